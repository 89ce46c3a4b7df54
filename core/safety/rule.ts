import type { LigandId } from '../chelators/catalogue';
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
  readonly title: string;
  /** The highest severity the rule gives; each finding carries its own. */
  readonly severity: Severity;
  /** Drugs the rule concerns; empty for rules about the patient or the record. */
  readonly drugs: readonly LigandId[];
  readonly sourceIds: readonly string[];
  /** True where a source is from memory or its reading is unsure; shown with every finding. */
  readonly uncertain: boolean;
  readonly evaluate: (context: SafetyContext) => readonly FindingDraft[];
}

/** Declare a rule (the identity function, for type checking of the literal). */
export function defineRule(rule: SafetyRule): SafetyRule {
  return rule;
}
