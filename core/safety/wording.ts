/**
 * Small helpers that keep the findings' sentences in one voice: numbers
 * without binary noise, units as a reader writes them, drug names as generic
 * names with a capital at the start of a sentence.
 */

// Numbers and units come from the one formatter and the one unit table, as on the sheet and the screens:
// shown(37.04, 0) === '37' (core/numbers/formatNumber.ts formatTrimmed); readableUnit('10*9/L') === '×10⁹/L'
// (core/units/displayUnit.ts). The short names keep the rules' sentences readable.
export { formatTrimmed as shown } from '../numbers/formatNumber';
export { displayUnit as readableUnit } from '../units/displayUnit';

/**
 * A generic drug name with a capital first letter, to open a sentence.
 *
 * @example capitalised('deferasirox') === 'Deferasirox'
 */
export function capitalised(text: string): string {
  return text.length === 0 ? text : text[0]!.toUpperCase() + text.slice(1);
}

/** The closing words every review finding carries. */
export const forPrescriberReview = 'for prescriber review';
