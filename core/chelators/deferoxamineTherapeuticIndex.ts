import type { MgPerKg, MicrogramsPerLitre, Quantity } from '../units/quantity';

/** Deferoxamine therapeutic index: mg/kg/day of deferoxamine per µg/L of ferritin. */
export type TherapeuticIndex = Quantity<'(mg/kg/d)/(ug/L)'>;

/**
 * Index above which patients were at risk of sensorineural hearing loss:
 * "a ratio of greater than 0.025". Porter et al., Desferrioxamine ototoxicity:
 * evaluation of risk factors in thalassaemic patients and guidelines for safe
 * dosage, Br J Haematol 1989;73:403 (abstract, confirmed). Printed 0.025, used as is.
 */
export const deferoxamineTherapeuticIndexLimit = 0.025 as TherapeuticIndex;

/**
 * Mean daily deferoxamine dose from the week's doses: weekly dose ÷ 7.
 * Porter 1989 does not define "mean daily dose" in its abstract; averaging the
 * week's dose over 7 days is common practice (source 'common-practice').
 *
 * @param dosePerInfusionMgPerKg - mg/kg of deferoxamine mesylate per infusion (1–100)
 * @param infusionsPerWeek - infusions a week (1–7)
 * @returns mean daily dose, mg/kg/day (as mg/kg per day of the week)
 * @example meanDailyDeferoxamineDoseMgPerKg(mgPerKg(40), 5) ≈ 28.57
 */
export function meanDailyDeferoxamineDoseMgPerKg(dosePerInfusionMgPerKg: MgPerKg, infusionsPerWeek: number): MgPerKg {
  return ((dosePerInfusionMgPerKg * infusionsPerWeek) / 7) as MgPerKg;
}

/**
 * Deferoxamine therapeutic index = mean daily dose (mg/kg) ÷ serum ferritin (µg/L).
 * Above 0.025 marks a risk of sensorineural hearing loss (Porter et al., Br J
 * Haematol 1989;73:403): a finding for review by the prescriber.
 *
 * @param meanDailyDoseMgPerKg - mean daily dose, mg/kg (weekly dose ÷ 7), 0–100
 * @param ferritinUgPerL - serum ferritin, µg/L (= ng/mL), > 0
 * @returns the index, (mg/kg/day)/(µg/L)
 * @example deferoxamineTherapeuticIndex(mgPerKg(28.571), ugPerL(1250)) ≈ 0.0229
 */
export function deferoxamineTherapeuticIndex(meanDailyDoseMgPerKg: MgPerKg, ferritinUgPerL: MicrogramsPerLitre): TherapeuticIndex {
  return (meanDailyDoseMgPerKg / ferritinUgPerL) as TherapeuticIndex;
}

/**
 * Whether an index is above Porter's 0.025 (strictly greater, as the source words it).
 *
 * @param index - the therapeutic index
 * @returns true when above 0.025
 * @example deferoxamineTherapeuticIndexAboveLimit(0.0251 as TherapeuticIndex) === true
 */
export function deferoxamineTherapeuticIndexAboveLimit(index: TherapeuticIndex): boolean {
  return index > deferoxamineTherapeuticIndexLimit;
}
