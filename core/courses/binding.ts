import { pmComparisonAtPhysiologicalPh, type PmComparisonRow } from '../chemistry/pmComparison';
import { defaultSetOf } from '../chemistry/sets';
import type { MetalId as ChemistryMetalId } from '../chemistry/types';
import { substanceForm } from '../chelators/substanceForms';
import { atomicWeight, type ElementSymbol } from '../elements/atomicWeights';
import { molarMass } from '../elements/molarMass';
import { courseDrug, type CourseDrugId } from './drugs';
import type { MetalId } from './regimens';

const elementOfMetal: Readonly<Record<MetalId, ElementSymbol>> = { lead: 'Pb', mercury: 'Hg', arsenic: 'As', copper: 'Cu' };
/** The ion the chemistry engine has constants for, per metal (arsenic has none). */
const ionOfMetal: Readonly<Record<MetalId, ChemistryMetalId | null>> = { lead: 'Pb2+', mercury: 'Hg2+', arsenic: null, copper: 'Cu2+' };

export interface CourseBindingRow {
  readonly drug: CourseDrugId;
  readonly drugLabel: string;
  readonly metal: MetalId;
  readonly doseMg: number;
  /** Molar mass of what is dosed, g/mol (CIAAW weights). */
  readonly molarMassGPerMol: number | null;
  /** Metal bound by one administration if every ligand molecule held metal: a ceiling, never an expected removal. */
  readonly stoichiometricCeilingMg: number | null;
  readonly ceilingLabel: string;
  /** pM at pH 7.4 (1 µM metal, 10 µM ligand) from core/chemistry where a constant set exists. */
  readonly pm: PmComparisonRow | null;
  readonly pmNote: string;
  readonly sourceIds: readonly string[];
}

/**
 * Metal bound per administration by stoichiometry (a ceiling, labelled as
 * such) beside the pM comparison of the chemistry engine where it has
 * constants (calcium disodium edetate: the EDTA set; succimer: protonation
 * only, so no pM).
 *
 * ceiling (mg) = dose (mg) / M(drug as dosed) / ligands per metal × Ar(metal)
 *
 * @param drugId - a course drug
 * @param doseMg - one administration, mg of the drug as dosed (> 0)
 * @param metal - the metal treated
 * @returns the row; ceiling null for zinc (not a chelator) or an uncatalogued metal
 * @example courseBindingRow('calcium-disodium-edetate', 1000, 'lead').stoichiometricCeilingMg ≈ 553.6 (1000 / 374.27 × 207.2)
 */
export function courseBindingRow(drugId: CourseDrugId, doseMg: number, metal: MetalId): CourseBindingRow {
  const drug = courseDrug(drugId);
  const element = elementOfMetal[metal];
  const binding = drug.bindings.find((it) => it.metal === element);
  const molar = drug.substanceFormId ? substanceForm(drug.substanceFormId).molarMassGPerMol : drug.formula ? molarMass(drug.formula) : null;
  const ceiling = molar !== null && binding ? (doseMg / molar / binding.ligandsPerMetal) * atomicWeight(element) : null;
  const ion = ionOfMetal[metal];
  let pm: PmComparisonRow | null = null;
  let pmNote = `No constant set for ${drug.label} in the chemistry engine: no pM.`;
  if (drug.chemistryLigand && ion) {
    pm = pmComparisonAtPhysiologicalPh(ion, undefined, undefined, [defaultSetOf(drug.chemistryLigand)])[0] ?? null;
    pmNote = pm && pm.basis === 'computed' ? `p${element} at pH 7.4 computed from ${pm.setId}.` : `${pm?.note ?? ''}`.trim() || 'No pM.';
  } else if (drug.chemistryLigand && !ion) {
    pmNote = `No ${metal} constants in the chemistry engine: no pM.`;
  }
  return {
    drug: drugId,
    drugLabel: drug.label,
    metal,
    doseMg,
    molarMassGPerMol: molar,
    stoichiometricCeilingMg: ceiling,
    ceilingLabel:
      ceiling === null
        ? drug.formula === null
          ? `${drug.label} is not a chelator: no stoichiometric figure.`
          : `No ${metal} stoichiometry catalogued for ${drug.label}.`
        : `stoichiometric ceiling (every molecule bound, ${binding!.ligandsPerMetal} : 1; from memory): an upper bound, not the expected removal`,
    pm,
    pmNote,
    sourceIds: ['course-stoichiometry-memory', 'course-molar-masses-memory', 'ciaaw-2021', ...(pm ? pm.sourceIds : [])],
  };
}
