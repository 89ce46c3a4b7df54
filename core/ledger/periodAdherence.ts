import type { IsoDate } from '../dates/isoDate';
import { proportionOfDaysCoveredFormula } from '../dosing/formulas';
import { proportionOfDaysCovered, type DaysCovered } from '../dosing/proportionOfDaysCovered';
import type { Origin } from '../formulas/derivation';
import { runInternal } from '../formulas/run';
import type { Case, ChelationPeriod } from '../model/caseFile';

/** The proportion of days covered of one chelation period, with the window it was counted over. */
export interface CoveredWindow extends DaysCovered {
  /** First day counted: the later of the period's start and the first dispensing of its drug. */
  readonly fromDate: IsoDate;
  /** Last day counted: the earlier of the period's end and the review date. */
  readonly toDate: IsoDate;
  /** The dispensings counted, as case references ('dispensings[2] disp-03'). */
  readonly refs: readonly string[];
}

/** The adherence behind a period's expected removal: the entered estimate and, where dispensings exist, the proportion of days covered. */
export interface PeriodAdherence {
  readonly periodId: string;
  /** The pharmacist's estimate on the period (default 1). */
  readonly entered: number;
  /** From the dispensing records; null when none of the period's drug is dated on or before its last counted day. */
  readonly covered: CoveredWindow | null;
  /** What expected removal uses: the proportion of days covered where it exists, otherwise the entered estimate. */
  readonly used: number;
}

/**
 * The proportion of days covered (PDC) over a window: the dispensings of one drug
 * (any order), counted from the later of `fromDate` and the first dispensing —
 * the Pharmacy Quality Alliance measure starts at the first fill, the index date
 * (nau-pqa-2012-pdc) — to `toDate`. Null when nothing of the drug was dispensed
 * on or before `toDate`, or the first dispensing is after it.
 */
export function coveredWindow(caseFile: Case, drug: ChelationPeriod['drug'], fromDate: IsoDate, toDate: IsoDate): CoveredWindow | null {
  const counted = caseFile.dispensings
    .map((it, index) => ({ it, ref: `dispensings[${index}] ${it.id}` }))
    .filter(({ it }) => it.drug === drug && it.date <= toDate);
  if (counted.length === 0) return null;
  const firstDate = counted.reduce((first, { it }) => (it.date < first ? it.date : first), counted[0]!.it.date);
  const windowStart = firstDate > fromDate ? firstDate : fromDate;
  const covered = proportionOfDaysCovered(counted.map(({ it }) => it), windowStart, toDate);
  return { ...covered, fromDate: windowStart, toDate, refs: counted.map(({ ref }) => ref) };
}

/**
 * The adherence a chelation period's expected removal uses on a review date.
 * Where the case holds dispensings of the period's drug, the proportion of
 * days covered from the first of them (or the period's start) to the period's
 * end or the review date takes the place of the entered estimate — for the
 * whole period, days before the first dispensing on record included (a
 * modelling choice of this tool, pdc-feeds-expected-removal-choice); otherwise the entered estimate.
 *
 * @param caseFile - a parsed case
 * @param period - one of its chelation periods
 * @param asOf - the review date 'YYYY-MM-DD'
 * @example periodAdherence(caseWithTwo30DaySuppliesTwentyDaysApart, periodFrom2026_01_01, '2026-03-31')
 *   → { entered: 1, covered: { coveredDays: 60, periodDays: 90, proportion: 0.667, … }, used: 0.667 }
 */
export function periodAdherence(caseFile: Case, period: ChelationPeriod, asOf: IsoDate): PeriodAdherence {
  const toDate = period.endDate !== null && period.endDate < asOf ? period.endDate : asOf;
  const covered = period.startDate > toDate ? null : coveredWindow(caseFile, period.drug, period.startDate, toDate);
  return { periodId: period.id, entered: period.adherence, covered, used: covered === null ? period.adherence : covered.proportion };
}

/**
 * Where the adherence in a period's expected removal comes from, as a
 * derivation input's origin: the proportion of days covered (a nested
 * derivation of the catalogued formula over the dispensings counted) or the
 * entered estimate.
 */
export function adherenceOrigin(adherence: PeriodAdherence, period: ChelationPeriod): Origin {
  const entered: Origin = { kind: 'record', description: `${period.id}: estimated adherence${period.adherenceNote ? ` (${period.adherenceNote})` : ''}`, refs: [period.id] };
  const { covered } = adherence;
  if (covered === null) return entered;
  const run = runInternal(
    proportionOfDaysCoveredFormula,
    { coveredDays: covered.coveredDays, periodDays: covered.periodDays },
    {
      origins: {
        coveredDays: {
          kind: 'record',
          description: `days with ${period.drug} on hand from ${covered.dispensings} dispensing(s), ${covered.fromDate} to ${covered.toDate}, overlapping supplies carried forward (in place of the entered estimate ${adherence.entered.toFixed(2)})`,
          refs: covered.refs,
        },
        periodDays: { kind: 'record', description: `${period.id}: ${covered.fromDate} to ${covered.toDate}`, refs: [period.id] },
      },
    },
  );
  // The counts come from proportionOfDaysCovered, so they are whole days with covered ≤ period: the run cannot refuse.
  return run.ok ? { kind: 'computed', derivation: run.value.derivation } : entered;
}
