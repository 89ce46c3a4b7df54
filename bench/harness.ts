/**
 * A small benchmark harness: warm-up, then repeated runs until both a minimum
 * count and a minimum time are reached; reports the median and the spread
 * (10th–90th percentile). Ratios between figures measured in the same run hold
 * on a noisy shared machine where absolute times do not.
 */
import { performance } from 'node:perf_hooks';

export interface Timing {
  readonly name: string;
  readonly runs: number;
  readonly medianMs: number;
  readonly p10Ms: number;
  readonly p90Ms: number;
}

export interface MeasureOptions {
  /** Untimed calls before measuring (JIT warm-up). */
  readonly warmupRuns?: number;
  /** At least this many timed calls. */
  readonly minRuns?: number;
  /** Keep measuring until this much time has been spent, ms. */
  readonly minTimeMs?: number;
  /** Never more than this many timed calls. */
  readonly maxRuns?: number;
}

const quantileOfSorted = (sorted: readonly number[], q: number): number => {
  if (sorted.length === 0) return Number.NaN;
  const position = (sorted.length - 1) * q;
  const lower = Math.floor(position);
  const upper = Math.ceil(position);
  return sorted[lower]! + (sorted[upper]! - sorted[lower]!) * (position - lower);
};

/** Time `run` and summarise; `run` may return a value, which is kept alive so the work is not optimised away. */
export async function measure(name: string, run: () => unknown, options: MeasureOptions = {}): Promise<Timing> {
  const { warmupRuns = 3, minRuns = 10, minTimeMs = 1500, maxRuns = 500 } = options;
  let sink: unknown;
  for (let index = 0; index < warmupRuns; index += 1) sink = await run();
  const times: number[] = [];
  const started = performance.now();
  while (times.length < maxRuns && (times.length < minRuns || performance.now() - started < minTimeMs)) {
    const before = performance.now();
    sink = await run();
    times.push(performance.now() - before);
  }
  if (sink === Symbol.for('never')) console.log('');
  times.sort((left, right) => left - right);
  return { name, runs: times.length, medianMs: quantileOfSorted(times, 0.5), p10Ms: quantileOfSorted(times, 0.1), p90Ms: quantileOfSorted(times, 0.9) };
}

/** Least-squares slope of log(cost) against log(size): 1 is linear, 2 quadratic. */
export function scalingExponent(points: readonly { readonly size: number; readonly ms: number }[]): number {
  const xs = points.map((point) => Math.log(point.size));
  const ys = points.map((point) => Math.log(point.ms));
  const meanX = xs.reduce((sum, x) => sum + x, 0) / xs.length;
  const meanY = ys.reduce((sum, y) => sum + y, 0) / ys.length;
  let numerator = 0;
  let denominator = 0;
  xs.forEach((x, index) => {
    numerator += (x - meanX) * (ys[index]! - meanY);
    denominator += (x - meanX) ** 2;
  });
  return numerator / denominator;
}
