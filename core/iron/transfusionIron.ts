import type { Fraction, MgPerMl, Milligrams, Millilitres } from '../units/quantity';

/**
 * Iron brought in by one transfusion.
 *
 * iron (mg) = volume (mL) × unit haematocrit (fraction) × iron per mL of pure red cells (mg/mL)
 *
 * Source: the standard method (references.md §1, confirmed); iron per mL of
 * pure red cells is the assumption 'iron-per-ml-red-cells' (1.08 mg/mL default,
 * Cohen, Glimm & Porter, Blood 2008;111:583; 1.16 selectable).
 *
 * @param volumeMl - volume transfused, mL (a unit of packed cells is about 250–350 mL)
 * @param unitHaematocrit - haematocrit of the unit as a fraction (about 0.50–0.80)
 * @param ironPerMlRedCells - mg iron per mL of pure red cells (about 1.0–1.2)
 * @returns iron, mg
 * @example transfusionIronMg(ml(280), fraction(0.6), mgPerMl(1.08)) ≈ 181.44 mg
 */
export function transfusionIronMg(
  volumeMl: Millilitres,
  unitHaematocrit: Fraction,
  ironPerMlRedCells: MgPerMl,
): Milligrams {
  return (volumeMl * unitHaematocrit * ironPerMlRedCells) as Milligrams;
}
