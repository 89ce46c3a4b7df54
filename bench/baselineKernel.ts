/**
 * The baseline of the recompute benchmark: a bare kernel doing the ledger's
 * arithmetic over typed arrays with no validation, no objects and no dates —
 * the daily iron account (transfusional iron in, chelation removal and basal
 * loss out), rolled into 30-day months, then a projection of each scenario
 * over the horizon with a sampled band (10th, 50th and 90th percentile each
 * month). It is what the same work costs with nothing around it, so the
 * full recompute can be reported as a ratio measured in the same run.
 * Constants are the ledger's defaults as of this writing (1.08 mg iron per mL
 * of red cells, 10.6 mg/kg per mg/g dry, 1 mg/day basal loss); the kernel's
 * numbers are not used anywhere, only its cost.
 */

export interface KernelInput {
  readonly recordDays: number;
  readonly transfusionDay: Int32Array;
  readonly transfusionRedCellMl: Float64Array;
  readonly periodStartDay: Int32Array;
  readonly periodEndDay: Int32Array;
  readonly periodRemovalMgPerDay: Float64Array;
  readonly weightKg: number;
  readonly startLicMgPerGDry: number;
  /** Expected removal of each projected scenario, mg/day. */
  readonly scenarioRemovalMgPerDay: Float64Array;
  readonly horizonMonths: number;
  readonly samples: number;
}

const ironPerMlRedCellsMg = 1.08;
const angelucciMgPerKgPerMgPerGDry = 10.6;
const basalLossMgPerDay = 1;
const daysPerMonth = 30.4375;

/** Run the kernel; returns a checksum so the work cannot be optimised away. */
export function baselineKernel(input: KernelInput): number {
  const days = input.recordDays;
  const dailyIn = new Float64Array(days);
  const dailyOut = new Float64Array(days);
  for (let index = 0; index < input.transfusionDay.length; index += 1) dailyIn[input.transfusionDay[index]!]! += input.transfusionRedCellMl[index]! * ironPerMlRedCellsMg;
  for (let period = 0; period < input.periodStartDay.length; period += 1) {
    const end = Math.min(days - 1, input.periodEndDay[period]!);
    for (let day = input.periodStartDay[period]!; day <= end; day += 1) dailyOut[day]! += input.periodRemovalMgPerDay[period]!;
  }
  const monthCount = Math.ceil(days / daysPerMonth);
  const monthIn = new Float64Array(monthCount);
  const monthOut = new Float64Array(monthCount);
  let trailingInMg = 0;
  for (let day = 0; day < days; day += 1) {
    const month = Math.floor(day / daysPerMonth);
    monthIn[month]! += dailyIn[day]!;
    monthOut[month]! += dailyOut[day]! + basalLossMgPerDay;
    if (day >= days - 365) trailingInMg += dailyIn[day]!;
  }
  const intakeMgPerDay = trailingInMg / 365;

  // Seeded linear congruential draws (no objects), normal by the sum of three uniforms.
  let state = 12345;
  const uniform = () => {
    state = (Math.imul(state, 1664525) + 1013904223) >>> 0;
    return state / 4294967296;
  };
  const normal = () => (uniform() + uniform() + uniform() - 1.5) * 2;
  let checksum = 0;
  const lic = new Float64Array(input.samples);
  const netPerDay = new Float64Array(input.samples);
  const sorted = new Float64Array(input.samples);
  const startBodyMg = input.startLicMgPerGDry * angelucciMgPerKgPerMgPerGDry * input.weightKg;
  for (let scenario = 0; scenario < input.scenarioRemovalMgPerDay.length; scenario += 1) {
    for (let sample = 0; sample < input.samples; sample += 1) {
      const intake = intakeMgPerDay * (1 + 0.08 * normal());
      const removal = input.scenarioRemovalMgPerDay[scenario]! * (1 + 0.3 * normal());
      netPerDay[sample] = intake - removal - basalLossMgPerDay;
      lic[sample] = startBodyMg;
    }
    for (let month = 1; month <= input.horizonMonths; month += 1) {
      for (let sample = 0; sample < input.samples; sample += 1) {
        const body = Math.max(0, lic[sample]! + netPerDay[sample]! * daysPerMonth);
        lic[sample] = body;
        sorted[sample] = body / (angelucciMgPerKgPerMgPerGDry * input.weightKg);
      }
      sorted.sort();
      checksum += sorted[Math.floor(0.1 * (input.samples - 1))]! + sorted[Math.floor(0.5 * (input.samples - 1))]! + sorted[Math.floor(0.9 * (input.samples - 1))]!;
    }
  }
  for (let month = 0; month < monthCount; month += 1) checksum += monthIn[month]! - monthOut[month]!;
  return checksum;
}
