import { displayUnit } from '../units/displayUnit';

/**
 * Format a number for a reader: fixed decimals for ordinary magnitudes,
 * three significant figures for small ones (so 0.0123 does not print as 0.01),
 * and scientific notation for very large or very small ones. The one number
 * formatter of what is printed: the command line and the review sheet share it,
 * so a sheet's figures match `compute` digit for digit.
 *
 * @param value - any finite number
 * @param decimals - decimals for ordinary magnitudes (default 2)
 * @returns the text, '0' for zero
 * @example formatNumber(181.44, 1) === '181.4'
 * @example formatNumber(0.01234, 2) === '0.0123'
 */
export function formatNumber(value: number, decimals = 2): string {
  if (value === 0) return '0';
  const magnitude = Math.abs(value);
  if (magnitude >= 1e7 || magnitude < 1e-4) return value.toExponential(3);
  if (magnitude < 10 ** -decimals * 100) return String(Number(value.toPrecision(3)));
  return value.toFixed(decimals);
}

/**
 * A number as a person would type it back: no padding zeros, no binary noise.
 * @example formatPlain(0.1 + 0.2) === '0.3'
 */
export function formatPlain(value: number): string {
  return String(Number(value.toPrecision(10)));
}

/**
 * Six significant figures: enough to check a number by hand, without binary noise.
 * @example formatReadable(-97.49891528) === '-97.4989'
 */
export function formatReadable(value: number): string {
  return String(Number(value.toPrecision(6)));
}

/** "280 mL", "0.6" for a fraction, "positive" for text; UCUM codes shown as a reader writes them. */
export function withUnit(value: number | string, unit: string, decimals?: number): string {
  const text = typeof value === 'number' ? formatNumber(value, decimals) : value;
  const shown = displayUnit(unit);
  return shown === '' ? text : `${text} ${shown}`;
}
