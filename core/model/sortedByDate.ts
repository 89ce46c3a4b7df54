import type { IsoDate } from '../dates';

/**
 * Entries in date order, earliest first, as a new array; entries with the
 * same date keep the order they were entered in.
 *
 * @param entries - anything with a `date` ('YYYY-MM-DD'); not changed
 * @returns a new array
 * @example sortedByDate([{ date: '2026-05-01' }, { date: '2025-01-10' }]).map((it) => it.date) → ['2025-01-10', '2026-05-01']
 */
export function sortedByDate<Entry extends { readonly date: IsoDate }>(entries: readonly Entry[]): Entry[] {
  // ISO dates order as strings; Array.prototype.sort is stable (ES2019).
  return [...entries].sort((entry, other) => (entry.date < other.date ? -1 : entry.date > other.date ? 1 : 0));
}
