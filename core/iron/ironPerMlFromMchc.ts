import { atomicWeight } from '../elements/atomicWeights';
import { haemoglobinMonomerMolarMassGPerMol } from '../units/concentration';
import type { GPerDl, MgPerMl, Quantity } from '../units/quantity';

/** Milligrams of iron per gram of haemoglobin. */
export type MgIronPerGHaemoglobin = Quantity<'mg/g'>;

/**
 * Iron per gram of haemoglobin: four haems, each with one iron atom, per
 * tetramer of 64 458 g/mol (4 × 16 114.5, the monomer mass used for SI
 * haemoglobin reporting, core/units/concentration).
 * 4 × 55.845 / 64 458 × 1000 = 3.4655 mg/g (references.md §1 prints 3.466).
 * Computed from the CIAAW atomic weight of iron (core/elements), not typed.
 */
export const ironPerGramHaemoglobinMg: MgIronPerGHaemoglobin = ((4 * atomicWeight('Fe') * 1000) /
  (4 * haemoglobinMonomerMolarMassGPerMol)) as MgIronPerGHaemoglobin;

/**
 * Iron per mL of pure red cells from the red cells' mean corpuscular
 * haemoglobin concentration (MCHC).
 *
 * iron (mg/mL) = MCHC (g/dL) × 10 (dL→L) × 3.466 mg Fe/g Hb ÷ 1000 (L→mL)
 *
 * Source: derived (references.md §1, 'iron-per-hb-derived'); Ar(Fe) from
 * CIAAW 2021. An MCHC of 31 g/dL gives about 1.07 mg/mL and 33.5 g/dL about
 * 1.16 mg/mL, the two published values of the assumption 'iron-per-ml-red-cells'.
 *
 * @param mchc - mean corpuscular haemoglobin concentration, g/dL (plausible 25–40)
 * @returns iron per mL of pure red cells, mg/mL
 * @example ironPerMlRedCellsFromMchc(gPerDl(31)) ≈ 1.0743 mg/mL
 */
export function ironPerMlRedCellsFromMchc(mchc: GPerDl): MgPerMl {
  return ((mchc * 10 * ironPerGramHaemoglobinMg) / 1000) as MgPerMl;
}
