import { UTCDate } from '@date-fns/utc';
import { differenceInCalendarDays } from 'date-fns';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { daysBetween, isIsoDate } from '../../../core/dates/isoDate';

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
