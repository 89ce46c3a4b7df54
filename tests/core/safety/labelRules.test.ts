import { afterAll, describe, expect, it } from 'vitest';
import { addDaysIso, addMonthsIso } from '../../../core/dates';
import { proportionOfDaysCovered } from '../../../core/dosing';
import { monitoringCalendar } from '../../../core/monitoring';
import { findSource } from '../../../core/references';
import { labelInteractions } from '../../../core/safety/interactionCatalogue';
import { computeCase } from '../../../core/ledger/computeCase';
import { readDemo, withChange } from '../model/caseFixtures';
import { md1102, th0322 } from './scenarioCases';
import { expectDescriptive, findingsFor, ofRule, parsed, period, producedTexts, result, reviewDate, smallCase } from './safetyCases';

afterAll(() => expectDescriptive(producedTexts));

// The rules brought to the current labels by issue 10, each on both sides of
// its threshold, with the label section it follows named in the test. Sources:
// references.md §9 (labels read again) and the source records cited.

describe('dose-outside-published-range: far above the labelled daily maximum is urgent (modelling choice 1.5 ×; deferiprone maximum 100 mg/kg/day, EU SmPC 2004 §4.2)', () => {
  const deferiprone = (perAdministration: number) =>
    ofRule(findingsFor(smallCase({ ageYears: 29, weightKg: 61, chelationPeriods: [period('deferiprone', perAdministration, { startDaysBefore: 200 })] })), 'dose-outside-published-range');

  it('75 mg/kg three times a day (225 mg/kg/day) computes and is urgent, naming the per-administration dose', () => {
    const [finding] = deferiprone(75);
    expect(finding).toMatchObject({ severity: 'urgent' });
    expect(finding!.text).toContain('75 mg/kg per administration × 3 a day; the dose field is per administration');
  });

  it('at 1.5 × (50 mg/kg × 3 = 150) review only; just above (50.1 × 3) urgent; 33.3 × 3 = 100 nothing', () => {
    expect(deferiprone(50).map((it) => it.severity)).toEqual(['review']);
    expect(deferiprone(50.1).map((it) => it.severity)).toEqual(['urgent']);
    expect(deferiprone(100 / 3)).toEqual([]);
  });
});

describe('deferasirox-hepatic-impairment (US deferasirox label, boxed warning and §2: avoid in Child-Pugh C; reduce in B)', () => {
  const withChildPugh = (childPughClass: string, drug: 'deferasirox' | 'deferiprone' = 'deferasirox') =>
    ofRule(findingsFor(smallCase({ chelationPeriods: [period(drug, drug === 'deferasirox' ? 14 : 25)], clinicalState: { hepaticImpairment: [{ id: 'cp', date: addDaysIso(reviewDate, -20), childPughClass }] } })), 'deferasirox-hepatic-impairment');

  it('C is urgent, B is review, A gives nothing; on deferiprone nothing', () => {
    expect(withChildPugh('C').map((it) => it.severity)).toEqual(['urgent']);
    expect(withChildPugh('B').map((it) => it.severity)).toEqual(['review']);
    expect(withChildPugh('A')).toEqual([]);
    expect(withChildPugh('C', 'deferiprone')).toEqual([]);
  });
});

describe('deferasirox-start-criteria (US deferasirox label §2.1: ≥ 100 mL/kg of packed red cells, ferritin consistently > 1,000 µg/L)', () => {
  const start = (ferritins: number[], transfusionEveryDays: number | null, startDaysBefore = 10) =>
    ofRule(
      findingsFor(smallCase({ weightKg: 60, transfusionEveryDays, results: ferritins.map((value, index) => result('ferritin', 40 - index * 20, value, 'ug/L')), chelationPeriods: [period('deferasirox', 14, { startDaysBefore })] })),
      'deferasirox-start-criteria',
    );

  it('in the first month of a run: information, met with 2 years of transfusions (about 1,000 mL/kg) and ferritins 1,001 and 1,200', () => {
    const [finding] = start([1001, 1200], 21);
    expect(finding!.severity).toBe('information');
    expect(finding!.text).toContain('which the record meets');
  });

  it('a ferritin of 1,000 is not above 1,000: not shown as met; no transfusions on record: not met', () => {
    expect(start([1000, 1200], 21)[0]!.text).toContain('which the record does not show');
    expect(start([1500, 1500], null)[0]!.text).toContain('0 mL/kg of packed red cells');
  });

  it('is shown only while the run is in its first month', () => {
    expect(start([1500, 1500], 21, 40)).toEqual([]);
  });
});

describe('deferoxamine-ferritin-band (US deferoxamine labels §2: about 25 below 2,000 µg/L, 35 at 2,000–3,000, up to 55 above)', () => {
  const band = (ferritin: number) => ofRule(findingsFor(smallCase({ results: [result('ferritin', 5, ferritin, 'ug/L'), result('liver-iron', 100, 6, 'mg/g{dry}', { method: 'biopsy' })], chelationPeriods: [period('deferoxamine', 40)] })), 'deferoxamine-ferritin-band')[0]!.text;
  it('1,999 → about 25; 2,000 → about 35; 3,000 → up to 55', () => {
    expect(band(1999)).toContain('about 25 mg/kg/day as the usual dose with ferritin below 2,000');
    expect(band(2000)).toContain('about 35 mg/kg/day');
    expect(band(3000)).toContain('up to 55 mg/kg/day');
    expect(band(3000)).toContain('reference only');
  });
});

describe('product-administrations-mismatch (US deferiprone label March 2025 §2.1: the two 1,000 mg tablets are not interchangeable)', () => {
  const withProduct = (productId: string, administrationsPerDay: number) =>
    ofRule(findingsFor(smallCase({ chelationPeriods: [period('deferiprone', 75 / administrationsPerDay, { productId, administrationsPerDay })] })), 'product-administrations-mismatch');

  it('the twice-a-day tablet recorded three times a day: review; twice a day: nothing; the three-times-a-day tablet twice a day: review', () => {
    expect(withProduct('deferiprone-tablets-1000-twice-daily', 3).map((it) => it.severity)).toEqual(['review']);
    expect(withProduct('deferiprone-tablets-1000-twice-daily', 2)).toEqual([]);
    expect(withProduct('deferiprone-tablets-1000-three-times-daily', 3)).toEqual([]);
    expect(withProduct('deferiprone-tablets-1000-three-times-daily', 2)[0]!.text).toContain('not interchangeable');
  });

  it('an unknown product is information; a product of another drug is review', () => {
    expect(withProduct('local-product', 3).map((it) => it.severity)).toEqual(['information']);
    expect(withProduct('deferasirox-film-coated', 3).map((it) => it.severity)).toEqual(['review']);
  });
});

describe('label-listed-interaction (deferasirox EU SmPC §4.5; deferiprone US §7 / EU §4.5; deferoxamine US drug interactions)', () => {
  const coMedication = (name: string) => ({ id: `cm-${name}`, name, startDate: addDaysIso(reviewDate, -20), endDate: null });
  const interactions = (drug: 'deferasirox' | 'deferiprone' | 'deferoxamine', names: string[]) =>
    ofRule(findingsFor(smallCase({ chelationPeriods: [period(drug, drug === 'deferasirox' ? 14 : drug === 'deferiprone' ? 25 : 40)], coMedications: names.map(coMedication) })), 'label-listed-interaction');

  it('deferasirox: ibuprofen (GI bleeding), repaglinide (CYP2C8), rifampicin (UGT inducer), cholestyramine typed with capitals; amlodipine is not listed', () => {
    const found = interactions('deferasirox', ['ibuprofen', 'repaglinide', 'Rifampicin', 'Cholestyramine', 'amlodipine']);
    expect(found.map((it) => it.triggers[0]!.value)).toEqual(['ibuprofen', 'repaglinide', 'Rifampicin', 'Cholestyramine']);
    expect(found.every((it) => it.severity === 'review' && it.text.includes('matching is by name and may miss a drug'))).toBe(true);
    expect(found[1]!.text).toContain('about 2.3-fold');
    expect(found[0]!.sourceIds).toEqual(expect.arrayContaining(['interaction-matching-by-name', 'deferasirox-smpc-eu']));
  });

  it('deferiprone: clozapine (neutropenia) and zinc sulfate (polyvalent cation, spacing); deferoxamine: prochlorperazine and gallium-67', () => {
    expect(interactions('deferiprone', ['clozapine', 'zinc sulfate']).map((it) => it.text.includes('deferiprone') || it.text.startsWith('Deferiprone'))).toEqual([true, true]);
    expect(interactions('deferiprone', ['zinc sulfate'])[0]!.text).toContain('asks for an interval between them');
    expect(interactions('deferoxamine', ['prochlorperazine', 'Gallium-67']).map((it) => it.triggers[0]!.value)).toEqual(['prochlorperazine', 'Gallium-67']);
  });

  it('names both drugs; an interaction of a chelator that is not running gives nothing', () => {
    const [finding] = interactions('deferasirox', ['warfarin']);
    expect(finding!.text.startsWith('Deferasirox with warfarin')).toBe(true);
    expect(interactions('deferoxamine', ['repaglinide'])).toEqual([]);
  });

  it('every catalogue entry cites a known source and lists its members once, in lower case', () => {
    for (const entry of labelInteractions) {
      for (const id of entry.sourceIds) expect(findSource(id), id).toBeDefined();
      expect(new Set(entry.members).size, entry.id).toBe(entry.members.length);
      for (const member of entry.members) expect(member, entry.id).toBe(member.toLowerCase());
    }
  });
});

describe('proportion of days covered (Nau, Pharmacy Quality Alliance 2012: days with drug on hand ÷ days in the period; overlaps carried forward)', () => {
  it('worked by hand: two 30-day supplies 20 days apart over 90 days cover 60 days (the second shifted to start on day 31)', () => {
    const covered = proportionOfDaysCovered([{ date: '2026-01-01', daysSupplied: 30 }, { date: '2026-01-21', daysSupplied: 30 }], '2026-01-01', '2026-03-31');
    expect(covered).toEqual({ coveredDays: 60, periodDays: 90, proportion: 60 / 90, dispensings: 2 });
  });

  it('counts supply on hand from before the period and none after its end; a gap is uncovered', () => {
    expect(proportionOfDaysCovered([{ date: '2025-12-20', daysSupplied: 30 }], '2026-01-01', '2026-01-31').coveredDays).toBe(18);
    expect(proportionOfDaysCovered([{ date: '2026-01-25', daysSupplied: 30 }], '2026-01-01', '2026-01-31').coveredDays).toBe(7);
    expect(proportionOfDaysCovered([{ date: '2026-01-01', daysSupplied: 10 }, { date: '2026-01-21', daysSupplied: 11 }], '2026-01-01', '2026-01-31').coveredDays).toBe(21);
  });

  it('is shown beside the entered adherence for the period (adherence-from-dispensings)', () => {
    const dispensings = [0, 1, 2].map((index) => ({ id: `d${index}`, date: addDaysIso(reviewDate, -89 + index * 30), drug: 'deferasirox', quantity: { value: 30, unit: '{each}' }, daysSupplied: 20 }));
    const [finding] = ofRule(findingsFor(smallCase({ chelationPeriods: [period('deferasirox', 14, { startDaysBefore: 89, adherence: 0.9 })], dispensings })), 'adherence-from-dispensings');
    expect(finding!.text).toContain('3 dispensing(s) cover 60 of 90 days, a proportion of days covered of 0.67');
    expect(finding!.text).toContain('entered adherence estimate of 0.9');
  });

  it('is set beside the measured response between LIC results: TH-0417 with 15-day supplies every 30 days from 2025-11-20', () => {
    const dispensings = Array.from({ length: 12 }, (_, index) => ({ id: `disp-${index}`, date: addDaysIso('2025-11-20', index * 30), drug: 'deferasirox', quantity: { value: 15, unit: '{each}' }, daysSupplied: 15 }));
    const json = withChange(readDemo('th-0417'), ['dispensings'], dispensings);
    const [finding] = ofRule(findingsFor(json), 'adherence-from-dispensings');
    // By hand: the LIC results of 2025-11-18 and 2026-11-17; counted from the first dispensing (PQA index date),
    // 2025-11-20..2026-11-17 is 363 days, of which the 12 supplies of 15 days cover 180.
    expect(finding!.text).toContain('Between the LIC results of 2025-11-18 and 2026-11-17 the dispensings cover 180 of 363 days (0.5, below the 0.80 usually taken as adequate)');
    const results = computeCase(parsed(json), reviewDate, { samples: 60 });
    const ratio = results.ok ? results.value.responses.at(-1)!.measuredToExpectedRatio! : NaN;
    expect(finding!.triggers.find((it) => it.name === 'measured ÷ expected removal')!.value).toBe(Number(ratio.toFixed(4)));
    expect(finding!.text).toContain(`the measured removal was ${Math.round(ratio * 100)} % of the expected`);
  });
});

describe('scenario cases (scenarios.md) with the new rules', () => {
  it('TH-0322 (scenario 5): urgent T2* below 10 ms and ANC below 1.5 on deferiprone; the calendar follows the ANC daily; a daily count overdue is a review finding', () => {
    const findings = findingsFor(th0322());
    const urgent = findings.filter((it) => it.severity === 'urgent').map((it) => it.ruleId);
    expect(urgent).toEqual(expect.arrayContaining(['cardiac-t2star', 'deferiprone-neutrophils']));
    const calendar = monitoringCalendar(parsed(th0322()), reviewDate);
    expect(calendar.ok && calendar.value.items.find((it) => it.id === 'neutrophils')).toMatchObject({ interval: { days: 1 }, status: 'overdue' });
    expect(ofRule(findings, 'deferiprone-anc-monitoring')[0]).toMatchObject({ severity: 'review' });
  });

  it('MD-1102 (scenario 2): the renal findings, and the calendar checks creatinine weekly while it rises (1.0 → 1.5 mg/dL, 50 % over baseline)', () => {
    const ids = findingsFor(md1102()).map((it) => it.ruleId);
    expect(ids).toEqual(expect.arrayContaining(['deferasirox-egfr', 'deferasirox-creatinine-rise']));
    const calendar = monitoringCalendar(parsed(md1102()), reviewDate);
    expect(calendar.ok && calendar.value.items.find((it) => it.id === 'creatinine')).toMatchObject({ interval: { days: 7 } });
  });

  it('TH-0093 (scenario 3): ascorbic acid within the 200 mg the label gives, given only with deferoxamine after its first month; hearing and eyes due', () => {
    const findings = findingsFor(readDemo('th-0093'));
    expect(ofRule(findings, 'ascorbic-acid-with-deferoxamine').map((it) => it.severity)).toEqual(['information']);
    expect(ofRule(findings, 'deferoxamine-hearing-eyes')).toHaveLength(2);
    expect(ofRule(findings, 'label-listed-interaction')).toEqual([]);
    expect(addMonthsIso('2024-09-02', 1)).toBe('2024-10-02');
  });
});
