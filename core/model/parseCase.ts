import { fail, ok, type Result } from '../result';
import { caseSchemas, type Case } from './caseFile';
import { consistencyIssues } from './consistency';
import { migrateCase } from './migrate';
import { issuesFromZod } from './zodIssues';

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

  const refused = caseSchemas.refuse.safeParse(migrated.value, { reportInput: true });
  if (!refused.success) return fail(...issuesFromZod(refused.error.issues, 'error'));

  const theCase: Case = refused.data;
  const crossField = consistencyIssues(theCase);
  const errors = crossField.filter((it) => it.severity === 'error');
  if (errors.length > 0) return fail(...errors);

  // The same structure at the plausibility level: its issues are only range warnings.
  const screened = caseSchemas.warn.safeParse(migrated.value, { reportInput: true });
  const rangeWarnings = screened.success ? [] : issuesFromZod(screened.error.issues, 'warning');
  return ok(theCase, [...rangeWarnings, ...crossField.filter((it) => it.severity === 'warning')]);
}
