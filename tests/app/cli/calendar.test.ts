import { existsSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import ICAL from 'ical.js';
import { describe, expect, it } from 'vitest';
import { cli, demoCase as demo, testNow as fixedNow } from './harness';

const tempFile = () => join(mkdtempSync(join(tmpdir(), 'cl-cal-')), 'due.ics');

describe('calendar command', () => {
  it('prints TH-0417 monitoring readably on its review date: creatinine and ALT overdue, hearing and eyes due now (scenarios.md §1)', async () => {
    const { code, out } = await cli('calendar', demo('th-0417'));
    expect(code).toBe(0);
    expect(out).toContain('Monitoring for TH-0417 as of 2026-11-20');
    expect(out).toContain('- serum creatinine (monthly): OVERDUE since 2026-10-29 (22 days); last on record: 2026-09-29');
    expect(out).toContain('- ALT (liver transaminases) (monthly): OVERDUE since 2026-10-29 (22 days); last on record: 2026-09-29');
    expect(out).toContain('- hearing (audiometry) (yearly): due now (2026-11-20); last on record: none on record');
    expect(out).toContain('- absolute neutrophil count (ANC): not listed, no deferiprone running on 2026-11-20');
    expect(out).toContain('for review by the prescriber');
  });

  it('writes TH-0093 as an .ics file that ical.js reads, with hearing and eyes due (scenarios.md §3)', async () => {
    const path = tempFile();
    const { code, out } = await cli('calendar', demo('th-0093'), '-o', path);
    expect(code).toBe(0);
    expect(out).toContain(`Wrote 4 event(s) to ${path} (iCalendar).`);
    const root = new ICAL.Component(ICAL.parse(readFileSync(path, 'utf8')));
    const events = root.getAllSubcomponents('vevent').map((it) => new ICAL.Event(it));
    expect(events.map((it) => `${it.summary} ${it.startDate.toString()}`).sort()).toEqual([
      'TH-0093: eye examination (ophthalmology) due 2026-11-20',
      'TH-0093: hearing (audiometry) due 2026-11-20',
      'TH-0093: liver iron concentration by MRI overdue 2026-10-07',
      'TH-0093: serum ferritin due 2027-01-13',
    ]);
    expect((events[0]!.component.getFirstPropertyValue('dtstamp') as ICAL.Time).toJSDate().getTime()).toBe(fixedNow.getTime());
  });

  it('refuses to overwrite an existing file unless --force, and says so', async () => {
    const path = tempFile();
    writeFileSync(path, 'keep me');
    const refused = await cli('calendar', demo('th-0093'), '--output', path);
    expect(refused.code).toBe(1);
    expect(refused.err).toContain(`${path} already exists; nothing was written. Add --force to replace it.`);
    expect(readFileSync(path, 'utf8')).toBe('keep me');
    const forced = await cli('calendar', demo('th-0093'), '-o', path, '--force');
    expect(forced.code).toBe(0);
    expect(readFileSync(path, 'utf8')).toMatch(/^BEGIN:VCALENDAR\r\n/);
  });

  it('prints the list only without -o, and takes --as-of and --anc-interval-days', async () => {
    const { code, out } = await cli('calendar', demo('th-0417'), '--as-of', '2026-10-15', '--anc-interval-days', '14');
    expect(code).toBe(0);
    expect(out).toContain('as of 2026-10-15');
    expect(out).toContain('- serum creatinine (monthly): due 2026-10-29');
    expect(out).not.toContain('Wrote');
  });

  it('gives the calendar as JSON', async () => {
    const { code, out } = await cli('calendar', demo('th-0093'), '--json');
    expect(code).toBe(0);
    const parsed = JSON.parse(out);
    expect(parsed.items.map((it: { id: string }) => it.id)).toEqual(['liver-iron', 'hearing', 'eyes', 'ferritin']);
  });

  it('names the problem with bad options and writes nothing', async () => {
    const path = tempFile();
    const bad = await cli('calendar', demo('th-0093'), '--as-of', '2026-13-01', '--anc-interval-days', '0', '-o', path);
    expect(bad.code).toBe(1);
    expect(bad.err).toContain('--as-of: "2026-13-01" is not a calendar date written YYYY-MM-DD.');
    expect(existsSync(path)).toBe(false);
    const zero = await cli('calendar', demo('th-0093'), '--anc-interval-days', '0');
    expect(zero.err).toContain('--anc-interval-days: ANC interval 0 days is outside the plausible range 1–90 whole days.');
    expect((await cli('calendar')).code).toBe(2);
    expect((await cli('calendar', demo('th-0093'), '--colour', 'red')).err).toContain('--colour: not an option of calendar');
  });
});
