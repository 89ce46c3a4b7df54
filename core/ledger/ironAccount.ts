import { daysBetween, daysLeftInMonth, epochDayFromIso, isoFromEpochDay, monthKey, type IsoDate } from '../dates/isoDate';
import { angelucciSlopeMgPerKgPerMgPerGDry } from '../iron/bodyIron';
import type { ChelationSpan, LedgerInput } from './ledgerInput';
import { weightKgAt } from './weightAt';

/** One calendar month of the iron account. The last month ends at the review date. */
export interface MonthOfAccount {
  /** 'YYYY-MM'. */
  readonly month: string;
  readonly firstDay: IsoDate;
  readonly lastDay: IsoDate;
  readonly days: number;
  /** Iron in with transfused red cells, mg. */
  readonly transfusedInMg: number;
  /** Iron out with removed blood (exchange, venesection), mg. */
  readonly removedWithBloodMg: number;
  /** Expected iron out through chelation, mg (regimen × efficiency × adherence). */
  readonly chelationOutMg: number;
  /** Basal loss, mg. */
  readonly basalLossMg: number;
  /** In − out, mg. */
  readonly netMg: number;
  /** Weight on the month's last day, kg. */
  readonly weightKg: number;
  /**
   * Estimated body iron stores at the end of the month, mg: anchored to the
   * latest measured LIC (Angelucci relation) and carried forward by the net
   * balance; between two measured LICs the gap between the carried balance
   * and the next measurement is spread evenly over the days between them, so
   * the estimate meets every measurement; after the last, carried forward
   * only. Null before the first LIC on record. Not clamped at zero: a
   * negative estimate after the last measurement means the expected removal
   * exceeds what the record supports, and the caller says so.
   */
  readonly bodyIronMg: number | null;
  /** Estimated LIC at the end of the month, mg/g dry; null before the first LIC. */
  readonly licEstimateMgPerGDry: number | null;
  /** Measured LICs inside the month (the estimate is re-anchored to each). */
  readonly measuredLic: readonly { readonly date: IsoDate; readonly licMgPerGDry: number }[];
}

export interface IronAccount {
  readonly firstDay: IsoDate;
  readonly lastDay: IsoDate;
  readonly months: readonly MonthOfAccount[];
  /** Body iron stores estimated on the review date, mg, or null with no LIC on record. */
  readonly bodyIronAtAsOfMg: number | null;
  readonly licAtAsOfMgPerGDry: number | null;
  /** Per-day series for callers that need sums over arbitrary windows (same length as the day count). */
  readonly daily: DailySeries;
}

/** Day-by-day flows from `firstDay` (index 0) to the review date. */
export interface DailySeries {
  readonly firstDay: IsoDate;
  readonly transfusedInMg: Float64Array;
  readonly removedWithBloodMg: Float64Array;
  readonly chelationOutMg: Float64Array;
  readonly basalLossMg: Float64Array;
  readonly weightKg: Float64Array;
}

/**
 * The month-by-month iron account from the first record to the review date.
 *
 * Each day: in = transfused iron; out = iron in removed blood + expected
 * chelation removal (each active regimen, averaged over its days per week) +
 * basal loss. Body iron stores are anchored at each measured LIC by the
 * Angelucci relation (stores mg = 10.6 × LIC × weight; Angelucci et al.,
 * N Engl J Med 2000;343:327) and carried forward by the net balance; the LIC
 * estimate is stores ÷ (10.6 × weight).
 *
 * @param input - normalised flows (see ledgerInput.ts); at least one weight
 * @returns months oldest first; sums of the months equal the sums of the records
 * @example a record with one 280 mL unit at 0.60 and no chelation has transfusedInMg 181.44 in its month
 */
export function computeIronAccount(input: LedgerInput): IronAccount {
  const firstDay = earliestDate(input);
  const dayCount = daysBetween(firstDay, input.asOf) + 1;
  const daily: DailySeries = {
    firstDay,
    transfusedInMg: new Float64Array(dayCount),
    removedWithBloodMg: new Float64Array(dayCount),
    chelationOutMg: new Float64Array(dayCount),
    basalLossMg: new Float64Array(dayCount),
    weightKg: new Float64Array(dayCount),
  };
  for (const movement of input.movements) {
    const index = daysBetween(firstDay, movement.date);
    if (index < 0 || index >= dayCount) continue;
    daily.transfusedInMg[index]! += movement.ironInMg;
    daily.removedWithBloodMg[index]! += movement.ironOutMg;
  }
  // Weights change rarely: walk them in day order instead of searching per day.
  // The loops below run over integer day numbers; ISO strings are made once per month,
  // not once per day (a 20-year record has about 7,300 days).
  const firstEpochDay = epochDayFromIso(firstDay);
  // The weight is constant between changes: each segment of days [from, to) is filled at once. Kept in
  // typed arrays, not objects: a weight may be whole or not, and objects holding both kinds of number
  // make V8 throw away and redo its optimized code for this function.
  const weightsByDate = [...input.weights].sort((a, b) => a.date.localeCompare(b.date));
  const segmentFrom = new Int32Array(weightsByDate.length + 1);
  const segmentTo = new Int32Array(weightsByDate.length + 1);
  const segmentWeightKg = new Float64Array(weightsByDate.length + 1);
  let segmentCount = 0;
  let segmentStart = 0;
  let currentWeight = weightKgAt(input.weights, firstDay);
  const closeSegment = (to: number) => {
    segmentFrom[segmentCount] = segmentStart;
    segmentTo[segmentCount] = to;
    segmentWeightKg[segmentCount] = currentWeight;
    segmentCount += 1;
  };
  for (const entry of weightsByDate) {
    const dayIndex = epochDayFromIso(entry.date) - firstEpochDay;
    if (dayIndex >= dayCount) break;
    if (dayIndex > segmentStart) {
      closeSegment(dayIndex);
      segmentStart = dayIndex;
    }
    currentWeight = entry.weightKg;
  }
  closeSegment(dayCount);
  for (let segment = 0; segment < segmentCount; segment += 1) daily.weightKg.fill(segmentWeightKg[segment]!, segmentFrom[segment]!, segmentTo[segment]!);
  daily.basalLossMg.fill(input.basalLossMgPerDay);
  for (const span of input.chelation) {
    const from = Math.max(0, daysBetween(firstDay, span.start));
    const to = Math.min(dayCount - 1, span.end === null ? dayCount - 1 : daysBetween(firstDay, span.end));
    const removalAt = removalByWeight(span);
    for (let segment = 0; segment < segmentCount; segment += 1) {
      const last = Math.min(to, segmentTo[segment]! - 1);
      if (segmentFrom[segment]! > last || segmentTo[segment]! <= from) continue;
      const removalMgPerDay = removalAt(segmentWeightKg[segment]!);
      for (let index = Math.max(from, segmentFrom[segment]!); index <= last; index += 1) daily.chelationOutMg[index]! += removalMgPerDay;
    }
  }

  // The days with a measured LIC, in day order, each with its measurements in record order.
  const anchorsByDay = new Map<number, number[]>();
  for (const measurement of input.licMeasurements) {
    const index = daysBetween(firstDay, measurement.date);
    if (index < 0 || index >= dayCount) continue;
    anchorsByDay.set(index, [...(anchorsByDay.get(index) ?? []), measurement.licMgPerGDry]);
  }
  const anchorDays = [...anchorsByDay.keys()].sort((a, b) => a - b);
  let nextAnchor = 0;

  const months: MonthOfAccount[] = [];
  const monthLastIndex: number[] = [];
  /** Each measurement day with the stores it sets and the balance carried to it from the one before. */
  const meetings: { readonly index: number; readonly anchoredMg: number; readonly carriedMg: number | null }[] = [];
  // The running estimate as a plain number with a flag, not number | null: a variable that may hold null
  // keeps its number boxed, one allocation per day of the record.
  let anchored = false;
  let runningMg = 0;
  for (let monthFirstIndex = 0; monthFirstIndex < dayCount; ) {
    const monthFirstDay = isoFromEpochDay(firstEpochDay + monthFirstIndex);
    const nextMonthIndex = Math.min(dayCount, monthFirstIndex + daysLeftInMonth(monthFirstDay));
    let transfusedInMg = 0;
    let removedWithBloodMg = 0;
    let chelationOutMg = 0;
    let basalLossMg = 0;
    const measuredLic: { date: IsoDate; licMgPerGDry: number }[] = [];
    for (let index = monthFirstIndex; index < nextMonthIndex; index += 1) {
      const inMg = daily.transfusedInMg[index]!;
      const bloodOutMg = daily.removedWithBloodMg[index]!;
      const chelationMg = daily.chelationOutMg[index]!;
      const basalMg = daily.basalLossMg[index]!;
      transfusedInMg += inMg;
      removedWithBloodMg += bloodOutMg;
      chelationOutMg += chelationMg;
      basalLossMg += basalMg;
      if (anchored) runningMg += inMg - bloodOutMg - chelationMg - basalMg;
      if (nextAnchor < anchorDays.length && anchorDays[nextAnchor] === index) {
        nextAnchor += 1;
        const measured = anchorsByDay.get(index)!;
        const meanLic = measured.reduce((sum, value) => sum + value, 0) / measured.length;
        // The measurement describes the end of its day: it replaces the running estimate.
        const carriedMg: number | null = anchored ? runningMg : null;
        runningMg = angelucciSlopeMgPerKgPerMgPerGDry * meanLic * daily.weightKg[index]!;
        anchored = true;
        meetings.push({ index, anchoredMg: runningMg, carriedMg });
        const date = isoFromEpochDay(firstEpochDay + index);
        for (const value of measured) measuredLic.push({ date, licMgPerGDry: value });
      }
    }
    const lastIndex = nextMonthIndex - 1;
    monthLastIndex.push(lastIndex);
    const weightKg = daily.weightKg[lastIndex]!;
    const bodyIronMg = anchored ? runningMg : null;
    months.push({
      month: monthKey(monthFirstDay),
      firstDay: monthFirstDay,
      days: nextMonthIndex - monthFirstIndex,
      transfusedInMg,
      removedWithBloodMg,
      chelationOutMg,
      basalLossMg,
      measuredLic,
      lastDay: isoFromEpochDay(firstEpochDay + lastIndex),
      netMg: transfusedInMg - removedWithBloodMg - chelationOutMg - basalLossMg,
      weightKg,
      bodyIronMg,
      licEstimateMgPerGDry: bodyIronMg === null ? null : bodyIronMg / (angelucciSlopeMgPerKgPerMgPerGDry * weightKg),
    });
    monthFirstIndex = nextMonthIndex;
  }
  const weightAtAsOf = daily.weightKg[dayCount - 1]!;
  const bodyIronMg = anchored ? runningMg : null;
  return {
    firstDay,
    lastDay: input.asOf,
    months: meetEachMeasurement(months, monthLastIndex, meetings),
    bodyIronAtAsOfMg: bodyIronMg,
    licAtAsOfMgPerGDry: bodyIronMg === null ? null : bodyIronMg / (angelucciSlopeMgPerKgPerMgPerGDry * weightAtAsOf),
    daily,
  };
}

/**
 * A span's expected removal at a weight, worked out again only when the weight changes:
 * the weight changes a few times in a record of thousands of days, and the removal goes
 * through the chelator catalogue each time it is worked out.
 */
export function removalByWeight(span: Pick<ChelationSpan, 'expectedRemovalMgPerDay'>): (weightKg: number) => number {
  let lastWeightKg = Number.NaN;
  let lastRemovalMgPerDay = 0;
  return (weightKg) => {
    if (weightKg !== lastWeightKg) {
      lastRemovalMgPerDay = span.expectedRemovalMgPerDay(weightKg);
      lastWeightKg = weightKg;
    }
    return lastRemovalMgPerDay;
  };
}

function earliestDate(input: LedgerInput): IsoDate {
  const candidates = [
    ...input.movements.map((it) => it.date),
    ...input.chelation.map((it) => it.start),
    ...input.licMeasurements.map((it) => it.date),
  ].filter((date) => date <= input.asOf);
  if (candidates.length === 0) return input.asOf;
  return candidates.reduce((earliest, date) => (date < earliest ? date : earliest));
}

/** Sum of a daily series over [fromIndex, toIndex], clamped to the series. */
export function sumDaily(series: Float64Array, fromIndex: number, toIndex: number): number {
  let total = 0;
  for (let index = Math.max(0, fromIndex); index <= Math.min(series.length - 1, toIndex); index += 1) total += series[index]!;
  return total;
}

/**
 * The month-end estimates between two measured LICs, moved so that they meet
 * the later one: the gap between the balance carried to that day and what it
 * measured is spread evenly over the days since the earlier measurement (a
 * modelling choice of ours: the record says the stores got there, not when
 * the difference arose). The flows are untouched, so the months still add up
 * to the record; only the estimate line changes, and only between
 * measurements.
 */
function meetEachMeasurement(
  months: readonly MonthOfAccount[],
  monthLastIndex: readonly number[],
  meetings: readonly { readonly index: number; readonly anchoredMg: number; readonly carriedMg: number | null }[],
): MonthOfAccount[] {
  const moved = [...months];
  // One pass: months and measurements are both in day order; `next` is the first measurement after the month's end.
  let next = 0;
  for (let month = 0; month < moved.length; month += 1) {
    const last = monthLastIndex[month]!;
    while (next < meetings.length && meetings[next]!.index <= last) next += 1;
    const entry = moved[month]!;
    if (next === 0 || next === meetings.length || entry.bodyIronMg === null) continue;
    const from = meetings[next - 1]!.index;
    const { index: to, anchoredMg, carriedMg } = meetings[next]!;
    if (carriedMg === null) continue;
    const bodyIronMg = entry.bodyIronMg + ((anchoredMg - carriedMg) * (last - from)) / (to - from);
    moved[month] = { ...entry, bodyIronMg, licEstimateMgPerGDry: bodyIronMg / (angelucciSlopeMgPerKgPerMgPerGDry * entry.weightKg) };
  }
  return moved;
}
