import { computeCase } from '../../core/ledger/computeCase';
import { derivationsOf } from '../../core/report/derivationIndex';
import { evaluateFindings } from '../../core/safety';
import { isIsoDate } from '../../core/dates/isoDate';
import { formatIssues } from '../../core/result';
import type { ParsedArgs } from './args';
import type { CaseIo } from './caseCommands';
import { decisionSupportCaution } from './format';
import { formatDerivation } from './formatDerivation';
import { exitCodes } from './io';

export const explainUsage = 'Usage: chelation-ledger explain <case.json> [<result>] [--as-of YYYY-MM-DD] [--json]';

/** `explain <case.json> [<result>]`: the derivation tree of one result, or the list of results that can be explained. */
export function explainCommand(args: ParsedArgs, io: CaseIo): number {
  const [path, resultId] = args.positionals;
  if (path === undefined) {
    io.err(explainUsage);
    return exitCodes.usage;
  }
  const loaded = io.readCase(path);
  if (!loaded.ok) {
    io.err(`${path}: the case file has errors; nothing was computed.`);
    io.err(formatIssues(loaded.issues));
    return exitCodes.invalidInput;
  }
  const asOf = args.options['--as-of'] ?? loaded.value.review.reviewDate ?? io.today();
  if (!isIsoDate(asOf)) {
    io.err(`--as-of: "${asOf}" is not a calendar date written YYYY-MM-DD.`);
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
  const named = derivationsOf(computed.value, findings.value);
  if (resultId === undefined) {
    io.out([`Results of ${loaded.value.patient.label} on ${asOf} that can be explained:`, ...named.map((it) => `  ${it.id}  ${it.label}`)].join('\n'));
    return exitCodes.ok;
  }
  const found = named.find((it) => it.id === resultId);
  if (!found) {
    io.err(`No result "${resultId}" for this case. Results: ${named.map((it) => it.id).join(', ')}.`);
    return exitCodes.invalidInput;
  }
  if (args.switches.has('--json')) {
    io.out(JSON.stringify({ id: found.id, label: found.label, asOf, derivation: found.derivation, caution: decisionSupportCaution }, null, 2));
  } else {
    io.out([`${found.label} — ${loaded.value.patient.label}, ${asOf}`, formatDerivation(found.derivation, 1), `  ${decisionSupportCaution}`].join('\n'));
  }
  return exitCodes.ok;
}
