import type { LigandId } from '../chelators/catalogue';
import { applyThreshold, type AppliedThreshold } from '../thresholds';
import type { SafetyContext } from './context';
import type { FindingDraft, Severity } from './types';

/**
 * A safety rule: data (id, title, the highest severity it gives, the drugs it
 * concerns, its sources and whether any is from memory or unsure) plus a pure
 * function from the review's context to findings. An empty list means the
 * rule did not trigger.
 */
export interface SafetyRule {
  /** Stable kebab-case id; never renamed (findings and tests refer to it). */
  readonly id: string;
  /** The title with the published thresholds (a listing of the rules). */
  readonly title: string;
  /** The title with the thresholds a review applied: a local protocol's limit, not the published one, where one is set. */
  readonly titleFor: (threshold: ThresholdLookup) => string;
  /** The highest severity the rule gives; each finding carries its own. */
  readonly severity: Severity;
  /** Drugs the rule concerns; empty for rules about the patient or the record. */
  readonly drugs: readonly LigandId[];
  readonly sourceIds: readonly string[];
  /** True where a source is from memory or its reading is unsure; shown with every finding. */
  readonly uncertain: boolean;
  readonly evaluate: (context: SafetyContext) => readonly FindingDraft[];
}

/** A threshold as a review applies it (SafetyContext.threshold). */
export type ThresholdLookup = (id: string) => AppliedThreshold;

/** What a rule is declared with: its title is a text, or, where it names a limit, built from the thresholds applied. */
export type RuleSpec = Omit<SafetyRule, 'title' | 'titleFor'> & { readonly title: string | ((threshold: ThresholdLookup) => string) };

/**
 * Declare a rule. A title that names a limit is a function of the thresholds, so the title of a
 * finding shows the limit actually used (a local override), and the listing shows the published one.
 *
 * @example defineRule({ id: 'x', title: (threshold) => `Ferritin below ${threshold('ferritin-low').value} µg/L`, … }).title === 'Ferritin below 500 µg/L'
 */
export function defineRule(spec: RuleSpec): SafetyRule {
  const { title } = spec;
  const titleFor = typeof title === 'string' ? () => title : title;
  return { ...spec, title: titleFor((id) => applyThreshold(id, {})), titleFor };
}
