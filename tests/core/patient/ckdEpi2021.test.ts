import { describe, expect, it } from 'vitest';
import { runFormula } from '../../../core/formulas/run';
import { egfrCkdEpi2021 } from '../../../core/patient/ckdEpi2021';
import { egfrCkdEpi2021Formula } from '../../../core/patient/formulas';
import type { SexAtBirth } from '../../../core/patient/sexAtBirth';
import { mgPerDl, years } from '../../../core/units/quantity';

function egfr(creatinineMgPerDl: number, ageYears: number, sex: SexAtBirth): number {
  const result = egfrCkdEpi2021(mgPerDl(creatinineMgPerDl), years(ageYears), sex);
  if (!result.ok) throw new Error(result.issues[0]!.message);
  return result.value;
}

/**
 * An independent re-implementation in the four-stratum form in which Inker et
 * al. (N Engl J Med 2021;385:1737) tabulate the equation: one power law per sex
 * and creatinine band, written out separately rather than with min/max.
 */
function egfrByStratum(creatinineMgPerDl: number, ageYears: number, sex: SexAtBirth): number {
  const ageTerm = 0.9938 ** ageYears;
  if (sex === 'female') {
    return creatinineMgPerDl <= 0.7
      ? 142 * (creatinineMgPerDl / 0.7) ** -0.241 * ageTerm * 1.012
      : 142 * (creatinineMgPerDl / 0.7) ** -1.2 * ageTerm * 1.012;
  }
  return creatinineMgPerDl <= 0.9
    ? 142 * (creatinineMgPerDl / 0.9) ** -0.302 * ageTerm
    : 142 * (creatinineMgPerDl / 0.9) ** -1.2 * ageTerm;
}

describe('CKD-EPI 2021 worked examples, derived by hand from the printed equation (Inker et al. 2021)', () => {
  // Each value worked with six-figure logarithms (shown); tolerance ±0.005,
  // well above the 1e-5 relative error of six-figure intermediates.
  it('man, 50 years, 1.0 mg/dL → 91.69', () => {
    // (1.0/0.9)^−1.200 = e^(−1.2 × 0.105361) = 0.881234; 0.9938^50 = e^(50 × −0.0062193) = 0.732740
    // 142 × 0.881234 × 0.732740 = 91.69
    expect(egfr(1.0, 50, 'male')).toBeCloseTo(91.69, 2);
  });

  it('man, 71 years (MD-1102, scenarios.md §2): 1.0 → 80.47 and 1.5 mg/dL → 49.47, "from about 80 to just under 50"', () => {
    // 0.9938^71 = e^(−0.441570) = 0.643026; (1.5/0.9)^−1.200 = e^(−0.612991) = 0.541728
    // 142 × 0.881234 × 0.643026 = 80.47; 142 × 0.541728 × 0.643026 = 49.47
    expect(egfr(1.0, 71, 'male')).toBeCloseTo(80.47, 2);
    expect(egfr(1.5, 71, 'male')).toBeCloseTo(49.47, 2);
  });

  it('woman, 60 years, 0.8 mg/dL → 84.30 (above κ: exponent −1.200)', () => {
    // (0.8/0.7)^−1.200 = e^(−0.160238) = 0.851941; 0.9938^60 = 0.688556
    // 142 × 0.851941 × 0.688556 × 1.012 = 84.30
    expect(egfr(0.8, 60, 'female')).toBeCloseTo(84.3, 2);
  });

  it('woman, 30 years, 0.6 mg/dL → 123.76 (below κ: exponent −0.241)', () => {
    // (0.6/0.7)^−0.241 = e^(0.0371503) = 1.037849; 0.9938^30 = 0.829793
    // 142 × 1.037849 × 0.829793 × 1.012 = 123.76
    expect(egfr(0.6, 30, 'female')).toBeCloseTo(123.76, 2);
  });
});

describe('CKD-EPI 2021 against the four-stratum form', () => {
  it('agrees on a grid of creatinine, age and sex', () => {
    // Same arithmetic in another arrangement: floating-point error only (1e-12 relative).
    for (const sex of ['female', 'male'] as const) {
      for (let creatinine = 0.3; creatinine <= 12; creatinine *= 1.17) {
        for (const age of [18, 25, 40, 63.5, 80, 97]) {
          const ratio = egfr(creatinine, age, sex) / egfrByStratum(creatinine, age, sex);
          expect(Math.abs(ratio - 1), `${sex} ${creatinine} mg/dL ${age} y`).toBeLessThan(1e-12);
        }
      }
    }
  });
});

describe('CKD-EPI 2021 invariants', () => {
  it('falls as creatinine rises, for both sexes', () => {
    for (const sex of ['female', 'male'] as const) {
      let previous = Number.POSITIVE_INFINITY;
      for (let creatinine = 0.2; creatinine <= 15; creatinine += 0.05) {
        const value = egfr(creatinine, 55, sex);
        expect(value).toBeLessThan(previous);
        previous = value;
      }
    }
  });

  it('is continuous at SCr = κ, where it equals 142 × 0.9938^age (× 1.012 for women)', () => {
    // At SCr = κ both min and max terms are 1. One part in 1e9 on either side
    // moves the value by about |α| or 1.2 parts in 1e9: tolerance 1e-8 relative.
    for (const [sex, kappa, factor] of [['female', 0.7, 1.012], ['male', 0.9, 1]] as const) {
      const atKappa = egfr(kappa, 45, sex);
      expect(atKappa / (142 * 0.9938 ** 45 * factor) - 1).toBeCloseTo(0, 12);
      expect(Math.abs(egfr(kappa * (1 - 1e-9), 45, sex) / atKappa - 1)).toBeLessThan(1e-8);
      expect(Math.abs(egfr(kappa * (1 + 1e-9), 45, sex) / atKappa - 1)).toBeLessThan(1e-8);
    }
  });

  it('carries the female factor 1.012 at the same SCr/κ above 1, and gives a woman a lower eGFR than a man at the same creatinine above 0.9', () => {
    // Above κ both sexes share the exponent −1.200, so only 1.012 differs (exact up to rounding: 1e-12).
    for (const ratio of [1.2, 2, 5]) {
      expect(egfr(0.7 * ratio, 50, 'female') / egfr(0.9 * ratio, 50, 'male')).toBeCloseTo(1.012, 12);
    }
    // Same creatinine 1.2: female / male = (0.7/0.9)^1.2 × 1.012 = 0.7397 × 1.012 = 0.749 (hand arithmetic).
    expect(egfr(1.2, 50, 'female') / egfr(1.2, 50, 'male')).toBeCloseTo(0.749, 3);
  });

  it('falls with age by 0.9938 a year', () => {
    for (const age of [18, 30, 60, 89]) {
      expect(egfr(1.1, age + 1, 'male') / egfr(1.1, age, 'male')).toBeCloseTo(0.9938, 12);
      expect(egfr(1.1, age + 1, 'male')).toBeLessThan(egfr(1.1, age, 'male'));
    }
  });
});

describe('CKD-EPI 2021 refusals', () => {
  it('refuses a 17-year-old and points to the bedside Schwartz equation', () => {
    const result = egfrCkdEpi2021(mgPerDl(0.8), years(17), 'female');
    expect(result).toEqual({
      ok: false,
      issues: [
        {
          code: 'not_applicable',
          path: ['ageYears'],
          message:
            'Age 17 years is outside the range of CKD-EPI 2021 (adults, 18–120 years); for a child, review the bedside Schwartz eGFR (egfr-schwartz-bedside).',
          severity: 'error',
        },
      ],
    });
    expect(egfrCkdEpi2021(mgPerDl(0.8), years(18), 'female').ok).toBe(true);
  });
});

describe('egfr-ckd-epi-2021 through runFormula', () => {
  it('takes creatinine in µmol/L and gives the same eGFR as in mg/dL', () => {
    // 132.6 µmol/L ÷ 88.40 = 1.5000 mg/dL. Tolerance ±0.05: the hand value 49.47 is rounded to
    // 0.005, and the µmol/L route differs from 1.5 mg/dL by under 0.01 % (≈ 0.006 mL/min/1.73 m²).
    const result = runFormula(egfrCkdEpi2021Formula, {
      serumCreatinine: 132.6,
      creatinineUnit: 'umol/L',
      ageYears: 71,
      sexAtBirth: 'male',
    });
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.value.outputs.egfrMlPerMinPer173M2).toBeCloseTo(49.47, 1);
    expect(result.value.outputs.creatinineMgPerDl).toBeCloseTo(1.5, 3);
    expect(result.value.derivation.sourceIds).toEqual(['inker-2021']);
  });

  it('refuses age 17 through the calculator with the same message', () => {
    const result = runFormula(egfrCkdEpi2021Formula, {
      serumCreatinine: 0.8,
      creatinineUnit: 'mg/dL',
      ageYears: 17,
      sexAtBirth: 'female',
    });
    expect(result.ok).toBe(false);
    if (result.ok) return;
    // The calculator's age range is the equation's adult range, stated in calc --list too.
    expect(result.issues[0]).toMatchObject({ code: 'out_of_range', path: ['ageYears'] });
    expect(result.issues[0]!.message).toContain('18–120 a');
    expect(result.issues[0]!.message).toContain('egfr-schwartz-bedside');
  });

  it('refuses an out-of-range creatinine, naming field, value and range in the chosen unit', () => {
    const result = runFormula(egfrCkdEpi2021Formula, {
      serumCreatinine: 25,
      creatinineUnit: 'mg/dL',
      ageYears: 50,
      sexAtBirth: 'male',
    });
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.issues).toEqual([
      {
        code: 'out_of_range',
        path: ['serumCreatinine'],
        message: 'Serum creatinine 25 mg/dL is outside the plausible range 0.1–20 mg/dL; if it was measured in umol/L, choose that unit.',
        severity: 'error',
      },
    ]);
  });

  it('requires sex at birth and the creatinine unit', () => {
    const result = runFormula(egfrCkdEpi2021Formula, { serumCreatinine: 1, ageYears: 50 });
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.issues.map((it) => [it.code, it.path[0]])).toEqual([
      ['required', 'creatinineUnit'],
      ['required', 'sexAtBirth'],
    ]);
  });
});
