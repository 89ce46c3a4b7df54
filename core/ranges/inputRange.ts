import type { Bounds } from './bounds';

/** The range part of a formula's number input, taken from a quantity's {@link Bounds}. */
export interface InputRange {
  readonly unit: string;
  readonly min: number;
  readonly max: number;
  readonly minExclusive?: boolean;
  readonly plausible: { readonly min: number; readonly max: number };
  readonly integer?: boolean;
}

/**
 * The ranges of a calculator's input for a quantity the case model also holds, from the
 * one table (core/ranges/plausibleRanges.ts): refused outside the possible range, kept
 * with a warning outside the plausible one. A calculator and a case file therefore accept
 * the same values, and a value `check` accepts cannot be refused inside a review.
 *
 * @param bounds - the quantity's ranges
 * @returns unit, min/max (possible), minExclusive, plausible and integer, to spread into an input spec
 * @example inputRange(weightBounds).max === 400 && inputRange(weightBounds).plausible.max === 200
 */
export function inputRange(bounds: Bounds): InputRange {
  return {
    unit: bounds.unit,
    min: bounds.possible.min,
    max: bounds.possible.max,
    ...(bounds.possible.minExclusive ? { minExclusive: true } : {}),
    plausible: bounds.plausible,
    ...(bounds.integer ? { integer: true } : {}),
  };
}
