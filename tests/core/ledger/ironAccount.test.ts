import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { addDaysIso } from '../../../core/dates';
import { computeIronAccount } from '../../../core/ledger/ironAccount';
import type { LedgerInput } from '../../../core/ledger/ledgerInput';
import { measuredResponses } from '../../../core/ledger/measuredResponse';

const base: LedgerInput = {
  asOf: '2026-03-31',
  movements: [],
  chelation: [],
  weights: [{ date: '2026-01-01', weightKg: 50 }],
  licMeasurements: [],
  basalLossMgPerDay: 1,
};

describe('iron account', () => {
  it('puts one transfusion in its month: 280 mL × 0.60 × 1.08 = 181.44 mg (hand arithmetic)', () => {
    const account = computeIronAccount({
      ...base,
      movements: [{ date: '2026-02-10', ironInMg: 181.44, ironOutMg: 0, ref: 't1' }],
    });
    expect(account.months.map((it) => it.month)).toEqual(['2026-02', '2026-03']);
    expect(account.months[0]!.transfusedInMg).toBeCloseTo(181.44, 9);
    // February 2026 from the 10th has 19 days of basal loss at 1 mg/day.
    expect(account.months[0]!.days).toBe(19);
    expect(account.months[0]!.netMg).toBeCloseTo(181.44 - 19, 9);
  });

  it('anchors body iron to a measured LIC by the Angelucci relation (10.6 × LIC × weight) and carries the balance forward', () => {
    // Angelucci et al., N Engl J Med 2000;343:327: stores (mg/kg) = 10.6 × LIC.
    // LIC 10 at 50 kg → 5300 mg. With no flows but 1 mg/day basal loss, 31 days later
    // the stores are 5269 mg and the LIC estimate 5269 / 530 = 9.9415 mg/g dry.
    const account = computeIronAccount({
      ...base,
      asOf: '2026-02-01',
      licMeasurements: [{ date: '2026-01-01', licMgPerGDry: 10, method: 'biopsy', ref: 'r1' }],
    });
    expect(account.bodyIronAtAsOfMg).toBeCloseTo(5300 - 31, 9);
    expect(account.licAtAsOfMgPerGDry).toBeCloseTo((5300 - 31) / 530, 9);
  });

  it('between two measured LICs the estimate meets the later one: the gap is spread evenly over the days between them', () => {
    // Hand arithmetic with the Angelucci relation (stores = 10.6 × LIC × weight, N Engl J Med 2000;343:327):
    // LIC 10 on 2026-01-01 at 50 kg → 5,300 mg; 1 mg/day basal loss and nothing else carries 5,300 − 90 = 5,210 mg
    // to 2026-04-01 (day 90), but LIC 12 is measured there → 6,360 mg: a gap of +1,150 mg over 90 days.
    // Month ends: 2026-01-31 is day 30 → 5,300 − 30 + 1,150 × 30/90 = 5,653.33 mg (LIC 10.667);
    // 2026-02-28 is day 58 → 5,300 − 58 + 1,150 × 58/90 = 5,983.11 mg; 2026-03-31 is day 89 → 5,211 + 1,137.22 = 6,348.22 mg.
    const account = computeIronAccount({
      ...base,
      asOf: '2026-04-30',
      licMeasurements: [
        { date: '2026-01-01', licMgPerGDry: 10, method: 'biopsy', ref: 'r1' },
        { date: '2026-04-01', licMgPerGDry: 12, method: 'biopsy', ref: 'r2' },
      ],
    });
    const byMonth = Object.fromEntries(account.months.map((it) => [it.month, it]));
    expect(byMonth['2026-01']!.bodyIronMg).toBeCloseTo(5300 - 30 + (1150 * 30) / 90, 6);
    expect(byMonth['2026-01']!.licEstimateMgPerGDry).toBeCloseTo((5300 - 30 + (1150 * 30) / 90) / 530, 9);
    expect(byMonth['2026-02']!.bodyIronMg).toBeCloseTo(5300 - 58 + (1150 * 58) / 90, 6);
    expect(byMonth['2026-03']!.bodyIronMg).toBeCloseTo(5300 - 89 + (1150 * 89) / 90, 6);
    // After the last measurement: carried forward only (29 days of basal loss from 6,360 mg).
    expect(byMonth['2026-04']!.bodyIronMg).toBeCloseTo(6360 - 29, 6);
    // The flows are untouched.
    expect(account.months.reduce((sum, it) => sum + it.netMg, 0)).toBeCloseTo(-(31 + 28 + 31 + 30), 9);
  });

  it('sums of the months equal the sums of the records (property, fast-check)', () => {
    fc.assert(
      fc.property(
        fc.array(
          fc.record({ day: fc.integer({ min: 0, max: 700 }), ironInMg: fc.double({ min: 0, max: 500, noNaN: true }), ironOutMg: fc.double({ min: 0, max: 300, noNaN: true }) }),
          { maxLength: 40 },
        ),
        fc.double({ min: 0, max: 80, noNaN: true }),
        (records, removalMgPerDay) => {
          const input: LedgerInput = {
            ...base,
            asOf: '2026-12-31',
            movements: records.map((it, index) => ({ date: addDaysIso('2025-01-01', it.day), ironInMg: it.ironInMg, ironOutMg: it.ironOutMg, ref: `m${index}` })),
            chelation: [{ id: 'c', label: 'c', drug: 'deferasirox', start: '2025-01-01', end: null, expectedRemovalMgPerDay: () => removalMgPerDay }],
          };
          const account = computeIronAccount(input);
          const totalIn = account.months.reduce((sum, it) => sum + it.transfusedInMg, 0);
          const totalOut = account.months.reduce((sum, it) => sum + it.removedWithBloodMg, 0);
          const totalDays = account.months.reduce((sum, it) => sum + it.days, 0);
          const chelation = account.months.reduce((sum, it) => sum + it.chelationOutMg, 0);
          const recordsIn = records.reduce((sum, it) => sum + it.ironInMg, 0);
          const recordsOut = records.reduce((sum, it) => sum + it.ironOutMg, 0);
          // Floating-point sums of up to 40 values below 500: 1e-6 mg is far below any clinical meaning.
          expect(Math.abs(totalIn - recordsIn)).toBeLessThan(1e-6);
          expect(Math.abs(totalOut - recordsOut)).toBeLessThan(1e-6);
          expect(totalDays).toBe(730);
          expect(Math.abs(chelation - removalMgPerDay * 730)).toBeLessThan(1e-6);
        },
      ),
      { numRuns: 60, seed: 20261201 },
    );
  });
});

describe('measured response between LIC results', () => {
  it('recovers the removal built into a synthetic record (intake − 10.6 × ΔLIC × weight − basal)', () => {
    // A synthetic patient at a constant 50 kg: 10 mg/day transfused (about 0.2 mg/kg/day,
    // Brittenham 2011's lowest intake band) and a regimen removing 15 mg/day. Over 365
    // days: intake 3650 mg, removal 5475 mg, basal 365 mg → stores fall 2190 mg, i.e.
    // ΔLIC = −2190 / 530 = −4.132 mg/g dry. Given those two LICs, the method must
    // return exactly the 5475 mg that was put in.
    const movements = Array.from({ length: 365 }, (_, day) => ({ date: addDaysIso('2025-01-02', day), ironInMg: 10, ironOutMg: 0, ref: `d${day}` }));
    const chelation = [{ id: 'c', label: 'test regimen', drug: 'deferasirox', start: '2025-01-01', end: null, expectedRemovalMgPerDay: () => 15 }];
    const lics = [
      { date: '2025-01-01', licMgPerGDry: 12, method: 'MRI', ref: 'a' },
      { date: '2026-01-01', licMgPerGDry: 12 - 2190 / 530, method: 'MRI', ref: 'b' },
    ];
    const account = computeIronAccount({ ...base, asOf: '2026-01-01', weights: [{ date: '2025-01-01', weightKg: 50 }], movements, chelation, licMeasurements: lics });
    const [response] = measuredResponses(account, lics, chelation);
    expect(response!.days).toBe(365);
    expect(response!.intakeMg).toBeCloseTo(3650, 6);
    expect(response!.measuredChelationMg).toBeCloseTo(5475, 6);
    expect(response!.expectedChelationMg).toBeCloseTo(5475, 6);
    expect(response!.measuredToExpectedRatio).toBeCloseTo(1, 9);
    expect(response!.measuredChelationMgPerKgPerDay).toBeCloseTo(0.3, 9);
    expect(response!.caveats).toEqual([]);
  });

  it('flags a short interval, a change of method and a change of regimen', () => {
    const chelation = [
      { id: 'a', label: 'deferoxamine', drug: 'deferoxamine', start: '2025-01-01', end: '2025-02-14', expectedRemovalMgPerDay: () => 10 },
      { id: 'b', label: 'deferasirox', drug: 'deferasirox', start: '2025-02-15', end: null, expectedRemovalMgPerDay: () => 12 },
    ];
    const lics = [
      { date: '2025-01-01', licMgPerGDry: 8, method: 'biopsy', ref: 'a' },
      { date: '2025-04-01', licMgPerGDry: 7.5, method: 'MRI R2* 1.5 T', ref: 'b' },
    ];
    const account = computeIronAccount({ ...base, asOf: '2025-04-01', chelation, licMeasurements: lics });
    const [response] = measuredResponses(account, lics, chelation);
    expect(response!.caveats).toEqual(['short-interval', 'method-changed', 'regimen-changed']);
    expect(response!.caveatText.join(' ')).toContain('90 days, under 180');
  });
});
