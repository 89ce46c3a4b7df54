import { isIsoDate } from '../../core/dates/isoDate';
import { computeCase } from '../../core/ledger/computeCase';
import { citeShort, findSource } from '../../core/references';
import { formatIssues } from '../../core/result';
import { evaluateFindings, type Finding } from '../../core/safety';
import type { ParsedArgs } from './args';
import type { CaseIo } from './caseCommands';
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
  const path = args.positionals[0];
  if (path === undefined) {
    io.err('Usage: chelation-ledger findings <case.json> [--as-of YYYY-MM-DD] [--json]');
    return exitCodes.usage;
  }
  const loaded = io.readCase(path);
  if (!loaded.ok) {
    io.err(`${path}: the case file has errors; no findings were evaluated.`);
    io.err(formatIssues(loaded.issues));
    return exitCodes.invalidInput;
  }
  const problems: string[] = [];
  for (const flag of Object.keys(args.options)) if (flag !== '--as-of') problems.push(`${flag}: not an option of findings (--as-of, --json).`);
  for (const flag of args.missingValues) problems.push(`${flag}: a value is missing after the flag.`);
  const asOf = args.options['--as-of'] ?? loaded.value.review.reviewDate ?? io.today();
  if (!isIsoDate(asOf)) problems.push(`--as-of: "${asOf}" is not a calendar date written YYYY-MM-DD.`);
  if (problems.length > 0) {
    io.err(problems.join('\n'));
    return exitCodes.invalidInput;
  }
  const computed = computeCase(loaded.value, asOf);
  if (!computed.ok) {
    io.err(formatIssues(computed.issues));
    return exitCodes.invalidInput;
  }
  const findings = evaluateFindings(loaded.value, computed.value, asOf);
  if (!findings.ok) {
    io.err(formatIssues(findings.issues));
    return exitCodes.invalidInput;
  }
  if (args.switches.has('--json')) {
    io.out(JSON.stringify({ caution: decisionSupportCaution, asOf, patient: loaded.value.patient.label, findings: findings.value }, null, 2));
    return exitCodes.ok;
  }
  const count = (severity: Finding['severity']) => findings.value.filter((it) => it.severity === severity).length;
  io.out(`Safety findings for ${loaded.value.patient.label} as of ${asOf}: ${count('urgent')} urgent, ${count('review')} for review, ${count('information')} for information`);
  io.out(`  ${decisionSupportCaution}`);
  io.out('');
  io.out(formatFindings(findings.value, '  '));
  return exitCodes.ok;
}
