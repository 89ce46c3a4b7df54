import type { IsoDate } from '../dates';

/** A period as chelation periods and co-medications record it: end date inclusive, null while ongoing. */
export interface DatedPeriod {
  readonly startDate: IsoDate;
  readonly endDate: IsoDate | null;
}

/**
 * The periods running on a date (chelation periods, co-medications): started
 * on or before it and not ended before it. The end date is the last day taken.
 *
 * @param periods - any order; not changed
 * @param onDate - 'YYYY-MM-DD'
 * @returns the active periods, in the order given
 * @example periodsActiveOn([{ startDate: '2025-05-20', endDate: null }], '2026-11-20').length === 1
 */
export function periodsActiveOn<Period extends DatedPeriod>(periods: readonly Period[], onDate: IsoDate): Period[] {
  return periods.filter((period) => period.startDate <= onDate && (period.endDate === null || onDate <= period.endDate));
}
