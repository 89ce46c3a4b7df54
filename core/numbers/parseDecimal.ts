/** A decimal number as people type it: optional sign, digits with an optional point, optional exponent. */
const decimalPattern = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;

/**
 * Read a number typed by a user (a command-line flag, a form field). Stricter than
 * `Number()`: an empty or blank value, hexadecimal (`0x10`), binary or octal
 * literals, `Infinity`, thousands separators and trailing words are refused rather
 * than read as 0, 16 or NaN. A value that overflows to ±Infinity is refused too.
 *
 * @param text - the characters typed; leading and trailing spaces are allowed
 * @returns the number, or undefined when the text is not a finite decimal number
 * @example parseDecimal('52.5') === 52.5; parseDecimal('0x10') === undefined; parseDecimal('') === undefined
 */
export function parseDecimal(text: string): number | undefined {
  const trimmed = text.trim();
  if (!decimalPattern.test(trimmed)) return undefined;
  const value = Number(trimmed);
  return Number.isFinite(value) ? value : undefined;
}
