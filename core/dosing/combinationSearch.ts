/**
 * Exact searches over the amounts a shelf of pieces (tablets, half tablets,
 * vials) can make. Amounts are counted in half-milligram units so that half
 * tablets of odd strengths (62.5 mg) stay whole numbers and the search is exact.
 */

/** One kind of piece: a whole tablet, a half tablet or a vial. */
export interface Piece {
  /** Amount in half-milligram units (a 90 mg tablet is 180). */
  readonly halfMgUnits: number;
  /** Caller's label, carried back in the result. */
  readonly key: string;
}

export interface PieceCount {
  readonly key: string;
  readonly halfMgUnits: number;
  readonly count: number;
}

export interface Combination {
  readonly totalHalfMgUnits: number;
  readonly pieceCount: number;
  readonly pieces: readonly PieceCount[];
}

/**
 * Half-milligram units of an amount in mg (exact for whole and half mg).
 * @param amountMg - mg, 0 or more
 * @returns half-mg units, rounded to the nearest whole unit
 * @example halfMgUnitsFromMg(62.5) === 125
 */
export function halfMgUnitsFromMg(amountMg: number): number {
  return Math.round(amountMg * 2);
}

/**
 * Fewest pieces for every total from 0 to `upToUnits` (unbounded supply of
 * each piece). A total no combination makes has Infinity. On equal counts the
 * piece earlier in `pieces` wins, so callers list pieces in order of preference.
 */
function fewestPieces(pieces: readonly Piece[], upToUnits: number): { counts: Float64Array; lastPiece: Int32Array } {
  const counts = new Float64Array(upToUnits + 1).fill(Infinity);
  const lastPiece = new Int32Array(upToUnits + 1).fill(-1);
  counts[0] = 0;
  for (let total = 1; total <= upToUnits; total += 1) {
    for (let index = 0; index < pieces.length; index += 1) {
      const size = pieces[index]!.halfMgUnits;
      if (size > total) continue;
      const candidate = counts[total - size]! + 1;
      if (candidate < counts[total]!) {
        counts[total] = candidate;
        lastPiece[total] = index;
      }
    }
  }
  return { counts, lastPiece };
}

function rebuild(pieces: readonly Piece[], lastPiece: Int32Array, total: number): Combination {
  const tally = new Map<number, number>();
  let remaining = total;
  let pieceCount = 0;
  while (remaining > 0) {
    const index = lastPiece[remaining]!;
    tally.set(index, (tally.get(index) ?? 0) + 1);
    remaining -= pieces[index]!.halfMgUnits;
    pieceCount += 1;
  }
  const counted = [...tally.entries()]
    .sort(([first], [second]) => first - second)
    .map(([index, count]) => ({ key: pieces[index]!.key, halfMgUnits: pieces[index]!.halfMgUnits, count }));
  return { totalHalfMgUnits: total, pieceCount, pieces: counted };
}

/**
 * The combination whose total is closest to a target, with at least one and
 * at most `maxPieces` pieces. On equal distance the lower total wins (the
 * intended dose is not passed on a tie); at that total, the fewest pieces,
 * then the earlier pieces in `pieces`.
 *
 * The closest total never lies above target + the largest piece: removing one
 * piece from a larger combination gives one that is still above the target and
 * closer. So the search up to there is exhaustive.
 *
 * @param pieces - at least one, each 1 or more half-mg units, in order of preference
 * @param targetHalfMgUnits - the intended amount, half-mg units (any positive real)
 * @param maxPieces - the most pieces in one administration (1 or more)
 * @returns the combination, or undefined when no piece exists
 * @example closestCombination([{ halfMgUnits: 720, key: '360' }, { halfMgUnits: 360, key: '180' }, { halfMgUnits: 180, key: '90' }], 2184, 12)
 *   → total 2160 (1,080 mg) as 3 × '360'
 */
export function closestCombination(pieces: readonly Piece[], targetHalfMgUnits: number, maxPieces: number): Combination | undefined {
  if (pieces.length === 0) return undefined;
  const largest = Math.max(...pieces.map((it) => it.halfMgUnits));
  const upTo = Math.ceil(targetHalfMgUnits) + largest;
  const { counts, lastPiece } = fewestPieces(pieces, upTo);
  let best = -1;
  for (let total = 1; total <= upTo; total += 1) {
    if (counts[total]! > maxPieces) continue;
    if (best < 0 || Math.abs(total - targetHalfMgUnits) < Math.abs(best - targetHalfMgUnits)) best = total;
  }
  return best < 0 ? undefined : rebuild(pieces, lastPiece, best);
}

/**
 * The combination with the smallest total at or above a target (vials: open
 * enough to draw the dose, with the least left over), with at most
 * `maxPieces` pieces; at that total, the fewest pieces.
 *
 * @param pieces - at least one, in order of preference
 * @param targetHalfMgUnits - the amount to cover, half-mg units (positive)
 * @param maxPieces - the most pieces (1 or more)
 * @returns the combination, or undefined when `maxPieces` pieces cannot cover the target
 * @example smallestCoveringCombination([{ halfMgUnits: 4000, key: '2000' }, { halfMgUnits: 1000, key: '500' }], 1840, 12)
 *   → total 2000 (1,000 mg) as 2 × '500'
 */
export function smallestCoveringCombination(pieces: readonly Piece[], targetHalfMgUnits: number, maxPieces: number): Combination | undefined {
  if (pieces.length === 0) return undefined;
  const largest = Math.max(...pieces.map((it) => it.halfMgUnits));
  const from = Math.max(1, Math.ceil(targetHalfMgUnits));
  const upTo = from + largest;
  const { counts, lastPiece } = fewestPieces(pieces, upTo);
  for (let total = from; total <= upTo; total += 1) {
    if (counts[total]! <= maxPieces) return rebuild(pieces, lastPiece, total);
  }
  return undefined;
}
