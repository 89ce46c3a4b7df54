/**
 * Expected failures are values, bugs are thrown (style.md habit 8).
 *
 * An {@link Issue} is data: a code from a closed set, a path into the input,
 * and a sentence a pharmacist can act on (field, value, plausible range).
 * Presentation is built from issues by separate functions.
 */

/** The closed set of issue codes. Add a code here before using it anywhere. */
export const issueCodes = [
  'required',
  'not_a_number',
  'out_of_range',
  'not_an_integer',
  'unknown_choice',
  'unknown_calculator',
  'unknown_option',
  'wrong_basis',
  'field_strength_mismatch',
  'invalid_date',
  'invalid_file',
  'unsupported_version',
  'inconsistent',
  'not_applicable',
  /** An iterative method (the chemistry speciation solver) stopped without meeting its convergence test. */
  'not_converged',
  /** A file could not be written (disk full, read-only folder, locked file); nothing was written over the old file. */
  'write_failed',
  /** A file changed on disk since it was opened (another window or machine): a save would overwrite it. */
  'changed_on_disk',
  /** A file of that name exists already and is not replaced. */
  'already_exists',
  /** A host call whose service this build does not have yet, or that this host cannot do (a folder dialog in the browser preview). */
  'not_available',
  /** A host call refused before it ran: an unknown sender, a missing or wrong token. */
  'forbidden',
  /** A host service failed unexpectedly; the message names the call, never a stack trace. */
  'host_failed',
  /** Long work (an import) stopped because the user cancelled it; the message says what was and was not done. */
  'cancelled',
] as const;

export type IssueCode = (typeof issueCodes)[number];

export interface Issue {
  readonly code: IssueCode;
  /** Path into the input, e.g. ['transfusions', 3, 'volumeMl'] or ['volumeMl']. */
  readonly path: readonly (string | number)[];
  /** A full sentence naming the field, the value and the plausible range. */
  readonly message: string;
  /** 'error' refuses the input; 'warning' keeps it but tells the user. */
  readonly severity: 'error' | 'warning';
}

export type Result<T> =
  | { readonly ok: true; readonly value: T; readonly warnings?: readonly Issue[] }
  | { readonly ok: false; readonly issues: readonly Issue[] };

export function ok<T>(value: T, warnings?: readonly Issue[]): Result<T> {
  return warnings && warnings.length > 0 ? { ok: true, value, warnings } : { ok: true, value };
}

export function fail<T = never>(...issues: readonly Issue[]): Result<T> {
  return { ok: false, issues };
}

export function issue(
  code: IssueCode,
  path: readonly (string | number)[],
  message: string,
  severity: 'error' | 'warning' = 'error',
): Issue {
  return { code, path, message, severity };
}

/** One line per issue, `path: message`, for command-line and log output. */
export function formatIssues(issues: readonly Issue[]): string {
  return issues
    .map((it) => {
      const where = it.path.length > 0 ? `${it.path.join('.')}: ` : '';
      const tag = it.severity === 'warning' ? 'warning: ' : '';
      return `${tag}${where}${it.message}`;
    })
    .join('\n');
}
