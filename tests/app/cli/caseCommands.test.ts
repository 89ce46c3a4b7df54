import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { cli, demoCase as demo } from './harness';

describe('check', () => {
  it('accepts the demo cases', async () => {
    for (const name of ['th-0417', 'th-0093']) {
      const { code, out } = await cli('check', demo(name));
      expect(code).toBe(0);
      expect(out).toContain('valid case file');
    }
  });

  it('lists the issues of a broken file and exits 1, naming the field, the value and the range', async () => {
    const broken = JSON.parse(readFileSync(demo('th-0417'), 'utf8'));
    broken.transfusions[3].unitHaematocrit = 60;
    const dir = mkdtempSync(join(tmpdir(), 'cl-case-'));
    const path = join(dir, 'broken.json');
    writeFileSync(path, JSON.stringify(broken));
    const { code, err } = await cli('check', path);
    expect(code).toBe(1);
    expect(err).toContain('transfusions[3].unitHaematocrit 60 is outside 0.40–0.85; enter it as a fraction (0.60).');
  });

  it('says what is wrong with a missing file or bad JSON', async () => {
    expect((await cli('check', '/nonexistent/case.json')).err).toContain('no such file');
    const dir = mkdtempSync(join(tmpdir(), 'cl-case-'));
    writeFileSync(join(dir, 'bad.json'), '{ "format": ');
    const bad = await cli('check', join(dir, 'bad.json'));
    expect(bad.code).toBe(1);
    expect(bad.err).toContain('is not valid JSON');
  });
});

describe('compute', () => {
  it('prints the readable review of TH-0417 on its review date', async () => {
    const { code, out } = await cli('compute', demo('th-0417'));
    expect(code).toBe(0);
    expect(out).toContain('Iron review for TH-0417');
    expect(out).toContain('as of 2026-11-20');
    expect(out).toContain('for review by the prescriber');
    expect(out).toContain('Measured response between LIC results');
    expect(out).toContain('Projected LIC');
  });

  it('gives the full results as JSON with the same seed repeating exactly', async () => {
    const first = await cli('compute', demo('th-0093'), '--json', '--seed', '7', '--horizon-months', '12');
    const second = await cli('compute', demo('th-0093'), '--json', '--seed', '7', '--horizon-months', '12');
    expect(first.code).toBe(0);
    expect(second.out).toBe(first.out);
    const parsed = JSON.parse(first.out);
    expect(parsed.results.projection.horizonMonths).toBe(12);
    expect(parsed.results.projection.seed).toBe(7);
    expect(parsed.results.intake.derivation.formulaId).toBe('iron-intake-rate');
  });

  it('refuses bad options with the flag and the accepted range, and computes nothing', async () => {
    const { code, out, err } = await cli('compute', demo('th-0093'), '--as-of', '2026-02-30', '--horizon-months', '500');
    expect(code).toBe(1);
    expect(out).toBe('');
    expect(err).toContain('--as-of: "2026-02-30" is not a calendar date');
    expect(err).toContain('--horizon-months: "500" is not a whole number in 1–120.');
  });
});

describe('explain', () => {
  it('lists the results that can be explained', async () => {
    const { code, out } = await cli('explain', demo('th-0417'));
    expect(code).toBe(0);
    expect(out).toContain('intake');
    expect(out).toContain('body-iron');
    expect(out).toContain('projection:current:12');
  });

  it('prints the derivation tree of one result with inputs, origins, formula and sources', async () => {
    const { code, out } = await cli('explain', demo('th-0417'), 'intake');
    expect(code).toBe(0);
    expect(out).toContain('[iron-intake-rate]');
    expect(out).toContain('[net-transfusional-iron]');
    expect(out).toContain('assumption iron-per-ml-red-cells, published default');
    expect(out).toContain('source Brittenham GM');
    expect(out).toContain('for review by the prescriber');
  });

  it('gives the derivation as JSON, and refuses an unknown result naming the known ones', async () => {
    const json = await cli('explain', demo('th-0093'), 'body-iron', '--json');
    expect(JSON.parse(json.out).derivation.formulaId).toBe('body-iron-carried-forward');
    const unknown = await cli('explain', demo('th-0093'), 'iron-magic');
    expect(unknown.code).toBe(1);
    expect(unknown.err).toContain('No result "iron-magic"');
    expect(unknown.err).toContain('intake');
  });
});

describe('explain a finding', () => {
  it('explains the computed trigger of a finding with the calculator that produced it', async () => {
    const list = await cli('explain', demo('th-0093'));
    expect(list.out).toContain('finding:deferoxamine-therapeutic-index');
    const { code, out } = await cli('explain', demo('th-0093'), 'finding:deferoxamine-therapeutic-index');
    expect(code).toBe(0);
    expect(out).toContain('[deferoxamine-therapeutic-index]');
    expect(out).toContain('Porter');
  });
});
