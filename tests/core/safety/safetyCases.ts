import { expect } from 'vitest';
import { addDaysIso } from '../../../core/dates';
import { computeCase } from '../../../core/ledger/computeCase';
import type { Case } from '../../../core/model/caseFile';
import { parseCase } from '../../../core/model/parseCase';
import { evaluateFindings, type Finding, type ThresholdOverrides } from '../../../core/safety';

export const reviewDate = '2026-11-20';

/** Every finding text a test file produced, for the wording check in its afterAll. */
export const producedTexts: string[] = [];

export function parsed(json: unknown): Case {
  const result = parseCase(json);
  if (!result.ok) throw new Error(result.issues.map((it) => it.message).join('\n'));
  return result.value;
}

/** computeCase then evaluateFindings on a case file (JSON); every text is recorded for the wording check. */
export function findingsFor(json: unknown, asOf = reviewDate, thresholds: ThresholdOverrides = {}): readonly Finding[] {
  const theCase = parsed(json);
  const results = computeCase(theCase, asOf, { samples: 60 });
  if (!results.ok) throw new Error(results.issues.map((it) => it.message).join('\n'));
  const findings = evaluateFindings(theCase, results.value, asOf, thresholds);
  if (!findings.ok) throw new Error(findings.issues.map((it) => it.message).join('\n'));
  producedTexts.push(...findings.value.map((it) => it.text));
  return findings.value;
}

export const ofRule = (findings: readonly Finding[], ruleId: string) => findings.filter((it) => it.ruleId === ruleId);

/**
 * Imperative dosing wording that no finding may use (house rules: descriptive,
 * never "give X mg"). "consider" is allowed only inside a label's words, so it
 * is refused at the start of a clause; "start" is allowed only as "start date".
 */
export const forbiddenPhrasings: readonly RegExp[] = [
  /\bgive\b/i,
  /\bincrease the dose\b/i,
  /\breduce the dose\b/i,
  /\b(increase|reduce|decrease|change|switch) (it |the dose )?to\b/i,
  /\bstop\b/i,
  /\bstart\b(?! date)/i,
  /\badminister\b/i,
  /\bprescribe\b/i,
  /\bmust\b/i,
  /\bshould\b/i,
  /\bdiscontinue\b/i,
  /\bwithhold\b/i,
  /(^|[.;:]\s*)consider\b/i,
  /\bdo not\b/i,
];

export function expectDescriptive(texts: readonly string[]): void {
  for (const text of texts) {
    for (const pattern of forbiddenPhrasings) {
      expect(pattern.test(text), `"${text}" matches ${pattern}`).toBe(false);
    }
  }
}

export interface SmallCaseOptions {
  readonly ageYears?: number;
  readonly sexAtBirth?: 'female' | 'male';
  readonly diagnosisGroup?: string;
  readonly weightKg?: number;
  readonly heightCm?: number | null;
  readonly pregnancy?: 'not-pregnant' | 'pregnant' | 'breastfeeding';
  readonly results?: readonly Record<string, unknown>[];
  readonly chelationPeriods?: readonly Record<string, unknown>[];
  readonly coMedications?: readonly Record<string, unknown>[];
  readonly dispensings?: readonly Record<string, unknown>[];
  readonly clinicalState?: Record<string, unknown>;
  /** Days between transfusions of 2 units (560 mL at 0.60) over the two years before the review; null for none. */
  readonly transfusionEveryDays?: number | null;
}

let resultCounter = 0;
/** One result entry; `daysBefore` counts back from the review date. */
export function result(kind: string, daysBefore: number, value: number, unit: string, extra: Record<string, unknown> = {}): Record<string, unknown> {
  resultCounter += 1;
  return { id: `r${resultCounter}`, date: addDaysIso(reviewDate, -daysBefore), kind, measured: { value, unit }, ...extra };
}

/** A chelation period running from `startDaysBefore` days before the review date, ongoing. */
export function period(drug: 'deferoxamine' | 'deferiprone' | 'deferasirox', dose: number, options: Record<string, unknown> = {}): Record<string, unknown> {
  const defaults = {
    deferoxamine: { formulation: 'vial', route: 'subcutaneous', administrationsPerDay: 1, daysPerWeek: 5, infusionHours: 10 },
    deferiprone: { formulation: 'tablet', route: 'oral', administrationsPerDay: 3, daysPerWeek: 7 },
    deferasirox: { formulation: 'film-coated-tablet', route: 'oral', administrationsPerDay: 1, daysPerWeek: 7 },
  }[drug];
  const startDaysBefore = (options.startDaysBefore as number | undefined) ?? 400;
  const { startDaysBefore: _ignored, ...rest } = options;
  return { id: `p-${drug}-${dose}`, drug, ...defaults, dose: { value: dose, unit: 'mg/kg' }, startDate: addDaysIso(reviewDate, -startDaysBefore), endDate: null, ...rest };
}

/**
 * A small invented case on the review date 2026-11-20: a patient of the given
 * age, weight and height with up-to-date results by default (creatinine, ALT,
 * ANC, ferritin, LIC, cardiac T2*, all unremarkable) unless `results` replaces them.
 */
export function smallCase(options: SmallCaseOptions = {}): Record<string, unknown> {
  const weightKg = options.weightKg ?? 60;
  const every = options.transfusionEveryDays === undefined ? 21 : options.transfusionEveryDays;
  const transfusions =
    every === null
      ? []
      : Array.from({ length: Math.floor(730 / every) }, (_, index) => ({
          id: `t${index}`,
          date: addDaysIso(reviewDate, -730 + index * every),
          kind: 'simple',
          volume: { value: 560, unit: 'mL' },
          unitHaematocrit: 0.6,
          unitCount: 2,
        }));
  const results = options.results ?? [
    result('liver-iron', 200, 5, 'mg/g{dry}', { method: 'biopsy' }),
    result('cardiac-t2star', 200, 30, 'ms', { fieldStrengthT: 1.5 }),
    result('ferritin', 60, 1500, 'ug/L'),
    result('ferritin', 10, 1500, 'ug/L'),
    result('creatinine', 10, 0.7, 'mg/dL'),
    result('alt', 10, 25, 'U/L'),
    result('neutrophils', 3, 3.2, '10*9/L'),
  ];
  return {
    format: 'chelation-ledger.case',
    version: 2,
    patient: {
      label: 'XX-0001',
      age: { kind: 'years-on-date', years: options.ageYears ?? 30, onDate: reviewDate },
      sexAtBirth: options.sexAtBirth ?? 'male',
      diagnosisGroup: options.diagnosisGroup ?? 'thalassaemia-major',
      pregnancy: { status: options.pregnancy ?? 'not-pregnant', recordedOn: options.pregnancy && options.pregnancy !== 'not-pregnant' ? addDaysIso(reviewDate, -5) : null },
      weights: [{ date: addDaysIso(reviewDate, -800), weight: { value: weightKg, unit: 'kg' } }],
      heights: options.heightCm === null ? [] : [{ date: addDaysIso(reviewDate, -30), height: { value: options.heightCm ?? 170, unit: 'cm' } }],
    },
    transfusions,
    results,
    chelationPeriods: options.chelationPeriods ?? [],
    coMedications: options.coMedications ?? [],
    dispensings: options.dispensings ?? [],
    ...(options.clinicalState ? { clinicalState: options.clinicalState } : {}),
  };
}
