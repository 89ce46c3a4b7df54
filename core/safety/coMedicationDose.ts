import type { CoMedication } from '../model/caseFile';
import { milligramsFromGrams } from '../units/mass';
import type { Grams } from '../units/quantity';

/**
 * A co-medication's dose per administration in mg, whatever unit it was
 * entered in (g × 1000 through core/units; mg/kg × the weight).
 *
 * @param dose - as entered: mg, g or mg/kg
 * @param weightKg - the weight a mg/kg dose refers to, kg (> 0)
 * @returns mg per administration
 * @example coMedicationDoseMg({ value: 0.1, unit: 'g' }, 23) === 100; coMedicationDoseMg({ value: 2, unit: 'mg/kg' }, 23) === 46
 */
export function coMedicationDoseMg(dose: NonNullable<CoMedication['dose']>, weightKg: number): number {
  if (dose.unit === 'g') return milligramsFromGrams(dose.value as Grams);
  return dose.unit === 'mg/kg' ? dose.value * weightKg : dose.value;
}
