import { isIsoDate } from '../../core/dates/isoDate';
import { parseDecimal } from '../../core/numbers/parseDecimal';
import { monitoringCalendar, type MonitoringCalendar, type MonitoringItem } from '../../core/monitoring';
import { formatIssues, type Result } from '../../core/result';
import { itemSources, monitoringIcs, writeCalendarOutput } from '../host/icalendar';
import { splitOutput, type ParsedArgs } from './args';
import { asOfSource, type CaseIo } from './caseReview';
import { decisionSupportCaution } from './format';
import { exitCodes } from './io';

/** What the calendar command needs beyond reading a case: a clock for DTSTAMP and a file writer. Tests pass fakes. */
export interface CalendarHostIo {
  /** The instant of writing (the host's clock; core never reads it). */
  readonly now: () => Date;
  readonly writeCalendar: (path: string, text: string, options: { readonly overwrite: boolean; readonly inputs?: readonly string[] }) => Promise<Result<void>>;
}

export const calendarUsage = `Usage:
  chelation-ledger calendar <case.json> [--as-of YYYY-MM-DD] [--anc-interval-days N] [-o due.ics] [--force] [--json]
Lists the monitoring due for the active regimens; with -o (or --output) also writes it as an iCalendar file.
An existing file is not replaced unless --force is given.`;

const known = new Set(['--as-of', '--anc-interval-days', '--output']);

function statusText(item: MonitoringItem): string {
  switch (item.status) {
    case 'overdue':
      return `OVERDUE since ${item.dueDate} (${item.daysOverdue} day${item.daysOverdue === 1 ? '' : 's'})`;
    case 'due-now':
      return `due now (${item.dueDate})`;
    case 'upcoming':
      return `due ${item.dueDate}`;
  }
}

/** The calendar as a reader sees it: one block per item, then what does not apply, assumptions and the caution. */
export function formatMonitoringCalendar(calendar: MonitoringCalendar): string {
  const items = calendar.items.map((item) =>
    [
      `- ${item.what} (${item.intervalText}): ${statusText(item)}; last on record: ${item.lastDate ?? 'none on record'}`,
      `    why: ${item.why}`,
      `    source: ${itemSources(item)}`,
    ].join('\n'),
  );
  const skipped = calendar.notApplicable.map((it) => `- ${it.what}: not listed, ${it.reason}`);
  return [
    `Monitoring for ${calendar.caseLabel} as of ${calendar.asOf}`,
    ...(items.length > 0 ? items : ['(no monitoring rule applies on this date)']),
    ...(skipped.length > 0 ? ['Not applicable on this date:', ...skipped] : []),
    'Assumptions:',
    ...calendar.assumptions.map((it) => `- ${it}`),
    decisionSupportCaution,
  ].join('\n');
}


/**
 * `calendar <case.json> [--as-of DATE] [--anc-interval-days N] [-o due.ics] [--force] [--json]`:
 * print the monitoring due, and with -o write it as an iCalendar file.
 */
export async function calendarCommand(args: ParsedArgs, io: CaseIo & Partial<CalendarHostIo>): Promise<number> {
  const problems: string[] = [];
  const { rest, output: shortOutput } = splitOutput(args.positionals, problems);
  const path = rest[0];
  if (path === undefined) {
    io.err(calendarUsage);
    return exitCodes.usage;
  }
  if (rest.length > 1) problems.push(`Unexpected word "${rest[1]}".`);
  for (const flag of Object.keys(args.options)) if (!known.has(flag)) problems.push(`${flag}: not an option of calendar (--as-of, --anc-interval-days, -o/--output, --force, --json).`);
  for (const flag of args.missingValues) problems.push(`${flag}: a value is missing after the flag.`);
  const output = shortOutput ?? args.options['--output'];
  const loaded = io.readCase(path);
  if (!loaded.ok) {
    io.err(`${path}: the case file has errors; no calendar was made.`);
    io.err(formatIssues(loaded.issues));
    return exitCodes.invalidInput;
  }
  const asOf = args.options['--as-of'] ?? loaded.value.review.reviewDate ?? io.today();
  if (!isIsoDate(asOf)) problems.push(`--as-of: "${asOf}" is not a calendar date written YYYY-MM-DD.`);
  const ancRaw = args.options['--anc-interval-days'];
  const ancIntervalDays = ancRaw === undefined ? undefined : parseDecimal(ancRaw);
  if (ancRaw !== undefined && ancIntervalDays === undefined) problems.push(`--anc-interval-days: "${ancRaw}" is not a number; enter whole days 1–90.`);
  if (problems.length > 0) {
    io.err(problems.join('\n'));
    return exitCodes.invalidInput;
  }
  const calendar = monitoringCalendar(loaded.value, asOf, ancIntervalDays === undefined ? {} : { ancIntervalDays });
  if (!calendar.ok) {
    const flagOf: Readonly<Record<string, string>> = { ancIntervalDays: '--anc-interval-days', asOf: asOfSource(args, loaded.value) };
    io.err(formatIssues(calendar.issues.map((it) => (flagOf[String(it.path[0])] !== undefined ? { ...it, path: [flagOf[String(it.path[0])]!] } : it))));
    return exitCodes.invalidInput;
  }
  if (output !== undefined) {
    const now = io.now ?? (() => new Date()); // the host's clock: DTSTAMP only
    const write = io.writeCalendar ?? writeCalendarOutput;
    const written = await write(output, monitoringIcs(calendar.value, now()), { overwrite: args.switches.has('--force'), inputs: [path] });
    if (!written.ok) {
      io.err(formatIssues(written.issues));
      return exitCodes.invalidInput;
    }
  }
  if (args.switches.has('--json')) {
    io.out(JSON.stringify({ ...calendar.value, ...(output !== undefined ? { written: output } : {}), caution: decisionSupportCaution }, null, 2));
  } else {
    io.out(formatMonitoringCalendar(calendar.value));
    if (output !== undefined) io.out(`Wrote ${calendar.value.items.length} event(s) to ${output} (iCalendar).`);
  }
  return exitCodes.ok;
}
