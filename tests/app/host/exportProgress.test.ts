import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { createHostDispatch } from '../../../app/host/hostDispatch';
import { createHostServices } from '../../../app/host/hostServices';
import { demoEnvironment, watch } from './hostFixtures';

// The progress and the cancel of an export (the review sheet as PDF, the monitoring calendar as
// iCalendar) through the host contract's workProgress and cancelWork, called through the one
// dispatcher both transports use, on copies of the demo cases. Outside references: a PDF starts with
// "%PDF-" (ISO 32000-1 §7.5.2) and an iCalendar object with "BEGIN:VCALENDAR" (RFC 5545 §3.4); the
// exports folder is read back from disk, not through the host. Nothing here times anything.

const caseId = 'th-0417.json';

function setUp() {
  const environment = demoEnvironment();
  const dispatch = createHostDispatch(createHostServices(environment));
  const exported = () => (existsSync(join(environment.folder, 'exports')) ? readdirSync(join(environment.folder, 'exports')).sort() : []);
  return { dispatch, exported, folder: environment.folder };
}

describe('an export reports its steps under the page\'s work id', () => {
  it('the review sheet: opening, reviewing, laying out, writing, in that order, and the PDF is written', async () => {
    const { dispatch, exported, folder } = setUp();
    const workId = 'sheet-export-0001';
    const { answer, seen } = await watch(dispatch, workId, dispatch('exportSheetPdf', { caseId, asOfDate: '2026-11-20', paper: 'a4', workId }));
    expect((answer as { ok: boolean }).ok, JSON.stringify(answer)).toBe(true);
    expect(seen).toEqual([
      { step: 'Opening th-0417.json', done: 0, total: 4 },
      { step: 'Reviewing TH-0417 on 2026-11-20', done: 1, total: 4 },
      { step: "Laying out the sheet's pages", done: 2, total: 4 },
      { step: 'Writing th-0417-sheet-2026-11-20.pdf', done: 3, total: 4 },
    ]);
    expect(exported()).toEqual(['th-0417-sheet-2026-11-20.pdf']);
    expect(readFileSync(join(folder, 'exports', 'th-0417-sheet-2026-11-20.pdf')).subarray(0, 5).toString('latin1')).toBe('%PDF-');
    expect(await dispatch('workProgress', { workId })).toEqual({ ok: true, value: null });
  });

  it('the monitoring calendar: opening, writing, and the calendar is written', async () => {
    const { dispatch, exported, folder } = setUp();
    const workId = 'calendar-export-01';
    const { answer, seen } = await watch(dispatch, workId, dispatch('exportCalendar', { caseId, asOfDate: '2026-11-20', workId }));
    expect((answer as { ok: boolean }).ok, JSON.stringify(answer)).toBe(true);
    expect(seen).toEqual([
      { step: 'Opening th-0417.json', done: 0, total: 2 },
      { step: 'Writing th-0417-monitoring-2026-11-20.ics', done: 1, total: 2 },
    ]);
    expect(exported()).toEqual(['th-0417-monitoring-2026-11-20.ics']);
    expect(readFileSync(join(folder, 'exports', 'th-0417-monitoring-2026-11-20.ics'), 'utf8').startsWith('BEGIN:VCALENDAR')).toBe(true);
  });
});

describe('cancelWork during an export', () => {
  for (const stopAt of ['Opening th-0417.json', 'Reviewing TH-0417 on 2026-11-20', "Laying out the sheet's pages", 'Writing th-0417-sheet-2026-11-20.pdf']) {
    it(`stops the review sheet when asked during "${stopAt}": no file is written, and the answer says so`, async () => {
      const { dispatch, exported } = setUp();
      const workId = 'sheet-cancel-0001';
      const cancels: Promise<unknown>[] = [];
      const { answer } = await watch(dispatch, workId, dispatch('exportSheetPdf', { caseId, asOfDate: '2026-11-20', paper: 'a4', workId }), (progress) => {
        if (progress?.step === stopAt) cancels.push(dispatch('cancelWork', { workId }));
      });
      expect(await Promise.all(cancels)).toEqual([{ ok: true, value: { stopping: true } }]);
      expect(answer).toEqual({
        ok: false,
        issues: [{ code: 'cancelled', path: ['workId'], message: 'The review sheet of th-0417.json was cancelled before it was written; no file was written.', severity: 'error' }],
      });
      expect(exported()).toEqual([]);
    });
  }

  it('stops the calendar before it is written', async () => {
    const { dispatch, exported } = setUp();
    const workId = 'calendar-cancel-01';
    expect(await dispatch('cancelWork', { workId })).toEqual({ ok: true, value: { stopping: true } });
    const answer = await dispatch('exportCalendar', { caseId, asOfDate: '2026-11-20', workId });
    expect(!answer.ok && answer.issues[0]).toMatchObject({ code: 'cancelled', message: 'The monitoring calendar of th-0417.json was cancelled before it was written; no file was written.' });
    expect(exported()).toEqual([]);
  });

  it('refuses a bad work id on the export calls, naming the field and the value; nothing is written', async () => {
    const { dispatch, exported } = setUp();
    for (const [name, payload] of [
      ['exportSheetPdf', { caseId, asOfDate: '2026-11-20', paper: 'a4', workId: 'no spaces please' }],
      ['exportCalendar', { caseId, asOfDate: '2026-11-20', workId: 'short' }],
    ] as const) {
      const answer = await dispatch(name, payload);
      expect(!answer.ok && answer.issues[0]!.path, name).toEqual(['workId']);
      expect(!answer.ok && answer.issues[0]!.message, name).toMatch(/^workId ".*" is not a work id/);
    }
    expect(exported()).toEqual([]);
  });

  it('leaves an export without a work id as it was: it runs through and writes the file', async () => {
    const { dispatch, exported } = setUp();
    const answer = await dispatch('exportCalendar', { caseId, asOfDate: '2026-11-20' });
    expect(answer.ok).toBe(true);
    expect(exported()).toEqual(['th-0417-monitoring-2026-11-20.ics']);
  });
});
