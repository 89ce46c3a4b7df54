import type { IsoDate } from '../dates/isoDate';
import type { CaseResults } from '../ledger/computeCase';
import type { Case } from '../model/caseFile';
import { ok, type Result } from '../result';
import { safetyContext, type SafetyContext } from './context';
import type { SafetyRule } from './rule';
import { safetyRules } from './rules';
import { anySourceUncertain, checkThresholdOverrides, type ThresholdOverrides } from '../thresholds';
import { severities, type Finding } from './types';

/**
 * Run every safety rule over a computed case and return the findings, urgent
 * first, then review, then information (rules keep their catalogue order
 * within a severity). Nothing is hidden or deduplicated away: each finding
 * carries the values it rests on, the thresholds (with any local override),
 * its sources and whether any source is from memory. Descriptive only: every
 * finding is for review by the prescriber.
 *
 * Local protocols may set a threshold differently: pass the overrides keyed by
 * threshold id (core/thresholds/catalogue.ts), usually the case file's own
 * `thresholdOverrides` (each with its reason and who set it). A finding's title
 * and text then state the limit the local protocol applies.
 *
 * @param caseFile - a parsed case (core/model parseCase); not changed
 * @param results - computeCase(caseFile, asOf) for the same review date
 * @param asOf - review date 'YYYY-MM-DD'
 * @param thresholds - local overrides by threshold id (value in the threshold's unit, reason, by); default none
 * @param rules - the rules to run (default: every catalogued rule)
 * @returns the findings, or issues naming each bad override (id, value, accepted range)
 * @example evaluateFindings(md1102, results, '2026-11-20') → ok([…, { ruleId: 'deferasirox-egfr', severity: 'review',
 *   text: 'Deferasirox with eGFR 49.1 mL/min/1.73 m² (CKD-EPI 2021, 2026-11-10): in the 40–60 band, …' }, …])
 */
export function evaluateFindings(...args: Parameters<typeof findingsWithMonitoring>): Result<readonly Finding[]> {
  const evaluated = findingsWithMonitoring(...args);
  return evaluated.ok ? ok(evaluated.value.findings) : evaluated;
}

/**
 * {@link evaluateFindings} with the monitoring calendar the rules read
 * (core/monitoring monitoringCalendar on the same date, with the same
 * overrides), for a caller that shows both (the panel) without computing the
 * calendar twice. Parameters as for evaluateFindings.
 */
export function findingsWithMonitoring(
  caseFile: Case,
  results: CaseResults,
  asOf: IsoDate,
  thresholds: ThresholdOverrides = {},
  rules: readonly SafetyRule[] = safetyRules,
): Result<{ readonly findings: readonly Finding[]; readonly monitoring: SafetyContext['monitoring'] }> {
  const checked = checkThresholdOverrides(thresholds);
  if (!checked.ok) return checked;
  const context = safetyContext(caseFile, results, asOf, checked.value);
  const findings = rules.flatMap((rule) =>
    rule.evaluate(context).map((draft): Finding => {
      const sourceIds = [...new Set([...rule.sourceIds, ...(draft.extraSourceIds ?? []), ...(draft.thresholds ?? []).flatMap((it) => it.sourceIds)])];
      return {
        ruleId: rule.id,
        severity: draft.severity,
        title: rule.titleFor(context.threshold),
        text: draft.text,
        drugs: draft.drugs ?? rule.drugs,
        triggers: draft.triggers,
        thresholds: draft.thresholds ?? [],
        sourceIds,
        sourceUncertain: rule.uncertain || anySourceUncertain(sourceIds),
      };
    }),
  );
  const rank = (finding: Finding) => severities.indexOf(finding.severity);
  // Array.prototype.sort is stable (ES2019): rules keep their order within a severity.
  return ok({ findings: [...findings].sort((first, second) => rank(first) - rank(second)), monitoring: context.monitoring });
}
