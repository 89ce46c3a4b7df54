import { fail, issue, ok, type Result } from '../result';
import type { Centimetres, MgPerDl, MlPerMinPer173M2, Years } from '../units/quantity';
import { adultFromAgeYears, schwartzFromAgeYears } from './ageRanges';

/**
 * Estimated GFR in children by the bedside Schwartz equation.
 *
 * eGFR (mL/min/1.73 m²) = 0.413 × height (cm) / SCr (mg/dL)
 *
 * Source: Schwartz GJ et al., New equations to estimate GFR in children with CKD,
 * J Am Soc Nephrol 2009;20:629 ('schwartz-2009', secondary); 0.413 as printed.
 * Creatinine by an enzymatic, IDMS-traceable method.
 *
 * @param heightCm - height, cm, 45–210
 * @param creatinineMgPerDl - serum creatinine, mg/dL, 0.1–20
 * @param ageYears - age, years, 1 to under 18 (outside that a 'not_applicable' issue)
 * @returns eGFR, mL/min/1.73 m²
 * @example egfrSchwartzBedside(cm(121), mgPerDl(0.4), years(7)) → ok(124.93)
 */
export function egfrSchwartzBedside(
  heightCm: Centimetres,
  creatinineMgPerDl: MgPerDl,
  ageYears: Years,
): Result<MlPerMinPer173M2> {
  if (ageYears < schwartzFromAgeYears || ageYears >= adultFromAgeYears) {
    const advice =
      ageYears >= adultFromAgeYears
        ? 'for an adult, review CKD-EPI 2021 (egfr-ckd-epi-2021)'
        : 'it was not derived in infants under 1 year';
    return fail(
      issue(
        'not_applicable',
        ['ageYears'],
        `Age ${ageYears} years is outside the range of the bedside Schwartz equation (${schwartzFromAgeYears} to under ${adultFromAgeYears} years); ${advice}.`,
      ),
    );
  }
  return ok(((0.413 * heightCm) / creatinineMgPerDl) as MlPerMinPer173M2);
}
