import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { createHostDispatch } from '../../../app/host/hostDispatch';
import { createHostServices } from '../../../app/host/hostServices';
import { demoEnvironment, watch } from './hostFixtures';

// The progress and the cancel of an import through the host contract (workProgress, cancelWork),
// called through the one dispatcher both transports use, on copies of the demo cases. Outside
// references: the steps and their counts are those of the CSV text below, counted by hand (RFC 4180
// records, a header on line 1); the case file and its journal are read back from disk byte for byte,
// not through the host. Nothing here times anything: the polls only watch which step is reported.

const caseId = 'th-0417.json';

// Line 1 header; lines 2 and 4 good; line 3 an impossible volume (the case model refuses it, so the
// case is checked a second time without it); line 5 not a date (the reader refuses it: three rows reach the check).
const transfusionsCsv = 'date,volume (L),haematocrit,units\n2026-11-24,0.56,0.6,2\n2026-11-25,-0.005,0.6,2\n2026-11-26,0.54,0.58,2\nnot-a-date,0.5,0.6,2\n';
const csvRequest = { caseId, kind: 'csv-transfusions', sourceName: 'tx.csv', sourceText: transfusionsCsv } as const;

function setUp() {
  const environment = demoEnvironment();
  const dispatch = createHostDispatch(createHostServices(environment));
  const disk = () => ({
    file: readFileSync(join(environment.folder, caseId), 'utf8'),
    journal: readdirSync(environment.folder).includes('th-0417.journal.jsonl') ? readFileSync(join(environment.folder, 'th-0417.journal.jsonl'), 'utf8') : null,
    names: readdirSync(environment.folder).sort(),
  });
  const revisionOf = async () => {
    const opened = await dispatch('openCase', { caseId });
    if (!opened.ok) throw new Error('open failed');
    return (opened.value as { revision: string }).revision;
  };
  return { dispatch, disk, revisionOf };
}

describe('an import reports its steps under the page\'s work id', () => {
  it('reports opening, reading, checking (again without the refused row) and saving, in that order, with the steps done of those foreseen', async () => {
    const { dispatch, revisionOf } = setUp();
    const workId = 'a1b2c3d4e5f6a7b8c9d0e1f2';
    const { answer, seen } = await watch(dispatch, workId, dispatch('importCommit', { ...csvRequest, workId, baseRevision: await revisionOf() }));
    expect((answer as { ok: boolean }).ok, JSON.stringify(answer)).toBe(true);
    expect(seen).toEqual([
      { step: 'Opening th-0417.json', done: 0, total: 4 },
      { step: 'Reading tx.csv', done: 1, total: 4 },
      { step: 'Checking 3 rows against the case', done: 2, total: 4 },
      // The second pass was not foreseen: the total grows by one.
      { step: 'Checking 2 rows against the case again (pass 2, without the 1 row refused)', done: 3, total: 5 },
      { step: 'Saving th-0417.json', done: 4, total: 5 },
    ]);
    // Once the call has answered, the host has no such work running.
    expect(await dispatch('workProgress', { workId })).toEqual({ ok: true, value: null });
  });

  it('groups the thousands of a long file\'s row count as the screens write numbers (1,200)', async () => {
    const { dispatch } = setUp();
    const workId = 'long-file-0001';
    // 1,200 invented rows on the first 28 days of November 2026, all within the case's plausible ranges.
    const rows = Array.from({ length: 1200 }, (_, index) => `2026-11-${String(1 + (index % 28)).padStart(2, '0')},0.3,0.6,1`);
    const { answer, seen } = await watch(dispatch, workId, dispatch('importDryRun', { ...csvRequest, sourceName: 'long.csv', sourceText: `date,volume (L),haematocrit,units\n${rows.join('\n')}\n`, workId }));
    expect((answer as { ok: boolean }).ok, JSON.stringify(answer).slice(0, 400)).toBe(true);
    expect(seen.map((it) => it?.step)).toEqual(['Opening th-0417.json', 'Reading long.csv', 'Checking 1,200 rows against the case']);
    expect(seen.map((it) => it?.total)).toEqual([3, 3, 3]);
  });
});

describe('cancelWork', () => {
  it('stops a commit before it saves: nothing is written to the case file or its journal, and the answer says so', async () => {
    const { dispatch, disk, revisionOf } = setUp();
    const before = disk();
    const workId = 'f00dfeedf00dfeedf00dfeed';
    const cancels: unknown[] = [];
    const { answer } = await watch(dispatch, workId, dispatch('importCommit', { ...csvRequest, workId, baseRevision: await revisionOf() }), (progress) => {
      // Cancelled as soon as the file is being read, as a user would press Cancel while the step shows.
      if (progress?.step === 'Reading tx.csv') cancels.push(dispatch('cancelWork', { workId }));
    });
    expect(await Promise.all(cancels)).toEqual([{ ok: true, value: { stopping: true } }]);
    expect(answer).toEqual({
      ok: false,
      issues: [{ code: 'cancelled', path: ['workId'], message: 'The import from tx.csv was cancelled; nothing was added to th-0417.json.', severity: 'error' }],
    });
    expect(disk()).toEqual(before);
    // Finished: a late cancel is told that nothing is stopping.
    expect(await dispatch('cancelWork', { workId })).toEqual({ ok: true, value: { stopping: false } });
  });

  it('honours a cancel that reaches the host before the call it names, and a cancel at the last step before saving', async () => {
    const { dispatch, disk, revisionOf } = setUp();
    const before = disk();
    expect(await dispatch('cancelWork', { workId: 'early-cancel-01' })).toEqual({ ok: true, value: { stopping: true } });
    const early = await dispatch('importCommit', { ...csvRequest, workId: 'early-cancel-01', baseRevision: await revisionOf() });
    expect(!early.ok && early.issues[0]).toMatchObject({ code: 'cancelled' });

    const workId = 'last-moment-cancel';
    let cancel: Promise<unknown> | undefined;
    const { answer } = await watch(dispatch, workId, dispatch('importCommit', { ...csvRequest, workId, baseRevision: await revisionOf() }), (progress) => {
      if (progress?.step === 'Saving th-0417.json') cancel ??= dispatch('cancelWork', { workId });
    });
    expect(await cancel).toEqual({ ok: true, value: { stopping: true } });
    expect(!(answer as { ok: boolean }).ok && (answer as { issues: { code: string }[] }).issues[0]).toMatchObject({ code: 'cancelled' });
    expect(disk()).toEqual(before);
  });

  it('stops a dry run between steps with its own words', async () => {
    const { dispatch } = setUp();
    const workId = 'dry-run-cancel-01';
    const { answer } = await watch(dispatch, workId, dispatch('importDryRun', { ...csvRequest, workId }), (progress) => {
      if (progress?.step === 'Opening th-0417.json') void dispatch('cancelWork', { workId });
    });
    expect(answer).toEqual({
      ok: false,
      issues: [{ code: 'cancelled', path: ['workId'], message: 'The preview of the import from tx.csv was cancelled; nothing was added to th-0417.json.', severity: 'error' }],
    });
  });

  it('leaves an import without a work id as it was: it runs through and adds the rows', async () => {
    const { dispatch, revisionOf } = setUp();
    const committed = await dispatch('importCommit', { ...csvRequest, baseRevision: await revisionOf() });
    expect(committed.ok && (committed.value as { counts: Record<string, number> }).counts['transfusions']).toBe(2);
  });
});

describe('work ids', () => {
  it('refuses a bad work id on every call that takes one, with a message naming the field, the value and the form expected; nothing is read or written', async () => {
    const { dispatch, disk, revisionOf } = setUp();
    const before = disk();
    const bad = [
      ['workProgress', { workId: 'short' }, '"short"'],
      ['cancelWork', { workId: '../../etc/passwd' }, '"../../etc/passwd"'],
      ['importDryRun', { ...csvRequest, workId: 'has spaces in it' }, '"has spaces in it"'],
      ['importCommit', { ...csvRequest, workId: 'x'.repeat(65), baseRevision: await revisionOf() }, '65 characters given'],
    ] as const;
    for (const [name, payload, value] of bad) {
      const answer = await dispatch(name, payload);
      expect(answer.ok, name).toBe(false);
      if (answer.ok) continue;
      expect(answer.issues[0]!.path, name).toEqual(['workId']);
      expect(answer.issues[0]!.message, name).toMatch(/^workId .* is not a work id: expected 8 to 64 letters, digits, _ or -/);
      expect(answer.issues[0]!.message, name).toContain(value);
    }
    const missing = await dispatch('workProgress', {});
    expect(!missing.ok && missing.issues[0]!.message).toBe('workId is missing; expected text.');
    expect(disk()).toEqual(before);
  });

  it('answers null for work it does not know, and for work already finished', async () => {
    const { dispatch } = setUp();
    expect(await dispatch('workProgress', { workId: 'never-started-01' })).toEqual({ ok: true, value: null });
    await dispatch('importDryRun', { ...csvRequest, workId: 'finished-dry-run' });
    expect(await dispatch('workProgress', { workId: 'finished-dry-run' })).toEqual({ ok: true, value: null });
  });
});
