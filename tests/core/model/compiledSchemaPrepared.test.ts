import { describe, expect, it } from 'vitest';
import { caseSchemas } from '../../../core/model/caseFile';
import { bothLevelSchema, casesBeforeCompiling, parseCase, prepareToReadManyCases } from '../../../core/model/parseCase';
import { readDemo } from './caseFixtures';

// A file of its own, so this module state (nothing read yet) is the process's first: the workspace
// review says it reads many cases before the first, and its first case is then read with the schema
// zod compiled (tests/core/model/compiledSchema.test.ts holds that schema to zod's runtime parser).
describe('prepareToReadManyCases', () => {
  it('has the first case read with the compiled schema, and reads it as before', () => {
    expect(casesBeforeCompiling).toBeGreaterThan(0);
    prepareToReadManyCases();
    const schema = bothLevelSchema();
    expect(schema).not.toBe(caseSchemas.both);
    expect((schema as unknown as { _zod: { bag: { fallbackRun?: unknown } } })._zod.bag.fallbackRun).toBeTypeOf('function');
    const demo = readDemo('th-0417');
    const parsed = parseCase(demo);
    expect(parsed.ok).toBe(true);
    // zod's runtime parser on the same input, at the same level, as parseCase reads it.
    const runtime = caseSchemas.both.safeParse(demo, { reportInput: true });
    expect(runtime.success).toBe(true);
    if (parsed.ok && runtime.success) expect(parsed.value).toEqual(runtime.data);
  });
});
