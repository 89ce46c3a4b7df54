import type { Tesla } from '../units/quantity';

export type R2StarCalibrationId = 'hernando-1.5t' | 'wood-1.5t' | 'henninger';

/**
 * A published linear calibration from liver R2* to liver iron concentration:
 * LIC (mg/g dry) = intercept + slope × R2* (s⁻¹), valid only at the field
 * strength it was derived at.
 */
export interface R2StarCalibration {
  readonly id: R2StarCalibrationId;
  /** Short name for screens and the sheet, with the field strength. */
  readonly label: string;
  readonly fieldStrengthTesla: Tesla;
  /** False when the source does not state the field strength and the catalogue assumes it. */
  readonly fieldStrengthConfirmed: boolean;
  readonly slopeMgPerGDryPerPerS: number;
  readonly interceptMgPerGDry: number;
  readonly sourceId: string;
  /** What a reader must know before relying on the result. */
  readonly caution?: string;
}

/**
 * The named calibrations, in the order a user is offered them.
 *
 * Left out on purpose: Hankins (Blood 2009;113:4853, 0.028 × R2* − 0.45) and
 * Garbowski (J Cardiovasc Magn Reson 2014;16:40) are known here only from
 * memory; a calibration that turns a patient's scan into a number must not
 * rest on memory. Hernando's 2.89 T and 3.0 T calibrations exist in the same
 * paper but have not been read yet.
 */
export const r2StarCalibrations: readonly R2StarCalibration[] = [
  {
    id: 'hernando-1.5t',
    label: 'Hernando et al. 2022, 1.5 T',
    fieldStrengthTesla: 1.5 as Tesla,
    fieldStrengthConfirmed: true,
    // Hernando et al., Radiology 2022 (doi 10.1148/radiol.213256), abstract: "for 1.5 T,
    // LIC (in milligrams per gram [dry weight]) = −0.16 + 2.603 × 10−2 R2* (in seconds−1)". Confirmed.
    slopeMgPerGDryPerPerS: 0.02603,
    interceptMgPerGDry: -0.16,
    sourceId: 'hernando-2022',
    caution: 'Calibrated against a commercial R2 MRI method, not biopsy.',
  },
  {
    id: 'wood-1.5t',
    label: 'Wood et al. 2005, 1.5 T',
    fieldStrengthTesla: 1.5 as Tesla,
    fieldStrengthConfirmed: true,
    // Wood et al., Blood 2005;106:1460: LIC = 0.0254 × R2* + 0.202, as reproduced in public MRI
    // analysis code; primary text not seen (secondary).
    slopeMgPerGDryPerPerS: 0.0254,
    interceptMgPerGDry: 0.202,
    sourceId: 'wood-2005',
    caution: 'Coefficients seen only where other work reproduces them (secondary).',
  },
  {
    id: 'henninger',
    label: 'Henninger et al. 2015 (field strength assumed 1.5 T)',
    fieldStrengthTesla: 1.5 as Tesla,
    fieldStrengthConfirmed: false,
    // Henninger et al., RöFo 2015 (doi 10.1055/s-0034-1399318), abstract: slope 0.024 s·mg/g,
    // intercept 0.277 mg/g, from 17 biopsies. Field strength not in the abstract: assumed 1.5 T.
    slopeMgPerGDryPerPerS: 0.024,
    interceptMgPerGDry: 0.277,
    sourceId: 'henninger-2015',
    caution: 'Field strength not confirmed from the full text; treated as 1.5 T. Derived from 17 biopsies.',
  },
];

/**
 * The calibration with this id. Throws for an unknown id: ids come from the
 * catalogue's own choice list, so an unknown one is a bug.
 *
 * @param id - a calibration id from {@link r2StarCalibrations}
 * @returns the calibration
 * @example r2StarCalibration('hernando-1.5t').interceptMgPerGDry === -0.16
 */
export function r2StarCalibration(id: R2StarCalibrationId): R2StarCalibration {
  const found = r2StarCalibrations.find((it) => it.id === id);
  if (!found) throw new Error(`Unknown R2* calibration ${id}`);
  return found;
}

export const r2StarCalibrationIds: readonly R2StarCalibrationId[] = r2StarCalibrations.map((it) => it.id);
