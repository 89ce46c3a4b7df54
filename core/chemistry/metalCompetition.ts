import { fail, ok, type Result } from '../result';
import type { SourceStatus } from '../references/source';
import { speciate, type MetalSpeciation } from './speciation';
import { defaultSetOf } from './sets';
import { molarFromMicromolar, ph, type LigandConstantSet } from './types';

/**
 * Plasma ionized (free) calcium used by the illustration, µmol/L: 1.2 mmol/L,
 * inside the reference interval 1.11–1.40 mmol/L (central 95 % of 11,320
 * determinations; serum ionized calcium reference-interval study, J Bras Patol
 * Med Lab, abstract: source 'ionized-calcium-interval-2004'). Protein-bound calcium
 * (about 40 % of the total ~2.5 mmol/L) is not modelled: only the ionized pool is
 * offered to the ligand (common practice for this illustration).
 */
export const plasmaIonizedCalciumUmolPerL = 1200;

/**
 * Edetate concentration of the drug comparison, µmol/L: 1 mmol/L, chosen to be
 * near the plasma calcium so that the calcium it takes is visible. Illustrative,
 * not a measured plasma level after a dose.
 */
export const illustrativeEdetateUmolPerL = 1000;

/** Lead and calcium after one edetate addition. */
export interface LeadCalciumState {
  /** −log₁₀[Pb²⁺ free]. */
  readonly pPb: number;
  /** Share of the lead held by edetate, 0–1. */
  readonly leadBoundFraction: number;
  /** Share of the lead not held by edetate (aqua ion and hydroxo species), 0–1, summed directly. */
  readonly leadUnboundFraction: number;
  /** Share of all edetate on lead, and on calcium, 0–1. */
  readonly ligandShareLead: number;
  readonly ligandShareCalcium: number;
  /** Free (ionized) calcium left, mmol/L; the total calcium when no calcium is present. */
  readonly freeCalciumMmolPerL: number;
}

export interface LeadCalciumCompetition {
  readonly setId: string;
  readonly setLabel: string;
  readonly setStatus: SourceStatus;
  readonly pH: number;
  readonly leadUmolPerL: number;
  readonly calciumUmolPerL: number;
  /** Standard-convention ligand (10 µM) with lead alone. */
  readonly leadAlone: LeadCalciumState;
  /** The same with plasma ionized calcium present. */
  readonly withPlasmaCalcium: LeadCalciumState;
  readonly drugEdetateUmolPerL: number;
  /** Edetate given without calcium (edetate disodium): it takes calcium from plasma. */
  readonly edetateDisodium: LeadCalciumState;
  /** Edetate given as its calcium complex (calcium disodium edetate): each edetate brings one calcium. */
  readonly calciumDisodiumEdetate: LeadCalciumState;
  readonly sourceIds: readonly string[];
}

export interface LeadCalciumOptions {
  /** An EDTA (or other) set with Pb²⁺ and Ca²⁺ constants; default the EDTA default set. */
  readonly set?: LigandConstantSet;
  readonly leadUmolPerL?: number;
  readonly calciumUmolPerL?: number;
  readonly ligandUmolPerL?: number;
  readonly drugEdetateUmolPerL?: number;
}

/**
 * Lead against plasma calcium for edetate at pH 7.4: how much of the ligand goes
 * to calcium rather than lead, what that does to pPb, and why the calcium complex
 * (calcium disodium edetate) is the form used for lead rather than edetate
 * disodium, which takes ionized calcium out of plasma (fatal hypocalcaemia,
 * MMWR 2006;55:204). Lead stays bound either way, because log K(PbY) 18.0 exceeds
 * log K(CaY) 10.7 by more than seven units (Martell & Smith, set 'edta-textbook-25c').
 *
 * @param options - set (default EDTA default set), lead (default 1 µmol/L), calcium (default 1200 µmol/L),
 *   ligand for the pM part (default 10 µmol/L), drug edetate (default 1000 µmol/L); all 1e-6 to 1e5 µmol/L
 * @returns the four states, or the speciation issues (set without Pb²⁺ or Ca²⁺ constants, no convergence)
 * @example leadCalciumCompetition() → withPlasmaCalcium.ligandShareCalcium ≈ 0.90, ligandShareLead ≈ 0.10;
 *   edetateDisodium.freeCalciumMmolPerL ≈ 0.20; calciumDisodiumEdetate.freeCalciumMmolPerL ≈ 1.20
 */
export function leadCalciumCompetition(options: LeadCalciumOptions = {}): Result<LeadCalciumCompetition> {
  const set = options.set ?? defaultSetOf('edta');
  const leadUmol = options.leadUmolPerL ?? 1;
  const calciumUmol = options.calciumUmolPerL ?? plasmaIonizedCalciumUmolPerL;
  const ligandUmol = options.ligandUmolPerL ?? 10;
  const drugUmol = options.drugEdetateUmolPerL ?? illustrativeEdetateUmolPerL;
  const physiologicalPh = ph(7.4);

  const solve = (calciumTotalUmol: number, edetateUmol: number): Result<LeadCalciumState> => {
    const metals = [
      { metal: 'Pb2+' as const, totalMolar: molarFromMicromolar(leadUmol) },
      ...(calciumTotalUmol > 0 ? [{ metal: 'Ca2+' as const, totalMolar: molarFromMicromolar(calciumTotalUmol) }] : []),
    ];
    const result = speciate(set, metals, molarFromMicromolar(edetateUmol), physiologicalPh);
    if (!result.ok) return fail(...result.issues);
    const lead = result.value.metals[0]!;
    const calcium: MetalSpeciation | undefined = result.value.metals[1];
    return ok({
      pPb: lead.pM,
      leadBoundFraction: lead.boundFraction,
      leadUnboundFraction: lead.unboundFraction,
      ligandShareLead: lead.ligandShare,
      ligandShareCalcium: calcium?.ligandShare ?? 0,
      freeCalciumMmolPerL: calcium ? calcium.freeMolar * 1000 : 0,
    });
  };

  const states = [solve(0, ligandUmol), solve(calciumUmol, ligandUmol), solve(calciumUmol, drugUmol), solve(calciumUmol + drugUmol, drugUmol)];
  const values: LeadCalciumState[] = [];
  // The four solves share the set and the metals, so the first refusal speaks for all.
  for (const state of states) {
    if (!state.ok) return fail(...state.issues);
    values.push(state.value);
  }
  const [leadAlone, withPlasmaCalcium, edetateDisodium, calciumDisodiumEdetate] = values as [LeadCalciumState, LeadCalciumState, LeadCalciumState, LeadCalciumState];
  return ok({
    setId: set.id,
    setLabel: set.label,
    setStatus: set.status,
    pH: physiologicalPh,
    leadUmolPerL: leadUmol,
    calciumUmolPerL: calciumUmol,
    leadAlone,
    withPlasmaCalcium,
    drugEdetateUmolPerL: drugUmol,
    edetateDisodium,
    calciumDisodiumEdetate,
    sourceIds: [...set.sourceIds, 'ionized-calcium-interval-2004', 'mmwr-2006-edetate', 'pm-convention'],
  });
}
