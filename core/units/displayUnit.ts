import { formatNumber } from '../numbers/formatNumber';

/**
 * UCUM unit codes as a pharmacist reads them on a lab report or a sheet.
 * Codes are kept at the boundaries (files, JSON); this is presentation only.
 */
const unitDisplay: Readonly<Record<string, string>> = {
  'ug/L': 'µg/L',
  'umol/L': 'µmol/L',
  'ug/dL': 'µg/dL',
  '10*9/L': '×10⁹/L',
  '10*3/uL': '×10³/µL',
  's-1': 's⁻¹',
  'mg/g{dry}': 'mg/g dry weight',
  'ug/g{dry}': 'µg/g dry weight',
  'umol/g{dry}': 'µmol/g dry weight',
  'mg/g{wet}': 'mg/g wet weight',
  'ug/(24.h)': 'µg/24 h',
  'umol/(24.h)': 'µmol/24 h',
  'mg/d': 'mg/day',
  'mg/kg/d': 'mg/kg/day',
  'mL/kg/a': 'mL/kg/year',
  'mL/min/{1.73_m2}': 'mL/min/1.73 m²',
  m2: 'm²',
  'mg/m2': 'mg/m²',
  a: 'years',
  d: 'days',
  'd/wk': 'days/week',
};

/**
 * A UCUM unit code as shown to a reader ('ug/L' → 'µg/L'); '1' shows as nothing.
 *
 * @param ucumCode - a UCUM code, or any unit text (returned unchanged when not listed)
 * @example displayUnit('10*9/L') === '×10⁹/L'
 */
export function displayUnit(ucumCode: string): string {
  if (ucumCode === '1') return '';
  return unitDisplay[ucumCode] ?? ucumCode;
}

/**
 * A value with its unit as a reader writes it: "280 mL", "0.6" for a fraction, "positive" for text.
 * A number goes through formatNumber (core/numbers/formatNumber.ts), the unit through displayUnit.
 *
 * @example withUnit(181.44, 'mg', 1) === '181.4 mg'; withUnit(0.6, '1') === '0.60'
 */
export function withUnit(value: number | string, unit: string, decimals?: number): string {
  const text = typeof value === 'number' ? formatNumber(value, decimals) : value;
  const shown = displayUnit(unit);
  return shown === '' ? text : `${text} ${shown}`;
}
