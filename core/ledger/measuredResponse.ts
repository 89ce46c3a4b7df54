import { daysBetween, type IsoDate } from '../dates/isoDate';
import { measuredChelationMg as balanceMethod } from './balance';
import { sumDaily, type IronAccount } from './ironAccount';
import type { ChelationSpan, LicMeasurement } from './ledgerInput';

/**
 * An interval between two LIC results shorter than this is called short:
 * MRI LIC repeatability is of the order of 10–15 %, so over a few months the
 * change in LIC is mostly measurement noise. 180 days is common practice
 * (MRI liver iron is usually repeated every 6–12 months), not a published cut-off.
 */
export const shortIntervalDays = 180;

export type ResponseCaveat = 'short-interval' | 'method-changed' | 'regimen-changed' | 'no-chelation';

export interface MeasuredResponse {
  readonly fromDate: IsoDate;
  readonly toDate: IsoDate;
  readonly days: number;
  readonly fromLicMgPerGDry: number;
  readonly toLicMgPerGDry: number;
  readonly meanWeightKg: number;
  /** Net iron brought in by transfusions minus blood removed, mg. */
  readonly intakeMg: number;
  /** Change of body iron stores, mg (Angelucci relation at each date's weight). */
  readonly storesChangeMg: number;
  /** Iron that left the body: intake − change of stores, mg. */
  readonly totalExcretionMg: number;
  /** Of which attributed to chelation: total − basal loss, mg. */
  readonly measuredChelationMg: number;
  /** Expected chelation removal for the regimens on record in the interval, mg. */
  readonly expectedChelationMg: number;
  readonly measuredChelationMgPerKgPerDay: number;
  readonly expectedChelationMgPerKgPerDay: number;
  readonly intakeMgPerKgPerDay: number;
  /** measured ÷ expected; null when no chelation was expected. */
  readonly measuredToExpectedRatio: number | null;
  readonly caveats: readonly ResponseCaveat[];
  readonly caveatText: readonly string[];
  /**
   * The regimen (the set of chelation periods on record together) that ran on
   * most days of the interval, its share of the days, and the other regimens
   * with their days. Added for the one-basis rule: the response is usable when
   * the dominant regimen covers at least the stated share.
   */
  readonly dominantRegimen: { readonly periodIds: readonly string[]; readonly drugs: readonly string[]; readonly share: number };
  readonly mixedRegimens: readonly { readonly label: string; readonly days: number }[];
}

/**
 * The chelation response actually achieved between consecutive LIC results.
 *
 * excretion (mg) = intake (mg) − Δ body iron stores (mg), with stores =
 * 10.6 × LIC × weight (Angelucci et al., N Engl J Med 2000;343:327); the
 * chelation share is excretion minus basal loss. This is the balance method
 * of the deferasirox phase-III analyses (Cappellini 2006; Cohen, Glimm &
 * Porter, Blood 2008;111:583 — the exact method from memory), written with
 * each date's own weight so that growth is not read as iron removed.
 *
 * @param account - the iron account (daily series)
 * @param measurements - LIC results, any order
 * @param chelation - regimens on record, to flag changes inside an interval
 * @returns one entry per consecutive pair of LIC results, oldest first
 */
export function measuredResponses(
  account: IronAccount,
  measurements: readonly LicMeasurement[],
  chelation: readonly ChelationSpan[],
  regimenShare = 0.9,
): MeasuredResponse[] {
  const sorted = [...measurements].sort((a, b) => a.date.localeCompare(b.date));
  const responses: MeasuredResponse[] = [];
  for (let index = 1; index < sorted.length; index += 1) {
    const from = sorted[index - 1]!;
    const to = sorted[index]!;
    const days = daysBetween(from.date, to.date);
    if (days <= 0) continue;
    const fromIndex = daysBetween(account.daily.firstDay, from.date);
    const toIndex = daysBetween(account.daily.firstDay, to.date);
    // Flows after the first measurement's day up to and including the second's.
    const window = [fromIndex + 1, toIndex] as const;
    const intakeMg = sumDaily(account.daily.transfusedInMg, ...window) - sumDaily(account.daily.removedWithBloodMg, ...window);
    const expectedChelationMg = sumDaily(account.daily.chelationOutMg, ...window);
    const basalMg = sumDaily(account.daily.basalLossMg, ...window);
    const meanWeightKg = sumDaily(account.daily.weightKg, ...window) / days;
    const weightFrom = account.daily.weightKg[fromIndex]!;
    const weightTo = account.daily.weightKg[toIndex]!;
    const { storesChangeMg, totalExcretionMg, chelationMg: measuredChelationMg } = balanceMethod({
      intakeMg,
      fromLic: from.licMgPerGDry,
      toLic: to.licMgPerGDry,
      fromWeightKg: weightFrom,
      toWeightKg: weightTo,
      basalLossMg: basalMg,
    });
    const perKgPerDay = (mg: number) => mg / meanWeightKg / days;
    const caveats: ResponseCaveat[] = [];
    const caveatText: string[] = [];
    if (days < shortIntervalDays) {
      caveats.push('short-interval');
      caveatText.push(`The interval is ${days} days, under ${shortIntervalDays}: the LIC change is within measurement noise, so the measured removal is uncertain.`);
    }
    if (from.method !== to.method) {
      caveats.push('method-changed');
      caveatText.push(`The two LIC results come from different methods (${from.method}; ${to.method}): part of the change may be the method.`);
    }
    const coverage = regimenCoverage(chelation, from.date, to.date, days);
    if (coverage.dominant.share < regimenShare) {
      caveats.push('regimen-changed');
      caveatText.push(
        `No one regimen ran on ${Math.round(regimenShare * 100)} % of the interval's days (the most common covered ${Math.round(coverage.dominant.share * 100)} %; ${coverage.mixed.map((it) => `${it.label}: ${it.days} days`).join('; ')}): the measured removal mixes regimens.`,
      );
    }
    if (expectedChelationMg <= 0) {
      caveats.push('no-chelation');
      caveatText.push('No chelation is on record in the interval: the removal shown is basal loss and measurement noise.');
    }
    responses.push({
      fromDate: from.date,
      toDate: to.date,
      days,
      fromLicMgPerGDry: from.licMgPerGDry,
      toLicMgPerGDry: to.licMgPerGDry,
      meanWeightKg,
      intakeMg,
      storesChangeMg,
      totalExcretionMg,
      measuredChelationMg,
      expectedChelationMg,
      measuredChelationMgPerKgPerDay: perKgPerDay(measuredChelationMg),
      expectedChelationMgPerKgPerDay: perKgPerDay(expectedChelationMg),
      intakeMgPerKgPerDay: perKgPerDay(intakeMg),
      measuredToExpectedRatio: expectedChelationMg > 0 ? measuredChelationMg / expectedChelationMg : null,
      caveats,
      caveatText,
      dominantRegimen: coverage.dominant,
      mixedRegimens: coverage.mixed,
    });
  }
  return responses;
}

/**
 * Days of the interval (after `fromDate` up to `toDate`) on each regimen — the
 * set of spans on record together that day (end dates inclusive) — and the
 * regimen with the most days.
 */
function regimenCoverage(chelation: readonly ChelationSpan[], fromDate: IsoDate, toDate: IsoDate, days: number) {
  const inWindow = chelation.filter((span) => span.start <= toDate && (span.end === null || span.end > fromDate));
  // Day offsets of each span relative to fromDate; a regimen is the set of spans on a day, keyed by their indices.
  const starts = inWindow.map((span) => daysBetween(fromDate, span.start));
  const ends = inWindow.map((span) => (span.end === null ? Number.POSITIVE_INFINITY : daysBetween(fromDate, span.end)));
  // The set of spans changes only where one starts or ends: walk those offsets, not every day against every span
  // (days × spans was quadratic in a record of thousands of dose changes).
  const startingAt = new Map<number, number[]>();
  const endingBefore = new Map<number, number[]>();
  const at = (map: Map<number, number[]>, offset: number, index: number) => {
    const list = map.get(offset);
    if (list) list.push(index);
    else map.set(offset, [index]);
  };
  inWindow.forEach((_, index) => {
    const first = Math.max(1, starts[index]!);
    const last = Math.min(days, ends[index]!);
    if (first > last) return;
    at(startingAt, first, index);
    if (last < days) at(endingBefore, last + 1, index);
  });
  const changes = [...new Set([1, ...startingAt.keys(), ...endingBefore.keys()])].filter((offset) => offset <= days).sort((a, b) => a - b);
  const running = new Set<number>();
  const counts = new Map<string, number>();
  let key = '';
  let run = 0;
  changes.forEach((offset, change) => {
    for (const index of endingBefore.get(offset) ?? []) running.delete(index);
    for (const index of startingAt.get(offset) ?? []) running.add(index);
    const dayKey = [...running].sort((a, b) => a - b).map((index) => `${index},`).join('');
    if (dayKey !== key) {
      if (run > 0) counts.set(key, (counts.get(key) ?? 0) + run);
      key = dayKey;
      run = 0;
    }
    run += (changes[change + 1] ?? days + 1) - offset;
  });
  if (run > 0) counts.set(key, (counts.get(key) ?? 0) + run);
  const spansOf = (regimenKey: string) => regimenKey.split(',').filter((it) => it !== '').map((it) => inWindow[Number(it)]!);
  const ranked = [...counts.entries()].sort((a, b) => b[1] - a[1]).map(([regimenKey, count]) => ({ spans: spansOf(regimenKey), days: count }));
  const top = ranked[0] ?? { spans: [], days: 0 };
  const labelOf = (spans: readonly ChelationSpan[]) => (spans.length === 0 ? 'no chelation' : spans.map((span) => span.label).join(' + '));
  return {
    dominant: { periodIds: top.spans.map((span) => span.id), drugs: [...new Set(top.spans.map((span) => span.drug))], share: days > 0 ? top.days / days : 1 },
    mixed: ranked.slice(1).map((entry) => ({ label: labelOf(entry.spans), days: entry.days })),
  };
}
