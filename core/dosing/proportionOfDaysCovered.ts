import { addDaysIso, daysBetween, type IsoDate } from '../dates/isoDate';

export interface Supply {
  readonly date: IsoDate;
  /** Whole days the dispensing was meant to cover, ≥ 1. */
  readonly daysSupplied: number;
}

export interface DaysCovered {
  /** Days in the period with drug on hand. */
  readonly coveredDays: number;
  /** Days in the period (both ends included). */
  readonly periodDays: number;
  /** coveredDays ÷ periodDays, 0–1. */
  readonly proportion: number;
  readonly dispensings: number;
}

/**
 * The proportion of days covered (PDC) over a period: days with the drug on
 * hand ÷ days in the period. Supplies are laid end to end in date order; a
 * supply dispensed while an earlier one still lasts starts the day after the
 * earlier one ends (overlapping supplies carried forward), so no day is
 * counted twice and an early refill is not lost. Supply dispensed before the
 * period that is still on hand at its start counts; days after the period's
 * end do not. Definition: Nau, Pharmacy Quality Alliance 2012 (nau-pqa-2012-pdc).
 *
 * @param supplies - dispensings of one drug, any order; not changed
 * @param fromDate - first day of the period, 'YYYY-MM-DD'
 * @param toDate - last day of the period (on or after fromDate)
 * @returns covered days, period days and the proportion
 * @example proportionOfDaysCovered([{ date: '2026-01-01', daysSupplied: 30 }, { date: '2026-01-21', daysSupplied: 30 }], '2026-01-01', '2026-03-31')
 *   → coveredDays 60 (the second supply runs from 2026-01-31 to 2026-03-01), periodDays 90, proportion 0.667
 */
export function proportionOfDaysCovered(supplies: readonly Supply[], fromDate: IsoDate, toDate: IsoDate): DaysCovered {
  const periodDays = daysBetween(fromDate, toDate) + 1;
  const ordered = [...supplies].filter((it) => it.date <= toDate).sort((first, second) => (first.date < second.date ? -1 : first.date > second.date ? 1 : 0));
  let coveredDays = 0;
  // The first day not yet covered by an earlier supply.
  let nextFree: IsoDate | null = null;
  for (const supply of ordered) {
    const start = nextFree !== null && nextFree > supply.date ? nextFree : supply.date;
    const end = addDaysIso(start, supply.daysSupplied - 1);
    nextFree = addDaysIso(end, 1);
    const from = start > fromDate ? start : fromDate;
    const to = end < toDate ? end : toDate;
    if (from <= to) coveredDays += daysBetween(from, to) + 1;
  }
  return { coveredDays, periodDays, proportion: coveredDays / periodDays, dispensings: ordered.length };
}
