import { addMonthsIso, type IsoDate } from '../dates/isoDate';
import { fail, issue, ok, type Result } from '../result';
import type { Case } from './caseFile';
import { describeCaseDateProblem, isCaseDate } from './caseDate';
import { eventDateSpan } from './eventDates';

/**
 * How far after the last dated entry a review may be set: 5 years. A modelling choice
 * of ours: the iron account carries the record forward day by day, and beyond a few
 * years with nothing recorded (no transfusion, result or weight) the carried-forward
 * balances say more about the assumptions than about the patient; projections already
 * reach up to 10 years ahead of the review date on their own.
 */
export const reviewYearsAfterRecord = 5;

/** The review dates a case supports: from its first dated entry to {@link reviewYearsAfterRecord} years after its last. */
export interface ReviewWindow {
  readonly from: IsoDate;
  readonly to: IsoDate;
}

/**
 * The review dates a case supports, or null when it has no dated entry at all.
 *
 * @param theCase - a parsed case; not changed
 * @example reviewWindow(caseWithEntries('2022-01-04', '2026-11-10')) → { from: '2022-01-04', to: '2031-11-10' }
 */
export function reviewWindow(theCase: Case): ReviewWindow | null {
  const span = eventDateSpan(theCase);
  let from = span?.earliest ?? null;
  let last = span?.latest ?? null;
  for (const period of theCase.chelationPeriods) {
    if (period.endDate === null) continue;
    if (from === null || period.endDate < from) from = period.endDate;
    if (last === null || period.endDate > last) last = period.endDate;
  }
  if (from === null || last === null) return null;
  return { from, to: addMonthsIso(last, 12 * reviewYearsAfterRecord) };
}

/**
 * Check a review date against the case's window (see {@link reviewWindow}): a review
 * far before or after the record is refused with the window it supports, instead of
 * carrying iron over decades with nothing recorded.
 *
 * @param theCase - a parsed case
 * @param asOf - the review date 'YYYY-MM-DD'
 * @returns the date, or an issue at path ['asOf'] naming the date and the window
 */
export function checkReviewDate(theCase: Case, asOf: IsoDate): Result<IsoDate> {
  if (!isCaseDate(asOf)) return fail(issue('invalid_date', ['asOf'], `Review date ${describeCaseDateProblem(asOf)}`));
  const window = reviewWindow(theCase);
  if (window === null || (asOf >= window.from && asOf <= window.to)) return ok(asOf);
  const side = asOf < window.from ? 'before the first dated entry of the record' : `more than ${reviewYearsAfterRecord} years after its last dated entry`;
  return fail(
    issue(
      'out_of_range',
      ['asOf'],
      `Review date ${asOf} is ${side}; this case supports review dates ${window.from} to ${window.to} (from its first entry to ${reviewYearsAfterRecord} years after its last). Nothing was computed.`,
    ),
  );
}
