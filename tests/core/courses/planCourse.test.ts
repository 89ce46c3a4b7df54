import { describe, expect, it } from 'vitest';
import {
  checkEdetateAfterSecondDimercaprol,
  courseRegimens,
  findCourseRegimen,
  planCourse,
  rollingDailyChecks,
  type CoursePlan,
  type CourseRequest,
  type PlannedAdministration,
} from '../../../core/courses';
import { findSource } from '../../../core/references';
import type { Result } from '../../../core/result';

// Expected doses are the label or reference figures themselves (named beside each check) times the
// patient's size by hand arithmetic; body-surface area by Mosteller, √(cm × kg / 3600) (N Engl J Med
// 1987;317:1098). Tolerance: 0.05 mg (the plan keeps unrounded mg; one decimal is what a sheet prints).

const base = { start: '2026-11-14T08:00', timeZone: 'Europe/London' } as const;

function plan(id: string, request: Partial<CourseRequest> & { weightKg: number }): Result<CoursePlan> {
  const regimen = findCourseRegimen(id);
  if (!regimen) throw new Error(`no regimen ${id}`);
  return planCourse(regimen, { ...base, ...request });
}

function planned(id: string, request: Partial<CourseRequest> & { weightKg: number }): CoursePlan {
  const result = plan(id, request);
  if (!result.ok) throw new Error(result.issues.map((it) => it.message).join('\n'));
  return result.value;
}

function refused(id: string, request: Partial<CourseRequest> & { weightKg: number }) {
  const result = plan(id, request);
  expect(result.ok, `${id} should be refused`).toBe(false);
  return result.ok ? [] : result.issues;
}

const mosteller = (heightCm: number, weightKg: number) => Math.sqrt((heightCm * weightKg) / 3600);

describe('the catalogue', () => {
  it('cites only sources that exist, and every regimen has phases for some population', () => {
    for (const regimen of courseRegimens) {
      for (const id of regimen.sourceIds) expect(findSource(id), `${regimen.id}: ${id}`).toBeDefined();
      for (const population of regimen.populations) {
        expect(population.phases.length).toBeGreaterThan(0);
        for (const phase of population.phases) {
          for (const id of [...phase.sourceIds, ...phase.doseOptions.flatMap((it) => it.sourceIds)]) expect(findSource(id), `${regimen.id}/${phase.id}: ${id}`).toBeDefined();
        }
      }
      for (const item of regimen.monitoring) for (const id of item.sourceIds) expect(findSource(id)).toBeDefined();
    }
  });
});

describe('published doses, a child and an adult for each regimen', () => {
  it('succimer: label weight band 8–15 kg 100 mg for a 14 kg child; 10 mg/kg and 350 mg/m² shown beside (succimer label, dosage table)', () => {
    const value = planned('succimer-lead', { weightKg: 14, heightCm: 92, ageYears: 3 });
    const phase = value.phases[0]!;
    expect(phase.dosePerAdministrationMg).toBe(100);
    expect(phase.alternatives.find((it) => it.basis === 'mg-per-kg')!.mg).toBeCloseTo(140, 1);
    expect(phase.alternatives.find((it) => it.basis === 'mg-per-m2')!.mg).toBeCloseTo(350 * mosteller(92, 14), 1); // 209.4
    expect(planned('succimer-lead', { weightKg: 14, heightCm: 92, ageYears: 3, basis: 'mg-per-m2' }).phases[0]!.dosePerAdministrationMg).toBeCloseTo(209.35, 1);
  });

  it('succimer: an adult of 70 kg takes the ≥ 45 kg row, 500 mg; 10 mg/kg (700 mg) is capped at 500 mg (label)', () => {
    expect(planned('succimer-lead', { weightKg: 70, heightCm: 175, ageYears: 30 }).phases[0]!.dosePerAdministrationMg).toBe(500);
    const perKg = planned('succimer-lead', { weightKg: 70, heightCm: 175, ageYears: 30, basis: 'mg-per-kg' }).phases[0]!;
    expect(perKg.dosePerAdministrationMg).toBe(500);
    expect(perKg.capApplied).toContain('700 mg capped at the per-dose maximum 500 mg');
  });

  it('calcium disodium edetate: 1,000 mg/m²/day for a child (0.670 m²) and an adult (1.845 m²), 5 days, two courses 2 days apart (label)', () => {
    const child = planned('edetate-calcium-disodium-lead', { weightKg: 16, heightCm: 101, ageYears: 4 });
    expect(child.phases[0]!.dosePerAdministrationMg).toBeCloseTo(1000 * mosteller(101, 16), 1); // 670.0
    const adult = planned('edetate-calcium-disodium-lead', { weightKg: 70, heightCm: 175, ageYears: 40 });
    expect(adult.phases[0]!.dosePerAdministrationMg).toBeCloseTo(1000 * mosteller(175, 70), 1); // 1844.7
    expect(adult.administrations).toHaveLength(10);
    expect(adult.courses.map((it) => [it.first.localDate, it.last.localDate])).toEqual([
      ['2026-11-14', '2026-11-18'],
      ['2026-11-21', '2026-11-25'],
    ]);
    expect(adult.restDays).toEqual(['2026-11-19', '2026-11-20']);
    expect(planned('edetate-calcium-disodium-lead', { weightKg: 70, heightCm: 175, ageYears: 40, restDays: 4 }).restDays).toHaveLength(4);
  });

  it('dimercaprol then edetate: 4 mg/kg or 75 mg/m² dimercaprol, 250 mg/m² edetate every 4 h (label; clinical references)', () => {
    const child = planned('dimercaprol-edetate-encephalopathy', { weightKg: 16, heightCm: 101, ageYears: 4, basis: 'mg-per-m2' });
    expect(child.phases[0]!.dosePerAdministrationMg).toBeCloseTo(75 * mosteller(101, 16), 1); // 50.2
    expect(child.phases[1]!.dosePerAdministrationMg).toBeCloseTo(250 * mosteller(101, 16), 1); // 167.5
    const adult = planned('dimercaprol-edetate-encephalopathy', { weightKg: 70, heightCm: 175, ageYears: 40 });
    expect(adult.phases[0]!.dosePerAdministrationMg).toBeCloseTo(280, 5); // 4 mg/kg × 70
    expect(adult.phases[1]!.dosePerAdministrationMg).toBeCloseTo(250 * mosteller(175, 70), 1);
  });

  it('dimercaprol for arsenic: 3 mg/kg every 4 h × 2 days, every 6 h on day 3, every 12 h × 10 days (label as reproduced)', () => {
    const child = planned('dimercaprol-arsenic', { weightKg: 20 });
    expect(child.phases.map((it) => [it.administrations, it.dosePerAdministrationMg])).toEqual([
      [12, 60],
      [4, 60],
      [20, 60],
    ]);
    expect(planned('dimercaprol-arsenic', { weightKg: 70 }).totalsMg[0]!.mg).toBeCloseTo(36 * 210, 5);
  });

  it('dimercaprol for mercury: 5 mg/kg, then 2.5 mg/kg twice daily for 10 days (label as reproduced)', () => {
    const adult = planned('dimercaprol-mercury', { weightKg: 70 });
    expect(adult.phases.map((it) => [it.administrations, it.dosePerAdministrationMg])).toEqual([
      [1, 350],
      [20, 175],
    ]);
    expect(planned('dimercaprol-mercury', { weightKg: 20 }).phases[1]!.dosePerAdministrationMg).toBe(50);
  });

  it('unithiol: 3–5 mg/kg every 4 h by slow IV infusion (pharmacology chapter); upper end by default, lower end on request', () => {
    expect(planned('unithiol-iv', { weightKg: 70 }).phases[0]!.dosePerAdministrationMg).toBe(350);
    expect(planned('unithiol-iv', { weightKg: 70 }).phases[0]!.administrations).toBe(18); // 3 days × 6
    expect(planned('unithiol-iv', { weightKg: 20, mgPerKg: 3 }).phases[0]!.dosePerAdministrationMg).toBe(60);
    expect(refused('unithiol-iv', { weightKg: 20, mgPerKg: 5.1 })[0]!.path).toEqual(['mgPerKg']);
    expect(refused('unithiol-iv', { weightKg: 20, mgPerKg: 2.9 })[0]!.code).toBe('out_of_range');
  });

  it('penicillamine: children 20 mg/kg/day to the nearest 250 mg; adults the lower end of 750–1,500 mg/day (US label; EASL 2012)', () => {
    const child = planned('penicillamine-wilson', { weightKg: 20, ageYears: 8 });
    expect(child.phases[0]!.dosePerAdministrationMg * 2).toBe(500); // 400 mg → 500 mg/day, two doses
    expect(planned('penicillamine-wilson', { weightKg: 30, ageYears: 10 }).phases[0]!.dosePerAdministrationMg * 2).toBe(500); // 600 → 500
    expect(planned('penicillamine-wilson', { weightKg: 33, ageYears: 11 }).phases[0]!.dosePerAdministrationMg * 2).toBe(750); // 660 → 750
    const adult = planned('penicillamine-wilson', { weightKg: 70, ageYears: 40 });
    expect(adult.phases[0]!.dosePerAdministrationMg).toBe(250); // 750 mg/day in three
  });

  it('trientine dihydrochloride (salt): children 500 mg/day, adults 750 mg/day at the lower ends (US label)', () => {
    expect(planned('trientine-dihydrochloride-wilson', { weightKg: 30, ageYears: 12 }).phases[0]!.dosePerAdministrationMg).toBe(250);
    expect(planned('trientine-dihydrochloride-wilson', { weightKg: 66, ageYears: 13 }).phases[0]!.dosePerAdministrationMg).toBe(375);
  });

  it('trientine tetrahydrochloride (base): children from 5 years 225 mg/day, adults 450 mg/day (EU SmPC §4.2)', () => {
    expect(planned('trientine-tetrahydrochloride-wilson', { weightKg: 25, ageYears: 8 }).phases[0]!.dosePerAdministrationMg).toBe(112.5);
    expect(planned('trientine-tetrahydrochloride-wilson', { weightKg: 66, ageYears: 34 }).phases[0]!.dosePerAdministrationMg).toBe(225);
    expect(refused('trientine-tetrahydrochloride-wilson', { weightKg: 16, ageYears: 4 })[0]!.code).toBe('not_applicable');
  });

  it('zinc (elemental): 50 mg three times daily from 16 years or 57 kg; 25 mg three times at 6–15 years; twice at 1–5 (zinc references)', () => {
    const rows = (weightKg: number, ageYears: number) => {
      const phase = planned('zinc-wilson', { weightKg, ageYears }).phases[0]!;
      return [phase.dosePerAdministrationMg, 24 / phase.intervalHours];
    };
    expect(rows(66, 40)).toEqual([50, 3]);
    expect(rows(57, 15)).toEqual([50, 3]);
    expect(rows(56.9, 15)).toEqual([25, 3]);
    expect(rows(30, 10)).toEqual([25, 3]);
    expect(rows(16, 4)).toEqual([25, 2]);
    expect(refused('zinc-wilson', { weightKg: 8, ageYears: 0.5 })[0]!.code).toBe('not_applicable');
  });
});

describe('caps at the boundary, both sides', () => {
  it('succimer 10 mg/kg: 50 kg gives 500 mg uncapped; 50.1 kg is capped at 500 mg (label table’s top row)', () => {
    const at = planned('succimer-lead', { weightKg: 50, ageYears: 12, basis: 'mg-per-kg' }).phases[0]!;
    expect(at.dosePerAdministrationMg).toBe(500);
    expect(at.capApplied).toBeNull();
    const over = planned('succimer-lead', { weightKg: 50.1, ageYears: 12, basis: 'mg-per-kg' }).phases[0]!;
    expect(over.dosePerAdministrationMg).toBe(500);
    expect(over.capApplied).not.toBeNull();
  });

  it('succimer weight bands at their edges: 15.9 kg → 100 mg, 16 kg → 200 mg, 44.9 kg → 400 mg, 45 kg → 500 mg; below 8 kg refused', () => {
    const dose = (weightKg: number) => planned('succimer-lead', { weightKg, ageYears: 5 }).phases[0]!.dosePerAdministrationMg;
    expect([dose(15.9), dose(16), dose(23.9), dose(24), dose(34.9), dose(35), dose(44.9), dose(45)]).toEqual([100, 200, 200, 300, 300, 400, 400, 500]);
    expect(refused('succimer-lead', { weightKg: 7.9, ageYears: 1 })[0]!.path).toEqual(['weightKg']);
  });

  it('an entered succimer dose of 500 mg is planned; 501 mg is refused (per-dose maximum)', () => {
    expect(planned('succimer-lead', { weightKg: 60, ageYears: 15, doseMg: 500 }).phases[0]!.dosePerAdministrationMg).toBe(500);
    expect(refused('succimer-lead', { weightKg: 60, ageYears: 15, doseMg: 501 })[0]!.message).toContain('exceeds the per-dose maximum of 500 mg');
  });

  it('calcium disodium edetate: an entered 1,844 mg/day for 1.8447 m² is planned as entered; 1,845 mg is refused: the daily dose is never exceeded', () => {
    const request = { weightKg: 70, heightCm: 175, ageYears: 40 };
    const within = planned('edetate-calcium-disodium-lead', { ...request, doseMg: 1844 });
    expect(within.phases[0]!.dosePerAdministrationMg).toBe(1844);
    expect(within.phases[0]!.basis).toBe('entered');
    // An entered dose more than 0.5 % from the published one is kept and flagged (1,500 mg against 1,844.7).
    const lower = plan('edetate-calcium-disodium-lead', { ...request, doseMg: 1500 });
    expect(lower.ok && lower.warnings?.[0]?.message).toContain('differs from the published 1844.7 mg');
    const over = refused('edetate-calcium-disodium-lead', { ...request, doseMg: 1845 });
    expect(over[0]!.message).toContain('the label allows no day above the recommended daily dose');
  });

  it('trientine dihydrochloride children’s cap: 1,500 mg/day planned (above the usual 750: warning), 1,501 refused; adults 2,000 / 2,001 (US label)', () => {
    const child = plan('trientine-dihydrochloride-wilson', { weightKg: 30, ageYears: 10, dailyMg: 1500 });
    expect(child.ok && child.warnings?.[0]?.path).toEqual(['dailyMg']);
    expect(refused('trientine-dihydrochloride-wilson', { weightKg: 30, ageYears: 10, dailyMg: 1501 })[0]!.message).toContain('exceeds the maximum 1500 mg/day');
    expect(plan('trientine-dihydrochloride-wilson', { weightKg: 66, ageYears: 34, dailyMg: 2000 }).ok).toBe(true);
    expect(refused('trientine-dihydrochloride-wilson', { weightKg: 66, ageYears: 34, dailyMg: 2001 })[0]!.code).toBe('out_of_range');
  });

  it('trientine tetrahydrochloride children: 600 mg base/day planned, 601 refused (SmPC range top, secondary)', () => {
    expect(plan('trientine-tetrahydrochloride-wilson', { weightKg: 25, ageYears: 8, dailyMg: 600 }).ok).toBe(true);
    expect(refused('trientine-tetrahydrochloride-wilson', { weightKg: 25, ageYears: 8, dailyMg: 601 })[0]!.path).toEqual(['dailyMg']);
  });

  it('penicillamine adults: 2,000 mg/day planned with a warning (above 1,500), 2,001 refused ("seldom above 2 g")', () => {
    const at = plan('penicillamine-wilson', { weightKg: 70, ageYears: 40, dailyMg: 2000 });
    expect(at.ok && at.warnings?.[0]?.message).toContain('outside the usual 750–1500 mg/day');
    expect(refused('penicillamine-wilson', { weightKg: 70, ageYears: 40, dailyMg: 2001 })[0]!.code).toBe('out_of_range');
  });
});

describe('safety rules, each triggered and not triggered', () => {
  it('dimercaprol is refused for iron, cadmium and selenium and planned for lead (dimercaprol references)', () => {
    for (const metal of ['iron', 'cadmium', 'selenium']) {
      const issues = refused('dimercaprol-edetate-encephalopathy', { weightKg: 16, heightCm: 101, ageYears: 4, metal });
      expect(issues[0]!.message).toContain('toxic complexes');
      expect(refused('dimercaprol-mercury', { weightKg: 70, metal })[0]!.path).toEqual(['metal']);
    }
    expect(plan('dimercaprol-edetate-encephalopathy', { weightKg: 16, heightCm: 101, ageYears: 4, metal: 'lead' }).ok).toBe(true);
    expect(planned('dimercaprol-mercury', { weightKg: 70 }).cautions.join(' ')).toContain('peanut oil');
  });

  it('succimer is withheld at ANC 1,199/µL and planned at 1,200/µL (succimer label)', () => {
    expect(refused('succimer-lead', { weightKg: 14, ageYears: 3, ancPerUl: 1199 })[0]!.message).toContain('below 1,200/µL');
    expect(plan('succimer-lead', { weightKg: 14, ageYears: 3, ancPerUl: 1200 }).ok).toBe(true);
  });

  it('in encephalopathy succimer and edetate alone are refused; the combination is planned', () => {
    expect(refused('succimer-lead', { weightKg: 16, ageYears: 4, encephalopathy: true })[0]!.message).toContain('does not cross the blood-brain barrier');
    expect(refused('edetate-calcium-disodium-lead', { weightKg: 16, heightCm: 101, ageYears: 4, encephalopathy: true })[0]!.message).toContain('second dimercaprol dose');
    expect(plan('dimercaprol-edetate-encephalopathy', { weightKg: 16, heightCm: 101, ageYears: 4, encephalopathy: true }).ok).toBe(true);
  });

  it('edetate starts with the second dimercaprol dose: the planned course passes, an edetate dose with the first dimercaprol dose is caught', () => {
    const value = planned('dimercaprol-edetate-encephalopathy', { weightKg: 16, heightCm: 101, ageYears: 4 });
    const dimercaprol = value.administrations.filter((it) => it.drug === 'dimercaprol');
    const edetate = value.administrations.filter((it) => it.drug === 'calcium-disodium-edetate');
    expect(edetate[0]!.at.epochMs).toBe(dimercaprol[1]!.at.epochMs);
    expect(edetate[0]!.at.epochMs - dimercaprol[0]!.at.epochMs).toBe(4 * 3_600_000);
    expect(checkEdetateAfterSecondDimercaprol(value.administrations)).toEqual([]);
    const early: PlannedAdministration[] = [...value.administrations, { ...edetate[0]!, at: dimercaprol[0]!.at }];
    expect(checkEdetateAfterSecondDimercaprol(early)[0]!.message).toContain('never first');
  });

  it('the daily dose of edetate is checked over any 24 h: six 4-hourly doses fit 1,500 mg/m²; a seventh inside 24 h is caught', () => {
    const value = planned('dimercaprol-edetate-encephalopathy', { weightKg: 16, heightCm: 101, ageYears: 4 });
    const check = value.dailyChecks.find((it) => it.drug === 'calcium-disodium-edetate')!;
    expect(check.withinLimit).toBe(true);
    expect(check.largestMgIn24h).toBeCloseTo(check.limitMg, 6);
    const edetate = value.administrations.filter((it) => it.drug === 'calcium-disodium-edetate');
    const extra: PlannedAdministration = { ...edetate[0]!, at: { ...edetate[0]!.at, epochMs: edetate[0]!.at.epochMs + 3_600_000 } };
    const caught = rollingDailyChecks([...value.administrations, extra], value.phases).find((it) => it.drug === 'calcium-disodium-edetate')!;
    expect(caught.withinLimit).toBe(false);
  });

  it('lead nephropathy: the label’s schedules by creatinine (1.99 standard; 2 and 2.99 every 24 h × 5; 3 and 4 every 48 h × 3; 4.01 weekly)', () => {
    const request = { weightKg: 70, heightCm: 175, ageYears: 50 };
    const phase = (creatinineMgPerDl: number) => planned('edetate-calcium-disodium-lead', { ...request, creatinineMgPerDl, courses: 1 }).phases[0]!;
    expect(phase(1.99).id).toBe('daily-5-days');
    expect(phase(1.99).dosePerAdministrationMg).toBeCloseTo(1000 * mosteller(175, 70), 1);
    for (const creatinine of [2, 2.99]) expect([phase(creatinine).intervalHours, phase(creatinine).administrations]).toEqual([24, 5]);
    for (const creatinine of [3, 4]) expect([phase(creatinine).intervalHours, phase(creatinine).administrations]).toEqual([48, 3]);
    expect([phase(4.01).intervalHours, phase(4.01).administrations]).toEqual([168, 4]);
    expect(phase(3).dosePerAdministrationMg).toBeCloseTo(500 * mosteller(175, 70), 1); // 500 mg/m²
  });

  it('blood lead frames the plan: 45 µg/dL or less warns for succimer, 45.1 does not; 70 warns for succimer, 69.9 does not', () => {
    const warnings = (ugPerDl: number) => {
      const result = plan('succimer-lead', { weightKg: 14, ageYears: 3, bloodLead: { value: ugPerDl, unit: 'ug/dL' } });
      return result.ok ? (result.warnings ?? []).map((it) => it.message) : ['refused'];
    };
    expect(warnings(45).join(' ')).toContain('not above 45');
    expect(warnings(45.1)).toEqual([]);
    expect(warnings(69.9)).toEqual([]);
    expect(warnings(70).join(' ')).toContain('medical emergency');
  });

  it('height is required where a dose is per m², and age where the dose depends on it', () => {
    expect(refused('edetate-calcium-disodium-lead', { weightKg: 16, ageYears: 4 })[0]!.path).toEqual(['heightCm']);
    expect(refused('trientine-dihydrochloride-wilson', { weightKg: 66 })[0]!.path).toEqual(['ageYears']);
  });
});

describe("the patient's numbers take their ranges from core/ranges (one table with the case model)", () => {
  // The ranges are the case model's (core/ranges/plausibleRanges.ts): weight refused at or below 0 and above 400 kg,
  // plausible 2–200 kg; height refused above 275 cm, plausible 40–220 cm; age refused above 125, plausible 0–105.
  it('keeps a weight outside the plausible range with a warning naming that range, as a case file does', () => {
    // Dimercaprol for arsenic, 3 mg/kg (the course catalogue's figure): 230 kg × 3 = 690 mg per administration.
    const heavy = planned('dimercaprol-arsenic', { weightKg: 230 });
    expect(heavy.phases[0]!.dosePerAdministrationMg).toBeCloseTo(690, 5);
    expect(heavy.warnings.map((it) => it.message)).toContain('Weight 230 kg is outside the plausible range 2–200 kg.');
    expect(heavy.warnings.find((it) => it.path[0] === 'weightKg')!.severity).toBe('warning');
  });

  it('refuses a weight, a height or an age outside the possible range, naming the field, the value and the range', () => {
    expect(refused('dimercaprol-arsenic', { weightKg: 0 })[0]).toMatchObject({ code: 'out_of_range', path: ['weightKg'], message: 'Weight 0 kg is outside the possible range 0–400 kg (above 0).' });
    expect(refused('dimercaprol-arsenic', { weightKg: 401 })[0]!.path).toEqual(['weightKg']);
    expect(refused('succimer-lead', { weightKg: 70, heightCm: 300 })[0]).toMatchObject({ path: ['heightCm'], message: 'Height 300 cm is outside the possible range 0–275 cm (above 0).' });
    expect(refused('penicillamine-wilson', { weightKg: 70, ageYears: 130 })[0]).toMatchObject({ path: ['ageYears'], message: 'Age 130 a is outside the possible range 0–125 a.' });
  });
});
