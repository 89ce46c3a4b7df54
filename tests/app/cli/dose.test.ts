import { describe, expect, it } from 'vitest';
import { ok } from '../../../core/result';
import { runWith, type CliRun } from './harness';

/** The dose command with a fake file reader holding `files`. */
const cli = (argv: string[], files: Record<string, string> = {}): Promise<CliRun> => runWith(argv, { readText: (path) => ok(files[path] ?? '') });

describe('dose command', () => {
  it('proposes TH-0417 at 28 mg/kg/day film-coated: 4 × 360 mg, 27.7 mg/kg/day (hand arithmetic: 1,440 / 52)', async () => {
    const { code, out } = await cli(['dose', '--product', 'deferasirox-film-coated', '--target-mg-per-kg-per-day', '28', '--weight-kg', '52']);
    expect(code).toBe(0);
    expect(out).toContain('deferasirox film-coated tablets: 4 × 360 mg per administration');
    expect(out).toContain('27.7 mg/kg/day at 52 kg, 16 mg a day (1.1 %) below the intended 28 mg/kg/day');
    expect(out).toContain('source: Deferasirox prescribing information: presentations');
    expect(out).toContain('[memory]');
  });

  it('gives TH-0093 the vials per infusion as JSON (40 mg/kg × 23 kg = 920 mg → 2 × 500 mg, 80 mg left)', async () => {
    const { code, out } = await cli(['dose', '--product', 'deferoxamine-vials', '--target-mg-per-kg-per-administration', '40', '--weight-kg', '23', '--json']);
    expect(code).toBe(0);
    expect(JSON.parse(out).form).toEqual({ kind: 'vials', vials: [{ strengthMg: 500, vials: 2 }], openedMg: 1000, wasteMg: 80 });
  });

  it('uses a local formulary catalogue instead of the shipped strengths', async () => {
    // A formulary stocking only 360 mg: 1,092 mg → 1,080 (3 tablets) stays; at 28 mg/kg/day 1,456 → 1,440 (4 tablets).
    const local = JSON.stringify([
      { id: 'deferasirox-film-coated', drug: 'deferasirox', kind: 'tablets', name: 'local deferasirox 360', strengths: [{ strengthMg: 360, halvable: false }], sourceIds: ['local-formulary'] },
    ]);
    const { code, out } = await cli(['dose', '--product', 'deferasirox-film-coated', '--target-mg-per-kg-per-day', '24', '--weight-kg', '52', '--catalogue', 'local.json'], { 'local.json': local });
    // 24 × 52 = 1,248 mg: 1,080 (168 below) against 1,440 (192 above) → 3 × 360.
    expect(code).toBe(0);
    expect(out).toContain('local deferasirox 360: 3 × 360 mg per administration');
    expect(out).toContain('source: local-formulary (local catalogue)');
  });

  it('reads back its own dose --list --json as a local catalogue (the documented shape)', async () => {
    const listed = (await cli(['dose', '--list', '--json'])).out;
    const again = await cli(['dose', '--list', '--json', '--catalogue', 'copy.json'], { 'copy.json': listed });
    expect(again.code).toBe(0);
    expect(JSON.parse(again.out)).toEqual(JSON.parse(listed));
  });

  it('lists the products with their strengths', async () => {
    const { code, out } = await cli(['dose', '--list']);
    expect(code).toBe(0);
    expect(out).toContain('deferiprone-tablets — deferiprone film-coated tablets: 500 mg (halves allowed), 1000 mg (halves allowed)');
    expect(out).toContain('deferoxamine-vials — deferoxamine mesylate powder for injection, single-use vials: 500 mg, 2000 mg');
  });

  it('names the flag, the value and the range of bad input', async () => {
    const bad = await cli(['dose', '--product', 'deferasirox-film-coated', '--target-mg-per-kg-per-day', '28', '--weight-kg', '520']);
    expect(bad.code).toBe(1);
    expect(bad.err).toBe('--weight-kg: Body weight (kg) 520 is outside the plausible range 2–200.');
    const both = await cli(['dose', '--product', 'deferoxamine-vials', '--target-mg-per-kg-per-day', '40', '--target-mg-per-kg-per-administration', '40', '--weight-kg', '23']);
    expect(both.err).toContain('Give exactly one of');
    const unknown = await cli(['dose', '--product', 'deferasirox-chewable', '--target-mg-per-kg-per-day', '28', '--weight-kg', '52']);
    expect(unknown.err).toContain('--product: Product "deferasirox-chewable" is not in the catalogue');
    const broken = await cli(['dose', '--list', '--catalogue', 'bad.json'], { 'bad.json': '[{"id": "x"' });
    expect(broken.err).toContain('Product catalogue bad.json is not valid JSON');
  });

  it('is offered by calc as the practical-dose calculator', async () => {
    const { code, out } = await cli(['calc', 'practical-dose', '--product', 'deferasirox-film-coated', '--target-mg-per-kg-per-day', '21', '--weight-kg', '52']);
    expect(code).toBe(0);
    expect(out).toContain('combination 3 × 360 mg');
    expect((await cli(['calc', '--list'])).out).toContain('practical-dose — Practical dose from the available strengths');
  });
});
