import type { WeightEntry } from './caseFile';
import type { IsoDate } from '../dates';
import { sortedByDate } from './sortedByDate';

/**
 * The most recent weight measured on or before a date: the weight a dose in
 * mg/kg or an intake per kg on that date refers to. On a day with two
 * weights, the one entered last counts.
 *
 * @param weights - the patient's weights, any order; not changed
 * @param onDate - 'YYYY-MM-DD'
 * @returns the entry, unit as entered (kg), or undefined when none is that early
 * @example latestWeightOnOrBefore([{ date: '2025-05-02', weight: { value: 48, unit: 'kg' } },
 *   { date: '2026-04-30', weight: { value: 52, unit: 'kg' } }], '2026-01-01')?.weight.value === 48
 */
export function latestWeightOnOrBefore(weights: readonly WeightEntry[], onDate: IsoDate): WeightEntry | undefined {
  return sortedByDate(weights)
    .filter((entry) => entry.date <= onDate)
    .at(-1);
}
