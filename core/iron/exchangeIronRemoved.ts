import type { Fraction, MgPerMl, Milligrams, Millilitres } from '../units/quantity';
import { transfusionIronMg } from './transfusionIron';

/**
 * Iron taken out by a red-cell exchange (manual or automated) or a venesection.
 *
 * iron removed (mg) = volume removed (mL) × patient haematocrit (fraction) × iron per mL of pure red cells (mg/mL)
 *
 * The arithmetic is the transfusion's (iron in the red cells of a volume of
 * blood), so it delegates to {@link transfusionIronMg}; only the roles differ.
 * Source: the standard method (references.md §1; design.md §5). During an
 * automated exchange the haematocrit of the removed blood drifts; the
 * pre-procedure value makes this an approximation.
 *
 * @param volumeRemovedMl - volume of the patient's blood removed, mL (a venesection about 250–500 mL; an automated exchange up to about 5000 mL)
 * @param patientHaematocrit - the patient's haematocrit as a fraction (about 0.15–0.65)
 * @param ironPerMlRedCells - mg iron per mL of pure red cells (about 1.0–1.2)
 * @returns iron removed, mg (positive)
 * @example exchangeIronRemovedMg(ml(4000), fraction(0.3), mgPerMl(1.08)) ≈ 1296 mg
 */
export function exchangeIronRemovedMg(
  volumeRemovedMl: Millilitres,
  patientHaematocrit: Fraction,
  ironPerMlRedCells: MgPerMl,
): Milligrams {
  return transfusionIronMg(volumeRemovedMl, patientHaematocrit, ironPerMlRedCells);
}
