import { addDaysIso, addMonthsIso, daysBetween, type IsoDate } from '../dates';
import type { Case, ChelationPeriod } from '../model/caseFile';
import { periodsActiveOn } from '../model/periodsActiveOn';
import { resultsByKindBetween, resultsOfKindBetween } from '../model/resultsOfKindBetween';
import { earliestCaseDate } from '../model/caseDate';
import { checkReviewDate } from '../model/reviewWindow';
import { ageOnDate } from '../patient/ageOnDate';
import { fail, issue, ok, type Result } from '../result';
import { creatinineMgPerDlFromUmolPerL } from '../units/concentration';
import type { UmolPerL } from '../units/quantity';
import { continuousRunStart } from '../model/continuousRunStart';
import { deferiproneAncInterval } from './deferiproneAncSchedule';
import { monitoringRules, weeklyThroughoutAncIntervalDays, type MonitoringInterval, type MonitoringItemId, type MonitoringRule } from './monitoringRules';

export interface MonitoringOptions {
  /**
   * A local protocol's fixed interval of ANC checks on deferiprone, 1–90 days.
   * Without it the 2025 US label's schedule by time on the drug applies.
   */
  readonly ancIntervalDays?: number;
  /** 'weekly-throughout' (the older texts) as a named local protocol: the same as ancIntervalDays 7. */
  readonly ancSchedule?: 'label-2025' | 'weekly-throughout';
  /**
   * The local-protocol thresholds the review runs with (core/thresholds ids); default the case's own
   * (`thresholdOverrides`). Their 'deferiprone-anc-interval' sets the fixed ANC interval when
   * ancIntervalDays and ancSchedule are not given, so findings, calendar, sheet and panel share one rule.
   */
  readonly thresholdOverrides?: Readonly<Record<string, { readonly value: number } | undefined>>;
}

/** Threshold id of a local protocol's fixed ANC interval (core/thresholds/catalogue.ts). */
export const ancIntervalThresholdId = 'deferiprone-anc-interval';

/**
 * The fixed ANC interval a set of local-protocol thresholds asks for, in whole days within the
 * calendar's 1–90 (the threshold accepts up to 92, three months: kept to 90 here), or undefined.
 */
export function ancIntervalFromOverrides(overrides: Readonly<Record<string, { readonly value: number } | undefined>>): number | undefined {
  const override = overrides[ancIntervalThresholdId];
  return override === undefined ? undefined : Math.min(ancIntervalRange.max, Math.max(ancIntervalRange.min, Math.round(override.value)));
}

export type MonitoringStatus = 'overdue' | 'due-now' | 'upcoming';

export interface MonitoringItem {
  readonly id: MonitoringItemId;
  readonly ruleId: string;
  readonly what: string;
  readonly why: string;
  readonly sourceIds: readonly string[];
  /** The drugs on the review date that bring this item in (empty for ferritin, liver iron, cardiac T2* when no chelator runs). */
  readonly drugs: readonly ChelationPeriod['drug'][];
  readonly interval: MonitoringInterval;
  /** "every 1 month", "every 7 days". */
  readonly intervalText: string;
  /** Date of the last result on or before the review date; null: none on record. */
  readonly lastDate: IsoDate | null;
  readonly dueDate: IsoDate;
  readonly status: MonitoringStatus;
  readonly overdue: boolean;
  /** Days past the due date on the review date (0 unless overdue). */
  readonly daysOverdue: number;
}

export interface MonitoringSkipped {
  readonly id: MonitoringItemId;
  readonly what: string;
  readonly reason: string;
}

export interface MonitoringCalendar {
  readonly caseLabel: string;
  readonly asOf: IsoDate;
  /** Earliest due first; on the same date, in the rules' order. */
  readonly items: readonly MonitoringItem[];
  /** Rules that do not apply to this case on this date, with the reason (never hidden). */
  readonly notApplicable: readonly MonitoringSkipped[];
  readonly assumptions: readonly string[];
}

const ancIntervalRange = { min: 1, max: 90 } as const;

function addInterval(date: IsoDate, interval: MonitoringInterval): IsoDate {
  return 'months' in interval ? addMonthsIso(date, interval.months) : addDaysIso(date, interval.days);
}

function intervalText(interval: MonitoringInterval): string {
  if ('months' in interval) return interval.months === 1 ? 'monthly' : interval.months === 12 ? 'yearly' : `every ${interval.months} months`;
  return interval.days === 7 ? 'weekly' : `every ${interval.days} days`;
}

function ageOn(theCase: Case, asOf: IsoDate): number | undefined {
  return ageOnDate(theCase.patient.age, asOf) ?? undefined;
}

interface Applicability {
  readonly applies: boolean;
  readonly drugs: readonly ChelationPeriod['drug'][];
  readonly reason: string;
}

function applicability(rule: MonitoringRule, theCase: Case, asOf: IsoDate, active: readonly ChelationPeriod[]): Applicability {
  const activeDrugs = [...new Set(active.map((it) => it.drug))];
  switch (rule.condition.kind) {
    case 'on-drug': {
      const drugs = activeDrugs.filter((drug) => (rule.condition as { drugs: readonly string[] }).drugs.includes(drug));
      return { applies: drugs.length > 0, drugs, reason: `no ${rule.condition.drugs.join(' or ')} running on ${asOf}` };
    }
    case 'iron-loaded-programme': {
      const yearBefore = addMonthsIso(asOf, -12);
      const transfused = theCase.transfusions.some((it) => yearBefore <= it.date && it.date <= asOf);
      return { applies: activeDrugs.length > 0 || transfused, drugs: activeDrugs, reason: `no chelator running on ${asOf} and no transfusion in the 12 months before` };
    }
    case 'thalassaemia-major-from-age': {
      const age = ageOn(theCase, asOf);
      const isTm = theCase.patient.diagnosisGroup === 'thalassaemia-major';
      const oldEnough = age !== undefined && age >= rule.condition.minAgeYears;
      const reason = !isTm
        ? `the yearly rule is for thalassaemia major (this case: ${theCase.patient.diagnosisGroup}); local protocol decides otherwise`
        : `age ${age === undefined ? 'unknown' : Math.floor(age)} years on ${asOf}, under ${rule.condition.minAgeYears}; earlier where indicated (local decision)`;
      return { applies: isTm && oldEnough, drugs: activeDrugs, reason };
    }
  }
}

function inFirstMonthOfPeriod(asOf: IsoDate, active: readonly ChelationPeriod[], drugs: readonly ChelationPeriod['drug'][]): boolean {
  return active.some((period) => drugs.includes(period.drug) && asOf < addMonthsIso(period.startDate, 1));
}

/** A renal risk factor recorded as present on the review date (the latest entry of each factor counts). */
function renalRiskRecorded(theCase: Case, asOf: IsoDate): boolean {
  const latestByFactor = new Map<string, string>();
  for (const entry of [...theCase.clinicalState.renalRiskFactors].filter((it) => it.date <= asOf).sort((first, second) => (first.date < second.date ? -1 : 1))) {
    latestByFactor.set(entry.factor, entry.status);
  }
  return [...latestByFactor.values()].includes('present');
}

/** Rise of creatinine over baseline above which the label asks for closer checks: 33 % (US label, references.md §4; secondary). */
const creatinineRisePercent = 33;

/**
 * Whether creatinine is rising on deferasirox: the latest result more than
 * 33 % above the baseline (the latest before the run began, or the first on
 * the drug). The label asks for more frequent checks while it rises.
 */
function creatinineRising(theCase: Case, asOf: IsoDate): boolean {
  const runStart = continuousRunStart(theCase.chelationPeriods, 'deferasirox', asOf);
  if (runStart === null) return false;
  const all = resultsOfKindBetween(theCase.results, 'creatinine', earliestCaseDate, asOf);
  const mgPerDl = (entry: (typeof all)[number]) => (entry.measured.unit === 'mg/dL' ? entry.measured.value : creatinineMgPerDlFromUmolPerL(entry.measured.value as UmolPerL));
  const baseline = all.filter((it) => it.date <= runStart).at(-1) ?? all.find((it) => it.date > runStart);
  const latest = all.at(-1);
  if (!baseline || !latest || latest === baseline) return false;
  return (mgPerDl(latest) / mgPerDl(baseline) - 1) * 100 > creatinineRisePercent;
}

interface RuleInterval {
  readonly interval: MonitoringInterval;
  /** Why this interval, when it is not the rule's usual one. */
  readonly why?: string;
}

function ruleInterval(rule: MonitoringRule, theCase: Case, asOf: IsoDate, active: readonly ChelationPeriod[], drugs: readonly ChelationPeriod['drug'][], localAncDays: number | undefined): RuleInterval {
  if (rule.dynamic === 'deferiprone-anc') {
    const runStart = continuousRunStart(theCase.chelationPeriods, 'deferiprone', asOf) ?? asOf;
    const anc = deferiproneAncInterval(theCase, runStart, asOf, localAncDays);
    return { interval: { days: anc.days }, why: anc.why };
  }
  if (rule.dynamic === 'deferasirox-creatinine') {
    if (creatinineRising(theCase, asOf)) {
      return { interval: { days: 7 }, why: `On deferasirox with the latest creatinine more than ${creatinineRisePercent} % above its baseline: weekly here, as the label asks for more frequent checks while creatinine rises (US label boxed warning).` };
    }
    if (inFirstMonthOfPeriod(asOf, active, drugs) && renalRiskRecorded(theCase, asOf)) {
      return { interval: { days: 7 }, why: 'On deferasirox in the first month of a period with a renal risk factor recorded: serum creatinine weekly (US label boxed warning and §2.1).' };
    }
    return { interval: rule.interval };
  }
  if (rule.firstMonthInterval && inFirstMonthOfPeriod(asOf, active, drugs)) return { interval: rule.firstMonthInterval };
  return { interval: rule.interval };
}

/**
 * The monitoring due for a case on a review date: for each check the active
 * regimens and the diagnosis call for (creatinine, ALT, ANC, ferritin, liver
 * iron, cardiac T2*, hearing, eyes), the last result on record, the due date
 * and whether it is overdue. A check with nothing on record is due on the
 * review date. Rules that do not apply are listed with the reason.
 *
 * due date = last result date + interval (calendar months, or days); with no
 * result on record, the review date. Overdue: due date before the review date.
 *
 * Sources: see monitoringRules.ts (deferasirox and deferoxamine labels,
 * deferiprone ANC texts, guideline literature, common practice).
 *
 * @param theCase - a parsed case (core/model); not changed
 * @param asOf - the review date 'YYYY-MM-DD' (1900–2100); results after it are ignored
 * @param options - a local protocol's fixed ANC interval, ancIntervalDays 1–90, or ancSchedule 'weekly-throughout'; without
 *   either, the 'deferiprone-anc-interval' threshold of `thresholdOverrides` (default the case's own), else the 2025 US label's schedule
 * @returns the calendar, or an issue naming the field, the value and the range
 * @example monitoringCalendar(TH-0417, '2026-11-20') → creatinine: last 2026-09-29, due 2026-10-29, overdue by 22 days;
 *   hearing: none on record, due 2026-11-20 (due now)
 */
export function monitoringCalendar(theCase: Case, asOf: IsoDate, options: MonitoringOptions = {}): Result<MonitoringCalendar> {
  // The same review window as the iron review (core/model/reviewWindow.ts).
  const window = checkReviewDate(theCase, asOf);
  if (!window.ok) return window;
  const ancIntervalDays =
    options.ancIntervalDays ??
    (options.ancSchedule === 'weekly-throughout'
      ? weeklyThroughoutAncIntervalDays
      : options.ancSchedule === 'label-2025'
        ? undefined
        : ancIntervalFromOverrides(options.thresholdOverrides ?? theCase.thresholdOverrides));
  if (ancIntervalDays !== undefined && (!Number.isInteger(ancIntervalDays) || ancIntervalDays < ancIntervalRange.min || ancIntervalDays > ancIntervalRange.max)) {
    return fail(
      issue('out_of_range', ['ancIntervalDays'], `ANC interval ${ancIntervalDays} days is outside the plausible range ${ancIntervalRange.min}–${ancIntervalRange.max} whole days.`),
    );
  }
  const active = periodsActiveOn(theCase.chelationPeriods, asOf);
  const items: MonitoringItem[] = [];
  const notApplicable: MonitoringSkipped[] = [];
  const onRecord = resultsByKindBetween(theCase.results, earliestCaseDate, asOf);
  for (const rule of monitoringRules()) {
    const fit = applicability(rule, theCase, asOf, active);
    if (!fit.applies) {
      notApplicable.push({ id: rule.itemId, what: rule.what, reason: fit.reason });
      continue;
    }
    const { interval, why: intervalWhy } = ruleInterval(rule, theCase, asOf, active, fit.drugs, ancIntervalDays);
    // An examination recorded as not done does not count as done.
    const done = rule.resultKind === null ? [] : onRecord(rule.resultKind).filter((it) => !('outcome' in it) || it.outcome !== 'not-done');
    const lastDate = done.at(-1)?.date ?? null;
    const dueDate = lastDate === null ? asOf : addInterval(lastDate, interval);
    const status: MonitoringStatus = dueDate < asOf ? 'overdue' : dueDate === asOf ? 'due-now' : 'upcoming';
    const perDrug = rule.byDrug ? fit.drugs.map((drug) => rule.byDrug![drug]).filter((it) => it !== undefined) : [];
    items.push({
      id: rule.itemId,
      ruleId: rule.id,
      what: rule.what,
      why: intervalWhy ?? (perDrug.length > 0 ? perDrug.map((it) => it.why).join(' ') : rule.why),
      sourceIds: perDrug.length > 0 ? [...new Set(perDrug.flatMap((it) => it.sourceIds))] : rule.sourceIds,
      drugs: fit.drugs,
      interval,
      intervalText: intervalText(interval),
      lastDate,
      dueDate,
      status,
      overdue: status === 'overdue',
      daysOverdue: status === 'overdue' ? daysBetween(dueDate, asOf) : 0,
    });
  }
  const order = new Map(items.map((it, index) => [it.ruleId, index]));
  items.sort((first, second) => (first.dueDate < second.dueDate ? -1 : first.dueDate > second.dueDate ? 1 : order.get(first.ruleId)! - order.get(second.ruleId)!));
  return ok({
    caseLabel: theCase.patient.label,
    asOf,
    items,
    notApplicable,
    assumptions: [
      'A check with no result on record is shown as due on the review date; a hearing or eye examination recorded as not done does not count as done.',
      ancIntervalDays === undefined
        ? 'ANC on deferiprone by time on the drug (US label, March 2025): weekly for 6 months, every 2 weeks for the next 6, then up to every 4 weeks; daily while the latest ANC is below 1.5 × 10⁹/L.'
        : `ANC on deferiprone every ${ancIntervalDays} days by the local protocol (the label's schedule by time on the drug is replaced); daily while the latest ANC is below 1.5 × 10⁹/L.`,
      'Intervals run from the last result on record on or before the review date; a calendar month ends on the same day of the next month, or on its last day.',
    ],
  });
}
