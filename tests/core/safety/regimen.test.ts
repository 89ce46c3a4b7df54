import { afterAll, describe, expect, it } from 'vitest';
import { addDaysIso, addMonthsIso } from '../../../core/dates';
import { expectDescriptive, reviewDate, findingsFor, ofRule, period, producedTexts, result, smallCase } from './safetyCases';

afterAll(() => expectDescriptive(producedTexts));

const withPeriods = (periods: readonly Record<string, unknown>[], options: Parameters<typeof smallCase>[0] = {}) => smallCase({ ...options, chelationPeriods: periods });

describe('dose-outside-published-range (chelator catalogue: labels; references.md §3)', () => {
  it('deferasirox film-coated 28 mg/kg/day is inside 7–28; 29 is above', () => {
    expect(ofRule(findingsFor(withPeriods([period('deferasirox', 28)])), 'dose-outside-published-range')).toHaveLength(0);
    const [finding] = ofRule(findingsFor(withPeriods([period('deferasirox', 29)])), 'dose-outside-published-range');
    expect(finding!.text).toContain('above the published range 7–28 mg/kg/day');
    expect(finding!.sourceIds).toContain('deferasirox-label-us');
  });

  it('deferasirox dispersible 9 mg/kg/day is below 10–40; deferiprone 101 mg/kg/day is above "up to 100"', () => {
    expect(ofRule(findingsFor(withPeriods([period('deferasirox', 9, { formulation: 'dispersible-tablet' })])), 'dose-outside-published-range')[0]!.text).toContain('below the published range 10–40');
    expect(ofRule(findingsFor(withPeriods([period('deferiprone', 101, { administrationsPerDay: 1 })])), 'dose-outside-published-range')[0]!.text).toContain('up to 100 mg/kg/day');
    expect(ofRule(findingsFor(withPeriods([period('deferiprone', 100, { administrationsPerDay: 1 })])), 'dose-outside-published-range')).toHaveLength(0);
  });
});

describe('deferoxamine-growth-limit (deferoxamine label; Brittenham 2011: ≤ 40 mg/kg/day while growing; < 18 years as growing is common practice)', () => {
  it('a 10-year-old at 40 mg/kg/day: information "at"; at 41: review "above"', () => {
    const at = ofRule(findingsFor(withPeriods([period('deferoxamine', 40)], { ageYears: 10, weightKg: 30 })), 'deferoxamine-growth-limit');
    expect(at[0]!.severity).toBe('information');
    expect(at[0]!.text).toContain('at the labelled threshold of 40');
    const above = ofRule(findingsFor(withPeriods([period('deferoxamine', 41)], { ageYears: 17.9, weightKg: 30 })), 'deferoxamine-growth-limit');
    expect(above[0]!.severity).toBe('review');
  });

  it('an 18-year-old at 50 mg/kg/day: no growth finding (and inside 20–60)', () => {
    const findings = findingsFor(withPeriods([period('deferoxamine', 50)], { ageYears: 18 }));
    expect(ofRule(findings, 'deferoxamine-growth-limit')).toHaveLength(0);
    expect(ofRule(findings, 'dose-outside-published-range')).toHaveLength(0);
  });
});

describe('deferoxamine-intravenous-rate (deferoxamine label: at most 15 mg/kg/h)', () => {
  it('50 mg/kg over 3 h (16.7 mg/kg/h) is above; over 4 h (12.5) is not', () => {
    const iv = (hours: number) => withPeriods([period('deferoxamine', 50, { route: 'intravenous', infusionHours: hours })]);
    expect(ofRule(findingsFor(iv(3)), 'deferoxamine-intravenous-rate')[0]!.text).toContain('16.7 mg/kg/h');
    expect(ofRule(findingsFor(iv(4)), 'deferoxamine-intravenous-rate')).toHaveLength(0);
  });
});

describe('deferoxamine-therapeutic-index (Porter et al., Br J Haematol 1989;73:403: greater than 0.025)', () => {
  const withFerritin = (ferritin: number) =>
    withPeriods([period('deferoxamine', 35)], { results: [result('ferritin', 5, ferritin, 'ug/L'), result('liver-iron', 100, 6, 'mg/g{dry}', { method: 'biopsy' })] });

  it('35 mg/kg on 5 nights with ferritin 1000: 25 / 1000 = 0.025 exactly, not above (information)', () => {
    const [finding] = ofRule(findingsFor(withFerritin(1000)), 'deferoxamine-therapeutic-index');
    expect(finding!.severity).toBe('information');
    expect(finding!.triggers[0]!.value).toBe((35 * 5) / 7 / 1000);
    expect(finding!.triggers[0]!.derivation!.formulaId).toBe('deferoxamine-therapeutic-index');
  });

  it('ferritin 996: 25 / 996 ≈ 0.0251, above 0.025 (review)', () => {
    const [finding] = ofRule(findingsFor(withFerritin(996)), 'deferoxamine-therapeutic-index');
    expect(finding!.severity).toBe('review');
    expect(finding!.text).toContain('therapeutic index 0.0251');
    expect(finding!.triggers[0]!.value).toBeCloseTo(25 / 996, 12);
  });
});

describe('deferoxamine-hearing-eyes (US deferoxamine label §5: hearing and eye examinations, yearly; read from the audiology and eye results)', () => {
  const exam = (kind: string, daysBefore: number, outcome: string) => ({ id: `${kind}-${daysBefore}`, date: addDaysIso(reviewDate, -daysBefore), kind, outcome });
  const withExams = (exams: Record<string, unknown>[]) => {
    const json = withPeriods([period('deferoxamine', 40)]);
    return { ...json, results: [...(json['results'] as unknown[]), ...exams] };
  };

  it('none on record: information for each, due on the review date; not on deferoxamine: nothing', () => {
    const found = ofRule(findingsFor(withPeriods([period('deferoxamine', 40)])), 'deferoxamine-hearing-eyes');
    expect(found.map((it) => it.severity)).toEqual(['information', 'information']);
    expect(found[0]!.text).toContain('no hearing (audiology) done is on record');
    expect(ofRule(findingsFor(withPeriods([period('deferasirox', 14)])), 'deferoxamine-hearing-eyes')).toHaveLength(0);
  });

  it('normal results within the year: nothing; a year and a day ago: due again; "not done" does not count', () => {
    expect(ofRule(findingsFor(withExams([exam('audiology', 300, 'normal'), exam('eye-examination', 300, 'normal')])), 'deferoxamine-hearing-eyes')).toHaveLength(0);
    expect(ofRule(findingsFor(withExams([exam('audiology', 366, 'normal'), exam('eye-examination', 300, 'normal')])), 'deferoxamine-hearing-eyes').map((it) => it.text)).toEqual([
      expect.stringContaining('hearing (audiology) due on 2026-11-19'),
    ]);
    expect(ofRule(findingsFor(withExams([exam('audiology', 10, 'not-done'), exam('eye-examination', 300, 'normal')])), 'deferoxamine-hearing-eyes')).toHaveLength(1);
  });

  it('a result changed from baseline is a review finding', () => {
    const [finding] = ofRule(findingsFor(withExams([exam('audiology', 30, 'changed-from-baseline'), exam('eye-examination', 30, 'normal')])), 'deferoxamine-hearing-eyes');
    expect(finding).toMatchObject({ severity: 'review' });
    expect(finding!.text).toContain('recorded as changed from baseline');
  });
});

describe('ascorbic-acid-with-deferoxamine (older US deferoxamine label, vitamin C: after the first month of regular deferoxamine; about 50 mg/day under 10, 100 mg in older children, up to 200 mg in adults; not in cardiac failure)', () => {
  const ascorbic = (mg: number, startDaysBefore = 300) => ({
    id: `vc-${mg}`,
    name: 'ascorbic acid',
    dose: { value: mg, unit: 'mg' },
    timing: 'with-each-deferoxamine-infusion',
    startDate: addDaysIso(reviewDate, -startDaysBefore),
    endDate: null,
  });
  const adult = (mg: number, startDaysBefore?: number, extra: Record<string, unknown> = {}) =>
    ofRule(findingsFor({ ...smallCase({ chelationPeriods: [period('deferoxamine', 40)], coMedications: [ascorbic(mg, startDaysBefore)] }), ...extra }), 'ascorbic-acid-with-deferoxamine');

  it('an adult: 200 mg a day is within the 200 mg cap (information); 201 is above (review)', () => {
    const [within, ...rest] = adult(200);
    expect(rest).toHaveLength(0);
    expect(within).toMatchObject({ severity: 'information' });
    expect(within!.text).toContain('within the labelled threshold of 200 mg a day for the age');
    expect(within!.text).toContain('cardiac failure is not recorded');
    const [above] = adult(201);
    expect(above).toMatchObject({ severity: 'review' });
    expect(above!.text).toContain('above the labelled threshold of 200 mg a day, the most the label gives');
  });

  it('amounts by age (what the label says generally suffices): under 10 years 50 mg, older children 100 mg; above them information, above 200 mg review', () => {
    const child = (ageYears: number, mg: number) =>
      ofRule(findingsFor(smallCase({ ageYears, weightKg: ageYears < 10 ? 23 : 45, heightCm: ageYears < 10 ? 121 : 155, chelationPeriods: [period('deferoxamine', 30)], coMedications: [ascorbic(mg)] })), 'ascorbic-acid-with-deferoxamine');
    expect(child(7, 50).map((it) => [it.severity, it.text.includes('within the labelled threshold of 50 mg a day for the age')])).toEqual([['information', true]]);
    expect(child(7, 51).map((it) => [it.severity, it.text.includes('above the labelled threshold of 50 mg a day that the label says generally suffices')])).toEqual([['information', true]]);
    expect(child(14, 100)[0]!.text).toContain('within the labelled threshold of 100 mg a day');
    expect(child(14, 101)[0]!.text).toContain('above the labelled threshold of 100 mg a day');
    expect(child(7, 201).map((it) => it.severity)).toEqual(['review']);
  });

  it('after the first month of regular deferoxamine: from the day the month ends nothing; a day earlier, review', () => {
    // period() starts deferoxamine 400 days before the review date.
    const runStart = addDaysIso(reviewDate, -400);
    const monthEnds = addMonthsIso(runStart, 1);
    const daysBefore = (date: string) => Math.round((Date.parse(`${reviewDate}T00:00:00Z`) - Date.parse(`${date}T00:00:00Z`)) / 86400000);
    expect(adult(150, daysBefore(monthEnds)).map((it) => it.severity)).toEqual(['information']);
    const early = adult(150, daysBefore(monthEnds) + 1);
    expect(early.map((it) => it.severity)).toEqual(['review', 'information']);
    expect(early[0]!.text).toContain('within the first month of regular deferoxamine');
  });

  it('without deferoxamine: review; with cardiac failure recorded: review; recorded absent: information only', () => {
    expect(ofRule(findingsFor(smallCase({ chelationPeriods: [period('deferasirox', 14)], coMedications: [ascorbic(150)] })), 'ascorbic-acid-with-deferoxamine')[0]!.text).toContain('no deferoxamine running');
    const failure = (status: string) => ({ clinicalState: { cardiacFailure: [{ id: 'cf', date: addDaysIso(reviewDate, -30), status }] } });
    expect(adult(150, undefined, failure('present')).map((it) => [it.severity, it.text.includes('excludes vitamin C supplements in cardiac failure')])).toEqual([
      ['review', true],
      ['information', false],
    ]);
    expect(adult(150, undefined, failure('absent')).map((it) => it.severity)).toEqual(['information']);
  });

  it('severe heart iron (T2* 8 ms) without cardiac failure recorded: review', () => {
    const heart = smallCase({
      chelationPeriods: [period('deferoxamine', 40)],
      coMedications: [ascorbic(150)],
      results: [result('cardiac-t2star', 20, 8, 'ms', { fieldStrengthT: 1.5 }), result('liver-iron', 20, 8, 'mg/g{dry}', { method: 'biopsy' })],
    });
    expect(ofRule(findingsFor(heart), 'ascorbic-acid-with-deferoxamine').some((it) => it.severity === 'review' && it.text.includes('cardiac failure'))).toBe(true);
  });
});

describe('chelator-combination and pregnancy-or-breastfeeding', () => {
  it('two chelators: information listing both; one: nothing', () => {
    const [finding] = ofRule(findingsFor(withPeriods([period('deferiprone', 25), period('deferoxamine', 40)])), 'chelator-combination');
    expect(finding!.text).toContain('deferiprone tablets 75 mg/kg/day with deferoxamine vials 40 mg/kg/day on 5 days a week');
    expect(ofRule(findingsFor(withPeriods([period('deferiprone', 25)])), 'chelator-combination')).toHaveLength(0);
  });

  it('pregnancy: urgent flag only, first in the list, with no dose arithmetic', () => {
    const findings = findingsFor(withPeriods([period('deferasirox', 14)], { pregnancy: 'pregnant', sexAtBirth: 'female' }));
    expect(findings[0]!.ruleId).toBe('pregnancy-or-breastfeeding');
    expect(findings[0]!.severity).toBe('urgent');
    expect(findings[0]!.text).not.toMatch(/mg\/kg/);
    expect(ofRule(findingsFor(withPeriods([period('deferasirox', 14)], { pregnancy: 'breastfeeding', sexAtBirth: 'female' })), 'pregnancy-or-breastfeeding')[0]!.text).toMatch(/^Breastfeeding/);
    expect(ofRule(findingsFor(withPeriods([period('deferasirox', 14)])), 'pregnancy-or-breastfeeding')).toHaveLength(0);
  });
});
