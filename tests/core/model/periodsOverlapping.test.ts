import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { addDaysIso, daysBetween } from '../../../core/dates/isoDate';
import { periodsOverlapping } from '../../../core/model/periodsOverlapping';

// Oracle: enumerate the window's days one by one and ask whether any is a day the
// period ran (start ≤ day ≤ end, end inclusive as the case file defines it).
// An independent, brute-force reading of the same definition.
const anyDayOnPeriod = (period: { startDate: string; endDate: string | null }, afterDate: string, toDate: string) => {
  for (let day = addDaysIso(afterDate, 1); day <= toDate; day = addDaysIso(day, 1)) {
    if (period.startDate <= day && (period.endDate === null || day <= period.endDate)) return true;
  }
  return false;
};

describe('periodsOverlapping (the ledger’s one overlap rule)', () => {
  it('agrees with a day-by-day enumeration of the window', () => {
    const base = '2026-01-01';
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 60 }), fc.option(fc.integer({ min: 0, max: 40 })), fc.integer({ min: 0, max: 60 }), fc.integer({ min: 1, max: 30 }), (start, length, after, span) => {
        const period = { startDate: addDaysIso(base, start), endDate: length === null ? null : addDaysIso(base, start + length) };
        const afterDate = addDaysIso(base, after);
        const toDate = addDaysIso(afterDate, span);
        expect(periodsOverlapping([period], afterDate, toDate).length === 1).toBe(anyDayOnPeriod(period, afterDate, toDate));
      }),
    );
  });
  it('leaves out a period whose last day is the day before the window, keeps one starting on the window’s last day', () => {
    const ended = { startDate: '2026-01-01', endDate: '2026-03-01' };
    const starting = { startDate: '2026-06-01', endDate: null };
    expect(periodsOverlapping([ended, starting], '2026-03-01', '2026-06-01')).toEqual([starting]);
    expect(daysBetween('2026-03-01', '2026-06-01')).toBe(92);
  });
});
