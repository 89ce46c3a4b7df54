import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import fc from 'fast-check';
import { afterAll, describe, expect, it } from 'vitest';
import { openCaseStore } from '../../../app/host/caseStore';
import { readCsvImport } from '../../../app/host/imports/csvImport';
import { readFhirImport } from '../../../app/host/imports/fhirImport';
import type { ImportPlan } from '../../../app/host/imports/importPlan';
import { issueCodes, type Result } from '../../../core/result';
import { readDemo } from '../../core/model/caseFixtures';

// Property: whatever arrives (a cut or corrupted case file, a CSV export from
// another system, a FHIR bundle with odd resources), the store and the
// importers answer with a Result and never throw, and every rejection says
// where (a file, a line, a bundle entry). Inputs are fast-check's (an outside
// generator); seeds are fixed so a failure repeats. The timeouts only bound a
// hang on a shared machine; nothing here measures speed.
const timeoutMs = 120_000;

function expectPlanWellFormed(result: Result<ImportPlan>, where: RegExp): void {
  if (!result.ok) {
    expect(result.issues.length).toBeGreaterThan(0);
    for (const found of result.issues) {
      expect(issueCodes).toContain(found.code);
      expect(found.message.length).toBeGreaterThan(10);
      expect(found.message).not.toMatch(/\n\s+at /);
    }
    return;
  }
  for (const row of result.value.rejected) {
    expect(row.where).toMatch(where);
    expect(row.reason.length).toBeGreaterThan(5);
  }
  for (const entry of result.value.entries) expect(entry.where).toMatch(where);
  for (const unknown of result.value.unknownCodes) expect(unknown.where).toMatch(where);
}

const folder = mkdtempSync(join(tmpdir(), 'store-fuzz-'));
afterAll(() => rmSync(folder, { recursive: true, force: true }));

describe('case store on malformed case files', () => {
  const demoText = JSON.stringify(readDemo('th-0093'), null, 2);
  it('opens or refuses, naming the file, for 400 cut, spliced or random files', async () => {
    const store = openCaseStore(folder);
    const mangled = fc.oneof(
      fc.nat({ max: demoText.length }).map((cut) => demoText.slice(0, cut)),
      fc.tuple(fc.nat({ max: demoText.length }), fc.string({ maxLength: 8 })).map(([at, junk]) => demoText.slice(0, at) + junk + demoText.slice(at)),
      fc.string({ maxLength: 200 }),
      fc.jsonValue().map((value) => JSON.stringify(value)),
    );
    await fc.assert(
      fc.asyncProperty(mangled, async (text) => {
        writeFileSync(join(folder, 'fuzz.json'), text);
        const opened = await store.open('fuzz.json');
        if (opened.ok) return;
        expect(opened.issues.length).toBeGreaterThan(0);
        for (const found of opened.issues) expect(issueCodes).toContain(found.code);
        // A failure of the file as a whole names it; a field's issue starts with the field (core/model).
        const first = opened.issues[0]!;
        if (first.path.length === 0 && first.code === 'invalid_file') expect(first.message).toMatch(/fuzz\.json|case file/i);
      }),
      { seed: 12, numRuns: 400 },
    );
  }, timeoutMs);
});

describe('CSV import on arbitrary text', () => {
  const cellText = fc.oneof(
    fc.string({ maxLength: 12 }),
    fc.constantFrom('2026-01-05', '05/01/2026', '13/01/2026', '01/13/2026', '560', '0.6', '60', 'ferritin', 'creatinine', 'ug/L', 'mg/L', 'umol/L', '"', '""', ',', '\n', ''),
  );
  const csvLike = fc
    .tuple(
      fc.constantFrom('date,volume,haematocrit,units', 'date,test,value,unit', 'Date,Volume (L),Hct (%),Units', 'a,b,c', ''),
      fc.array(fc.array(cellText, { maxLength: 6 }), { maxLength: 12 }),
    )
    .map(([header, rows]) => [header, ...rows.map((row) => row.join(','))].join('\n'));
  it('never throws, and every rejected row names its line, on 2,000 CSV-like files', () => {
    fc.assert(fc.property(csvLike, (text) => expectPlanWellFormed(readCsvImport(text, null), /^line \d+$/)), { seed: 7, numRuns: 2000 });
  }, timeoutMs);
  it('never throws on 1,000 arbitrary strings', () => {
    fc.assert(fc.property(fc.string({ maxLength: 400 }), (text) => expectPlanWellFormed(readCsvImport(text, null), /^line \d+$/)), { seed: 8, numRuns: 1000 });
  }, timeoutMs);
});

describe('FHIR import on arbitrary JSON', () => {
  const coding = fc.record({ system: fc.constantFrom('http://loinc.org', 'http://snomed.info/sct', 'x'), code: fc.constantFrom('2276-4', '718-7', '2160-0', '29463-7', '116863004', '15074-8', '') });
  const quantity = fc.record({ value: fc.oneof(fc.double(), fc.integer()), unit: fc.constantFrom('ug/L', 'mg/dL', '[lb_av]', 'L', 'furlong'), system: fc.constantFrom('http://unitsofmeasure.org', 'x'), code: fc.constantFrom('ug/L', 'mg/dL', '[lb_av]', 'L', 'mL', 'nonsense') }, { requiredKeys: [] });
  const resource = fc.oneof(
    fc.record({ resourceType: fc.constant('Observation'), id: fc.string({ maxLength: 5 }), status: fc.constantFrom('final', 'preliminary', 'cancelled'), code: fc.record({ coding: fc.array(coding, { maxLength: 3 }) }), effectiveDateTime: fc.constantFrom('2026-01-05', '2026-13-40', 'yesterday'), valueQuantity: quantity }, { requiredKeys: ['resourceType'] }),
    fc.record({ resourceType: fc.constant('Procedure'), status: fc.constantFrom('completed', 'in-progress'), code: fc.record({ coding: fc.array(coding, { maxLength: 2 }) }), performedDateTime: fc.constantFrom('2026-01-05T10:00:00Z', ''), extension: fc.array(fc.record({ url: fc.constant('x'), valueQuantity: quantity }), { maxLength: 2 }) }, { requiredKeys: ['resourceType'] }),
    fc.record({ resourceType: fc.constant('Patient'), birthDate: fc.string({ maxLength: 12 }), gender: fc.constantFrom('female', 'male', 'other', 'unknown') }, { requiredKeys: ['resourceType'] }),
    fc.anything(),
  );
  it('never throws, and every entry, rejection and unknown code names its bundle entry, on 2,000 bundles', () => {
    fc.assert(
      fc.property(fc.array(resource, { maxLength: 8 }), (resources) =>
        expectPlanWellFormed(readFhirImport({ resourceType: 'Bundle', entry: resources.map((it) => ({ resource: it })) }, null), /^entry\[\d+\]/),
      ),
      { seed: 9, numRuns: 2000 },
    );
  }, timeoutMs);
  it('never throws on 1,000 arbitrary JSON values', () => {
    fc.assert(fc.property(fc.jsonValue(), (json) => expectPlanWellFormed(readFhirImport(json, null), /^entry\[\d+\]/)), { seed: 10, numRuns: 1000 });
  }, timeoutMs);
});
