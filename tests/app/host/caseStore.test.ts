import { appendFileSync, existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, utimesSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { nodeAtomicWriteFs } from '../../../app/host/atomicWrite';
import { contentHash } from '../../../app/host/caseJournal';
import { openCaseStore, serializeCase, type CaseStore, type OpenedCase } from '../../../app/host/caseStore';
import { currentCaseFileVersion, type Case } from '../../../core/model/caseFile';
import type { Result } from '../../../core/result';
import { deepFreeze, readDemo, withChange } from '../../core/model/caseFixtures';
import { stateAt } from './crash/killStates';
import { faultyFs } from './faultyFs';

// Outside references: the real file system (read back with Node's fs), SHA-256
// as computed by Node's crypto (FIPS 180-4), and the demo case files, which
// the case model accepts (tests/core/model/demoCases.test.ts).

let folder: string;
const clock = () => new Date('2026-12-01T09:30:00.000Z');
let store: CaseStore;
beforeEach(() => {
  folder = mkdtempSync(join(tmpdir(), 'case-store-'));
  store = openCaseStore(folder, { now: clock });
});
afterEach(() => rmSync(folder, { recursive: true, force: true }));

function value<T>(result: Result<T>): T {
  if (!result.ok) throw new Error(`expected ok, got ${result.issues.map((it) => it.message).join('; ')}`);
  return result.value;
}
function issuesOf<T>(result: Result<T>) {
  if (result.ok) throw new Error('expected a failure');
  return result.issues;
}
const withNote = (theCase: unknown, text: string) =>
  withChange(theCase, ['review', 'notes'], [{ date: '2026-11-20', by: 'pharmacist', text }]);
const demo = () => readDemo('th-0417');
const onDisk = (name: string) => readFileSync(join(folder, name), 'utf8');

describe('case store: create, open, save, history', () => {
  it('creates a case with one journal line, opens it equal, and refuses to create it twice', async () => {
    const created = value(await store.create('th-0417.json', demo(), 'created'));
    expect(onDisk('th-0417.json')).toBe(serializeCase(created.caseFile));
    expect(created.revision.sha256).toBe(contentHash(onDisk('th-0417.json')));
    const opened = value(await store.open('th-0417.json'));
    expect(opened.caseFile).toEqual(created.caseFile);
    expect(opened.recoverable).toBeNull();
    expect(value(await store.history('th-0417.json')).entries).toEqual([
      { at: '2026-12-01T09:30:00.000Z', change: 'created', sha256: created.revision.sha256, version: currentCaseFileVersion },
    ]);
    expect(issuesOf(await store.create('th-0417.json', demo(), 'again'))[0]!.code).toBe('already_exists');
  });

  it('saves a change against the revision it opened and records it in the history', async () => {
    const opened = value(await store.create('a.json', demo(), 'created'));
    const saved = value(await store.save('a.json', withNote(opened.caseFile, 'reviewed'), { expected: opened.revision, change: 'added a review note' }));
    expect(JSON.parse(onDisk('a.json')).review.notes[0].text).toBe('reviewed');
    const history = value(await store.history('a.json'));
    expect(history.entries.map((it) => it.change)).toEqual(['created', 'added a review note']);
    expect(history.entries.at(-1)!.sha256).toBe(saved.revision.sha256);
    expect(history.unreadableLines).toEqual([]);
  });

  it('refuses a case with errors with the same messages as check, and writes nothing', async () => {
    const opened = value(await store.create('a.json', demo(), 'created'));
    const before = onDisk('a.json');
    const bad = withChange(opened.caseFile, ['transfusions', 0, 'unitHaematocrit'], 60);
    const issues = issuesOf(await store.save('a.json', bad, { expected: opened.revision, change: 'typo' }));
    expect(issues.map((it) => it.message)).toContain('transfusions[0].unitHaematocrit 60 is outside 0.40–0.85; enter it as a fraction (0.60).');
    expect(onDisk('a.json')).toBe(before);
    expect(value(await store.history('a.json')).entries).toHaveLength(1);
  });

  it('never changes the case it is handed', async () => {
    const frozen = deepFreeze(demo());
    value(await store.create('a.json', frozen, 'created'));
    expect(frozen).toEqual(demo());
  });

  it('refuses names with a folder part or without .json', async () => {
    for (const name of ['../x.json', 'sub/x.json', 'x.txt', '.hidden.json', 'a\\b.json']) {
      expect(issuesOf(await store.create(name, demo(), 'created'))[0]!.message).toContain('not a case file name');
    }
  });
});

describe('case store: two windows on one file', () => {
  it('detects a change on disk, writes nothing over it, and keeps the work through save-as', async () => {
    const first = value(await store.create('a.json', demo(), 'created'));
    const windowA: OpenedCase = value(await store.open('a.json'));
    const windowB: OpenedCase = value(await store.open('a.json'));
    expect(windowA.revision).toEqual(first.revision);
    value(await store.save('a.json', withNote(windowA.caseFile, 'from A'), { expected: windowA.revision, change: 'note A' }));
    const issues = issuesOf(await store.save('a.json', withNote(windowB.caseFile, 'from B'), { expected: windowB.revision, change: 'note B' }));
    expect(issues[0]!.code).toBe('changed_on_disk');
    expect(issues[0]!.message).toContain(join(folder, 'a.json'));
    expect(issues[0]!.message).toContain('Save as');
    expect(JSON.parse(onDisk('a.json')).review.notes[0].text).toBe('from A');
    value(await store.saveAs('a-from-b.json', withNote(windowB.caseFile, 'from B'), 'saved as a copy: a.json changed on disk'));
    expect(JSON.parse(onDisk('a-from-b.json')).review.notes[0].text).toBe('from B');
  });

  it('a file touched but not changed (same content, new time) is not a conflict', async () => {
    const opened = value(await store.create('a.json', demo(), 'created'));
    utimesSync(join(folder, 'a.json'), new Date('2030-01-01'), new Date('2030-01-01'));
    expect((await store.save('a.json', withNote(opened.caseFile, 'x'), { expected: opened.revision, change: 'note' })).ok).toBe(true);
  });

  it('a file deleted since it was opened is reported, not silently recreated', async () => {
    const opened = value(await store.create('a.json', demo(), 'created'));
    rmSync(join(folder, 'a.json'));
    expect(issuesOf(await store.save('a.json', opened.caseFile, { expected: opened.revision, change: 'x' }))[0]!.message).toContain('moved or deleted');
  });

  it('a file edited by another program is opened as it is, with the journal state offered', async () => {
    value(await store.create('a.json', demo(), 'created'));
    writeFileSync(join(folder, 'a.json'), JSON.stringify(withNote(demo(), 'by hand')));
    const opened = value(await store.open('a.json'));
    expect(opened.caseFile.review.notes[0]!.text).toBe('by hand');
    expect(opened.recoverable).toEqual({ reason: 'changed-outside', at: '2026-12-01T09:30:00.000Z', change: 'created' });
  });
});

describe('case store: versions', () => {
  it('migrates an older version in memory and writes the current version only on save', async () => {
    // A version 1 file (the small kill-test case is written in version 1).
    const older = `${JSON.stringify(stateAt(1), null, 2)}\n`;
    writeFileSync(join(folder, 'old.json'), older);
    const opened = value(await store.open('old.json'));
    expect(opened.migratedFromVersion).toBe(1);
    expect(opened.caseFile.version).toBe(currentCaseFileVersion);
    expect(onDisk('old.json')).toBe(older);
    const listed = value(await store.list())[0]!;
    expect(listed.status === 'ok' && listed.migratedFromVersion).toBe(1);
    expect(onDisk('old.json')).toBe(older);
    value(await store.save('old.json', opened.caseFile, { expected: opened.revision, change: 'saved in the current version' }));
    expect(JSON.parse(onDisk('old.json')).version).toBe(currentCaseFileVersion);
  });

  it('refuses a newer version on open and never overwrites it', async () => {
    const newer = JSON.stringify({ ...demo(), version: currentCaseFileVersion + 1 });
    writeFileSync(join(folder, 'new.json'), newer);
    const issues = issuesOf(await store.open('new.json'));
    expect(issues[0]!.code).toBe('unsupported_version');
    // Even a save handed the file's exact revision is refused.
    const revision = { mtimeMs: 0, size: newer.length, sha256: contentHash(newer) };
    expect(issuesOf(await store.save('new.json', demo(), { expected: revision, change: 'x' }))[0]!.code).toBe('unsupported_version');
    expect(onDisk('new.json')).toBe(newer);
    expect(existsSync(join(folder, 'new.journal.jsonl'))).toBe(false);
  });
});

describe('case store: failures keep the work and the old file', () => {
  const journalPath = (path: string) => path.endsWith('.jsonl');
  const casePath = (path: string) => path.includes('.tmp') || path.endsWith('a.json');

  it('disk full while adding to the journal: nothing written, the message names the journal', async () => {
    const opened = value(await store.create('a.json', demo(), 'created'));
    const before = onDisk('a.json');
    const full = openCaseStore(folder, { now: clock, fs: faultyFs('writeFile', 'ENOSPC', { only: journalPath }) });
    const issues = issuesOf(await full.save('a.json', withNote(opened.caseFile, 'x'), { expected: opened.revision, change: 'note' }));
    expect(issues[0]!.code).toBe('write_failed');
    expect(issues[0]!.message).toContain('a.journal.jsonl');
    expect(issues[0]!.message).toContain('the disk is full');
    expect(onDisk('a.json')).toBe(before);
    // The torn journal line is skipped, the history still reads, the file opens unchanged.
    const history = value(await store.history('a.json'));
    expect(history.entries.map((it) => it.change)).toEqual(['created']);
    expect(history.unreadableLines).toHaveLength(1);
    expect(value(await store.open('a.json')).recoverable).toBeNull();
  });

  it('disk full while writing the case: the old file stays, and the journal recovers the new state', async () => {
    const opened = value(await store.create('a.json', demo(), 'created'));
    const before = onDisk('a.json');
    const full = openCaseStore(folder, { now: clock, fs: faultyFs('writeFile', 'ENOSPC', { only: casePath }) });
    const changed = withNote(opened.caseFile, 'typed before the disk filled');
    const issues = issuesOf(await full.save('a.json', changed, { expected: opened.revision, change: 'note' }));
    expect(issues[0]!.message).toContain(join(folder, 'a.json'));
    expect(issues[0]!.message).toContain('the disk is full');
    expect(onDisk('a.json')).toBe(before);
    expect(readdirSync(folder).filter((it) => it.endsWith('.tmp'))).toEqual([]);
    const reopened = value(await store.open('a.json'));
    expect(reopened.recoverable?.reason).toBe('interrupted-save');
    const recovered = value(await store.recover('a.json'));
    expect(recovered.caseFile.review.notes[0]!.text).toBe('typed before the disk filled');
    value(await store.save('a.json', recovered.caseFile, { expected: recovered.revision, change: 'recovered' }));
    expect(JSON.parse(onDisk('a.json')).review.notes[0].text).toBe('typed before the disk filled');
  });

  for (const { code, step, words } of [
    { code: 'EROFS', step: 'open', words: 'read-only' },
    { code: 'EACCES', step: 'open', words: 'permission denied' },
    { code: 'EBUSY', step: 'rename', words: 'locked by another program' },
  ] as const) {
    it(`${code}: a clear message naming the file, the old file intact`, async () => {
      const opened = value(await store.create('a.json', demo(), 'created'));
      const before = onDisk('a.json');
      const faulty = openCaseStore(folder, { now: clock, fs: faultyFs(step, code, { only: casePath }) });
      const issues = issuesOf(await faulty.save('a.json', withNote(opened.caseFile, 'x'), { expected: opened.revision, change: 'note' }));
      expect(issues[0]!.message).toContain(join(folder, 'a.json'));
      expect(issues[0]!.message).toContain(words);
      expect(issues[0]!.message).not.toContain('TH-0417');
      expect(onDisk('a.json')).toBe(before);
    });
  }

  it('a read-only folder refuses a new case with a message naming the file', async () => {
    const readOnly = openCaseStore(folder, { now: clock, fs: faultyFs('open', 'EROFS') });
    const issues = issuesOf(await readOnly.create('a.json', demo(), 'created'));
    expect(issues[0]!.message).toContain('a.journal.jsonl');
    expect(issues[0]!.message).toContain('read-only');
    expect(readdirSync(folder)).toEqual([]);
  });

  it('corrupt JSON: a message naming the file, the journal offered, recovery writes the last good state', async () => {
    const opened = value(await store.create('a.json', demo(), 'created'));
    writeFileSync(join(folder, 'a.json'), onDisk('a.json').slice(0, 200));
    const issues = issuesOf(await store.open('a.json'));
    expect(issues[0]!.message).toMatch(/^Case file .*a\.json is not valid JSON/);
    expect(issues.some((it) => it.message.includes('recover brings it back'))).toBe(true);
    const recovered = value(await store.recover('a.json'));
    expect(recovered.caseFile).toEqual(opened.caseFile);
    value(await store.save('a.json', recovered.caseFile, { expected: recovered.revision, change: 'recovered from the journal' }));
    expect(value(await store.open('a.json')).caseFile).toEqual(opened.caseFile);
  });

  it('a byte-order mark is accepted; bytes that are not UTF-8 are refused naming the file', async () => {
    writeFileSync(join(folder, 'bom.json'), `\ufeff${JSON.stringify(demo())}`);
    expect((await store.open('bom.json')).ok).toBe(true);
    writeFileSync(join(folder, 'latin1.json'), Buffer.from([0x7b, 0x22, 0xe9, 0x22, 0x7d]));
    expect(issuesOf(await store.open('latin1.json'))[0]!.message).toContain('latin1.json: it holds bytes that are not UTF-8');
  });

  it('a torn journal line does not swallow the next change', async () => {
    const opened = value(await store.create('a.json', demo(), 'created'));
    appendFileSync(join(folder, 'a.journal.jsonl'), '\n{"at":"2026-12-01T09:30:00.000Z","change":"cut sh');
    value(await store.save('a.json', withNote(opened.caseFile, 'x'), { expected: opened.revision, change: 'after the tear' }));
    const history = value(await store.history('a.json'));
    expect(history.entries.map((it) => it.change)).toEqual(['created', 'after the tear']);
    expect(history.unreadableLines).toHaveLength(1);
  });
});

describe('case store: list, rename, archive', () => {
  it('lists every case file with a summary, and the unreadable ones with why', async () => {
    value(await store.create('b.json', demo(), 'created'));
    value(await store.create('a.json', readDemo('th-0093'), 'created'));
    writeFileSync(join(folder, 'broken.json'), '{');
    writeFileSync(join(folder, 'newer.json'), JSON.stringify({ ...demo(), version: 99 }));
    writeFileSync(join(folder, '.b.json.0123456789ab.tmp'), '{');
    value(await store.archive('b.json'));
    value(await store.create('b.json', demo(), 'created'));
    const list = value(await store.list());
    expect(list.map((it) => [it.fileName, it.status])).toEqual([
      ['a.json', 'ok'],
      ['b.json', 'ok'],
      ['broken.json', 'unreadable'],
      ['newer.json', 'unreadable'],
    ]);
    const first = list[0]!;
    expect(first.status === 'ok' && first.label).toBe((readDemo('th-0093')['patient'] as { label: string }).label);
    const newer = list[3]!;
    expect(newer.status === 'unreadable' && newer.issues[0]!.code).toBe('unsupported_version');
  });

  it('renames a case with its journal, and refuses a taken name', async () => {
    value(await store.create('a.json', demo(), 'created'));
    value(await store.create('b.json', demo(), 'created'));
    expect(issuesOf(await store.rename('a.json', 'b.json'))[0]!.code).toBe('already_exists');
    value(await store.rename('a.json', 'c.json'));
    expect(readdirSync(folder).sort()).toEqual(['b.journal.jsonl', 'b.json', 'c.journal.jsonl', 'c.json']);
    expect(value(await store.history('c.json')).entries.map((it) => it.change)).toEqual(['created', 'renamed from a.json']);
    expect(value(await store.open('c.json')).recoverable).toBeNull();
  });

  it('archives into archive/ without deleting, numbering a second archive of the same name', async () => {
    value(await store.create('a.json', demo(), 'created'));
    expect(value(await store.archive('a.json')).archivedAs).toBe(join('archive', 'a.json'));
    value(await store.create('a.json', demo(), 'created again'));
    expect(value(await store.archive('a.json')).archivedAs).toBe(join('archive', 'a-2.json'));
    expect(readdirSync(join(folder, 'archive')).sort()).toEqual(['a-2.journal.jsonl', 'a-2.json', 'a.journal.jsonl', 'a.json']);
    expect(readdirSync(folder)).toEqual(['archive']);
    const archived: Case = JSON.parse(readFileSync(join(folder, 'archive', 'a.json'), 'utf8'));
    expect(archived.patient.label).toBe('TH-0417');
    // The archive is listed apart (openArchived), never among the workspace's cases.
    expect(value(await store.list()).map((it) => it.fileName)).toEqual([]);
    expect(value(await store.openArchived()).map((it) => [it.fileName, it.opened.ok])).toEqual([['a-2.json', true], ['a.json', true]]);
  });

  it('a workspace without an archive has no archived cases', async () => {
    expect(value(await store.openArchived())).toEqual([]);
  });
});

describe('case store: temporary files left by an interrupted save', () => {
  // A kill during a save leaves `.<name>.<12 hex>.tmp` (atomicWrite.ts; the kill test counts them).
  // Listing sweeps those older than ten minutes, by the clock the store is given, and nothing else.
  const tenMinutesMs = 10 * 60 * 1000;
  const at = (ms: number) => new Date(clock().getTime() - ms);
  it('removes only its own temporary files older than ten minutes, when the workspace is listed', async () => {
    value(await store.create('a.json', demo(), 'created'));
    const files = {
      old: '.a.json.0123456789ab.tmp',
      recent: '.a.json.ba9876543210.tmp',
      notOurs: '.a.json.tmp',
      notOursEither: 'a.json.0123456789ab.tmp',
      upperHex: '.a.json.0123456789AB.tmp',
    };
    for (const name of Object.values(files)) writeFileSync(join(folder, name), '{"partial":');
    const ages: Record<keyof typeof files, number> = { old: tenMinutesMs + 1000, recent: tenMinutesMs - 1000, notOurs: 3 * tenMinutesMs, notOursEither: 3 * tenMinutesMs, upperHex: 3 * tenMinutesMs };
    for (const [key, name] of Object.entries(files)) utimesSync(join(folder, name), at(ages[key as keyof typeof files]), at(ages[key as keyof typeof files]));
    const listed = value(await store.list());
    expect(listed.map((it) => it.fileName)).toEqual(['a.json']);
    const left = readdirSync(folder).sort();
    expect(left).not.toContain(files.old);
    expect(left).toEqual([files.notOurs, files.recent, files.upperHex, 'a.journal.jsonl', 'a.json', files.notOursEither].sort());
    // The case itself is untouched.
    expect(value(await store.open('a.json')).caseFile.patient.label).toBe('TH-0417');
  });

  it('sweeps the exports folder the same way (an export cut off as it was written), and leaves the exports', async () => {
    value(await store.create('a.json', demo(), 'created'));
    const exports = join(folder, 'exports');
    mkdirSync(exports);
    const files = { old: '.a-sheet-2026-11-20.pdf.0123456789ab.tmp', recent: '.a-sheet-2026-11-20.pdf.ba9876543210.tmp', written: 'a-sheet-2026-11-20.pdf' };
    for (const name of Object.values(files)) writeFileSync(join(exports, name), '%PDF-');
    utimesSync(join(exports, files.old), at(tenMinutesMs + 1000), at(tenMinutesMs + 1000));
    utimesSync(join(exports, files.recent), at(tenMinutesMs - 1000), at(tenMinutesMs - 1000));
    utimesSync(join(exports, files.written), at(3 * tenMinutesMs), at(3 * tenMinutesMs));
    value(await store.list());
    expect(readdirSync(exports).sort()).toEqual([files.recent, files.written].sort());
  });

  it('leaves a temporary file it cannot remove (a read-only share) and still lists the cases', async () => {
    value(await store.create('a.json', demo(), 'created'));
    const name = '.a.json.0123456789ab.tmp';
    writeFileSync(join(folder, name), '');
    utimesSync(join(folder, name), at(3 * tenMinutesMs), at(3 * tenMinutesMs));
    const refusingUnlink = { ...nodeAtomicWriteFs, unlink: async () => Promise.reject(Object.assign(new Error('simulated EROFS'), { code: 'EROFS' })) };
    const readOnly = openCaseStore(folder, { now: clock, fs: refusingUnlink });
    expect(value(await readOnly.list()).map((it) => it.fileName)).toEqual(['a.json']);
    expect(readdirSync(folder)).toContain(name);
  });
});
