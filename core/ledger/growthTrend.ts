import { daysBetween, type IsoDate } from '../dates/isoDate';
import { daysPerYear } from '../units/time';

/**
 * Bounds of the growth rule, modelling choices of ours: the trend is read
 * from the weights of the last two years (at least two, spanning at least
 * 180 days), and bounded to 0–8 kg/year — weight loss is not projected, and
 * 8 kg/year is about the fastest weight gain of the adolescent growth spurt
 * (from memory: growth-chart velocity tables). Growth stops at age 18.
 */
export const growthRule = { windowDays: 730, minimumSpanDays: 180, maxGainKgPerYear: 8, adultAgeYears: 18 } as const;

export interface GrowthTrend {
  /** Weight gain applied to the projection, kg/year (bounded). */
  readonly gainKgPerYear: number;
  /** Days from the review date until age 18 (0 for an adult). */
  readonly growthDays: number;
  /** The rule as applied, in words. */
  readonly statement: string;
}

/**
 * The weight trend a projection follows for a patient under 18: the
 * least-squares slope of the recent weights, bounded; zero for an adult or
 * when the record has too few weights.
 *
 * @param weights - dated weights, kg, any order
 * @param asOf - review date
 * @param ageYears - age on the review date, or null when unknown (treated as adult: weight held)
 * @example growthTrendOf([{ date: '2025-11-20', weightKg: 48 }, { date: '2026-11-20', weightKg: 52 }], '2026-11-20', 15).gainKgPerYear ≈ 4.0
 */
export function growthTrendOf(weights: readonly { readonly date: IsoDate; readonly weightKg: number }[], asOf: IsoDate, ageYears: number | null): GrowthTrend {
  if (ageYears === null || ageYears >= growthRule.adultAgeYears) {
    return { gainKgPerYear: 0, growthDays: 0, statement: 'Weight is held at its latest value over the projection (adult).' };
  }
  const recent = weights.filter((it) => it.date <= asOf && daysBetween(it.date, asOf) <= growthRule.windowDays);
  const xs = recent.map((it) => -daysBetween(it.date, asOf));
  const span = xs.length > 0 ? Math.max(...xs) - Math.min(...xs) : 0;
  const growthDays = Math.round((growthRule.adultAgeYears - ageYears) * daysPerYear);
  if (recent.length < 2 || span < growthRule.minimumSpanDays) {
    return { gainKgPerYear: 0, growthDays, statement: 'Weight is held at its latest value: too few recent weights for a growth trend (at least two over 180 days in the last two years).' };
  }
  const meanX = xs.reduce((sum, x) => sum + x, 0) / xs.length;
  const meanY = recent.reduce((sum, it) => sum + it.weightKg, 0) / recent.length;
  let sxy = 0;
  let sxx = 0;
  recent.forEach((it, index) => {
    sxy += (xs[index]! - meanX) * (it.weightKg - meanY);
    sxx += (xs[index]! - meanX) ** 2;
  });
  const slopePerYear = (sxy / sxx) * daysPerYear;
  const gainKgPerYear = Math.min(growthRule.maxGainKgPerYear, Math.max(0, slopePerYear));
  const bounded = gainKgPerYear !== slopePerYear ? ` (the record's trend ${slopePerYear.toFixed(1)} kg/year, bounded to 0–${growthRule.maxGainKgPerYear})` : '';
  return {
    gainKgPerYear,
    growthDays,
    statement: `Under 18, the projection's weight follows the patient's own trend of ${gainKgPerYear.toFixed(1)} kg/year${bounded} from ${recent.length} weights of the last two years, until age 18; the intake (mg/day) and the removal per mg of chelatable iron are held.`,
  };
}
