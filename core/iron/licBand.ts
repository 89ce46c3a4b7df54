import type { MgPerGDry } from '../units/quantity';
import type { Band } from './band';

export type LicBandId = 'normal' | 'above-normal' | 'target-range' | 'raised-risk' | 'high-cardiac-risk';

/**
 * The band edges, mg/g dry, with the sources given on licBand below: upper limit of
 * normal 1.8 and high cardiac risk from 15 (Olivieri & Brittenham 1997); target 3–7
 * (Brittenham 2011, Table 2). Charts shade the bands from these edges.
 */
export const licBandEdgesMgPerGDry = { normalUpTo: 1.8, targetFrom: 3, targetUpTo: 7, highCardiacFrom: 15 } as const;
const edges = licBandEdgesMgPerGDry;

/** The bands as a formula's expression states them: '≤ 1.8 | < 3 | 3–7 | < 15 | ≥ 15'. */
export const licBandsText = `≤ ${edges.normalUpTo} | < ${edges.targetFrom} | ${edges.targetFrom}–${edges.targetUpTo} | < ${edges.highCardiacFrom} | ≥ ${edges.highCardiacFrom}`;

/**
 * Band of a liver iron concentration (LIC).
 *
 * ≤ 1.8 normal; above 1.8 and below 3 above normal but below the usual target;
 * 3–7 usual target range (both ends included); above 7 and below 15 raised
 * risk of complications; ≥ 15 high risk of cardiac disease (mg/g dry).
 *
 * Source: Olivieri & Brittenham, Blood 1997;89:739 (upper limit of normal about
 * 1.8; ≥ 15 high cardiac risk); Brittenham, N Engl J Med 2011;364:146, Table 2
 * (3–7 target, > 7 raised risk). references.md §2.
 *
 * @param lic - liver iron concentration, mg Fe/g dry weight (0 or more)
 * @returns band id, label and source id
 * @example licBand(mgPerGDry(11.4)).id === 'raised-risk'
 */
export function licBand(lic: MgPerGDry): Band<LicBandId> {
  if (lic <= edges.normalUpTo) return { id: 'normal', label: 'normal (up to about 1.8 mg/g dry)', sourceId: 'olivieri-brittenham-1997' };
  if (lic < edges.targetFrom) {
    return { id: 'above-normal', label: 'above normal, below the usual target range (1.8–3 mg/g dry)', sourceId: 'olivieri-brittenham-1997' };
  }
  if (lic <= edges.targetUpTo) return { id: 'target-range', label: 'usual target range (3–7 mg/g dry)', sourceId: 'brittenham-2011' };
  if (lic < edges.highCardiacFrom) return { id: 'raised-risk', label: 'raised risk of complications (above 7 mg/g dry)', sourceId: 'brittenham-2011' };
  return { id: 'high-cardiac-risk', label: 'high risk of cardiac disease (15 mg/g dry or more)', sourceId: 'olivieri-brittenham-1997' };
}
