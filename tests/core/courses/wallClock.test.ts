import { describe, expect, it } from 'vitest';
import { addWallClockDays, isTimeZone, offsetChangesBetween, readWallClock, wallClockAt } from '../../../core/courses';

// Outside references for the clock changes:
// - UK: The Summer Time Order 2002 (SI 2002/262): summer time (GMT + 1) from 01:00 GMT on the last Sunday
//   in March to 01:00 GMT on the last Sunday in October → 2026-03-29 and 2026-10-25.
// - US: Energy Policy Act of 2005 §110: daylight time from 02:00 local on the second Sunday in March to
//   02:00 local on the first Sunday in November → 2026-03-08 and 2026-11-01 (America/Chicago: −06:00 / −05:00).
// Expected instants are hand arithmetic from those rules; exact equality (minutes are integers).

describe('the ward clock (IANA zones, daylight-saving rules)', () => {
  it('reads a local start on an ordinary day as the instant of that zone’s offset', () => {
    const read = readWallClock('2026-10-24T22:00', 'Europe/London');
    expect(read.ok && read.value.epochMs).toBe(Date.UTC(2026, 9, 24, 21, 0)); // BST = UTC+1
    expect(read.ok && read.value.utcOffset).toBe('+01:00');
    expect(read.ok && read.warnings).toBeUndefined();
  });

  it('refuses a time inside the spring-forward gap (01:30 on 2026-03-29 in London does not exist), naming the value', () => {
    const read = readWallClock('2026-03-29T01:30', 'Europe/London');
    expect(read.ok).toBe(false);
    if (!read.ok) {
      expect(read.issues[0]!.code).toBe('invalid_date');
      expect(read.issues[0]!.path).toEqual(['start']);
      expect(read.issues[0]!.message).toContain('2026-03-29T01:30');
    }
    // The minute before and the hour after the gap are real.
    expect(readWallClock('2026-03-29T00:59', 'Europe/London').ok).toBe(true);
    expect(readWallClock('2026-03-29T02:00', 'Europe/London').ok).toBe(true);
  });

  it('reads a time that happens twice (01:30 on 2026-10-25 in London) as the first occurrence, with a warning', () => {
    const read = readWallClock('2026-10-25T01:30', 'Europe/London');
    expect(read.ok).toBe(true);
    if (read.ok) {
      expect(read.value.epochMs).toBe(Date.UTC(2026, 9, 25, 0, 30)); // 01:30 BST, not 01:30 GMT
      expect(read.warnings?.[0]?.severity).toBe('warning');
      expect(read.warnings?.[0]?.message).toContain('happens twice');
    }
  });

  it('refuses what is not a local date-time or not a real date', () => {
    for (const text of ['2026-10-24 22:00', '2026-10-24T22:00Z', '2026-02-30T08:00', '2026-10-24T24:00', 'tomorrow']) {
      const read = readWallClock(text, 'Europe/London');
      expect(read.ok, text).toBe(false);
    }
  });

  it('finds each change to the minute: London back on 2026-10-25 at 01:00 GMT, Chicago forward on 2026-03-08 at 08:00 UTC', () => {
    const london = offsetChangesBetween(Date.UTC(2026, 9, 20), Date.UTC(2026, 10, 5), 'Europe/London');
    expect(london).toHaveLength(1);
    expect(london[0]).toMatchObject({ atEpochMs: Date.UTC(2026, 9, 25, 1, 0), localDate: '2026-10-25', offsetBefore: '+01:00', offsetAfter: '+00:00', shiftMinutes: -60 });
    const chicago = offsetChangesBetween(Date.UTC(2026, 2, 1), Date.UTC(2026, 2, 15), 'America/Chicago');
    expect(chicago).toHaveLength(1);
    // 02:00 CST = 08:00 UTC
    expect(chicago[0]).toMatchObject({ atEpochMs: Date.UTC(2026, 2, 8, 8, 0), offsetBefore: '-06:00', offsetAfter: '-05:00', shiftMinutes: 60 });
    expect(offsetChangesBetween(Date.UTC(2026, 0, 5), Date.UTC(2026, 1, 5), 'Europe/London')).toEqual([]);
    expect(offsetChangesBetween(Date.UTC(2026, 0, 1), Date.UTC(2026, 11, 31), 'Asia/Tokyo')).toEqual([]); // Japan keeps no summer time
  });

  it('keeps the clock time for whole days: 09:00 the day before the October change is 09:00 the day after, 25 real hours later', () => {
    const nine = Date.UTC(2026, 9, 24, 8, 0); // 09:00 BST
    const next = addWallClockDays(nine, 1, 'Europe/London');
    expect(wallClockAt(next, 'Europe/London')).toMatchObject({ localDate: '2026-10-25', localTime: '09:00', utcOffset: '+00:00' });
    expect((next - nine) / 3_600_000).toBe(25);
  });

  it('knows IANA names and refuses others', () => {
    expect(isTimeZone('Europe/London')).toBe(true);
    expect(isTimeZone('America/Chicago')).toBe(true);
    expect(isTimeZone('Mars/Olympus_Mons')).toBe(false);
  });
});
