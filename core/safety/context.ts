import { chelatorIdOf } from '../ledger/caseToLedger';
import type { CaseResults } from '../ledger/computeCase';
import type { ChelatorId, LigandId } from '../chelators/catalogue';
import type { IsoDate } from '../dates/isoDate';
import type { Case, ChelationPeriod, CoMedication, HeightEntry, ResultEntry, ResultKind } from '../model/caseFile';
import { periodsActiveOn } from '../model/periodsActiveOn';
import { sortedByDate } from '../model/sortedByDate';
import { ageOnDate } from '../patient/ageOnDate';
import { monitoringCalendar, type MonitoringCalendar } from '../monitoring/monitoringCalendar';
import { applyThreshold, type AppliedThreshold, type FixedThresholdId, type ThresholdOverrides } from '../thresholds';

/** A chelation period running on the review date, with its dose per kg per dosing day. */
export interface ActiveRegimen {
  readonly period: ChelationPeriod;
  readonly chelatorId: ChelatorId;
  /** 'chelationPeriods[1] chel-dfx-2025'. */
  readonly ref: string;
  /** Dose per dosing day, mg/kg (dose per administration × administrations a day; mg doses ÷ the latest weight). */
  readonly doseMgPerKgPerDay: number;
}

/** A result on or before the review date with the reference to its case entry. */
export interface DatedResult<Kind extends ResultKind> {
  readonly entry: Extract<ResultEntry, { readonly kind: Kind }>;
  /** 'results[12] 2026-10-13'. */
  readonly ref: string;
}

/** What every rule reads, built once per evaluation. Read-only. */
export interface SafetyContext {
  readonly caseFile: Case;
  readonly results: CaseResults;
  readonly asOf: IsoDate;
  /** Age on the review date, decimal years; null when the case gives none that early. */
  readonly ageYears: number | null;
  /** Latest weight on or before the review date, kg (the one computeCase used). */
  readonly weightKg: number;
  readonly active: readonly ActiveRegimen[];
  readonly activeDrugs: ReadonlySet<LigandId>;
  readonly activeCoMedications: readonly { readonly coMedication: CoMedication; readonly ref: string }[];
  /** Results of one kind on or before the review date, earliest first. */
  resultsOf<Kind extends ResultKind>(kind: Kind): readonly DatedResult<Kind>[];
  /** Age on a date, decimal years; null when unknown. */
  ageOn(date: IsoDate): number | null;
  /** Latest height on or before a date. */
  heightOn(date: IsoDate): HeightEntry | undefined;
  threshold(id: FixedThresholdId | string): AppliedThreshold;
  /**
   * The monitoring calendar on the review date (core/monitoring), with the
   * local protocol's ANC interval when 'deferiprone-anc-interval' is
   * overridden: findings about what is due read it, so they and the calendar
   * never disagree.
   */
  readonly monitoring: MonitoringCalendar;
  /** The latest Child-Pugh class recorded on or before the review date, with its entry. */
  readonly childPugh: { readonly childPughClass: 'A' | 'B' | 'C'; readonly date: IsoDate; readonly ref: string } | null;
  /** Cardiac failure as last recorded on or before the review date: 'present', 'absent', or null when not recorded. */
  readonly cardiacFailure: { readonly status: 'present' | 'absent'; readonly date: IsoDate; readonly ref: string } | null;
}

/** A value per key, made by `make` the first time the key is asked for and kept for the rest of one review. */
function onceEach<Key, Value>(): (key: Key, make: () => Value) => Value {
  const made = new Map<Key, Value>();
  return (key, make) => {
    if (!made.has(key)) made.set(key, make());
    return made.get(key)!;
  };
}

/** The latest dated entry of a list on or before a date, with its index. */
function latestOnOrBefore<Entry extends { readonly date: IsoDate }>(entries: readonly Entry[], asOf: IsoDate): { entry: Entry; index: number } | null {
  let found: { entry: Entry; index: number } | null = null;
  entries.forEach((entry, index) => {
    if (entry.date <= asOf && (found === null || entry.date >= found.entry.date)) found = { entry, index };
  });
  return found;
}

/**
 * Build the context the rules read: the chelation periods and co-medications
 * running on the review date, results up to that date with their case
 * references, the patient's age and weight, and the thresholds with any local
 * overrides applied.
 *
 * @param caseFile - a parsed case; not changed
 * @param results - computeCase's results for the same review date
 * @param asOf - review date 'YYYY-MM-DD'
 * @param overrides - checked threshold overrides
 * @returns the context
 * @example safetyContext(theCase, results, '2026-11-20', {}).active.length === 1 (TH-0417: deferasirox)
 */
export function safetyContext(caseFile: Case, results: CaseResults, asOf: IsoDate, overrides: ThresholdOverrides): SafetyContext {
  const doseOf = new Map(results.currentRegimens.map((regimen) => [regimen.periodId, regimen.doseMgPerKgPerDay]));
  const active = caseFile.chelationPeriods
    .map((period, index) => ({ period, index }))
    .filter(({ period }) => periodsActiveOn([period], asOf).length > 0)
    .map(({ period, index }) => ({
      period,
      chelatorId: chelatorIdOf(period),
      ref: `chelationPeriods[${index}] ${period.id}`,
      doseMgPerKgPerDay:
        doseOf.get(period.id) ??
        (period.dose.unit === 'mg/kg' ? period.dose.value : period.dose.value / results.patient.weightKg) * period.administrationsPerDay,
    }));
  const activeCoMedications = caseFile.coMedications
    .map((coMedication, index) => ({ coMedication, ref: `coMedications[${index}] ${coMedication.id}` }))
    .filter(({ coMedication }) => periodsActiveOn([coMedication], asOf).length > 0);
  const indexed = caseFile.results.map((entry, index) => ({ entry, ref: `results[${index}] ${entry.date}`, date: entry.date }));
  const sorted = sortedByDate(indexed).filter((it) => it.date <= asOf);
  const ageOn = (date: IsoDate): number | null => ageOnDate(caseFile.patient.age, date);
  // The review's thresholds, not only the case's: the calendar's ANC interval follows the same override as the findings.
  const calendar = monitoringCalendar(caseFile, asOf, { thresholdOverrides: overrides });
  // The review date and a checked override are valid inputs of the calendar: a failure here is a bug.
  if (!calendar.ok) throw new Error(`Monitoring calendar refused a checked review: ${calendar.issues.map((it) => it.message).join(' ')}`);
  const childPugh = latestOnOrBefore(caseFile.clinicalState.hepaticImpairment, asOf);
  const cardiacFailure = latestOnOrBefore(caseFile.clinicalState.cardiacFailure, asOf);
  const appliedThreshold = onceEach<string, AppliedThreshold>();
  const resultsOfKind = onceEach<ResultKind, readonly { readonly entry: ResultEntry; readonly ref: string }[]>();
  return {
    caseFile,
    results,
    asOf,
    monitoring: calendar.value,
    childPugh: childPugh ? { childPughClass: childPugh.entry.childPughClass, date: childPugh.entry.date, ref: `clinicalState.hepaticImpairment[${childPugh.index}] ${childPugh.entry.id}` } : null,
    cardiacFailure: cardiacFailure ? { status: cardiacFailure.entry.status, date: cardiacFailure.entry.date, ref: `clinicalState.cardiacFailure[${cardiacFailure.index}] ${cardiacFailure.entry.id}` } : null,
    ageYears: ageOn(asOf),
    weightKg: results.patient.weightKg,
    active,
    activeDrugs: new Set(active.map((regimen) => regimen.period.drug)),
    activeCoMedications,
    // Rules ask for the same kinds and thresholds again and again (a title, a text, the sources): each is made once per review.
    resultsOf: <Kind extends ResultKind>(kind: Kind) =>
      resultsOfKind(kind, () => sorted.filter((it) => it.entry.kind === kind).map((it) => ({ entry: it.entry, ref: it.ref }))) as readonly DatedResult<Kind>[],
    ageOn,
    heightOn: (date) => sortedByDate(caseFile.patient.heights).filter((it) => it.date <= date).at(-1),
    threshold: (id) => appliedThreshold(id, () => applyThreshold(id, overrides)),
  };
}
