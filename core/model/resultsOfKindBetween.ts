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

/**
 * {@link resultsOfKindBetween} for many kinds of one window: the results are
 * grouped by kind in one pass, each group in date order, so a caller asking
 * for a dozen kinds (the monitoring calendar) does not filter and sort the
 * whole list a dozen times. Same entries, same order, kind for kind.
 *
 * @param results - the case's results, any order; not changed
 * @param fromDate - first day of the window, 'YYYY-MM-DD'
 * @param toDate - last day of the window, 'YYYY-MM-DD'
 * @returns the lookup: a kind's results in the window, earliest first (a new array each call)
 * @example resultsByKindBetween(theCase.results, '2025-11-20', '2026-11-20')('ferritin') → the ferritins of that year
 */
export function resultsByKindBetween(results: readonly ResultEntry[], fromDate: IsoDate, toDate: IsoDate): <Kind extends ResultKind>(kind: Kind) => Extract<ResultEntry, { readonly kind: Kind }>[] {
  const byKind = new Map<ResultKind, ResultEntry[]>();
  for (const result of results) {
    if (result.date < fromDate || result.date > toDate) continue;
    const group = byKind.get(result.kind);
    if (group) group.push(result);
    else byKind.set(result.kind, [result]);
  }
  const sorted = new Map<ResultKind, ResultEntry[]>();
  for (const [kind, group] of byKind) sorted.set(kind, sortedByDate(group));
  return <Kind extends ResultKind>(kind: Kind) => [...(sorted.get(kind) ?? [])] as Extract<ResultEntry, { readonly kind: Kind }>[];
}
