import { describe, expect, it } from 'vitest';
import { runFormula } from '../../../core/formulas/run';
import { egfrSchwartzBedsideFormula } from '../../../core/patient/formulas';
import { egfrSchwartzBedside } from '../../../core/patient/schwartzBedside';
import { cm, mgPerDl, years } from '../../../core/units/quantity';
import { ucumConvert } from '../units/ucumReference';

describe('bedside Schwartz (Schwartz et al., J Am Soc Nephrol 2009;20:629)', () => {
  it('TH-0093 (scenarios.md §3): 121 cm, 0.4 mg/dL → 0.413 × 121 / 0.4 = 124.9325 (hand arithmetic)', () => {
    // Exact decimal arithmetic: floating-point error only.
    const result = egfrSchwartzBedside(cm(121), mgPerDl(0.4), years(7));
    expect(result.ok && result.value).toBeCloseTo(124.9325, 10);
  });

  it('agrees with the SI form 36.5 × height (cm) / SCr (µmol/L) (as printed in UK paediatric references, from memory)', () => {
    // 0.413 × 88.4 = 36.51: the printed 36.5 is rounded by 0.03 %; tolerance 0.05 %.
    // ucum-lhc converts mg/dL to µmol/L with creatinine 113.12 g/mol (PubChem, from memory).
    for (const [heightCm, creatinine] of [[75, 0.25], [121, 0.4], [160, 0.9], [140, 3.2]] as const) {
      const umolPerL = ucumConvert('mg/dL', creatinine, 'umol/L', 113.12);
      const result = egfrSchwartzBedside(cm(heightCm), mgPerDl(creatinine), years(8));
      if (!result.ok) throw new Error('refused');
      expect(Math.abs(result.value / ((36.5 * heightCm) / umolPerL) - 1)).toBeLessThan(0.0005);
    }
  });

  it('falls as creatinine rises and rises with height', () => {
    const at = (height: number, creatinine: number): number => {
      const result = egfrSchwartzBedside(cm(height), mgPerDl(creatinine), years(10));
      if (!result.ok) throw new Error('refused');
      return result.value;
    };
    expect(at(130, 0.6)).toBeLessThan(at(130, 0.5));
    expect(at(131, 0.5)).toBeGreaterThan(at(130, 0.5));
  });

  it('covers 1 to under 18 years and refuses outside, pointing adults to CKD-EPI 2021', () => {
    expect(egfrSchwartzBedside(cm(75), mgPerDl(0.3), years(1)).ok).toBe(true);
    expect(egfrSchwartzBedside(cm(170), mgPerDl(0.8), years(17.9)).ok).toBe(true);
    expect(egfrSchwartzBedside(cm(172), mgPerDl(0.8), years(18))).toEqual({
      ok: false,
      issues: [
        {
          code: 'not_applicable',
          path: ['ageYears'],
          message:
            'Age 18 years is outside the range of the bedside Schwartz equation (1 to under 18 years); for an adult, review CKD-EPI 2021 (egfr-ckd-epi-2021).',
          severity: 'error',
        },
      ],
    });
    const infant = egfrSchwartzBedside(cm(65), mgPerDl(0.3), years(0.5));
    expect(infant.ok).toBe(false);
    if (infant.ok) return;
    expect(infant.issues[0]!.message).toBe(
      'Age 0.5 years is outside the range of the bedside Schwartz equation (1 to under 18 years); it was not derived in infants under 1 year.',
    );
  });
});

describe('egfr-schwartz-bedside through runFormula', () => {
  it('takes creatinine in µmol/L', () => {
    // 35.36 µmol/L = 0.4000 mg/dL (× 113.12 / 10 000); tolerance ±0.05 for the 4-figure µmol/L value.
    const result = runFormula(egfrSchwartzBedsideFormula, {
      heightCm: 121,
      serumCreatinine: 35.36,
      creatinineUnit: 'umol/L',
      ageYears: 7,
    });
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.value.outputs.egfrMlPerMinPer173M2).toBeCloseTo(124.93, 1);
  });

  it('refuses a height outside 40–220 cm (the case model’s plausible height, core/ranges), naming the field, value and range', () => {
    const result = runFormula(egfrSchwartzBedsideFormula, { heightCm: 12.1, serumCreatinine: 0.4, creatinineUnit: 'mg/dL', ageYears: 7 });
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.issues[0]).toMatchObject({
      code: 'out_of_range',
      path: ['heightCm'],
      message: 'Height 12.1 cm is outside the plausible range 40–220 cm.',
    });
  });
});
