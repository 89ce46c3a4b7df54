import { afterAll, describe, expect, it } from 'vitest';
import { expectDescriptive, findingsFor, ofRule, period, producedTexts, result, smallCase } from './safetyCases';

afterAll(() => expectDescriptive(producedTexts));

const onDrug = (drug: 'deferasirox' | 'deferiprone' | 'deferoxamine', results: readonly Record<string, unknown>[]) =>
  smallCase({ results: [...results, result('liver-iron', 100, 6, 'mg/g{dry}', { method: 'biopsy' })], chelationPeriods: [period(drug, drug === 'deferiprone' ? 25 : drug === 'deferasirox' ? 14 : 40)] });

describe('alt-raised (5 × an assumed ULN of 40 U/L; from memory, flagged)', () => {
  it('ALT 200 U/L is not above 5 × 40; 201 is, on deferasirox', () => {
    expect(ofRule(findingsFor(onDrug('deferasirox', [result('alt', 5, 200, 'U/L')])), 'alt-raised')).toHaveLength(0);
    const [finding] = ofRule(findingsFor(onDrug('deferasirox', [result('alt', 5, 201, 'U/L')])), 'alt-raised');
    expect(finding!.severity).toBe('review');
    expect(finding!.sourceUncertain).toBe(true);
    expect(finding!.text).toContain('assumed upper limit of normal of 40 U/L');
  });

  it('no chelator that the rule concerns: no finding', () => {
    expect(ofRule(findingsFor(onDrug('deferoxamine', [result('alt', 5, 400, 'U/L')])), 'alt-raised')).toHaveLength(0);
  });
});

describe('low-iron-on-chelation (deferasirox and deferiprone labels: ferritin consistently < 500 µg/L, LIC < 3 mg/g dry)', () => {
  it('two consecutive ferritins of 499 µg/L: review; 500 then 499 is not two below', () => {
    const [finding] = ofRule(findingsFor(onDrug('deferasirox', [result('ferritin', 40, 499, 'ug/L'), result('ferritin', 5, 499, 'ug/L')])), 'low-iron-on-chelation');
    expect(finding!.severity).toBe('review');
    expect(finding!.sourceIds).toContain('low-iron-interruption-labels');
    expect(ofRule(findingsFor(onDrug('deferiprone', [result('ferritin', 40, 500, 'ug/L'), result('ferritin', 5, 499, 'ug/L')])), 'low-iron-on-chelation')).toHaveLength(0);
  });

  it('LIC 2.9 mg/g dry on deferiprone: review; LIC 3 is not below 3', () => {
    const lic = (value: number) =>
      smallCase({ results: [result('liver-iron', 20, value, 'mg/g{dry}', { method: 'biopsy' }), result('neutrophils', 2, 3, '10*9/L')], chelationPeriods: [period('deferiprone', 25)] });
    expect(ofRule(findingsFor(lic(2.9)), 'low-iron-on-chelation')[0]!.text).toContain('liver iron 2.9 mg/g dry');
    expect(ofRule(findingsFor(lic(3)), 'low-iron-on-chelation')).toHaveLength(0);
  });
});

describe('deferiprone-neutrophils (US deferiprone label 2025: bands and interruption below 1.5 × 10⁹/L)', () => {
  const anc = (value: number) => findingsFor(onDrug('deferiprone', [result('neutrophils', 2, value, '10*9/L')]));

  it('ANC 1.5 is not below 1.5; 1.49 is neutropenia, urgent', () => {
    expect(ofRule(anc(1.5), 'deferiprone-neutrophils')).toHaveLength(0);
    const [finding] = ofRule(anc(1.49), 'deferiprone-neutrophils');
    expect(finding!.severity).toBe('urgent');
    expect(finding!.text).toContain('neutropenia (0.5 to below 1.5, US label 2025)');
    expect(finding!.text).toContain('the label advises interrupting deferiprone');
  });

  it('0.49 is severe neutropenia and 0.19 agranulocytosis (0.2 in the 2025 US label)', () => {
    expect(ofRule(anc(0.49), 'deferiprone-neutrophils')[0]!.text).toContain('severe neutropenia');
    expect(ofRule(anc(0.19), 'deferiprone-neutrophils')[0]!.text).toContain('agranulocytosis');
    expect(ofRule(anc(0.2), 'deferiprone-neutrophils')[0]!.text).toContain('severe neutropenia');
  });

  it('a low ANC on deferasirox alone is not a deferiprone finding', () => {
    expect(ofRule(findingsFor(onDrug('deferasirox', [result('neutrophils', 2, 1.0, '10*9/L')])), 'deferiprone-neutrophils')).toHaveLength(0);
  });
});

describe('deferiprone-anc-monitoring (weekly in older labels; "regularly" in the 2025 US label)', () => {
  it('an ANC 7 days ago: nothing; 8 days ago: information naming the 2025 wording', () => {
    expect(ofRule(findingsFor(onDrug('deferiprone', [result('neutrophils', 7, 3, '10*9/L')])), 'deferiprone-anc-monitoring')).toHaveLength(0);
    const [finding] = ofRule(findingsFor(onDrug('deferiprone', [result('neutrophils', 8, 3, '10*9/L')])), 'deferiprone-anc-monitoring');
    expect(finding!.severity).toBe('information');
    expect(finding!.text).toContain('8 days before the review date');
    expect(finding!.text).toContain('2025 US label');
  });

  it('no ANC since deferiprone began: review', () => {
    const [finding] = ofRule(findingsFor(onDrug('deferiprone', [result('neutrophils', 500, 3, '10*9/L')])), 'deferiprone-anc-monitoring');
    expect(finding!.severity).toBe('review');
    expect(finding!.text).toContain('no absolute neutrophil count on record since then (last');
  });
});

describe('deferasirox-monthly-tests (US deferasirox label: creatinine and transaminases monthly)', () => {
  it('creatinine and ALT 31 days ago: nothing; 32 days ago: one review finding for each', () => {
    const tests = (daysBefore: number) => onDrug('deferasirox', [result('creatinine', daysBefore, 0.7, 'mg/dL'), result('alt', daysBefore, 20, 'U/L')]);
    expect(ofRule(findingsFor(tests(31)), 'deferasirox-monthly-tests')).toHaveLength(0);
    const found = ofRule(findingsFor(tests(32)), 'deferasirox-monthly-tests');
    expect(found.map((it) => it.severity)).toEqual(['review', 'review']);
    expect(found[0]!.text).toContain('no serum creatinine in the last 31 days');
    expect(found[1]!.text).toContain('no ALT in the last 31 days');
  });
});
