import { describe, expect, it } from 'vitest';
import { addDaysIso } from '../../../core/dates';
import { computeCase } from '../../../core/ledger/computeCase';
import { periodAdherence } from '../../../core/ledger/periodAdherence';
import type { Case } from '../../../core/model/caseFile';
import { parseCase } from '../../../core/model/parseCase';
import { readDemo, withChange } from '../model/caseFixtures';

function parsed(json: unknown): Case {
  const result = parseCase(json);
  if (!result.ok) throw new Error(result.issues.map((it) => it.message).join('\n'));
  return result.value;
}

function computed(json: unknown, asOf = '2026-11-20') {
  const result = computeCase(parsed(json), asOf, { samples: 60 });
  if (!result.ok) throw new Error(result.issues.map((it) => it.message).join('\n'));
  return result.value;
}

const dispensing = (index: number, date: string, daysSupplied: number, drug = 'deferasirox') => ({
  id: `disp-${index}`,
  date,
  drug,
  quantity: { value: daysSupplied, unit: '{each}' },
  daysSupplied,
});

/** TH-0417's deferasirox period (from 2025-05-20, ongoing) with a year of dispensings instead of the default adherence. */
function th0417With(dispensings: readonly Record<string, unknown>[]) {
  return withChange(readDemo('th-0417'), ['dispensings'], dispensings);
}

describe('proportion of days covered per chelation period (Pharmacy Quality Alliance definition)', () => {
  // The Pharmacy Quality Alliance's own PDC measure examples (pqaalliance.org, measure example claims,
  // 2018) list each claim's fill date, days' supply and the first and last dose dates after shifting
  // overlaps. The same claims are used here in 2025, which like 2018 is not a leap year, so every
  // day count is the same. Exact integers: no tolerance.
  const periodFrom = (startDate: string) => ({ id: 'chel-pqa', drug: 'deferasirox', formulation: 'film-coated-tablet', route: 'oral', dose: { value: 14, unit: 'mg/kg' }, administrationsPerDay: 1, daysPerWeek: 7, startDate, endDate: null, adherence: 0.9 });
  const caseWith = (dispensings: readonly Record<string, unknown>[], startDate = '2025-01-01') =>
    parsed(withChange(withChange(readDemo('th-0417'), ['chelationPeriods'], [periodFrom(startDate)]), ['dispensings'], dispensings));

  it('PQA example: fills on 03-25, 07-05 and 09-25, 90 days each; the third is shifted to 10-03 to 12-31; the period starts at the first fill (index date): 270 of 282 days', () => {
    const theCase = caseWith([dispensing(1, '2025-03-25', 90), dispensing(2, '2025-07-05', 90), dispensing(3, '2025-09-25', 90)]);
    const adherence = periodAdherence(theCase, theCase.chelationPeriods[0]!, '2025-12-31');
    // By hand: 03-25..06-22 (90), gap 06-23..07-04, 07-05..10-02 (90), 10-03..12-31 (90); 03-25..12-31 is 7+30+31+30+31+31+30+31+30+31 = 282 days.
    expect(adherence.covered).toMatchObject({ fromDate: '2025-03-25', toDate: '2025-12-31', coveredDays: 270, periodDays: 282, dispensings: 3 });
    expect(adherence.used).toBe(270 / 282);
    expect(adherence.entered).toBe(0.9);
  });

  it('PQA example: fills on 01-01, 03-25, 07-05 and 10-15, 90 days each; the second is shifted to 04-01 to 06-29, the last is cut at the end of the period: 348 of 365 days', () => {
    const theCase = caseWith([dispensing(1, '2025-01-01', 90), dispensing(2, '2025-03-25', 90), dispensing(3, '2025-07-05', 90), dispensing(4, '2025-10-15', 90)]);
    const adherence = periodAdherence(theCase, theCase.chelationPeriods[0]!, '2025-12-31');
    // By hand: 90 + 90 (04-01..06-29) + 90 (07-05..10-02) + 78 (10-15..12-31: 17 + 30 + 31) = 348; 2025 has 365 days.
    expect(adherence.covered).toMatchObject({ coveredDays: 348, periodDays: 365 });
  });

  it('supply on hand from before the period counts from the period’s start; dispensings of another drug and after the review date do not count', () => {
    const theCase = caseWith([dispensing(1, '2025-05-20', 30), dispensing(2, '2025-06-10', 30, 'deferiprone'), dispensing(3, '2025-07-15', 30)], '2025-06-01');
    const adherence = periodAdherence(theCase, theCase.chelationPeriods[0]!, '2025-06-30');
    // By hand: the first supply lasts 05-20..06-18, so 06-01..06-18 = 18 of the 30 days of June; the third is after the review date.
    expect(adherence.covered).toMatchObject({ fromDate: '2025-06-01', coveredDays: 18, periodDays: 30, dispensings: 1 });
  });

  it('without dispensings of the period’s drug the entered estimate is used', () => {
    const theCase = caseWith([dispensing(1, '2025-03-25', 90, 'deferoxamine')]);
    expect(periodAdherence(theCase, theCase.chelationPeriods[0]!, '2025-12-31')).toEqual({ periodId: 'chel-pqa', entered: 0.9, covered: null, used: 0.9 });
  });
});

describe('the proportion of days covered feeds expected removal', () => {
  // 12 fills of 15 days every 30 days from the period's start: half the days covered by hand.
  const start = '2025-11-20';
  const halfCovered = Array.from({ length: 12 }, (_, index) => dispensing(index, addDaysIso(start, index * 30), 15));

  it('the current regimen’s expected removal equals the one with the proportion entered as the adherence, and its derivation names the proportion of days covered', () => {
    // Window 2025-11-20 .. 2026-11-20 = 366 days; 11 fills of 15 days plus the 12th (2026-10-17, 15 days) = 180 covered.
    const fed = computed(th0417With(halfCovered));
    const regimen = fed.currentRegimens.find((it) => it.periodId === 'chel-dfx-2025')!;
    expect(regimen.adherence.covered).toMatchObject({ coveredDays: 180, periodDays: 366 });
    const pdc = 180 / 366;
    const entered = computed(withChange(th0417With([]), ['chelationPeriods', 1, 'adherence'], pdc));
    const same = entered.currentRegimens.find((it) => it.periodId === 'chel-dfx-2025')!;
    // The same arithmetic with the same adherence: equal to floating-point rounding (1e-9 mg/day).
    expect(regimen.expectedRemovalMgPerDay).toBeCloseTo(same.expectedRemovalMgPerDay, 9);
    const adherenceInput = regimen.derivation.inputs.find((it) => it.name === 'adherence')!;
    expect(adherenceInput.value).toBe(pdc);
    expect(adherenceInput.origin.kind).toBe('computed');
    if (adherenceInput.origin.kind !== 'computed') return;
    expect(adherenceInput.origin.derivation.formulaId).toBe('proportion-of-days-covered');
    expect(adherenceInput.origin.derivation.sourceIds).toContain('nau-pqa-2012-pdc');
    const covered = adherenceInput.origin.derivation.inputs.find((it) => it.name === 'coveredDays')!;
    expect(covered.origin).toMatchObject({ kind: 'record', refs: expect.arrayContaining(['dispensings[0] disp-0', 'dispensings[11] disp-11']) });
  });

  it('the daily account removes the same iron as with the proportion entered, and a notice says the estimate was replaced', () => {
    const fed = computed(th0417With(halfCovered));
    const entered = computed(withChange(th0417With([]), ['chelationPeriods', 1, 'adherence'], 180 / 366));
    const removed = (results: typeof fed) => results.months.reduce((sum, month) => sum + month.chelationOutMg, 0);
    expect(removed(fed)).toBeCloseTo(removed(entered), 6);
    expect(removed(fed)).toBeLessThan(removed(computed(readDemo('th-0417'))));
    expect(fed.notices.some((it) => it.text.startsWith('Expected removal of chel-dfx-2025 uses the proportion of days covered by 12 dispensing(s), 180 of 366 days'))).toBe(true);
  });
});
