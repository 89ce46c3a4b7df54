import type { Days, Kilograms, MgPerKgPerDay, Milligrams } from '../units/quantity';

/**
 * Iron intake as a rate per kg of body weight per day over a window.
 *
 * rate (mg/kg/day) = total iron (mg) ÷ weight (kg) ÷ window (days)
 *
 * Source: the usual way transfusional loading is stated (Brittenham, N Engl J
 * Med 2011;364:146, Table 2; Hoffbrand et al., Blood 2012;120:3657).
 *
 * @param totalIronMg - iron brought in over the window, mg (0 or more)
 * @param weightKg - body weight, kg (plausible 1–200; use the weight over the window)
 * @param windowDays - length of the window, days (more than 0; a trailing year is 365 or 366)
 * @returns mg/kg/day
 * @example ironIntakeRateMgPerKgPerDay(mg(5460), kg(50), days(365)) ≈ 0.299 mg/kg/day
 */
export function ironIntakeRateMgPerKgPerDay(totalIronMg: Milligrams, weightKg: Kilograms, windowDays: Days): MgPerKgPerDay {
  return (totalIronMg / weightKg / windowDays) as MgPerKgPerDay;
}
