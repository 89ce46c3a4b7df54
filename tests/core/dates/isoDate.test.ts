import { describe, expect, it } from 'vitest';
import {
  addDaysIso,
  addMonthsIso,
  daysBetween,
  isIsoDate,
  monthEndIso,
  monthStartIso,
} from '../../../core/dates';

// Outside reference: the Gregorian calendar rules (ISO 8601; leap years divisible by 4,
// except centuries not divisible by 400), checked against JavaScript's own Date.UTC.
describe('ISO calendar dates', () => {
  it('accepts real dates and refuses impossible ones', () => {
    expect(isIsoDate('2024-02-29')).toBe(true);
    expect(isIsoDate('2000-02-29')).toBe(true);
    expect(isIsoDate('1900-02-29')).toBe(false);
    expect(isIsoDate('2025-02-29')).toBe(false);
    expect(isIsoDate('2026-13-01')).toBe(false);
    expect(isIsoDate('2026-1-01')).toBe(false);
    expect(isIsoDate('01/02/2026')).toBe(false);
  });

  it('counts days as Date.UTC does, across a leap day and a year end', () => {
    const utcDays = (a: [number, number, number], b: [number, number, number]) =>
      (Date.UTC(...b) - Date.UTC(...a)) / 86_400_000;
    expect(daysBetween('2024-02-28', '2024-03-01')).toBe(utcDays([2024, 1, 28], [2024, 2, 1]));
    expect(daysBetween('2025-12-20', '2026-01-10')).toBe(21);
    expect(daysBetween('2026-11-20', '2025-11-20')).toBe(-365);
  });

  it('adds days and months with month-end clamping', () => {
    expect(addDaysIso('2026-02-27', 3)).toBe('2026-03-02');
    expect(addMonthsIso('2026-01-31', 1)).toBe('2026-02-28');
    expect(addMonthsIso('2024-01-31', 1)).toBe('2024-02-29');
    expect(addMonthsIso('2026-11-20', 24)).toBe('2028-11-20');
    expect(monthStartIso('2026-11-20')).toBe('2026-11-01');
    expect(monthEndIso('2024-02-10')).toBe('2024-02-29');
  });

  it('does not depend on the machine time zone', () => {
    const before = process.env.TZ;
    process.env.TZ = 'Pacific/Kiritimati';
    try {
      expect(daysBetween('2026-03-01', '2026-04-01')).toBe(31);
      expect(monthStartIso('2026-03-01')).toBe('2026-03-01');
    } finally {
      process.env.TZ = before;
    }
  });
});

describe('epoch days', () => {
  it('round-trips every day of a leap year and matches daysBetween', async () => {
    const { epochDayFromIso, isoFromEpochDay, addDaysIso, daysBetween } = await import('../../../core/dates');
    const start = epochDayFromIso('2024-01-01');
    for (let offset = 0; offset < 366; offset += 1) {
      const iso = addDaysIso('2024-01-01', offset);
      expect(isoFromEpochDay(start + offset)).toBe(iso);
      expect(epochDayFromIso(iso) - start).toBe(daysBetween('2024-01-01', iso));
    }
  });

  it('names the same day as the platform Date (toISOString) for every day 1900–2100, every 7th day of years 0000–9999, and outside them', async () => {
    // The reference is ECMAScript's own proleptic Gregorian calendar (ECMA-262 §21.4.1, Date.prototype.toISOString).
    const { isoFromEpochDay } = await import('../../../core/dates');
    const byDate = (day: number) => new Date(day * 86_400_000).toISOString().slice(0, 10);
    const mismatches: number[] = [];
    for (let day = -25_567; day <= 47_482; day += 1) if (isoFromEpochDay(day) !== byDate(day)) mismatches.push(day);
    for (let day = -719_528; day <= 2_932_896; day += 7) if (isoFromEpochDay(day) !== byDate(day)) mismatches.push(day);
    for (const day of [-719_529, -719_528, 2_932_896, 2_932_897, 1.5, -0.5]) if (isoFromEpochDay(day) !== byDate(day)) mismatches.push(day);
    expect(mismatches).toEqual([]);
    expect(isoFromEpochDay(-719_528)).toBe('0000-01-01');
    expect(isoFromEpochDay(2_932_896)).toBe('9999-12-31');
  });

  it('reads a date to the same day number as Date.UTC, valid or not, for years 0000–9999', async () => {
    // The reference is ECMAScript's Date.UTC (ECMA-262 §21.4.3.4), which the fast path replaces: the same
    // number for every day of 1900–2100 and every 7th day of 0100–9999, for days past a month's end
    // (2026-02-30 is 2026-03-02 to both), and for text it does not read itself (two-digit years, month 13).
    const { epochDayFromIso, isoFromEpochDay } = await import('../../../core/dates');
    const byDateUtc = (text: string) => Date.UTC(Number(text.slice(0, 4)), Number(text.slice(5, 7)) - 1, Number(text.slice(8, 10))) / 86_400_000;
    const texts: string[] = [];
    for (let day = -25_567; day <= 47_482; day += 1) texts.push(isoFromEpochDay(day));
    for (let day = -682_998; day <= 2_932_896; day += 7) texts.push(isoFromEpochDay(day));
    texts.push('2026-02-30', '2024-02-31', '2025-04-31', '0099-06-01', '0050-01-01', '2026-13-01', '2026-00-10', '2026-01-00', '2026-1-01', '20260101', 'not a date');
    const mismatches = texts.filter((text) => !Object.is(epochDayFromIso(text), byDateUtc(text)));
    expect(mismatches).toEqual([]);
  });
});
