import { describe, expect, it } from 'vitest';
import {
  deferoxamineTherapeuticIndex,
  deferoxamineTherapeuticIndexAboveLimit,
  deferoxamineTherapeuticIndexLimit,
  meanDailyDeferoxamineDoseMgPerKg,
} from '../../../core/chelators';
import { mgPerKg, ugPerL } from '../../../core/units/quantity';

// Porter et al., Br J Haematol 1989;73:403 (abstract): index = mean daily dose (mg/kg) ÷ serum ferritin
// (µg/L); "a ratio of greater than 0.025" marks a risk of sensorineural hearing loss. Mean daily dose =
// weekly dose ÷ 7 is common practice (the abstract does not define it).
describe('deferoxamine therapeutic index', () => {
  it('TH-0093 (scenarios.md §3): 40 mg/kg on 5 nights, ferritin 1900 then 1250 µg/L', () => {
    // Hand arithmetic: 40 × 5 / 7 = 28.571 mg/kg/day; ÷ 1900 = 0.01504; ÷ 1250 = 0.02286; the index would
    // reach 0.025 at a ferritin of 28.571 / 0.025 = 1142.9 µg/L. Tolerance: the fifth decimal of the hand figures.
    const meanDaily = meanDailyDeferoxamineDoseMgPerKg(mgPerKg(40), 5);
    expect(meanDaily).toBeCloseTo(28.571, 3);
    expect(deferoxamineTherapeuticIndex(meanDaily, ugPerL(1900))).toBeCloseTo(0.01504, 5);
    expect(deferoxamineTherapeuticIndex(meanDaily, ugPerL(1250))).toBeCloseTo(0.02286, 5);
    expect(meanDaily / deferoxamineTherapeuticIndexLimit).toBeCloseTo(1142.9, 1);
  });

  it('flags strictly above 0.025, on both sides of the boundary', () => {
    // 35 mg/kg on 5 nights = 25 mg/kg/day exactly (175 / 7 is exact in binary floating point); ÷ 1000 µg/L is
    // the double nearest 0.025, the same double as the literal. So exactly 0.025 is not flagged ("greater
    // than"), and one µg/L either side moves the index across.
    const meanDaily = meanDailyDeferoxamineDoseMgPerKg(mgPerKg(35), 5);
    expect(meanDaily).toBe(25);
    const atLimit = deferoxamineTherapeuticIndex(meanDaily, ugPerL(1000));
    expect(atLimit).toBe(0.025);
    expect(deferoxamineTherapeuticIndexAboveLimit(atLimit)).toBe(false);
    expect(deferoxamineTherapeuticIndexAboveLimit(deferoxamineTherapeuticIndex(meanDaily, ugPerL(999)))).toBe(true);
    expect(deferoxamineTherapeuticIndexAboveLimit(deferoxamineTherapeuticIndex(meanDaily, ugPerL(1001)))).toBe(false);
  });

  it('rises as ferritin falls at a fixed dose (monotonic)', () => {
    const meanDaily = meanDailyDeferoxamineDoseMgPerKg(mgPerKg(40), 5);
    const ferritins = [3000, 2000, 1500, 1000, 500];
    const indices = ferritins.map((ferritin) => deferoxamineTherapeuticIndex(meanDaily, ugPerL(ferritin)));
    for (let step = 1; step < indices.length; step += 1) expect(indices[step]!).toBeGreaterThan(indices[step - 1]!);
  });
});
