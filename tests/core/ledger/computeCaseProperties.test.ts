import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { addDaysIso } from '../../../core/dates';
import { computeCase } from '../../../core/ledger/computeCase';
import { derivationsOf } from '../../../core/report/derivationIndex';
import { parseCase } from '../../../core/model/parseCase';

// Random valid cases of every record kind: the review must compute, stay finite, and keep
// its accounts closed (months sum to the record). No outside reference is needed for
// these invariants: they follow from conservation of mass (iron in − iron out = change).
const day = fc.integer({ min: 0, max: 900 });
const transfusion = fc.oneof(
  fc.record({ kind: fc.constant('simple'), day, volume: fc.integer({ min: 150, max: 700 }), haematocrit: fc.option(fc.double({ min: 0.5, max: 0.7, noNaN: true }), { nil: null }) }),
  fc.record({ kind: fc.constant('exchange'), day, volume: fc.integer({ min: 1000, max: 3000 }), haematocrit: fc.double({ min: 0.5, max: 0.7, noNaN: true }), removed: fc.integer({ min: 1000, max: 4500 }), patientHct: fc.double({ min: 0.2, max: 0.4, noNaN: true }) }),
  fc.record({ kind: fc.constant('venesection'), day, removed: fc.integer({ min: 100, max: 500 }), patientHct: fc.double({ min: 0.3, max: 0.45, noNaN: true }) }),
);
const period = fc.oneof(
  fc.record({ drug: fc.constant('deferasirox'), formulation: fc.constantFrom('dispersible-tablet', 'film-coated-tablet'), route: fc.constant('oral'), dose: fc.integer({ min: 7, max: 28 }), perDay: fc.constant(1), days: fc.constant(7) }),
  fc.record({ drug: fc.constant('deferiprone'), formulation: fc.constant('tablet'), route: fc.constant('oral'), dose: fc.integer({ min: 15, max: 33 }), perDay: fc.constant(3), days: fc.constant(7) }),
  fc.record({ drug: fc.constant('deferoxamine'), formulation: fc.constant('vial'), route: fc.constant('subcutaneous'), dose: fc.integer({ min: 20, max: 50 }), perDay: fc.constant(1), days: fc.integer({ min: 3, max: 7 }) }),
);

const arbitraryCase = fc.record({
  transfusions: fc.array(transfusion, { maxLength: 25 }),
  periods: fc.array(fc.record({ spec: period, start: day, length: fc.integer({ min: 30, max: 600 }), adherence: fc.double({ min: 0.3, max: 1, noNaN: true }) }), { maxLength: 3 }),
  lics: fc.array(fc.record({ day, lic: fc.double({ min: 0.5, max: 30, noNaN: true }) }), { maxLength: 4 }),
  weight: fc.integer({ min: 15, max: 90 }),
});

type CaseInput = typeof arbitraryCase extends fc.Arbitrary<infer Value> ? Value : never;

function toJson(input: CaseInput) {
  const date = (offset: number) => addDaysIso('2024-01-01', offset);
  return {
    format: 'chelation-ledger.case',
    version: 1,
    patient: {
      label: 'XX-0002',
      age: { kind: 'years-on-date', years: 25, onDate: '2024-01-01' },
      sexAtBirth: 'female',
      diagnosisGroup: 'thalassaemia-major',
      pregnancy: { status: 'not-pregnant', recordedOn: null },
      weights: [{ date: '2024-01-01', weight: { value: input.weight, unit: 'kg' } }],
    },
    transfusions: input.transfusions.map((it, index) =>
      it.kind === 'simple'
        ? { id: `t${index}`, date: date(it.day), kind: 'simple', volume: { value: it.volume, unit: 'mL' }, unitHaematocrit: it.haematocrit, unitCount: 1 }
        : it.kind === 'exchange'
          ? { id: `t${index}`, date: date(it.day), kind: 'exchange', method: 'automated', volumeIn: { value: it.volume, unit: 'mL' }, unitHaematocrit: it.haematocrit, unitCount: 8, volumeRemoved: { value: it.removed, unit: 'mL' }, patientHaematocrit: it.patientHct }
          : { id: `t${index}`, date: date(it.day), kind: 'venesection', volumeRemoved: { value: it.removed, unit: 'mL' }, patientHaematocrit: it.patientHct },
    ),
    results: input.lics.map((it, index) => ({ id: `l${index}`, date: date(it.day), kind: 'liver-iron', method: 'biopsy', measured: { value: it.lic, unit: 'mg/g{dry}' } })),
    chelationPeriods: input.periods.map((it, index) => ({
      id: `c${index}`,
      drug: it.spec.drug,
      formulation: it.spec.formulation,
      route: it.spec.route,
      dose: { value: it.spec.dose, unit: 'mg/kg' },
      administrationsPerDay: it.spec.perDay,
      daysPerWeek: it.spec.days,
      startDate: date(it.start),
      endDate: date(it.start + it.length),
      adherence: Math.round(it.adherence * 100) / 100,
    })),
  };
}

describe('computeCase over random valid cases (fast-check)', () => {
  it('computes finite results whose months sum to the record, for every record kind', () => {
    fc.assert(
      fc.property(arbitraryCase, (input) => {
        const parsed = parseCase(toJson(input));
        if (!parsed.ok) return; // overlapping periods of one drug etc. are the model's business
        const result = computeCase(parsed.value, '2026-06-30', { samples: 50, horizonMonths: 12 });
        expect(result.ok).toBe(true);
        if (!result.ok) return;
        const months = result.value.months;
        const inMg = months.reduce((sum, it) => sum + it.transfusedInMg - it.removedWithBloodMg, 0);
        expect(inMg).toBeCloseTo(result.value.intake.cumulativeNetMg, 6);
        for (const month of months) {
          expect(Number.isFinite(month.netMg)).toBe(true);
          if (month.licEstimateMgPerGDry !== null) expect(Number.isFinite(month.licEstimateMgPerGDry)).toBe(true);
        }
        for (const scenario of result.value.projection?.scenarios ?? []) {
          for (const month of scenario.months) {
            expect(month.licP10).toBeLessThanOrEqual(month.licP90);
            expect(month.licMgPerGDry).toBeGreaterThanOrEqual(0);
          }
        }
        expect(derivationsOf(result.value).length).toBeGreaterThan(0);
      }),
      { numRuns: 80, seed: 11 },
    );
    // 80 random reviews take about 4 s on an idle core; the machine is shared by many sessions,
    // so the timeout is generous. It bounds a hang, it asserts no speed (speed lives in npm run bench).
  }, 30_000);
});
