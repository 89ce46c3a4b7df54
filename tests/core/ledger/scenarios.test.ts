import { describe, expect, it } from 'vitest';
import { addDaysIso, addMonthsIso, daysBetween } from '../../../core/dates';
import { computeCase } from '../../../core/ledger/computeCase';
import { parseCase } from '../../../core/model/parseCase';
import { sc0781 } from '../safety/scenarioCases';

// Scenarios 4 and 6 of ../shared/scenarios.md, with invented records, checked by hand
// arithmetic with the standard method (volume × haematocrit × 1.08 mg/mL; Cohen, Glimm &
// Porter, Blood 2008) and the Angelucci relation (stores = 10.6 × LIC × weight).

function patient(label: string, weightKg: number, diagnosisGroup: string) {
  return {
    label,
    age: { kind: 'years-on-date', years: 26, onDate: '2026-11-20' },
    sexAtBirth: 'male',
    diagnosisGroup,
    pregnancy: { status: 'not-pregnant', recordedOn: null },
    weights: [{ date: '2025-01-01', weight: { value: weightKg, unit: 'kg' } }],
  };
}

function computed(json: unknown, asOf: string) {
  const parsed = parseCase(json);
  if (!parsed.ok) throw new Error(parsed.issues.map((it) => it.message).join('\n'));
  const result = computeCase(parsed.value, asOf, { samples: 100 });
  if (!result.ok) throw new Error('not computed');
  return result.value;
}

describe('scenario 4: SC-0781 on monthly automated red-cell exchange', () => {
  // The one SC-0781 fixture (tests/core/safety/scenarioCases.ts), shared with the safety rules' tests.
  const json = sc0781();
  const exchanges = json.transfusions as { date: string }[];

  it('nets to zero: 2000 mL × 0.60 in and 4000 mL × 0.30 out carry the same 1296 mg', () => {
    const results = computed(json, '2026-11-20');
    const inWindow = exchanges.filter((it) => it.date > addDaysIso('2026-11-20', -365) && it.date <= '2026-11-20').length;
    expect(results.intake.transfusedMg).toBeCloseTo(inWindow * 2000 * 0.6 * 1.08, 6);
    expect(results.intake.removedWithBloodMg).toBeCloseTo(inWindow * 4000 * 0.3 * 1.08, 6);
    expect(results.intake.netMg).toBeCloseTo(0, 6);
    expect(results.intake.mgPerKgPerDay).toBe(0);
  });

  it('refuses the 1.5 T calibration for the 3 T result, and flags ferritin as a poor marker here', () => {
    const results = computed(json, '2026-11-20');
    expect(results.bodyIron.lastMeasured).toBeNull();
    expect(results.notices.some((it) => it.severity === 'review' && it.text.includes('3 T'))).toBe(true);
    expect(results.ferritin.note).toContain('sickle cell disease');
    expect(results.notices.some((it) => it.text.includes('pre-procedure patient haematocrit'))).toBe(true);
  });
});

describe('scenario 6: TH-0158 venesection after transplant', () => {
  const asOf = '2026-11-20';
  // 6 mL/kg at 58 kg = 348 mL every 14 days, haematocrit 0.36: 348 × 0.36 × 1.08 = 135.3 mg each.
  const venesections = Array.from({ length: 29 }, (_, index) => ({
    id: `v${index}`,
    date: addDaysIso('2025-10-30', index * 14),
    kind: 'venesection',
    volumeRemoved: { value: 348, unit: 'mL' },
    patientHaematocrit: 0.36,
  })).filter((it) => it.date <= asOf);
  const json = {
    format: 'chelation-ledger.case',
    version: 1,
    patient: patient('TH-0158', 58, 'thalassaemia-major'),
    transfusions: venesections,
    results: [{ id: 'l1', date: asOf, kind: 'liver-iron', method: 'biopsy', measured: { value: 12, unit: 'mg/g{dry}' } }],
  };

  it('removes 135.3 mg per venesection and projects when LIC crosses 7 and 3', () => {
    const results = computed(json, asOf);
    const perVenesectionMg = 348 * 0.36 * 1.08;
    // The record starts before the trailing year, so the window is the full 365 days.
    const inYear = venesections.filter((it) => it.date > addDaysIso(asOf, -365)).length;
    expect(results.intake.windowDays).toBe(365);
    expect(results.intake.removedWithBloodMg).toBeCloseTo(inYear * perVenesectionMg, 6);
    const lossMgPerDay = (inYear * perVenesectionMg) / 365 + 1; // plus 1 mg/day basal loss
    const storesMg = 10.6 * 12 * 58;
    const firstMonthBelow = (lic: number) => {
      for (let months = 1; months <= 24; months += 1) {
        const days = daysBetween(asOf, addMonthsIso(asOf, months));
        if ((storesMg - days * lossMgPerDay) / (10.6 * 58) <= lic) return months;
      }
      return null;
    };
    const current = results.projection!.scenarios[0]!;
    expect(current.crossings.find((it) => it.thresholdMgPerGDry === 7)!.monthsAhead).toBe(firstMonthBelow(7));
    expect(current.crossings.find((it) => it.thresholdMgPerGDry === 3)!.monthsAhead).toBe(firstMonthBelow(3));
    // About 10 and 18 months: 3074 mg ÷ 10.6 mg/day and 5533 mg ÷ 10.6 mg/day.
    expect(firstMonthBelow(7)).toBeGreaterThanOrEqual(9);
    expect(firstMonthBelow(7)).toBeLessThanOrEqual(11);
  });
});
