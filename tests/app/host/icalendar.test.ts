import { existsSync, mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import ICAL from 'ical.js';
import { describe, expect, it } from 'vitest';
import {
  escapeIcsText,
  foldIcsLine,
  icsCaution,
  icsUtcDateTime,
  monitoringIcs,
  monitoringUid,
  writeCalendarFile,
  writeIcs,
} from '../../../app/host/icalendar';
import { monitoringCalendar, type MonitoringCalendar } from '../../../core/monitoring';
import { parseCase } from '../../../core/model/parseCase';
import { readDemo } from '../../core/model/caseFixtures';

// The outside reference is ical.js 2.2.1 (npm registry, the Mozilla calendar parser); the RFC 5545
// byte rules (CRLF §3.1, folding at 75 octets §3.1, TEXT escaping §3.3.11) are also checked directly.

const stamp = new Date(Date.UTC(2026, 10, 20, 9, 30, 15));

function demoCalendar(name: 'th-0417' | 'th-0093'): MonitoringCalendar {
  const parsed = parseCase(readDemo(name));
  if (!parsed.ok) throw new Error('demo case invalid');
  const result = monitoringCalendar(parsed.value, '2026-11-20');
  if (!result.ok) throw new Error('calendar failed');
  return result.value;
}

function parsedEvents(text: string) {
  const root = new ICAL.Component(ICAL.parse(text));
  return { root, events: root.getAllSubcomponents('vevent').map((it) => new ICAL.Event(it)) };
}

/** Physical lines of an .ics text (split on CRLF; the final CRLF leaves an empty tail). */
function physicalLines(text: string): string[] {
  const lines = text.split('\r\n');
  expect(lines.at(-1)).toBe('');
  return lines.slice(0, -1);
}

describe('iCalendar export checked by ical.js', () => {
  for (const name of ['th-0417', 'th-0093'] as const) {
    it(`has one all-day event per monitoring item of ${name}, on its due date`, () => {
      const cal = demoCalendar(name);
      const { root, events } = parsedEvents(monitoringIcs(cal, stamp));
      expect(root.getFirstPropertyValue('version')).toBe('2.0');
      expect(root.getFirstPropertyValue('prodid')).toBe('-//chelation-ledger//monitoring calendar//EN');
      expect(events).toHaveLength(cal.items.length);
      cal.items.forEach((item, index) => {
        const event = events[index]!;
        expect(event.startDate.isDate).toBe(true);
        expect(event.startDate.toString()).toBe(item.dueDate);
        // DTEND is the next day: a one-day all-day event (RFC 5545 §3.6.1).
        expect(event.endDate.toString()).toBe(new Date(Date.parse(`${item.dueDate}T00:00:00Z`) + 86_400_000).toISOString().slice(0, 10));
        expect(event.uid).toBe(monitoringUid(cal.caseLabel, item.id, item.dueDate));
        expect(event.description).toContain(icsCaution);
        expect(event.description).toContain('Source: ');
        expect(event.description).toContain(item.lastDate === null ? 'Last on record: none on record.' : `Last on record: ${item.lastDate}.`);
        const dtstamp = event.component.getFirstPropertyValue('dtstamp') as ICAL.Time;
        expect(dtstamp.zone?.tzid).toBe('UTC');
        expect(dtstamp.toJSDate().getTime()).toBe(stamp.getTime());
      });
    });
  }

  it('puts TH-0093 hearing and eye checks on the review date and names the deferoxamine label', () => {
    const { events } = parsedEvents(monitoringIcs(demoCalendar('th-0093'), stamp));
    const hearing = events.find((it) => it.summary === 'TH-0093: hearing (audiometry) due')!;
    expect(hearing.startDate.toString()).toBe('2026-11-20');
    expect(hearing.description).toContain('Deferoxamine mesylate for injection, prescribing information (US)');
    expect(events.find((it) => it.summary === 'TH-0093: eye examination (ophthalmology) due')!.startDate.toString()).toBe('2026-11-20');
  });

  it('round-trips text with commas, semicolons, backslashes, newlines and non-ASCII characters', () => {
    const awkward = 'Ferritin 2,900 µg/L; LIC 11.4 mg/g\\dry\nSecond line, with "quotes": é, ß, 日本語, 🩸\r\nThird line after CRLF';
    const text = writeIcs({ name: 'Test; calendar, one', dtStamp: stamp, events: [{ uid: 'u-1@test', date: '2026-12-01', summary: awkward, description: `${awkward} ${'long '.repeat(40)}` }] });
    const { root, events } = parsedEvents(text);
    // X-WR-CALNAME is a non-standard property: ical.js keeps its value raw, so the TEXT escapes show.
    expect(root.getFirstPropertyValue('x-wr-calname')).toBe('Test\\; calendar\\, one');
    // ical.js returns line breaks as LF; CRLF in the input is one line break.
    const expected = awkward.replace(/\r\n/g, '\n');
    expect(events[0]!.summary).toBe(expected);
    expect(events[0]!.description).toBe(`${expected} ${'long '.repeat(40)}`);
  });

  it('is byte-identical for the same case, date and stamp, with stable UIDs', () => {
    const cal = demoCalendar('th-0417');
    expect(monitoringIcs(cal, stamp)).toBe(monitoringIcs(cal, stamp));
    expect(monitoringUid('TH-0417', 'creatinine', '2026-10-29')).toBe(monitoringUid('TH-0417', 'creatinine', '2026-10-29'));
    expect(monitoringUid('TH-0417', 'creatinine', '2026-10-29')).not.toBe(monitoringUid('TH-0417', 'creatinine', '2026-11-29'));
    expect(monitoringUid('TH-0417', 'creatinine', '2026-10-29')).not.toBe(monitoringUid('TH 0417', 'creatinine', '2026-10-29'));
    expect(monitoringUid('TH-0417', 'creatinine', '2026-10-29')).toMatch(/^creatinine-20261029-th-0417-[0-9a-f]{8}@chelation-ledger$/);
  });
});

describe('RFC 5545 rules on the bytes', () => {
  const text = monitoringIcs(demoCalendar('th-0417'), stamp);

  it('ends every line with CRLF and has no bare CR or LF (§3.1)', () => {
    for (const line of physicalLines(text)) {
      expect(line).not.toMatch(/[\r\n]/);
    }
    expect(text.endsWith('\r\n')).toBe(true);
  });

  it('folds every physical line to at most 75 octets, continuation lines starting with one space (§3.1)', () => {
    const lines = physicalLines(text);
    expect(lines.some((it) => it.startsWith(' '))).toBe(true); // the descriptions are long enough to fold
    for (const line of lines) expect(Buffer.byteLength(line, 'utf8')).toBeLessThanOrEqual(75);
  });

  it('never splits a UTF-8 character when folding', () => {
    // 3-octet and 4-octet characters across many fold positions: each physical line must decode
    // on its own with a fatal decoder, and unfolding (§3.1: remove CRLF + one space) gives the line back.
    for (let offset = 0; offset < 8; offset += 1) {
      const logical = `DESCRIPTION:${'a'.repeat(offset)}${'日本語🩸µ'.repeat(30)}`;
      const folded = foldIcsLine(logical);
      for (const physical of folded.split('\r\n')) {
        const bytes = Buffer.from(physical, 'utf8');
        expect(bytes.length).toBeLessThanOrEqual(75);
        expect(() => new TextDecoder('utf-8', { fatal: true }).decode(bytes)).not.toThrow();
      }
      expect(folded.replace(/\r\n /g, '')).toBe(logical);
    }
  });

  it('fills lines: a fold happens only where the next character would pass 75 octets', () => {
    expect(foldIcsLine('X'.repeat(75))).toBe('X'.repeat(75));
    expect(foldIcsLine('X'.repeat(80))).toBe(`${'X'.repeat(75)}\r\n ${'X'.repeat(5)}`);
    expect(foldIcsLine('X'.repeat(75 + 74 + 1))).toBe(`${'X'.repeat(75)}\r\n ${'X'.repeat(74)}\r\n X`);
  });

  it('escapes backslash, semicolon, comma and line breaks in TEXT (§3.3.11)', () => {
    expect(escapeIcsText('a,b;c\\d\ne\r\nf\rg')).toBe('a\\,b\\;c\\\\d\\ne\\nf\\ng');
    // A colon needs no escape in TEXT.
    expect(escapeIcsText('Why: label')).toBe('Why: label');
  });

  it('writes DTSTAMP in UTC with a Z and all-day dates as VALUE=DATE (§3.3.5, §3.3.4)', () => {
    expect(icsUtcDateTime(stamp)).toBe('20261120T093015Z');
    const unfolded = text.replace(/\r\n /g, '');
    expect(unfolded).toContain('DTSTAMP:20261120T093015Z\r\n');
    expect(unfolded).toContain('DTSTART;VALUE=DATE:20261029\r\nDTEND;VALUE=DATE:20261030\r\n');
    // Nine items for TH-0417 on deferasirox: creatinine, ALT, AST, bilirubin, hearing, eyes, ferritin, liver iron, cardiac T2*.
    expect(unfolded.match(/^BEGIN:VEVENT$/gm)).toHaveLength(9);
  });
});

describe('writing the file', () => {
  it('refuses to replace an existing file unless asked, and says so', () => {
    const dir = mkdtempSync(join(tmpdir(), 'cl-ics-'));
    const path = join(dir, 'due.ics');
    expect(writeCalendarFile(path, 'first', { overwrite: false }).ok).toBe(true);
    const again = writeCalendarFile(path, 'second', { overwrite: false });
    expect(again.ok).toBe(false);
    if (!again.ok) expect(again.issues[0]!.message).toBe(`${path} already exists; nothing was written. Add --force to replace it.`);
    expect(readFileSync(path, 'utf8')).toBe('first');
    expect(writeCalendarFile(path, 'second', { overwrite: true }).ok).toBe(true);
    expect(readFileSync(path, 'utf8')).toBe('second');
  });

  it('reports a folder that does not exist', () => {
    const result = writeCalendarFile('/nonexistent-folder/due.ics', 'x', { overwrite: false });
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.issues[0]!.message).toContain('Cannot write /nonexistent-folder/due.ics');
    expect(existsSync('/nonexistent-folder/due.ics')).toBe(false);
  });
});
