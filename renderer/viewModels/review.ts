import type { IsoDate } from '../../core/dates/isoDate';
import { computeCase, type CaseResults } from '../../core/ledger/computeCase';
import { monitoringCalendar, type MonitoringCalendar } from '../../core/monitoring';
import { derivationsOf, type NamedDerivation } from '../../core/report/derivationIndex';
import { buildSheet } from '../../core/report/buildSheet';
import type { Sheet } from '../../core/report/sheet';
import type { Case } from '../../core/model/caseFile';
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

/**
 * The review sheet as core builds it for the PDF, for the screen's preview.
 * The content hash printed on the sheet is that of the file's bytes, which the
 * host computes when it writes the PDF; the preview says so instead.
 */
export function sheetOf(caseFile: Case, review: Review, toolVersion: string): Sheet {
  return buildSheet({
    caseFile,
    results: review.results,
    findings: review.findings,
    caseFileSha256: 'computed by the host when the sheet is written',
    toolVersion: `chelation-ledger ${toolVersion}`,
  });
}

const reviewCache = new WeakMap<Case, Map<string, ReviewOutcome>>();

/**
 * The review of an accepted case on a date, computed once: every screen of
 * the open case reads the same outcome (a case is immutable, so its object
 * identity is its version; an edit makes a new case and a new review).
 */
export function cachedReviewOf(caseFile: Case, asOf: IsoDate): ReviewOutcome {
  let byDate = reviewCache.get(caseFile);
  if (!byDate) {
    byDate = new Map();
    reviewCache.set(caseFile, byDate);
  }
  let outcome = byDate.get(asOf);
  if (!outcome) {
    outcome = reviewOf(caseFile, asOf);
    byDate.set(asOf, outcome);
  }
  return outcome;
}
