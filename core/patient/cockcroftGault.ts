import { fail, issue, ok, type Result } from '../result';
import type { Kilograms, MgPerDl, MlPerMin, Years } from '../units/quantity';
import { adultFromAgeYears, oldestAgeYears } from './ageRanges';
import type { SexAtBirth } from './sexAtBirth';

/**
 * Creatinine clearance by Cockcroft–Gault (not normalised to body-surface area).
 *
 * CrCl (mL/min) = (140 − age) × weight (kg) / (72 × SCr (mg/dL)), × 0.85 if female
 *
 * Source: Cockcroft DW, Gault MH, Prediction of creatinine clearance from serum
 * creatinine, Nephron 1976;16:31 ('cockcroft-gault-1976', secondary). 140, 72
 * and 0.85 as printed. Derived in adult men, with creatinine by the Jaffe method;
 * the weight is the weight the user enters (actual weight in the original
 * study; local protocols may choose ideal or adjusted weight in obesity).
 *
 * @param ageYears - age, years, 18–120 (children are refused: not derived in them)
 * @param weightKg - body weight, kg, 20–350
 * @param creatinineMgPerDl - serum creatinine, mg/dL, 0.1–20
 * @param sexAtBirth - 'female' or 'male'
 * @returns creatinine clearance, mL/min; or a 'not_applicable' issue under 18 years
 * @example creatinineClearanceCockcroftGault(years(70), kg(75), mgPerDl(1.0), 'male') → ok(72.9…)
 */
export function creatinineClearanceCockcroftGault(
  ageYears: Years,
  weightKg: Kilograms,
  creatinineMgPerDl: MgPerDl,
  sexAtBirth: SexAtBirth,
): Result<MlPerMin> {
  if (ageYears < adultFromAgeYears) {
    return fail(
      issue(
        'not_applicable',
        ['ageYears'],
        `Age ${ageYears} years is outside the range of Cockcroft–Gault (${adultFromAgeYears}–${oldestAgeYears} years; it was derived in adults); for a child, review the bedside Schwartz eGFR (egfr-schwartz-bedside).`,
      ),
    );
  }
  const femaleFactor = sexAtBirth === 'female' ? 0.85 : 1;
  return ok((((140 - ageYears) * weightKg) / (72 * creatinineMgPerDl)) * femaleFactor as MlPerMin);
}
