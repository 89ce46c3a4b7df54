import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runCli } from '../../../app/cli/main';
import { readCaseFile } from '../../../app/host/caseFiles';
import { th0322 } from '../../core/safety/scenarioCases';

const demo = (name: string) => new URL(`../../../assets/demo/${name}.json`, import.meta.url).pathname;

function cli(...argv: string[]) {
  const out: string[] = [];
  const err: string[] = [];
  const code = runCli(argv, { out: (text) => out.push(text), err: (text) => err.push(text), readCase: readCaseFile, today: () => '2026-12-01' });
  return { code, out: out.join('\n'), err: err.join('\n') };
}

function written(json: unknown): string {
  const path = join(mkdtempSync(join(tmpdir(), 'cl-findings-')), 'case.json');
  writeFileSync(path, JSON.stringify(json));
  return path;
}

describe('findings', () => {
  it('prints TH-0093’s findings readably with severities and short citations (Porter 1989 for the therapeutic index)', () => {
    const { code, out } = cli('findings', demo('th-0093'));
    expect(code).toBe(0);
    expect(out).toContain('Safety findings for TH-0093 as of 2026-11-20');
    expect(out).toContain('for review by the prescriber');
    expect(out).toMatch(/INFO\s+Deferoxamine therapeutic index 0\.0229/);
    expect(out).toContain('Porter JB, et al., Br J Haematol 1989;73:403-409');
  });

  it('exits 0 with urgent findings (it is a report): TH-0322 lists the urgent ones first', () => {
    const { code, out } = cli('findings', written(th0322()), '--as-of', '2026-11-20');
    expect(code).toBe(0);
    const severities = out.split('\n').map((line) => /^\s+(URGENT|REVIEW|INFO)\b/.exec(line)?.[1]).filter(Boolean);
    expect(severities.slice(0, 2)).toEqual(['URGENT', 'URGENT']);
    expect(severities.indexOf('URGENT', 2)).toBe(-1);
  });

  it('--json gives the findings with their rule ids, triggers and sources', () => {
    const { code, out } = cli('findings', demo('th-0417'), '--json');
    expect(code).toBe(0);
    const parsed = JSON.parse(out);
    expect(parsed.asOf).toBe('2026-11-20');
    expect(parsed.findings.map((it: { ruleId: string }) => it.ruleId)).toContain('deferasirox-monthly-tests');
    expect(parsed.findings.every((it: { sourceIds: string[] }) => it.sourceIds.length > 0)).toBe(true);
  });

  it('exits 1 on an invalid case file, naming the field, and on a bad date', () => {
    const broken = JSON.parse(readFileSync(demo('th-0417'), 'utf8'));
    broken.transfusions[3].unitHaematocrit = 60;
    const bad = cli('findings', written(broken));
    expect(bad.code).toBe(1);
    expect(bad.out).toBe('');
    expect(bad.err).toContain('transfusions[3].unitHaematocrit');
    expect(cli('findings', demo('th-0417'), '--as-of', '2026-02-30').code).toBe(1);
  });
});

describe('compute includes the findings', () => {
  it('in the JSON output object and at the top of the readable summary', () => {
    const json = JSON.parse(cli('compute', demo('th-0093'), '--json', '--horizon-months', '12').out);
    expect(json.findings.map((it: { ruleId: string }) => it.ruleId)).toContain('deferoxamine-therapeutic-index');
    const { out } = cli('compute', demo('th-0417'));
    expect(out.indexOf('Findings (urgent first')).toBeGreaterThan(0);
    expect(out.indexOf('Findings (urgent first')).toBeLessThan(out.indexOf('Transfusional iron'));
    expect(out).toContain('At this regimen intake exceeds the expected removal by');
  });
});

describe('a local protocol threshold recorded in the case', () => {
  it('applies to the findings and shows as local, with who set it and why; an unknown threshold is refused', () => {
    const demoPath = new URL('../../../assets/demo/th-0093.json', import.meta.url).pathname;
    const json = JSON.parse(readFileSync(demoPath, 'utf8'));
    // Scenario TH-0093 (therapeutic index about 0.023): a local protocol alerting at 0.02
    // turns the information finding into one for review (Porter 1989 publishes 0.025).
    json.thresholdOverrides = { 'deferoxamine-therapeutic-index': { value: 0.02, reason: 'local audiology protocol', by: 'Pharmacist AB', at: '2026-11-01' } };
    const dir = mkdtempSync(join(tmpdir(), 'cl-threshold-'));
    writeFileSync(join(dir, 'case.json'), JSON.stringify(json));
    const out: string[] = [];
    const err: string[] = [];
    const io = { out: (text: string) => out.push(text), err: (text: string) => err.push(text), readCase: readCaseFile, today: () => '2026-12-01' };
    expect(runCli(['findings', join(dir, 'case.json'), '--json'], io)).toBe(0);
    const findings = JSON.parse(out.join('\n')).findings as { ruleId: string; severity: string; text: string }[];
    const index = findings.find((it) => it.ruleId === 'deferoxamine-therapeutic-index')!;
    expect(index.severity).toBe('review');
    expect(index.text).toContain('local audiology protocol');
    json.thresholdOverrides = { 'no-such-threshold': { value: 1, reason: 'x', by: 'y', at: '2026-11-01' } };
    writeFileSync(join(dir, 'case.json'), JSON.stringify(json));
    err.length = 0;
    expect(runCli(['check', join(dir, 'case.json')], io)).toBe(1);
    expect(err.join('\n')).toContain('Threshold "no-such-threshold" is not catalogued');
  });
});
