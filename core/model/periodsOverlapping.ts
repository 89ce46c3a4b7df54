import type { IsoDate } from '../dates';
import type { DatedPeriod } from './periodsActiveOn';

/**
 * The periods with at least one day in the window after `afterDate` up to and
 * including `toDate` — the window the ledger sums flows over between two dated
 * events (an LIC result and the next, an LIC result and the review date). The
 * end date is the last day taken, so a period that ended on `afterDate` is
 * not in the window. The one overlap rule of the ledger.
 *
 * @param periods - any order; not changed
 * @param afterDate - 'YYYY-MM-DD', the day before the window
 * @param toDate - 'YYYY-MM-DD', the window's last day (after afterDate: the window holds at least one day)
 * @returns the overlapping periods, in the order given
 * @example periodsOverlapping([{ startDate: '2026-01-01', endDate: '2026-03-01' }], '2026-03-01', '2026-06-01').length === 0
 */
export function periodsOverlapping<Period extends DatedPeriod>(periods: readonly Period[], afterDate: IsoDate, toDate: IsoDate): Period[] {
  return periods.filter((period) => period.startDate <= toDate && (period.endDate === null || period.endDate > afterDate));
}
