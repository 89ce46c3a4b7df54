import type { ResultKind } from '../model/caseFile';

/**
 * The monitoring the findings rely on, as data: what is checked, how often,
 * and on which source. A rule applies when its condition holds for the case on
 * the review date (see monitoringCalendar.ts); the interval is calendar months
 * or days.
 */

export const monitoringItemIds = ['creatinine', 'alt', 'ast', 'bilirubin', 'neutrophils', 'ferritin', 'liver-iron', 'cardiac-t2star', 'hearing', 'eyes'] as const;
export type MonitoringItemId = (typeof monitoringItemIds)[number];

export type MonitoringInterval = { readonly months: number } | { readonly days: number };

/** The condition under which a rule applies; evaluated by the calendar. */
export type MonitoringCondition =
  | { readonly kind: 'on-drug'; readonly drugs: readonly ('deferasirox' | 'deferiprone' | 'deferoxamine')[] }
  /** On any chelator, or transfused in the 12 months before the review. */
  | { readonly kind: 'iron-loaded-programme' }
  /** Thalassaemia major from a given age in completed years. */
  | { readonly kind: 'thalassaemia-major-from-age'; readonly minAgeYears: number };

export interface MonitoringRule {
  readonly id: string;
  readonly itemId: MonitoringItemId;
  /** What is checked, in the trade's words. */
  readonly what: string;
  /** The result kind in the case file that records it (version 2 records hearing and eyes as audiology and eye-examination results). */
  readonly resultKind: ResultKind | null;
  /**
   * An interval that depends on the case, computed by the calendar: the
   * deferiprone ANC schedule by time on the drug, creatinine on deferasirox
   * (weekly in the first month with renal risk, or while it is rising).
   */
  readonly dynamic?: 'deferiprone-anc' | 'deferasirox-creatinine';
  readonly condition: MonitoringCondition;
  readonly interval: MonitoringInterval;
  /**
   * A shorter interval in the first month of the current period of the drug
   * (a start, or a dose change recorded as a new period).
   */
  readonly firstMonthInterval?: MonitoringInterval;
  /** Why, as a pharmacist would write it; names the source's standing. */
  readonly why: string;
  readonly sourceIds: readonly string[];
  /**
   * For a rule several drugs bring in with different sources (hearing, eyes):
   * the sentence and sources per drug; the calendar keeps those of the drugs running.
   */
  readonly byDrug?: Readonly<Partial<Record<'deferasirox' | 'deferiprone' | 'deferoxamine', { readonly why: string; readonly sourceIds: readonly string[] }>>>;
}

/** A local protocol's fixed ANC interval on deferiprone when one is chosen as "weekly throughout" (the older texts). */
export const weeklyThroughoutAncIntervalDays = 7;

/**
 * The rules. Intervals and sources:
 * - on deferasirox: AST, ALT and bilirubin every 2 weeks in the first month
 *   of a period, then monthly (US label §5.2; references.md §9, confirmed);
 *   creatinine monthly, weekly in the first month when renal risk factors are
 *   recorded, and weekly while it is rising (US label boxed warning and §2.1;
 *   confirmed) — computed by the calendar ('deferasirox-creatinine');
 * - ANC on deferiprone by time on the drug (US label March 2025 §2.1, §5.1;
 *   confirmed), or a local protocol's fixed interval — computed by the
 *   calendar ('deferiprone-anc', deferiproneAncSchedule.ts);
 * - ferritin every 3 months: common practice (monitoring-ferritin-quarterly);
 * - liver iron by MRI yearly; cardiac T2* yearly in thalassaemia major from
 *   10 years: guideline literature, secondary (monitoring-mri-yearly);
 * - hearing and eyes yearly on deferoxamine (label, confirmed) and on
 *   deferasirox (label; secondary, from memory), read from the audiology and
 *   eye-examination results.
 *
 * @returns the rules, in the order the calendar lists items due on the same date
 * @example monitoringRules().find((it) => it.itemId === 'alt')?.firstMonthInterval → { days: 14 }
 */
export function monitoringRules(): readonly MonitoringRule[] {
  // The table is fixed: built once, on first use (every monitoring calendar reads it).
  builtRules ??= buildMonitoringRules();
  return builtRules;
}

let builtRules: readonly MonitoringRule[] | undefined;

function buildMonitoringRules(): readonly MonitoringRule[] {
  const liverTest = (itemId: 'alt' | 'ast' | 'bilirubin', what: string): MonitoringRule => ({
    id: `${itemId}-on-deferasirox`,
    itemId,
    what,
    resultKind: itemId,
    condition: { kind: 'on-drug', drugs: ['deferasirox'] },
    interval: { months: 1 },
    firstMonthInterval: { days: 14 },
    why: `On deferasirox: ${what} every 2 weeks during the first month of a period, then at least monthly (US label §5.2).`,
    sourceIds: ['deferasirox-label-us'],
  });
  return [
    {
      id: 'creatinine-on-deferasirox',
      itemId: 'creatinine',
      what: 'serum creatinine',
      resultKind: 'creatinine',
      condition: { kind: 'on-drug', drugs: ['deferasirox'] },
      interval: { months: 1 },
      dynamic: 'deferasirox-creatinine',
      why: 'On deferasirox: serum creatinine at least monthly; weekly in the first month when there is renal risk, and more often while it rises (US label boxed warning and §2.1).',
      sourceIds: ['deferasirox-label-us'],
    },
    liverTest('alt', 'ALT (liver transaminases)'),
    liverTest('ast', 'AST'),
    liverTest('bilirubin', 'serum bilirubin'),
    {
      id: 'anc-on-deferiprone',
      itemId: 'neutrophils',
      what: 'absolute neutrophil count (ANC)',
      resultKind: 'neutrophils',
      condition: { kind: 'on-drug', drugs: ['deferiprone'] },
      interval: { days: 7 },
      dynamic: 'deferiprone-anc',
      why: 'On deferiprone: ANC by time on the drug (US label 2025 §2.1, §5.1).',
      sourceIds: ['deferiprone-label-us-2025'],
    },
    {
      id: 'ferritin-quarterly',
      itemId: 'ferritin',
      what: 'serum ferritin',
      resultKind: 'ferritin',
      condition: { kind: 'iron-loaded-programme' },
      interval: { months: 3 },
      why: 'On chelation or a transfusion programme: serum ferritin every 3 months (common practice).',
      sourceIds: ['monitoring-ferritin-quarterly'],
    },
    {
      id: 'liver-iron-yearly',
      itemId: 'liver-iron',
      what: 'liver iron concentration by MRI',
      resultKind: 'liver-iron',
      condition: { kind: 'iron-loaded-programme' },
      interval: { months: 12 },
      why: 'On chelation or a transfusion programme: liver iron by MRI yearly (common practice and guideline literature; secondary).',
      sourceIds: ['monitoring-mri-yearly'],
    },
    {
      id: 'cardiac-t2star-yearly',
      itemId: 'cardiac-t2star',
      what: 'cardiac T2* by MRI',
      resultKind: 'cardiac-t2star',
      condition: { kind: 'thalassaemia-major-from-age', minAgeYears: 10 },
      interval: { months: 12 },
      why: 'Thalassaemia major from 10 years of age: cardiac T2* yearly (guideline literature; secondary).',
      sourceIds: ['monitoring-mri-yearly'],
    },
    {
      id: 'hearing-yearly',
      itemId: 'hearing',
      what: 'hearing (audiometry)',
      resultKind: 'audiology',
      condition: { kind: 'on-drug', drugs: ['deferoxamine', 'deferasirox'] },
      interval: { months: 12 },
      why: 'On deferoxamine: hearing yearly (label; confirmed). On deferasirox: auditory testing yearly (label; secondary, from memory).',
      sourceIds: ['deferoxamine-label', 'deferasirox-label-us'],
      byDrug: {
        deferoxamine: { why: 'On deferoxamine: hearing yearly (label; confirmed).', sourceIds: ['deferoxamine-label'] },
        deferasirox: { why: 'On deferasirox: auditory testing yearly (label; secondary, from memory).', sourceIds: ['deferasirox-label-us'] },
      },
    },
    {
      id: 'eyes-yearly',
      itemId: 'eyes',
      what: 'eye examination (ophthalmology)',
      resultKind: 'eye-examination',
      condition: { kind: 'on-drug', drugs: ['deferoxamine', 'deferasirox'] },
      interval: { months: 12 },
      why: 'On deferoxamine: eye examination yearly (label; confirmed). On deferasirox: ophthalmic testing yearly (label; secondary, from memory).',
      sourceIds: ['deferoxamine-label', 'deferasirox-label-us'],
      byDrug: {
        deferoxamine: { why: 'On deferoxamine: eye examination yearly (label; confirmed).', sourceIds: ['deferoxamine-label'] },
        deferasirox: { why: 'On deferasirox: ophthalmic testing yearly (label; secondary, from memory).', sourceIds: ['deferasirox-label-us'] },
      },
    },
  ];
}
