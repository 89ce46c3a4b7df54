import type { ComplexConstant, MetalId } from '../types';

/**
 * Shorthand for one complex constant M_p L_q H_r (r < 0 for hydroxo) with the
 * value as printed. Internal to the constant-set files.
 */
export function complex(
  metal: MetalId,
  stoichiometry: { readonly metals?: number; readonly ligands?: number; readonly protons?: number },
  logBeta: number,
  asPrinted: string,
): ComplexConstant {
  return {
    metal,
    metalCount: stoichiometry.metals ?? 1,
    ligandCount: stoichiometry.ligands ?? 1,
    protonCount: stoichiometry.protons ?? 0,
    logBeta,
    asPrinted,
  };
}
