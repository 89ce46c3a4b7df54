import type { Milliseconds, PerSecond } from '../units/quantity';

/**
 * R2* from T2*: the rate is the inverse of the time.
 *
 * R2* (s⁻¹) = 1000 ÷ T2* (ms)
 *
 * Source: definition (references.md §2).
 *
 * @param t2Star - T2*, ms (more than 0; liver about 0.5–35, heart about 2–60)
 * @returns R2*, s⁻¹
 * @example r2StarPerSFromT2StarMs(msec(2)) === 500 s⁻¹
 */
export function r2StarPerSFromT2StarMs(t2Star: Milliseconds): PerSecond {
  return (1000 / t2Star) as PerSecond;
}

/**
 * T2* from R2*: the time is the inverse of the rate.
 *
 * T2* (ms) = 1000 ÷ R2* (s⁻¹)
 *
 * Source: definition (references.md §2).
 *
 * @param r2Star - R2*, s⁻¹ (more than 0)
 * @returns T2*, ms
 * @example t2StarMsFromR2StarPerS(perSecond(500)) === 2 ms
 */
export function t2StarMsFromR2StarPerS(r2Star: PerSecond): Milliseconds {
  return (1000 / r2Star) as Milliseconds;
}
