import { addDaysIso } from '../dates/isoDate';
import type { IsoDate } from '../dates/isoDate';
import type { Derivation } from '../formulas/derivation';
import { runInternal } from '../formulas/run';
import type { Issue } from '../result';
import type { LedgerNotice } from './caseToLedger';
import { bodyIronCarriedForward, netIronBalance } from './formulas';
import { sumDaily } from './ironAccount';
import { dayIndexOf, efficiencyUsesOf, periodsBetween, transfusionalIronBetween, type ReviewContext } from './reviewContext';

export interface BodyIronSummary {
  readonly lastMeasured: { readonly date: IsoDate; readonly licMgPerGDry: number; readonly method: string } | null;
  readonly bodyIronMg: number | null;
  readonly licMgPerGDry: number | null;
  readonly derivation: Derivation | null;
}

/**
 * Body iron and LIC on the review date, carried forward from the last
 * measured LIC (the mean of that day's results) by the net balance since:
 * transfusional iron net of removed blood, expected chelation removal and
 * basal loss (Angelucci relation, stores mg = 10.6 × LIC × weight).
 *
 * @param context - the review (see reviewContext.ts)
 * @returns the summary (nulls with no LIC on record) and its notices
 */
export function bodyIronOnDate(context: ReviewContext): { readonly bodyIron: BodyIronSummary; readonly notices: readonly LedgerNotice[] } {
  const { account, asOf, weightKg, lastIndex, normalised, overrides } = context;
  const sortedLics = [...normalised.input.licMeasurements].sort((a, b) => a.date.localeCompare(b.date));
  const lastLic = sortedLics[sortedLics.length - 1];
  if (!lastLic) {
    return {
      bodyIron: { lastMeasured: null, bodyIronMg: null, licMgPerGDry: null, derivation: null },
      notices: [{ severity: 'review', text: 'No liver iron result on record: body iron, LIC estimates and projections need at least one.' }],
    };
  }
  const anchorIndex = dayIndexOf(context, lastLic.date);
  const anchorWeight = account.daily.weightKg[anchorIndex]!;
  const sameDay = sortedLics.filter((it) => it.date === lastLic.date);
  const anchorLic = sameDay.reduce((sum, it) => sum + it.licMgPerGDry, 0) / sameDay.length;
  const sinceIron = transfusionalIronBetween(context, lastLic.date, asOf);
  if (!sinceIron.ok) return notCarried(sinceIron.issues);
  const periodsSince = periodsBetween(context, lastLic.date, asOf);
  const netSince = runInternal(
    netIronBalance,
    {
      transfusionalNetMg: sinceIron.value.outputs.netMg,
      chelationRemovalMg: sumDaily(account.daily.chelationOutMg, anchorIndex + 1, lastIndex),
      days: lastIndex - anchorIndex,
    },
    {
      overrides,
      origins: {
        transfusionalNetMg: { kind: 'computed', derivation: sinceIron.value.derivation },
        chelationRemovalMg: {
          kind: 'record',
          description: `expected removal of the regimens on record ${addDaysIso(lastLic.date, 1)} to ${asOf}`,
          refs: periodsSince.map((it) => it.id),
          assumptions: efficiencyUsesOf(periodsSince, overrides),
        },
        days: { kind: 'record', description: `days ${addDaysIso(lastLic.date, 1)} to ${asOf}`, refs: [] },
      },
    },
  );
  if (!netSince.ok) return notCarried(netSince.issues);
  const carriedRun = runInternal(
    bodyIronCarriedForward,
    { anchorLicMgPerGDry: anchorLic, anchorWeightKg: anchorWeight, netSinceMg: netSince.value.outputs.netMg, weightNowKg: weightKg },
    {
      origins: {
        anchorLicMgPerGDry: { kind: 'record', description: `LIC ${lastLic.date} (${lastLic.method})`, refs: sameDay.map((it) => it.ref) },
        anchorWeightKg: { kind: 'record', description: `weight on ${lastLic.date}`, refs: [] },
        netSinceMg: { kind: 'computed', derivation: netSince.value.derivation },
        weightNowKg: { kind: 'record', description: `latest weight on or before ${asOf}`, refs: [] },
      },
    },
  );
  if (!carriedRun.ok) return notCarried(carriedRun.issues);
  const carried = carriedRun.value;
  const notices: LedgerNotice[] =
    carried.outputs.bodyIronMg < 0
      ? [{ severity: 'review', text: 'The carried-forward body iron falls below zero: the expected removal exceeds what the record supports. Review the efficiency and adherence assumptions.' }]
      : [];
  return {
    bodyIron: {
      lastMeasured: { date: lastLic.date, licMgPerGDry: anchorLic, method: lastLic.method },
      bodyIronMg: carried.outputs.bodyIronMg,
      licMgPerGDry: carried.outputs.licMgPerGDry,
      derivation: carried.derivation,
    },
    notices,
  };
}

/**
 * The summary when a total since the last LIC leaves the range its formula accepts
 * (a review date long after the record): no body iron on the review date, and a
 * notice saying which value and range, instead of a number nobody should read.
 */
function notCarried(issues: readonly Issue[]): { readonly bodyIron: BodyIronSummary; readonly notices: readonly LedgerNotice[] } {
  return {
    bodyIron: { lastMeasured: null, bodyIronMg: null, licMgPerGDry: null, derivation: null },
    notices: issues
      .filter((it) => it.severity === 'error')
      .map((it) => ({ severity: 'review' as const, text: `Body iron is not carried forward to the review date: ${it.message}` })),
  };
}
