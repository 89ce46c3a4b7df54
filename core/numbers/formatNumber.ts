/**
 * The one module that writes numbers for a reader (one table per fact: a formatter lives
 * in one place). The command line, the review sheet, the findings' sentences, the dose
 * proposals and the workspace screens all format through these functions, so a figure
 * reads the same wherever it is printed. Locale-free on purpose: the same text on every
 * desktop. Units are added by `withUnit` (core/units/displayUnit.ts), which builds on these.
 */

/**
 * Format a number for a reader: fixed decimals for ordinary magnitudes,
 * three significant figures for small ones (so 0.0123 does not print as 0.01),
 * and scientific notation for very large or very small ones. What `compute` and
 * the review sheet print, so a sheet's figures match `compute` digit for digit.
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

/**
 * At most `decimals` decimals and no trailing zeros, as a sentence states a value.
 *
 * @param value - any finite number
 * @param decimals - 0–6
 * @example formatTrimmed(37.04, 0) === '37'; formatTrimmed(0.02286, 4) === '0.0229'; formatTrimmed(1.30, 2) === '1.3'
 */
export function formatTrimmed(value: number, decimals: number): string {
  return String(Number(value.toFixed(decimals)));
}

/** Thousands separated by a comma in the whole part of a plain decimal text ('12345.5' → '12,345.5'). */
function grouped(digits: string): string {
  const [whole, fraction] = digits.split('.') as [string, string | undefined];
  return `${whole.replace(/\B(?=(\d{3})+(?!\d))/g, ',')}${fraction !== undefined ? `.${fraction}` : ''}`;
}

/**
 * An amount as a pharmacist writes it in a sentence: thousands separated by a
 * comma, at most `decimals` decimals, no trailing zeros, no binary noise, a minus sign (−).
 *
 * @param value - any finite number
 * @param decimals - most decimals shown, 0–6 (default 2)
 * @returns the text
 * @example formatAmount(1080) === '1,080'; formatAmount(20.769, 1) === '20.8'; formatAmount(1.5) === '1.5'
 */
export function formatAmount(value: number, decimals = 2): string {
  const rounded = Number(value.toFixed(decimals));
  return `${rounded < 0 ? '−' : ''}${grouped(String(Math.abs(rounded)))}`;
}

/**
 * Exactly `decimals` decimals with thousands separated by a comma, as a table column
 * shows a value (the workspace screens): formatGrouped(2900, 0) === '2,900'; formatGrouped(11.4, 2) === '11.40'.
 *
 * @param value - any finite number
 * @param decimals - 0–20
 */
export function formatGrouped(value: number, decimals: number): string {
  const fixed = Math.abs(value).toFixed(decimals);
  const negative = value < 0 && Number(fixed) !== 0;
  return `${negative ? '-' : ''}${grouped(fixed)}`;
}
