/**
 * The spellings people type for the units a case file holds, mapped to their
 * UCUM codes. A lab report or a hand-typed entry says "µg/L", "ng/ml",
 * "umol/l", "x10^9/L" or "mg/g dry"; the case file stores the UCUM code
 * ('ug/L', 'ng/mL', 'umol/L', '10*9/L', 'mg/g{dry}') and keeps what was typed
 * beside it (core/model/bounds.ts), so nothing the user typed is lost.
 *
 * Matching ignores case, spaces and the difference between the micro sign
 * (U+00B5), the Greek mu (U+03BC) and "u"; it is applied only among the units
 * a field allows, so 'ML' for a volume can only be read as 'mL'. Spellings
 * beyond the UCUM code's own are common practice on laboratory reports. A
 * liver iron typed as plain "mg/g" is not matched: wet and dry weight differ
 * about 3.3-fold (Fischer & Harmatz 2009), so the user is asked which.
 */

/** Extra spellings per UCUM code (written already canonical: lower case, no spaces, "u" for micro). */
const aliases: Readonly<Record<string, readonly string[]>> = {
  'mg/g{dry}': ['mg/gdry', 'mg/gdw', 'mg/g(dry)', 'mg/gdryweight', 'mgfe/gdw', 'mgfe/gdry'],
  'ug/g{dry}': ['ug/gdry', 'ug/gdw', 'ug/g(dry)', 'ug/gdryweight'],
  'umol/g{dry}': ['umol/gdry', 'umol/gdw', 'umol/g(dry)', 'umol/gdryweight'],
  '10*9/L': ['x10^9/l', 'x10e9/l', '10^9/l', '10e9/l', 'x109/l', 'g/l(cells)', '*10^9/l', '×10^9/l', '×109/l'],
  '10*3/uL': ['x10^3/ul', 'x10e3/ul', '10^3/ul', '10e3/ul', 'k/ul', 'x103/ul', '×10^3/ul', '/nl'],
  'U/L': ['iu/l', 'u/l'],
  'ug/(24.h)': ['ug/24h', 'ug/day', 'ug/d', 'ug/24hr', 'ug/(24h)'],
  'umol/(24.h)': ['umol/24h', 'umol/day', 'umol/d', 'umol/24hr', 'umol/(24h)'],
  's-1': ['/s', '1/s', 'hz', 's^-1', 's⁻¹'],
  'mg/kg': ['mg/kgbw'],
  'mg/mmol': ['mg/mmolcreat', 'mg/mmolcreatinine'],
  'mg/g': ['mg/gcreat', 'mg/gcreatinine'],
};

/**
 * A unit as typed, in the form spellings are compared: lower case, no spaces,
 * micro as "u".
 *
 * @param typed - any text
 * @returns the canonical form
 * @example canonicalUnitSpelling(' µmol/l ') === 'umol/l'
 */
export function canonicalUnitSpelling(typed: string): string {
  return typed.replace(/[\u00b5\u03bc]/gu, 'u').replace(/\s+/gu, '').toLowerCase();
}

/**
 * The UCUM code a typed unit stands for, among the codes a field allows.
 * An exact UCUM code is taken as it is; otherwise the spelling is compared
 * without case, spaces or the micro-sign difference, and against the usual
 * spellings of lab reports.
 *
 * @param typed - the unit as typed ('µg/L', 'ml', 'mg/g dry', 'umol/l')
 * @param allowedUcumCodes - the UCUM codes the field accepts
 * @returns the matching UCUM code, or undefined when the spelling is none of them
 * @example ucumCodeForTypedUnit('umol/l', ['mg/dL', 'umol/L']) === 'umol/L'; ucumCodeForTypedUnit('mg/g dry', ['mg/g{dry}']) === 'mg/g{dry}'
 */
export function ucumCodeForTypedUnit<const Code extends string>(typed: string, allowedUcumCodes: readonly Code[]): Code | undefined {
  if ((allowedUcumCodes as readonly string[]).includes(typed)) return typed as Code;
  const wanted = canonicalUnitSpelling(typed);
  return allowedUcumCodes.find((code) => canonicalUnitSpelling(code) === wanted || (aliases[code] ?? []).includes(wanted));
}
