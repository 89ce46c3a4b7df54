import { derivationsOf } from '../../core/report/derivationIndex';
import type { ParsedArgs } from './args';
import { reviewCase, type CaseIo } from './caseReview';
import { decisionSupportCaution } from './format';
import { formatDerivation } from './formatDerivation';
import { exitCodes } from './io';

export const explainUsage = 'Usage: chelation-ledger explain <case.json> [<result>] [--as-of YYYY-MM-DD] [--json]';

/** `explain <case.json> [<result>]`: the derivation tree of one result, or the list of results that can be explained. */
export function explainCommand(args: ParsedArgs, io: CaseIo): number {
  const review = reviewCase(args, io, { command: 'explain', usage: explainUsage, extraPositionals: 1 });
  if (typeof review === 'number') return review;
  const resultId = args.positionals[1];
  const named = derivationsOf(review.results, review.findings);
  const label = review.caseFile.patient.label;
  if (resultId === undefined) {
    io.out([`Results of ${label} on ${review.asOf} that can be explained:`, ...named.map((it) => `  ${it.id}  ${it.label}`)].join('\n'));
    return exitCodes.ok;
  }
  const found = named.find((it) => it.id === resultId);
  if (!found) {
    io.err(`No result "${resultId}" for this case. Results: ${named.map((it) => it.id).join(', ')}.`);
    return exitCodes.invalidInput;
  }
  if (args.switches.has('--json')) {
    io.out(JSON.stringify({ id: found.id, label: found.label, asOf: review.asOf, derivation: found.derivation, caution: decisionSupportCaution }, null, 2));
  } else {
    io.out([`${found.label} — ${label}, ${review.asOf}`, formatDerivation(found.derivation, 1), `  ${decisionSupportCaution}`].join('\n'));
  }
  return exitCodes.ok;
}
