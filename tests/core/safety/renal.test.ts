import { afterAll, describe, expect, it } from 'vitest';
import { expectDescriptive, findingsFor, ofRule, period, producedTexts, result, smallCase } from './safetyCases';
import { md1102 } from './scenarioCases';

afterAll(() => expectDescriptive(producedTexts));

/** A child on deferasirox with one creatinine 10 days before the review (bedside Schwartz needs the height). */
function childWithCreatinine(creatinineMgPerDl: number, heightCm: number | null = 100) {
  return smallCase({
    ageYears: 10,
    weightKg: 30,
    heightCm,
    results: [result('creatinine', 10, creatinineMgPerDl, 'mg/dL'), result('alt', 10, 20, 'U/L'), result('liver-iron', 100, 6, 'mg/g{dry}', { method: 'biopsy' })],
    chelationPeriods: [period('deferasirox', 14)],
  });
}

describe('deferasirox-egfr (US deferasirox label: eGFR < 40 contraindicated, 40–60 halved start; references.md §4)', () => {
  // Schwartz et al., J Am Soc Nephrol 2009;20:629: eGFR = 0.413 × height (cm) / SCr (mg/dL).
  // With height 100 cm the creatinine for a chosen eGFR is 41.3 / eGFR; eGFR is compared to 0.1
  // (as reported), so floating-point noise in 41.3 / (41.3 / 40) cannot cross the threshold.
  it('eGFR 40.0 is not below 40: in the 40–60 band, review, with the estimator named', () => {
    const [finding, ...rest] = ofRule(findingsFor(childWithCreatinine(41.3 / 40)), 'deferasirox-egfr');
    expect(rest).toHaveLength(0);
    expect(finding!.severity).toBe('review');
    expect(finding!.text).toContain('eGFR 40 mL/min/1.73 m² (bedside Schwartz');
    expect(finding!.text).toContain('40–60 band');
    expect(finding!.triggers[0]!.value).toBe(40);
    expect(finding!.triggers[0]!.derivation!.formulaId).toBe('egfr-schwartz-bedside');
  });

  it('eGFR 39.9 is below 40: urgent, "below the labelled threshold of 40"', () => {
    const [finding] = ofRule(findingsFor(childWithCreatinine(41.3 / 39.9)), 'deferasirox-egfr');
    expect(finding!.severity).toBe('urgent');
    expect(finding!.text).toMatch(/^Deferasirox with eGFR 39\.9 mL\/min\/1\.73 m² \(bedside Schwartz, \d{4}-\d{2}-\d{2}\): below the labelled threshold of 40; for prescriber review\.$/);
    expect(finding!.sourceIds).toEqual(expect.arrayContaining(['deferasirox-label-us', 'schwartz-2009']));
  });

  it('eGFR 60 is outside the band (no finding); 59.9 is inside it', () => {
    expect(ofRule(findingsFor(childWithCreatinine(41.3 / 60)), 'deferasirox-egfr')).toHaveLength(0);
    expect(ofRule(findingsFor(childWithCreatinine(41.3 / 59.9)), 'deferasirox-egfr')[0]!.severity).toBe('review');
  });

  it('a child without a height: the estimate cannot be made, and the finding says so', () => {
    const [finding] = ofRule(findingsFor(childWithCreatinine(1.2, null)), 'deferasirox-egfr');
    expect(finding!.severity).toBe('information');
    expect(finding!.text).toContain('cannot be estimated');
    expect(finding!.text).toContain('needs a height');
  });

  it('not on deferasirox: no renal finding even at a low eGFR', () => {
    const json = { ...childWithCreatinine(41.3 / 20), chelationPeriods: [] };
    expect(ofRule(findingsFor(json), 'deferasirox-egfr')).toHaveLength(0);
  });

  it('MD-1102 (scenario 2): CKD-EPI 2021 named, value as the published equation gives it by hand', () => {
    const [finding] = ofRule(findingsFor(md1102()), 'deferasirox-egfr');
    // Inker et al., N Engl J Med 2021;385:1737: male, κ 0.9, α −0.302; creatinine 1.5 mg/dL
    // 10 days before the review at age 71 on the review date.
    const age = 71 - 10 / 365.2425;
    const byHand = 142 * Math.min(1.5 / 0.9, 1) ** -0.302 * Math.max(1.5 / 0.9, 1) ** -1.2 * 0.9938 ** age;
    expect(finding!.triggers[0]!.value).toBe(Math.round(byHand * 10) / 10);
    expect(finding!.text).toContain('(CKD-EPI 2021,');
    expect(finding!.severity).toBe('review');
    expect(finding!.triggers[0]!.derivation!.formulaId).toBe('egfr-ckd-epi-2021');
  });
});

describe('deferasirox-crcl (EU deferasirox text, CrCl < 60 mL/min — from memory; Cockcroft & Gault, Nephron 1976;16:31)', () => {
  it('MD-1102: CrCl by hand (140 − age) × 68 / (72 × 1.5) is below 60, flagged as from memory', () => {
    const [finding] = ofRule(findingsFor(md1102()), 'deferasirox-crcl');
    const age = 71 - 10 / 365.2425;
    expect(finding!.triggers[0]!.value).toBe(Math.round((((140 - age) * 68) / (72 * 1.5)) * 10) / 10);
    expect(finding!.sourceUncertain).toBe(true);
    expect(finding!.text).toContain('memory');
  });

  it('an adult with creatinine 0.7 mg/dL (CrCl about 131 mL/min) has none; a child never gets one (adult equation)', () => {
    const adult = smallCase({ chelationPeriods: [period('deferasirox', 14)] });
    expect(ofRule(findingsFor(adult), 'deferasirox-crcl')).toHaveLength(0);
    expect(ofRule(findingsFor(childWithCreatinine(41.3 / 20)), 'deferasirox-crcl')).toHaveLength(0);
  });
});

describe('deferasirox-creatinine-rise (US label: > 33 % over baseline on two consecutive results)', () => {
  const withCreatinines = (values: readonly number[], baseline: number | null = 1.0) =>
    smallCase({
      results: [
        ...(baseline === null ? [] : [result('creatinine', 410, baseline, 'mg/dL')]),
        ...values.map((value, index) => result('creatinine', 10 + 30 * (values.length - 1 - index), value, 'mg/dL')),
        result('liver-iron', 100, 6, 'mg/g{dry}', { method: 'biopsy' }),
      ],
      chelationPeriods: [period('deferasirox', 14, { startDaysBefore: 400 })],
    });

  it('33 % exactly on two results is not above 33 %: no finding', () => {
    expect(ofRule(findingsFor(withCreatinines([1.33, 1.33])), 'deferasirox-creatinine-rise')).toHaveLength(0);
  });

  it('34 % on two consecutive results: review, with the baseline and its definition', () => {
    const [finding] = ofRule(findingsFor(withCreatinines([1.34, 1.34])), 'deferasirox-creatinine-rise');
    expect(finding!.severity).toBe('review');
    expect(finding!.text).toContain('34 % and 34 %');
    expect(finding!.text).toContain('the latest before deferasirox began');
    expect(finding!.triggers.map((it) => it.name)).toEqual(['baseline creatinine', 'creatinine (34 % over baseline)', 'creatinine (34 % over baseline)']);
  });

  it('only the latest result above 33 %: information, saying the rule concerns two consecutive results', () => {
    const [finding] = ofRule(findingsFor(withCreatinines([1.2, 1.4])), 'deferasirox-creatinine-rise');
    expect(finding!.severity).toBe('information');
    expect(finding!.text).toContain('two consecutive results');
  });

  it('no creatinine before deferasirox: the baseline is the mean of the first two on the drug', () => {
    const [finding] = ofRule(findingsFor(withCreatinines([1.0, 1.0, 1.34, 1.34], null)), 'deferasirox-creatinine-rise');
    expect(finding!.severity).toBe('review');
    expect(finding!.text).toContain('mean of the first two results on deferasirox');
  });

  it('MD-1102: 1.4 and 1.5 mg/dL over a baseline of 1.0 (40 % and 50 %)', () => {
    const [finding] = ofRule(findingsFor(md1102()), 'deferasirox-creatinine-rise');
    expect(finding!.text).toContain('40 % and 50 %');
  });
});
