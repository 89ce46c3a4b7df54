import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { cli, demoCase, tempDir, writeTemp } from './harness';

// The crash paths of issue 17, each reproduced first as a stack trace: a case that `check`
// accepts must give a review (exit 0, findings where a value is out of the published
// range) or a message naming the field, the value and the range (exit 1), never exit 3.
// Outside reference for the dose ranges: the labels as summarised in references.md §3
// (deferasirox film-coated up to 28 mg/kg/day; deferiprone up to 100 mg/kg/day).
const th0417 = () => JSON.parse(readFileSync(demoCase('th-0417'), 'utf8'));

function variant(change: (json: any) => void): string {
  const json = th0417();
  change(json);
  return writeTemp(json);
}

const heavy = variant((json) => {
  json.patient.weights.at(-1).weight.value = 230;
});
const lic70 = variant((json) => {
  const lic = json.results.findLast((it: any) => it.kind === 'liver-iron');
  Object.assign(lic, { method: 'biopsy', measured: { value: 70, unit: 'mg/g{dry}' } });
  delete lic.fieldStrengthT;
  delete lic.calibrationId;
});
const deferasiroxTimesThree = variant((json) => {
  Object.assign(json.chelationPeriods.at(-1), { dose: { value: 60, unit: 'mg/kg' }, administrationsPerDay: 3 });
});
const deferiproneTimesThree = variant((json) => {
  json.chelationPeriods[json.chelationPeriods.length - 1] = {
    id: 'chel-dfp',
    drug: 'deferiprone',
    formulation: 'tablet',
    route: 'oral',
    dose: { value: 75, unit: 'mg/kg' },
    administrationsPerDay: 3,
    daysPerWeek: 7,
    startDate: '2025-05-20',
    endDate: null,
    adherence: 1,
  };
});

describe('values check accepts, outside the calculators’ old ranges', () => {
  for (const [label, path] of [
    ['weight 230 kg', heavy],
    ['LIC 70 mg/g dry', lic70],
    ['deferasirox 60 mg/kg × 3 a day', deferasiroxTimesThree],
    ['deferiprone 75 mg/kg × 3 a day', deferiproneTimesThree],
  ] as const) {
    it(`${label}: check warns, compute, findings, explain and calendar finish with exit 0`, async () => {
      const checked = await cli('check', path);
      expect(checked.code).toBe(0);
      expect(checked.err).toContain('warning');
      for (const command of ['compute', 'findings', 'explain', 'calendar']) {
        const run = await cli(command, path);
        expect(run.code, `${command}: ${run.err}`).toBe(0);
        expect(run.err).not.toMatch(/unexpected internal error|\bat .*:\d+:\d+/);
      }
    });
  }

  it('a daily dose far above the labelled range is a finding, not a refusal', async () => {
    for (const path of [deferasiroxTimesThree, deferiproneTimesThree]) {
      const { code, out } = await cli('findings', path, '--json');
      expect(code).toBe(0);
      const findings = JSON.parse(out).findings as { ruleId: string; severity: string }[];
      expect(findings.some((it) => /dose/.test(it.ruleId) && it.severity !== 'information')).toBe(true);
    }
  });
});

describe('review dates far from the record', () => {
  it('refuses a review more than 5 years after the last entry, naming the flag and the window (exit 1)', async () => {
    for (const date of ['2034-12-31', '2100-12-31']) {
      const { code, out, err } = await cli('compute', demoCase('th-0417'), '--as-of', date);
      expect(code).toBe(1);
      expect(out).toBe('');
      expect(err).toContain(`--as-of: Review date ${date} is more than 5 years after its last dated entry`);
      expect(err).toContain('2021-09-01 to 2031-11-17');
    }
  });

  it('refuses dates outside 1900–2100 and dates before the record for every review command', async () => {
    for (const command of ['compute', 'findings', 'explain', 'calendar']) {
      for (const date of ['0100-01-01', '9999-12-31', '1950-01-01']) {
        const { code, err } = await cli(command, demoCase('th-0417'), '--as-of', date);
        expect(code, `${command} ${date}`).toBe(1);
        expect(err).toMatch(/--as-of: Review date/);
      }
    }
  });
});

describe('strict options', () => {
  it('refuses a repeated flag and names both values (exit 2)', async () => {
    const { code, err } = await cli('compute', demoCase('th-0417'), '--seed', '1', '--seed', '2');
    expect(code).toBe(2);
    expect(err).toBe('--seed: given 2 times ("1", "2"); give it once.');
    expect((await cli('binding', '--weight-kg', '52', '--weight-kg=60')).code).toBe(2);
  });

  it('refuses hexadecimal, empty and non-integer values with the accepted form', async () => {
    const hex = await cli('calc', 'transfusion-iron', '--volume-ml', '0x10', '--unit-haematocrit', '0.6');
    expect(hex.code).toBe(1);
    expect(hex.err).toContain('Volume transfused "0x10" is not a number');
    const empty = await cli('calc', 'transfusion-iron', '--volume-ml=', '--unit-haematocrit', '0.6');
    expect(empty.code).toBe(1);
    expect(empty.err).toContain('--volume-ml: a value is missing');
    const seed = await cli('compute', demoCase('th-0417'), '--seed', '1.5');
    expect(seed.err).toContain('--seed: "1.5" is not a whole number in 0–2147483647.');
    const blankSeed = await cli('compute', demoCase('th-0417'), '--seed', ' ');
    expect(blankSeed.code).toBe(1);
    const garbage = await cli('findings', demoCase('th-0417'), '--as-of', '2026-01-01garbage');
    expect(garbage.code).toBe(1);
    expect(garbage.err).toContain('is not a calendar date written YYYY-MM-DD');
    const dose = await cli('dose', '--product', 'deferasirox-film-coated', '--target-mg-per-kg-per-day', '0x1C', '--weight-kg', '52');
    expect(dose.err).toContain('--target-mg-per-kg-per-day: "0x1C" is not a number.');
  });

  it('check refuses a second file and options it does not take instead of ignoring them', async () => {
    const two = await cli('check', demoCase('th-0417'), demoCase('th-0093'));
    expect(two.code).toBe(2);
    expect(two.err).toContain('check takes one case file');
    const option = await cli('check', demoCase('th-0417'), '--as-of', '2026-01-01');
    expect(option.code).toBe(2);
    expect(option.err).toContain('--as-of: not an option of check');
    expect((await cli('compute', demoCase('th-0417'), '--force')).err).toContain('--force: not an option of compute');
  });
});

describe('model gaps found by the fuzz run', () => {
  it('refuses "__proto__" in thresholdOverrides instead of dropping it silently', async () => {
    const text = JSON.stringify(th0417()).replace(/}$/, ', "thresholdOverrides": {"__proto__": {"value": 1, "reason": "x", "by": "y", "at": "2026-01-01"}}}');
    const { code, err } = await cli('check', writeTemp(text));
    expect(code).toBe(1);
    expect(err).toContain('thresholdOverrides.__proto__ is a reserved name, not a threshold id');
  });

  it('warns about a period duplicated inside a proposed regimen (it would count the dose twice)', async () => {
    const path = variant((json) => {
      const proposal = json.proposedRegimens[0];
      proposal.periods.push({ ...proposal.periods[0], id: 'duplicate' });
    });
    const { code, err } = await cli('check', path);
    expect(code).toBe(0);
    expect(err).toContain('proposedRegimens[0].periods[1] (deferasirox from 2026-11-20) overlaps proposedRegimens[0].periods[0] of the same drug');
  });
});

describe('calendar output', () => {
  it('never writes over the case file it reads, even with --force', async () => {
    const path = variant(() => undefined);
    const before = readFileSync(path, 'utf8');
    const { code, err } = await cli('calendar', path, '-o', path, '--force');
    expect(code).toBe(1);
    expect(err).toContain('is the file this command reads');
    expect(readFileSync(path, 'utf8')).toBe(before);
  });

  it('says a folder given to -o is a folder, instead of suggesting --force', async () => {
    const folder = tempDir();
    const { code, err } = await cli('calendar', demoCase('th-0417'), '-o', folder);
    expect(code).toBe(1);
    expect(err).toContain(`${folder} is a folder; give a file name for the calendar after -o`);
    expect(err).not.toContain('--force');
  });
});
