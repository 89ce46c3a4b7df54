import { describe, expect, it } from 'vitest';
import { latestWeightOnOrBefore, parseCase, periodsActiveOn, resultsOfKindBetween, type Case } from '../../../core/model';
import { unitHaematocritAssumptionId } from '../../../core/model';
import { daysBetween } from '../../../core/dates';
import { readDemo } from './caseFixtures';

function parsedDemo(name: 'th-0417' | 'th-0093'): Case {
  const result = parseCase(readDemo(name));
  if (!result.ok) throw new Error(`${name} does not parse:\n${result.issues.map((it) => it.message).join('\n')}`);
  return result.value;
}

// The outside reference for the demo cases is the scenario text in
// ../shared/scenarios.md (scenarios 1 and 3): each check below quotes the fact it pins.
describe('demo case TH-0417 (scenarios.md, scenario 1)', () => {
  it('parses with no errors and no warnings', () => {
    const result = parseCase(readDemo('th-0417'));
    expect(result.ok ? [] : result.issues).toEqual([]);
    expect(result.ok && result.warnings).toBeFalsy();
  });

  const theCase = parsedDemo('th-0417');
  const reviewDate = theCase.review.reviewDate!;

  it('is a 15-year-old with β-thalassaemia major weighing 52 kg at the review', () => {
    expect(reviewDate).toBe('2026-11-20');
    expect(theCase.patient.diagnosisGroup).toBe('thalassaemia-major');
    // "15-year-old": born 2011-06-14, so 15 on the review date 2026-11-20.
    expect(theCase.patient.age).toEqual({ kind: 'birth-date', birthDate: '2011-06-14' });
    expect(latestWeightOnOrBefore(theCase.patient.weights, reviewDate)?.weight).toEqual({ value: 52, unit: 'kg' });
  });

  it('has two units of about 280 mL at haematocrit about 0.60 every three weeks for years', () => {
    const simple = theCase.transfusions.filter((it) => it.kind === 'simple');
    expect(simple.length).toBeGreaterThan(80);
    for (const transfusion of simple) {
      expect(transfusion.unitCount).toBe(2);
      // "about 280 mL each": 265–295 mL a unit.
      expect(transfusion.volume.value / 2).toBeGreaterThanOrEqual(265);
      expect(transfusion.volume.value / 2).toBeLessThanOrEqual(295);
      // "around 0.60": 0.57–0.63 (a 1e-9 margin for the decimal fractions).
      if (transfusion.unitHaematocrit !== null) expect(Math.abs(transfusion.unitHaematocrit - 0.6)).toBeLessThanOrEqual(0.03 + 1e-9);
    }
    const gapsDays = simple.slice(1).map((it, index) => daysBetween(simple[index]!.date, it.date));
    expect(new Set(gapsDays)).toEqual(new Set([21]));
    // A few records lack the unit haematocrit: the product default applies and shows as assumed.
    expect(simple.some((it) => it.unitHaematocrit === null)).toBe(true);
    expect(unitHaematocritAssumptionId).toBe('unit-haematocrit-red-cells');
  });

  it('has been on deferasirox film-coated 21 mg/kg/day for the last 18 months, after deferoxamine', () => {
    const active = periodsActiveOn(theCase.chelationPeriods, reviewDate);
    expect(active).toHaveLength(1);
    const current = active[0]!;
    expect(current).toMatchObject({ drug: 'deferasirox', formulation: 'film-coated-tablet', dose: { value: 21, unit: 'mg/kg' }, administrationsPerDay: 1, daysPerWeek: 7 });
    expect(current.startDate).toBe('2025-05-20'); // 18 months before 2026-11-20
    const before = periodsActiveOn(theCase.chelationPeriods, '2025-05-19');
    expect(before.map((it) => it.drug)).toEqual(['deferoxamine']);
  });

  it('has MRI liver iron 9.8 a year ago and 11.4 now, 1.5 T, same calibration', () => {
    const lic = resultsOfKindBetween(theCase.results, 'liver-iron', '2025-11-01', reviewDate);
    expect(lic.map((it) => it.measured)).toEqual([
      { value: 9.8, unit: 'mg/g{dry}' },
      { value: 11.4, unit: 'mg/g{dry}' },
    ]);
    for (const result of lic) expect(result).toMatchObject({ method: 'mri', fieldStrengthT: 1.5, calibrationId: 'hernando-1.5t' });
  });

  it('has ferritin rising from 2400 to 2900 µg/L over the last year', () => {
    const ferritin = resultsOfKindBetween(theCase.results, 'ferritin', '2025-11-18', reviewDate);
    expect(ferritin[0]?.measured.value).toBe(2400);
    expect(ferritin.at(-1)?.measured.value).toBe(2900);
  });

  it('has creatinine and ALT results and the two proposed regimens', () => {
    expect(resultsOfKindBetween(theCase.results, 'creatinine', '2025-05-20', reviewDate).length).toBeGreaterThanOrEqual(12);
    expect(resultsOfKindBetween(theCase.results, 'alt', '2025-05-20', reviewDate).length).toBeGreaterThanOrEqual(12);
    const [higher, combined] = theCase.proposedRegimens;
    expect(higher?.periods.map((it) => [it.drug, it.dose.value, it.daysPerWeek])).toEqual([['deferasirox', 28, 7]]);
    expect(combined?.periods.map((it) => [it.drug, it.dose.value, it.daysPerWeek])).toEqual([
      ['deferasirox', 28, 7],
      ['deferoxamine', 40, 5],
    ]);
    for (const regimen of theCase.proposedRegimens) for (const period of regimen.periods) expect(period.startDate).toBe(reviewDate);
  });
});

describe('demo case TH-0093 (scenarios.md, scenario 3)', () => {
  it('parses with no errors and no warnings', () => {
    const result = parseCase(readDemo('th-0093'));
    expect(result.ok ? [] : result.issues).toEqual([]);
    expect(result.ok && result.warnings).toBeFalsy();
  });

  const theCase = parsedDemo('th-0093');
  const reviewDate = theCase.review.reviewDate!;

  it('is a 7-year-old of 23 kg and 121 cm', () => {
    expect(theCase.patient.age).toEqual({ kind: 'birth-date', birthDate: '2019-08-03' });
    expect(latestWeightOnOrBefore(theCase.patient.weights, reviewDate)?.weight.value).toBe(23);
    expect(theCase.patient.heights.at(-1)?.height).toEqual({ value: 121, unit: 'cm' });
  });

  it('is on deferoxamine 40 mg/kg subcutaneously over 10 hours on 5 nights, with ascorbic acid 100 mg with each infusion', () => {
    const [current] = periodsActiveOn(theCase.chelationPeriods, reviewDate);
    expect(current).toMatchObject({ drug: 'deferoxamine', route: 'subcutaneous', dose: { value: 40, unit: 'mg/kg' }, daysPerWeek: 5, infusionHours: 10 });
    const [ascorbic] = periodsActiveOn(theCase.coMedications, reviewDate);
    expect(ascorbic).toMatchObject({ name: 'ascorbic acid', dose: { value: 100, unit: 'mg' }, timing: 'with-each-deferoxamine-infusion' });
  });

  it('has ferritin falling from 1900 to 1250 µg/L', () => {
    const ferritin = resultsOfKindBetween(theCase.results, 'ferritin', '2025-05-01', reviewDate);
    expect(ferritin[0]?.measured).toEqual({ value: 1900, unit: 'ug/L' });
    expect(ferritin.at(-1)?.measured).toEqual({ value: 1250, unit: 'ug/L' });
    const values = ferritin.map((it) => it.measured.value);
    expect(values).toEqual([...values].sort((first, second) => second - first));
  });
});
