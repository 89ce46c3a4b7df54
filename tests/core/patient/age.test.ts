import { UTCDate } from '@date-fns/utc';
import { addDays, addYears, differenceInCalendarDays, differenceInYears } from 'date-fns';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ageInDecimalYears, ageInWholeYears } from '../../../core/patient/age';
import { readCalendarDay } from '../../../core/patient/calendarDate';

/**
 * Julian Day Number of a Gregorian date by the integer algorithm of Fliegel and
 * Van Flandern (Commun ACM 1968;11:657), an outside reference for day counts
 * that shares nothing with date-fns. Divisions truncate toward zero, as in the
 * published FORTRAN.
 */
function julianDayNumber(year: number, month: number, day: number): number {
  const div = (a: number, b: number): number => Math.trunc(a / b);
  const m14 = div(month - 14, 12);
  return (
    div(1461 * (year + 4800 + m14), 4) +
    div(367 * (month - 2 - 12 * m14), 12) -
    div(3 * div(year + 4900 + m14, 100), 4) +
    day -
    32075
  );
}

const isLeapYear = (year: number): boolean => (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0;

/** Birthday in a given year, with a 29 February birth on 1 March of a common year (common practice). */
function birthdayIn(year: number, month: number, day: number): [number, number, number] {
  return month === 2 && day === 29 && !isLeapYear(year) ? [year, 3, 1] : [year, month, day];
}

/** Independent age: count birthdays passed by comparing calendar fields, then share of the year of age by JDN. */
function referenceAge(birth: [number, number, number], review: [number, number, number]): { whole: number; decimal: number } {
  const [by, bm, bd] = birth;
  const [ry] = review;
  const thisYearsBirthday = birthdayIn(ry, bm, bd);
  const reviewJdn = julianDayNumber(...review);
  const whole = ry - by - (reviewJdn < julianDayNumber(...thisYearsBirthday) ? 1 : 0);
  const last = julianDayNumber(...birthdayIn(by + whole, bm, bd));
  const next = julianDayNumber(...birthdayIn(by + whole + 1, bm, bd));
  return { whole, decimal: whole + (reviewJdn - last) / (next - last) };
}

const iso = ([year, month, day]: [number, number, number]): string =>
  `${String(year).padStart(4, '0')}-${String(month).padStart(2, '0')}-${String(day).padStart(2, '0')}`;

function value(result: ReturnType<typeof ageInWholeYears>): number {
  if (!result.ok) throw new Error(result.issues.map((it) => it.message).join('; '));
  return result.value;
}

describe('the Julian Day Number reference itself', () => {
  it('gives JD 2451545 for 2000-01-01 (the J2000 epoch, noon of that day) and 2440588 for 1970-01-01', () => {
    expect(julianDayNumber(2000, 1, 1)).toBe(2451545);
    expect(julianDayNumber(1970, 1, 1)).toBe(2440588);
  });
});

describe('age in whole years', () => {
  it('turns 15 on the birthday itself, not the day before (doc example)', () => {
    expect(value(ageInWholeYears('2011-06-15', '2026-06-14'))).toBe(14);
    expect(value(ageInWholeYears('2011-06-15', '2026-06-15'))).toBe(15);
  });

  it('is 0 on the day of birth', () => {
    expect(value(ageInWholeYears('2026-03-01', '2026-03-01'))).toBe(0);
  });

  it('counts a 29 February birth a year older on 1 March of a common year (common practice; date-fns rule)', () => {
    expect(value(ageInWholeYears('2000-02-29', '2001-02-28'))).toBe(0);
    expect(value(ageInWholeYears('2000-02-29', '2001-03-01'))).toBe(1);
    expect(value(ageInWholeYears('2000-02-29', '2004-02-28'))).toBe(3);
    expect(value(ageInWholeYears('2000-02-29', '2004-02-29'))).toBe(4);
    // 2100 is not a leap year (Gregorian rule): birthday on 1 March 2100.
    expect(value(ageInWholeYears('2096-02-29', '2100-02-28'))).toBe(3);
    expect(value(ageInWholeYears('2096-02-29', '2100-03-01'))).toBe(4);
  });
});

describe('age in decimal years', () => {
  it('gives 7 + 182/365 for 2019-01-01 → 2026-07-02 (doc example; 182 days by JDN)', () => {
    expect(julianDayNumber(2026, 7, 2) - julianDayNumber(2026, 1, 1)).toBe(182);
    expect(value(ageInDecimalYears('2019-01-01', '2026-07-02'))).toBeCloseTo(7 + 182 / 365, 12);
  });

  it('is a whole number on each birthday', () => {
    expect(value(ageInDecimalYears('2011-06-15', '2026-06-15'))).toBe(15);
    expect(value(ageInDecimalYears('2000-02-29', '2001-03-01'))).toBe(1);
  });

  it('gives a 29 February birth 365/366 of a year on 28 February of the next year', () => {
    // Last birthday 2000-02-29, next 2001-03-01: 366 days apart by JDN, 365 of them lived.
    expect(julianDayNumber(2001, 3, 1) - julianDayNumber(2000, 2, 29)).toBe(366);
    expect(value(ageInDecimalYears('2000-02-29', '2001-02-28'))).toBeCloseTo(365 / 366, 12);
  });

  it('agrees with the independent calendar-field and JDN reference on random dates (fast-check)', () => {
    // Whole years exactly; decimal years to 1e-12 (one division of small integers).
    const date = fc
      .record({ year: fc.integer({ min: 1900, max: 2100 }), month: fc.integer({ min: 1, max: 12 }), day: fc.integer({ min: 1, max: 31 }) })
      .filter(({ year, month, day }) => day <= [31, isLeapYear(year) ? 29 : 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31][month - 1]!)
      .map(({ year, month, day }): [number, number, number] => [year, month, day]);
    fc.assert(
      fc.property(date, date, (first, second) => {
        const [birth, review] = julianDayNumber(...first) <= julianDayNumber(...second) ? [first, second] : [second, first];
        if (review[0] - birth[0] > 119) return;
        const expected = referenceAge(birth, review);
        expect(value(ageInWholeYears(iso(birth), iso(review)))).toBe(expected.whole);
        const decimal = value(ageInDecimalYears(iso(birth), iso(review)));
        expect(Math.abs(decimal - expected.decimal)).toBeLessThan(1e-12);
        expect(Math.floor(decimal)).toBe(expected.whole);
      }),
      { numRuns: 2000, seed: 20260417 },
    );
  });

  it('agrees with the reference for 29 February births over 120 years (fast-check)', () => {
    const leapYear = fc.integer({ min: 475, max: 525 }).map((quarter) => quarter * 4).filter(isLeapYear);
    fc.assert(
      fc.property(leapYear, fc.integer({ min: 0, max: 120 * 366 }), (birthYear, daysLater) => {
        const birth: [number, number, number] = [birthYear, 2, 29];
        const reviewDate = new Date(Date.UTC(birthYear, 1, 29 + daysLater));
        const review: [number, number, number] = [reviewDate.getUTCFullYear(), reviewDate.getUTCMonth() + 1, reviewDate.getUTCDate()];
        const expected = referenceAge(birth, review);
        if (expected.whole > 120) return;
        expect(value(ageInWholeYears(iso(birth), iso(review)))).toBe(expected.whole);
        expect(Math.abs(value(ageInDecimalYears(iso(birth), iso(review))) - expected.decimal)).toBeLessThan(1e-12);
      }),
      { numRuns: 1000, seed: 29022000 },
    );
  });
});

/**
 * Age the way date-fns computes it over @date-fns/utc's UTCDate (differenceInYears,
 * addYears clamping 29 February to the 28th, then one day on; differenceInCalendarDays):
 * a general reference library, and the way this module computed it before it was
 * written out as day numbers. The results must be the same numbers, bit for bit.
 */
function dateFnsAge(birthIso: string, reviewIso: string): { whole: number; decimal: number } {
  const utc = (text: string) => new UTCDate(Number(text.slice(0, 4)), Number(text.slice(5, 7)) - 1, Number(text.slice(8, 10)));
  const birth = utc(birthIso);
  const review = utc(reviewIso);
  const whole = differenceInYears(review, birth);
  const birthday = (age: number) => {
    const anniversary = addYears(birth, age);
    return birth.getMonth() === 1 && birth.getDate() === 29 && anniversary.getDate() === 28 ? addDays(anniversary, 1) : anniversary;
  };
  const last = birthday(whole);
  return { whole, decimal: whole + differenceInCalendarDays(review, last) / differenceInCalendarDays(birthday(whole + 1), last) };
}

describe('age against date-fns (general reference library)', () => {
  const day = fc.integer({ min: Date.UTC(1900, 0, 1) / 86_400_000, max: Date.UTC(2100, 11, 31) / 86_400_000 });
  const isoOfDay = (epochDay: number) => new Date(epochDay * 86_400_000).toISOString().slice(0, 10);

  it('gives exactly the same whole and decimal years on random pairs of days 1900–2100 (fast-check)', () => {
    fc.assert(
      fc.property(day, fc.integer({ min: 0, max: 120 * 365 }), (birthDay, daysLater) => {
        const birth = isoOfDay(birthDay);
        const review = isoOfDay(birthDay + daysLater);
        const expected = dateFnsAge(birth, review);
        if (expected.whole > 120) return;
        expect(value(ageInWholeYears(birth, review))).toBe(expected.whole);
        expect(value(ageInDecimalYears(birth, review))).toBe(expected.decimal);
      }),
      { numRuns: 3000, seed: 20261202 },
    );
  });

  it('gives exactly the same on and around every leap day and year end of 1988–2104, for births on those days', () => {
    const births: string[] = [];
    for (let year = 1988; year <= 2104; year += 4) births.push(`${year}-02-28`, `${year}-02-29`, `${year}-03-01`, `${year}-12-31`, `${year + 1}-01-01`);
    const valid = births.filter((text) => readCalendarDay(text, 'birthDate', 'birth date').ok);
    // 2100 is not a leap year (Gregorian rule): its 29 February is no date and is left out; 2000 is one.
    expect(valid).not.toContain('2100-02-29');
    expect(valid).toContain('2000-02-29');
    let checked = 0;
    for (const birth of valid) {
      for (const review of valid) {
        if (review < birth) continue;
        const expected = dateFnsAge(birth, review);
        if (expected.whole > 120) continue;
        expect(value(ageInWholeYears(birth, review)), `${birth} → ${review}`).toBe(expected.whole);
        expect(value(ageInDecimalYears(birth, review)), `${birth} → ${review}`).toBe(expected.decimal);
        checked += 1;
      }
    }
    expect(checked).toBeGreaterThan(5_000);
  });
});

describe('date refusals', () => {
  it('refuses a date that is not on the calendar, naming the field and the value', () => {
    expect(ageInWholeYears('2021-02-30', '2026-01-01')).toEqual({
      ok: false,
      issues: [
        {
          code: 'invalid_date',
          path: ['birthDate'],
          message: 'Birth date "2021-02-30" is not a calendar date written YYYY-MM-DD (for example 2011-06-15).',
          severity: 'error',
        },
      ],
    });
  });

  it('refuses other spellings of a date: day first, no zero padding, a time part', () => {
    for (const text of ['15/06/2011', '2011-6-15', '2011-06-15T00:00', '', '2021-13-01']) {
      const result = readCalendarDay(text, 'reviewDate', 'review date');
      expect(result.ok, text).toBe(false);
      if (result.ok) continue;
      expect(result.issues[0]).toMatchObject({ code: 'invalid_date', path: ['reviewDate'] });
    }
  });

  it('reports both dates when both are bad', () => {
    const result = ageInDecimalYears('2011-02-29', 'yesterday');
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.issues.map((it) => it.path[0])).toEqual(['birthDate', 'reviewDate']);
  });

  it('refuses a review date before the birth date', () => {
    const result = ageInWholeYears('2011-06-15', '2010-01-01');
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.issues[0]).toEqual({
      code: 'inconsistent',
      path: ['reviewDate'],
      message: 'Review date 2010-01-01 is before the birth date 2011-06-15; the review date must be on or after the birth date.',
      severity: 'error',
    });
  });

  it('refuses an age above 120 years, naming the value and the range', () => {
    const result = ageInWholeYears('1890-05-01', '2026-01-01');
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.issues[0]).toMatchObject({
      code: 'out_of_range',
      path: ['birthDate'],
      message: 'Birth date 1890-05-01 gives an age of 135 years on 2026-01-01, outside the plausible range 0–120 years.',
    });
  });
});
