import type { ResultKind } from '../model/caseFile';

/**
 * The monitoring the findings rely on, as data: what is checked, how often,
 * and on which source. A rule applies when its condition holds for the case on
 * the review date (see monitoringCalendar.ts); the interval is calendar months
 * or days.
 */

export const monitoringItemIds = ['creatinine', 'alt', 'neutrophils', 'ferritin', 'liver-iron', 'cardiac-t2star', 'hearing', 'eyes'] as const;
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
  /** The result kind in the case file that records it; null when the case model has none (hearing, eyes). */
  readonly resultKind: ResultKind | null;
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

/** Default interval of ANC checks on deferiprone, days: weekly per older labels and the EU text; configurable (monitoring-deferiprone-anc). */
export const defaultAncIntervalDays = 7;

/**
 * The rules. Intervals and sources:
 * - creatinine and ALT monthly on deferasirox, creatinine weekly and ALT every
 *   two weeks in the first month: deferasirox label (monitoring-deferasirox-label;
 *   secondary; the first-month frequencies from memory);
 * - ANC on deferiprone every `ancIntervalDays` (default 7): older labels and EU
 *   weekly; the 2025 US label allows less frequent checks case by case
 *   (monitoring-deferiprone-anc);
 * - ferritin every 3 months: common practice (monitoring-ferritin-quarterly);
 * - liver iron by MRI yearly; cardiac T2* yearly in thalassaemia major from
 *   10 years: guideline literature, secondary (monitoring-mri-yearly);
 * - hearing and eyes yearly on deferoxamine (label, confirmed per
 *   references.md §4) and on deferasirox (label; secondary, from memory).
 *
 * @param ancIntervalDays - days between ANC checks on deferiprone, 1–90 (validated by the calendar)
 * @returns the rules, in the order the calendar lists items due on the same date
 * @example monitoringRules(7).find((it) => it.itemId === 'neutrophils')?.interval → { days: 7 }
 */
export function monitoringRules(ancIntervalDays: number): readonly MonitoringRule[] {
  return [
    {
      id: 'creatinine-on-deferasirox',
      itemId: 'creatinine',
      what: 'serum creatinine',
      resultKind: 'creatinine',
      condition: { kind: 'on-drug', drugs: ['deferasirox'] },
      interval: { months: 1 },
      firstMonthInterval: { days: 7 },
      why: 'On deferasirox: serum creatinine monthly, weekly in the first month of a new period or a new dose (deferasirox label; secondary, first-month frequency from memory).',
      sourceIds: ['monitoring-deferasirox-label'],
    },
    {
      id: 'alt-on-deferasirox',
      itemId: 'alt',
      what: 'ALT (liver transaminases)',
      resultKind: 'alt',
      condition: { kind: 'on-drug', drugs: ['deferasirox'] },
      interval: { months: 1 },
      firstMonthInterval: { days: 14 },
      why: 'On deferasirox: ALT monthly, every two weeks in the first month of a new period or a new dose (deferasirox label; secondary, first-month frequency from memory).',
      sourceIds: ['monitoring-deferasirox-label'],
    },
    {
      id: 'anc-on-deferiprone',
      itemId: 'neutrophils',
      what: 'absolute neutrophil count (ANC)',
      resultKind: 'neutrophils',
      condition: { kind: 'on-drug', drugs: ['deferiprone'] },
      interval: { days: ancIntervalDays },
      why: `On deferiprone: ANC every ${ancIntervalDays} days (${ancIntervalDays === defaultAncIntervalDays ? 'the default: weekly per older labels and the EU text' : 'interval set for this review'}; the 2025 US label allows less frequent checks case by case; secondary).`,
      sourceIds: ['monitoring-deferiprone-anc'],
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
      resultKind: null,
      condition: { kind: 'on-drug', drugs: ['deferoxamine', 'deferasirox'] },
      interval: { months: 12 },
      why: 'On deferoxamine: hearing yearly (label; confirmed). On deferasirox: auditory testing yearly (label; secondary, from memory).',
      sourceIds: ['monitoring-deferoxamine-label', 'monitoring-deferasirox-label'],
      byDrug: {
        deferoxamine: { why: 'On deferoxamine: hearing yearly (label; confirmed).', sourceIds: ['monitoring-deferoxamine-label'] },
        deferasirox: { why: 'On deferasirox: auditory testing yearly (label; secondary, from memory).', sourceIds: ['monitoring-deferasirox-label'] },
      },
    },
    {
      id: 'eyes-yearly',
      itemId: 'eyes',
      what: 'eye examination (ophthalmology)',
      resultKind: null,
      condition: { kind: 'on-drug', drugs: ['deferoxamine', 'deferasirox'] },
      interval: { months: 12 },
      why: 'On deferoxamine: eye examination yearly (label; confirmed). On deferasirox: ophthalmic testing yearly (label; secondary, from memory).',
      sourceIds: ['monitoring-deferoxamine-label', 'monitoring-deferasirox-label'],
      byDrug: {
        deferoxamine: { why: 'On deferoxamine: eye examination yearly (label; confirmed).', sourceIds: ['monitoring-deferoxamine-label'] },
        deferasirox: { why: 'On deferasirox: ophthalmic testing yearly (label; secondary, from memory).', sourceIds: ['monitoring-deferasirox-label'] },
      },
    },
  ];
}
