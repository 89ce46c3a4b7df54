import type { ResultEntry } from '../model/caseFile';
import { creatinineMgPerDlFromUmolPerL } from '../units/concentration';
import type { UmolPerL } from '../units/quantity';

type CreatinineEntry = Extract<ResultEntry, { readonly kind: 'creatinine' }>;

/**
 * A creatinine result in mg/dL, whatever unit it was entered in
 * (µmol/L ÷ 88.40, from the CIAAW molar mass of creatinine, core/units).
 *
 * @param entry - a creatinine result as entered
 * @returns mg/dL
 * @example creatinineMgPerDl({ …, measured: { value: 132.6, unit: 'umol/L' } }) ≈ 1.5
 */
export function creatinineMgPerDl(entry: CreatinineEntry): number {
  return entry.measured.unit === 'mg/dL' ? entry.measured.value : creatinineMgPerDlFromUmolPerL(entry.measured.value as UmolPerL);
}
