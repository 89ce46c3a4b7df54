import type { Fraction, GPerDl, Kilograms, Millilitres } from '../units/quantity';

/**
 * The factor 3 of the Davies formula, as printed (Davies et al., Transfusion
 * 2007;47:212). Divided by a unit haematocrit of 0.6 it gives 5 mL/kg per
 * g/dL, the gradient those authors measured (5.02).
 */
export const daviesFactor = 3;

/**
 * Volume of red cells to transfuse for a desired rise in haemoglobin
 * (Davies formula, derived in children).
 *
 * volume (mL) = weight (kg) × haemoglobin rise (g/dL) × 3 ÷ unit haematocrit (fraction)
 *
 * Source: Davies P, Robertson S, Hegde S, et al., Calculating the required
 * transfusion volume in children, Transfusion 2007;47:212-216 (as quoted by
 * Cornell et al. 2017). Derived in children without bleeding, haemolysis or
 * large fluid infusions; for review by the prescriber, following local protocols.
 *
 * @param weightKg - body weight, kg (plausible 0.5–150; the study population was children)
 * @param riseGPerDl - desired haemoglobin rise, g/dL (plausible 0.1–10)
 * @param unitHaematocrit - haematocrit of the unit as a fraction (about 0.50–0.80)
 * @returns volume, mL
 * @example transfusionVolumeForHbRiseMl(kg(20), gPerDl(3), fraction(0.6)) === 300 mL
 */
export function transfusionVolumeForHbRiseMl(weightKg: Kilograms, riseGPerDl: GPerDl, unitHaematocrit: Fraction): Millilitres {
  return ((weightKg * riseGPerDl * daviesFactor) / unitHaematocrit) as Millilitres;
}
