import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { createHostDispatch } from '../../../app/host/hostDispatch';
import { createHostServices } from '../../../app/host/hostServices';
import { parseCase } from '../../../core/model/parseCase';
import { demoEnvironment } from './hostFixtures';

// The contract's importDryRun and importCommit, called through the one
// dispatcher both transports use, on copies of the demo cases. Outside
// references: the case files are read back from disk with the case model (not
// through the host); line numbers are those of the CSV text below, counted by
// hand (RFC 4180 records, a header on line 1); litres to millilitres is UCUM's
// exact factor 1000 (l = dm3); the FHIR resources follow the R4 specification's
// published examples (cited at each).

const caseId = 'th-0417.json';

function setUp() {
  const environment = demoEnvironment();
  const dispatch = createHostDispatch(createHostServices(environment));
  const casePath = join(environment.folder, caseId);
  const journalPath = join(environment.folder, 'th-0417.journal.jsonl');
  const disk = () => ({
    file: readFileSync(casePath, 'utf8'),
    journal: readdirSync(environment.folder).includes('th-0417.journal.jsonl') ? readFileSync(journalPath, 'utf8') : null,
    names: readdirSync(environment.folder).sort(),
  });
  const revisionOf = async () => {
    const opened = await dispatch('openCase', { caseId });
    if (!opened.ok) throw new Error('open failed');
    return (opened.value as { revision: string }).revision;
  };
  return { environment, dispatch, casePath, journalPath, disk, revisionOf };
}

// Line 1 header; lines 2 and 4 good; line 3 an impossible volume (refused by the
// case model, as check refuses it); line 5 not a date.
const transfusionsCsv = 'date,volume (L),haematocrit,units\n2026-11-24,0.56,0.6,2\n2026-11-25,-0.005,0.6,2\n2026-11-26,0.54,0.58,2\nnot-a-date,0.5,0.6,2\n';
const csvRequest = { caseId, kind: 'csv-transfusions', sourceName: 'tx.csv', sourceText: transfusionsCsv } as const;

describe('importDryRun through the host contract', () => {
  it('previews what would be added and changes nothing on disk', async () => {
    const { dispatch, disk } = setUp();
    const before = disk();
    const answer = await dispatch('importDryRun', csvRequest);
    expect(answer.ok, JSON.stringify(answer)).toBe(true);
    if (!answer.ok) return;
    const value = answer.value as { counts: Record<string, number>; firstRows: string[]; rejected: { line: number | null; reason: string }[]; understood: string[] };
    expect(value.counts).toEqual({ transfusions: 2, exchanges: 0, venesections: 0, results: 0, weights: 0, heights: 0 });
    expect(value.firstRows).toEqual(['line 2: 2026-11-24 transfusion 560 mL, unit haematocrit 0.6', 'line 4: 2026-11-26 transfusion 540 mL, unit haematocrit 0.58']);
    expect(value.understood).toContain('volume ← column "volume (L)" (guessed)');
    // The file, its journal and the folder are byte for byte as before.
    expect(disk()).toEqual(before);
  });

  it('lists every rejected row with its line number and the reason', async () => {
    const { dispatch } = setUp();
    const answer = await dispatch('importDryRun', csvRequest);
    if (!answer.ok) throw new Error('dry run failed');
    const rejected = (answer.value as { rejected: { line: number | null; reason: string }[] }).rejected;
    expect(rejected.map((it) => it.line).sort()).toEqual([3, 5]);
    expect(rejected.find((it) => it.line === 3)!.reason).toMatch(/volume\.value -5 mL is not possible/);
    expect(rejected.find((it) => it.line === 5)!.reason).toContain('"not-a-date" is not a date');
  });

  it('takes a column mapping (column → field) and a date order from the request', async () => {
    const { dispatch } = setUp();
    const answer = await dispatch('importDryRun', {
      caseId,
      kind: 'csv-results',
      sourceName: 'lab.csv',
      sourceText: 'Taken,Analyte,Reading,UoM\n24/11/2026,ferritin,1480,ug/L\n03/11/2026,ALT,40,U/L\n',
      columnMapping: { Taken: 'date', Reading: 'value' },
      dateOrder: 'day-first',
    });
    expect(answer.ok, JSON.stringify(answer)).toBe(true);
    if (!answer.ok) return;
    const value = answer.value as { counts: Record<string, number>; firstRows: string[]; understood: string[] };
    expect(value.counts['results']).toBe(2);
    expect(value.firstRows).toEqual(['line 2: 2026-11-24 ferritin 1480 ug/L', 'line 3: 2026-11-03 alt 40 U/L']);
    expect(value.understood).toEqual(expect.arrayContaining(['date ← column "Taken"', 'value ← column "Reading"', 'dates: day-first (as given)']));
    const wrong = await dispatch('importDryRun', { caseId, kind: 'csv-results', sourceName: 'lab.csv', sourceText: 'a,b\n', columnMapping: { a: 'colour' } });
    expect(!wrong.ok && wrong.issues[0]).toMatchObject({ code: 'unknown_choice', path: ['columnMapping', 'a'] });
    expect(!wrong.ok && wrong.issues[0]!.message).toContain('date, test, value, unit');
  });

  it('reads red-cell exchanges and venesections (csv-exchanges, csv-venesections), with the column mapping checked against their fields', async () => {
    const { dispatch, disk } = setUp();
    const before = disk();
    // Invented rows; 2.1 L is 2100 mL (UCUM: l = dm3) and 27 % is 0.27 (UCUM: % = 10^-2).
    const exchanges = await dispatch('importDryRun', {
      caseId,
      kind: 'csv-exchanges',
      sourceName: 'rcx.csv',
      sourceText: 'When,Method,Vol in (L),Units,Vol removed (L),Patient Hct (%)\n2026-11-20,automated,2.1,8,2.3,27\n2026-11-21,automated,2.1,8,2.3,27\n',
      columnMapping: { When: 'date', 'Vol in (L)': 'volumeIn' },
    });
    expect(exchanges.ok, JSON.stringify(exchanges)).toBe(true);
    if (!exchanges.ok) return;
    const exchangePreview = exchanges.value as { counts: Record<string, number>; firstRows: string[] };
    expect(exchangePreview.firstRows[0]).toBe('line 2: 2026-11-20 automated exchange 2100 mL in (unit haematocrit not given, the product default applies), 2300 mL out, patient haematocrit 0.27');
    // Counted by kind (the contract's counts are by record kind): two exchanges, no simple transfusion.
    expect(exchangePreview.counts).toMatchObject({ exchanges: 2, transfusions: 0, venesections: 0 });
    const venesections = await dispatch('importDryRun', { caseId, kind: 'csv-venesections', sourceName: 'v.csv', sourceText: 'date,volume removed,hct\n2026-11-20,450,0.41\n' });
    expect(venesections.ok && (venesections.value as { firstRows: string[] }).firstRows).toEqual(['line 2: 2026-11-20 venesection 450 mL, patient haematocrit 0.41']);
    const wrongField = await dispatch('importDryRun', { caseId, kind: 'csv-venesections', sourceName: 'v.csv', sourceText: 'a,b\n', columnMapping: { a: 'volumeIn' } });
    expect(!wrongField.ok && wrongField.issues[0]!.message).toContain('date, volumeRemoved, patientHaematocrit');
    expect(disk()).toEqual(before);
  });

  it('refuses a file it cannot read with a message naming the file', async () => {
    const { dispatch, disk } = setUp();
    const before = disk();
    const cases = [
      { kind: 'csv-transfusions', sourceName: 'empty.csv', sourceText: '', expected: /^empty\.csv: nothing was imported/ },
      { kind: 'fhir-bundle', sourceName: 'results.csv', sourceText: 'date,test\n', expected: /^results\.csv is not valid JSON/ },
      { kind: 'fhir-bundle', sourceName: 'patient.json', sourceText: '{"resourceType":"Patient"}', expected: /^patient\.json: nothing was imported/ },
    ] as const;
    for (const { expected, ...request } of cases) {
      const answer = await dispatch('importDryRun', { caseId, ...request });
      expect(answer.ok, request.sourceName).toBe(false);
      if (!answer.ok) expect(answer.issues[0]!.message, request.sourceName).toMatch(expected);
      const commit = await dispatch('importCommit', { caseId, ...request, baseRevision: '1|1|absent' });
      expect(commit.ok, request.sourceName).toBe(false);
    }
    const missing = await dispatch('importDryRun', { ...csvRequest, caseId: 'nobody.json' });
    expect(!missing.ok && missing.issues[0]!.message).toContain('nobody.json');
    expect(disk()).toEqual(before);
  });
});

describe('the column mapping a dry run answers for a CSV', () => {
  it('lists each column with the field it is read as, the fields and those required', async () => {
    const { dispatch } = setUp();
    const answer = await dispatch('importDryRun', csvRequest);
    if (!answer.ok) throw new Error('dry run failed');
    // The header of transfusionsCsv above, in order; "volume (L)" is read as volume (its unit in brackets).
    expect((answer.value as { csvMapping: unknown }).csvMapping).toEqual({
      columns: [
        { column: 'date', field: 'date' },
        { column: 'volume (L)', field: 'volume' },
        { column: 'haematocrit', field: 'haematocrit' },
        { column: 'units', field: 'units' },
      ],
      fields: ['date', 'volume', 'haematocrit', 'units', 'product'],
      required: ['date', 'volume'],
    });
  });

  it('answers the columns when a required one is missing, with the refusal as a whole-file rejection, and a commit is refused', async () => {
    const { dispatch, disk, revisionOf } = setUp();
    const before = disk();
    const request = { caseId, kind: 'csv-results', sourceName: 'odd.csv', sourceText: 'when,what\n2026-01-01,x\n' } as const;
    const answer = await dispatch('importDryRun', request);
    expect(answer.ok, JSON.stringify(answer)).toBe(true);
    if (!answer.ok) return;
    const value = answer.value as { counts: Record<string, number>; rejected: { line: number | null; reason: string }[]; csvMapping: { columns: unknown[] } };
    expect(value.counts).toEqual({ transfusions: 0, results: 0, weights: 0, heights: 0 });
    expect(value.rejected).toEqual([{ line: 1, reason: expect.stringContaining('no column for test, value, unit') }]);
    expect(value.csvMapping.columns).toEqual([{ column: 'when', field: 'date' }, { column: 'what', field: null }]);
    // Mapped by the user, the same file is read.
    const mapped = await dispatch('importDryRun', { ...request, sourceText: 'when,what,reading,uom\n2026-01-01,ferritin,1500,ug/L\n', columnMapping: { what: 'test', reading: 'value', uom: 'unit' } });
    expect(mapped.ok && (mapped.value as { counts: Record<string, number> }).counts['results']).toBe(1);
    const commit = await dispatch('importCommit', { ...request, baseRevision: await revisionOf() });
    expect(!commit.ok && commit.issues[0]!.message).toMatch(/^odd\.csv: nothing was imported/);
    expect(disk()).toEqual(before);
  });
});

describe('importCommit through the host contract', () => {
  it('adds exactly the previewed rows, atomically, with one journal line naming the source', async () => {
    const { dispatch, disk, casePath, journalPath, revisionOf } = setUp();
    const beforeCase = parseCase(JSON.parse(readFileSync(casePath, 'utf8')));
    if (!beforeCase.ok) throw new Error('demo invalid');
    const preview = await dispatch('importDryRun', csvRequest);
    if (!preview.ok) throw new Error('dry run failed');
    const committed = await dispatch('importCommit', { ...csvRequest, baseRevision: await revisionOf() });
    expect(committed.ok, JSON.stringify(committed)).toBe(true);
    if (!committed.ok) return;
    expect((committed.value as { counts: unknown }).counts).toEqual((preview.value as { counts: unknown }).counts);
    // Read back from disk with the case model: the old entries untouched, the two previewed ones after them.
    const after = parseCase(JSON.parse(readFileSync(casePath, 'utf8')));
    if (!after.ok) throw new Error('saved case invalid');
    const old = beforeCase.value.transfusions;
    expect(after.value.transfusions.slice(0, old.length)).toEqual(old);
    expect(after.value.transfusions.slice(old.length)).toEqual([
      { id: 'imp-2026-11-24', date: '2026-11-24', kind: 'simple', volume: { value: 560, unit: 'mL' }, unitHaematocrit: 0.6, unitCount: 2 },
      { id: 'imp-2026-11-26', date: '2026-11-26', kind: 'simple', volume: { value: 540, unit: 'mL' }, unitHaematocrit: 0.58, unitCount: 2 },
    ]);
    expect(after.value.results).toEqual(beforeCase.value.results);
    const journal = readFileSync(journalPath, 'utf8').split('\n').filter((line) => line.trim() !== '');
    expect(journal).toHaveLength(1);
    expect(JSON.parse(journal[0]!)).toMatchObject({ change: 'imported 2 entries from tx.csv' });
    // No temporary file of the atomic write is left beside the case.
    expect(disk().names.filter((name) => name.endsWith('.tmp'))).toEqual([]);
    // The revision returned is the one a next save must name.
    expect((committed.value as { revision: string }).revision).toBe(await revisionOf());
  });

  it('refuses a stale revision and writes nothing', async () => {
    const { dispatch, disk, revisionOf } = setUp();
    const stale = await revisionOf();
    const opened = await dispatch('openCase', { caseId });
    if (!opened.ok) throw new Error('open failed');
    const document = structuredClone((opened.value as { document: { patient: { label: string } } }).document);
    document.patient.label = 'TH-0417-B';
    // Another window saves first.
    const other = await dispatch('saveCase', { caseId, document, baseRevision: stale });
    expect(other.ok).toBe(true);
    const before = disk();
    const answer = await dispatch('importCommit', { ...csvRequest, baseRevision: stale });
    expect(answer.ok).toBe(false);
    if (!answer.ok) {
      expect(answer.issues[0]!.code).toBe('changed_on_disk');
      expect(answer.issues[0]!.message).toContain('th-0417.json changed on disk');
    }
    expect(disk()).toEqual(before);
  });
});

// FHIR R4 Observation/example ("Simple Weight Example", hl7.org/fhir/R4/observation-example.json):
// its code.coding carries, beside LOINC 29463-7, a local coding
// { system: 'http://acme.org/devices/clinical-codes', code: 'body-weight' }. The
// MRI results below are built on that published pattern: the example's
// structure (status, code.coding with a local system, effectiveDateTime,
// valueQuantity with a UCUM system and code), with invented local codes and
// values, since neither LOINC nor the specification has an MRI liver iron example.
const localSystem = 'http://acme.org/devices/clinical-codes';
const observation = (id: string, code: string, display: string, value: number, unit: string) => ({
  resourceType: 'Observation',
  id,
  status: 'final',
  code: { coding: [{ system: localSystem, code, display }] },
  subject: { reference: 'Patient/example' },
  effectiveDateTime: '2026-11-24',
  valueQuantity: { value, unit, system: 'http://unitsofmeasure.org', code: unit },
});
const mriBundle = {
  resourceType: 'Bundle',
  type: 'collection',
  entry: [
    { resource: observation('r2s', 'liver-r2star', 'Liver R2*', 160, 's-1') },
    // 0.028 s = 28 ms (UCUM s and ms: a factor of 1000).
    { resource: observation('t2s', 'heart-t2star', 'Cardiac T2*', 0.028, 's') },
    { resource: observation('unk', 'spleen-r2star', 'Spleen R2*', 90, 's-1') },
  ],
};
const codeMapText = JSON.stringify({
  format: 'chelation-ledger-code-map',
  version: 1,
  codes: [
    { system: localSystem, code: 'liver-r2star', display: 'Liver R2*, 1.5 T', result: { kind: 'liver-iron', method: 'mri-r2star', fieldStrengthT: 1.5, calibrationId: 'hernando-1.5t' }, unit: 's-1' },
    { system: localSystem, code: 'heart-t2star', result: { kind: 'cardiac-t2star', fieldStrengthT: 1.5 }, unit: 'ms' },
  ],
});

describe('FHIR imports with a local code map through the contract', () => {
  it('reads mapped codes, lists the unknown one among the refused, and commits the mapped results', async () => {
    const { dispatch, casePath, revisionOf } = setUp();
    const request = { caseId, kind: 'fhir-bundle', sourceName: 'mri.json', sourceText: JSON.stringify(mriBundle), codeMap: { sourceName: 'site-codes.json', sourceText: codeMapText } } as const;
    const preview = await dispatch('importDryRun', request);
    expect(preview.ok, JSON.stringify(preview)).toBe(true);
    if (!preview.ok) return;
    const value = preview.value as { counts: Record<string, number>; rejected: { line: number | null; reason: string }[] };
    expect(value.counts['results']).toBe(2);
    expect(value.rejected).toEqual([{ line: null, reason: `entry[2] Observation/unk: code ${localSystem}|spleen-r2star (Spleen R2*) is not one the import knows; not imported.` }]);
    const committed = await dispatch('importCommit', { ...request, baseRevision: await revisionOf() });
    expect(committed.ok, JSON.stringify(committed)).toBe(true);
    const saved = JSON.parse(readFileSync(casePath, 'utf8')) as { results: Record<string, unknown>[] };
    expect(saved.results.slice(-2)).toEqual([
      expect.objectContaining({ date: '2026-11-24', kind: 'liver-iron', method: 'mri-r2star', fieldStrengthT: 1.5, calibrationId: 'hernando-1.5t', measured: { value: 160, unit: 's-1' } }),
      expect.objectContaining({ date: '2026-11-24', kind: 'cardiac-t2star', fieldStrengthT: 1.5, measured: { value: 28, unit: 'ms' } }),
    ]);
  });

  it('without the map, lists every MRI code as unknown rather than dropping it', async () => {
    const { dispatch } = setUp();
    const preview = await dispatch('importDryRun', { caseId, kind: 'fhir-bundle', sourceName: 'mri.json', sourceText: JSON.stringify(mriBundle) });
    if (!preview.ok) throw new Error('dry run failed');
    const value = preview.value as { counts: Record<string, number>; rejected: { reason: string }[] };
    expect(value.counts['results']).toBe(0);
    expect(value.rejected.map((it) => it.reason.split(':')[0])).toEqual(['entry[0] Observation/r2s', 'entry[1] Observation/t2s', 'entry[2] Observation/unk']);
  });

  it('refuses a broken code map naming the map file and the field', async () => {
    const { dispatch } = setUp();
    const broken = JSON.stringify({ format: 'chelation-ledger-code-map', version: 1, codes: [{ system: localSystem, code: 'liver-r2star', result: { kind: 'liver-iron', method: 'mri-r2star', fieldStrengthT: 1.5, calibrationId: 'hernando-1.5t' }, unit: 'ms' }] });
    const answer = await dispatch('importDryRun', { caseId, kind: 'fhir-bundle', sourceName: 'mri.json', sourceText: JSON.stringify(mriBundle), codeMap: { sourceName: 'site-codes.json', sourceText: broken } });
    expect(answer.ok).toBe(false);
    if (!answer.ok) expect(answer.issues[0]!.message).toBe('Code map site-codes.json, codes[0].unit: "ms" is not a unit the case file records liver-iron (mri-r2star) in; use s-1.');
  });
});
