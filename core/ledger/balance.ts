import { angelucciSlopeMgPerKgPerMgPerGDry } from '../iron/bodyIron';

/**
 * Body iron stores carried forward from a measured LIC by the net balance since.
 *
 * stores (mg) = 10.6 × LIC at the anchor (mg/g dry) × weight at the anchor (kg) + net balance since (mg)
 * LIC now (mg/g dry) = stores ÷ (10.6 × weight now)
 *
 * Source: Angelucci et al., N Engl J Med 2000;343:327 (stores mg/kg = 10.6 × LIC).
 *
 * @param anchorLicMgPerGDry - measured LIC, mg/g dry (0–60)
 * @param anchorWeightKg - weight on the day of the measurement, kg
 * @param netSinceMg - iron in minus iron out since the measurement, mg (may be negative)
 * @param weightNowKg - weight now, kg
 * @returns stores in mg and the LIC estimate in mg/g dry (negative when the balance removes more than was there)
 * @example carriedForwardStores(10, 50, -31, 50) → { bodyIronMg: 5269, licMgPerGDry: 9.9415 }
 */
export function carriedForwardStores(
  anchorLicMgPerGDry: number,
  anchorWeightKg: number,
  netSinceMg: number,
  weightNowKg: number,
): { readonly bodyIronMg: number; readonly licMgPerGDry: number } {
  const bodyIronMg = angelucciSlopeMgPerKgPerMgPerGDry * anchorLicMgPerGDry * anchorWeightKg + netSinceMg;
  return { bodyIronMg, licMgPerGDry: bodyIronMg / (angelucciSlopeMgPerKgPerMgPerGDry * weightNowKg) };
}

/**
 * Chelation removal achieved between two LIC results (the balance method).
 *
 * Δstores (mg) = 10.6 × (LIC₂ × weight₂ − LIC₁ × weight₁)
 * removal by chelation (mg) = intake (mg) − Δstores (mg) − basal loss (mg)
 *
 * Source: Angelucci et al., N Engl J Med 2000;343:327; the balance method of
 * the deferasirox phase-III analyses (Cohen, Glimm & Porter, Blood 2008;111:583;
 * the exact method from memory).
 *
 * @returns Δstores and the removal by chelation, mg
 * @example measuredChelationMg({ intakeMg: 3650, fromLic: 12, toLic: 7.868, fromWeightKg: 50, toWeightKg: 50, basalLossMg: 365 }).chelationMg ≈ 5475
 */
export function measuredChelationMg(input: {
  readonly intakeMg: number;
  readonly fromLic: number;
  readonly toLic: number;
  readonly fromWeightKg: number;
  readonly toWeightKg: number;
  readonly basalLossMg: number;
}): { readonly storesChangeMg: number; readonly totalExcretionMg: number; readonly chelationMg: number } {
  const storesChangeMg = angelucciSlopeMgPerKgPerMgPerGDry * (input.toLic * input.toWeightKg - input.fromLic * input.fromWeightKg);
  const totalExcretionMg = input.intakeMg - storesChangeMg;
  return { storesChangeMg, totalExcretionMg, chelationMg: totalExcretionMg - input.basalLossMg };
}

/**
 * Iron in the red cells transfused and removed over a window.
 *
 * iron in (mg) = Σ volume × unit haematocrit (mL of pure red cells) × iron per mL of pure red cells
 * iron out (mg) = Σ volume removed × patient haematocrit × iron per mL (exchange, venesection)
 *
 * Source: the standard method (references.md §1); iron per mL of pure red
 * cells is the assumption 'iron-per-ml-red-cells' (1.08 mg/mL, Cohen, Glimm &
 * Porter, Blood 2008;111:583).
 *
 * @example netTransfusionalIron(336, 0, 1.08) → { ironInMg: 362.88, ironOutMg: 0, netMg: 362.88 }
 */
export function netTransfusionalIron(
  redCellsInMl: number,
  redCellsOutMl: number,
  ironPerMlRedCellsMg: number,
): { readonly ironInMg: number; readonly ironOutMg: number; readonly netMg: number } {
  const ironInMg = redCellsInMl * ironPerMlRedCellsMg;
  const ironOutMg = redCellsOutMl * ironPerMlRedCellsMg;
  return { ironInMg, ironOutMg, netMg: ironInMg - ironOutMg };
}

/**
 * Net iron balance over a number of days.
 *
 * net (mg) = transfusional net (mg) − chelation removal (mg) − basal loss (mg/day) × days
 *
 * Source: mass balance; basal loss about 1 mg/day (Hunt et al., Am J Clin Nutr 2009).
 *
 * @example netIronBalanceMg(1000, 600, 1, 100) === 300
 */
export function netIronBalanceMg(transfusionalNetMg: number, chelationRemovalMg: number, basalLossMgPerDay: number, days: number): number {
  return transfusionalNetMg - chelationRemovalMg - basalLossMgPerDay * days;
}
