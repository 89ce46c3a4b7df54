import type { Derivation } from '../formulas/derivation';
import type { CaseResults } from '../ledger/computeCase';
import type { Finding } from '../safety/types';

export interface NamedDerivation {
  /** Stable id for `explain`, e.g. 'intake', 'body-iron', 'regimen:chel-dfx-2025', 'projection:current:12'. */
  readonly id: string;
  readonly label: string;
  readonly derivation: Derivation;
}

/**
 * Every headline number of a computed case with its derivation, in the order
 * a review reads them, then the computed trigger values of the findings
 * (an eGFR, a therapeutic index). `explain` and the method appendix read this list, so
 * they show exactly what was used.
 *
 * @example derivationsOf(results)[0].id === 'intake'
 */
export function derivationsOf(results: CaseResults, findings: readonly Finding[] = []): NamedDerivation[] {
  const named: NamedDerivation[] = [
    { id: 'intake', label: 'transfusional iron intake over the trailing year', derivation: results.intake.derivation },
  ];
  if (results.bodyIron.derivation) {
    named.push({ id: 'body-iron', label: 'body iron and LIC on the review date', derivation: results.bodyIron.derivation });
  }
  for (const regimen of results.currentRegimens) {
    named.push({ id: `regimen:${regimen.periodId}`, label: `expected removal of ${regimen.label}`, derivation: regimen.derivation });
  }
  for (const response of results.responses) {
    named.push({
      id: `response:${response.fromDate}:${response.toDate}`,
      label: `measured response ${response.fromDate} to ${response.toDate}`,
      derivation: response.derivation,
    });
  }
  for (const scenario of results.projection?.scenarios ?? []) {
    for (const milestone of scenario.milestones) {
      named.push({
        id: `projection:${scenario.id}:${milestone.monthsAhead}`,
        label: `projected LIC at ${milestone.monthsAhead} months, ${scenario.name}`,
        derivation: milestone.derivation,
      });
    }
  }
  const seen = new Map<string, number>();
  for (const finding of findings) {
    for (const trigger of finding.triggers) {
      if (!trigger.derivation) continue;
      const name = slug(trigger.name);
      const base = name === finding.ruleId ? `finding:${finding.ruleId}` : `finding:${finding.ruleId}:${name}`;
      const count = (seen.get(base) ?? 0) + 1;
      seen.set(base, count);
      named.push({
        id: count === 1 ? base : `${base}:${count}`,
        label: `${trigger.name} behind the finding "${finding.title}"${trigger.date ? ` (${trigger.date})` : ''}`,
        derivation: trigger.derivation,
      });
    }
  }
  return named;
}

function slug(text: string): string {
  return text.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '');
}
