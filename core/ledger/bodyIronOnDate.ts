import { addDaysIso } from '../dates/isoDate';
import type { IsoDate } from '../dates/isoDate';
import type { Derivation } from '../formulas/derivation';
import { runInternal } from '../formulas/run';
import type { Issue } from '../result';
import type { LedgerNotice } from './caseToLedger';
import { bodyIronCarriedForward, netIronBalance } from './formulas';
import { resolveAssumption } from '../assumptions';
import { angelucciSlopeMgPerKgPerMgPerGDry } from '../iron/bodyIron';
import { removalByWeight } from './ironAccount';
import { basisScaleOf, type EfficiencyBasis } from './efficiencyBasis';
import { projectionSpread } from './projection';
import { quantilesOfUnsorted } from './quantile';
import { createRandom } from './random';
import { dayIndexOf, efficiencyUsesOf, periodsBetween, transfusionalIronBetween, type ReviewContext } from './reviewContext';

export interface BodyIronSummary {
  readonly lastMeasured: { readonly date: IsoDate; readonly licMgPerGDry: number; readonly method: string } | null;
  readonly bodyIronMg: number | null;
  readonly licMgPerGDry: number | null;
  readonly derivation: Derivation | null;
  /**
   * Added with the one efficiency basis: the basis of the chelation removal since the LIC
   * (the review's basis), the stores the anchoring LIC sets (mg), its relative measurement
   * spread, and the 10th–90th percentile band of the LIC now (seeded; null with no LIC).
   */
  readonly efficiencyBasis: 'measured' | 'published' | null;
  readonly anchorStoresMg: number | null;
  readonly anchorRelativeSd: number | null;
  readonly band: { readonly licP10: number; readonly licP90: number } | null;
}

/** The relative measurement spread of an LIC result by its method (assumptions lic-measurement-sd-biopsy and -mri). */
export function licRelativeSdOf(method: string, overrides: ReviewContext['overrides']): number {
  return resolveAssumption(method === 'biopsy' ? 'lic-measurement-sd-biopsy' : 'lic-measurement-sd-mri', overrides).value;
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
export function bodyIronOnDate(
  context: ReviewContext,
  basis: EfficiencyBasis,
  band: { readonly seed: number; readonly samples: number },
): { readonly bodyIron: BodyIronSummary; readonly notices: readonly LedgerNotice[] } {
  const { account, asOf, weightKg, lastIndex, normalised, overrides } = context;
  const sortedLics = [...normalised.input.licMeasurements].sort((a, b) => a.date.localeCompare(b.date));
  const lastLic = sortedLics[sortedLics.length - 1];
  if (!lastLic) {
    return {
      bodyIron: { lastMeasured: null, bodyIronMg: null, licMgPerGDry: null, derivation: null, efficiencyBasis: null, anchorStoresMg: null, anchorRelativeSd: null, band: null },
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
  // Chelation since the LIC at the review's one basis: each span's expected removal day by day, scaled by the measured ratio for its drug.
  let chelationSinceMg = 0;
  for (const span of normalised.input.chelation) {
    const scale = basisScaleOf(basis, span.drug);
    const from = Math.max(anchorIndex + 1, dayIndexOf(context, span.start));
    const to = Math.min(lastIndex, span.end === null ? lastIndex : dayIndexOf(context, span.end));
    const removalAt = removalByWeight(span);
    for (let index = from; index <= to; index += 1) chelationSinceMg += removalAt(account.daily.weightKg[index]!) * scale;
  }
  const netSince = runInternal(
    netIronBalance,
    {
      transfusionalNetMg: sinceIron.value.outputs.netMg,
      chelationRemovalMg: chelationSinceMg,
      periodDays: lastIndex - anchorIndex,
    },
    {
      overrides,
      origins: {
        transfusionalNetMg: { kind: 'computed', derivation: sinceIron.value.derivation },
        chelationRemovalMg: {
          kind: 'record',
          description:
            basis.basis === 'measured'
              ? `expected removal of the regimens on record ${addDaysIso(lastLic.date, 1)} to ${asOf}, ${basis.drugs.join(' and ')} × measured ÷ expected ${basis.ratio.toFixed(2)} (${basis.interval!.fromDate} to ${basis.interval!.toDate})`
              : `expected removal of the regimens on record ${addDaysIso(lastLic.date, 1)} to ${asOf} at the published efficiencies`,
          refs: periodsSince.map((it) => it.id),
          assumptions: efficiencyUsesOf(periodsSince, overrides),
        },
        periodDays: { kind: 'record', description: `days ${addDaysIso(lastLic.date, 1)} to ${asOf}`, refs: [] },
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
  // The band of "now": the anchoring LIC's measurement spread and the spread of the removal since (as in the projection band).
  const anchorStoresMg = angelucciSlopeMgPerKgPerMgPerGDry * anchorLic * anchorWeight;
  const anchorRelativeSd = licRelativeSdOf(lastLic.method, overrides);
  const sigma = basis.basis === 'measured' ? projectionSpread.removalSigmaMeasured : projectionSpread.removalSigmaPublished;
  const restMg = carried.outputs.bodyIronMg - anchorStoresMg + chelationSinceMg;
  const random = createRandom(band.seed * 7919 + 17);
  const sampled = new Float64Array(band.samples);
  for (let sample = 0; sample < band.samples; sample += 1) {
    const adherence = projectionSpread.adherenceLow + (projectionSpread.adherenceHigh - projectionSpread.adherenceLow) * random.uniform();
    const stores = anchorStoresMg * Math.exp(anchorRelativeSd * random.normal()) + restMg - chelationSinceMg * Math.exp(sigma * random.normal()) * adherence;
    sampled[sample] = stores / (angelucciSlopeMgPerKgPerMgPerGDry * weightKg);
  }
  const [p10, p90] = quantilesOfUnsorted(sampled, [0.1, 0.9]);
  const central = carried.outputs.licMgPerGDry;
  return {
    bodyIron: {
      lastMeasured: { date: lastLic.date, licMgPerGDry: anchorLic, method: lastLic.method },
      bodyIronMg: carried.outputs.bodyIronMg,
      licMgPerGDry: central,
      derivation: carried.derivation,
      efficiencyBasis: basis.basis,
      anchorStoresMg,
      anchorRelativeSd,
      band: { licP10: Math.min(central, p10!), licP90: Math.max(central, p90!) },
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
    bodyIron: { lastMeasured: null, bodyIronMg: null, licMgPerGDry: null, derivation: null, efficiencyBasis: null, anchorStoresMg: null, anchorRelativeSd: null, band: null },
    notices: issues
      .filter((it) => it.severity === 'error')
      .map((it) => ({ severity: 'review' as const, text: `Body iron is not carried forward to the review date: ${it.message}` })),
  };
}
