import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { caseSchemaAt, type Case } from '../../../core/model/caseFile';
import { consistencyIssues } from '../../../core/model/consistency';
import { migrateCase } from '../../../core/model/migrate';
import { parseCase } from '../../../core/model/parseCase';
import { issuesFromZod } from '../../../core/model/zodIssues';
import { fail, ok, type Result } from '../../../core/result';
import { readDemo, remove, withChange } from './caseFixtures';

// parseCase reads a case in one zod pass at the 'both' level (core/model/bounds.ts). The reference
// here is zod itself read the way parseCase read it before: a full pass of the refusing schema,
// then a full pass of the plausibility schema, each built by caseSchemaAt from the same field
// declarations. The one-pass reading must give the same Result, issue for issue and in the same
// order (messages, paths, codes, severities), on every input: there is no tolerance, since a
// difference would make validation more or less strict. The inputs are fast-check's, seeded so a
// failure repeats.
const refuseSchema = caseSchemaAt('refuse');
const warnSchema = caseSchemaAt('warn');

function twoPassParse(json: unknown): Result<Case> {
  const migrated = migrateCase(json);
  if (!migrated.ok) return migrated;
  const refused = refuseSchema.safeParse(migrated.value, { reportInput: true });
  if (!refused.success) return fail(...issuesFromZod(refused.error.issues, 'error'));
  const theCase: Case = refused.data;
  const crossField = consistencyIssues(theCase);
  const errors = crossField.filter((it) => it.severity === 'error');
  if (errors.length > 0) return fail(...errors);
  const screened = warnSchema.safeParse(migrated.value, { reportInput: true });
  const rangeWarnings = screened.success ? [] : issuesFromZod(screened.error.issues, 'warning');
  return ok(theCase, [...rangeWarnings, ...crossField.filter((it) => it.severity === 'warning')]);
}

const fuzzTimeoutMs = 120_000;
type Path = (string | number)[];

/** Every path to a value in a case (the first three entries of each list), numbers apart. */
function pathsOf(json: unknown): { all: Path[]; numbers: Path[] } {
  const all: Path[] = [];
  const numbers: Path[] = [];
  const walk = (node: unknown, path: Path) => {
    if (path.length > 0) all.push(path);
    if (typeof node === 'number') numbers.push(path);
    if (Array.isArray(node)) node.slice(0, 3).forEach((item, index) => walk(item, [...path, index]));
    else if (typeof node === 'object' && node !== null) for (const [key, value] of Object.entries(node)) walk(value, [...path, key]);
  };
  walk(json, []);
  return { all, numbers };
}

// Numbers on both sides of the possible and plausible ranges of every field, whole and not,
// and a few that are not numbers at all.
const numberLike = fc.oneof(
  fc.double({ min: -50, max: 5000, noNaN: true }),
  fc.integer({ min: -10, max: 400 }),
  fc.constantFrom(0, 1, 1.5, 0.3, 0.62, 60, 62, 100, 101, 200, 250, 5000, 1e9, -1, Number.NaN, null, '60', remove),
);

const demos = { 'th-0417': readDemo('th-0417'), 'th-0093': readDemo('th-0093') } as const;

describe('parseCase in one pass gives what the two passes gave', () => {
  for (const [name, demo] of Object.entries(demos)) {
    const { all, numbers } = pathsOf(demo);

    it(`${name}: up to three numbers changed (refusals, warnings, both, and in-range values)`, () => {
      fc.assert(
        fc.property(fc.array(fc.tuple(fc.constantFrom(...numbers), numberLike), { minLength: 1, maxLength: 3 }), (changes) => {
          const changed = changes.reduce<unknown>((json, [path, value]) => withChange(json, path, value), demo);
          expect(parseCase(changed)).toEqual(twoPassParse(changed));
        }),
        { seed: 1602, numRuns: 300 },
      );
    }, fuzzTimeoutMs);

    it(`${name}: any one value replaced by random JSON or removed`, () => {
      fc.assert(
        fc.property(fc.constantFrom(...all), fc.oneof(fc.jsonValue(), fc.constant(remove)), (path, value) => {
          const changed = withChange(demo, path, value);
          expect(parseCase(changed)).toEqual(twoPassParse(changed));
        }),
        { seed: 1603, numRuns: 250 },
      );
    }, fuzzTimeoutMs);
  }

  it('a case with range warnings only keeps its value and every warning', () => {
    // A haematocrit of 0.9 (possible, above the plausible 0.40–0.85) and an ascorbic acid dose of
    // 400 mg (above the plausible 25–250 mg): warnings, not refusals.
    const changed = withChange(withChange(demos['th-0093'], ['transfusions', 0, 'unitHaematocrit'], 0.9), ['coMedications', 0, 'dose', 'value'], 400);
    const parsed = parseCase(changed);
    expect(parsed).toEqual(twoPassParse(changed));
    expect(parsed.ok).toBe(true);
    const warnings = (parsed.ok ? parsed.warnings ?? [] : []).map((it) => it.path.join('.'));
    expect(warnings).toEqual(expect.arrayContaining(['transfusions.0.unitHaematocrit', 'coMedications.0.dose.value']));
  });
});
