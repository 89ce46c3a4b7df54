import { fail, issue, ok, type Result } from '../result';
import type { MgPerGDry, PerSecond, Tesla } from '../units/quantity';
import type { R2StarCalibration } from './r2StarCalibrations';

/**
 * Field strengths closer than this are the same for choosing a calibration:
 * vendors' "3 T" scanners run at 2.89 T or 3.0 T, and Hernando et al. 2022
 * treat both as the 3 T class (their calibrations for the two differ little).
 * Common practice.
 */
export const fieldStrengthToleranceTesla = 0.25;

/**
 * Liver iron concentration from liver R2* through a named calibration, refused
 * when the scan's field strength is not the calibration's.
 *
 * LIC (mg/g dry) = intercept + slope × R2* (s⁻¹), coefficients of the calibration
 *
 * Source: the calibration's own (core/iron/r2StarCalibrations); R2* depends on
 * field strength, so a calibration must never be applied to a scan at another
 * field strength (Hernando et al. 2022; references.md §2).
 *
 * @param r2Star - liver R2*, s⁻¹ (plausible 10–2000)
 * @param scanFieldStrength - field strength of the scan that measured R2*, tesla (1.5 or about 3)
 * @param calibration - a named calibration from the catalogue
 * @returns LIC, mg Fe/g dry weight; or a 'field_strength_mismatch' issue asking for a calibration derived at the scan's field strength
 * @example licFromR2Star(perSecond(300), tesla(1.5), r2StarCalibration('hernando-1.5t')) → ok(7.649)
 * @example licFromR2Star(perSecond(300), tesla(3), r2StarCalibration('hernando-1.5t')) → issue 'field_strength_mismatch'
 */
export function licFromR2Star(r2Star: PerSecond, scanFieldStrength: Tesla, calibration: R2StarCalibration): Result<MgPerGDry> {
  if (Math.abs(scanFieldStrength - calibration.fieldStrengthTesla) > fieldStrengthToleranceTesla) {
    return fail(
      issue(
        'field_strength_mismatch',
        ['calibration'],
        `The calibration ${calibration.label} ${derivedAt(calibration)} and cannot convert an R2* measured at ${scanFieldStrength} T: ` +
          `R2* rises with field strength. Choose a calibration derived at ${scanFieldStrength} T, or use the liver iron the MRI report gives with its own calibration.`,
      ),
    );
  }
  return ok((calibration.interceptMgPerGDry + calibration.slopeMgPerGDryPerPerS * r2Star) as MgPerGDry);
}

function derivedAt(calibration: R2StarCalibration): string {
  return calibration.fieldStrengthConfirmed
    ? `was derived at ${calibration.fieldStrengthTesla} T`
    : `is taken as a ${calibration.fieldStrengthTesla} T calibration (its field strength is not confirmed)`;
}
