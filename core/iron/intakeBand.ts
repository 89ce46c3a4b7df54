import type { MgPerKgPerDay } from '../units/quantity';
import type { Band } from './band';

export type IntakeBandId = 'low' | 'intermediate' | 'high';

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
  if (intake < 0.3) return { id: 'low', label: 'low intake (below 0.3 mg/kg/day)', sourceId: 'brittenham-2011' };
  if (intake <= 0.5) return { id: 'intermediate', label: 'intermediate intake (0.3–0.5 mg/kg/day)', sourceId: 'brittenham-2011' };
  return { id: 'high', label: 'high intake (above 0.5 mg/kg/day)', sourceId: 'brittenham-2011' };
}
