import { describe, expect, it } from 'vitest';
import { differenceInCalendarDays } from 'date-fns';
import { ageOnDate } from '../../../core/patient/ageOnDate';

describe('ageOnDate', () => {
  it('moves an age stated on a date by the days between at the mean Gregorian year (365.2425 days, the calendar’s definition)', () => {
    // 2026-01-01 to 2028-01-01 is 730 days (date-fns counts them independently): 730 / 365.2425 years.
    const days = differenceInCalendarDays(new Date(Date.UTC(2028, 0, 1)), new Date(Date.UTC(2026, 0, 1)));
    expect(days).toBe(730);
    expect(ageOnDate({ kind: 'years-on-date', years: 15, onDate: '2026-01-01' }, '2028-01-01')).toBeCloseTo(15 + 730 / 365.2425, 12);
    expect(ageOnDate({ kind: 'years-on-date', years: 15, onDate: '2026-01-01' }, '2026-01-01')).toBe(15);
  });
  it('reads a birth date by calendar years (whole years on the birthday)', () => {
    expect(ageOnDate({ kind: 'birth-date', birthDate: '2011-03-15' }, '2026-03-15')).toBe(15);
    expect(ageOnDate({ kind: 'birth-date', birthDate: '2027-03-15' }, '2026-03-15')).toBeNull();
  });
});
