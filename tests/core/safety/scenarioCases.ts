import { addDaysIso, addMonthsIso } from '../../../core/dates';
import { period, result, reviewDate, smallCase } from './safetyCases';

/**
 * The scenario patients of ../shared/scenarios.md that have no demo file,
 * built from the scenario text with the open details made up plausibly.
 * All invented.
 */

/** Scenario 2, MD-1102: 71-year-old man with MDS, 68 kg, deferasirox film-coated 14 mg/kg/day; creatinine 1.0 → 1.5 mg/dL. */
export function md1102(): Record<string, unknown> {
  const monthly = (months: number, creatinine: number) => [
    result('creatinine', daysBeforeMonths(months), creatinine, 'mg/dL'),
    result('alt', daysBeforeMonths(months), 24, 'U/L'),
  ];
  const json = smallCase({
    ageYears: 71,
    sexAtBirth: 'male',
    diagnosisGroup: 'myelodysplastic-syndrome',
    weightKg: 68,
    results: [
      result('creatinine', 560, 1.0, 'mg/dL'),
      result('liver-iron', 150, 8.5, 'mg/g{dry}', { method: 'mri', fieldStrengthT: 1.5, calibrationId: 'hernando-1.5t' }),
      result('ferritin', 100, 1850, 'ug/L'),
      result('ferritin', 10, 1900, 'ug/L'),
      ...monthly(5, 1.0),
      ...monthly(4, 1.1),
      ...monthly(3, 1.3),
      ...monthly(2, 1.4),
      result('creatinine', 10, 1.5, 'mg/dL'),
      result('alt', 10, 26, 'U/L'),
    ],
    chelationPeriods: [period('deferasirox', 14, { startDaysBefore: 540 })],
  });
  return { ...json, patient: { ...(json.patient as object), label: 'MD-1102' } };
}

/** Scenario 5, TH-0322: 29-year-old, 61 kg, cardiac T2* 8 ms, LIC 18, deferiprone 25 mg/kg × 3 plus deferoxamine 40 mg/kg on 5 nights, ANC 1.3. */
export function th0322(): Record<string, unknown> {
  const json = smallCase({
    ageYears: 29,
    sexAtBirth: 'female',
    weightKg: 61,
    results: [
      result('cardiac-t2star', 12, 8, 'ms', { fieldStrengthT: 1.5 }),
      result('liver-iron', 12, 18, 'mg/g{dry}', { method: 'mri', fieldStrengthT: 1.5, calibrationId: 'hernando-1.5t' }),
      result('ferritin', 40, 3400, 'ug/L'),
      result('ferritin', 5, 3500, 'ug/L'),
      result('creatinine', 5, 0.7, 'mg/dL'),
      result('alt', 5, 30, 'U/L'),
      result('neutrophils', 10, 2.4, '10*9/L'),
      result('neutrophils', 3, 1.3, '10*9/L'),
    ],
    chelationPeriods: [period('deferiprone', 25, { startDaysBefore: 200 }), period('deferoxamine', 40, { startDaysBefore: 200 })],
  });
  return { ...json, patient: { ...(json.patient as object), label: 'TH-0322' } };
}

/** Scenario 4, SC-0781: 26-year-old with sickle cell disease, 74 kg, monthly automated exchange, no chelator, liver R2* at 3 T with a 1.5 T calibration chosen. */
export function sc0781(): Record<string, unknown> {
  const json = smallCase({
    ageYears: 26,
    sexAtBirth: 'female',
    diagnosisGroup: 'sickle-cell-disease',
    weightKg: 74,
    transfusionEveryDays: null,
    results: [
      result('ferritin', 90, 900, 'ug/L'),
      result('ferritin', 30, 650, 'ug/L'),
      // R2* 200 s⁻¹ at 3 T: about 4.1 mg/g dry on a 3 T calibration; a 1.5 T calibration is refused.
      result('liver-iron', 20, 200, 's-1', { method: 'mri-r2star', fieldStrengthT: 3, calibrationId: 'hernando-1.5t' }),
    ],
  });
  const exchanges = Array.from({ length: 24 }, (_, index) => ({
    id: `x${index}`,
    date: addMonthsIso(addDaysIso(reviewDate, -730), index),
    kind: 'exchange',
    method: 'automated',
    volumeIn: { value: 2000, unit: 'mL' },
    unitHaematocrit: 0.6,
    unitCount: 8,
    volumeRemoved: { value: 4000, unit: 'mL' },
    patientHaematocrit: 0.3,
  }));
  return { ...json, transfusions: exchanges, patient: { ...(json.patient as object), label: 'SC-0781' } };
}

function daysBeforeMonths(months: number): number {
  return Math.round(months * 30.44);
}
