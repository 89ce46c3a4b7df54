import { chelatorIdOf } from '../ledger/caseToLedger';
import type { CaseResults } from '../ledger/computeCase';
import type { ChelatorId, LigandId } from '../chelators/catalogue';
import type { IsoDate } from '../dates/isoDate';
import type { Case, ChelationPeriod, CoMedication, HeightEntry, ResultEntry, ResultKind } from '../model/caseFile';
import { periodsActiveOn } from '../model/periodsActiveOn';
import { sortedByDate } from '../model/sortedByDate';
import { ageOnDate } from '../patient/ageOnDate';
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
  return {
    caseFile,
    results,
    asOf,
    ageYears: ageOn(asOf),
    weightKg: results.patient.weightKg,
    active,
    activeDrugs: new Set(active.map((regimen) => regimen.period.drug)),
    activeCoMedications,
    resultsOf: <Kind extends ResultKind>(kind: Kind) =>
      sorted.filter((it) => it.entry.kind === kind).map((it) => ({ entry: it.entry as Extract<ResultEntry, { readonly kind: Kind }>, ref: it.ref })),
    ageOn,
    heightOn: (date) => sortedByDate(caseFile.patient.heights).filter((it) => it.date <= date).at(-1),
    threshold: (id) => applyThreshold(id, overrides),
  };
}
