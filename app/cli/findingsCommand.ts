import { citeShort, findSource } from '../../core/references';
import type { Finding } from '../../core/safety';
import type { ParsedArgs } from './args';
import { reviewCase, type CaseIo } from './caseReview';
import { decisionSupportCaution } from './format';
import { exitCodes } from './io';

const severityLabel = { urgent: 'URGENT', review: 'REVIEW', information: 'INFO' } as const;

/** The findings as a reader sees them: severity, the sentence, what it rests on, and the short citations. */
export function formatFindings(findings: readonly Finding[], indent = ''): string {
  if (findings.length === 0) return `${indent}No findings from the safety rules.`;
  const lines: string[] = [];
  for (const finding of findings) {
    lines.push(`${indent}${severityLabel[finding.severity].padEnd(6)} ${finding.text}`);
    const overridden = finding.thresholds.filter((it) => it.overridden);
    for (const threshold of overridden) {
      lines.push(`${indent}       local threshold: ${threshold.label} ${threshold.value} ${threshold.unit} (published ${threshold.publishedValue}; ${threshold.reason}, ${threshold.by})`);
    }
    const sources = finding.sourceIds.map((id) => {
      const source = findSource(id);
      return source ? citeShort(source) : id;
    });
    lines.push(`${indent}       sources: ${sources.join('; ')}${finding.sourceUncertain ? ' — includes a value from memory or an unsure source' : ''}`);
  }
  return lines.join('\n');
}

/** `findings <case.json> [--as-of DATE] [--json]`: the safety findings; exit 0 whatever they say (a report), 1 on a bad case file. */
export function findingsCommand(args: ParsedArgs, io: CaseIo): number {
  const review = reviewCase(args, io, { command: 'findings', usage: 'Usage: chelation-ledger findings <case.json> [--as-of YYYY-MM-DD] [--json]' });
  if (typeof review === 'number') return review;
  const { asOf, findings } = review;
  const label = review.caseFile.patient.label;
  if (args.switches.has('--json')) {
    io.out(JSON.stringify({ caution: decisionSupportCaution, asOf, patient: label, findings }, null, 2));
    return exitCodes.ok;
  }
  const count = (severity: Finding['severity']) => findings.filter((it) => it.severity === severity).length;
  io.out(`Safety findings for ${label} as of ${asOf}: ${count('urgent')} urgent, ${count('review')} for review, ${count('information')} for information`);
  io.out(`  ${decisionSupportCaution}`);
  io.out('');
  io.out(formatFindings(findings, '  '));
  return exitCodes.ok;
}
