import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { caseSchemaAt } from '../../../core/model/caseFile';
import { migrateCase } from '../../../core/model/migrate';
import { bothLevelSchema, casesBeforeCompiling, parseCase } from '../../../core/model/parseCase';
import { readDemo, remove, withChange } from './caseFixtures';

// After its first few cases parseCase reads with the 'both'-level schema compiled by zod's own
// z.compile (zod.dev/compile: "identical results and identical errors"; on any issue the compiled
// schema hands the input back to the runtime parser). The reference here is zod's runtime parser,
// on a schema built afresh by caseSchemaAt so nothing is shared with the compiled one: every
// safeParse result must be equal, value for value and issue for issue (messages, paths, codes,
// params, inputs). No tolerance: a difference would change what a case file is read as. The
// inputs are the demo cases and fast-check's changes to them, seeded so a failure repeats.
const runtimeBoth = caseSchemaAt('both');
const demos = { 'th-0417': readDemo('th-0417'), 'th-0093': readDemo('th-0093') } as const;

const migrated = (json: unknown): unknown => {
  const result = migrateCase(json);
  return result.ok ? result.value : json;
};

/** The schema parseCase reads with once past its first cases: the compiled one, where this runtime allows it. */
function compiledInUse(): z.ZodType {
  for (let k = 0; k <= casesBeforeCompiling; k += 1) parseCase(demos['th-0093']);
  return bothLevelSchema();
}

const numberLike = fc.oneof(
  fc.double({ min: -50, max: 5000, noNaN: true }),
  fc.integer({ min: -10, max: 400 }),
  fc.constantFrom(0, 0.62, 1.5, 60, 101, 250, 1e9, -1, Number.NaN, null, '60', remove),
);

describe('the compiled case schema reads as zod’s runtime parser reads', () => {
  it('is in use in Node once a few cases have been read (Node allows generated code)', () => {
    expect(z.util.allowsEval.value).toBe(true);
    const schema = compiledInUse();
    expect(schema).not.toBe(runtimeBoth);
    // zod's compiled clone keeps the runtime parser it falls back to.
    expect((schema as unknown as { _zod: { bag: { fallbackRun?: unknown } } })._zod.bag.fallbackRun).toBeTypeOf('function');
  });

  for (const [name, demo] of Object.entries(demos)) {
    it(`${name}: as it is, and with up to three values changed or removed`, () => {
      const schema = compiledInUse();
      const input = migrated(demo);
      expect(schema.safeParse(input, { reportInput: true })).toEqual(runtimeBoth.safeParse(input, { reportInput: true }));
      const paths: (string | number)[][] = [];
      const walk = (node: unknown, path: (string | number)[]) => {
        if (path.length > 0) paths.push(path);
        if (Array.isArray(node)) node.slice(0, 3).forEach((item, index) => walk(item, [...path, index]));
        else if (typeof node === 'object' && node !== null) for (const [key, value] of Object.entries(node)) walk(value, [...path, key]);
      };
      walk(demo, []);
      fc.assert(
        fc.property(fc.array(fc.tuple(fc.constantFrom(...paths), fc.oneof(numberLike, fc.jsonValue())), { minLength: 1, maxLength: 3 }), (changes) => {
          // A later change inside a value an earlier one replaced has nowhere to go: that draw is skipped.
          let changed: unknown = demo;
          try {
            for (const [path, value] of changes) changed = withChange(changed, path, value);
          } catch {
            fc.pre(false);
          }
          changed = migrated(changed);
          expect(schema.safeParse(changed, { reportInput: true })).toEqual(runtimeBoth.safeParse(changed, { reportInput: true }));
        }),
        { seed: 1604, numRuns: 300 },
      );
    }, 120_000);
  }
});
