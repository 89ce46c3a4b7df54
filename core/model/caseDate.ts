import { isIsoDate, type IsoDate } from '../dates';

/**
 * The years a case file may name. Outside them a date is a typing error (0219
 * for 2019, 3019 for 2019), not history: the oldest patient alive was born
 * after 1900, and a plan beyond 2100 is not a plan. Common practice.
 */
export const earliestCaseDate = '1900-01-01';
export const latestCaseDate = '2100-12-31';

/**
 * Whether a value is a date a case file may hold: a real calendar date
 * 'YYYY-MM-DD' (core/dates) between 1900-01-01 and 2100-12-31.
 *
 * @param value - anything
 * @returns true for such a string
 * @example isCaseDate('2024-02-29') === true; isCaseDate('2023-02-29') === false; isCaseDate('0219-05-01') === false
 */
export function isCaseDate(value: unknown): value is IsoDate {
  return typeof value === 'string' && isIsoDate(value) && value >= earliestCaseDate && value <= latestCaseDate;
}

/** The sentence after the field's name when a date is refused. */
export function describeCaseDateProblem(value: unknown): string {
  const shown = typeof value === 'string' ? JSON.stringify(value) : String(value);
  return `${shown} is not a calendar date; enter it as YYYY-MM-DD between ${earliestCaseDate} and ${latestCaseDate}.`;
}
