import { afterAll, describe, expect, it } from 'vitest';
import { computeCase } from '../../../core/ledger/computeCase';
import { findSource } from '../../../core/references';
import { evaluateFindings, safetyRules, severities, thresholdCatalogue } from '../../../core/safety';
import { deepFreeze, readDemo } from '../model/caseFixtures';
import { expectDescriptive, findingsFor, forbiddenPhrasings, ofRule, parsed, period, producedTexts, result, smallCase } from './safetyCases';
import { md1102, sc0781, th0322 } from './scenarioCases';

afterAll(() => expectDescriptive(producedTexts));

describe('the rule and threshold catalogues', () => {
  it('every rule has a kebab-case id, known sources, and is flagged uncertain when any source is from memory', () => {
    for (const rule of safetyRules) {
      expect(rule.id).toMatch(/^[a-z0-9]+(-[a-z0-9]+)*$/);
      expect(rule.sourceIds.length).toBeGreaterThan(0);
      for (const id of rule.sourceIds) expect(findSource(id), `${rule.id} cites ${id}`).toBeDefined();
      if (rule.sourceIds.some((id) => findSource(id)!.status === 'memory')) expect(rule.uncertain, rule.id).toBe(true);
    }
  });

  it('every threshold cites known sources and its published value lies inside its override range', () => {
    for (const threshold of thresholdCatalogue) {
      for (const id of threshold.sourceIds) expect(findSource(id), `${threshold.id} cites ${id}`).toBeDefined();
      expect(threshold.value).toBeGreaterThanOrEqual(threshold.overrideMin);
      expect(threshold.value).toBeLessThanOrEqual(threshold.overrideMax);
    }
  });
});

describe('local protocol overrides (the case file’s thresholdOverrides, passed to evaluateFindings)', () => {
  // 41.3 / 43 mg/dL at 100 cm gives a bedside Schwartz eGFR of 43 (Schwartz 2009).
  const child = smallCase({ ageYears: 10, weightKg: 30, heightCm: 100, results: [result('creatinine', 5, 41.3 / 43, 'mg/dL')], chelationPeriods: [period('deferasirox', 14)] });

  it('an eGFR threshold raised to 45 makes eGFR 43 urgent and says so in the sentence and the finding', () => {
    expect(ofRule(findingsFor(child), 'deferasirox-egfr')[0]!.severity).toBe('review');
    const [finding] = ofRule(findingsFor(child, '2026-11-20', { 'deferasirox-egfr-lower': { value: 45, reason: 'local renal protocol', by: 'Pharmacist AB' } }), 'deferasirox-egfr');
    expect(finding!.severity).toBe('urgent');
    expect(finding!.text).toContain('the local threshold of 45 (overriding the labelled 40; local renal protocol, Pharmacist AB)');
    expect(finding!.thresholds[0]).toMatchObject({ id: 'deferasirox-egfr-lower', value: 45, publishedValue: 40, overridden: true, by: 'Pharmacist AB' });
  });

  it('an unknown id or an implausible value is refused with the id, the value and the range', () => {
    const theCase = parsed(child);
    const results = computeCase(theCase, '2026-11-20', { samples: 60 });
    if (!results.ok) throw new Error('not ok');
    const unknown = evaluateFindings(theCase, results.value, '2026-11-20', { 'egfr-lower': { value: 45, reason: 'x', by: 'y' } });
    expect(unknown.ok).toBe(false);
    if (!unknown.ok) expect(unknown.issues[0]).toMatchObject({ code: 'unknown_option', path: ['thresholds', 'egfr-lower'] });
    const implausible = evaluateFindings(theCase, results.value, '2026-11-20', { 'deferasirox-egfr-lower': { value: 400, reason: 'x', by: 'y' } });
    expect(implausible.ok).toBe(false);
    if (!implausible.ok) expect(implausible.issues[0]!.message).toContain('400 mL/min/{1.73_m2} is outside the plausible range 10–90');
  });
});

describe('the engine', () => {
  it('sorts by severity (urgent, review, information) and never changes the case or the results', () => {
    const theCase = deepFreeze(parsed(th0322()));
    const results = computeCase(theCase, '2026-11-20', { samples: 60 });
    if (!results.ok) throw new Error('not ok');
    deepFreeze(results.value);
    const first = evaluateFindings(theCase, results.value, '2026-11-20');
    const second = evaluateFindings(theCase, results.value, '2026-11-20');
    expect(second).toEqual(first);
    if (!first.ok) throw new Error('not ok');
    const ranks = first.value.map((it) => severities.indexOf(it.severity));
    expect(ranks).toEqual([...ranks].sort((a, b) => a - b));
  });
});

describe('the scenario and demo cases (../shared/scenarios.md)', () => {
  it('TH-0322 (scenario 5): urgent cardiac T2* below 10 ms and ANC below 1.5 on deferiprone, with their sources; combination listed', () => {
    const findings = findingsFor(th0322());
    const urgent = findings.filter((it) => it.severity === 'urgent');
    expect(urgent.map((it) => it.ruleId)).toEqual(['cardiac-t2star', 'deferiprone-neutrophils']);
    expect(urgent[0]!.sourceIds).toContain('kirk-2009');
    expect(urgent[1]!.sourceIds).toContain('deferiprone-label-us-2025');
    expect(ofRule(findings, 'chelator-combination')).toHaveLength(1);
  });

  it('MD-1102 (scenario 2): eGFR band, CrCl and the creatinine rise, all for the prescriber', () => {
    const ids = findingsFor(md1102()).map((it) => it.ruleId);
    expect(ids).toEqual(expect.arrayContaining(['deferasirox-egfr', 'deferasirox-crcl', 'deferasirox-creatinine-rise']));
  });

  it('SC-0781 (scenario 4): the field-strength refusal; no chelator findings', () => {
    const findings = findingsFor(sc0781());
    expect(ofRule(findings, 'mri-field-strength-mismatch')).toHaveLength(1);
    expect(findings.every((it) => it.drugs.length === 0)).toBe(true);
  });

  it('TH-0093 (scenario 3): therapeutic index about 0.0229, below 0.025; at the growth limit; hearing and eyes; ascorbic acid within its cap', () => {
    const findings = findingsFor(readDemo('th-0093'));
    const [index] = ofRule(findings, 'deferoxamine-therapeutic-index');
    // Porter 1989: 40 mg/kg × 5 / 7 ÷ 1250 µg/L (ferritin of 2026-10-13).
    expect(index!.triggers[0]!.value).toBeCloseTo((40 * 5) / 7 / 1250, 12);
    expect(index!.severity).toBe('information');
    expect(ofRule(findings, 'deferoxamine-growth-limit')[0]!.text).toContain('at the labelled threshold of 40');
    // Hearing and eyes: none on record in the demo, so each is due on the review date (US deferoxamine label §5).
    expect(ofRule(findings, 'deferoxamine-hearing-eyes').map((it) => it.text.split(':')[1]!.trim().split(' due')[0])).toEqual(['hearing (audiology)', 'eye examination']);
    // 100 mg a day at 7 years: within the 200 mg the label gives (scenarios.md §3), above the 50 mg it says generally suffices under 10.
    const [ascorbic] = ofRule(findings, 'ascorbic-acid-with-deferoxamine');
    expect(ascorbic!.severity).toBe('information');
    expect(ascorbic!.text).toContain('within the 200 mg a day the label gives for adults, but above the labelled threshold of 50 mg a day');
  });

  it('TH-0417 (scenario 1): creatinine and ALT more than a month old, and intake above the expected removal', () => {
    const ids = findingsFor(readDemo('th-0417')).map((it) => it.ruleId);
    expect(ids).toEqual(expect.arrayContaining(['deferasirox-monthly-tests', 'positive-projected-balance']));
  });
});

describe('wording', () => {
  it('the forbidden list catches imperative dosing and lets descriptive wording through', () => {
    const matches = (text: string) => forbiddenPhrasings.some((pattern) => pattern.test(text));
    for (const imperative of ['Give 20 mg/kg daily.', 'Stop deferiprone.', 'Reduce the dose to 7 mg/kg.', 'Increase to 28 mg/kg/day.', 'ANC 1.3; consider interrupting.', 'Start deferasirox.', 'The patient should have an ANC.', 'Must be reviewed.', 'Prescribe ascorbic acid.']) {
      expect(matches(imperative), imperative).toBe(true);
    }
    for (const descriptive of ['the label advises interrupting deferiprone below 1.5', 'where the US label halves the starting dose', 'the start date is 2026-01-01', 'ascorbic acid given with each infusion', 'the labels advise interrupting or considering interruption']) {
      expect(matches(descriptive), descriptive).toBe(false);
    }
  });
});
