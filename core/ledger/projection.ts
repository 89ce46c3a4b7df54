import { addMonthsIso, daysBetween, type IsoDate } from '../dates/isoDate';
import { angelucciSlopeMgPerKgPerMgPerGDry } from '../iron/bodyIron';
import { daysPerYear } from '../units/time';
import { quantilesOfUnsorted } from './quantile';
import { createRandom } from './random';
import { calibrationExcessMg, storesAfterDays, type ProjectionModel, type StoresModel } from './removalModel';

/**
 * Spread of the uncertain inputs in the projection band. These are this
 * project's modelling choices, not published values, and are shown with
 * every band:
 * - intake: normal, sd 10 % — unit haematocrit (about 0.55–0.65 around 0.60,
 *   sd ≈ 4 %) together with month-to-month variation in the future
 *   transfusion rate (sd ≈ 9 %);
 * - chelation removal: log-normal, σ 0.35 on the published efficiency
 *   (references.md: efficiencies vary with iron burden and dose), σ 0.20 when
 *   the patient's own measured response is used; times a uniform adherence
 *   factor 0.9–1.1 around the user's estimate;
 * - the anchoring LIC: log-normal with the measurement spread of its method
 *   (assumptions lic-measurement-sd-biopsy and lic-measurement-sd-mri), on the
 *   stores it anchors.
 */
export const projectionSpread = {
  intakeSd: 0.1,
  removalSigmaPublished: 0.35,
  removalSigmaMeasured: 0.2,
  adherenceLow: 0.9,
  adherenceHigh: 1.1,
} as const;

/** The band's edges and middle: 10th, 50th and 90th percentiles. */
const bandProbabilities = [0.1, 0.5, 0.9] as const;

/** LIC thresholds whose crossings are reported, mg/g dry (Olivieri & Brittenham, Blood 1997;89:739; Brittenham 2011). */
export const licCrossingThresholds = [15, 7, 3] as const;

/**
 * LIC below which a deferasirox label advises interruption in
 * non-transfusion-dependent thalassaemia, mg/g dry (references.md §9:
 * "LIC < 3 mg/g dry interrupt"; drug reference reproducing the US label;
 * secondary). The projection names the month it enters this range.
 */
export const labelLowLicMgPerGDry = 3;

export interface ProjectionScenarioInput {
  readonly id: string;
  readonly name: string;
  /** Expected chelation removal at the chosen basis, mg/day (averaged over the week), at a weight. */
  readonly removalMgPerDay: (weightKg: number) => number;
  /** 'measured' when the removal is scaled by the patient's own measured response. */
  readonly efficiencyBasis: 'measured' | 'published';
  /** Multiplier applied to the removal (1 unless a caller scales it). */
  readonly efficiencyScale: number;
}

export interface ProjectionInput {
  readonly asOf: IsoDate;
  readonly startBodyIronMg: number;
  /** Weight on the review date, kg. */
  readonly weightKg: number;
  /** Weight gain while growing, kg/year (0 for an adult, the default). */
  readonly weightGainKgPerYear?: number;
  /** Days over which the weight gain applies (until age 18; default 0). */
  readonly growthDays?: number;
  /** Future transfusional intake net of blood removed, mg/day. */
  readonly intakeMgPerDay: number;
  readonly basalLossMgPerDay: number;
  readonly horizonMonths: number;
  readonly seed: number;
  /** Monte Carlo samples for the band (≥ 50). */
  readonly samples: number;
  readonly scenarios: readonly ProjectionScenarioInput[];
  /** Removal model (default 'burden-dependent'). */
  readonly model?: ProjectionModel;
  /** Floor, mg/g dry (default 1.8). */
  readonly floorLicMgPerGDry?: number;
  /** Share of removal proportional to the excess under the burden-dependent model (default 1). */
  readonly burdenShare?: number;
  /** Stores set by the anchoring LIC, mg, and its relative measurement spread (default none). */
  readonly anchorStoresMg?: number;
  readonly anchorRelativeSd?: number;
}

export interface ProjectedMonth {
  readonly monthsAhead: number;
  readonly date: IsoDate;
  /** Central projection (every uncertain input at its estimate), mg/g dry. */
  readonly licMgPerGDry: number;
  /** 10th and 90th percentiles of the band, widened where needed so that they contain the central line. */
  readonly licP10: number;
  readonly licP50: number;
  readonly licP90: number;
  readonly bodyIronMg: number;
  /** Weight the month's LIC is read at, kg (follows the growth trend under 18). Added with the burden-dependent model. */
  readonly weightKg: number;
}

export interface Crossing {
  readonly thresholdMgPerGDry: number;
  readonly direction: 'falls below' | 'rises above';
  /** First month of the central projection past the threshold, or null within the horizon. */
  readonly monthsAhead: number | null;
  readonly date: IsoDate | null;
  /** Earliest and latest month across the 10th–90th percentile band, or null. */
  readonly bandEarliestMonths: number | null;
  readonly bandLatestMonths: number | null;
}

/** Where the projection enters a range in which a label advises considering interruption. */
export interface LabelZone {
  readonly thresholdMgPerGDry: number;
  /** First month the central projection is below the threshold, or null within the horizon. */
  readonly centralMonth: number | null;
  /** First month the band's low edge is below it, or null. */
  readonly bandMonth: number | null;
  /** The finding in words (descriptive). */
  readonly text: string;
}

export interface ScenarioProjection {
  readonly id: string;
  readonly name: string;
  readonly efficiencyBasis: 'measured' | 'published';
  /** Removal on the review date at the chosen basis, mg/day (the model's calibration point). */
  readonly removalMgPerDay: number;
  /** Net balance on the review date: intake − removal − basal loss. */
  readonly netMgPerDay: number;
  readonly netMgPerKgPerDay: number;
  readonly months: readonly ProjectedMonth[];
  readonly crossings: readonly Crossing[];
  /** Added with the burden-dependent model: the model, its floor and calibration, and the label zones. */
  readonly model: ProjectionModel;
  readonly floorLicMgPerGDry: number;
  readonly calibration: {
    /** Share of removal proportional to the excess (0 under constant-rate). */
    readonly burdenShare: number;
    /** Excess above the floor the rate is calibrated on, mg. */
    readonly calibrationExcessMg: number;
    /** Removal per mg of excess, per day (0 under constant-rate). */
    readonly rateConstantPerDay: number;
  };
  readonly labelZones: readonly LabelZone[];
}

/**
 * Projects body iron and LIC month by month for each scenario, with a
 * 10th–90th percentile band from seeded sampling of the uncertain inputs
 * (intake, removal, adherence and the anchoring LIC's measurement).
 *
 * The default model removes iron in proportion to the chelatable excess
 * (stores above the floor, LIC 1.8 mg/g dry), calibrated so that on the
 * review date it equals the expected (or measured) removal; the projected
 * LIC approaches an equilibrium instead of crossing zero. The constant-rate
 * model holds today's removal until the floor. See removalModel.ts;
 * LIC = stores ÷ (10.6 × weight) (Angelucci et al., N Engl J Med 2000;343:327).
 *
 * @param input - start, rates, horizon (1–120 months), seed, samples, model
 * @returns one projection per scenario; the same seed gives the same band
 */
export function projectScenarios(input: ProjectionInput): ScenarioProjection[] {
  const model = input.model ?? 'burden-dependent';
  const floorLic = input.floorLicMgPerGDry ?? 1.8;
  const burdenShare = model === 'constant-rate' ? 0 : (input.burdenShare ?? 1);
  const gainPerDay = (input.weightGainKgPerYear ?? 0) / daysPerYear;
  const growthDays = input.growthDays ?? 0;
  const anchorStoresMg = input.anchorStoresMg ?? 0;
  const anchorSd = input.anchorRelativeSd ?? 0;
  const monthDates = Array.from({ length: input.horizonMonths + 1 }, (_, index) => addMonthsIso(input.asOf, index));
  const monthDays = monthDates.map((date) => daysBetween(input.asOf, date));
  const startLic = input.startBodyIronMg / (angelucciSlopeMgPerKgPerMgPerGDry * input.weightKg);
  const calibration = calibrationExcessMg(input.startBodyIronMg, input.weightKg, floorLic);
  // One typed array per month, filled again for each scenario; its band is read without a full sort (quantile.ts).
  const sampleLics = monthDays.map(() => new Float64Array(input.samples));
  return input.scenarios.map((scenario, scenarioIndex) => {
    const removalMgPerDay = scenario.removalMgPerDay(input.weightKg) * scenario.efficiencyScale;
    const netMgPerDay = input.intakeMgPerDay - removalMgPerDay - input.basalLossMgPerDay;
    const modelOf = (startStoresMg: number, intakeFactor: number, removalFactor: number): StoresModel => ({
      startStoresMg,
      startWeightKg: input.weightKg,
      weightGainKgPerDay: gainPerDay,
      growthDays,
      netInflowMgPerDay: input.intakeMgPerDay * intakeFactor - input.basalLossMgPerDay,
      removalAtStartMgPerDay: removalMgPerDay * removalFactor,
      floorLicMgPerGDry: floorLic,
      burdenShare,
      calibrationExcessMg: calibration,
    });
    const licOf = (stores: { storesMg: number; weightKg: number }) => stores.storesMg / (angelucciSlopeMgPerKgPerMgPerGDry * stores.weightKg);
    // One stream per scenario, derived from the seed, so adding a scenario does not shift another's band.
    const random = createRandom(input.seed * 1009 + scenarioIndex);
    const sigma = scenario.efficiencyBasis === 'measured' ? projectionSpread.removalSigmaMeasured : projectionSpread.removalSigmaPublished;
    for (let sample = 0; sample < input.samples; sample += 1) {
      const intakeFactor = Math.max(0, 1 + projectionSpread.intakeSd * random.normal());
      const adherenceFactor =
        projectionSpread.adherenceLow + (projectionSpread.adherenceHigh - projectionSpread.adherenceLow) * random.uniform();
      // Log-normal with median 1: exp(σ z).
      const removalFactor = Math.exp(sigma * random.normal()) * adherenceFactor;
      const anchorShiftMg = anchorSd > 0 ? anchorStoresMg * (Math.exp(anchorSd * random.normal()) - 1) : 0;
      const sampled = modelOf(Math.max(0, input.startBodyIronMg + anchorShiftMg), intakeFactor, removalFactor);
      for (let index = 0; index < monthDays.length; index += 1) sampleLics[index]![sample] = licOf(storesAfterDays(sampled, monthDays[index]!));
    }
    const centralModel = modelOf(input.startBodyIronMg, 1, 1);
    const months: ProjectedMonth[] = monthDays.map((days, index) => {
      const [p10, p50, p90] = quantilesOfUnsorted(sampleLics[index]!, bandProbabilities);
      const stores = storesAfterDays(centralModel, days);
      const central = licOf(stores);
      return {
        monthsAhead: index,
        date: monthDates[index]!,
        licMgPerGDry: central,
        licP10: Math.min(central, p10!),
        licP50: p50!,
        licP90: Math.max(central, p90!),
        bodyIronMg: stores.storesMg,
        weightKg: stores.weightKg,
      };
    });
    return {
      id: scenario.id,
      name: scenario.name,
      efficiencyBasis: scenario.efficiencyBasis,
      removalMgPerDay,
      netMgPerDay,
      netMgPerKgPerDay: netMgPerDay / input.weightKg,
      months,
      crossings: licCrossingThresholds.map((threshold) => crossingOf(months, startLic, threshold)),
      model,
      floorLicMgPerGDry: floorLic,
      calibration: { burdenShare, calibrationExcessMg: calibration, rateConstantPerDay: (burdenShare * removalMgPerDay) / calibration },
      labelZones: startLic > labelLowLicMgPerGDry ? [labelZoneOf(months, labelLowLicMgPerGDry)] : [],
    };
  });
}

function labelZoneOf(months: readonly ProjectedMonth[], threshold: number): LabelZone {
  const central = months.find((month) => month.monthsAhead > 0 && month.licMgPerGDry < threshold)?.monthsAhead ?? null;
  const band = months.find((month) => month.monthsAhead > 0 && month.licP10 < threshold)?.monthsAhead ?? null;
  const range = `the range below LIC ${threshold} mg/g dry where a deferasirox label advises considering interruption (non-transfusion-dependent thalassaemia)`;
  const text =
    central !== null
      ? `From about month ${central} the projection enters ${range}${band !== null && band < central ? ` (the band's low edge from about month ${band})` : ''}; the projection past it assumes the regimen continues.`
      : band !== null
        ? `From about month ${band} the band's low edge enters ${range}; the central projection stays above it; the projection past it assumes the regimen continues.`
        : `Within the horizon neither the projection nor its band enters ${range}.`;
  return { thresholdMgPerGDry: threshold, centralMonth: central, bandMonth: band, text };
}

function crossingOf(months: readonly ProjectedMonth[], startLic: number, threshold: number): Crossing {
  const falling = startLic > threshold;
  const past = (lic: number) => (falling ? lic <= threshold : lic >= threshold);
  const first = (pick: (month: ProjectedMonth) => number) => months.find((month) => month.monthsAhead > 0 && past(pick(month)));
  const central = first((month) => month.licMgPerGDry);
  // Falling: the low edge (p10) crosses first and the high edge (p90) last; rising, the reverse.
  const earliest = first((month) => (falling ? month.licP10 : month.licP90));
  const latest = first((month) => (falling ? month.licP90 : month.licP10));
  return {
    thresholdMgPerGDry: threshold,
    direction: falling ? 'falls below' : 'rises above',
    monthsAhead: central?.monthsAhead ?? null,
    date: central?.date ?? null,
    bandEarliestMonths: earliest?.monthsAhead ?? null,
    bandLatestMonths: latest?.monthsAhead ?? null,
  };
}
