import type { MgPerGDry, MgPerKg } from '../units/quantity';
import { licFromBodyIronMgPerKg } from './bodyIron';

/**
 * Change of liver iron concentration produced by a net iron balance.
 *
 * ΔLIC (mg/g dry) = net iron balance (mg/kg) ÷ 10.6
 *
 * The Angelucci relation has no intercept, so it holds for changes as it does
 * for stores; this is the inverse relation applied to a difference. Positive
 * net balance (intake above excretion) raises the LIC.
 * Source: Angelucci et al., N Engl J Med 2000;343:327; the method of the
 * phase-III balance analyses (references.md §3, memory for its exact form).
 *
 * @param netIron - iron in minus iron out over the period, mg/kg body weight (negative when more leaves than enters)
 * @returns change of LIC over the period, mg Fe/g dry weight (signed)
 * @example licChangeMgPerGDry(mgPerKg(-53)) === -5 mg/g dry
 */
export function licChangeMgPerGDry(netIron: MgPerKg): MgPerGDry {
  return licFromBodyIronMgPerKg(netIron);
}
