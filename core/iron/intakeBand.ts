import type { MgPerKgPerDay } from '../units/quantity';
import type { Band } from './band';

export type IntakeBandId = 'low' | 'intermediate' | 'high';

/** The band edges, mg/kg/day: Brittenham, N Engl J Med 2011;364:146, Table 2 (as printed: < 0.3, 0.3–0.5, > 0.5). */
export const intakeBandEdgesMgPerKgPerDay = { lowBelow: 0.3, highAbove: 0.5 } as const;
const { lowBelow, highAbove } = intakeBandEdgesMgPerKgPerDay;

/** The bands as a formula's expression states them: '< 0.3, 0.3–0.5, > 0.5'. */
export const intakeBandsText = `< ${lowBelow}, ${lowBelow}–${highAbove}, > ${highAbove}`;
/** The same, with bars between the bands as the iron-bands formula lists them: '< 0.3 | 0.3–0.5 | > 0.5'. */
export const intakeBandsBarred = `< ${lowBelow} | ${lowBelow}–${highAbove} | > ${highAbove}`;

/**
 * Band of a transfusional iron intake rate.
 *
 * < 0.3 low; 0.3–0.5 intermediate (both ends included); > 0.5 high (mg/kg/day).
 *
 * Source: Brittenham, Iron-chelating therapy for transfusional iron overload,
 * N Engl J Med 2011;364:146, Table 2 (bands as printed: < 0.3, 0.3–0.5, > 0.5).
 *
 * @param intake - iron intake, mg/kg/day (0 or more)
 * @returns band id, label and source id
 * @example intakeBand(mgPerKgPerDay(0.4)).id === 'intermediate'
 */
export function intakeBand(intake: MgPerKgPerDay): Band<IntakeBandId> {
  if (intake < lowBelow) return { id: 'low', label: `low intake (below ${lowBelow} mg/kg/day)`, sourceId: 'brittenham-2011' };
  if (intake <= highAbove) return { id: 'intermediate', label: `intermediate intake (${lowBelow}–${highAbove} mg/kg/day)`, sourceId: 'brittenham-2011' };
  return { id: 'high', label: `high intake (above ${highAbove} mg/kg/day)`, sourceId: 'brittenham-2011' };
}
