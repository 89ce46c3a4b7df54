import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { createHostDispatch } from '../../app/host/hostDispatch';
import { createHostServices } from '../../app/host/hostServices';
import type { HostApi } from '../../core/contract';
import { parseCase } from '../../core/model/parseCase';
import { ok } from '../../core/result';
import { createHostClient } from '../../renderer/host';
import { followWork, newWorkId, progressPollMs, workspaceHostOver, type RecordImportPreview, type WorkspaceHost } from '../../renderer/hostPort';
import { createWorkspaceStore } from '../../renderer/state/store';
import {
  importCancelledText,
  importPreviewView,
  importProgressBar,
  importStepText,
  importStoppingText,
  importTooLateText,
  importedText,
  kindForFile,
  withColumnField,
} from '../../renderer/viewModels/recordImport';
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
  return { environment, client, host: workspaceHostOver(client) };
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

  it('a slow dry run shows as pending and Cancel asks the host to stop it (by its work id) and abandons its answer', async () => {
    const { host } = workspace();
    let release: () => void = () => undefined;
    const cancelled: string[] = [];
    const slow: WorkspaceHost = {
      ...host,
      previewRecordImport: async (request, followed) => {
        await new Promise<void>((resolve) => (release = resolve));
        return host.previewRecordImport(request, followed);
      },
      cancelWork: async (workId) => {
        cancelled.push(workId);
        return host.cancelWork(workId);
      },
    };
    const store = createWorkspaceStore();
    await store.getState().connect(slow, 'test');
    store.getState().openImport('th-0417.json');
    store.getState().chooseImportFile('unit-export.csv', transfusionsCsv);
    await settle();
    const pending = store.getState().importSession?.pending;
    expect(pending).toEqual({ what: 'preview', label: 'Reading unit-export.csv', workId: expect.stringMatching(/^[0-9a-f]{24}$/), progress: null });
    // Before the host reports a step, the screen says what the page asked for, with an indeterminate bar.
    expect(importStepText(pending!)).toBe('Reading unit-export.csv…');
    expect(importProgressBar(pending!)).toEqual({ label: 'Progress of reading the file', value: null, max: null });
    await store.getState().cancelImport();
    expect(cancelled).toEqual([pending!.workId]);
    expect(store.getState().importSession?.pending).toBeNull();
    release();
    await settle();
    await settle();
    expect(store.getState().importSession?.preview).toBeNull();
  });
});

/**
 * The page's host over the real host services, with the commit held until `release` and every
 * call that names a work id recorded in order; `progress` stands in for the host's answer to a
 * poll while the commit is held (the real host has not begun it, so it would answer null).
 */
function heldCommit(client: HostApi, answers: { progress: NonNullable<Awaited<ReturnType<HostApi['workProgress']>>>; cancel?: ReturnType<HostApi['cancelWork']> }) {
  const calls: { name: string; workId: string | undefined }[] = [];
  let release: () => void = () => undefined;
  const held = new Promise<void>((resolve) => (release = resolve));
  const api: HostApi = {
    ...client,
    importCommit: async (request) => {
      calls.push({ name: 'importCommit', workId: request.workId });
      await held;
      return client.importCommit(request);
    },
    workProgress: async (request) => {
      calls.push({ name: 'workProgress', workId: request.workId });
      return answers.progress;
    },
    cancelWork: async (request) => {
      calls.push({ name: 'cancelWork', workId: request.workId });
      return answers.cancel ?? client.cancelWork(request);
    },
  };
  return { host: workspaceHostOver(api), calls, release: () => release() };
}

describe('an import\'s progress and Cancel on the Import screen', () => {
  it('polls the host while the commit runs and cancels it with the same work id; the host then adds nothing', async () => {
    const { client, environment } = workspace();
    const casePath = join(environment.folder, 'th-0417.json');
    const progress = ok({ step: 'Checking 60,000 rows against the case', done: 2, total: 4 });
    const { host, calls, release } = heldCommit(client, { progress });
    const store = createWorkspaceStore();
    await store.getState().connect(host, 'test');
    store.getState().openCase('th-0417.json');
    store.getState().openImport();
    store.getState().chooseImportFile('unit-export.csv', transfusionsCsv);
    await until(() => store.getState().importSession?.preview !== null);
    const before = readFileSync(casePath, 'utf8');
    const committing = store.getState().commitImport();
    await until(() => store.getState().importSession?.pending?.progress != null);
    const pending = store.getState().importSession!.pending!;
    expect(pending.progress).toEqual({ step: 'Checking 60,000 rows against the case', done: 2, total: 4 });
    // The host's step as the screen shows it: its own words, then which step of those foreseen (done + 1 of total).
    expect(importStepText(pending)).toBe('Checking 60,000 rows against the case (step 3 of 4)');
    expect(importProgressBar(pending)).toEqual({ label: 'Progress of adding the import', value: 2, max: 4 });

    await store.getState().cancelImport();
    expect(store.getState().importSession?.pending).toBeNull();
    expect(store.getState().importSession?.notice).toBe(importStoppingText());
    release();
    await committing;

    // One work id from the commit on: the call carries it, every poll asks for it, the cancel names it.
    const fromCommit = calls.slice(calls.findIndex((it) => it.name === 'importCommit'));
    const workId = fromCommit[0]!.workId;
    expect(workId).toBe(pending.workId);
    expect(workId).toMatch(/^[0-9a-f]{24}$/);
    expect(fromCommit.filter((it) => it.name === 'workProgress').length).toBeGreaterThan(0);
    expect(fromCommit.filter((it) => it.name === 'cancelWork')).toEqual([{ name: 'cancelWork', workId }]);
    expect(fromCommit.every((it) => it.workId === workId)).toBe(true);
    // The real host got the cancel before the commit (held here) reached it: it stopped at its first step.
    expect(store.getState().importSession?.notice).toBe(importCancelledText('unit-export.csv', 'TH-0417'));
    expect(store.getState().importSession?.refusal).toBeNull();
    expect(readFileSync(casePath, 'utf8')).toBe(before);
    // No poll after the answer.
    const polls = calls.length;
    await new Promise((resolve) => setTimeout(resolve, progressPollMs * 2));
    expect(calls.length).toBe(polls);
  });

  it('says when Cancel came too late (the host was saving), and that the import was added', async () => {
    const { client, environment } = workspace();
    const { host, release } = heldCommit(client, { progress: ok({ step: 'Saving th-0417.json', done: 3, total: 4 }), cancel: Promise.resolve(ok({ stopping: false })) });
    const store = createWorkspaceStore();
    await store.getState().connect(host, 'test');
    store.getState().openImport('th-0417.json');
    store.getState().chooseImportFile('unit-export.csv', transfusionsCsv);
    await until(() => store.getState().importSession?.preview !== null);
    const committing = store.getState().commitImport();
    await until(() => store.getState().importSession?.pending?.progress != null);
    await store.getState().cancelImport();
    expect(store.getState().importSession?.notice).toBe(importTooLateText());
    release();
    await committing;
    expect(store.getState().message).toBe('The import you stopped was added before it could be stopped: Added 2 transfusions from unit-export.csv to TH-0417.');
    const onDisk = parseCase(JSON.parse(readFileSync(join(environment.folder, 'th-0417.json'), 'utf8')));
    expect(onDisk.ok && onDisk.value.transfusions.filter((it) => it.id.startsWith('imp-')).length).toBe(2);
  });
});

describe('following the host\'s work', () => {
  afterEach(() => vi.useRealTimers());

  it('asks for the progress every 250 ms while the call runs, and never after it answered', async () => {
    vi.useFakeTimers();
    const asked: string[] = [];
    const seen: unknown[] = [];
    const api = { workProgress: async ({ workId }: { workId: string }) => (asked.push(workId), ok({ step: `step ${asked.length}`, done: asked.length - 1, total: 9 })) };
    let answer: (value: string) => void = () => undefined;
    const followed = followWork(api, { workId: 'work-id-0001', onProgress: (progress) => seen.push(progress.step) }, () => new Promise<string>((resolve) => (answer = resolve)));
    await vi.advanceTimersByTimeAsync(progressPollMs - 1);
    expect(asked).toEqual([]);
    await vi.advanceTimersByTimeAsync(1 + progressPollMs * 2);
    expect(asked).toEqual(['work-id-0001', 'work-id-0001', 'work-id-0001']);
    expect(seen).toEqual(['step 1', 'step 2', 'step 3']);
    answer('done');
    expect(await followed).toBe('done');
    await vi.advanceTimersByTimeAsync(progressPollMs * 4);
    expect(asked).toHaveLength(3);
  });

  it('makes work ids of 24 hex digits that the contract accepts, a new one each time', () => {
    const ids = Array.from({ length: 500 }, newWorkId);
    for (const id of ids) expect(id).toMatch(/^[0-9a-f]{24}$/);
    expect(new Set(ids).size).toBe(ids.length);
  });
});

describe('the import view-model', () => {
  it('groups the counts of a step in thousands as the screens write numbers', () => {
    const pending = { what: 'preview', label: 'Reading big.csv', progress: { step: 'Reading big.csv', done: 1233, total: 60000 } } as const;
    expect(importStepText(pending)).toBe('Reading big.csv (step 1,234 of 60,000)');
    const preview: RecordImportPreview = { counts: { transfusions: 60000, results: 1 }, firstRows: [], rejected: Array.from({ length: 1200 }, (_, index) => ({ line: index + 2, reason: 'r' })) };
    expect(importPreviewView(preview).addsText).toBe('Would add 60,000 transfusions, 1 result.');
    // Exchanges and venesections are named as what they are (the host counts the transfusion list by kind).
    expect(importPreviewView({ ...preview, counts: { transfusions: 0, exchanges: 2, venesections: 1, results: 0, weights: 0, heights: 0 } }).addsText).toBe('Would add 2 red-cell exchanges, 1 venesection.');
    expect(importedText({ exchanges: 1 }, 'rcx.csv', 'SC-0781')).toBe('Added 1 red-cell exchange from rcx.csv to SC-0781.');
    expect(importPreviewView(preview).rejectedText).toBe('1,200 rows or entries are refused and would not be added:');
    expect(importedText({ transfusions: 60000 }, 'x.csv', 'TH-0417')).toBe('Added 60,000 transfusions from x.csv to TH-0417.');
  });

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
