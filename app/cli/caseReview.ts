import { isIsoDate } from '../../core/dates/isoDate';
import { parseDecimal } from '../../core/numbers/parseDecimal';
import { computeCase, type CaseResults, type ComputeOptions } from '../../core/ledger/computeCase';
import { projectionModels, type ProjectionModel } from '../../core/ledger/removalModel';
import type { Case } from '../../core/model/caseFile';
import { formatIssues, type Issue, type Result } from '../../core/result';
import { evaluateFindings, type Finding } from '../../core/safety';
import type { ParsedArgs } from './args';
import { exitCodes, type CliIo } from './io';

export interface CaseIo extends CliIo {
  readonly readCase: (path: string) => Result<Case>;
  /** Today's date 'YYYY-MM-DD', the default review date when the case has none. */
  readonly today: () => string;
}

export interface CaseReview {
  readonly caseFile: Case;
  readonly warnings: readonly Issue[];
  readonly asOf: string;
  readonly results: CaseResults;
  readonly findings: readonly Finding[];
}

/** Options every review command takes, beyond `--as-of`: their flags and ranges. */
export interface ReviewOptions {
  readonly command: string;
  /** Positionals the command takes after the case path (e.g. explain's result id). */
  readonly extraPositionals?: number;
  /** Whole-number options with their accepted range, passed to computeCase. */
  readonly integerOptions?: Readonly<Record<string, { readonly min: number; readonly max: number; readonly key: keyof ComputeOptions }>>;
  readonly usage: string;
}

/** Where a command's review date came from, to name it in a message: the flag, the case's review date, or today. */
export function asOfSource(args: ParsedArgs, caseFile: Case): string {
  if (args.options['--as-of'] !== undefined) return '--as-of';
  return caseFile.review.reviewDate !== null ? 'review.reviewDate' : 'review date (today)';
}

/**
 * The shared path of `compute`, `explain` and `findings`: read the case,
 * check the options (review date, horizon, seed), compute the review and
 * evaluate the findings. Returns the review, or the exit code after saying
 * what was wrong (the field or flag, the value and the accepted range).
 */
export function reviewCase(args: ParsedArgs, io: CaseIo, options: ReviewOptions): CaseReview | number {
  const path = args.positionals[0];
  if (path === undefined || args.positionals.length > 1 + (options.extraPositionals ?? 0)) {
    io.err(options.usage);
    return exitCodes.usage;
  }
  const loaded = io.readCase(path);
  if (!loaded.ok) {
    io.err(`${path}: the case file has errors; nothing was computed.`);
    io.err(formatIssues(loaded.issues));
    return exitCodes.invalidInput;
  }
  const integerOptions = options.integerOptions ?? {};
  const known = ['--as-of', '--model', ...Object.keys(integerOptions)];
  const problems: string[] = [];
  for (const flag of Object.keys(args.options)) {
    if (!known.includes(flag)) problems.push(`${flag}: not an option of ${options.command} (${[...known, '--json'].join(', ')}).`);
  }
  for (const flag of args.missingValues) problems.push(`${flag}: a value is missing after the flag.`);
  for (const flag of args.switches) if (flag !== '--json' && flag !== '--help') problems.push(`${flag}: not an option of ${options.command}.`);
  const asOf = args.options['--as-of'] ?? loaded.value.review.reviewDate ?? io.today();
  if (!isIsoDate(asOf)) problems.push(`--as-of: "${asOf}" is not a calendar date written YYYY-MM-DD.`);
  const computeOptions: Record<string, number> = {};
  for (const [flag, { min, max, key }] of Object.entries(integerOptions)) {
    const raw = args.options[flag];
    if (raw === undefined) continue;
    const value = parseDecimal(raw) ?? Number.NaN;
    if (!Number.isInteger(value) || value < min || value > max) problems.push(`${flag}: "${raw}" is not a whole number in ${min}–${max}.`);
    else computeOptions[key] = value;
  }
  const model = args.options['--model'];
  if (model !== undefined && !(projectionModels as readonly string[]).includes(model)) {
    problems.push(`--model: "${model}" is not a projection model (${projectionModels.join(', ')}; default ${projectionModels[0]}).`);
  }
  if (problems.length > 0) {
    io.err(problems.join('\n'));
    return exitCodes.invalidInput;
  }
  const computed = computeCase(loaded.value, asOf, { ...(computeOptions as ComputeOptions), ...(model !== undefined ? { model: model as ProjectionModel } : {}) });
  if (!computed.ok) {
    const asOfFrom = asOfSource(args, loaded.value);
    io.err(formatIssues(computed.issues.map((it) => (it.path[0] === 'asOf' ? { ...it, path: [asOfFrom] } : it))));
    return exitCodes.invalidInput;
  }
  // The local protocol's thresholds recorded in the case apply to every review of it.
  const findings = evaluateFindings(loaded.value, computed.value, asOf, loaded.value.thresholdOverrides);
  if (!findings.ok) {
    io.err(formatIssues(findings.issues));
    return exitCodes.invalidInput;
  }
  return { caseFile: loaded.value, warnings: loaded.warnings ?? [], asOf, results: computed.value, findings: findings.value };
}
