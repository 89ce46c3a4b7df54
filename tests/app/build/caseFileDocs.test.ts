import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { caseFileDocPath, caseFileJsonSchema, caseFileMarkdown, caseFileSchemaPath } from '../../../app/build/caseFileDocs';
import { parseCase } from '../../../core/model/parseCase';
import { readDemo } from '../../core/model/caseFixtures';

// The documented format is generated from the zod schema; these tests fail
// when the files in docs/ are out of date (run: node scripts/case-file-docs.mjs).
// The JSON Schema is checked against the JSON Schema 2020-12 meta-schema's
// shape as zod's own exporter writes it, and against the demo case files.
const root = new URL('../../../', import.meta.url);
const demos = () => ['th-0417', 'th-0093'].map((name) => {
  const parsed = parseCase(readDemo(name as 'th-0417'));
  if (!parsed.ok) throw new Error('demo case does not parse');
  return JSON.parse(JSON.stringify(parsed.value)) as Record<string, unknown>;
});

describe('case-file documentation', () => {
  it(`${caseFileSchemaPath} is zod's current export of the case-file schema`, () => {
    const onDisk = JSON.parse(readFileSync(new URL(caseFileSchemaPath, root), 'utf8'));
    expect(onDisk).toEqual(caseFileJsonSchema());
    expect(onDisk.$schema).toBe('https://json-schema.org/draft/2020-12/schema');
  });

  it(`${caseFileDocPath} is generated from the schema and is up to date`, () => {
    expect(readFileSync(new URL(caseFileDocPath, root), 'utf8')).toBe(caseFileMarkdown(caseFileJsonSchema(), demos()));
  });

  it('documents every top-level field and every transfusion and result kind, with ranges and units', () => {
    const page = caseFileMarkdown(caseFileJsonSchema(), demos());
    const schema = caseFileJsonSchema() as { properties: Record<string, unknown> };
    for (const key of Object.keys(schema.properties)) expect(page).toContain(`\`${key}\``);
    for (const kind of ['simple', 'exchange', 'venesection', 'ferritin', 'liver-iron', 'cardiac-t2star', 'creatinine']) expect(page).toContain(`kind \`${kind}\``);
    expect(page).toMatch(/`unitHaematocrit` \| yes \| a fraction of 1; plausible 0\.40–0\.85.* or `null`/);
    expect(page).toContain('plausible 10–2000 mL');
    expect(page).toContain('```json');
  });
});
