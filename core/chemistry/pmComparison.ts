import { speciate } from './speciation';
import { ligandConstantSets } from './sets';
import type { LigandConstantSet, LigandId, MetalId, Molar } from './types';
import { ligandIds, molarFromMicromolar, ph } from './types';

/** One row of the capacity comparison: a ligand's pM at pH 7.4 under the standard convention. */
export interface PmComparisonRow {
  readonly ligand: LigandId;
  readonly ligandName: string;
  readonly setId: string;
  readonly setLabel: string;
  /** 'computed' from the set; 'literature' when the set's constants are unconfirmed; 'none' when neither exists. */
  readonly basis: 'computed' | 'literature' | 'none';
  readonly pM?: number;
  readonly sourceIds: readonly string[];
  readonly note: string;
}

/**
 * pM at pH 7.4 for each ligand's default constant set under the standard
 * convention (1 µM metal, 10 µM ligand; references.md §6) — the chemistry half
 * of the per-dose capacity comparison (the stoichiometric half comes from
 * core/chelators). A set with unconfirmed constants shows its published pM as a
 * literature value; a set without constants for the metal shows none.
 *
 * @param metal - the metal (default Fe³⁺)
 * @param totalMetalMolar - total metal, mol/L (default 1e-6)
 * @param totalLigandMolar - total ligand, mol/L (default 1e-5)
 * @param sets - the sets to compare (default: each ligand's default set)
 * @returns one row per ligand
 * @example pmComparisonAtPhysiologicalPh() → deferoxamine ≈ 26.7 (computed), deferasirox 22.5 (literature), …
 */
export function pmComparisonAtPhysiologicalPh(
  metal: MetalId = 'Fe3+',
  totalMetalMolar: Molar = molarFromMicromolar(1),
  totalLigandMolar: Molar = molarFromMicromolar(10),
  sets: readonly LigandConstantSet[] = ligandIds.map((id) => ligandConstantSets.find((it) => it.ligand === id && it.isDefault)!),
): PmComparisonRow[] {
  const physiologicalPh = ph(7.4);
  return sets.map((set) => {
    const base = { ligand: set.ligand, ligandName: set.ligandName, setId: set.id, setLabel: set.label };
    const literature = set.literaturePm?.find((it) => it.metal === metal);
    if (set.metalConstantsUnconfirmed) {
      return literature
        ? { ...base, basis: 'literature', pM: literature.pM, sourceIds: [literature.sourceId], note: literature.note }
        : { ...base, basis: 'none', sourceIds: set.sourceIds, note: 'Constants unconfirmed and no published value entered.' };
    }
    const result = speciate(set, [{ metal, totalMolar: totalMetalMolar }], totalLigandMolar, physiologicalPh);
    if (!result.ok) {
      return { ...base, basis: 'none', sourceIds: set.sourceIds, note: result.issues.map((it) => it.message).join(' ') };
    }
    return {
      ...base,
      basis: 'computed',
      pM: result.value.metals[0]!.pM,
      sourceIds: [...set.sourceIds, 'pm-convention'],
      note: `Computed from ${set.id} (${set.status}).`,
    };
  });
}
