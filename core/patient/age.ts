import { fail, issue, ok, type Result } from '../result';
import type { Years } from '../units/quantity';
import { oldestAgeYears } from './ageRanges';
import { readCalendarDay, type CalendarDay } from './calendarDate';

interface BirthAndReview {
  readonly birth: CalendarDay;
  readonly review: CalendarDay;
  readonly wholeYears: number;
}

const millisecondsInDay = 86_400_000;

const isLeapYear = (year: number): boolean => (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0;

function readBirthAndReview(birthDate: string, reviewDate: string): Result<BirthAndReview> {
  const birth = readCalendarDay(birthDate, 'birthDate', 'birth date');
  const review = readCalendarDay(reviewDate, 'reviewDate', 'review date');
  if (!birth.ok || !review.ok) return fail(...(birth.ok ? [] : birth.issues), ...(review.ok ? [] : review.issues));
  if (review.value.epochDay < birth.value.epochDay) {
    return fail(
      issue(
        'inconsistent',
        ['reviewDate'],
        `Review date ${reviewDate} is before the birth date ${birthDate}; the review date must be on or after the birth date.`,
      ),
    );
  }
  // A year is complete on the anniversary of month and day (a 29 February birth completes it on
  // 1 March of a common year): the rule of date-fns' differenceInYears, which the tests compare with.
  const { year: birthYear, month: birthMonth, day: birthDay } = birth.value;
  const { year, month, day } = review.value;
  const beforeAnniversary = month < birthMonth || (month === birthMonth && day < birthDay);
  const wholeYears = year - birthYear - (beforeAnniversary ? 1 : 0);
  if (wholeYears > oldestAgeYears) {
    return fail(
      issue(
        'out_of_range',
        ['birthDate'],
        `Birth date ${birthDate} gives an age of ${wholeYears} years on ${reviewDate}, outside the plausible range 0–${oldestAgeYears} years.`,
      ),
    );
  }
  return ok({ birth: birth.value, review: review.value, wholeYears });
}

/**
 * The day number of the birthday on which a person completes a given year of
 * age. A 29 February birth has its birthday on 1 March in a common year
 * ('leap-day-birthday', common practice; the rule date-fns' addYears plus one
 * day gives), so this stays consistent with {@link ageInWholeYears}.
 */
function birthdayAtAge(birth: CalendarDay, ageYears: number): number {
  const year = birth.year + ageYears;
  const bornOnLeapDay = birth.month === 2 && birth.day === 29;
  const [month, day] = bornOnLeapDay && !isLeapYear(year) ? [3, 1] : [birth.month, birth.day];
  return Date.UTC(year, month - 1, day) / millisecondsInDay;
}

/**
 * Age in completed years on a review date (the age a person states).
 *
 * @param birthDate - 'YYYY-MM-DD', at most 120 years before the review date
 * @param reviewDate - 'YYYY-MM-DD', on or after the birth date (the review's as-of date; no clock is read)
 * @returns completed years, a whole number, 0–120; or issues naming the date field
 * @example ageInWholeYears('2011-06-15', '2026-06-14') → ok(14); ('2011-06-15', '2026-06-15') → ok(15)
 */
export function ageInWholeYears(birthDate: string, reviewDate: string): Result<Years> {
  const read = readBirthAndReview(birthDate, reviewDate);
  return read.ok ? ok(read.value.wholeYears as Years) : read;
}

/**
 * Age in decimal years on a review date: completed years plus the share of the
 * current year of age already lived (days since the last birthday ÷ days from
 * the last birthday to the next). The whole part always equals
 * {@link ageInWholeYears}; the fraction follows the calendar, so the same day
 * count is a slightly smaller share of a 366-day year of age.
 *
 * @param birthDate - 'YYYY-MM-DD', at most 120 years before the review date
 * @param reviewDate - 'YYYY-MM-DD', on or after the birth date
 * @returns age, years (decimal), 0–121; or issues naming the date field
 * @example ageInDecimalYears('2019-01-01', '2026-07-02') → ok(7 + 182/365 ≈ 7.4986)
 */
export function ageInDecimalYears(birthDate: string, reviewDate: string): Result<Years> {
  const read = readBirthAndReview(birthDate, reviewDate);
  if (!read.ok) return read;
  const { birth, review, wholeYears } = read.value;
  const lastBirthday = birthdayAtAge(birth, wholeYears);
  const nextBirthday = birthdayAtAge(birth, wholeYears + 1);
  const daysSinceBirthday = review.epochDay - lastBirthday;
  const daysInYearOfAge = nextBirthday - lastBirthday;
  return ok((wholeYears + daysSinceBirthday / daysInYearOfAge) as Years);
}
