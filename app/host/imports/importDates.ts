import { isIsoDate } from '../../../core/dates/isoDate';

/** How a file writes day and month when it does not use ISO dates. */
export type DateOrder = 'day-first' | 'month-first';

export type ReadDate =
  | { readonly ok: true; readonly date: string }
  | { readonly ok: false; readonly ambiguous: boolean; readonly reason: string };

const isoLike = /^(\d{4})-(\d{2})-(\d{2})(?:[T ].*)?$/;
const separated = /^(\d{1,2})[/.-](\d{1,2})[/.-](\d{4})$/;

/**
 * One date as written in an import: ISO 8601 (`2026-03-04`, optionally with a
 * time, of which only the calendar date is kept), or day and month with `/`,
 * `.` or `-` and a four-digit year. A date whose day and month could be
 * swapped (both 12 or less) is ambiguous without an order and is never guessed.
 *
 * @param text - the cell as written
 * @param order - the file's order for non-ISO dates, when known
 * @example readImportDate('03/04/2026', undefined) → ambiguous; readImportDate('03/04/2026', 'day-first') → '2026-04-03'
 */
export function readImportDate(text: string, order: DateOrder | undefined): ReadDate {
  const trimmed = text.trim();
  const iso = isoLike.exec(trimmed);
  if (iso) {
    const date = `${iso[1]}-${iso[2]}-${iso[3]}`;
    return isIsoDate(date) ? { ok: true, date } : { ok: false, ambiguous: false, reason: `"${trimmed}" is not a calendar date` };
  }
  const parts = separated.exec(trimmed);
  if (!parts) return { ok: false, ambiguous: false, reason: `"${trimmed.slice(0, 40)}" is not a date (expected YYYY-MM-DD, DD/MM/YYYY or MM/DD/YYYY)` };
  const first = Number(parts[1]);
  const second = Number(parts[2]);
  const year = parts[3]!;
  const resolved: DateOrder | undefined = order ?? (first > 12 && second <= 12 ? 'day-first' : second > 12 && first <= 12 ? 'month-first' : undefined);
  if (resolved === undefined) {
    return { ok: false, ambiguous: true, reason: `"${trimmed}" could be day-first or month-first; choose the date order (day first or month first)` };
  }
  const [day, month] = resolved === 'day-first' ? [first, second] : [second, first];
  const date = `${year}-${String(month).padStart(2, '0')}-${String(day).padStart(2, '0')}`;
  return isIsoDate(date) ? { ok: true, date } : { ok: false, ambiguous: false, reason: `"${trimmed}" is not a calendar date read ${resolved}` };
}

/**
 * The order a file's dates imply: day-first if some date has a first part above
 * 12, month-first if some has a second part above 12; both is a conflict.
 *
 * @returns the order, 'conflict', or undefined when every date is ISO or ambiguous
 */
export function impliedDateOrder(texts: readonly string[]): DateOrder | 'conflict' | undefined {
  let dayFirst = false;
  let monthFirst = false;
  for (const text of texts) {
    const parts = separated.exec(text.trim());
    if (!parts) continue;
    if (Number(parts[1]) > 12) dayFirst = true;
    if (Number(parts[2]) > 12) monthFirst = true;
  }
  return dayFirst && monthFirst ? 'conflict' : dayFirst ? 'day-first' : monthFirst ? 'month-first' : undefined;
}
