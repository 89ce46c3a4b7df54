import { copyFileSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { openCaseStore } from '../../../app/host/caseStore';
import { cli, demoCase, runWith, tempDir, testNow } from './harness';
import { faultyFs } from '../host/faultyFs';

// The messages are those of `check` (the case model's), so each refusal below
// is compared with what check says for the same file; the unit-haematocrit
// advice follows the case model's fraction rule (haematocrit as a fraction of 1, ICSH practice).

const newArgs = (path: string) => ['new', path, '--label', 'KT-0003', '--birth-date', '2014-02-03', '--sex-at-birth', 'female', '--diagnosis-group', 'thalassaemia-major', '--weight-kg', '35', '--weight-date', '2026-01-10'];

describe('new and add', () => {
  it('new creates a valid case that check accepts, and refuses to replace it', async () => {
    const path = join(tempDir(), 'kt.json');
    const created = await cli(...newArgs(path));
    expect(created.code).toBe(0);
    expect((await cli('check', path)).out).toContain('valid case file (KT-0003)');
    const again = await cli(...newArgs(path));
    expect(again.code).toBe(1);
    expect(again.err).toContain('exists already');
  });

  it('new with a bad value names the field, the value and the range, and creates nothing', async () => {
    const folder = tempDir();
    const args = newArgs(join(folder, 'kt.json'));
    args[args.indexOf('--weight-kg') + 1] = '-3';
    const run = await cli(...args);
    expect(run.code).toBe(1);
    expect(run.err).toContain('patient.weights[0].weight.value -3 kg is not possible');
    expect(run.err).toContain('What was typed');
  });

  it('add records each kind with a journal line, and a refused entry is shown as typed with the check message', async () => {
    const path = join(tempDir(), 'kt.json');
    await cli(...newArgs(path));
    expect((await cli('add', 'transfusion', path, '--date', '2026-02-01', '--volume-ml', '520', '--unit-haematocrit', '0.58', '--units', '2')).code).toBe(0);
    expect((await cli('add', 'result', path, '--date', '2026-02-01', '--kind', 'ferritin', '--value', '1650', '--unit', 'ug/L')).code).toBe(0);
    expect((await cli('add', 'period', path, '--drug', 'deferasirox', '--formulation', 'film-coated-tablet', '--dose', '14', '--administrations-per-day', '1', '--days-per-week', '7', '--start', '2026-02-02')).code).toBe(0);
    expect((await cli('add', 'comedication', path, '--name', 'ascorbic acid', '--start', '2026-02-02')).code).toBe(0);
    const saved = JSON.parse(readFileSync(path, 'utf8'));
    expect(saved.transfusions[0]).toEqual({ id: 't-2026-02-01', date: '2026-02-01', kind: 'simple', volume: { value: 520, unit: 'mL' }, unitHaematocrit: 0.58, unitCount: 2 });
    expect(saved.chelationPeriods[0].route).toBe('oral');
    const history = await openCaseStore(join(path, '..')).history('kt.json');
    expect(history.ok && history.value.entries.map((it) => it.change)).toEqual([
      'created',
      'added simple transfusion on 2026-02-01',
      'added ferritin result on 2026-02-01',
      'added deferasirox period from 2026-02-02',
      'added co-medication ascorbic acid from 2026-02-02',
    ]);
    const refused = await cli('add', 'transfusion', path, '--date', '2026-03-01', '--volume-ml', '520', '--unit-haematocrit', '60');
    expect(refused.code).toBe(1);
    expect(refused.err).toContain('transfusions[1].unitHaematocrit 60 is outside 0.40–0.85; enter it as a fraction (0.60).');
    expect(refused.err).toContain('"unitHaematocrit":60');
    // The same message check gives for the same value written by hand.
    const byHand = { ...saved, transfusions: [...saved.transfusions, { id: 'x', date: '2026-03-01', kind: 'simple', volume: { value: 520, unit: 'mL' }, unitHaematocrit: 60, unitCount: 1 }] };
    const other = join(tempDir(), 'by-hand.json');
    writeFileSync(other, JSON.stringify(byHand));
    expect((await cli('check', other)).err).toContain('transfusions[1].unitHaematocrit 60 is outside 0.40–0.85; enter it as a fraction (0.60).');
  });

  it('add on a full disk says so, names the file, keeps the old file and shows what was typed', async () => {
    const folder = tempDir();
    const path = join(folder, 'kt.json');
    await cli(...newArgs(path));
    const before = readFileSync(path, 'utf8');
    const run = await runWith(['add', 'result', path, '--date', '2026-02-01', '--kind', 'ferritin', '--value', '1650', '--unit', 'ug/L'], {
      openStore: (dir) => openCaseStore(dir, { now: () => testNow, fs: faultyFs('writeFile', 'ENOSPC') }),
    });
    expect(run.code).toBe(1);
    expect(run.err).toContain('the disk is full');
    expect(run.err).toContain('"value":1650');
    expect(readFileSync(path, 'utf8')).toBe(before);
  });

  it('rejects unknown flags and kinds with usage', async () => {
    expect((await cli('add', 'transfusion', 'x.json', '--volume', '3')).err).toContain('--volume: not an option of add transfusion');
    expect((await cli('add', 'dose', 'x.json')).err).toContain('"dose" is not something add records');
  });
});

describe('panel', () => {
  it('lists every case ranked, and a case that does not open with its reason', async () => {
    const folder = tempDir();
    copyFileSync(demoCase('th-0417'), join(folder, 'th-0417.json'));
    copyFileSync(demoCase('th-0093'), join(folder, 'th-0093.json'));
    writeFileSync(join(folder, 'broken.json'), '{');
    const run = await cli('panel', folder, '--as-of', '2026-11-20', '--json');
    expect(run.code).toBe(0);
    const panel = JSON.parse(run.out);
    expect(panel.rows.map((row: { label: string }) => row.label).sort()).toEqual(['TH-0093', 'TH-0417']);
    expect(panel.notReviewed[0].fileName).toBe('broken.json');
    expect(panel.caution).toContain('for review by the prescriber');
    const text = await cli('panel', folder, '--as-of', '2026-11-20');
    expect(text.out).toContain('broken.json: Case file');
    expect(text.out).toMatch(/1\. TH-\d{4} \(th-\d{4}\.json\) as of 2026-11-20/);
  });

  it('refuses a bad --as-of', async () => {
    expect((await cli('panel', tempDir(), '--as-of', '20-11-2026')).err).toContain('--as-of: "20-11-2026" is not a calendar date');
  });
});
