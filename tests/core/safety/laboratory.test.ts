import { afterAll, describe, expect, it } from 'vitest';
import { safetyRules } from '../../../core/safety';
import { expectDescriptive, findingsFor, ofRule, period, producedTexts, result, smallCase } from './safetyCases';

afterAll(() => expectDescriptive(producedTexts));

const onDrug = (drug: 'deferasirox' | 'deferiprone' | 'deferoxamine', results: readonly Record<string, unknown>[]) =>
  smallCase({ results: [...results, result('liver-iron', 100, 6, 'mg/g{dry}', { method: 'biopsy' })], chelationPeriods: [period(drug, drug === 'deferiprone' ? 25 : drug === 'deferasirox' ? 14 : 40)] });

describe('alt-raised (US deferasirox label §5.2: "severe or persistent elevations", no multiple of the upper limit; 5 × ULN only as a local protocol)', () => {
  const alt = (values: [number, number][], extra: Record<string, unknown> = {}) => values.map(([daysBefore, value]) => result('alt', daysBefore, value, 'U/L', extra));

  it('ALT 40 U/L is not above the assumed 40; 41 on one result is information; above it on two consecutive results is review (persistent)', () => {
    expect(ofRule(findingsFor(onDrug('deferasirox', alt([[5, 40]]))), 'alt-raised')).toHaveLength(0);
    const [single] = ofRule(findingsFor(onDrug('deferasirox', alt([[5, 41]]))), 'alt-raised');
    expect(single!.severity).toBe('information');
    expect(single!.sourceUncertain).toBe(true);
    expect(single!.text).toContain('assumed upper limit of normal of 40 U/L');
    const [persistent] = ofRule(findingsFor(onDrug('deferasirox', alt([[40, 41], [5, 41]]))), 'alt-raised');
    expect(persistent!.severity).toBe('review');
    expect(persistent!.text).toContain('a persistent elevation');
    expect(persistent!.text).toContain('gives no multiple of the upper limit');
    expect(persistent!.sourceIds).toContain('deferasirox-label-us');
    // The earlier result at the limit is not above it: one result only.
    expect(ofRule(findingsFor(onDrug('deferasirox', alt([[40, 40], [5, 41]]))), 'alt-raised')[0]!.severity).toBe('information');
  });

  it('uses the laboratory’s upper limit when the result carries one (35 U/L: 35 passes, 36 is above)', () => {
    expect(ofRule(findingsFor(onDrug('deferasirox', alt([[5, 35]], { referenceRange: { high: 35 } }))), 'alt-raised')).toHaveLength(0);
    const [finding] = ofRule(findingsFor(onDrug('deferasirox', alt([[5, 36]], { referenceRange: { high: 35 } }))), 'alt-raised');
    expect(finding!.text).toContain('the reporting laboratory’s upper limit of normal of 35 U/L');
    expect(finding!.sourceUncertain).toBe(false);
  });

  it('reads AST as well as ALT', () => {
    const found = ofRule(findingsFor(onDrug('deferiprone', [result('ast', 40, 90, 'U/L'), result('ast', 5, 95, 'U/L'), result('neutrophils', 2, 3, '10*9/L')])), 'alt-raised');
    expect(found.map((it) => it.text.includes('AST above the upper limit of normal on two consecutive results'))).toEqual([true]);
  });

  it('applies 5 × ULN only as a local protocol’s option: 201 U/L is not called “above 5 ×” by default; with the override, 200 is not above and 201 is', () => {
    const json = onDrug('deferasirox', alt([[5, 201]]));
    expect(ofRule(findingsFor(json), 'alt-raised')[0]!.text).not.toContain('5 ×');
    const local = { 'alt-multiple-of-uln': { value: 5, reason: 'local liver protocol', by: 'Pharmacist AB' } };
    expect(ofRule(findingsFor(onDrug('deferasirox', alt([[5, 200]])), undefined, local), 'alt-raised')[0]!.text).not.toContain('study-protocol');
    const [over] = ofRule(findingsFor(json, undefined, local), 'alt-raised');
    expect(over!.severity).toBe('review');
    expect(over!.text).toContain('the local threshold of 5 (overriding the study-protocol 5; local liver protocol, Pharmacist AB)');
  });

  it('no chelator that the rule concerns: no finding', () => {
    expect(ofRule(findingsFor(onDrug('deferoxamine', alt([[40, 400], [5, 400]]))), 'alt-raised')).toHaveLength(0);
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

  it('a local protocol’s ferritin limit of 600 µg/L: the finding’s title states 600, the one applied; the rule listing keeps the labelled 500', () => {
    // Labels: ferritin consistently below 500 µg/L (published); a local protocol may set 600 (override range 50–2000).
    const local = { 'ferritin-low': { value: 600, reason: 'local haematology protocol', by: 'Pharmacist AB' } };
    const json = onDrug('deferasirox', [result('ferritin', 40, 550, 'ug/L'), result('ferritin', 5, 560, 'ug/L')]);
    expect(ofRule(findingsFor(json), 'low-iron-on-chelation')).toHaveLength(0);
    const [finding] = ofRule(findingsFor(json, undefined, local), 'low-iron-on-chelation');
    expect(finding!.title).toBe('Ferritin consistently below 600 µg/L or LIC below 3 mg/g dry on deferasirox or deferiprone');
    expect(finding!.text).toContain('the local threshold of 600 (overriding the labelled 500; local haematology protocol, Pharmacist AB)');
    expect(safetyRules.find((it) => it.id === 'low-iron-on-chelation')!.title).toBe('Ferritin consistently below 500 µg/L or LIC below 3 mg/g dry on deferasirox or deferiprone');
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

describe('deferiprone-anc-monitoring (US label March 2025 §2.1, §5.1: the calendar\'s schedule by time on the drug)', () => {
  it('after a year without a low count (every 2–4 weeks): an ANC 28 days ago is not overdue; 29 days ago is information', () => {
    expect(ofRule(findingsFor(onDrug('deferiprone', [result('neutrophils', 28, 3, '10*9/L')])), 'deferiprone-anc-monitoring')).toHaveLength(0);
    const [finding] = ofRule(findingsFor(onDrug('deferiprone', [result('neutrophils', 29, 3, '10*9/L')])), 'deferiprone-anc-monitoring');
    expect(finding!.severity).toBe('information');
    expect(finding!.text).toContain('1 days overdue');
    expect(finding!.text).toContain('every 2 to 4 weeks');
  });

  it('in the first 6 months (weekly): 7 days ago is not overdue, 8 days ago is', () => {
    const early = (daysBefore: number) =>
      smallCase({ results: [result('neutrophils', daysBefore, 3, '10*9/L'), result('liver-iron', 100, 6, 'mg/g{dry}', { method: 'biopsy' })], chelationPeriods: [period('deferiprone', 25, { startDaysBefore: 100 })] });
    expect(ofRule(findingsFor(early(7)), 'deferiprone-anc-monitoring')).toHaveLength(0);
    expect(ofRule(findingsFor(early(8)), 'deferiprone-anc-monitoring')[0]!.text).toContain('weekly during the first 6 months');
  });

  it('a local protocol of weekly counts throughout applies when set (override of deferiprone-anc-interval)', () => {
    const local = { 'deferiprone-anc-interval': { value: 7, reason: 'weekly throughout, local haematology protocol', by: 'Pharmacist AB' } };
    const [finding] = ofRule(findingsFor(onDrug('deferiprone', [result('neutrophils', 8, 3, '10*9/L')]), undefined, local), 'deferiprone-anc-monitoring');
    expect(finding!.text).toContain('by the local protocol');
    expect(finding!.thresholds[0]!.overridden).toBe(true);
  });

  it('no ANC since deferiprone began: review', () => {
    const [finding] = ofRule(findingsFor(onDrug('deferiprone', [result('neutrophils', 500, 3, '10*9/L')])), 'deferiprone-anc-monitoring');
    expect(finding!.severity).toBe('review');
    expect(finding!.text).toContain('no absolute neutrophil count on record since then (the last is from');
  });
});

describe('deferasirox-monthly-tests (US deferasirox label: creatinine monthly, boxed warning; AST, ALT, bilirubin monthly, §5.2)', () => {
  it('tests a month ago (due on the review date): nothing; a day earlier: one review finding for each test', () => {
    const tests = (daysBefore: number) =>
      onDrug('deferasirox', [result('creatinine', daysBefore, 0.7, 'mg/dL'), result('alt', daysBefore, 20, 'U/L'), result('ast', daysBefore, 22, 'U/L'), result('bilirubin', daysBefore, 10, 'umol/L')]);
    expect(ofRule(findingsFor(tests(31)), 'deferasirox-monthly-tests')).toHaveLength(0);
    const found = ofRule(findingsFor(tests(32)), 'deferasirox-monthly-tests');
    expect(found.map((it) => it.severity)).toEqual(['review', 'review', 'review', 'review']);
    expect(found.map((it) => it.text.split(' was due')[0])).toEqual(['Deferasirox: serum creatinine', 'Deferasirox: ALT', 'Deferasirox: AST', 'Deferasirox: serum bilirubin']);
    expect(found[1]!.text).toContain('every 2 weeks during the first month of a period, then at least monthly (US label §5.2)');
  });

  it('a test with none on record is a review finding', () => {
    const found = ofRule(findingsFor(onDrug('deferasirox', [result('creatinine', 3, 0.7, 'mg/dL'), result('alt', 3, 20, 'U/L')])), 'deferasirox-monthly-tests');
    expect(found.map((it) => it.text)).toEqual([expect.stringContaining('AST was due on 2026-11-20 (monthly; none on record)'), expect.stringContaining('serum bilirubin was due')]);
  });
});
