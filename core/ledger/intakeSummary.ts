import { addDaysIso, type IsoDate } from '../dates/isoDate';
import type { Derivation } from '../formulas/derivation';
import { runInternal } from '../formulas/run';
import { ok, type Result } from '../result';
import { ironIntakeRate } from '../iron/formulas';
import { intakeBand } from '../iron/intakeBand';
import type { MgPerKgPerDay } from '../units/quantity';
import type { LedgerNotice } from './caseToLedger';
import { sumDaily } from './ironAccount';
import { transfusionalIronBetween, type ReviewContext } from './reviewContext';

/**
 * Length of the trailing intake window, days: a calendar year before the
 * review date, the window of the daily-loading figures (Hoffbrand, Taher &
 * Cappellini, Blood 2012;120:3657; common practice to count 365 days).
 */
export const trailingYearDays = 365;

export interface IntakeSummary {
  readonly windowFrom: IsoDate;
  readonly windowDays: number;
  readonly transfusedMg: number;
  readonly removedWithBloodMg: number;
  /** Exchanges and venesections in the window (records that took iron out with blood). Added for the per-procedure figure. */
  readonly removalProcedures: number;
  readonly netMg: number;
  readonly mgPerKgPerDay: number;
  readonly band: string;
  readonly cumulativeNetMg: number;
  readonly cumulativeSince: IsoDate;
  readonly derivation: Derivation;
}

/**
 * Transfusional intake over the trailing year (or the record, if shorter):
 * iron in, iron out with removed blood, the net rate in mg/kg/day with its
 * band, and the cumulative net since the first record.
 *
 * @param context - the review (see reviewContext.ts)
 * @returns the summary, and notices for a short record or a negative net; an issue when a total leaves a formula's range
 */
export function intakeSummary(context: ReviewContext): Result<{ readonly intake: IntakeSummary; readonly notices: readonly LedgerNotice[] }> {
  const { account, lastIndex, asOf, weightKg } = context;
  const notices: LedgerNotice[] = [];
  const dayCount = lastIndex + 1;
  const windowDays = Math.min(trailingYearDays, dayCount);
  const fromIndex = dayCount - windowDays;
  const transfusedMg = sumDaily(account.daily.transfusedInMg, fromIndex, lastIndex);
  const removedWithBloodMg = sumDaily(account.daily.removedWithBloodMg, fromIndex, lastIndex);
  const windowFrom = addDaysIso(account.firstDay, fromIndex);
  const netMg = transfusedMg - removedWithBloodMg;
  if (windowDays < trailingYearDays) {
    notices.push({ severity: 'information', text: `The record covers only ${windowDays} days before the review date: the intake is averaged over those days.` });
  }
  const windowIron = transfusionalIronBetween(context, addDaysIso(windowFrom, -1), asOf);
  if (!windowIron.ok) return windowIron;
  const intakeRun = runInternal(
    ironIntakeRate,
    { totalIronMg: Math.max(0, windowIron.value.outputs.netMg), weightKg, windowDays },
    {
      origins: {
        totalIronMg: { kind: 'computed', derivation: windowIron.value.derivation },
        weightKg: { kind: 'record', description: `latest weight on or before ${asOf}`, refs: [] },
        windowDays: { kind: 'record', description: `days ${windowFrom} to ${asOf}`, refs: [] },
      },
    },
  );
  if (!intakeRun.ok) return intakeRun;
  if (netMg < 0) {
    notices.push({ severity: 'information', text: `More iron left with removed blood than came in over the trailing year (net ${Math.round(netMg)} mg); the intake rate is shown as 0.` });
  }
  const cumulativeNetMg = sumDaily(account.daily.transfusedInMg, 0, lastIndex) - sumDaily(account.daily.removedWithBloodMg, 0, lastIndex);
  return ok({
    intake: {
      windowFrom,
      windowDays,
      transfusedMg,
      removedWithBloodMg,
      removalProcedures: context.normalised.input.movements.filter((it) => it.date >= windowFrom && it.date <= asOf && it.ironOutMg > 0).length,
      netMg,
      mgPerKgPerDay: intakeRun.value.outputs.intakeMgPerKgPerDay,
      band: intakeBand(intakeRun.value.outputs.intakeMgPerKgPerDay as MgPerKgPerDay).label,
      cumulativeNetMg,
      cumulativeSince: account.firstDay,
      derivation: intakeRun.value.derivation,
    },
    notices,
  });
}
