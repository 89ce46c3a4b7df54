import { describe, expect, it } from 'vitest';
import { runFormula } from '../../../core/formulas/run';
import type { AnyFormula } from '../../../core/formulas/types';
import {
  bloodLead,
  bloodLeadUnitsFormula,
  checkInChosenUnit,
  creatinineMgPerDlFromEntry,
  creatinineUnitsFormula,
  ferritinUnitsFormula,
  haemoglobin,
  haemoglobinUnitsFormula,
  serumCreatinine,
  serumFerritin,
  unitFormulas,
  type LabQuantity,
} from '../../../core/units/formulas';
import { ucumConvert } from './ucumReference';

// Molar masses handed to ucum-lhc, typed here from outside the project rather
// than taken from core, so the check is independent of core/elements:
// - creatinine C4H7N3O 113.12 g/mol (PubChem CID 588, from memory);
// - lead: CIAAW conventional atomic weight 207.2 (references.md §7);
// - haemoglobin per haem monomer 16 114.5 g/mol (tetramer 64 458 / 4, references.md §1).
const creatinineGPerMol = 113.12;
const leadGPerMol = 207.2;
const haemoglobinMonomerGPerMol = 64458 / 4;

/** Run a unit calculator and return its outputs; fails the test on a refusal. */
function convert(formula: AnyFormula, raw: Record<string, unknown>): Record<string, number> {
  const result = runFormula(formula, raw);
  if (!result.ok) throw new Error(result.issues.map((it) => it.message).join('; '));
  return result.value.outputs as Record<string, number>;
}

describe('creatinine-units against ucum-lhc', () => {
  // Tolerance 1e-4 relative: core's molar mass comes from CIAAW atomic weights
  // (113.118 g/mol) and the reference's from PubChem's rounded 113.12, a 2e-5
  // relative difference; all else is exact prefix arithmetic.
  for (const mgPerDl of [0.1, 0.45, 1.0, 1.5, 7.3, 20]) {
    it(`${mgPerDl} mg/dL`, () => {
      const out = convert(creatinineUnitsFormula, { serumCreatinine: mgPerDl, creatinineUnit: 'mg/dL' });
      const expected = ucumConvert('mg/dL', mgPerDl, 'umol/L', creatinineGPerMol);
      expect(Math.abs(out.creatinineUmolPerL! / expected - 1)).toBeLessThan(1e-4);
      expect(out.creatinineMgPerDl).toBe(mgPerDl);
    });
  }
  for (const umolPerL of [9, 53, 88.4, 132.6, 1770]) {
    it(`${umolPerL} µmol/L`, () => {
      const out = convert(creatinineUnitsFormula, { serumCreatinine: umolPerL, creatinineUnit: 'umol/L' });
      const expected = ucumConvert('umol/L', umolPerL, 'mg/dL', creatinineGPerMol);
      expect(Math.abs(out.creatinineMgPerDl! / expected - 1)).toBeLessThan(1e-4);
      expect(out.creatinineUmolPerL).toBe(umolPerL);
    });
  }

  it('agrees with the printed factor 88.4 (references.md §5)', () => {
    // 88.4 is printed to three significant figures: half a unit in the last place is 0.05 / 88.4 ≈ 6e-4.
    const out = convert(creatinineUnitsFormula, { serumCreatinine: 1, creatinineUnit: 'mg/dL' });
    expect(Math.abs(out.creatinineUmolPerL! / 88.4 - 1)).toBeLessThan(6e-4);
  });

  it('round-trips mg/dL → µmol/L → mg/dL', () => {
    // Multiplication then division by the same factor: floating-point error only.
    const there = convert(creatinineUnitsFormula, { serumCreatinine: 1.37, creatinineUnit: 'mg/dL' });
    const back = convert(creatinineUnitsFormula, { serumCreatinine: there.creatinineUmolPerL, creatinineUnit: 'umol/L' });
    expect(back.creatinineMgPerDl).toBeCloseTo(1.37, 12);
  });
});

describe('haemoglobin-units against ucum-lhc', () => {
  // g/dL ↔ g/L is an exact prefix change: 1e-12. mmol/L uses the monomer molar
  // mass on both sides (the same 16 114.5 g/mol), so ucum-lhc checks only the
  // arithmetic around it: 1e-9.
  for (const gPerDl of [2, 6.8, 9.5, 14, 25]) {
    it(`${gPerDl} g/dL`, () => {
      const out = convert(haemoglobinUnitsFormula, { haemoglobin: gPerDl, haemoglobinUnit: 'g/dL' });
      expect(out.haemoglobinGPerL! / ucumConvert('g/dL', gPerDl, 'g/L') - 1).toBeCloseTo(0, 12);
      const mmol = ucumConvert('g/dL', gPerDl, 'mmol/L', haemoglobinMonomerGPerMol);
      expect(Math.abs(out.haemoglobinMmolPerL! / mmol - 1)).toBeLessThan(1e-9);
    });
  }

  it('converts from g/L and from mmol/L to the same g/dL as ucum-lhc', () => {
    const fromGPerL = convert(haemoglobinUnitsFormula, { haemoglobin: 95, haemoglobinUnit: 'g/L' });
    expect(fromGPerL.haemoglobinGPerDl).toBeCloseTo(ucumConvert('g/L', 95, 'g/dL'), 12);
    const fromMmol = convert(haemoglobinUnitsFormula, { haemoglobin: 5.9, haemoglobinUnit: 'mmol/L' });
    const expected = ucumConvert('mmol/L', 5.9, 'g/dL', haemoglobinMonomerGPerMol);
    expect(Math.abs(fromMmol.haemoglobinGPerDl! / expected - 1)).toBeLessThan(1e-9);
  });

  it('agrees with the factor 0.6206 mmol/L per g/dL used by SI laboratories (common practice)', () => {
    // 0.6206 printed to four figures: half a unit in the last place is 0.00005 / 0.6206 ≈ 8e-5.
    const out = convert(haemoglobinUnitsFormula, { haemoglobin: 10, haemoglobinUnit: 'g/dL' });
    expect(Math.abs(out.haemoglobinMmolPerL! / 6.206 - 1)).toBeLessThan(8e-5);
  });
});

describe('ferritin-units against ucum-lhc', () => {
  // ng/mL and µg/L are one quantity: ucum-lhc gives factor 1; exact.
  for (const ferritin of [12, 500, 1000, 2400, 100000]) {
    it(`${ferritin} ng/mL = ${ferritin} µg/L`, () => {
      const out = convert(ferritinUnitsFormula, { ferritin, ferritinUnit: 'ng/mL' });
      expect(out.ferritinUgPerL).toBe(ucumConvert('ng/mL', ferritin, 'ug/L'));
      const back = convert(ferritinUnitsFormula, { ferritin, ferritinUnit: 'ug/L' });
      expect(back.ferritinNgPerMl).toBe(ucumConvert('ug/L', ferritin, 'ng/mL'));
    });
  }
});

describe('blood-lead-units against ucum-lhc', () => {
  // Same atomic weight (207.2) on both sides: 1e-9 relative.
  for (const ugPerDl of [0.5, 3.5, 45, 58, 70, 300]) {
    it(`${ugPerDl} µg/dL`, () => {
      const out = convert(bloodLeadUnitsFormula, { bloodLead: ugPerDl, bloodLeadUnit: 'ug/dL' });
      const expected = ucumConvert('ug/dL', ugPerDl, 'umol/L', leadGPerMol);
      expect(Math.abs(out.bloodLeadUmolPerL! / expected - 1)).toBeLessThan(1e-9);
    });
  }

  it('converts µmol/L back to µg/dL as ucum-lhc does', () => {
    const out = convert(bloodLeadUnitsFormula, { bloodLead: 2.17, bloodLeadUnit: 'umol/L' });
    expect(Math.abs(out.bloodLeadUgPerDl! / ucumConvert('umol/L', 2.17, 'ug/dL', leadGPerMol) - 1)).toBeLessThan(1e-9);
  });

  it('puts the usual chelation threshold 45 µg/dL at about 2.17 µmol/L (references.md §7 factor 10 / 207.2)', () => {
    // 2.17 printed to three figures: tolerance half a unit in the last place, 0.005.
    const out = convert(bloodLeadUnitsFormula, { bloodLead: 45, bloodLeadUnit: 'ug/dL' });
    expect(Math.abs(out.bloodLeadUmolPerL! - 2.17)).toBeLessThan(0.005);
  });
});

describe('plausible ranges per unit', () => {
  // The ranges of the different units of one quantity describe one physical
  // span, each bound rounded outward to a readable number. Checked with
  // ucum-lhc converting the first unit's bounds: (a) every other unit's range
  // contains the converted range (outward), (b) no bound moved by more than the
  // stated share of the converted value (rounding a small bound such as 0.024
  // µmol/L to one significant figure moves it by up to about 20 %).
  const cases: [LabQuantity<string>, string, (value: number, from: string, to: string) => number, number][] = [
    [serumCreatinine, 'creatinine', (v, from, to) => ucumConvert(from, v, to, creatinineGPerMol), 0.1],
    [haemoglobin, 'haemoglobin', (v, from, to) => ucumConvert(from, v, to, haemoglobinMonomerGPerMol), 0.05],
    [bloodLead, 'blood lead', (v, from, to) => ucumConvert(from, v, to, leadGPerMol), 0.2],
    [serumFerritin, 'ferritin', (v, from, to) => ucumConvert(from, v, to), 0],
  ];
  for (const [quantity, name, conversion, allowance] of cases) {
    it(`${name}: every unit's range contains the same span, rounded outward by at most ${allowance * 100} %`, () => {
      const [first, ...others] = quantity.units;
      for (const other of others) {
        const low = conversion(quantity.ranges[first!]!.min, first!, other);
        const high = conversion(quantity.ranges[first!]!.max, first!, other);
        const { min, max } = quantity.ranges[other]!;
        expect(min, `${other} min`).toBeLessThanOrEqual(low * (1 + 1e-12));
        expect(max, `${other} max`).toBeGreaterThanOrEqual(high * (1 - 1e-12));
        expect(Math.abs(min / low - 1)).toBeLessThanOrEqual(allowance);
        expect(Math.abs(max / high - 1)).toBeLessThanOrEqual(allowance);
      }
    });
  }
});

describe('refusals name the field, the value and the range in the chosen unit', () => {
  it('refuses creatinine 115 "mg/dL" and asks whether it was µmol/L', () => {
    const result = runFormula(creatinineUnitsFormula, { serumCreatinine: 115, creatinineUnit: 'mg/dL' });
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.issues).toHaveLength(1);
    expect(result.issues[0]).toMatchObject({ code: 'out_of_range', path: ['serumCreatinine'] });
    expect(result.issues[0]!.message).toBe(
      'Serum creatinine 115 mg/dL is outside the plausible range 0.1–20 mg/dL; if it was measured in umol/L, choose that unit.',
    );
  });

  it('refuses creatinine 1.2 "umol/L" and asks whether it was mg/dL', () => {
    const result = creatinineMgPerDlFromEntry(1.2, 'umol/L');
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.issues[0]!.message).toBe(
      'Serum creatinine 1.2 umol/L is outside the plausible range 8–1770 umol/L; if it was measured in mg/dL, choose that unit.',
    );
  });

  it('refuses a value plausible in no unit without a unit hint', () => {
    const issues = checkInChosenUnit('haemoglobin', 'haemoglobin', 400, 'g/L', haemoglobin.ranges);
    expect(issues).toHaveLength(1);
    expect(issues[0]!.message).toBe('Haemoglobin 400 g/L is outside the plausible range 20–250 g/L.');
  });

  it('refuses haemoglobin 120 "g/dL" and suggests g/L', () => {
    const result = runFormula(haemoglobinUnitsFormula, { haemoglobin: 120, haemoglobinUnit: 'g/dL' });
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.issues[0]!.message).toBe(
      'Haemoglobin 120 g/dL is outside the plausible range 2–25 g/dL; if it was measured in g/L, choose that unit.',
    );
  });

  it('requires the unit: no unit is ever assumed', () => {
    for (const formula of unitFormulas) {
      const valueName = Object.keys(formula.inputs)[0]!;
      const result = runFormula(formula, { [valueName]: 5 });
      expect(result.ok, formula.id).toBe(false);
      if (result.ok) continue;
      expect(result.issues.map((it) => it.code)).toEqual(['required']);
    }
  });

  it('refuses an unknown unit with the list of units', () => {
    const result = runFormula(bloodLeadUnitsFormula, { bloodLead: 45, bloodLeadUnit: 'mg/L' });
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.issues[0]).toMatchObject({ code: 'unknown_choice', path: ['bloodLeadUnit'] });
    expect(result.issues[0]!.message).toBe('Blood lead unit "mg/L" is not one of: ug/dL, umol/L.');
  });
});

describe('every unit calculator through runFormula', () => {
  it('records its inputs, outputs and sources in the derivation, and leaves its inputs alone', () => {
    const raw = Object.freeze({ ferritin: '2900', ferritinUnit: 'ug/L' });
    const result = runFormula(ferritinUnitsFormula, raw);
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.value.derivation.formulaId).toBe('ferritin-units');
    expect(result.value.derivation.inputs.map((it) => [it.name, it.value])).toEqual([
      ['ferritin', 2900],
      ['ferritinUnit', 'ug/L'],
    ]);
    expect(result.value.derivation.outputs.map((it) => [it.name, it.value, it.unit])).toEqual([
      ['ferritinNgPerMl', 2900, 'ng/mL'],
      ['ferritinUgPerL', 2900, 'ug/L'],
    ]);
    expect(raw).toEqual({ ferritin: '2900', ferritinUnit: 'ug/L' });
  });

  it('lists the five calculators in order', () => {
    expect(unitFormulas.map((it) => it.id)).toEqual(['creatinine-units', 'haemoglobin-units', 'ferritin-units', 'blood-lead-units', 'urinary-copper-units']);
  });
});
