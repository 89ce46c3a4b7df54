import { z } from 'zod';
import { fail, ok, type Issue, type Result } from '../result';
import { isWarningIssue } from './bounds';
import { caseSchemas, type Case } from './caseFile';
import { consistencyIssues } from './consistency';
import { migrateCase } from './migrate';
import { issuesFromZod } from './zodIssues';

/**
 * Cases read with the runtime schema before the 'both' level is compiled
 * (zod's z.compile: "same issues and error messages", zod.dev/compile). The
 * compiled schema validates a valid case several times faster and, on any
 * issue, hands the case back to the runtime parser, so the result is the same
 * either way (tests/core/model/compiledSchema.test.ts compares them). Compiling
 * costs about as much as reading two or three cases, so a command that reads
 * one case never pays it and a workspace of a thousand pays it once: a
 * modelling choice of ours. Where code may not be generated at run time (a
 * page whose Content-Security-Policy forbids it), zod says so and the runtime
 * schema is kept.
 */
export const casesBeforeCompiling = 3;

let casesRead = 0;
let compiledBoth: typeof caseSchemas.both | null = null;

/** The 'both'-level schema: the runtime one for the first cases read in this process, then the compiled one. */
export function bothLevelSchema(): typeof caseSchemas.both {
  if (compiledBoth !== null) return compiledBoth;
  casesRead += 1;
  if (casesRead <= casesBeforeCompiling) return caseSchemas.both;
  return compiledSchemaOrRuntime();
}

/**
 * For a host about to read a whole workspace (the panel): the schema is compiled
 * now, so even its first cases are read with it. Reading them with the runtime
 * schema would also have V8 optimize the runtime parser's code, which the rest
 * of the workspace never runs (measured on 1,000 cases, 10 interleaved runs:
 * median 2.20 s with three cases read first, 2.05 s compiled before the first).
 */
export function prepareToReadManyCases(): void {
  if (compiledBoth === null) compiledSchemaOrRuntime();
}

function compiledSchemaOrRuntime(): typeof caseSchemas.both {
  if (!z.util.allowsEval.value) return caseSchemas.both;
  compiledBoth ??= z.compile(caseSchemas.both);
  return compiledBoth;
}

/**
 * Read a case file: migrate it to the current version, validate it, and
 * return the case with its warnings, or every problem found.
 *
 * Refused ('error'): not a case file, a newer version, wrong structure, an
 * impossible value (a negative volume, a haematocrit above 1), a date that is
 * not a calendar date, an unknown assumption, inconsistent entries (a period
 * ending before it starts). Kept with a warning: a value outside its
 * plausible range (a weight above 200 kg, a ferritin above 20 000 µg/L), an
 * event after the review date, a label that looks like a name. Every message
 * names the field, the value and the plausible range.
 *
 * Never throws for any input, never changes its input; values keep the units
 * the user entered.
 *
 * @param json - anything, typically the output of JSON.parse on a case file
 * @returns the case (defaults filled in: empty lists, adherence 1) with warnings, or the issues
 * @example parseCase(JSON.parse(readFileSync('assets/demo/th-0417.json', 'utf8'))).ok === true
 */
export function parseCase(json: unknown): Result<Case> {
  const migrated = migrateCase(json);
  if (!migrated.ok) return migrated;

  // One pass at the 'both' level finds the refusals and the range warnings (bounds.ts says why they are
  // exactly those of a 'refuse' pass and a 'warn' pass); most cases have neither, and are read once.
  const checked = bothLevelSchema().safeParse(migrated.value, { reportInput: true });
  let theCase: Case;
  let rangeWarnings: Issue[] = [];
  if (checked.success) {
    theCase = checked.data;
  } else {
    const refusals = checked.error.issues.filter((it) => !isWarningIssue(it));
    if (refusals.length > 0) return fail(...issuesFromZod(refusals, 'error'));
    rangeWarnings = issuesFromZod(checked.error.issues, 'warning');
    // Only warnings: zod gives no value with issues, so the value comes from the refusing level, which passes.
    const refused = caseSchemas.refuse.safeParse(migrated.value, { reportInput: true });
    if (!refused.success) return fail(...issuesFromZod(refused.error.issues, 'error'));
    theCase = refused.data;
  }

  const crossField = consistencyIssues(theCase);
  const errors = crossField.filter((it) => it.severity === 'error');
  if (errors.length > 0) return fail(...errors);
  return ok(theCase, [...rangeWarnings, ...crossField.filter((it) => it.severity === 'warning')]);
}
