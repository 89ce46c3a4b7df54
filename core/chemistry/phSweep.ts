import type { Issue } from '../result';
import { conditionalConstant } from './conditionalConstant';
import { speciate } from './speciation';
import type { LigandConstantSet, MetalId, Molar, Ph } from './types';
import { ph } from './types';

/** One point of a sweep: a value, or the issue that stopped it at this pH. */
export type SweepPoint =
  | { readonly pH: Ph; readonly ok: true; readonly value: number }
  | { readonly pH: Ph; readonly ok: false; readonly issues: readonly Issue[] };

/**
 * The pH grid of the sweeps: from `fromPh` to `toPh` inclusive in equal steps.
 *
 * @param fromPh - first pH, 0–14
 * @param toPh - last pH, ≥ fromPh, 0–14
 * @param stepPh - step, > 0 (0.1 to 1 usual)
 * @returns the pH values
 * @example phGrid(2, 12, 1) → [2, 3, …, 12] (11 values)
 */
export function phGrid(fromPh: number, toPh: number, stepPh: number): Ph[] {
  const count = Math.round((toPh - fromPh) / stepPh);
  return Array.from({ length: count + 1 }, (_, index) => ph(Math.round((fromPh + index * stepPh) * 1e9) / 1e9));
}

/**
 * pM against pH for one ligand set and one metal (default grid pH 2–12),
 * each point solved with the previous solution as a warm start.
 *
 * @param set - one named constant set
 * @param metal - the metal
 * @param totalMetalMolar - total metal, mol/L (1e-12 to 0.1)
 * @param totalLigandMolar - total ligand, mol/L (1e-12 to 0.1)
 * @param pHs - the grid (default phGrid(2, 12, 0.5))
 * @returns one point per pH: pM, or the issue at that pH
 * @example pmSweep(deferoxamine set, 'Fe3+', 1e-6, 1e-5)[11] → { pH: 7.5, ok: true, value ≈ 26.94 }
 */
export function pmSweep(
  set: LigandConstantSet,
  metal: MetalId,
  totalMetalMolar: Molar,
  totalLigandMolar: Molar,
  pHs: readonly Ph[] = phGrid(2, 12, 0.5),
): SweepPoint[] {
  let warm: readonly number[] | undefined;
  return pHs.map((pH) => {
    const options = warm ? { initialLogFree: warm } : {};
    const result = speciate(set, [{ metal, totalMolar: totalMetalMolar }], totalLigandMolar, pH, options);
    if (!result.ok) return { pH, ok: false, issues: result.issues };
    warm = result.value.solution.logFree;
    return { pH, ok: true, value: result.value.metals[0]!.pM };
  });
}

/**
 * log K′ (conditional constant of the principal complex) against pH.
 *
 * @param set - one named constant set
 * @param metal - the metal
 * @param pHs - the grid (default phGrid(2, 12, 0.5))
 * @returns one point per pH: log K′, or the issue at that pH
 * @example conditionalConstantSweep(edta 25 °C set, 'Ca2+')[0] → { pH: 2, ok: true, value ≈ 10.7 − 13.59 = −2.89 }
 */
export function conditionalConstantSweep(
  set: LigandConstantSet,
  metal: MetalId,
  pHs: readonly Ph[] = phGrid(2, 12, 0.5),
): SweepPoint[] {
  return pHs.map((pH) => {
    const result = conditionalConstant(set, metal, pH);
    return result.ok ? { pH, ok: true, value: result.value.logConditional } : { pH, ok: false, issues: result.issues };
  });
}
