import { fail, issue, ok, type Result } from '../result';
import type { MgPerDl, MlPerMinPer173M2, Years } from '../units/quantity';
import { adultFromAgeYears, oldestAgeYears } from './ageRanges';
import type { SexAtBirth } from './sexAtBirth';

/**
 * Coefficients of the CKD-EPI 2021 creatinine equation by sex, as printed in
 * Inker et al., N Engl J Med 2021;385:1737 ('inker-2021', secondary):
 * κ (mg/dL) 0.7 female / 0.9 male; α −0.241 female / −0.302 male; 1.012 for female.
 */
const ckdEpi2021Coefficients = {
  female: { kappaMgPerDl: 0.7, alpha: -0.241, sexFactor: 1.012 },
  male: { kappaMgPerDl: 0.9, alpha: -0.302, sexFactor: 1 },
} as const satisfies Record<SexAtBirth, { kappaMgPerDl: number; alpha: number; sexFactor: number }>;

/**
 * Estimated GFR by the race-free CKD-EPI 2021 creatinine equation (adults).
 *
 * eGFR (mL/min/1.73 m²) = 142 × min(SCr/κ, 1)^α × max(SCr/κ, 1)^−1.200 × 0.9938^age × 1.012 [if female]
 *
 * Source: Inker LA et al., New creatinine- and cystatin C-based equations to
 * estimate GFR without race, N Engl J Med 2021;385:1737 ('inker-2021',
 * secondary); 142, −1.200, 0.9938 and the sex coefficients as printed.
 * Creatinine must be IDMS-traceable (standardised).
 *
 * @param creatinineMgPerDl - standardised serum creatinine, mg/dL, 0.1–20
 * @param ageYears - age, years, 18–120 (children are refused, pointing to bedside Schwartz)
 * @param sexAtBirth - 'female' or 'male'
 * @returns eGFR, mL/min/1.73 m²; or a 'not_applicable' issue under 18 years
 * @example egfrCkdEpi2021(mgPerDl(1.0), years(50), 'male') → ok(91.7…)
 */
export function egfrCkdEpi2021(
  creatinineMgPerDl: MgPerDl,
  ageYears: Years,
  sexAtBirth: SexAtBirth,
): Result<MlPerMinPer173M2> {
  if (ageYears < adultFromAgeYears) {
    return fail(
      issue(
        'not_applicable',
        ['ageYears'],
        `Age ${ageYears} years is outside the range of CKD-EPI 2021 (adults, ${adultFromAgeYears}–${oldestAgeYears} years); for a child, review the bedside Schwartz eGFR (egfr-schwartz-bedside).`,
      ),
    );
  }
  const { kappaMgPerDl, alpha, sexFactor } = ckdEpi2021Coefficients[sexAtBirth];
  const ratio = creatinineMgPerDl / kappaMgPerDl;
  const egfr = 142 * Math.min(ratio, 1) ** alpha * Math.max(ratio, 1) ** -1.2 * 0.9938 ** ageYears * sexFactor;
  return ok(egfr as MlPerMinPer173M2);
}
