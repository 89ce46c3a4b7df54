import { epochDayFromIso, isIsoDate } from '../dates/isoDate';
import { fail, issue, ok, type Result } from '../result';

/** A calendar day read from 'YYYY-MM-DD': its fields and its day number (whole days since 1970-01-01, UTC). */
export interface CalendarDay {
  readonly year: number;
  /** 1–12 */
  readonly month: number;
  readonly day: number;
  readonly epochDay: number;
}

/**
 * Read an ISO calendar date ('YYYY-MM-DD') typed by a user or stored in a case.
 * The date is a calendar day with no time, counted in whole UTC days (core/dates)
 * so that day counts are the same on every desktop; no clock is read, and no
 * Date object is built (ages are computed for every weight of every case opened).
 *
 * @param text - the date text, 'YYYY-MM-DD', a real calendar day (2021-02-30 is refused)
 * @param field - input name for the issue path, e.g. 'birthDate'
 * @param label - the field in the trade's words for the message, e.g. 'birth date'
 * @returns the day's fields and day number, or an 'invalid_date' issue naming field and value
 * @example readCalendarDay('2020-02-29', 'birthDate', 'birth date') → ok({ year: 2020, month: 2, day: 29, epochDay: 18321 })
 */
export function readCalendarDay(text: string, field: string, label: string): Result<CalendarDay> {
  if (!isIsoDate(text)) {
    const name = label.length > 0 ? label[0]!.toUpperCase() + label.slice(1) : label;
    return fail(issue('invalid_date', [field], `${name} "${text}" is not a calendar date written YYYY-MM-DD (for example 2011-06-15).`));
  }
  return ok({ year: Number(text.slice(0, 4)), month: Number(text.slice(5, 7)), day: Number(text.slice(8, 10)), epochDay: epochDayFromIso(text) });
}
