import { UTCDate } from '@date-fns/utc';

/**
 * Calendar dates as ISO strings 'YYYY-MM-DD'. Arithmetic runs on the calendar
 * itself (year, month and day numbers, and whole UTC days) so a review gives
 * the same months and day counts on every desktop, whatever its time zone.
 * The results are those of date-fns over @date-fns/utc's UTCDate (the tests
 * check them against it); the day and month arithmetic is written out here
 * because the ledger calls it thousands of times per review, where building
 * Date objects and formatting them was most of the cost.
 */
export type IsoDate = string;

/** The number written by the ASCII digits text[from..to), or -1 if any is not a digit (what /\d/ accepts). */
function digitsAt(text: string, from: number, to: number): number {
  let value = 0;
  for (let index = from; index < to; index += 1) {
    const digit = text.charCodeAt(index) - 48;
    if (digit < 0 || digit > 9) return -1;
    value = value * 10 + digit;
  }
  return value;
}

const hyphen = 45;

/**
 * True for a real calendar date written 'YYYY-MM-DD' (2026-02-30 is false).
 * @example isIsoDate('2024-02-29') === true; isIsoDate('2025-02-29') === false
 */
export function isIsoDate(text: string): boolean {
  // The shape /^\d{4}-\d{2}-\d{2}$/, read character by character: this runs for every date of every case opened.
  if (typeof text !== 'string' || text.length !== 10 || text.charCodeAt(4) !== hyphen || text.charCodeAt(7) !== hyphen) return false;
  const year = digitsAt(text, 0, 4);
  const month = digitsAt(text, 5, 7);
  const day = digitsAt(text, 8, 10);
  // Years 0000–0099 stay invalid, as they were when this read them through Date (which maps them to 19xx).
  if (year < 100 || month < 1 || month > 12 || day < 1) return false;
  return day <= daysInMonth(year, month);
}

/** Days in a month of the Gregorian calendar (leap years: divisible by 4, except centuries not divisible by 400). */
function daysInMonth(year: number, month: number): number {
  if (month === 2) return (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0 ? 29 : 28;
  return month === 4 || month === 6 || month === 9 || month === 11 ? 30 : 31;
}

/** Year, month (1–12) and day of a valid ISO date; throws on an invalid date (validate at the edge first). */
function partsOf(iso: IsoDate): readonly [year: number, month: number, day: number] {
  if (!isIsoDate(iso)) throw new Error(`Not an ISO calendar date: ${iso}`);
  return [digitsAt(iso, 0, 4), digitsAt(iso, 5, 7), digitsAt(iso, 8, 10)];
}

/** 'YYYY-MM-DD' from year, month (1–12) and day, the year padded to four digits (date-fns' 'yyyy'). */
function isoOf(year: number, month: number, day: number): IsoDate {
  return `${String(year).padStart(4, '0')}-${month < 10 ? '0' : ''}${month}-${day < 10 ? '0' : ''}${day}`;
}

/** A UTC date from 'YYYY-MM-DD'; throws on an invalid date (validate at the edge first). */
export function toUtcDate(iso: IsoDate): UTCDate {
  const [year, month, day] = partsOf(iso);
  return new UTCDate(year, month - 1, day);
}

/** 'YYYY-MM-DD' of a date, read in UTC; throws a RangeError for an invalid Date, as date-fns' format does. */
export function toIsoDate(date: Date): IsoDate {
  if (Number.isNaN(date.getTime())) throw new RangeError('Invalid time value');
  return isoOf(date.getUTCFullYear(), date.getUTCMonth() + 1, date.getUTCDate());
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

/** A count of days or months as date-fns applies it (Date's setters drop the fraction); NaN is refused. */
function wholeCount(count: number, date: IsoDate): number {
  if (Number.isNaN(count)) throw new RangeError(`Cannot add NaN to ${date}`);
  return Math.trunc(count);
}

/** @example addDaysIso('2026-02-27', 3) === '2026-03-02' */
export function addDaysIso(date: IsoDate, count: number): IsoDate {
  const [year, month, day] = partsOf(date);
  return isoFromEpochDay(Date.UTC(year, month - 1, day) / millisecondsInDay + wholeCount(count, date));
}

/** Adds calendar months, clamping to the month's end. @example addMonthsIso('2026-01-31', 1) === '2026-02-28' */
export function addMonthsIso(date: IsoDate, count: number): IsoDate {
  const [year, month, day] = partsOf(date);
  const monthIndex = year * 12 + (month - 1) + wholeCount(count, date);
  const newYear = Math.floor(monthIndex / 12);
  const newMonth = monthIndex - newYear * 12 + 1;
  return isoOf(newYear, newMonth, Math.min(day, daysInMonth(newYear, newMonth)));
}

/** @example monthStartIso('2026-11-20') === '2026-11-01' */
export function monthStartIso(date: IsoDate): IsoDate {
  const [year, month] = partsOf(date);
  return isoOf(year, month, 1);
}

/** @example monthEndIso('2024-02-10') === '2024-02-29' */
export function monthEndIso(date: IsoDate): IsoDate {
  const [year, month] = partsOf(date);
  return isoOf(year, month, daysInMonth(year, month));
}

/** Days from a date to the end of its month, both counted. @example daysLeftInMonth('2024-02-10') === 20 */
export function daysLeftInMonth(date: IsoDate): number {
  const [year, month, day] = partsOf(date);
  return daysInMonth(year, month) - day + 1;
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
  // 'YYYY-MM-DD' with years 0100–9999 by the calendar's arithmetic (H. Hinnant, days_from_civil, 2013),
  // as for isoFromEpochDay; any other text through Date.UTC, which also reads years 0–99 as 19xx.
  const year = date.length === 10 && date.charCodeAt(4) === hyphen && date.charCodeAt(7) === hyphen ? digitsAt(date, 0, 4) : -1;
  const month = year >= 100 ? digitsAt(date, 5, 7) : -1;
  const day = month >= 1 && month <= 12 ? digitsAt(date, 8, 10) : -1;
  if (day >= 1 && day <= 31) {
    const marchYear = month <= 2 ? year - 1 : year;
    const era = Math.floor(marchYear / 400);
    const yearOfEra = marchYear - era * 400;
    const dayOfYear = Math.floor((153 * (month > 2 ? month - 3 : month + 9) + 2) / 5) + day - 1;
    const dayOfEra = yearOfEra * 365 + Math.floor(yearOfEra / 4) - Math.floor(yearOfEra / 100) + dayOfYear;
    return era * 146_097 + dayOfEra - 719_468;
  }
  return Date.UTC(Number(date.slice(0, 4)), Number(date.slice(5, 7)) - 1, Number(date.slice(8, 10))) / millisecondsInDay;
}

/** Day numbers of 0000-01-01 and 9999-12-31, the years toISOString writes with four digits. */
const firstDayOfYear0 = -719_528;
const lastDayOfYear9999 = 2_932_896;

/** The ISO date of a day number from {@link epochDayFromIso}. @example isoFromEpochDay(1) === '1970-01-02' */
export function isoFromEpochDay(day: number): IsoDate {
  // Whole days of years 0000–9999 by the calendar's own arithmetic (H. Hinnant, "chrono-Compatible
  // Low-Level Date Algorithms", civil_from_days, 2013): the ledger names every month's first and last
  // day this way, and a Date per call was a tenth of the iron account's cost. Anything else through Date.
  if (Number.isInteger(day) && day >= firstDayOfYear0 && day <= lastDayOfYear9999) {
    const shifted = day + 719_468; // days from 0000-03-01
    const era = Math.floor(shifted / 146_097);
    const dayOfEra = shifted - era * 146_097;
    const yearOfEra = Math.floor((dayOfEra - Math.floor(dayOfEra / 1460) + Math.floor(dayOfEra / 36_524) - Math.floor(dayOfEra / 146_096)) / 365);
    const dayOfYear = dayOfEra - (365 * yearOfEra + Math.floor(yearOfEra / 4) - Math.floor(yearOfEra / 100));
    const monthFromMarch = Math.floor((5 * dayOfYear + 2) / 153);
    const dayOfMonth = dayOfYear - Math.floor((153 * monthFromMarch + 2) / 5) + 1;
    const month = monthFromMarch < 10 ? monthFromMarch + 3 : monthFromMarch - 9;
    return isoOf(yearOfEra + era * 400 + (month <= 2 ? 1 : 0), month, dayOfMonth);
  }
  return new Date(day * millisecondsInDay).toISOString().slice(0, 10);
}
