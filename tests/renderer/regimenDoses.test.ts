import { describe, expect, it } from 'vitest';
import type { ChelationPeriod } from '../../core/model/caseFile';
import { periodDoseLines } from '../../renderer/viewModels/regimenDoses';

// The Regimens screen's dose lines come from core (core/dosing's practical
// dose, core/chelators' binding by stoichiometry); this checks the text a
// pharmacist reads against arithmetic from outside the project.
const deferasirox28: ChelationPeriod = {
  id: 'p1', drug: 'deferasirox', formulation: 'film-coated-tablet', route: 'oral', dose: { value: 28, unit: 'mg/kg' },
  administrationsPerDay: 1, daysPerWeek: 7, startDate: '2026-11-20', endDate: null, adherence: 1,
} as ChelationPeriod;

describe('dose lines of a regimen', () => {
  it('states the iron one deferasirox dose can bind: 2 ligands per iron, M(deferasirox C21H15N3O4) 373.36 g/mol, Ar(Fe) 55.845 (CIAAW)', () => {
    const [line] = periodDoseLines([deferasirox28], 52);
    // 28 mg/kg × 52 kg = 1,456 mg; 1,456 / 373.36 / 2 × 55.845 = 108.9 mg (molar mass from the CIAAW
    // standard atomic weights: 21 × 12.011 + 15 × 1.008 + 3 × 14.007 + 4 × 15.999 = 373.368).
    const expectedBoundMg = (1456 / 373.368 / 2) * 55.845;
    expect(line!.capacity).toBe(`1,456 mg per administration binds at most ${Math.round(expectedBoundMg)} mg iron (stoichiometric ceiling)`);
  });

  it('gives the practical dose with the shelf strengths (90, 180, 360 mg film-coated tablets): 1,456 mg is nearest 4 × 360 mg = 1,440 mg', () => {
    const [line] = periodDoseLines([deferasirox28], 52);
    // Whole tablets of 90/180/360 mg reach multiples of 90 mg; the nearest to 1,456 mg is 1,440 mg (16 mg below; 1,530 is 74 above).
    expect(line!.practical).toMatch(/^4 × 360 mg/);
    expect(line!.practical).toContain('1,440');
  });

  it('says so when a formulation has no product in the catalogue, instead of inventing one', () => {
    const [line] = periodDoseLines([{ ...deferasirox28, formulation: 'granules' } as ChelationPeriod], 52);
    expect(line!.practical).toBe('no product of this formulation in the catalogue');
  });
});
