import { describe, expect, it } from 'vitest';
import {
  addWallClockDays,
  checkTrientineStrength,
  courseBindingRow,
  courseDrug,
  creatinineForSchedule,
  findCourseRegimen,
  isEdetateDisodium,
  isTimeZone,
  offsetChangesBetween,
  planCourse,
  readWallClock,
  resolveCourseRegimen,
  trientineSwitch,
  wallClockAt,
  type CourseRequest,
} from '../../../core/courses';
import { runFormula } from '../../../core/formulas';
import { urinaryCopperUnitsFormula } from '../../../core/units/formulas';
import { ucumConvert } from '../units/ucumReference';

// The @example of each exported function in core/courses, run as written (style.md habit 5).
// The figures come from the sources named in the doc comments: the UK clock rule (Summer Time
// Order 2002), the label doses, CIAAW molar masses and creatinine 88.40 µmol/L per mg/dL.

describe('core/courses doc-comment examples', () => {
  it('wallClock.ts', () => {
    expect(isTimeZone('Europe/London')).toBe(true);
    expect(isTimeZone('Mars/Olympus')).toBe(false);
    expect(wallClockAt(Date.UTC(2026, 9, 25, 5, 0), 'Europe/London')).toMatchObject({ localDate: '2026-10-25', localTime: '05:00', utcOffset: '+00:00' });
    const read = readWallClock('2026-10-24T22:00', 'Europe/London');
    expect(read.ok && read.value.epochMs).toBe(Date.UTC(2026, 9, 24, 21, 0));
    const nine = Date.UTC(2026, 9, 24, 8, 0);
    expect(wallClockAt(addWallClockDays(nine, 1, 'Europe/London'), 'Europe/London').localTime).toBe('09:00');
    const changes = offsetChangesBetween(Date.UTC(2026, 9, 24, 21, 0), Date.UTC(2026, 9, 26, 0, 0), 'Europe/London');
    expect(changes).toHaveLength(1);
    expect(changes[0]).toMatchObject({ localDate: '2026-10-25', offsetBefore: '+01:00', offsetAfter: '+00:00', shiftMinutes: -60 });
  });

  it('orderName.ts, regimens.ts, drugs.ts', () => {
    expect(isEdetateDisodium('Edetate disodium')).toBe(true);
    expect(isEdetateDisodium('edetate calcium disodium')).toBe(false);
    const refused = resolveCourseRegimen('edetate disodium');
    expect(!refused.ok && refused.issues[0]!.message).toContain('MMWR 2006;55:204');
    expect(findCourseRegimen('succimer-lead')?.populations[0]?.phases.length).toBe(2);
    expect(courseDrug('succimer').dosedAs).toBe('succimer');
  });

  it('trientineBasis.ts and binding.ts', () => {
    const wrong = checkTrientineStrength('trientine-tetrahydrochloride', 150, 'salt');
    expect(!wrong.ok && wrong.issues[0]!.code).toBe('wrong_basis');
    const change = trientineSwitch('trientine-dihydrochloride', 1000, 'trientine-tetrahydrochloride');
    expect(change.currentDailyBaseMg).toBeCloseTo(667.3, 1);
    expect(change.equivalentUnitsPerDay).toBeCloseTo(4.45, 2);
    expect(courseBindingRow('calcium-disodium-edetate', 1000, 'lead').stoichiometricCeilingMg).toBeCloseTo(553.6, 1);
  });

  it('planCourse.ts', () => {
    const plan = planCourse(findCourseRegimen('succimer-lead')!, { weightKg: 14, heightCm: 92, ageYears: 3, start: '2026-10-24T22:00', timeZone: 'Europe/London' });
    expect(plan.ok && plan.value.phases.map((it) => [it.administrations, it.dosePerAdministrationMg])).toEqual([
      [15, 100],
      [28, 100],
    ]);
    expect(plan.ok && plan.value.phases[1]!.last).toMatchObject({ localDate: '2026-11-12', localTime: '09:00' });
    expect(creatinineForSchedule(265.2, 'umol/L')).toBeCloseTo(3.0, 2);
  });

  it('planCourse changes neither the regimen nor the request, and repeats exactly', () => {
    const regimen = findCourseRegimen('dimercaprol-edetate-encephalopathy')!;
    const request: CourseRequest = { weightKg: 16, heightCm: 101, ageYears: 4, start: '2026-10-24T20:00', timeZone: 'Europe/London', basis: 'mg-per-m2' };
    const before = JSON.stringify([regimen, request]);
    const first = planCourse(Object.freeze(regimen), Object.freeze(request));
    expect(JSON.stringify([regimen, request])).toBe(before);
    expect(JSON.stringify(planCourse(regimen, request))).toBe(JSON.stringify(first));
  });
});

describe('calc urinary-copper-units (UCUM with Ar(Cu) as the outside reference)', () => {
  it('converts both ways and refuses a value outside the range in its unit', () => {
    const run = runFormula(urinaryCopperUnitsFormula, { urinaryCopper: 450, urinaryCopperUnit: 'ug/(24.h)' });
    expect(run.ok).toBe(true);
    if (run.ok) expect(run.value.outputs.urinaryCopperUmolPer24h).toBeCloseTo(ucumConvert('ug/(24.h)', 450, 'umol/(24.h)', 63.546), 9);
    const back = runFormula(urinaryCopperUnitsFormula, { urinaryCopper: 7.08, urinaryCopperUnit: 'umol/(24.h)' });
    if (back.ok) expect(back.value.outputs.urinaryCopperUgPer24h).toBeCloseTo(7.08 * 63.546, 6);
    const high = runFormula(urinaryCopperUnitsFormula, { urinaryCopper: 450, urinaryCopperUnit: 'umol/(24.h)' });
    expect(high.ok).toBe(false);
    if (!high.ok) expect(high.issues[0]!.message).toContain('if it was measured in ug/(24.h)');
  });
});
