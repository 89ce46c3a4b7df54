import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { th0322 } from '../../core/safety/scenarioCases';
import { cli, demoCase as demo, writeTemp as written } from './harness';

describe('findings', () => {
  it('prints TH-0093’s findings readably with severities and short citations (Porter 1989 for the therapeutic index)', async () => {
    const { code, out } = await cli('findings', demo('th-0093'));
    expect(code).toBe(0);
    expect(out).toContain('Safety findings for TH-0093 as of 2026-11-20');
    expect(out).toContain('for review by the prescriber');
    expect(out).toMatch(/INFO\s+Deferoxamine therapeutic index 0\.0229/);
    expect(out).toContain('Porter JB, et al., Br J Haematol 1989;73:403-409');
  });

  it('exits 0 with urgent findings (it is a report): TH-0322 lists the urgent ones first', async () => {
    const { code, out } = await cli('findings', written(th0322()), '--as-of', '2026-11-20');
    expect(code).toBe(0);
    const severities = out.split('\n').map((line) => /^\s+(URGENT|REVIEW|INFO)\b/.exec(line)?.[1]).filter(Boolean);
    expect(severities.slice(0, 2)).toEqual(['URGENT', 'URGENT']);
    expect(severities.indexOf('URGENT', 2)).toBe(-1);
  });

  it('--json gives the findings with their rule ids, triggers and sources', async () => {
    const { code, out } = await cli('findings', demo('th-0417'), '--json');
    expect(code).toBe(0);
    const parsed = JSON.parse(out);
    expect(parsed.asOf).toBe('2026-11-20');
    expect(parsed.findings.map((it: { ruleId: string }) => it.ruleId)).toContain('deferasirox-monthly-tests');
    expect(parsed.findings.every((it: { sourceIds: string[] }) => it.sourceIds.length > 0)).toBe(true);
  });

  it('exits 1 on an invalid case file, naming the field, and on a bad date', async () => {
    const broken = JSON.parse(readFileSync(demo('th-0417'), 'utf8'));
    broken.transfusions[3].unitHaematocrit = 60;
    const bad = await cli('findings', written(broken));
    expect(bad.code).toBe(1);
    expect(bad.out).toBe('');
    expect(bad.err).toContain('transfusions[3].unitHaematocrit');
    expect((await cli('findings', demo('th-0417'), '--as-of', '2026-02-30')).code).toBe(1);
  });
});

describe('compute includes the findings', () => {
  it('in the JSON output object and at the top of the readable summary', async () => {
    const json = JSON.parse((await cli('compute', demo('th-0093'), '--json', '--horizon-months', '12')).out);
    expect(json.findings.map((it: { ruleId: string }) => it.ruleId)).toContain('deferoxamine-therapeutic-index');
    const { out } = await cli('compute', demo('th-0417'));
    expect(out.indexOf('Findings (urgent first')).toBeGreaterThan(0);
    expect(out.indexOf('Findings (urgent first')).toBeLessThan(out.indexOf('Transfusional iron'));
    expect(out).toContain('At this regimen intake exceeds the expected removal by');
  });
});

describe('a local protocol threshold recorded in the case', () => {
  it('applies to the findings and shows as local, with who set it and why; an unknown threshold is refused', async () => {
    const json = JSON.parse(readFileSync(demo('th-0093'), 'utf8'));
    // Scenario TH-0093 (therapeutic index about 0.023): a local protocol alerting at 0.02
    // turns the information finding into one for review (Porter 1989 publishes 0.025).
    json.thresholdOverrides = { 'deferoxamine-therapeutic-index': { value: 0.02, reason: 'local audiology protocol', by: 'Pharmacist AB', at: '2026-11-01' } };
    const local = await cli('findings', written(json), '--json');
    expect(local.code).toBe(0);
    const findings = JSON.parse(local.out).findings as { ruleId: string; severity: string; text: string }[];
    const index = findings.find((it) => it.ruleId === 'deferoxamine-therapeutic-index')!;
    expect(index.severity).toBe('review');
    expect(index.text).toContain('local audiology protocol');
    json.thresholdOverrides = { 'no-such-threshold': { value: 1, reason: 'x', by: 'y', at: '2026-11-01' } };
    const unknown = await cli('check', written(json));
    expect(unknown.code).toBe(1);
    expect(unknown.err).toContain('Threshold "no-such-threshold" is not catalogued');
  });
});
