/**
 * Small helpers that keep the findings' sentences in one voice: numbers
 * without binary noise, units as a reader writes them, drug names as generic
 * names with a capital at the start of a sentence.
 */

/**
 * A number with at most `decimals` decimals and no trailing zeros.
 *
 * @param value - any finite number
 * @param decimals - 0–6
 * @example shown(37.04, 0) === '37'; shown(0.02286, 4) === '0.0229'; shown(1.30, 2) === '1.3'
 */
export function shown(value: number, decimals: number): string {
  return String(Number(value.toFixed(decimals)));
}

/** UCUM codes as a reader writes them. */
const readableUnits: Readonly<Record<string, string>> = {
  'mL/min/{1.73_m2}': 'mL/min/1.73 m²',
  'ug/L': 'µg/L',
  'ng/mL': 'ng/mL',
  '10*9/L': '× 10⁹/L',
  '10*3/uL': '× 10³/µL',
  'mg/g{dry}': 'mg/g dry',
  'mg/kg/d': 'mg/kg/day',
  'mg/d': 'mg/day',
  'umol/L': 'µmol/L',
};

/**
 * A unit as a reader writes it.
 *
 * @param ucum - a UCUM code (or '%', 'ms', 'U/L')
 * @example readableUnit('mL/min/{1.73_m2}') === 'mL/min/1.73 m²'
 */
export function readableUnit(ucum: string): string {
  return readableUnits[ucum] ?? ucum;
}

/**
 * A generic drug name with a capital first letter, to open a sentence.
 *
 * @example capitalised('deferasirox') === 'Deferasirox'
 */
export function capitalised(text: string): string {
  return text.length === 0 ? text : text[0]!.toUpperCase() + text.slice(1);
}

/** The closing words every review finding carries. */
export const forPrescriberReview = 'for prescriber review';
