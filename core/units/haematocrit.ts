import { fail, issue, ok, type Result } from '../result';
import type { Fraction } from './quantity';

/**
 * Read a haematocrit as a fraction of 1. A value above 1 is refused with a
 * message that suggests the fraction (60 → 0.60): entering a percentage where
 * a fraction is expected would multiply the iron by 100.
 *
 * @param value - haematocrit as a fraction, plausible range given by the caller
 * @param field - the field's name for the message, e.g. 'unit haematocrit'
 * @param range - plausible range (default 0.10–0.95)
 * @example parseHaematocrit(0.6, 'unit haematocrit') → ok(0.6)
 * @example parseHaematocrit(60, 'unit haematocrit') → issue "… enter it as a fraction (0.6)"
 */
export function parseHaematocrit(
  value: number,
  field: string,
  range: { readonly min: number; readonly max: number } = { min: 0.1, max: 0.95 },
): Result<Fraction> {
  if (!Number.isFinite(value)) {
    return fail(issue('not_a_number', [field], `${field} "${value}" is not a number; expected a fraction ${range.min}–${range.max}.`));
  }
  if (value > 1 && value <= 100) {
    return fail(
      issue('out_of_range', [field], `${field} ${value} is outside ${range.min}–${range.max}; enter it as a fraction (${Math.round(value * 100) / 10000}).`),
    );
  }
  if (value < range.min || value > range.max) {
    return fail(issue('out_of_range', [field], `${field} ${value} is outside the plausible range ${range.min}–${range.max}.`));
  }
  return ok(value as Fraction);
}
