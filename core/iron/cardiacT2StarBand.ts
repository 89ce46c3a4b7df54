import type { Milliseconds } from '../units/quantity';
import type { Band } from './band';

export type CardiacT2StarBandId = 'no-significant-iron' | 'mild-to-moderate' | 'severe' | 'very-severe';

/** The band edges, ms at 1.5 T: above 20 no significant iron (Anderson 2001); below 10 severe, below 6 very high risk (Kirk 2009). */
export const cardiacT2StarBandEdgesMs = { ironAtOrBelow: 20, severeBelow: 10, verySevereBelow: 6 } as const;
const edges = cardiacT2StarBandEdgesMs;

/** The bands as a formula's expression states them: '> 20 | 10–20 | 6–10 | < 6'. */
export const cardiacT2StarBandsText = `> ${edges.ironAtOrBelow} | ${edges.severeBelow}–${edges.ironAtOrBelow} | ${edges.verySevereBelow}–${edges.severeBelow} | < ${edges.verySevereBelow}`;

/**
 * Band of a cardiac (myocardial) T2* measured at 1.5 T.
 *
 * > 20 ms no significant myocardial iron; 10–20 ms mild to moderate (both ends
 * included); 6 to below 10 ms severe, high risk of heart failure; below 6 ms
 * very high risk.
 *
 * Source: Anderson et al., Eur Heart J 2001;22:2171 (20 ms); Kirk et al.,
 * Circulation 2009;120:1961 (10 ms and 6 ms). references.md §2. The thresholds
 * were set at 1.5 T; T2* is shorter at 3 T.
 *
 * @param t2Star - cardiac T2*, ms (more than 0)
 * @returns band id, label and source id
 * @example cardiacT2StarBand(msec(8)).id === 'severe'
 */
export function cardiacT2StarBand(t2Star: Milliseconds): Band<CardiacT2StarBandId> {
  if (t2Star > edges.ironAtOrBelow) return { id: 'no-significant-iron', label: `no significant heart iron (above ${edges.ironAtOrBelow} ms)`, sourceId: 'anderson-2001' };
  if (t2Star >= edges.severeBelow) return { id: 'mild-to-moderate', label: `mild to moderate heart iron (${edges.severeBelow}–${edges.ironAtOrBelow} ms)`, sourceId: 'anderson-2001' };
  if (t2Star >= edges.verySevereBelow) {
    return { id: 'severe', label: `severe heart iron, high risk of heart failure (below ${edges.severeBelow} ms)`, sourceId: 'kirk-2009' };
  }
  return { id: 'very-severe', label: `severe heart iron, very high risk of heart failure (below ${edges.verySevereBelow} ms)`, sourceId: 'kirk-2009' };
}
