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
  return summarise(name, times);
}

/** Median and 10th–90th percentile of some times (sorts them in place). */
function summarise(name: string, times: number[]): Timing {
  times.sort((left, right) => left - right);
  return { name, runs: times.length, medianMs: quantileOfSorted(times, 0.5), p10Ms: quantileOfSorted(times, 0.1), p90Ms: quantileOfSorted(times, 0.9) };
}

export interface PairedTiming {
  readonly baseline: Timing;
  readonly subject: Timing;
  /** subject ÷ baseline of each pair: median and 10th–90th percentile. */
  readonly ratio: { readonly runs: number; readonly median: number; readonly p10: number; readonly p90: number };
}

/**
 * Time `baseline` and `subject` interleaved (baseline, subject, baseline, subject … after
 * the warm-up of both), so drift on a shared machine falls on both alike; summarises each
 * and the ratio subject ÷ baseline of every pair. Counts and time limits as in `measure`,
 * counted in pairs and over both.
 */
export async function measurePaired(names: { readonly baseline: string; readonly subject: string }, baseline: () => unknown, subject: () => unknown, options: MeasureOptions = {}): Promise<PairedTiming> {
  const { warmupRuns = 3, minRuns = 10, minTimeMs = 1500, maxRuns = 500 } = options;
  let sink: unknown;
  for (let index = 0; index < warmupRuns; index += 1) {
    sink = await baseline();
    sink = await subject();
  }
  const baselineTimes: number[] = [];
  const subjectTimes: number[] = [];
  const ratios: number[] = [];
  const started = performance.now();
  while (ratios.length < maxRuns && (ratios.length < minRuns || performance.now() - started < minTimeMs)) {
    const first = performance.now();
    sink = await baseline();
    const second = performance.now();
    sink = await subject();
    const third = performance.now();
    baselineTimes.push(second - first);
    subjectTimes.push(third - second);
    ratios.push((third - second) / (second - first));
  }
  if (sink === Symbol.for('never')) console.log('');
  const ratio = summarise('ratio', ratios);
  return {
    baseline: summarise(names.baseline, baselineTimes),
    subject: summarise(names.subject, subjectTimes),
    ratio: { runs: ratio.runs, median: ratio.medianMs, p10: ratio.p10Ms, p90: ratio.p90Ms },
  };
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
