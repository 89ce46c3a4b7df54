import { fail, issue, ok, type Issue, type Result } from '../result';
import { checkSetApplies } from './conditionalConstant';
import { solveEquilibrium, type EquilibriumSolution, type SolveOptions, type SpeciesDefinition } from './equilibriumSolver';
import { hydrolysisOf } from './hydrolysis';
import { elementOf, speciesName } from './speciesName';
import type { LigandConstantSet, MetalId, Molar, Ph } from './types';

export interface MetalTotal {
  readonly metal: MetalId;
  readonly totalMolar: Molar;
}

export interface MetalSpeciation {
  readonly metal: MetalId;
  readonly totalMolar: Molar;
  /** Free aqua ion, mol/L. */
  readonly freeMolar: Molar;
  /** pM = −log₁₀[M free aqua ion]. */
  readonly pM: number;
  /** Share of the metal held by the ligand (all complexes), 0–1. */
  readonly boundFraction: number;
  /** Share of the metal in its own hydroxo species (no ligand), 0–1. */
  readonly hydrolysedFraction: number;
  /** Share of the metal not held by the ligand (aqua ion plus hydroxo species), 0–1, summed directly (no 1 − x cancellation). */
  readonly unboundFraction: number;
  /** Share of the total ligand held in this metal's complexes, 0–1. */
  readonly ligandShare: number;
  /** The complex holding most of this metal, e.g. 'FeL3'; '' when no complex. */
  readonly dominantComplex: string;
}

export interface Speciation {
  readonly setId: string;
  readonly setLabel: string;
  readonly pH: Ph;
  readonly totalLigandMolar: Molar;
  /** Fully deprotonated free ligand, mol/L. */
  readonly freeLigandMolar: Molar;
  /** Share of the ligand not bound to any metal (all protonation states), 0–1. */
  readonly unboundLigandFraction: number;
  readonly metals: readonly MetalSpeciation[];
  /** Every species with its concentration, largest first. */
  readonly species: readonly { readonly name: string; readonly molar: number; readonly log10Molar: number }[];
  readonly solution: EquilibriumSolution;
}

interface BuiltSpecies extends SpeciesDefinition {
  readonly role: 'free' | 'protonated-ligand' | 'hydroxo' | 'complex';
  /** Metal index (into metals) and count for complexes and hydroxo species. */
  readonly metalIndex?: number;
}

/**
 * Speciation of one ligand (one named constant set) with one or more metals at
 * a fixed pH: the free metal, the free ligand, every species, and pM = −log[M]
 * (the free aqua ion). Species: free ligand and its protonated forms, each
 * metal's hydrolysis products (Fe₂(OH)₂⁴⁺ included; solid hydroxides excluded by
 * the pM convention), and the set's complexes for the metals present. Several
 * metals compete for the one ligand (e.g. Pb²⁺ with plasma Ca²⁺ for EDTA).
 *
 * @param set - one named constant set (never mixed with another)
 * @param metals - each metal with its total, mol/L (1e-12 to 0.1), no metal twice
 * @param totalLigandMolar - total ligand, mol/L (1e-12 to 0.1)
 * @param pH - fixed pH, 0–14 (a conditional set only at its own pH)
 * @param options - solver options (warm start, iteration limit)
 * @returns the speciation, or issues (set not applicable, bad totals, no convergence)
 * @example speciate(deferoxamine set, [{ metal: 'Fe3+', totalMolar: 1e-6 }], 1e-5, ph(7.4)) → pM ≈ 26.7
 */
export function speciate(
  set: LigandConstantSet,
  metals: readonly MetalTotal[],
  totalLigandMolar: Molar,
  pH: Ph,
  options: SolveOptions = {},
): Result<Speciation> {
  const issues: Issue[] = [];
  metals.forEach((entry, index) => {
    const applies = checkSetApplies(set, entry.metal, pH);
    if (!applies.ok) issues.push(...applies.issues.map((it) => ({ ...it, path: ['metals', index, ...it.path] })));
    if (metals.findIndex((other) => other.metal === entry.metal) !== index) {
      issues.push(issue('inconsistent', ['metals', index, 'metal'], `Metal ${entry.metal} is listed twice; give its total once.`));
    }
  });
  if (issues.length > 0) return fail(...issues);

  const componentCount = metals.length + 1;
  const ligandIndex = metals.length;
  const unit = (k: number): number[] => Array.from({ length: componentCount }, (_, l) => (l === k ? 1 : 0));
  const species: BuiltSpecies[] = [];
  metals.forEach((entry, index) => {
    species.push({ name: elementOf(entry.metal), stoichiometry: unit(index), protonCount: 0, logBeta: 0, role: 'free', metalIndex: index });
  });
  species.push({ name: 'L', stoichiometry: unit(ligandIndex), protonCount: 0, logBeta: 0, role: 'free' });
  let cumulative = 0;
  // A conditional set (transferrin) already contains protonation: no protonated forms.
  if (set.conditionalAtPh === undefined) {
    set.protonationLogK.forEach((logK, step) => {
      cumulative += logK;
      species.push({
        name: speciesName(null, 0, 1, step + 1),
        stoichiometry: unit(ligandIndex),
        protonCount: step + 1,
        logBeta: cumulative,
        role: 'protonated-ligand',
      });
    });
  }
  metals.forEach((entry, index) => {
    for (const hydroxo of hydrolysisOf(entry.metal).species) {
      const stoichiometry = new Array<number>(componentCount).fill(0);
      stoichiometry[index] = hydroxo.metalCount;
      species.push({
        name: speciesName(entry.metal, hydroxo.metalCount, 0, -hydroxo.hydroxideCount),
        stoichiometry,
        protonCount: -hydroxo.hydroxideCount,
        logBeta: hydroxo.logBetaStar,
        role: 'hydroxo',
        metalIndex: index,
      });
    }
    for (const entryComplex of set.complexes.filter((it) => it.metal === entry.metal)) {
      const stoichiometry = new Array<number>(componentCount).fill(0);
      stoichiometry[index] = entryComplex.metalCount;
      stoichiometry[ligandIndex] = entryComplex.ligandCount;
      species.push({
        name: speciesName(entry.metal, entryComplex.metalCount, entryComplex.ligandCount, entryComplex.protonCount),
        stoichiometry,
        protonCount: entryComplex.protonCount,
        logBeta: entryComplex.logBeta,
        role: 'complex',
        metalIndex: index,
      });
    }
  });

  const solved = solveEquilibrium(
    {
      components: [
        ...metals.map((it) => ({ name: `${it.metal} total`, totalMolar: it.totalMolar })),
        { name: 'ligand total', totalMolar: totalLigandMolar },
      ],
      species,
    },
    pH,
    options,
  );
  if (!solved.ok) return fail(...solved.issues);
  const solution = solved.value;
  const concentrationOf = (index: number): number => solution.species[index]!.molar;

  const metalResults: MetalSpeciation[] = metals.map((entry, metalIndex) => {
    let bound = 0;
    let hydrolysed = 0;
    let free = 0;
    let dominantComplex = '';
    let dominantAtoms = 0;
    let ligandHeld = 0;
    species.forEach((it, index) => {
      if (it.metalIndex !== metalIndex) return;
      const metalAtoms = it.stoichiometry[metalIndex]! * concentrationOf(index);
      if (it.role === 'free') free += metalAtoms;
      if (it.role === 'hydroxo') hydrolysed += metalAtoms;
      if (it.role === 'complex') {
        bound += metalAtoms;
        ligandHeld += it.stoichiometry[ligandIndex]! * concentrationOf(index);
        if (metalAtoms > dominantAtoms) {
          dominantAtoms = metalAtoms;
          dominantComplex = it.name;
        }
      }
    });
    const logFree = solution.logFree[metalIndex]!;
    return {
      metal: entry.metal,
      totalMolar: entry.totalMolar,
      freeMolar: (10 ** logFree) as Molar,
      pM: -logFree,
      boundFraction: bound / entry.totalMolar,
      hydrolysedFraction: hydrolysed / entry.totalMolar,
      unboundFraction: (free + hydrolysed) / entry.totalMolar,
      ligandShare: ligandHeld / totalLigandMolar,
      dominantComplex,
    };
  });
  let unboundLigand = 0;
  species.forEach((it, index) => {
    if (it.role === 'free' && it.metalIndex === undefined) unboundLigand += concentrationOf(index);
    if (it.role === 'protonated-ligand') unboundLigand += concentrationOf(index);
  });

  return ok({
    setId: set.id,
    setLabel: set.label,
    pH,
    totalLigandMolar,
    freeLigandMolar: (10 ** solution.logFree[ligandIndex]!) as Molar,
    unboundLigandFraction: unboundLigand / totalLigandMolar,
    metals: metalResults,
    species: [...solution.species].sort((a, b) => b.molar - a.molar),
    solution,
  });
}
