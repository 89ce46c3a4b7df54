import { angelucciSlopeMgPerKgPerMgPerGDry } from '../iron/bodyIron';

/** The projection models: removal that falls as iron falls (default), or removal held at today's rate. */
export const projectionModels = ['burden-dependent', 'constant-rate'] as const;
export type ProjectionModel = (typeof projectionModels)[number];

/**
 * The least chelatable excess the calibration divides by, mg/g dry: a patient
 * at or just above the floor would otherwise get an unbounded rate constant.
 * A modelling choice of ours (1 mg/g dry, a little more than the band's width
 * between normal stores and the 3 mg/g dry of the labels).
 */
export const minimumCalibrationExcessMgPerGDry = 1;

export interface StoresModel {
  /** Body iron stores on the start day, mg. */
  readonly startStoresMg: number;
  /** Weight on the start day, kg. */
  readonly startWeightKg: number;
  /** Weight gain, kg per day (0 for an adult; held at 0 after `growthDays`). */
  readonly weightGainKgPerDay: number;
  /** Days over which the weight gain applies (until age 18), ≥ 0. */
  readonly growthDays: number;
  /** Iron in minus basal loss, mg/day (transfusions net of blood removed, minus basal loss; may be negative). */
  readonly netInflowMgPerDay: number;
  /** Chelation removal on the start day at the chosen efficiency basis, mg/day. */
  readonly removalAtStartMgPerDay: number;
  /** Floor: LIC at or below which no more iron is removed, mg/g dry. */
  readonly floorLicMgPerGDry: number;
  /** Share of the removal proportional to the excess above the floor (1 burden-dependent, 0 constant-rate). */
  readonly burdenShare: number;
  /** Excess used to calibrate the rate constant, mg (the estimated excess at the start, at least the minimum). */
  readonly calibrationExcessMg: number;
}

/**
 * The excess a projection is calibrated on: body iron above the floor at the
 * start, at least {@link minimumCalibrationExcessMgPerGDry} worth of stores.
 *
 * @param startStoresMg - estimated stores at the start, mg
 * @param weightKg - weight at the start, kg
 * @param floorLicMgPerGDry - floor, mg/g dry
 * @returns mg
 * @example calibrationExcessMg(10.6 * 50 * 12, 50, 1.8) ≈ 10.6 × 50 × 10.2 = 5406
 */
export function calibrationExcessMg(startStoresMg: number, weightKg: number, floorLicMgPerGDry: number): number {
  const storesPerLic = angelucciSlopeMgPerKgPerMgPerGDry * weightKg;
  return Math.max(startStoresMg - floorLicMgPerGDry * storesPerLic, minimumCalibrationExcessMgPerGDry * storesPerLic);
}

/**
 * Body iron stores after a number of days under the projection model.
 *
 * Above the floor (E = stores − floor stores > 0), removal is
 * R = R₀ × [(1 − s) + s × E ⁄ E_cal], so dE/dt = net inflow − floor growth − (1 − s)R₀ − k E
 * with k = s R₀ ⁄ E_cal: a first-order approach to the equilibrium
 * E_eq = b ⁄ k (closed form E(t) = E_eq + (E₀ − E_eq) e^(−k t)); with s = 0
 * (constant-rate) a straight line. At or below the floor no iron is removed
 * and stores do not fall (basal loss is balanced by absorption at normal
 * stores; a modelling choice), so the projection never goes below the floor
 * (or below the start, if the start is below it). Floor stores = floor LIC ×
 * 10.6 × weight (Angelucci et al., N Engl J Med 2000;343:327), moving with
 * the weight while the patient grows.
 *
 * @param model - start, rates, floor, shape and calibration
 * @param days - days after the start, ≥ 0
 * @returns stores (mg) and weight (kg) on that day
 * @example storesAfterDays({ startStoresMg: 6360, startWeightKg: 50, weightGainKgPerDay: 0, growthDays: 0, netInflowMgPerDay: 0, removalAtStartMgPerDay: 10, floorLicMgPerGDry: 1.8, burdenShare: 1, calibrationExcessMg: 5406 }, 0).storesMg === 6360
 */
export function storesAfterDays(model: StoresModel, days: number): { readonly storesMg: number; readonly weightKg: number } {
  const floorPerKg = model.floorLicMgPerGDry * angelucciSlopeMgPerKgPerMgPerGDry;
  const rateConstant = (model.burdenShare * model.removalAtStartMgPerDay) / model.calibrationExcessMg;
  const constantPart = (1 - model.burdenShare) * model.removalAtStartMgPerDay;
  let excess = model.startStoresMg - floorPerKg * model.startWeightKg;
  let weightKg = model.startWeightKg;
  // Two segments at most: growing (the floor rises with the weight), then grown. Called for every
  // sample and month of a projection band, so it builds nothing but its result.
  const growingDays = Math.min(days, Math.max(0, model.growthDays));
  if (growingDays > 0) {
    excess = excessAfter(excess, growingDays, model.netInflowMgPerDay, floorPerKg * model.weightGainKgPerDay, constantPart, rateConstant);
    weightKg += model.weightGainKgPerDay * growingDays;
  }
  if (days > growingDays) excess = excessAfter(excess, days - growingDays, model.netInflowMgPerDay, 0, constantPart, rateConstant);
  return { storesMg: excess + floorPerKg * weightKg, weightKg };
}

/** One segment at a constant floor growth (mg/day): above the floor the linear ODE, at or below it no removal and no fall. */
function excessAfter(startExcess: number, days: number, inflow: number, floorGrowth: number, constantPart: number, rateConstant: number): number {
  let excess = startExcess;
  let left = days;
  // At most three regime changes: below → at the floor → above → back to the floor.
  for (let step = 0; step < 4 && left > 0; step += 1) {
    if (excess > 0) {
      const drive = inflow - floorGrowth - constantPart;
      // A rate constant under 1e-12 per day (removal under a microgram a day) is treated as constant-rate: drive ⁄ k would overflow.
      if (rateConstant > 1e-12) {
        const equilibrium = drive / rateConstant;
        if (equilibrium >= 0) return equilibrium + (excess - equilibrium) * Math.exp(-rateConstant * left);
        // Falls towards a negative equilibrium: reaches the floor at t*, then at-floor rules.
        const toFloor = Math.log((excess - equilibrium) / -equilibrium) / rateConstant;
        if (toFloor >= left) return equilibrium + (excess - equilibrium) * Math.exp(-rateConstant * left);
        excess = 0;
        left -= toFloor;
      } else {
        if (drive >= 0) return excess + drive * left;
        const toFloor = excess / -drive;
        if (toFloor >= left) return excess + drive * left;
        excess = 0;
        left -= toFloor;
      }
    } else {
      // At or below the floor: nothing removed; stores rise with a positive inflow, otherwise held.
      const slope = Math.max(0, inflow) - floorGrowth;
      const aboveDrive = inflow - floorGrowth - constantPart;
      if (slope <= 0 || (excess === 0 && aboveDrive <= 0)) return excess + (slope <= 0 ? slope * left : 0);
      const toFloor = -excess / slope;
      if (toFloor >= left) return excess + slope * left;
      excess = 0;
      left -= toFloor;
      if (aboveDrive <= 0) return 0;
      // Just above the floor with a positive drive: continue in the above-floor regime.
      excess = Number.MIN_VALUE;
    }
  }
  return excess;
}
