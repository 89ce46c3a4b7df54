import type { IsoDate } from '../dates/isoDate';
import type { DatedWeight } from './ledgerInput';

/**
 * The weight that applies on a date: the latest weighing on or before it, or
 * the first weighing if the date precedes them all (the record's earliest
 * known weight stands in for earlier months; the caller says so).
 *
 * @param weights - at least one dated weight, any order
 * @param date - ISO date
 * @returns kg
 * @example weightKgAt([{date:'2026-01-01',weightKg:50},{date:'2026-06-01',weightKg:52}], '2026-07-01') === 52
 */
export function weightKgAt(weights: readonly DatedWeight[], date: IsoDate): number {
  if (weights.length === 0) throw new Error('weightKgAt needs at least one weight');
  let chosen: DatedWeight | undefined;
  let earliest = weights[0]!;
  for (const weight of weights) {
    if (weight.date < earliest.date) earliest = weight;
    if (weight.date <= date && (chosen === undefined || weight.date >= chosen.date)) chosen = weight;
  }
  return (chosen ?? earliest).weightKg;
}
