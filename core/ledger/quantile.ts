/**
 * Quantile of a sample by linear interpolation between order statistics
 * (Hyndman & Fan, Am Stat 1996;50:361, definition 7, the default of R and of
 * the simple-statistics package's quantileSorted for interior points).
 *
 * @param sortedValues - ascending, at least one value (an array or a typed array)
 * @param probability - 0–1
 * @example quantileOfSorted([1, 2, 3, 4], 0.5) === 2.5
 */
export function quantileOfSorted(sortedValues: ArrayLike<number>, probability: number): number {
  if (sortedValues.length === 0) throw new Error('quantileOfSorted needs at least one value');
  if (probability < 0 || probability > 1) throw new Error(`probability ${probability} outside 0–1`);
  const position = (sortedValues.length - 1) * probability;
  const lower = Math.floor(position);
  const upper = Math.ceil(position);
  const weight = position - lower;
  // a + (b − a) × w rather than a(1 − w) + bw: exact when a = b, so a flat sample gives
  // the same value at every probability (found by the property test over random cases).
  const below = sortedValues[lower]!;
  return below + (sortedValues[upper]! - below) * weight;
}
