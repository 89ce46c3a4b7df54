import { addDays, addYears, differenceInCalendarDays, differenceInYears } from 'date-fns';
import { fail, issue, ok, type Result } from '../result';
import type { Years } from '../units/quantity';
import { oldestAgeYears } from './ageRanges';
import { parseCalendarDate } from './calendarDate';

interface BirthAndReview {
  readonly birth: Date;
  readonly review: Date;
  readonly wholeYears: number;
}

function readBirthAndReview(birthDate: string, reviewDate: string): Result<BirthAndReview> {
  const birth = parseCalendarDate(birthDate, 'birthDate', 'birth date');
  const review = parseCalendarDate(reviewDate, 'reviewDate', 'review date');
  if (!birth.ok || !review.ok) return fail(...(birth.ok ? [] : birth.issues), ...(review.ok ? [] : review.issues));
  if (review.value < birth.value) {
    return fail(
      issue(
        'inconsistent',
        ['reviewDate'],
        `Review date ${reviewDate} is before the birth date ${birthDate}; the review date must be on or after the birth date.`,
      ),
    );
  }
  // date-fns counts a year complete on the anniversary; a 29 February birth completes it on 1 March of a common year.
  const wholeYears = differenceInYears(review.value, birth.value);
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
 * The birthday on which a person completes a given year of age. A 29 February
 * birth has its birthday on 1 March in a common year ('leap-day-birthday',
 * common practice; the rule date-fns differenceInYears follows), so this stays
 * consistent with {@link ageInWholeYears}.
 */
function birthdayAtAge(birth: Date, ageYears: number): Date {
  const anniversary = addYears(birth, ageYears);
  const bornOnLeapDay = birth.getMonth() === 1 && birth.getDate() === 29;
  // addYears clamps 29 February to 28 February in a common year.
  return bornOnLeapDay && anniversary.getDate() === 28 ? addDays(anniversary, 1) : anniversary;
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
  const daysSinceBirthday = differenceInCalendarDays(review, lastBirthday);
  const daysInYearOfAge = differenceInCalendarDays(nextBirthday, lastBirthday);
  return ok((wholeYears + daysSinceBirthday / daysInYearOfAge) as Years);
}
