import { UTCDate } from '@date-fns/utc';
import { addDays, addMonths, differenceInCalendarDays, endOfMonth, format, startOfMonth } from 'date-fns';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { addDaysIso, addMonthsIso, daysBetween, daysLeftInMonth, isIsoDate, monthEndIso, monthStartIso, toIsoDate } from '../../../core/dates/isoDate';

// Outside reference: date-fns 4 (differenceInCalendarDays over @date-fns/utc's UTCDate) and the
// JavaScript Date's own calendar, against our integer day arithmetic. Exact agreement is required:
// both count whole days, so there is no tolerance to argue.
const pad = (value: number, width: number) => String(value).padStart(width, '0');
const dateText = fc.tuple(fc.integer({ min: 100, max: 9999 }), fc.integer({ min: 0, max: 13 }), fc.integer({ min: 0, max: 32 })).map(
  ([year, month, day]) => `${pad(year, 4)}-${pad(month, 2)}-${pad(day, 2)}`,
);
const viaDate = (text: string) => {
  const [year, month, day] = text.split('-').map(Number) as [number, number, number];
  const date = new UTCDate(year, month - 1, day);
  return date.getFullYear() === year && date.getMonth() === month - 1 && date.getDate() === day;
};

describe('calendar-day arithmetic', () => {
  it('accepts exactly the dates the JavaScript calendar has (leap years included)', () => {
    fc.assert(fc.property(dateText, (text) => isIsoDate(text) === viaDate(text)), { numRuns: 5000 });
    // Gregorian leap rule (ISO 8601): 2000 and 2024 leap, 1900 and 2100 not.
    expect(['2000-02-29', '2024-02-29', '1900-02-29', '2100-02-29'].map(isIsoDate)).toEqual([true, true, false, false]);
  });

  it('counts the days between two dates as date-fns does in UTC', () => {
    const valid = dateText.filter(viaDate);
    fc.assert(
      fc.property(valid, valid, (earlier, later) => {
        const [ey, em, ed] = earlier.split('-').map(Number) as [number, number, number];
        const [ly, lm, ld] = later.split('-').map(Number) as [number, number, number];
        return daysBetween(earlier, later) === differenceInCalendarDays(new UTCDate(ly, lm - 1, ld), new UTCDate(ey, em - 1, ed));
      }),
      { numRuns: 3000 },
    );
  });

  it('still refuses a date that is not a calendar date', () => {
    expect(() => daysBetween('2025-02-29', '2025-03-01')).toThrow('Not an ISO calendar date: 2025-02-29');
  });
});

describe('day and month arithmetic without Date objects', () => {
  // Outside reference: date-fns 4 (addDays, addMonths, startOfMonth, endOfMonth, format 'yyyy-MM-dd')
  // over @date-fns/utc's UTCDate, which is what core/dates called before it did the arithmetic itself.
  // Exact agreement is required (whole days and calendar months): no tolerance to argue.
  const valid = fc.tuple(fc.integer({ min: 1000, max: 8999 }), fc.integer({ min: 1, max: 12 }), fc.integer({ min: 1, max: 31 }))
    .map(([year, month, day]) => `${pad(year, 4)}-${pad(month, 2)}-${pad(day, 2)}`)
    .filter(viaDate);
  const utc = (text: string) => {
    const [year, month, day] = text.split('-').map(Number) as [number, number, number];
    return new UTCDate(year, month - 1, day);
  };
  const text = (date: Date) => format(new UTCDate(date), 'yyyy-MM-dd');

  it('adds days as date-fns addDays does', () => {
    fc.assert(fc.property(valid, fc.integer({ min: -200_000, max: 200_000 }), (date, count) => addDaysIso(date, count) === text(addDays(utc(date), count))), { numRuns: 3000 });
  });

  it('adds months as date-fns addMonths does, clamping to the month end', () => {
    fc.assert(fc.property(valid, fc.integer({ min: -6000, max: 6000 }), (date, count) => addMonthsIso(date, count) === text(addMonths(utc(date), count))), { numRuns: 3000 });
    // The clamped cases by name: 31 January + 1 month in a common and a leap year, 29 February + 12 months.
    expect([addMonthsIso('2025-01-31', 1), addMonthsIso('2024-01-31', 1), addMonthsIso('2024-02-29', 12), addMonthsIso('2024-03-31', -1)]).toEqual([
      text(addMonths(utc('2025-01-31'), 1)),
      text(addMonths(utc('2024-01-31'), 1)),
      text(addMonths(utc('2024-02-29'), 12)),
      text(addMonths(utc('2024-03-31'), -1)),
    ]);
  });

  it('finds month starts and ends, and writes dates, as date-fns does', () => {
    fc.assert(
      fc.property(valid, (date) => monthStartIso(date) === text(startOfMonth(utc(date))) && monthEndIso(date) === text(endOfMonth(utc(date))) && toIsoDate(utc(date)) === date),
      { numRuns: 3000 },
    );
  });

  it('counts the days left in a month, the date included, as date-fns does', () => {
    fc.assert(fc.property(valid, (date) => daysLeftInMonth(date) === differenceInCalendarDays(endOfMonth(utc(date)), utc(date)) + 1), { numRuns: 3000 });
    expect([daysLeftInMonth('2024-02-10'), daysLeftInMonth('2023-02-28'), daysLeftInMonth('2026-12-01')]).toEqual([20, 1, 31]);
  });

  it('refuses what is not a calendar date, as before', () => {
    expect(() => addMonthsIso('2025-02-29', 1)).toThrow('Not an ISO calendar date: 2025-02-29');
    expect(() => addDaysIso('2025-13-01', 1)).toThrow('Not an ISO calendar date: 2025-13-01');
    expect(() => monthStartIso('2025-1-01')).toThrow('Not an ISO calendar date: 2025-1-01');
    expect(() => toIsoDate(new Date(Number.NaN))).toThrow(RangeError);
    // Non-ASCII digits are not digits of an ISO date (/\d/ without the u flag is [0-9]).
    expect(isIsoDate('２０２４-01-01')).toBe(false);
  });
});
