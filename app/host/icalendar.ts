import { createHash } from 'node:crypto';
import { realpathSync, statSync, writeFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { writeFileAtomic } from './atomicWrite';
import { addDaysIso, type IsoDate } from '../../core/dates';
import type { MonitoringCalendar, MonitoringItem } from '../../core/monitoring';
import { citeShort, findSource } from '../../core/references';
import { fail, issue, ok, type Result } from '../../core/result';

/**
 * An iCalendar (RFC 5545) writer for the monitoring calendar: our own, small,
 * and tested against the RFC's rules and against ical.js as the outside parser.
 *
 * RFC 5545 rules kept here: CRLF line endings (§3.1); content lines folded at
 * 75 octets with CRLF + one space, never inside a UTF-8 character (§3.1);
 * TEXT values escape backslash, semicolon, comma and newline (§3.3.11); DTSTAMP
 * in UTC with a trailing Z (§3.8.7.2, §3.3.5); all-day events as VALUE=DATE
 * with DTEND the next day (§3.6.1); a UID per event (§3.8.4.7) and PRODID and
 * VERSION per calendar (§3.7.3, §3.7.4).
 */

export const icsProductId = '-//chelation-ledger//monitoring calendar//EN';

/** The sentence every event carries (house rule: descriptive, never an instruction). */
export const icsCaution = 'Decision support: for review by the prescriber; follow local protocols.';

const crlf = '\r\n';
const maxLineOctets = 75;

/**
 * Escape a TEXT value (RFC 5545 §3.3.11): backslash, semicolon and comma get a
 * backslash; a line break (CRLF, CR or LF) becomes the two characters \n.
 * @example escapeIcsText('a,b;c\\d\ne') === 'a\\,b\\;c\\\\d\\ne'
 */
export function escapeIcsText(text: string): string {
  return text.replace(/\\/g, '\\\\').replace(/;/g, '\\;').replace(/,/g, '\\,').replace(/\r\n|\r|\n/g, '\\n');
}

/**
 * Fold one content line (RFC 5545 §3.1): no physical line longer than 75
 * octets of UTF-8; continuation lines start with one space, which counts in
 * their 75. A character is never split across lines.
 * @example foldIcsLine('X'.repeat(80)) === 'X'.repeat(75) + '\r\n ' + 'X'.repeat(5)
 */
export function foldIcsLine(line: string): string {
  const pieces: string[] = [];
  let current = '';
  let currentOctets = 0;
  let limit = maxLineOctets;
  for (const character of line) {
    const octets = Buffer.byteLength(character, 'utf8');
    if (currentOctets + octets > limit) {
      pieces.push(current);
      current = '';
      currentOctets = 0;
      limit = maxLineOctets - 1; // the leading space of a continuation line is one octet
    }
    current += character;
    currentOctets += octets;
  }
  pieces.push(current);
  return pieces.join(`${crlf} `);
}

/** 'YYYYMMDD' of an ISO date (RFC 5545 DATE, §3.3.4). @example icsDate('2026-10-29') === '20261029' */
export function icsDate(date: IsoDate): string {
  return date.replace(/-/g, '');
}

/** 'YYYYMMDDTHHMMSSZ' in UTC (RFC 5545 DATE-TIME form 2, §3.3.5). @example icsUtcDateTime(new Date(Date.UTC(2026, 10, 20, 9, 5, 7))) === '20261120T090507Z' */
export function icsUtcDateTime(instant: Date): string {
  return instant.toISOString().replace(/[-:]/g, '').replace(/\.\d{3}Z$/, 'Z');
}

export interface IcsAllDayEvent {
  readonly uid: string;
  readonly date: IsoDate;
  readonly summary: string;
  readonly description: string;
  readonly categories?: readonly string[];
}

/**
 * A timed event (RFC 5545 §3.3.5 form 2): DTSTART in UTC with a trailing Z, so
 * every calendar shows it at the right instant in its own zone; DTEND when a
 * duration is known (an infusion), none otherwise (an instant, §3.6.1).
 */
export interface IcsTimedEvent {
  readonly uid: string;
  readonly startUtc: Date;
  readonly durationMinutes?: number;
  readonly summary: string;
  readonly description: string;
  readonly categories?: readonly string[];
}

export interface IcsCalendar {
  readonly name: string;
  readonly events: readonly (IcsAllDayEvent | IcsTimedEvent)[];
  /** The instant the file is written, passed in by the host (DTSTAMP). */
  readonly dtStamp: Date;
}

/**
 * Write a calendar of all-day and timed events as RFC 5545 text: CRLF line endings,
 * folded lines, escaped TEXT values.
 * @param calendar - name, events (any number), the DTSTAMP instant
 * @returns the .ics text, ending in CRLF
 */
export function writeIcs(calendar: IcsCalendar): string {
  const stamp = icsUtcDateTime(calendar.dtStamp);
  const lines = [
    'BEGIN:VCALENDAR',
    'VERSION:2.0',
    `PRODID:${icsProductId}`,
    'CALSCALE:GREGORIAN',
    'METHOD:PUBLISH',
    `X-WR-CALNAME:${escapeIcsText(calendar.name)}`,
    ...calendar.events.flatMap((event) => [
      'BEGIN:VEVENT',
      `UID:${escapeIcsText(event.uid)}`,
      `DTSTAMP:${stamp}`,
      ...('startUtc' in event
        ? [
            `DTSTART:${icsUtcDateTime(event.startUtc)}`,
            ...(event.durationMinutes !== undefined ? [`DTEND:${icsUtcDateTime(new Date(event.startUtc.getTime() + event.durationMinutes * 60_000))}`] : []),
          ]
        : [`DTSTART;VALUE=DATE:${icsDate(event.date)}`, `DTEND;VALUE=DATE:${icsDate(addDaysIso(event.date, 1))}`]),
      `SUMMARY:${escapeIcsText(event.summary)}`,
      `DESCRIPTION:${escapeIcsText(event.description)}`,
      ...(event.categories && event.categories.length > 0 ? [`CATEGORIES:${event.categories.map(escapeIcsText).join(',')}`] : []),
      `TRANSP:${'startUtc' in event ? 'OPAQUE' : 'TRANSPARENT'}`,
      'END:VEVENT',
    ]),
    'END:VCALENDAR',
  ];
  return lines.map(foldIcsLine).join(crlf) + crlf;
}

/**
 * A stable UID for one monitoring item: the same case label, item and due
 * date always give the same UID (no clock, no randomness), so re-exporting
 * updates the calendar entry instead of adding a second one. The label is kept
 * readable where it is plain, and a hash keeps labels apart that differ only
 * in other characters.
 * @example monitoringUid('TH-0417', 'creatinine', '2026-10-29') starts with 'creatinine-20261029-th-0417-'
 */
export function monitoringUid(caseLabel: string, itemId: string, dueDate: IsoDate): string {
  const slug = caseLabel.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '') || 'case';
  const hash = createHash('sha256').update(caseLabel, 'utf8').digest('hex').slice(0, 8);
  return `${itemId}-${icsDate(dueDate)}-${slug}-${hash}@chelation-ledger`;
}

function dueText(item: MonitoringItem, asOf: IsoDate): string {
  switch (item.status) {
    case 'overdue':
      return `due ${item.dueDate}, overdue by ${item.daysOverdue} day${item.daysOverdue === 1 ? '' : 's'} on the review date ${asOf}`;
    case 'due-now':
      return `due now (${item.dueDate})`;
    case 'upcoming':
      return `due ${item.dueDate}`;
  }
}

/** The sources of an item: title, then the short citation with its standing. */
export function itemSources(item: MonitoringItem): string {
  return item.sourceIds
    .map((id) => {
      const source = findSource(id);
      return source ? `${source.title} (${citeShort(source)})` : id;
    })
    .join('; ');
}

/** One all-day event per monitoring item, on its due date. */
export function monitoringEvents(calendar: MonitoringCalendar): IcsAllDayEvent[] {
  return calendar.items.map((item) => ({
    uid: monitoringUid(calendar.caseLabel, item.id, item.dueDate),
    date: item.dueDate,
    summary: `${calendar.caseLabel}: ${item.what} ${item.status === 'overdue' ? 'overdue' : 'due'}`,
    description: [
      `${item.what}, ${item.intervalText}: ${dueText(item, calendar.asOf)}.`,
      `Last on record: ${item.lastDate ?? 'none on record'}.`,
      `Why: ${item.why}`,
      `Source: ${itemSources(item)}.`,
      icsCaution,
    ].join('\n'),
    categories: ['chelation monitoring', item.id],
  }));
}

/**
 * The monitoring calendar of one case as an .ics file's text.
 * @param calendar - from core/monitoring
 * @param dtStamp - the instant of writing (the host's clock)
 */
export function monitoringIcs(calendar: MonitoringCalendar, dtStamp: Date): string {
  return writeIcs({ name: `Monitoring ${calendar.caseLabel} (as of ${calendar.asOf})`, events: monitoringEvents(calendar), dtStamp });
}

/** Write an iCalendar file directly (the host's export folder, which picks a free name first). */
export function writeCalendarFile(path: string, text: string, options: { readonly overwrite: boolean }): Result<void> {
  try {
    writeFileSync(path, text, { encoding: 'utf8', flag: options.overwrite ? 'w' : 'wx' });
    return ok(undefined);
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    if (code === 'EEXIST') {
      return fail(issue('invalid_file', ['output'], `${path} already exists; nothing was written. Add --force to replace it.`));
    }
    return fail(issue('invalid_file', ['output'], `Cannot write ${path}: ${(error as Error).message}.`));
  }
}

/** The same file on disk, following links; a path that does not exist yet is compared as written. */
function sameFile(first: string, second: string): boolean {
  const real = (path: string) => {
    try {
      return realpathSync(path);
    } catch {
      return resolve(path);
    }
  };
  return real(first) === real(second);
}

/**
 * Write an iCalendar file the user named with -o, atomically (app/host/atomicWrite.ts:
 * a temporary file in the same folder, flushed, then renamed), so a failed write never
 * leaves a truncated file where the old one was. Refused with a message, nothing
 * written: a folder given as the file, an existing file without --force, and any file
 * the same command reads (`inputs`: the case file), even with --force.
 *
 * @param path - the file to write
 * @param text - the whole calendar
 * @param options - overwrite (--force) and the command's input files
 */
export async function writeCalendarOutput(
  path: string,
  text: string,
  options: { readonly overwrite: boolean; readonly inputs?: readonly string[] },
): Promise<Result<void>> {
  const input = (options.inputs ?? []).find((it) => sameFile(it, path));
  if (input !== undefined) {
    return fail(issue('invalid_file', ['output'], `${path} is the file this command reads (${input}); it is never written over. Choose another file name for the calendar.`));
  }
  let isFolder = false;
  try {
    isFolder = statSync(path).isDirectory();
  } catch {
    // Does not exist yet: the usual case.
  }
  if (isFolder) return fail(issue('invalid_file', ['output'], `${path} is a folder; give a file name for the calendar after -o (for example ${path.replace(/\/$/, '')}/due.ics).`));
  const written = await writeFileAtomic(path, text, { overwrite: options.overwrite });
  if (!written.ok && written.issues[0]?.code === 'already_exists') {
    return fail(issue('invalid_file', ['output'], `${path} already exists; nothing was written. Add --force to replace it.`));
  }
  return written.ok ? written : fail(...written.issues.map((it) => ({ ...it, path: ['output'] })));
}
