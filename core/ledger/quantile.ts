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
  const { lower, upper, weight } = quantilePosition(sortedValues.length, probability);
  return interpolated(sortedValues[lower]!, sortedValues[upper]!, weight);
}

/** The two order statistics (0-based) a definition-7 quantile interpolates between, and the weight of the upper one. */
function quantilePosition(count: number, probability: number): { readonly lower: number; readonly upper: number; readonly weight: number } {
  if (count === 0) throw new Error('quantile needs at least one value');
  if (probability < 0 || probability > 1) throw new Error(`probability ${probability} outside 0–1`);
  const position = (count - 1) * probability;
  const lower = Math.floor(position);
  return { lower, upper: Math.ceil(position), weight: position - lower };
}

// a + (b − a) × w rather than a(1 − w) + bw: exact when a = b, so a flat sample gives
// the same value at every probability (found by the property test over random cases).
const interpolated = (below: number, above: number, weight: number): number => below + (above - below) * weight;

/** Up to this many values, quantilesOfUnsorted sorts a copy instead of counting into buckets. */
const smallSampleCount = 256;

/**
 * The same quantiles as {@link quantileOfSorted} over the sorted values, found
 * without sorting: the values are counted into buckets by a mapping that never
 * puts a smaller value in a later bucket, so the bucket holding each needed
 * order statistic is known from the counts, and only that bucket's few values
 * are sorted. The order statistics are the sort's own, so the results are the
 * same to the last bit, at the cost of three passes over the values instead of
 * a sort (a projection band reads three quantiles of thousands of draws for
 * every month). A sample holding NaN, or whose spread the mapping cannot
 * scale, is sorted whole, as before.
 *
 * @param values - at least one value, in any order; not changed
 * @param probabilities - each 0–1
 * @example quantilesOfUnsorted(Float64Array.of(4, 1, 3, 2), [0.5]) gives [2.5]
 */
export function quantilesOfUnsorted(values: ArrayLike<number>, probabilities: readonly number[]): number[] {
  const count = values.length;
  const positions = probabilities.map((probability) => quantilePosition(count, probability));
  const sortedWhole = (): number[] => {
    const sorted = Float64Array.from(values).sort();
    return positions.map(({ lower, upper, weight }) => interpolated(sorted[lower]!, sorted[upper]!, weight));
  };
  // A small sample is sorted whole: below a few hundred values the sort costs less than the buckets' arrays
  // (measured on the panel's 50-draw bands; a performance choice of ours, the results are the same).
  if (count <= smallSampleCount) return sortedWhole();
  let least = Infinity;
  let greatest = -Infinity;
  let holdsNaN = false;
  for (let index = 0; index < count; index += 1) {
    const value = values[index]!;
    if (value < least) least = value;
    if (value > greatest) greatest = value;
    if (value !== value) holdsNaN = true;
  }
  const bucketCount = Math.max(1, count >>> 2);
  const scale = bucketCount / (greatest - least);
  if (holdsNaN || !(scale > 0 && scale < Infinity)) {
    // NaN, ±Infinity, or every value the same (then any order statistic is that value).
    if (!holdsNaN && least === greatest) return positions.map(({ weight }) => interpolated(least, least, weight));
    return sortedWhole();
  }
  const origin = least;
  const last = bucketCount - 1;
  // (value − least) × scale never decreases as the value grows, nor does its floor: bucket order is value order.
  const bucketOf = (value: number): number => Math.min(last, Math.floor((value - origin) * scale));
  const counts = new Int32Array(bucketCount);
  for (let index = 0; index < count; index += 1) counts[bucketOf(values[index]!)]! += 1;
  // Ranks before each bucket.
  const before = new Int32Array(bucketCount);
  for (let bucket = 1; bucket < bucketCount; bucket += 1) before[bucket] = before[bucket - 1]! + counts[bucket - 1]!;
  const bucketOfRank = (rank: number): number => {
    let low = 0;
    let high = last;
    while (low < high) {
      const middle = (low + high + 1) >>> 1;
      if (before[middle]! <= rank) low = middle;
      else high = middle - 1;
    }
    return low;
  };
  // The buckets that hold a needed rank, gathered into one array (each bucket's values together) and sorted in place.
  const slotOfBucket = new Int32Array(bucketCount).fill(-1);
  const slotStart: number[] = [];
  const slotSize: number[] = [];
  let gathered = 0;
  for (const { lower, upper } of positions) {
    for (const bucket of [bucketOfRank(lower), bucketOfRank(upper)]) {
      if (slotOfBucket[bucket] !== -1) continue;
      slotOfBucket[bucket] = slotStart.length;
      slotStart.push(gathered);
      slotSize.push(counts[bucket]!);
      gathered += counts[bucket]!;
    }
  }
  const members = new Float64Array(gathered);
  const filled = Int32Array.from(slotStart);
  for (let index = 0; index < count; index += 1) {
    const slot = slotOfBucket[bucketOf(values[index]!)]!;
    if (slot !== -1) members[filled[slot]!++] = values[index]!;
  }
  slotStart.forEach((from, slot) => members.subarray(from, from + slotSize[slot]!).sort());
  const orderStatistic = (rank: number): number => {
    const bucket = bucketOfRank(rank);
    return members[slotStart[slotOfBucket[bucket]!]! + rank - before[bucket]!]!;
  };
  return positions.map(({ lower, upper, weight }) => interpolated(orderStatistic(lower), orderStatistic(upper), weight));
}
