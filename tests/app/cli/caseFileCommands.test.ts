import { copyFileSync, existsSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { contentHash } from '../../../app/host/caseJournal';
import { openCaseStore, serializeCase } from '../../../app/host/caseStore';
import { parseCase } from '../../../core/model/parseCase';
import { cli, demoCase, tempDir, testNow } from './harness';

// rename, archive and recover on the command line, through the case store.
// Outside reference: the real file system, read back with Node's fs, and the
// case files read back with the case model; SHA-256 by Node's crypto (FIPS 180-4).

function workspace() {
  const folder = tempDir('case-files-');
  const casePath = join(folder, 'th-0417.json');
  copyFileSync(demoCase('th-0417'), casePath);
  return { folder, casePath };
}

const journalLines = (path: string) => readFileSync(path, 'utf8').split('\n').filter((line) => line.trim() !== '').map((line) => JSON.parse(line) as { change: string; content: string });

describe('rename', () => {
  it('renames a case with its journal and records it; refuses a taken name and a folder part', async () => {
    const { folder, casePath } = workspace();
    await cli('add', 'result', casePath, '--date', '2026-11-24', '--kind', 'ferritin', '--value', '1480', '--unit', 'ug/L');
    const run = await cli('rename', casePath, 'th-0417-old.json');
    expect(run.code, run.err).toBe(0);
    expect(run.out).toBe(`${casePath}: renamed to ${join(folder, 'th-0417-old.json')} (TH-0417), with its journal; the history records the rename.`);
    expect(readdirSync(folder).sort()).toEqual(['th-0417-old.journal.jsonl', 'th-0417-old.json']);
    expect(journalLines(join(folder, 'th-0417-old.journal.jsonl')).at(-1)!.change).toBe('renamed from th-0417.json');

    copyFileSync(demoCase('th-0093'), join(folder, 'th-0093.json'));
    const taken = await cli('rename', join(folder, 'th-0093.json'), 'th-0417-old.json');
    expect(taken.code).toBe(1);
    expect(taken.err).toContain('exists already; th-0093.json was not renamed');
    const elsewhere = await cli('rename', join(folder, 'th-0093.json'), '/tmp/th-0093.json');
    expect(elsewhere.code).toBe(2);
    expect(elsewhere.err).toContain('rename keeps a case in its folder');
    expect(existsSync(join(folder, 'th-0093.json'))).toBe(true);
  });
});

describe('archive', () => {
  it('moves the case and its journal to archive/, never deleting, and numbers a second one', async () => {
    const { folder, casePath } = workspace();
    await cli('add', 'result', casePath, '--date', '2026-11-24', '--kind', 'ferritin', '--value', '1480', '--unit', 'ug/L');
    const before = readFileSync(casePath, 'utf8');
    const run = await cli('archive', casePath);
    expect(run.code, run.err).toBe(0);
    expect(run.out).toContain(`moved to ${join(folder, 'archive', 'th-0417.json')}, with its journal. Nothing was deleted`);
    expect(readFileSync(join(folder, 'archive', 'th-0417.json'), 'utf8')).toBe(before);
    expect(existsSync(join(folder, 'archive', 'th-0417.journal.jsonl'))).toBe(true);
    expect(existsSync(casePath)).toBe(false);
    copyFileSync(demoCase('th-0417'), casePath);
    expect((await cli('archive', casePath)).out).toContain(join('archive', 'th-0417-2.json'));
    const missing = await cli('archive', join(folder, 'nobody.json'));
    expect(missing.code).toBe(1);
    expect(missing.err).toContain('nobody.json: no such file');
  });
});

describe('recover', () => {
  /** A save cut off after its journal line: the journal one state ahead of the file, as the kill test leaves it. */
  async function interruptedSave() {
    const folder = tempDir('case-files-');
    const casePath = join(folder, 'th-0417.json');
    const demo = parseCase(JSON.parse(readFileSync(demoCase('th-0417'), 'utf8')));
    if (!demo.ok) throw new Error('demo invalid');
    const store = openCaseStore(folder, { now: () => testNow });
    const created = await store.create('th-0417.json', demo.value, 'created');
    if (!created.ok) throw new Error('create failed');
    const oldState = readFileSync(casePath, 'utf8');
    const saved = await store.save('th-0417.json', { ...demo.value, review: { ...demo.value.review, notes: [{ date: '2026-11-20', by: 'pharmacist', text: 'second state' }] } }, { expected: created.value.revision, change: 'second state' });
    if (!saved.ok) throw new Error('save failed');
    const newState = readFileSync(casePath, 'utf8');
    // Put the old state back: the journal now holds a state the file does not (a crash between journal line and rename).
    writeFileSync(casePath, oldState);
    return { folder, casePath, journalPath: join(folder, 'th-0417.journal.jsonl'), newState };
  }

  it('shows the journal state and the history on --dry-run and writes nothing; without it, saves that state with one journal line', async () => {
    const { casePath, journalPath, newState } = await interruptedSave();
    const before = readFileSync(casePath, 'utf8');
    const dry = await cli('recover', casePath, '--dry-run');
    expect(dry.code, dry.err).toBe(0);
    expect(dry.out).toContain('("second state"); the file holds an earlier state: the save after it was cut off.');
    expect(dry.out).toContain('Nothing was written (dry run)');
    expect(readFileSync(casePath, 'utf8')).toBe(before);
    const run = await cli('recover', casePath);
    expect(run.code, run.err).toBe(0);
    expect(run.out).toContain(`Saved ${casePath} with the journal's latest state (one journal line)`);
    // The file is now byte for byte the state the journal held (its SHA-256 is the journal line's).
    expect(readFileSync(casePath, 'utf8')).toBe(newState);
    expect(contentHash(readFileSync(casePath))).toBe(contentHash(newState));
    expect(journalLines(journalPath).at(-1)!.change).toMatch(/^recovered the state of .* from the journal$/);
    const again = await cli('recover', casePath);
    expect(again.out).toContain('the file holds that state already');
    expect(again.out).toContain('Nothing to recover.');
  });

  it('brings back a case whose file is corrupt or missing', async () => {
    const { casePath } = workspace();
    await cli('add', 'result', casePath, '--date', '2026-11-24', '--kind', 'ferritin', '--value', '1480', '--unit', 'ug/L');
    const good = readFileSync(casePath, 'utf8');
    writeFileSync(casePath, good.slice(0, 200));
    const corrupt = await cli('recover', casePath);
    expect(corrupt.code, corrupt.err).toBe(0);
    expect(corrupt.out).toContain('the file does not open');
    expect(readFileSync(casePath, 'utf8')).toBe(good);
  });

  it('never writes over a file another program changed; --as saves the journal state beside it', async () => {
    const { folder, casePath } = workspace();
    await cli('add', 'result', casePath, '--date', '2026-11-24', '--kind', 'ferritin', '--value', '1480', '--unit', 'ug/L');
    const journalState = readFileSync(casePath, 'utf8');
    const edited = JSON.parse(journalState);
    edited.review.notes = [{ date: '2026-11-30', by: 'pharmacist', text: 'edited by hand' }];
    writeFileSync(casePath, JSON.stringify(edited, null, 2));
    const outside = readFileSync(casePath, 'utf8');
    const refused = await cli('recover', casePath);
    expect(refused.code).toBe(1);
    expect(refused.out).toContain('the file was changed by another program after it');
    expect(refused.err).toContain('not written over');
    expect(readFileSync(casePath, 'utf8')).toBe(outside);
    const beside = await cli('recover', casePath, '--as', 'th-0417-journal.json');
    expect(beside.code, beside.err).toBe(0);
    expect(readFileSync(join(folder, 'th-0417-journal.json'), 'utf8')).toBe(journalState);
    expect(readFileSync(casePath, 'utf8')).toBe(outside);
  });

  it('says so when there is no journal, and answers --help and wrong use plainly', async () => {
    const { casePath } = workspace();
    const none = await cli('recover', casePath);
    expect(none.code).toBe(1);
    expect(none.err).toContain('th-0417.journal.jsonl holds no readable change; there is nothing to recover for th-0417.json.');
    for (const command of ['rename', 'archive', 'recover']) {
      const help = await cli(command, '--help');
      expect(help.code).toBe(0);
      expect(help.out).toMatch(new RegExp(`^Usage: chelation-ledger ${command} <case\\.json>`));
      const wrong = await cli(command, casePath, 'a.json', 'b.json', '--colour', 'red');
      expect(wrong.code).toBe(2);
      expect(wrong.err).toContain('--colour: not an option of');
      expect(wrong.err).not.toMatch(/\n\s+at /);
    }
  });
});
