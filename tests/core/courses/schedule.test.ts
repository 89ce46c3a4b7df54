import { describe, expect, it } from 'vitest';
import {
  checkTrientineStrength,
  courseBindingRow,
  findCourseRegimen,
  isEdetateDisodium,
  planCourse,
  resolveCourseRegimen,
  trientineSwitch,
  unitsAround,
  type CourseRequest,
} from '../../../core/courses';
import { pmComparisonAtPhysiologicalPh } from '../../../core/chemistry';
import { urinaryCopperUgPer24hFromUmolPer24h, urinaryCopperUmolPer24hFromUgPer24h } from '../../../core/units/concentration';
import type { MicrogramsPer24h, UmolPer24h } from '../../../core/units/quantity';
import { ucumConvert } from '../units/ucumReference';

// Schedules are checked by hand arithmetic on the label intervals (succimer label: every 8 h × 5 days,
// then every 12 h × 14 days) and the UK clock rule (Summer Time Order 2002: back at 01:00 GMT on
// 2026-10-25, forward on 2026-03-29). Exact equality: instants are whole minutes.

function planned(id: string, request: Partial<CourseRequest> & { weightKg: number; start: string }) {
  const result = planCourse(findCourseRegimen(id)!, { timeZone: 'Europe/London', ...request });
  if (!result.ok) throw new Error(result.issues.map((it) => it.message).join('\n'));
  return result.value;
}

describe('succimer schedule counted, with and without a clock change', () => {
  const child = { weightKg: 14, heightCm: 92, ageYears: 3 };

  it('without a change (start 2026-11-14 22:00): 15 doses then 28; every-8-h ends 2026-11-19 14:00, the course 2026-12-03 10:00', () => {
    const value = planned('succimer-lead', { ...child, start: '2026-11-14T22:00' });
    expect(value.phases.map((it) => it.administrations)).toEqual([15, 28]);
    expect(value.phases[0]!.last).toMatchObject({ localDate: '2026-11-19', localTime: '14:00' }); // + 14 × 8 h = 112 h
    expect(value.phases[1]!.first).toMatchObject({ localDate: '2026-11-19', localTime: '22:00' }); // + 120 h
    expect(value.phases[1]!.last).toMatchObject({ localDate: '2026-12-03', localTime: '10:00' }); // + 120 + 27 × 12 = 444 h
    expect(value.offsetChanges).toEqual([]);
    expect(value.totalsMg).toEqual([{ drug: 'succimer', mg: 4300, administrations: 43 }]);
  });

  it('across the October change (start 2026-10-24 22:00 BST): elapsed 8 h intervals, so later doses sit an hour earlier on the clock', () => {
    const value = planned('succimer-lead', { ...child, start: '2026-10-24T22:00' });
    expect(value.phases.map((it) => it.administrations)).toEqual([15, 28]);
    const times = value.administrations.map((it) => `${it.at.localDate} ${it.at.localTime}`);
    expect(times.slice(0, 4)).toEqual(['2026-10-24 22:00', '2026-10-25 05:00', '2026-10-25 13:00', '2026-10-25 21:00']);
    expect(value.phases[0]!.last).toMatchObject({ localDate: '2026-10-29', localTime: '13:00', utcOffset: '+00:00' });
    expect(value.phases[1]!.last).toMatchObject({ localDate: '2026-11-12', localTime: '09:00' });
    // Every interval is exactly the label's in real time: 8 h through the fifteenth dose and on to the
    // first 12-hourly one (the 5 days end 120 h after the start), then 12 h.
    const gaps = value.administrations.slice(1).map((it, index) => (it.at.epochMs - value.administrations[index]!.at.epochMs) / 3_600_000);
    expect(new Set(gaps.slice(0, 15))).toEqual(new Set([8]));
    expect(new Set(gaps.slice(15))).toEqual(new Set([12]));
    expect(value.offsetChanges).toHaveLength(1);
    expect(value.administrations.filter((it) => it.clockShifted)).toHaveLength(42);
  });

  it('monitoring due: blood count at the start and weekly, blood lead weekly and 7 days after the last dose (succimer label)', () => {
    const value = planned('succimer-lead', { ...child, start: '2026-11-14T22:00' });
    const lead = value.monitoring.filter((it) => it.what.startsWith('blood lead')).map((it) => it.dueDate);
    expect(lead).toEqual(['2026-11-21', '2026-11-28', '2026-12-10']);
    expect(value.monitoring[0]).toMatchObject({ dueDate: '2026-11-14' });
  });
});

describe('once-daily edetate keeps its clock time across the March change', () => {
  it('09:00 every day, 23 real hours on 29 March; two courses with 2 rest days; each calendar day holds one dose', () => {
    const value = planned('edetate-calcium-disodium-lead', { weightKg: 70, heightCm: 175, ageYears: 40, start: '2026-03-26T09:00' });
    expect(value.administrations.map((it) => `${it.at.localDate} ${it.at.localTime}`)).toEqual([
      '2026-03-26 09:00',
      '2026-03-27 09:00',
      '2026-03-28 09:00',
      '2026-03-29 09:00',
      '2026-03-30 09:00',
      '2026-04-02 09:00',
      '2026-04-03 09:00',
      '2026-04-04 09:00',
      '2026-04-05 09:00',
      '2026-04-06 09:00',
    ]);
    expect((value.administrations[3]!.at.epochMs - value.administrations[2]!.at.epochMs) / 3_600_000).toBe(23);
    expect(value.restDays).toEqual(['2026-03-31', '2026-04-01']);
    expect(value.dailyChecks[0]!.withinLimit).toBe(true);
    expect(value.offsetChanges[0]).toMatchObject({ localDate: '2026-03-29', shiftMinutes: 60 });
  });
});

describe('dimercaprol and edetate across the October change (PB-2205’s sizes)', () => {
  it('30 doses each over 5 days; the 25-hour 25 October holds seven 4-hourly edetate doses, but no 24 hours holds more than six', () => {
    const value = planned('dimercaprol-edetate-encephalopathy', { weightKg: 16, heightCm: 101, ageYears: 4, start: '2026-10-24T20:00', basis: 'mg-per-m2' });
    expect(value.phases.map((it) => [it.drug, it.administrations])).toEqual([
      ['dimercaprol', 30],
      ['calcium-disodium-edetate', 30],
    ]);
    expect(value.phases[0]!.last).toMatchObject({ localDate: '2026-10-29', localTime: '15:00' }); // 19:00Z + 116 h
    expect(value.phases[1]!.first).toMatchObject({ localDate: '2026-10-25', localTime: '00:00', utcOffset: '+01:00' });
    expect(value.phases[1]!.last).toMatchObject({ localDate: '2026-10-29', localTime: '19:00' }); // 19:00Z + 120 h
    const onTheLongDay = value.administrations.filter((it) => it.drug === 'calcium-disodium-edetate' && it.at.localDate === '2026-10-25');
    expect(onTheLongDay).toHaveLength(7);
    const check = value.dailyChecks[0]!;
    expect(check.largestMgIn24h / value.phases[1]!.dosePerAdministrationMg).toBeCloseTo(6, 9);
    expect(check.withinLimit).toBe(true);
  });
});

describe('edetate disodium refused by name (MMWR 2006;55:204)', () => {
  it('refuses edetate disodium however it is typed, and accepts calcium disodium edetate', () => {
    for (const typed of ['edetate disodium', 'Edetate Disodium', 'disodium edetate', 'Na2EDTA', 'EDTA disodium', 'edetate-disodium']) {
      expect(isEdetateDisodium(typed), typed).toBe(true);
      const resolved = resolveCourseRegimen(typed);
      expect(resolved.ok).toBe(false);
      if (!resolved.ok) {
        expect(resolved.issues[0]!.message).toContain('MMWR 2006;55:204');
        expect(resolved.issues[0]!.message).toContain('calcium disodium edetate');
        expect(resolved.issues[0]!.message).toContain(`"${typed}"`);
      }
    }
    for (const typed of ['calcium disodium edetate', 'edetate calcium disodium', 'edetate-calcium-disodium-lead']) {
      expect(isEdetateDisodium(typed), typed).toBe(false);
      expect(resolveCourseRegimen(typed).ok, typed).toBe(true);
    }
    const bare = resolveCourseRegimen('EDTA');
    expect(bare.ok).toBe(false);
    expect(!bare.ok && bare.issues[0]!.code).toBe('inconsistent');
  });
});

describe('trientine salt and base (references.md §7, §9: 300 mg dihydrochloride ≈ 200 mg base; 300 mg tetrahydrochloride ≈ 150 mg base)', () => {
  it('converts by the molar masses 146.24 / 219.15 / 292.07 g/mol', () => {
    const today = trientineSwitch('trientine-dihydrochloride', 300, 'trientine-tetrahydrochloride');
    expect(today.currentDailyBaseMg).toBeCloseTo(200.2, 1); // 300 × 146.24 / 219.15; §9 "≈ 200"
    expect(today.equivalentDailyMg).toBeCloseTo(200.2, 1); // the new product is dosed as base
    const back = trientineSwitch('trientine-tetrahydrochloride', 150, 'trientine-dihydrochloride');
    expect(back.equivalentDailyMg).toBeCloseTo((150 * 219.15) / 146.24, 0); // 224.8 mg of the dihydrochloride
  });

  it('catches a strength on the wrong basis with both figures, and accepts it on the printed basis', () => {
    const wrong = checkTrientineStrength('trientine-tetrahydrochloride', 150, 'salt');
    expect(wrong.ok).toBe(false);
    if (!wrong.ok) {
      expect(wrong.issues[0]!.code).toBe('wrong_basis');
      expect(wrong.issues[0]!.message).toContain('299.6 mg of trientine tetrahydrochloride'); // 150 × 292.07 / 146.24
      expect(wrong.issues[0]!.message).toContain('75.1 mg base'); // 150 × 146.24 / 292.07
    }
    expect(checkTrientineStrength('trientine-tetrahydrochloride', 150, 'base').ok).toBe(true);
    const capsule = checkTrientineStrength('trientine-dihydrochloride', 250, 'base');
    expect(!capsule.ok && capsule.issues[0]!.message).toContain('166.8 mg trientine base'); // 250 × 146.24 / 219.15
    expect(checkTrientineStrength('trientine-dihydrochloride', 250, 'salt').ok).toBe(true);
    expect(checkTrientineStrength('trientine-dihydrochloride', 300, 'salt').ok).toBe(false); // no 300 mg capsule
  });

  it('offers the nearest half tablets (scored tablet, SmPC §3) or whole capsules (swallowed whole) around an exact dose', () => {
    expect(unitsAround('trientine-tetrahydrochloride', 333.6)).toEqual([
      { units: 2, mg: 300 },
      { units: 2.5, mg: 375 },
    ]);
    expect(unitsAround('trientine-tetrahydrochloride', 300)).toEqual([{ units: 2, mg: 300 }]);
    expect(unitsAround('trientine-dihydrochloride', 600)).toEqual([
      { units: 2, mg: 500 },
      { units: 3, mg: 750 },
    ]);
  });
});

describe('units: urinary copper µg/24 h ↔ µmol/24 h through Ar(Cu) 63.546 (CIAAW), checked against UCUM', () => {
  it('agrees with ucum-lhc to 1e-9 relative', () => {
    for (const value of [50, 200, 500, 1600]) {
      const ours = urinaryCopperUmolPer24hFromUgPer24h(value as MicrogramsPer24h);
      expect(ours).toBeCloseTo(ucumConvert('ug/(24.h)', value, 'umol/(24.h)', 63.546), 9);
      expect(urinaryCopperUgPer24hFromUmolPer24h(ours as UmolPer24h)).toBeCloseTo(value, 9);
    }
    // EASL's target 200–500 µg ≈ 3–8 µmol per day (as reproduced): 3.1 and 7.9.
    expect(urinaryCopperUmolPer24hFromUgPer24h(200 as MicrogramsPer24h)).toBeCloseTo(3.15, 2);
    expect(urinaryCopperUmolPer24hFromUgPer24h(500 as MicrogramsPer24h)).toBeCloseTo(7.87, 2);
  });
});

describe('binding: stoichiometric ceiling beside pM', () => {
  it('edetate 1,000 mg binds at most 553.6 mg of lead (1 : 1, 374.27 g/mol, Ar(Pb) 207.2); pPb from the EDTA set as the chemistry engine computes it', () => {
    const row = courseBindingRow('calcium-disodium-edetate', 1000, 'lead');
    expect(row.stoichiometricCeilingMg).toBeCloseTo((1000 / 374.27) * 207.2, 1);
    expect(row.ceilingLabel).toContain('ceiling');
    expect(row.pm?.basis).toBe('computed');
    expect(row.pm?.pM).toBeCloseTo(pmComparisonAtPhysiologicalPh('Pb2+').find((it) => it.ligand === 'edta')!.pM!, 9);
  });

  it('succimer and zinc: no pM (protonation constants only; zinc is not a chelator)', () => {
    expect(courseBindingRow('succimer', 100, 'lead').pm?.basis).toBe('none');
    expect(courseBindingRow('zinc', 50, 'copper').stoichiometricCeilingMg).toBeNull();
    expect(courseBindingRow('dimercaprol', 64, 'lead').pm).toBeNull();
  });
});
