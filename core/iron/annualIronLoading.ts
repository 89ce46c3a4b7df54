import type { MgPerKgPerDay, MgPerMl, MlPerKgPerYear } from '../units/quantity';
import { daysPerYear } from '../units/time';

/**
 * Daily transfusional iron loading from the annual volume of pure red cells
 * transfused per kg of body weight.
 *
 * loading (mg/kg/day) = annual pure red-cell volume (mL/kg/yr) × iron per mL of pure red cells (mg/mL) ÷ 365.2425
 *
 * Source: Hoffbrand, Taher & Cappellini, Blood 2012;120:3657 (2–4 units a month
 * is about 0.3–0.6 mg/kg/day); references.md §1 divides by 365, we by the mean
 * Gregorian year (core/units/time, a 0.07 % difference). Pure red-cell volume
 * is the transfused volume × unit haematocrit.
 *
 * @param annualRedCellVolume - pure red cells transfused per year, mL/kg/yr (plausible 0–400)
 * @param ironPerMlRedCells - mg iron per mL of pure red cells (about 1.0–1.2)
 * @returns mg/kg/day
 * @example dailyIronLoadingMgPerKgPerDay(mlPerKgPerYear(100), mgPerMl(1.08)) ≈ 0.2957 mg/kg/day
 */
export function dailyIronLoadingMgPerKgPerDay(annualRedCellVolume: MlPerKgPerYear, ironPerMlRedCells: MgPerMl): MgPerKgPerDay {
  return ((annualRedCellVolume * ironPerMlRedCells) / daysPerYear) as MgPerKgPerDay;
}
