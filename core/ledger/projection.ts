import { addMonthsIso, daysBetween, type IsoDate } from '../dates/isoDate';
import { angelucciSlopeMgPerKgPerMgPerGDry } from '../iron/bodyIron';
import { projectedLic } from './balance';
import { quantileOfSorted } from './quantile';
import { createRandom } from './random';

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
 *   factor 0.9–1.1 around the user's estimate.
 */
export const projectionSpread = {
  intakeSd: 0.1,
  removalSigmaPublished: 0.35,
  removalSigmaMeasured: 0.2,
  adherenceLow: 0.9,
  adherenceHigh: 1.1,
} as const;

/** LIC thresholds whose crossings are reported, mg/g dry (Olivieri & Brittenham, Blood 1997;89:739; Brittenham 2011). */
export const licCrossingThresholds = [15, 7, 3] as const;

export interface ProjectionScenarioInput {
  readonly id: string;
  readonly name: string;
  /** Expected chelation removal at the published efficiency, mg/day (averaged over the week), at a weight. */
  readonly removalMgPerDay: (weightKg: number) => number;
  /** 'measured' when the removal is scaled by the patient's own measured response. */
  readonly efficiencyBasis: 'measured' | 'published';
  /** Multiplier applied to the published removal (the measured ÷ expected ratio, or 1). */
  readonly efficiencyScale: number;
}

export interface ProjectionInput {
  readonly asOf: IsoDate;
  readonly startBodyIronMg: number;
  /** Weight held constant over the horizon (the latest weight), kg. */
  readonly weightKg: number;
  /** Future transfusional intake net of blood removed, mg/day. */
  readonly intakeMgPerDay: number;
  readonly basalLossMgPerDay: number;
  readonly horizonMonths: number;
  readonly seed: number;
  /** Monte Carlo samples for the band (≥ 50). */
  readonly samples: number;
  readonly scenarios: readonly ProjectionScenarioInput[];
}

export interface ProjectedMonth {
  readonly monthsAhead: number;
  readonly date: IsoDate;
  /** Central projection (every uncertain input at its estimate), mg/g dry. */
  readonly licMgPerGDry: number;
  readonly licP10: number;
  readonly licP50: number;
  readonly licP90: number;
  readonly bodyIronMg: number;
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

export interface ScenarioProjection {
  readonly id: string;
  readonly name: string;
  readonly efficiencyBasis: 'measured' | 'published';
  readonly removalMgPerDay: number;
  readonly netMgPerDay: number;
  readonly netMgPerKgPerDay: number;
  readonly months: readonly ProjectedMonth[];
  readonly crossings: readonly Crossing[];
}

/**
 * Projects body iron and LIC month by month for each scenario, with a
 * 10th–90th percentile band from seeded sampling of the uncertain inputs.
 *
 * body iron (t) = max(0, start + t × (intake − removal − basal loss)); LIC = body iron ÷ (10.6 × weight)
 * (Angelucci et al., N Engl J Med 2000;343:327). Removal is held constant:
 * real chelators remove less as iron falls, so projections far below LIC 3
 * overstate the fall.
 *
 * @param input - start, rates, horizon (1–120 months), seed, samples
 * @returns one projection per scenario; the same seed gives the same band
 */
export function projectScenarios(input: ProjectionInput): ScenarioProjection[] {
  const monthDates = Array.from({ length: input.horizonMonths + 1 }, (_, index) => addMonthsIso(input.asOf, index));
  const monthDays = monthDates.map((date) => daysBetween(input.asOf, date));
  const storesPerLic = angelucciSlopeMgPerKgPerMgPerGDry * input.weightKg;
  const startLic = input.startBodyIronMg / storesPerLic;
  return input.scenarios.map((scenario, scenarioIndex) => {
    const removalMgPerDay = scenario.removalMgPerDay(input.weightKg) * scenario.efficiencyScale;
    const netMgPerDay = input.intakeMgPerDay - removalMgPerDay - input.basalLossMgPerDay;
    const licAt = (days: number, intakeFactor: number, removalFactor: number): number =>
      projectedLic(input.startBodyIronMg, input.weightKg, days, input.intakeMgPerDay * intakeFactor, removalMgPerDay * removalFactor, input.basalLossMgPerDay);
    // One stream per scenario, derived from the seed, so adding a scenario does not shift another's band.
    const random = createRandom(input.seed * 1009 + scenarioIndex);
    const sigma = scenario.efficiencyBasis === 'measured' ? projectionSpread.removalSigmaMeasured : projectionSpread.removalSigmaPublished;
    const sampleLics: number[][] = monthDays.map(() => []);
    for (let sample = 0; sample < input.samples; sample += 1) {
      const intakeFactor = Math.max(0, 1 + projectionSpread.intakeSd * random.normal());
      const adherenceFactor =
        projectionSpread.adherenceLow + (projectionSpread.adherenceHigh - projectionSpread.adherenceLow) * random.uniform();
      // Log-normal with median 1: exp(σ z).
      const removalFactor = Math.exp(sigma * random.normal()) * adherenceFactor;
      monthDays.forEach((days, index) => sampleLics[index]!.push(licAt(days, intakeFactor, removalFactor)));
    }
    const months: ProjectedMonth[] = monthDays.map((days, index) => {
      const sorted = sampleLics[index]!.sort((a, b) => a - b);
      const central = licAt(days, 1, 1);
      return {
        monthsAhead: index,
        date: monthDates[index]!,
        licMgPerGDry: central,
        licP10: quantileOfSorted(sorted, 0.1),
        licP50: quantileOfSorted(sorted, 0.5),
        licP90: quantileOfSorted(sorted, 0.9),
        bodyIronMg: central * storesPerLic,
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
    };
  });
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
