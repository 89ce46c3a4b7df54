/**
 * An amount as a pharmacist writes it in a sentence: thousands separated by a
 * comma, at most `decimals` decimals, no trailing zeros, no binary noise.
 * Locale-free on purpose, so the same text appears on every desktop.
 *
 * @param value - any finite number
 * @param decimals - most decimals shown, 0–6 (default 2)
 * @returns the text
 * @example formatAmount(1080) === '1,080'; formatAmount(20.769, 1) === '20.8'; formatAmount(1.5) === '1.5'
 */
export function formatAmount(value: number, decimals = 2): string {
  const rounded = Number(value.toFixed(decimals));
  const [whole, fractionPart] = String(Math.abs(rounded)).split('.') as [string, string | undefined];
  const grouped = whole.replace(/\B(?=(\d{3})+(?!\d))/g, ',');
  const sign = rounded < 0 ? '−' : '';
  return `${sign}${grouped}${fractionPart ? `.${fractionPart}` : ''}`;
}
