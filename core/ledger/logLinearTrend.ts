import { daysBetween } from '../dates/isoDate';
import { daysPerYear } from '../units/time';

export interface DatedValue {
  /** ISO date 'YYYY-MM-DD'. */
  readonly date: string;
  readonly value: number;
}

export interface LogLinearTrend {
  /** Slope of ln(value) per day. */
  readonly slopePerDay: number;
  /** Relative change per year, e.g. 0.25 for +25 %/year. */
  readonly changePerYear: number;
  /** Days for the value to double (rising) or halve (falling); null when flat. */
  readonly doublingDays: number | null;
  readonly halvingDays: number | null;
  readonly direction: 'rising' | 'falling' | 'flat';
  readonly points: number;
  readonly firstDate: string;
  readonly lastDate: string;
}

/**
 * Log-linear trend of a positive series (ferritin): least-squares line of
 * ln(value) on days since the first point. Doubling or halving time = ln 2 / |slope|.
 * A change under 5 %/year is called flat (common practice: below the
 * analytical and biological variation of ferritin).
 *
 * @param points - at least two dated positive values, on at least two distinct dates
 * @returns the trend, or null when there are too few points
 * @example logLinearTrend([{date:'2026-01-01',value:1000},{date:'2027-01-01',value:2000}]).doublingDays === 365
 */
export function logLinearTrend(points: readonly DatedValue[]): LogLinearTrend | null {
  const usable = points.filter((it) => it.value > 0).slice().sort((a, b) => a.date.localeCompare(b.date));
  if (usable.length < 2) return null;
  const first = usable[0]!;
  const last = usable[usable.length - 1]!;
  const xs = usable.map((it) => daysBetween(first.date, it.date));
  const ys = usable.map((it) => Math.log(it.value));
  const meanX = xs.reduce((sum, x) => sum + x, 0) / xs.length;
  const meanY = ys.reduce((sum, y) => sum + y, 0) / ys.length;
  let sxx = 0;
  let sxy = 0;
  for (let index = 0; index < xs.length; index += 1) {
    sxx += (xs[index]! - meanX) ** 2;
    sxy += (xs[index]! - meanX) * (ys[index]! - meanY);
  }
  if (sxx === 0) return null;
  const slopePerDay = sxy / sxx;
  const changePerYear = Math.exp(slopePerDay * daysPerYear) - 1;
  const flat = Math.abs(changePerYear) < 0.05;
  const characteristicDays = slopePerDay === 0 ? null : Math.log(2) / Math.abs(slopePerDay);
  return {
    slopePerDay,
    changePerYear,
    doublingDays: !flat && slopePerDay > 0 ? characteristicDays : null,
    halvingDays: !flat && slopePerDay < 0 ? characteristicDays : null,
    direction: flat ? 'flat' : slopePerDay > 0 ? 'rising' : 'falling',
    points: usable.length,
    firstDate: first.date,
    lastDate: last.date,
  };
}
