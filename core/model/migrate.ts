import { fail, issue, ok, type Result } from '../result';
import { caseFileFormat, currentCaseFileVersion } from './caseFile';
import { describeValue } from './zodIssues';

/**
 * One step forward: takes a file of version n (already checked for format and
 * version) and returns a new object of version n + 1. It must not change its
 * input.
 */
type Migration = (older: Readonly<Record<string, unknown>>) => Record<string, unknown>;

/**
 * Version 1 → 2. Everything version 1 holds means the same in version 2
 * except the co-medications: version 1 knew only ascorbic acid, recorded as
 * `substance: 'ascorbic-acid'`; version 2 records any drug by its generic name,
 * so the substance becomes `name: 'ascorbic acid'`. The new lists (dispensings,
 * clinical state) start empty by the schema's defaults. Pure: a new object.
 */
function fromVersion1(older: Readonly<Record<string, unknown>>): Record<string, unknown> {
  const coMedications = Array.isArray(older['coMedications'])
    ? older['coMedications'].map((entry: unknown) => {
        if (!isPlainObject(entry) || !('substance' in entry)) return entry;
        const { substance, ...rest } = entry;
        return substance === 'ascorbic-acid' ? { ...rest, name: 'ascorbic acid' } : { ...rest, name: substance };
      })
    : older['coMedications'];
  return { ...older, version: 2, ...(coMedications === undefined ? {} : { coMedications }) };
}

/** Keyed by the version a migration starts from. */
const migrations: Readonly<Record<number, Migration>> = { 1: fromVersion1 };

function isPlainObject(value: unknown): value is Readonly<Record<string, unknown>> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

/**
 * Bring a case file read from disk to the current version.
 *
 * Reads `format` and `version`; a current file passes through unchanged (the
 * same object); an older one goes through each migration step in turn; a newer
 * version is refused, so an old copy of the tool never rewrites a newer file.
 * The input is never modified.
 *
 * @param json - anything, typically the output of JSON.parse
 * @returns the file at the current version (not yet validated: parseCase does that), or
 *   'invalid_file' (not a case file) / 'unsupported_version' (a version this code does not know)
 * @example migrateCase({ format: 'chelation-ledger.case', version: 3 }) → fail(unsupported_version)
 * @example migrateCase({ format: 'chelation-ledger.case', version: 1, coMedications: [{ substance: 'ascorbic-acid', … }] }).value.coMedications[0].name === 'ascorbic acid'
 */
export function migrateCase(json: unknown): Result<unknown> {
  if (!isPlainObject(json)) {
    return fail(issue('invalid_file', [], `The case file is ${describeValue(json)}; expected a JSON object with format "${caseFileFormat}".`));
  }
  if (json['format'] !== caseFileFormat) {
    const given = json['format'] === undefined ? 'missing' : JSON.stringify(json['format']);
    return fail(issue('invalid_file', ['format'], `format is ${given}; a chelation-ledger case file has format "${caseFileFormat}".`));
  }
  const version = json['version'];
  if (typeof version !== 'number' || !Number.isInteger(version) || version < 1) {
    const given = version === undefined ? 'missing' : JSON.stringify(version);
    return fail(issue('invalid_file', ['version'], `version is ${given}; expected a whole number from 1 to ${currentCaseFileVersion}.`));
  }
  if (version > currentCaseFileVersion) {
    return fail(
      issue(
        'unsupported_version',
        ['version'],
        `version ${version} is newer than this tool reads (1 to ${currentCaseFileVersion}); open the file with a newer version of chelation-ledger.`,
      ),
    );
  }
  let migrated: Readonly<Record<string, unknown>> = json;
  for (let from = version; from < currentCaseFileVersion; from += 1) {
    const step = migrations[from];
    // A missing step is a bug in this module, not a problem with the file.
    if (!step) throw new Error(`No case-file migration from version ${from}`);
    migrated = step(migrated);
  }
  return ok(migrated);
}
