/**
 * The two ranges of one quantity, read by the case model and by every calculator
 * that takes the quantity (one table per fact: core/ranges/plausibleRanges.ts):
 * - the possible range: outside it the value cannot be right (a negative volume, a
 *   haematocrit above 1), so a case file or a calculator refuses it;
 * - the plausible range: outside it the value is possible but unusual, so it is kept
 *   and the user is warned. Every message states the plausible range.
 */
export interface Bounds {
  /** UCUM code of the unit the number is in; '1' for a fraction or a count. */
  readonly unit: string;
  /** Outside this range the value is refused. */
  readonly possible: { readonly min: number; readonly max: number; readonly minExclusive?: boolean };
  /** Outside this range the value is kept with a warning. */
  readonly plausible: { readonly min: number; readonly max: number };
  /** Decimals shown for the range bounds in messages (0.40–0.85 needs 2). */
  readonly decimals: number;
  readonly integer?: boolean;
  /** A fraction of 1: a percentage typed by mistake (60 for 0.60) gets advice. */
  readonly fraction?: boolean;
}
