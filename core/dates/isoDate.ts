import { UTCDate } from '@date-fns/utc';
import { addDays, addMonths, endOfMonth, format, startOfMonth } from 'date-fns';

/**
 * Calendar dates as ISO strings 'YYYY-MM-DD'. Arithmetic runs in UTC
 * (date-fns with @date-fns/utc's UTCDate) so a review gives the same months
 * and day counts on every desktop, whatever its time zone.
 */
export type IsoDate = string;

const isoPattern = /^(\d{4})-(\d{2})-(\d{2})$/;

/**
 * True for a real calendar date written 'YYYY-MM-DD' (2026-02-30 is false).
 * @example isIsoDate('2024-02-29') === true; isIsoDate('2025-02-29') === false
 */
export function isIsoDate(text: string): boolean {
  const match = isoPattern.exec(text);
  if (!match) return false;
  const [year, month, day] = [Number(match[1]), Number(match[2]), Number(match[3])];
  // Years 0000–0099 stay invalid, as they were when this read them through Date (which maps them to 19xx).
  if (year < 100 || month < 1 || month > 12 || day < 1) return false;
  return day <= daysInMonth(year, month);
}

/** Days in a month of the Gregorian calendar (leap years: divisible by 4, except centuries not divisible by 400). */
function daysInMonth(year: number, month: number): number {
  if (month === 2) return (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0 ? 29 : 28;
  return month === 4 || month === 6 || month === 9 || month === 11 ? 30 : 31;
}

/** A UTC date from 'YYYY-MM-DD'; throws on an invalid date (validate at the edge first). */
export function toUtcDate(iso: IsoDate): UTCDate {
  const match = isoPattern.exec(iso);
  if (!match || !isIsoDate(iso)) throw new Error(`Not an ISO calendar date: ${iso}`);
  return new UTCDate(Number(match[1]), Number(match[2]) - 1, Number(match[3]));
}

/** 'YYYY-MM-DD' of a date, read in UTC. */
export function toIsoDate(date: Date): IsoDate {
  return format(new UTCDate(date), 'yyyy-MM-dd');
}

/** Whole calendar days from `earlierDate` to `laterDate` (negative if reversed). @example daysBetween('2026-01-01','2026-03-01') === 59 */
export function daysBetween(earlierDate: IsoDate, laterDate: IsoDate): number {
  // Whole UTC days, so the difference of day numbers is the calendar-day difference
  // (what date-fns' differenceInCalendarDays gives in UTC), without building Date objects
  // in the ledger's hot loops.
  if (!isIsoDate(earlierDate)) throw new Error(`Not an ISO calendar date: ${earlierDate}`);
  if (!isIsoDate(laterDate)) throw new Error(`Not an ISO calendar date: ${laterDate}`);
  return epochDayFromIso(laterDate) - epochDayFromIso(earlierDate);
}

/** @example addDaysIso('2026-02-27', 3) === '2026-03-02' */
export function addDaysIso(date: IsoDate, count: number): IsoDate {
  return toIsoDate(addDays(toUtcDate(date), count));
}

/** Adds calendar months, clamping to the month's end. @example addMonthsIso('2026-01-31', 1) === '2026-02-28' */
export function addMonthsIso(date: IsoDate, count: number): IsoDate {
  return toIsoDate(addMonths(toUtcDate(date), count));
}

/** @example monthStartIso('2026-11-20') === '2026-11-01' */
export function monthStartIso(date: IsoDate): IsoDate {
  return toIsoDate(startOfMonth(toUtcDate(date)));
}

/** @example monthEndIso('2024-02-10') === '2024-02-29' */
export function monthEndIso(date: IsoDate): IsoDate {
  return toIsoDate(endOfMonth(toUtcDate(date)));
}

/** 'YYYY-MM' of a date. @example monthKey('2026-11-20') === '2026-11' */
export function monthKey(date: IsoDate): string {
  return date.slice(0, 7);
}

/** The earlier of two ISO dates. */
export function earlierDate(first: IsoDate, second: IsoDate): IsoDate {
  return first <= second ? first : second;
}

/** The later of two ISO dates. */
export function laterDate(first: IsoDate, second: IsoDate): IsoDate {
  return first >= second ? first : second;
}

const millisecondsInDay = 86_400_000;

/**
 * Days since 1970-01-01 (UTC) for an ISO date: a fast integer form for loops
 * over thousands of days. Validate the date at the edge first.
 * @example epochDayFromIso('1970-01-02') === 1
 */
export function epochDayFromIso(date: IsoDate): number {
  return Date.UTC(Number(date.slice(0, 4)), Number(date.slice(5, 7)) - 1, Number(date.slice(8, 10))) / millisecondsInDay;
}

/** The ISO date of a day number from {@link epochDayFromIso}. @example isoFromEpochDay(1) === '1970-01-02' */
export function isoFromEpochDay(day: number): IsoDate {
  return new Date(day * millisecondsInDay).toISOString().slice(0, 10);
}
