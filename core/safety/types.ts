import type { IsoDate } from '../dates/isoDate';
import type { Derivation } from '../formulas/derivation';
import type { LigandId } from '../chelators/catalogue';
import type { AppliedThreshold } from '../thresholds';

/** How soon a finding asks for the prescriber's attention; never whether it is shown (every finding is shown). */
export const severities = ['urgent', 'review', 'information'] as const;
export type Severity = (typeof severities)[number];

/** A value a finding rests on: what it is, its unit, when it was measured and which case entry holds it. */
export interface TriggerValue {
  /** In the trade's words: 'eGFR', 'serum creatinine', 'absolute neutrophil count'. */
  readonly name: string;
  readonly value: number | string;
  /** UCUM code where one exists ('mL/min/{1.73_m2}', 'ug/L'); '' for text. */
  readonly unit: string;
  /** Date of the measurement or of the regimen, 'YYYY-MM-DD'; null for values not tied to a date. */
  readonly date: IsoDate | null;
  /** Case entry it comes from, e.g. 'results[12] 2026-10-13' or 'chelationPeriods[1] chel-dfx-2025'; null when computed from several. */
  readonly ref: string | null;
  /** How the value was computed, when it was (an eGFR, a therapeutic index); from the same run that gave the value. */
  readonly derivation?: Derivation;
}

/** One finding: what a pharmacist would write, what it rests on, and where the rule comes from. */
export interface Finding {
  readonly ruleId: string;
  readonly severity: Severity;
  readonly title: string;
  /** One descriptive sentence, never an instruction to dose. */
  readonly text: string;
  readonly drugs: readonly LigandId[];
  readonly triggers: readonly TriggerValue[];
  /** Thresholds the finding compared against, with any local override shown. */
  readonly thresholds: readonly AppliedThreshold[];
  /** Ids into core/references. */
  readonly sourceIds: readonly string[];
  /** True when a source the finding rests on is from memory or otherwise unsure. */
  readonly sourceUncertain: boolean;
}

/** What a rule returns: a finding without the rule's own data, which evaluateFindings adds. */
export interface FindingDraft {
  readonly severity: Severity;
  readonly text: string;
  readonly triggers: readonly TriggerValue[];
  readonly thresholds?: readonly AppliedThreshold[];
  /** Sources beyond the rule's own (e.g. the estimator's equation). */
  readonly extraSourceIds?: readonly string[];
  /** Drugs when narrower than the rule's list. */
  readonly drugs?: readonly LigandId[];
}
