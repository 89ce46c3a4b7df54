import type { ComplexConstant, MetalId } from '../types';

/**
 * Shorthand for one complex constant M_p L_q H_r (r < 0 for hydroxo) with the
 * value as printed. Internal to the constant-set files.
 *
 * @param metal - the metal ion
 * @param stoichiometry - metals p (default 1), ligands q (default 1), protons r (default 0; negative for hydroxide)
 * @param logBeta - overall log β from free M, free fully deprotonated L and H⁺
 * @param asPrinted - the value as printed in the source and any conversion
 * @returns the complex constant
 * @example complex('Fe3+', { ligands: 3 }, 37.4, 'log β3 = 37.4').ligandCount === 3
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
