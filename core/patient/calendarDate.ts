import { isIsoDate, toUtcDate } from '../dates/isoDate';
import { fail, issue, ok, type Result } from '../result';

/**
 * Read an ISO calendar date ('YYYY-MM-DD') typed by a user or stored in a case.
 * The date is a calendar day with no time, held in UTC (core/dates) so that
 * day counts are the same on every desktop; no clock is read.
 *
 * @param text - the date text, 'YYYY-MM-DD', a real calendar day (2021-02-30 is refused)
 * @param field - input name for the issue path, e.g. 'birthDate'
 * @param label - the field in the trade's words for the message, e.g. 'birth date'
 * @returns the day as a UTC date, or an 'invalid_date' issue naming field and value
 * @example parseCalendarDate('2020-02-29', 'birthDate', 'birth date') → ok(29 Feb 2020)
 */
export function parseCalendarDate(text: string, field: string, label: string): Result<Date> {
  if (!isIsoDate(text)) {
    const name = label.length > 0 ? label[0]!.toUpperCase() + label.slice(1) : label;
    return fail(issue('invalid_date', [field], `${name} "${text}" is not a calendar date written YYYY-MM-DD (for example 2011-06-15).`));
  }
  return ok(toUtcDate(text));
}
