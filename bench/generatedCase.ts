/**
 * A generated case file for the benchmarks (an invented patient, "BENCH-20Y"):
 * 20 years of transfusions every 3 weeks, 100 results of mixed kinds, 10
 * chelation periods and three proposed regimens (four projected scenarios with
 * the current one). `density` multiplies the number of records over the same 20
 * years (transfusions every 21/density days with the volume divided by density,
 * so the iron brought in stays the same; results and periods × density), which
 * is how the scaling figures grow the record without changing the patient.
 * Deterministic: no clock, no randomness.
 */
import { addDays, formatISO } from 'date-fns';
import { UTCDate } from '@date-fns/utc';

export const generatedReviewDate = '2026-12-01';
const recordStart = new UTCDate(2006, 11, 1);
const recordDays = 20 * 365;

const iso = (dayOffset: number): string => formatISO(addDays(recordStart, dayOffset), { representation: 'date' });

export function generatedCaseJson(density = 1): unknown {
  const transfusionIntervalDays = 21 / density;
  const transfusions = [];
  for (let index = 0, day = 0; day < recordDays; index += 1, day = Math.floor(index * transfusionIntervalDays)) {
    transfusions.push({
      id: `tx-${index}`,
      date: iso(day),
      kind: 'simple',
      volume: { value: Math.round(560 / density), unit: 'mL' },
      unitHaematocrit: 0.6,
      unitCount: density >= 2 ? 1 : 2,
    });
  }

  const resultCount = 100 * density;
  const results = [];
  for (let index = 0; index < resultCount; index += 1) {
    const day = Math.floor(((index + 0.5) * recordDays) / resultCount);
    const date = iso(day);
    const slot = index % 20;
    const id = `r-${index}`;
    if (slot < 8) results.push({ id, date, kind: 'ferritin', measured: { value: 1500 + ((index * 137) % 900), unit: 'ug/L' } });
    else if (slot < 12) results.push({ id, date, kind: 'haemoglobin', measured: { value: 9.5 + (index % 3) * 0.3, unit: 'g/dL' } });
    else if (slot < 15) results.push({ id, date, kind: 'creatinine', measured: { value: 0.6 + (index % 4) * 0.05, unit: 'mg/dL' } });
    else if (slot < 18) results.push({ id, date, kind: 'alt', measured: { value: 20 + (index % 5) * 4, unit: 'U/L' } });
    else if (slot === 18)
      results.push({ id, date, kind: 'liver-iron', method: 'mri', measured: { value: 8 + (index % 7) * 0.5, unit: 'mg/g{dry}' }, fieldStrengthT: 1.5, calibrationId: 'hernando-1.5t' });
    else results.push({ id, date, kind: 'cardiac-t2star', fieldStrengthT: 1.5, measured: { value: 24 + (index % 3), unit: 'ms' } });
  }

  const periodCount = 10 * density;
  const periodDays = Math.floor(recordDays / periodCount);
  const chelationPeriods = [];
  for (let index = 0; index < periodCount; index += 1) {
    const startDay = index * periodDays;
    const endDate = index === periodCount - 1 ? null : iso(startDay + periodDays - 1);
    const common = { id: `p-${index}`, startDate: iso(startDay), endDate, adherence: 0.8 };
    const kind = index % 3;
    if (kind === 0)
      chelationPeriods.push({ ...common, drug: 'deferoxamine', formulation: 'vial', route: 'subcutaneous', dose: { value: 35, unit: 'mg/kg' }, administrationsPerDay: 1, daysPerWeek: 5, infusionHours: 10 });
    else if (kind === 1)
      chelationPeriods.push({ ...common, drug: 'deferiprone', formulation: 'tablet', route: 'oral', dose: { value: 25, unit: 'mg/kg' }, administrationsPerDay: 3, daysPerWeek: 7 });
    else
      chelationPeriods.push({ ...common, drug: 'deferasirox', formulation: 'film-coated-tablet', route: 'oral', dose: { value: 21, unit: 'mg/kg' }, administrationsPerDay: 1, daysPerWeek: 7 });
  }

  const proposal = (id: string, name: string, period: Record<string, unknown>) => ({
    id,
    name,
    periods: [{ id: `${id}-p1`, startDate: generatedReviewDate, endDate: null, adherence: 1, ...period }],
  });
  const weights = [];
  for (let year = 0; year <= 20; year += 2) weights.push({ date: iso(year * 365), weight: { value: 30 + year * 2, unit: 'kg' } });
  const heights = [];
  for (let year = 0; year <= 20; year += 4) heights.push({ date: iso(year * 365), height: { value: 135 + year * 2, unit: 'cm' } });

  return {
    format: 'chelation-ledger.case',
    version: 1,
    patient: {
      label: 'BENCH-20Y',
      age: { kind: 'birth-date', birthDate: '1996-03-01' },
      sexAtBirth: 'male',
      diagnosisGroup: 'thalassaemia-major',
      pregnancy: { status: 'not-pregnant', recordedOn: null },
      weights,
      heights,
    },
    transfusions,
    results,
    chelationPeriods,
    coMedications: [],
    assumptionOverrides: {},
    proposedRegimens: [
      proposal('prop-dfx-28', 'Deferasirox 28 mg/kg/day', { drug: 'deferasirox', formulation: 'film-coated-tablet', route: 'oral', dose: { value: 28, unit: 'mg/kg' }, administrationsPerDay: 1, daysPerWeek: 7 }),
      proposal('prop-dfp-33', 'Deferiprone 33 mg/kg three times a day', { drug: 'deferiprone', formulation: 'tablet', route: 'oral', dose: { value: 33, unit: 'mg/kg' }, administrationsPerDay: 3, daysPerWeek: 7 }),
      proposal('prop-dfo-45', 'Deferoxamine 45 mg/kg on 6 nights', { drug: 'deferoxamine', formulation: 'vial', route: 'subcutaneous', dose: { value: 45, unit: 'mg/kg' }, administrationsPerDay: 1, daysPerWeek: 6, infusionHours: 10 }),
    ],
    review: { reviewDate: generatedReviewDate, notes: [], signOff: null },
  };
}

/**
 * The generated case with its chelation record replaced by `periodCount` back-to-back deferasirox
 * periods over the same 20 years (a dose change every 20 × 365 ⁄ periodCount days, the dose
 * stepping through 20–24 mg/kg), the last one ongoing: one unbroken run of dose changes, the
 * shape that made a review quadratic in the number of periods (issue 17).
 */
export function generatedCaseWithPeriods(periodCount: number): unknown {
  const json = generatedCaseJson(1) as { chelationPeriods: Record<string, unknown>[] };
  const template = json.chelationPeriods.find((period) => period.drug === 'deferasirox')!;
  const periodDays = recordDays / periodCount;
  json.chelationPeriods = Array.from({ length: periodCount }, (_, index) => ({
    ...template,
    id: `dc-${index}`,
    dose: { value: 20 + (index % 5), unit: 'mg/kg' },
    startDate: iso(Math.floor(index * periodDays)),
    endDate: index === periodCount - 1 ? null : iso(Math.floor((index + 1) * periodDays) - 1),
  }));
  return json;
}
