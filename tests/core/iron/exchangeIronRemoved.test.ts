import { describe, expect, it } from 'vitest';
import { exchangeIronRemoved, exchangeIronRemovedMg, transfusionIronMg } from '../../../core/iron';
import { runFormula } from '../../../core/formulas/run';
import { fraction, mgPerMl, ml } from '../../../core/units/quantity';

describe('iron removed by a red-cell exchange or a venesection', () => {
  it('matches hand arithmetic for scenario SC-0781: 4000 mL × 0.30 × 1.08 = 1296 mg', () => {
    // Standard method (references.md §1): volume × patient haematocrit × iron per mL.
    // Exact decimal product; floating-point error only (1e-9).
    expect(exchangeIronRemovedMg(ml(4000), fraction(0.3), mgPerMl(1.08))).toBeCloseTo(1296, 9);
  });

  it('gives a net loss for an automated exchange that removes more red cells than it gives (design.md §5)', () => {
    // 2000 mL at 0.60 in (1200 mL red cells) against 4000 mL at 0.30 out (1200 mL red cells):
    // the same red-cell volume, so net iron is exactly 0; with 0.32 out it turns negative.
    const even = runFormula(exchangeIronRemoved, { volumeRemovedMl: 4000, patientHaematocrit: 0.3, donorVolumeMl: 2000, unitHaematocrit: 0.6 });
    expect(even.ok && even.value.outputs.netIronMg).toBeCloseTo(0, 9);
    const negative = runFormula(exchangeIronRemoved, { volumeRemovedMl: 4000, patientHaematocrit: 0.32, donorVolumeMl: 2000, unitHaematocrit: 0.6 });
    expect(negative.ok).toBe(true);
    if (!negative.ok) return;
    expect(negative.value.outputs.netIronMg).toBeLessThan(0);
    expect(negative.value.outputs.netIronMg).toBeCloseTo(1200 * 1.08 - 1280 * 1.08, 9);
  });

  it('gives iron removed and no iron in for a venesection (scenario TH-0158: 6 mL/kg × 58 kg at 0.36)', () => {
    // Hand arithmetic: 348 mL × 0.36 × 1.08 = 135.3024 mg (floating-point tolerance 1e-9).
    const run = runFormula(exchangeIronRemoved, { volumeRemovedMl: 348, patientHaematocrit: 0.36 });
    expect(run.ok).toBe(true);
    if (!run.ok) return;
    expect(run.value.outputs.ironRemovedMg).toBeCloseTo(135.3024, 9);
    expect(run.value.outputs.ironTransfusedMg).toBe(0);
    expect(run.value.outputs.netIronMg).toBeCloseTo(-135.3024, 9);
  });

  it('gives 200–250 mg for a 500 mL venesection at a normal haematocrit', () => {
    // Haemochromatosis guidance (EASL clinical practice guidelines 2010; from memory) states
    // that a 400–500 mL venesection removes about 200–250 mg of iron. A 500 mL venesection at
    // haematocrit 0.40–0.45 gives 216–243 mg at 1.08 mg/mL. Tolerance: the quoted range itself.
    for (const haematocrit of [0.4, 0.42, 0.45]) {
      const ironMg = exchangeIronRemovedMg(ml(500), fraction(haematocrit), mgPerMl(1.08));
      expect(ironMg).toBeGreaterThanOrEqual(200);
      expect(ironMg).toBeLessThanOrEqual(250);
    }
  });

  it('is the transfusion arithmetic with other roles (one idea, one function)', () => {
    for (const [volume, haematocrit] of [[250, 0.2], [500, 0.45], [4500, 0.3]] as const) {
      expect(exchangeIronRemovedMg(ml(volume), fraction(haematocrit), mgPerMl(1.16))).toBe(
        transfusionIronMg(ml(volume), fraction(haematocrit), mgPerMl(1.16)),
      );
    }
  });

  it('refuses a patient haematocrit typed as a percentage and suggests the fraction', () => {
    const run = runFormula(exchangeIronRemoved, { volumeRemovedMl: 4000, patientHaematocrit: 30 });
    expect(run.ok).toBe(false);
    if (run.ok) return;
    expect(run.issues).toHaveLength(1);
    expect(run.issues[0]).toMatchObject({ code: 'out_of_range', path: ['patientHaematocrit'] });
    expect(run.issues[0]?.message).toBe('Patient haematocrit 30 is outside the plausible range 0.15–0.65; enter it as a fraction (0.3).');
  });
});
