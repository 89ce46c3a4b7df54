import { describe, expect, it } from 'vitest';
import { findFormula } from '../../../core/catalogue';
import { runFormula } from '../../../core/formulas/run';
import * as patient from '../../../core/patient';

// Bookkeeping of the patient area: the calculators are in the catalogue under
// their stable ids, reachable from the area's public surface, and do not touch
// their inputs. The numbers themselves are checked against outside references
// in the test file of each equation.
describe('patient calculators', () => {
  it('are listed in order and found in the catalogue by id', () => {
    const ids = patient.patientFormulas.map((it) => it.id);
    expect(ids).toEqual([
      'bsa-mosteller',
      'bsa-dubois',
      'bsa-haycock',
      'crcl-cockcroft-gault',
      'egfr-ckd-epi-2021',
      'egfr-schwartz-bedside',
    ]);
    for (const id of ids) expect(findFormula(id), id).toBeDefined();
  });

  it('export the pure functions and the calculators from core/patient', () => {
    for (const name of ['bsaMostellerM2', 'egfrCkdEpi2021', 'creatinineClearanceCockcroftGault', 'ageInWholeYears', 'ageInDecimalYears']) {
      expect(typeof (patient as Record<string, unknown>)[name], name).toBe('function');
    }
  });

  it('leave frozen raw inputs as they were', () => {
    const raw = Object.freeze({ serumCreatinine: '1.3', creatinineUnit: 'mg/dL', ageYears: '71', sexAtBirth: 'male' });
    expect(runFormula(patient.egfrCkdEpi2021Formula, raw).ok).toBe(true);
    expect(raw).toEqual({ serumCreatinine: '1.3', creatinineUnit: 'mg/dL', ageYears: '71', sexAtBirth: 'male' });
  });
});
