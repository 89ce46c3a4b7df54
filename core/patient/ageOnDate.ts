import { daysBetween, type IsoDate } from '../dates/isoDate';
import { daysPerYear } from '../units/time';
import { ageInDecimalYears } from './age';

/** How a case states age: a birth date, or an age in years on a stated date. */
export type StatedAge =
  | { readonly kind: 'birth-date'; readonly birthDate: string }
  | { readonly kind: 'years-on-date'; readonly years: number; readonly onDate: IsoDate };

/**
 * Age in decimal years on a date, from a birth date (calendar years, see
 * {@link ageInDecimalYears}) or from an age stated on another date moved by
 * the days between at the mean Gregorian year (daysPerYear).
 *
 * @param age - as the case states it
 * @param onDate - 'YYYY-MM-DD'
 * @returns years (decimal), or null when the birth date cannot give an age on that date
 * @example ageOnDate({ kind: 'years-on-date', years: 15, onDate: '2026-01-01' }, '2026-01-01') === 15
 */
export function ageOnDate(age: StatedAge, onDate: IsoDate): number | null {
  if (age.kind === 'birth-date') {
    const years = ageInDecimalYears(age.birthDate, onDate);
    return years.ok ? years.value : null;
  }
  return age.years + daysBetween(age.onDate, onDate) / daysPerYear;
}
