import { addDaysIso, type IsoDate } from '../dates/isoDate';
import type { ChelationPeriod } from './caseFile';

/**
 * The first day of the unbroken run of a drug that is running on the review
 * date: a dose change is recorded as a new period, so periods of the same drug
 * that follow each other without a gap (the next begins on or before the day
 * after the previous ends) count as one run.
 *
 * @param periods - the case's chelation periods, any order; not changed
 * @param drug - the drug
 * @param asOf - review date 'YYYY-MM-DD'
 * @returns the first day of the run, or null when the drug is not running on asOf
 * @example continuousRunStart([{ drug: 'deferasirox', startDate: '2025-01-01', endDate: '2025-06-30', … },
 *   { drug: 'deferasirox', startDate: '2025-07-01', endDate: null, … }], 'deferasirox', '2026-01-01') === '2025-01-01'
 */
export function continuousRunStart(periods: readonly ChelationPeriod[], drug: ChelationPeriod['drug'], asOf: IsoDate): IsoDate | null {
  const ofDrug = periods.filter((period) => period.drug === drug);
  const running = ofDrug.filter((period) => period.startDate <= asOf && (period.endDate === null || period.endDate >= asOf));
  if (running.length === 0) return null;
  let start = running.map((period) => period.startDate).sort()[0]!;
  // One pass over the drug's periods, latest start first. A period that starts before the run
  // and reaches the day before it extends the run back to its own start; one that does not
  // reach the run when its turn comes never will, since the run only grows back towards
  // periods that start earlier still. (Searching all periods again after each extension
  // made a long run of dose changes quadratic: 2,667 periods took about a minute.)
  const latestFirst = [...ofDrug].sort((a, b) => (a.startDate < b.startDate ? 1 : a.startDate > b.startDate ? -1 : 0));
  let dayBefore = addDaysIso(start, -1);
  for (const period of latestFirst) {
    if (period.startDate < start && (period.endDate === null || period.endDate >= dayBefore)) {
      start = period.startDate;
      dayBefore = addDaysIso(start, -1);
    }
  }
  return start;
}
