import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { createHostDispatch } from '../../app/host/hostDispatch';
import { createHostServices } from '../../app/host/hostServices';
import { parseCase } from '../../core/model/parseCase';
import { createHostClient } from '../../renderer/host';
import { workspaceHostOver, type RecordImportPreview, type WorkspaceHost } from '../../renderer/hostPort';
import { createWorkspaceStore } from '../../renderer/state/store';
import { importPreviewView, importedText, kindForFile, withColumnField } from '../../renderer/viewModels/recordImport';
import { demoEnvironment } from '../app/host/hostFixtures';

// The Import screen's store and view-model over the real host services (the
// same import as the command line), on a copy of the demo workspace. Outside
// references: the case file is read back from disk with the case model, not
// through the store; line numbers are those of the CSV text below, counted by
// hand (RFC 4180 records, the header on line 1).

// Line 2 and 4 good; line 3 a haematocrit of 61, a percentage in a fraction column (refused by the import).
const transfusionsCsv = 'Date given,Volume (mL),Hct,Units\n2026-11-24,560,0.6,2\n2026-11-25,550,61,2\n2026-12-15,540,0.58,2\n';

function workspace() {
  const environment = demoEnvironment();
  const dispatch = createHostDispatch(createHostServices(environment));
  const client = createHostClient({ call: (name, request) => dispatch(name, request), onMenuCommand: () => () => undefined });
  return { environment, host: workspaceHostOver(client) };
}

const settle = () => new Promise((resolve) => setTimeout(resolve, 20));
async function until(check: () => boolean): Promise<void> {
  for (let step = 0; step < 200 && !check(); step += 1) await settle();
}

describe('the Import screen (store and view-model over the host import)', () => {
  it('previews a CSV chosen for the open case: counts, first rows, the refused row with its line, the columns as read', async () => {
    const { host } = workspace();
    const store = createWorkspaceStore();
    await store.getState().connect(host, 'test');
    store.getState().openCase('th-0417.json');
    store.getState().openImport();
    expect(store.getState().screen).toBe('import');
    expect(store.getState().importSession?.caseId).toBe('th-0417.json');
    store.getState().chooseImportFile('unit-export.csv', transfusionsCsv);
    await until(() => store.getState().importSession?.preview !== null);
    const view = importPreviewView(store.getState().importSession!.preview!);
    expect(view.addsText).toBe('Would add 2 transfusions.');
    expect(view.canCommit).toBe(true);
    expect(view.firstRows).toEqual(['line 2: 2026-11-24 transfusion 560 mL, unit haematocrit 0.6', 'line 4: 2026-12-15 transfusion 540 mL, unit haematocrit 0.58']);
    expect(view.rejected).toEqual([{ where: 'line 3', reason: expect.stringContaining('haematocrit 61 looks like a percentage') }]);
    expect(view.columns).toEqual([
      { column: 'Date given', field: 'date' },
      { column: 'Volume (mL)', field: 'volume' },
      { column: 'Hct', field: 'haematocrit' },
      { column: 'Units', field: 'units' },
    ]);
    expect(view.missingText).toBeNull();
  });

  it('takes a corrected column mapping and the ambiguous-date choice, then commits into the case and reopens it', async () => {
    const { host, environment } = workspace();
    const store = createWorkspaceStore();
    await store.getState().connect(host, 'test');
    store.getState().openCase('th-0417.json');
    const before = store.getState().draft!.tables.results.length;
    store.getState().openImport();
    store.getState().setImportChoices({ kind: 'csv-results' });
    // 04/12/2026 is 4 December read day first, 12 April read month first (both parts 12 or less: never guessed).
    store.getState().chooseImportFile('lab.csv', 'Taken,Analyte,Reading,UoM\n04/12/2026,ferritin,2700,ug/L\n');
    await until(() => store.getState().importSession?.preview !== null);
    let view = importPreviewView(store.getState().importSession!.preview!);
    // "Analyte" and "UoM" are header words the import knows; "Taken" and "Reading" are not.
    expect(view.missingText).toBe('date, value');
    expect(view.canCommit).toBe(false);
    let mapping = store.getState().importSession!.preview!.csvMapping!;
    store.getState().setImportChoices({ columnMapping: withColumnField(mapping, 'Reading', 'value') });
    await until(() => store.getState().importSession?.preview !== null);
    mapping = store.getState().importSession!.preview!.csvMapping!;
    expect(mapping.columns.find((it) => it.column === 'Reading')?.field).toBe('value');
    store.getState().setImportChoices({ columnMapping: withColumnField(mapping, 'Taken', 'date') });
    await until(() => store.getState().importSession?.preview !== null);
    view = importPreviewView(store.getState().importSession!.preview!);
    expect(view.rejected).toEqual([{ where: 'line 2', reason: expect.stringContaining('could be day-first or month-first') }]);
    store.getState().setImportChoices({ dateOrder: 'day-first' });
    await until(() => store.getState().importSession?.preview !== null);
    view = importPreviewView(store.getState().importSession!.preview!);
    expect(view.firstRows).toEqual(['line 2: 2026-12-04 ferritin 2700 ug/L']);

    await store.getState().commitImport();
    expect(store.getState().message).toBe('Added 1 result from lab.csv to TH-0417.');
    expect(store.getState().screen).toBe('record');
    expect(store.getState().draft!.tables.results.length).toBe(before + 1);
    const onDisk = parseCase(JSON.parse(readFileSync(join(environment.folder, 'th-0417.json'), 'utf8')));
    expect(onDisk.ok && onDisk.value.results.some((it) => it.date === '2026-12-04' && it.kind === 'ferritin')).toBe(true);
  });

  it('will not import into the open case while it has entries that are not saved', async () => {
    const { host } = workspace();
    const store = createWorkspaceStore();
    await store.getState().connect(host, 'test');
    store.getState().openCase('th-0417.json');
    const rowId = store.getState().draft!.tables.transfusions[0]!.id;
    store.getState().edit((draft) => ({ ...draft, tables: { ...draft.tables, transfusions: draft.tables.transfusions.map((row) => (row.id === rowId ? { ...row, cells: { ...row.cells, unitHaematocrit: '60' } } : row)) } }));
    await settle();
    expect(store.getState().saveState).toBe('unsaved-errors');
    store.getState().openImport();
    store.getState().chooseImportFile('unit-export.csv', transfusionsCsv);
    await until(() => store.getState().importSession?.preview !== null);
    await store.getState().commitImport();
    expect(store.getState().importSession?.refusal).toMatch(/not saved yet/);
    expect(store.getState().draft!.tables.transfusions[0]!.cells.unitHaematocrit).toBe('60');
  });

  it('a slow dry run shows as pending and Cancel abandons its answer', async () => {
    const { host } = workspace();
    let release: () => void = () => undefined;
    const slow: WorkspaceHost = {
      ...host,
      previewRecordImport: async (request) => {
        await new Promise<void>((resolve) => (release = resolve));
        return host.previewRecordImport(request);
      },
    };
    const store = createWorkspaceStore();
    await store.getState().connect(slow, 'test');
    store.getState().openImport('th-0417.json');
    store.getState().chooseImportFile('unit-export.csv', transfusionsCsv);
    await settle();
    expect(store.getState().importSession?.pending).toEqual({ what: 'preview', label: 'Reading unit-export.csv' });
    store.getState().cancelImport();
    expect(store.getState().importSession?.pending).toBeNull();
    release();
    await settle();
    await settle();
    expect(store.getState().importSession?.preview).toBeNull();
  });
});

describe('the import view-model', () => {
  const mapping: NonNullable<RecordImportPreview['csvMapping']> = {
    columns: [{ column: 'a', field: 'date' }, { column: 'b', field: 'value' }, { column: 'c', field: null }],
    fields: ['date', 'test', 'value', 'unit'],
    required: ['date', 'test', 'value', 'unit'],
  };

  it('moves a field to the column chosen for it (one column per field) and leaves out columns not read', () => {
    expect(withColumnField(mapping, 'c', 'value')).toEqual({ a: 'date', c: 'value' });
    expect(withColumnField(mapping, 'a', null)).toEqual({ b: 'value' });
  });

  it('reads a .json file as a FHIR Bundle and keeps the CSV kind chosen otherwise', () => {
    expect(kindForFile('export.JSON', 'csv-results')).toBe('fhir-bundle');
    expect(kindForFile('lab.csv', 'csv-results')).toBe('csv-results');
    expect(kindForFile('lab.csv', 'fhir-bundle')).toBe('csv-transfusions');
  });

  it('says what was added in words', () => {
    expect(importedText({ transfusions: 3, results: 1, weights: 0, heights: 0 }, 'x.csv', 'TH-0417')).toBe('Added 3 transfusions, 1 result from x.csv to TH-0417.');
    expect(importedText({ transfusions: 0 }, 'x.csv', 'TH-0417')).toBe('Nothing was added from x.csv; TH-0417 is unchanged.');
  });
});
