import type { Days, Years } from './quantity';

/**
 * Days in a mean Gregorian year (365.2425), used when a rate per year is turned
 * into a rate per day. references.md's daily-loading formula divides by 365;
 * the difference (0.07 %) is far inside every clinical tolerance, and the
 * Gregorian mean keeps multi-year sums consistent with calendar dates.
 * Source: definition of the Gregorian calendar (common practice to use 365.25 or 365).
 */
export const daysPerYear = 365.2425;

/** Mean days per calendar month (daysPerYear / 12). */
export const daysPerMonth = daysPerYear / 12;

/** @example daysFromYears(years(1)) === 365.2425 */
export const daysFromYears = (durationYears: Years): Days => (durationYears * daysPerYear) as Days;
/** @example yearsFromDays(days(365.2425)) === 1 */
export const yearsFromDays = (durationDays: Days): Years => (durationDays / daysPerYear) as Years;
