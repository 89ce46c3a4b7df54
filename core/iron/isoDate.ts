import { differenceInCalendarDays, isValid, parseISO } from 'date-fns';
import { fail, issue, ok, type Result } from '../result';
import type { Days } from '../units/quantity';

/** A calendar date written 'YYYY-MM-DD' (no time, no zone). */
export type IsoDate = string;

const isoDatePattern = /^\d{4}-\d{2}-\d{2}$/;

/**
 * Read a calendar date 'YYYY-MM-DD'. Refuses other shapes ('2026-1-1',
 * '20260101') and dates that do not exist ('2026-02-30').
 *
 * @param text - the date as typed or stored
 * @param path - where the date sits in the input, for the issue
 * @returns the parsed date (local midnight; only calendar differences are taken from it), or an 'invalid_date' issue
 * @example parseIsoDate('2026-02-28', ['date']) → ok(Date 2026-02-28)
 */
export function parseIsoDate(text: IsoDate, path: readonly (string | number)[]): Result<Date> {
  const parsed = isoDatePattern.test(text) ? parseISO(text) : new Date(Number.NaN);
  if (!isValid(parsed)) {
    const field = path.length > 0 ? `${String(path[path.length - 1])} ` : '';
    return fail(issue('invalid_date', path, `Date ${field}"${text}" is not a calendar date written YYYY-MM-DD (for example 2026-03-14).`));
  }
  return ok(parsed);
}

/**
 * Number of calendar days from one date to another, counting both ends
 * (2026-01-01 to 2026-12-31 is 365 days). Daylight-saving changes do not count.
 *
 * @param firstDate - first day of the window (parsed by {@link parseIsoDate})
 * @param lastDate - last day of the window, not before firstDate
 * @returns days, 1 or more
 * @example inclusiveDays(parseISO('2026-01-01'), parseISO('2026-12-31')) === 365
 */
export function inclusiveDays(firstDate: Date, lastDate: Date): Days {
  return (differenceInCalendarDays(lastDate, firstDate) + 1) as Days;
}
