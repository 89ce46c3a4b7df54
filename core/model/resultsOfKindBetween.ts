import type { ResultEntry, ResultKind } from './caseFile';
import type { IsoDate } from '../dates';
import { sortedByDate } from './sortedByDate';

/**
 * The results of one kind dated inside a window (both ends included), in date
 * order. The type narrows to that kind, so a ferritin query returns ferritins.
 *
 * @param results - the case's results, any order; not changed
 * @param kind - 'ferritin', 'liver-iron', 'creatinine', …
 * @param fromDate - first day of the window, 'YYYY-MM-DD'
 * @param toDate - last day of the window, 'YYYY-MM-DD' (on or after fromDate)
 * @returns a new array, earliest first
 * @example resultsOfKindBetween(theCase.results, 'ferritin', '2025-11-20', '2026-11-20') → the ferritins of that year
 */
export function resultsOfKindBetween<Kind extends ResultKind>(
  results: readonly ResultEntry[],
  kind: Kind,
  fromDate: IsoDate,
  toDate: IsoDate,
): Extract<ResultEntry, { readonly kind: Kind }>[] {
  const ofKind = results.filter(
    (result): result is Extract<ResultEntry, { readonly kind: Kind }> =>
      result.kind === kind && fromDate <= result.date && result.date <= toDate,
  );
  return sortedByDate(ofKind);
}
