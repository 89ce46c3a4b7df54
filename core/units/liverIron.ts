import { atomicWeight } from '../elements/atomicWeights';
import type { MgPerGDry, MgPerGWet, UmolPerGDry } from './quantity';

/**
 * Liver iron concentration (LIC) unit conversions.
 *
 * mg/g dry → µmol/g dry: × 1000 / Ar(Fe) = × 17.907 (Ar(Fe) 55.845, CIAAW).
 * mg/g dry → mg/g wet: ÷ the dry-to-wet factor (default 3.33, i.e. about 70 %
 * water; Fischer & Harmatz, Hematology ASH Educ Program 2009:215, secondary),
 * which is an assumption the user can override ('liver-dry-to-wet-ratio').
 */

/** @example licUmolPerGDryFromMgPerGDry(mgPerGDry(1)) ≈ 17.907 */
export const licUmolPerGDryFromMgPerGDry = (lic: MgPerGDry): UmolPerGDry => ((lic * 1000) / atomicWeight('Fe')) as UmolPerGDry;
/** @example licMgPerGDryFromUmolPerGDry(17.907) ≈ 1 */
export const licMgPerGDryFromUmolPerGDry = (lic: UmolPerGDry): MgPerGDry => ((lic * atomicWeight('Fe')) / 1000) as MgPerGDry;
/** @example licMgPerGWetFromMgPerGDry(mgPerGDry(3.33), 3.33) === 1 */
export const licMgPerGWetFromMgPerGDry = (lic: MgPerGDry, dryToWetRatio: number): MgPerGWet =>
  (lic / dryToWetRatio) as MgPerGWet;
/** @example licMgPerGDryFromMgPerGWet(1, 3.33) === 3.33 */
export const licMgPerGDryFromMgPerGWet = (lic: MgPerGWet, dryToWetRatio: number): MgPerGDry =>
  (lic * dryToWetRatio) as MgPerGDry;
