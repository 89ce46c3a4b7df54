import { TZDate, tz } from '@date-fns/tz';
import { addDays, format } from 'date-fns';
import { fail, issue, ok, type Issue, type Result } from '../result';

/**
 * The ward's wall clock: local date-times in a named IANA time zone
 * (Europe/London, America/Chicago). This module is the one owner of
 * @date-fns/tz; the time-zone rules come from the runtime's ICU data, which
 * is the same for every call (no clock is read: core stays pure).
 *
 * How a daylight-saving change is handled (a modelling choice of this
 * project, stated on every plan):
 * - intervals shorter than a day ("every 4 / 8 / 12 hours") are elapsed time:
 *   8 hours between doses stay 8 real hours, so after the change the ward's
 *   clock time of each later dose moves by the size of the change
 *   (22:00 + 8 h across the October change in London is 05:00, not 06:00);
 * - intervals of whole days ("once daily", "every 48 hours", "weekly") keep
 *   the wall-clock time (09:00 stays 09:00), so one interval is 23 or 25 real
 *   hours;
 * - a start time that does not exist on the clock (inside a spring-forward
 *   gap) is refused; one that happens twice (autumn fall-back) is read as the
 *   first occurrence, with a warning.
 */

export interface WallClockInstant {
  /** The instant, milliseconds since 1970-01-01T00:00Z. */
  readonly epochMs: number;
  /** 'YYYY-MM-DD' on the ward's clock. */
  readonly localDate: string;
  /** 'HH:mm' on the ward's clock. */
  readonly localTime: string;
  /** UTC offset on the ward's clock at that instant, e.g. '+01:00'. */
  readonly utcOffset: string;
}

const localPattern = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2})$/;
const minuteMs = 60_000;
const hourMs = 3_600_000;

/**
 * True when the runtime knows the IANA time zone name.
 * @example isTimeZone('Europe/London') === true; isTimeZone('Mars/Olympus') === false
 */
export function isTimeZone(timeZone: string): boolean {
  try {
    new Intl.DateTimeFormat('en-GB', { timeZone }).format(0);
    return true;
  } catch {
    return false;
  }
}

/**
 * An instant as the ward's clock shows it.
 * @param epochMs - the instant
 * @param timeZone - IANA time zone name
 * @example wallClockAt(Date.UTC(2026, 9, 25, 5, 0), 'Europe/London') → { localDate: '2026-10-25', localTime: '05:00', utcOffset: '+00:00' }
 */
export function wallClockAt(epochMs: number, timeZone: string): WallClockInstant {
  const zoned = new TZDate(epochMs, timeZone);
  return {
    epochMs,
    localDate: format(zoned, 'yyyy-MM-dd'),
    localTime: format(zoned, 'HH:mm'),
    utcOffset: format(zoned, 'xxx'),
  };
}

/** Offset of the zone from UTC at an instant, minutes east of Greenwich (+60 for '+01:00'). */
function offsetMinutesAt(epochMs: number, timeZone: string): number {
  return -new TZDate(epochMs, timeZone).getTimezoneOffset();
}

/**
 * Read a local date-time 'YYYY-MM-DDTHH:mm' typed for the ward's clock.
 *
 * @param text - the local date-time as typed (no offset, no seconds)
 * @param timeZone - IANA time zone name of the ward
 * @param field - the input's name, for the issue path ('start')
 * @returns the instant (first occurrence of an ambiguous time, with a warning); or an
 *   'invalid_date' issue naming the value when it is not a date-time, not a real date,
 *   or falls in a daylight-saving gap of that zone
 * @example readWallClock('2026-10-24T22:00', 'Europe/London') → ok(epochMs of 2026-10-24T21:00Z)
 */
export function readWallClock(text: string, timeZone: string, field = 'start'): Result<WallClockInstant> {
  const match = localPattern.exec(text);
  if (!match) {
    return fail(issue('invalid_date', [field], `${field} "${text}" is not a local date and time written YYYY-MM-DDTHH:mm (e.g. 2026-10-24T22:00).`));
  }
  const [year, month, day, hour, minute] = match.slice(1).map(Number) as [number, number, number, number, number];
  const naiveUtcMs = Date.UTC(year, month - 1, day, hour, minute);
  const check = new Date(naiveUtcMs);
  if (check.getUTCMonth() !== month - 1 || check.getUTCDate() !== day || hour > 23 || minute > 59) {
    return fail(issue('invalid_date', [field], `${field} "${text}" is not a real date and time (month 01–12, day within the month, hours 00–23, minutes 00–59).`));
  }
  // Every offset the zone could have around that day; keep the instants that read back as typed.
  const offsets = new Set([-36, -12, 0, 12, 36].map((hours) => offsetMinutesAt(naiveUtcMs + hours * hourMs, timeZone)));
  const candidates = [...offsets]
    .map((offset) => naiveUtcMs - offset * minuteMs)
    .filter((epochMs) => {
      const shown = wallClockAt(epochMs, timeZone);
      return `${shown.localDate}T${shown.localTime}` === text;
    })
    .sort((first, second) => first - second);
  const first = candidates[0];
  if (first === undefined) {
    return fail(
      issue(
        'invalid_date',
        [field],
        `${field} "${text}" does not exist on the clock in ${timeZone}: it falls in the hour skipped when daylight-saving time begins; enter a time after the change.`,
      ),
    );
  }
  const warnings: Issue[] =
    candidates.length > 1
      ? [
          issue(
            'inconsistent',
            [field],
            `${field} "${text}" happens twice in ${timeZone} (clocks go back that night); read as the first occurrence (UTC offset ${wallClockAt(first, timeZone).utcOffset}).`,
            'warning',
          ),
        ]
      : [];
  return ok(wallClockAt(first, timeZone), warnings);
}

/**
 * The instant a whole number of calendar days later at the same wall-clock
 * time (date-fns addDays in the zone): 09:00 stays 09:00 across a change.
 * @example addWallClockDays(epochMs of 2026-10-24T09:00 London, 1, 'Europe/London') is 2026-10-25T09:00 local (25 h later)
 */
export function addWallClockDays(epochMs: number, count: number, timeZone: string): number {
  return addDays(new TZDate(epochMs, timeZone), count, { in: tz(timeZone) }).getTime();
}

/** A change of UTC offset between two instants, found to the minute. */
export interface OffsetChange {
  /** First instant (to the minute) with the new offset. */
  readonly atEpochMs: number;
  readonly localDate: string;
  readonly offsetBefore: string;
  readonly offsetAfter: string;
  /** Minutes the clock moves: +60 spring forward, −60 fall back. */
  readonly shiftMinutes: number;
}

/**
 * Every change of UTC offset (daylight-saving begins or ends) in [fromMs, toMs].
 * @param fromMs - first instant
 * @param toMs - last instant (≥ fromMs)
 * @param timeZone - IANA name
 * @returns the changes in order; empty when the offset is constant
 * @example offsetChangesBetween(2026-10-24T21:00Z, 2026-10-26T00:00Z, 'Europe/London') → one change, +01:00 → +00:00 on 2026-10-25, −60 min
 */
export function offsetChangesBetween(fromMs: number, toMs: number, timeZone: string): OffsetChange[] {
  const changes: OffsetChange[] = [];
  // Offsets change at most a few times a year: step by 6 hours, then bisect to the minute.
  const stepMs = 6 * hourMs;
  let previousMs = fromMs;
  let previousOffset = offsetMinutesAt(fromMs, timeZone);
  for (let probeMs = fromMs + stepMs; previousMs < toMs; probeMs += stepMs) {
    const atMs = Math.min(probeMs, toMs);
    const offset = offsetMinutesAt(atMs, timeZone);
    if (offset !== previousOffset) {
      let low = previousMs;
      let high = atMs;
      while (high - low > minuteMs) {
        const middle = low + Math.floor((high - low) / 2 / minuteMs) * minuteMs || low + minuteMs;
        if (offsetMinutesAt(middle, timeZone) === previousOffset) low = middle;
        else high = middle;
      }
      changes.push({
        atEpochMs: high,
        localDate: wallClockAt(high, timeZone).localDate,
        offsetBefore: wallClockAt(low, timeZone).utcOffset,
        offsetAfter: wallClockAt(high, timeZone).utcOffset,
        shiftMinutes: offset - previousOffset,
      });
      previousOffset = offset;
    }
    previousMs = atMs;
  }
  return changes;
}
