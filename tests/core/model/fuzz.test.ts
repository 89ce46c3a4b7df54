import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parseCase, pathText } from '../../../core/model';
import { issueCodes, type Issue } from '../../../core/result';
import { readDemo, withChange } from './caseFixtures';

// Property: whatever JSON arrives (a corrupt file, another tool's file, a
// hand edit), parseCase answers with a Result and never throws, and every
// issue it gives is well formed: a code from the closed set, and a message
// that starts with the field it is about (style.md, habit 8). The generator
// is fast-check's, an outside library; seeds are fixed so a failure repeats.

function expectWellFormed(issues: readonly Issue[]): void {
  for (const found of issues) {
    expect(issueCodes).toContain(found.code);
    expect(['error', 'warning']).toContain(found.severity);
    expect(found.message.startsWith(pathText(found.path))).toBe(true);
    expect(found.message.length).toBeGreaterThan(pathText(found.path).length + 5);
  }
}

function check(json: unknown): void {
  const result = parseCase(json);
  if (result.ok) expectWellFormed(result.warnings ?? []);
  else {
    expect(result.issues.length).toBeGreaterThan(0);
    expectWellFormed(result.issues);
  }
}

// Each run parses a whole case twice; on the shared two-core machine 600 runs
// can pass vitest's 5 s default, so these tests get a 60 s limit. It only
// bounds a hang; nothing here measures speed.
const fuzzTimeoutMs = 60_000;

describe('parseCase on arbitrary input', () => {
  it('never throws on any value fast-check can make', () => {
    fc.assert(fc.property(fc.anything({ withNullPrototype: true, withObjectString: true }), check), { seed: 417, numRuns: 500 });
  }, fuzzTimeoutMs);

  it('never throws on JSON values carrying the case-file header', () => {
    const header = fc.record({ format: fc.constant('chelation-ledger.case'), version: fc.constant(1) });
    const body = fc.dictionary(
      fc.constantFrom('patient', 'transfusions', 'results', 'chelationPeriods', 'coMedications', 'assumptionOverrides', 'proposedRegimens', 'review', '__proto__'),
      fc.jsonValue(),
    );
    fc.assert(fc.property(header, body, (head, rest) => check({ ...rest, ...head })), { seed: 93, numRuns: 300 });
  }, fuzzTimeoutMs);

  it('never throws when any one value inside a real case file is replaced by random JSON', () => {
    const demo = readDemo('th-0417');
    // Every path to a value in the demo, so each field gets its turn.
    const paths: (string | number)[][] = [];
    const walk = (node: unknown, path: (string | number)[]) => {
      paths.push(path);
      if (Array.isArray(node)) node.slice(0, 3).forEach((item, index) => walk(item, [...path, index]));
      else if (typeof node === 'object' && node !== null) for (const [key, value] of Object.entries(node)) walk(value, [...path, key]);
    };
    walk(demo, []);
    const leafPaths = paths.filter((path) => path.length > 0);
    fc.assert(
      fc.property(fc.constantFrom(...leafPaths), fc.jsonValue(), (path, value) => check(withChange(demo, path, value))),
      { seed: 2026, numRuns: 600 },
    );
  }, fuzzTimeoutMs);
});
