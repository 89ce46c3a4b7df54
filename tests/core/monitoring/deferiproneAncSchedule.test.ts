import { describe, expect, it } from 'vitest';
import { addDaysIso, addMonthsIso } from '../../../core/dates';
import { monitoringCalendar } from '../../../core/monitoring';
import { parsed, reviewDate, result, smallCase } from '../safety/safetyCases';

// The deferiprone ANC schedule of the US label, March 2025 revision, §2.1 and
// §5.1 (references.md §9): weekly for the first 6 months, every 2 weeks for
// the next 6 months, then every 2–4 weeks after a year without an interruption
// for low ANC; daily during neutropenia until recovery. Each step is tested on
// both sides of its boundary. "Weekly throughout" (the older texts) is a local
// protocol option.

function ancRow(startDate: string, ancs: [number, number][], options: Parameters<typeof monitoringCalendar>[2] = {}) {
  const json = smallCase({
    results: ancs.map(([daysBefore, value]) => result('neutrophils', daysBefore, value, '10*9/L')),
    chelationPeriods: [{ id: 'dfp', drug: 'deferiprone', formulation: 'tablet', route: 'oral', dose: { value: 25, unit: 'mg/kg' }, administrationsPerDay: 3, daysPerWeek: 7, startDate, endDate: null }],
  });
  const calendar = monitoringCalendar(parsed(json), reviewDate, options);
  if (!calendar.ok) throw new Error(calendar.issues[0]!.message);
  return calendar.value.items.find((it) => it.id === 'neutrophils')!;
}

describe('ANC on deferiprone by time on the drug (US label 2025 §2.1, §5.1)', () => {
  const startMonthsBefore = (months: number, days = 0) => addDaysIso(addMonthsIso(reviewDate, -months), days);

  it('is weekly up to 6 months and every 2 weeks from 6 months (a day before and on the boundary)', () => {
    expect(ancRow(startMonthsBefore(6, 1), [[3, 2.4]]).interval).toEqual({ days: 7 });
    expect(ancRow(startMonthsBefore(6), [[3, 2.4]]).interval).toEqual({ days: 14 });
  });

  it('is every 2 weeks up to 12 months and every 4 weeks (the longest of 2–4) from 12 months without a low count', () => {
    expect(ancRow(startMonthsBefore(12, 1), [[3, 2.4]]).interval).toEqual({ days: 14 });
    const afterYear = ancRow(startMonthsBefore(12), [[3, 2.4]]);
    expect(afterYear.interval).toEqual({ days: 28 });
    expect(afterYear.why).toContain('every 2 to 4 weeks or at the transfusion interval');
  });

  it('stays every 2 weeks after a year when an ANC below 1.5 is on record in the run (1.5 itself is not low)', () => {
    expect(ancRow(startMonthsBefore(14), [[200, 1.4], [3, 2.4]]).interval).toEqual({ days: 14 });
    expect(ancRow(startMonthsBefore(14), [[200, 1.5], [3, 2.4]]).interval).toEqual({ days: 28 });
  });

  it('is daily while the latest ANC is below 1.5 × 10⁹/L (neutropenia), whatever the time on the drug or the local protocol', () => {
    const low = ancRow(startMonthsBefore(3), [[3, 1.3]]);
    expect(low).toMatchObject({ interval: { days: 1 }, dueDate: addDaysIso(reviewDate, -2), status: 'overdue' });
    expect(ancRow(startMonthsBefore(3), [[3, 1.3]], { ancSchedule: 'weekly-throughout' }).interval).toEqual({ days: 1 });
    expect(ancRow(startMonthsBefore(3), [[3, 1.5]]).interval).toEqual({ days: 7 });
  });

  it('applies "weekly throughout" only as a chosen local protocol', () => {
    expect(ancRow(startMonthsBefore(20), [[3, 2.4]], { ancSchedule: 'weekly-throughout' })).toMatchObject({ interval: { days: 7 } });
    expect(ancRow(startMonthsBefore(20), [[3, 2.4]], { ancIntervalDays: 10 })).toMatchObject({ interval: { days: 10 } });
    expect(ancRow(startMonthsBefore(20), [[3, 2.4]])).toMatchObject({ interval: { days: 28 } });
  });
});
