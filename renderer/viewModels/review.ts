import type { IsoDate } from '../../core/dates/isoDate';
import { computeCase, type CaseResults } from '../../core/ledger/computeCase';
import type { Case } from '../../core/model/caseFile';
import { monitoringCalendar, type MonitoringCalendar } from '../../core/monitoring';
import { derivationsOf, type NamedDerivation } from '../../core/report/derivationIndex';
import { methodAppendix, type MethodAppendix } from '../../core/report/methodAppendix';
import type { Issue } from '../../core/result';
import { evaluateFindings, type Finding } from '../../core/safety';

/** Everything core says about one case on one review date. */
export interface Review {
  readonly asOf: IsoDate;
  readonly results: CaseResults;
  readonly findings: readonly Finding[];
  readonly derivations: readonly NamedDerivation[];
  readonly monitoring: MonitoringCalendar | null;
}

export type ReviewOutcome = { readonly ok: true; readonly review: Review } | { readonly ok: false; readonly issues: readonly Issue[] };

/**
 * The review the screens show: computeCase, the findings with the case's
 * local thresholds, the derivation index and the monitoring calendar — the
 * same path as the command line's compute, findings and explain.
 *
 * @param samples - projection band samples (the case list uses fewer: it shows no band)
 */
export function reviewOf(caseFile: Case, asOf: IsoDate, samples = 500): ReviewOutcome {
  const computed = computeCase(caseFile, asOf, { samples });
  if (!computed.ok) return { ok: false, issues: computed.issues };
  const findings = evaluateFindings(caseFile, computed.value, asOf, caseFile.thresholdOverrides);
  if (!findings.ok) return { ok: false, issues: findings.issues };
  const monitoring = monitoringCalendar(caseFile, asOf);
  return {
    ok: true,
    review: {
      asOf,
      results: computed.value,
      findings: findings.value,
      derivations: derivationsOf(computed.value, findings.value),
      monitoring: monitoring.ok ? monitoring.value : null,
    },
  };
}

/** The method appendix of a review: exactly the formulas and assumptions its numbers used. */
export function methodsOf(review: Review): MethodAppendix {
  return methodAppendix(review.derivations);
}
