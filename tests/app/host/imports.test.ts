import { copyFileSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { readCsvImport } from '../../../app/host/imports/csvImport';
import { readFhirImport } from '../../../app/host/imports/fhirImport';
import { readImportDate } from '../../../app/host/imports/importDates';
import { formatIssues } from '../../../core/result';
import { cli, demoCase, tempDir } from '../cli/harness';

// Outside references:
// - FHIR R4 specification examples, rebuilt here from their published JSON
//   (hl7.org/fhir/R4): Observation/example "Simple Weight Example" (LOINC
//   29463-7, 185 [lb_av], 2016-03-28), Observation/f001 (glucose, LOINC 15074-8,
//   6.3 mmol/L: a code this tool does not read), Patient/example (birth date
//   1974-12-25, gender male; the name is there to show it is never read), and
//   the US Core serum total bilirubin example (LOINC 1975-2, 8.6 mg/dL, 2005-07-07).
// - The international avoirdupois pound, 0.45359237 kg exactly (UCUM [lb_av]
//   = 7000 [gr], [gr] = 64.79891 mg): 185 lb = 83.91458845 kg.
// - ucum-lhc for the other conversions; papaparse's quoting (RFC 4180).
const weightExample = {
  resourceType: 'Observation',
  id: 'example',
  status: 'final',
  category: [{ coding: [{ system: 'http://terminology.hl7.org/CodeSystem/observation-category', code: 'vital-signs', display: 'Vital Signs' }] }],
  code: {
    coding: [
      { system: 'http://loinc.org', code: '29463-7', display: 'Body Weight' },
      { system: 'http://loinc.org', code: '3141-9', display: 'Body weight Measured' },
      { system: 'http://snomed.info/sct', code: '27113001', display: 'Body weight' },
      { system: 'http://acme.org/devices/clinical-codes', code: 'body-weight', display: 'Body Weight' },
    ],
  },
  subject: { reference: 'Patient/example' },
  encounter: { reference: 'Encounter/example' },
  effectiveDateTime: '2016-03-28',
  valueQuantity: { value: 185, unit: 'lbs', system: 'http://unitsofmeasure.org', code: '[lb_av]' },
};
const glucoseF001 = {
  resourceType: 'Observation',
  id: 'f001',
  status: 'final',
  code: { coding: [{ system: 'http://loinc.org', code: '15074-8', display: 'Glucose [Moles/volume] in Blood' }] },
  subject: { reference: 'Patient/f001' },
  effectivePeriod: { start: '2013-04-02T09:30:10+01:00' },
  issued: '2013-04-03T15:30:10+01:00',
  valueQuantity: { value: 6.3, unit: 'mmol/l', system: 'http://unitsofmeasure.org', code: 'mmol/L' },
};
const patientExample = {
  resourceType: 'Patient',
  id: 'example',
  identifier: [{ use: 'usual', system: 'urn:oid:1.2.36.146.595.217.0.1', value: '12345' }],
  name: [{ use: 'official', family: 'Chalmers', given: ['Peter', 'James'] }],
  gender: 'male',
  birthDate: '1974-12-25',
};
const bilirubinUsCore = {
  resourceType: 'Observation',
  id: 'serum-total-bilirubin',
  status: 'final',
  code: { coding: [{ system: 'http://loinc.org', code: '1975-2', display: 'Bilirubin, serum' }], text: 'Bilirubin' },
  effectiveDateTime: '2005-07-07',
  valueQuantity: { value: 8.6, unit: 'mg/dL', system: 'http://unitsofmeasure.org', code: 'mg/dL' },
};
// Our own resource: a red-cell transfusion as R4 records it (Procedure, SNOMED CT 116863004, references.md §8),
// with the volume in an extension (the extension URL is invented for the test).
const transfusionProcedure = {
  resourceType: 'Procedure',
  id: 'tx1',
  status: 'completed',
  code: { coding: [{ system: 'http://snomed.info/sct', code: '116863004', display: 'Transfusion of red blood cells' }] },
  performedDateTime: '2026-10-06T10:00:00Z',
  extension: [{ url: 'http://example.org/fhir/StructureDefinition/transfused-volume', valueQuantity: { value: 0.55, unit: 'L', system: 'http://unitsofmeasure.org', code: 'L' } }],
};
const bundle = (...resources: unknown[]) => ({ resourceType: 'Bundle', type: 'collection', entry: resources.map((resource) => ({ resource })) });

describe('FHIR R4 Bundle import', () => {
  const plan = readFhirImport(bundle(weightExample, glucoseF001, patientExample, bilirubinUsCore, transfusionProcedure), null);
  if (!plan.ok) throw new Error('bundle not read');

  it('converts the specification weight example from [lb_av] to kg through UCUM', () => {
    const weight = plan.value.entries.find((it) => it.list === 'weights')!;
    expect(weight.where).toBe('entry[0] Observation/example');
    expect(weight.entry).toEqual({ date: '2016-03-28', weight: { value: expect.closeTo(185 * 0.45359237, 9), unit: 'kg' } });
  });

  it('lists the glucose example as an unknown code instead of dropping it', () => {
    expect(plan.value.unknownCodes).toEqual([{ where: 'entry[1] Observation/f001', code: 'http://loinc.org|15074-8', display: 'Glucose [Moles/volume] in Blood' }]);
  });

  it('reads the Patient for birth date and sex only', () => {
    expect(plan.value.patient).toEqual({ birthDate: '1974-12-25', sexAtBirth: 'male' });
    expect(JSON.stringify(plan.value)).not.toMatch(/Chalmers|Peter|12345/);
  });

  it('reads the US Core bilirubin example by its LOINC code, and a transfusion Procedure with its volume in mL', () => {
    expect(plan.value.entries.find((it) => it.list === 'results')!.entry).toMatchObject({ date: '2005-07-07', kind: 'bilirubin', measured: { value: 8.6, unit: 'mg/dL' } });
    expect(plan.value.entries.find((it) => it.list === 'transfusions')!.entry).toMatchObject({ date: '2026-10-06', kind: 'simple', volume: { value: 550, unit: 'mL' }, unitHaematocrit: null, unitCount: 1 });
  });

  it('refuses what is not a Bundle, naming where', () => {
    const read = readFhirImport({ resourceType: 'Patient' }, null);
    expect(read.ok).toBe(false);
    expect(!read.ok && read.issues[0]!.message).toContain('not a FHIR Bundle');
  });

  it('rejects a preliminary result with where and why', () => {
    const read = readFhirImport(bundle({ ...bilirubinUsCore, status: 'preliminary' }), null);
    expect(read.ok && read.value.rejected).toEqual([{ where: 'entry[0] Observation/serum-total-bilirubin', reason: 'status "preliminary" (only final, amended or corrected results are imported)' }]);
  });
});

describe('CSV import', () => {
  it('guesses the mapping from the headers and says so; converts litres and percentages through UCUM', () => {
    const csv = 'Date,Volume (L),Hct (%),Units\n2026-01-05,0.56,60,2\n"2026-02-02",0.54,58,2\n';
    const plan = readCsvImport(csv, null);
    expect(plan.ok).toBe(true);
    if (!plan.ok) return;
    expect(plan.value.understood).toContain('date ← column "Date" (guessed)');
    expect(plan.value.entries.map((it) => it.entry)).toEqual([
      { date: '2026-01-05', kind: 'simple', volume: { value: 560, unit: 'mL' }, unitHaematocrit: 0.6, unitCount: 2 },
      { date: '2026-02-02', kind: 'simple', volume: { value: 540, unit: 'mL' }, unitHaematocrit: 0.58, unitCount: 2 },
    ]);
  });

  it('reports ambiguous dates instead of guessing, and reads them with an order', () => {
    const csv = 'date,test,value,unit\n03/04/2026,ferritin,1500,ug/L\n05/06/2026,ferritin,1400,ng/mL\n';
    const plan = readCsvImport(csv, null);
    expect(plan.ok && plan.value.entries).toEqual([]);
    expect(plan.ok && plan.value.rejected.map((it) => it.where)).toEqual(['line 2', 'line 3']);
    expect(plan.ok && plan.value.rejected[0]!.reason).toContain('could be day-first or month-first');
    const dayFirst = readCsvImport(csv, null, { dateOrder: 'day-first' });
    expect(dayFirst.ok && dayFirst.value.entries.map((it) => it.entry['date'])).toEqual(['2026-04-03', '2026-06-05']);
    // One date with a day above 12 settles the order for the file.
    const implied = readCsvImport(`${csv}25/06/2026,ferritin,1300,ug/L\n`, null);
    expect(implied.ok && implied.value.entries.map((it) => it.entry['date'])).toEqual(['2026-04-03', '2026-06-05', '2026-06-25']);
  });

  it('converts creatinine from mg/L to the case unit via UCUM with creatinine molar mass 113.12 g/mol; lists every rejected row by line', () => {
    const csv = 'date,test,value,unit\n2026-01-05,creatinine,7,mg/L\n2026-01-06,glucose,5,mmol/L\n2026-01-07,ferritin,high,ug/L\n2026-01-08,ferritin,1200,furlongs\n';
    const plan = readCsvImport(csv, null);
    if (!plan.ok) throw new Error('not read');
    // 7 mg/L = 0.7 mg/dL (mg/dL is the first unit the case model lists for creatinine).
    expect(plan.value.entries[0]!.entry['measured']).toEqual({ value: 0.7, unit: 'mg/dL' });
    expect(plan.value.rejected.map((it) => it.where)).toEqual(['line 3', 'line 4', 'line 5']);
    expect(plan.value.rejected[2]!.reason).toContain('"furlongs"');
  });

  it('keeps quoted commas and line breaks (papaparse) and counts lines from the file', () => {
    const csv = 'date,volume,haematocrit,units,product\n2026-01-05,560,0.6,2,"red cells, washed\nirradiated"\n2026-01-06,abc,0.6,2,x\n';
    const plan = readCsvImport(csv, null);
    expect(plan.ok && plan.value.entries[0]!.entry['note']).toBe('product: red cells, washed\nirradiated');
    expect(plan.ok && plan.value.rejected).toEqual([{ where: 'line 4', reason: 'column "volume": volume "abc" is not a number' }]);
  });

  it('refuses a haematocrit that looks like a percentage without a % header', () => {
    const plan = readCsvImport('date,volume,haematocrit\n2026-01-05,560,60\n', null);
    expect(plan.ok && plan.value.rejected[0]!.reason).toContain('looks like a percentage');
  });

  it('names where a file-wide problem is once, and names the choice in words, never a command-line flag', () => {
    const noKind = readCsvImport('when,what\n2026-01-01,x\n', null);
    const noColumn = readCsvImport('date,test,value\n2026-01-01,ferritin,1200\n', null);
    const conflict = readCsvImport('date,test,value,unit\n25/03/2026,ferritin,1,ug/L\n03/25/2026,ferritin,1,ug/L\n', null);
    const empty = readCsvImport('', null);
    for (const [read, path] of [[noKind, ['kind']], [noColumn, ['columnMapping', 'unit']], [conflict, ['dateOrder']], [empty, ['line 1']]] as const) {
      if (read.ok) throw new Error('expected a refusal');
      const found = read.issues[0]!;
      expect(found.path).toEqual(path);
      // formatIssues prefixes the path: the message must not repeat it ("line 1: line 1: …").
      expect(formatIssues(read.issues)).not.toMatch(/^(line \d+): \1/);
      expect(found.message).not.toMatch(/--[a-z]/);
    }
    expect(!conflict.ok && conflict.issues[0]!.message).toContain('Choose the date order (day first or month first)');
    const ambiguous = readCsvImport('date,test,value,unit\n03/04/2026,ferritin,1500,ug/L\n', null);
    expect(ambiguous.ok && ambiguous.value.rejected[0]).toMatchObject({ where: 'line 2', choice: 'dateOrder' });
    expect(ambiguous.ok && ambiguous.value.rejected[0]!.reason).toContain('choose the date order (day first or month first)');
    expect(ambiguous.ok && ambiguous.value.rejected[0]!.reason).not.toContain('--');
  });

  it('reads ISO, day-first and month-first dates (calendar checked)', () => {
    expect(readImportDate('2026-02-30', undefined).ok).toBe(false);
    expect(readImportDate('29/02/2024', undefined)).toEqual({ ok: true, date: '2024-02-29' });
    expect(readImportDate('02/29/2024', undefined)).toEqual({ ok: true, date: '2024-02-29' });
  });
});

describe('import command', () => {
  it('shows what would be added on --dry-run and adds nothing; adds it without --dry-run with one journal line', async () => {
    const folder = tempDir();
    const casePath = join(folder, 'th-0417.json');
    copyFileSync(demoCase('th-0417'), casePath);
    const before = readFileSync(casePath, 'utf8');
    const csvPath = join(folder, 'tx.csv');
    writeFileSync(csvPath, 'date,volume,haematocrit,units\n2026-11-25,560,0.6,2\n2026-11-26,-5,0.6,2\n');
    const dry = await cli('import', csvPath, '--into', casePath, '--dry-run');
    expect(dry.code).toBe(0);
    expect(dry.out).toContain('Would add: 1 transfusion(s)');
    expect(dry.out).toMatch(/line 3: column "volume": transfusions\[\d+\]\.volume\.value -5 mL is not possible/);
    expect(readFileSync(casePath, 'utf8')).toBe(before);
    const real = await cli('import', csvPath, '--into', casePath);
    expect(real.code).toBe(0);
    const saved = JSON.parse(readFileSync(casePath, 'utf8'));
    expect(saved.transfusions.at(-1)).toMatchObject({ id: 'imp-2026-11-25', date: '2026-11-25', volume: { value: 560, unit: 'mL' } });
  });

  it('gives rows on one date ids in turn past the ones taken, and names every refused row of a long file by its line', async () => {
    const folder = tempDir();
    const casePath = join(folder, 'th-0417.json');
    copyFileSync(demoCase('th-0417'), casePath);
    // A first import takes 'imp-2026-11-25'; the second import's three rows on that date follow it.
    const firstPath = join(folder, 'first.csv');
    writeFileSync(firstPath, 'date,volume,haematocrit,units\n2026-11-25,560,0.6,2\n');
    expect((await cli('import', firstPath, '--into', casePath)).code).toBe(0);
    const secondPath = join(folder, 'second.csv');
    writeFileSync(secondPath, 'date,volume,haematocrit,units\n2026-11-25,550,0.6,2\n2026-11-25,540,0.6,2\n2026-11-25,530,0.6,2\n');
    expect((await cli('import', secondPath, '--into', casePath)).code).toBe(0);
    const saved = JSON.parse(readFileSync(casePath, 'utf8')) as { transfusions: { id: string }[] };
    expect(saved.transfusions.slice(-4).map((it) => it.id)).toEqual(['imp-2026-11-25', 'imp-2026-11-25-2', 'imp-2026-11-25-3', 'imp-2026-11-25-4']);
    // 3,000 rows before the demo's birth date (2011-06-14) and one after: each refused row is
    // reported once with its own line (the screen once matched issues to rows quadratically).
    const longPath = join(folder, 'long.csv');
    writeFileSync(longPath, `date,volume,haematocrit,units\n${'2010-01-01,550,0.6,2\n'.repeat(3000)}2026-11-27,550,0.6,2\n`);
    const dry = await cli('import', longPath, '--into', casePath, '--dry-run');
    expect(dry.out).toContain('Would add: 1 transfusion(s)');
    const refusedLines = [...dry.out.matchAll(/line (\d+): column "date": transfusions\[\d+\]\.date 2010-01-01 is before the birth date/g)].map((it) => Number(it[1]));
    expect(refusedLines).toEqual(Array.from({ length: 3000 }, (_, index) => index + 2));
  });

  it('adds the flag that makes a choice the host names in words, and prints each place once', async () => {
    const folder = tempDir();
    const casePath = join(folder, 'th-0417.json');
    copyFileSync(demoCase('th-0417'), casePath);
    const ambiguousPath = join(folder, 'lab.csv');
    writeFileSync(ambiguousPath, 'date,test,value,unit\n03/04/2026,ferritin,1500,ug/L\n');
    const ambiguous = await cli('import', ambiguousPath, '--into', casePath, '--dry-run');
    expect(ambiguous.out).toContain('line 2: column "date": date "03/04/2026" could be day-first or month-first; choose the date order (day first or month first)');
    expect(ambiguous.out).toContain('On the command line: --date-order day-first or --date-order month-first.');
    const missingPath = join(folder, 'short.csv');
    writeFileSync(missingPath, 'date,test,value\n2026-01-01,ferritin,1200\n');
    const missing = await cli('import', missingPath, '--into', casePath, '--dry-run');
    expect(missing.code).toBe(1);
    // The command line shows the flag, not the host's name of the choice (columnMapping).
    expect(missing.err).toContain('The header row (line 1) has no column for unit; choose the column that holds it.\nOn the command line: --map unit=<header>.');
    expect(missing.err).not.toContain('columnMapping');
    expect(missing.err).not.toMatch(/line 1: line 1/);
  });

  it('imports a FHIR bundle and warns on a birth date that differs from the case', async () => {
    const folder = tempDir();
    const casePath = join(folder, 'th-0417.json');
    copyFileSync(demoCase('th-0417'), casePath);
    const bundlePath = join(folder, 'bundle.json');
    writeFileSync(bundlePath, JSON.stringify(bundle(patientExample, { ...bilirubinUsCore, effectiveDateTime: '2026-11-01' }, glucoseF001)));
    const run = await cli('import', bundlePath, '--into', casePath, '--dry-run');
    expect(run.out).toContain('Would add: 0 transfusion(s), 1 result(s)');
    expect(run.out).toContain('differs from the case');
    expect(run.out).toContain('http://loinc.org|15074-8');
    expect(run.out).not.toContain('Chalmers');
  });
});

describe('import --code-map', () => {
  // Built on the R4 Observation/example pattern: a local coding (system http://acme.org/devices/clinical-codes)
  // beside or instead of LOINC; the codes and values are invented (LOINC has no MRI liver iron code, loincCodes.ts).
  const local = 'http://acme.org/devices/clinical-codes';
  const mri = (id: string, code: string, value: number, unit: string) => ({
    resourceType: 'Observation',
    id,
    status: 'final',
    code: { coding: [{ system: local, code }] },
    effectiveDateTime: '2026-11-24',
    valueQuantity: { value, unit, system: 'http://unitsofmeasure.org', code: unit },
  });
  const map = {
    format: 'chelation-ledger-code-map',
    version: 1,
    codes: [{ system: local, code: 'liver-t2star', result: { kind: 'liver-iron', method: 'mri-t2star', fieldStrengthT: 1.5, calibrationId: 'hernando-1.5t' }, unit: 'ms' }],
  };

  it('maps a local code to a result kind and unit, and still lists the codes it does not know', async () => {
    const folder = tempDir();
    const casePath = join(folder, 'th-0417.json');
    copyFileSync(demoCase('th-0417'), casePath);
    const bundlePath = join(folder, 'mri.json');
    writeFileSync(bundlePath, JSON.stringify(bundle(mri('a', 'liver-t2star', 6.2, 'ms'), mri('b', 'pancreas-r2star', 80, 's-1'))));
    const mapPath = join(folder, 'codes.json');
    writeFileSync(mapPath, JSON.stringify(map));
    const run = await cli('import', bundlePath, '--into', casePath, '--code-map', mapPath, '--dry-run');
    expect(run.code, run.err).toBe(0);
    expect(run.out).toContain('Would add: 0 transfusion(s), 1 result(s)');
    expect(run.out).toContain('2026-11-24 liver-iron 6.2 ms');
    expect(run.out).toContain(`entry[1] Observation/b: ${local}|pancreas-r2star`);
    const without = await cli('import', bundlePath, '--into', casePath, '--dry-run');
    expect(without.out).toContain('Codes not known to the import (not imported): 2');
  });

  it('refuses a code map that is not valid, naming the file and the field, and imports nothing', async () => {
    const folder = tempDir();
    const casePath = join(folder, 'th-0417.json');
    copyFileSync(demoCase('th-0417'), casePath);
    const before = readFileSync(casePath, 'utf8');
    const bundlePath = join(folder, 'mri.json');
    writeFileSync(bundlePath, JSON.stringify(bundle(mri('a', 'liver-t2star', 6.2, 'ms'))));
    const mapPath = join(folder, 'codes.json');
    writeFileSync(mapPath, JSON.stringify({ ...map, codes: [{ ...map.codes[0], result: { kind: 'liver-iron', method: 'mri-t2star' } }] }));
    const run = await cli('import', bundlePath, '--into', casePath, '--code-map', mapPath);
    expect(run.code).toBe(1);
    expect(run.err).toContain(`Code map ${mapPath}, codes[0].result`);
    const missing = await cli('import', bundlePath, '--into', casePath, '--code-map', join(folder, 'nope.json'));
    expect(missing.code).toBe(1);
    expect(missing.err).toContain('nope.json');
    expect(readFileSync(casePath, 'utf8')).toBe(before);
  });
});
