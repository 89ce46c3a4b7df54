import { describe, expect, it } from 'vitest';
import { transfusionVolume, transfusionVolumeForHbRiseMl } from '../../../core/iron';
import { runFormula } from '../../../core/formulas/run';
import { fraction, gPerDl, kg } from '../../../core/units/quantity';

describe('volume for a haemoglobin rise (Davies et al., Transfusion 2007;47:212)', () => {
  it('matches the worked example: 20 kg, rise 3 g/dL, unit haematocrit 0.6 → 300 mL', () => {
    // volume = weight × rise × 3 / haematocrit = 20 × 3 × 3 / 0.6 = 300 mL (exact; tolerance 1e-9).
    expect(transfusionVolumeForHbRiseMl(kg(20), gPerDl(3), fraction(0.6))).toBeCloseTo(300, 9);
  });

  it('reproduces the gradient Davies et al. measured: 5.02 mL/kg per g/dL with units of haematocrit about 0.6', () => {
    // The formula at 0.6 gives 5 mL/kg per g/dL; their regression gradient was 5.02.
    // Tolerance 1 %: the gradient is printed to three figures and the units ranged 0.55–0.65.
    const perKgPerGPerDl = transfusionVolumeForHbRiseMl(kg(1), gPerDl(1), fraction(0.6));
    expect(Math.abs(perKgPerGPerDl - 5.02) / 5.02).toBeLessThan(0.01);
  });

  it('runs as the calculator transfusion-volume, with the volume per kg', () => {
    const run = runFormula(transfusionVolume, { weightKg: 14, haemoglobinRiseGPerDl: 2.5, unitHaematocrit: 0.58 });
    expect(run.ok).toBe(true);
    if (!run.ok) return;
    // 14 × 2.5 × 3 / 0.58 = 181.0345 mL; 12.931 mL/kg.
    expect(run.value.outputs.volumeMl).toBeCloseTo(181.0345, 4);
    expect(run.value.outputs.volumeMlPerKg).toBeCloseTo(12.931, 3);
  });

  it('rises with weight and rise and falls with the unit haematocrit (monotonicity)', () => {
    const base = transfusionVolumeForHbRiseMl(kg(20), gPerDl(2), fraction(0.6));
    expect(transfusionVolumeForHbRiseMl(kg(25), gPerDl(2), fraction(0.6))).toBeGreaterThan(base);
    expect(transfusionVolumeForHbRiseMl(kg(20), gPerDl(3), fraction(0.6))).toBeGreaterThan(base);
    expect(transfusionVolumeForHbRiseMl(kg(20), gPerDl(2), fraction(0.7))).toBeLessThan(base);
  });

  it('refuses a unit haematocrit typed as a percentage', () => {
    const run = runFormula(transfusionVolume, { weightKg: 20, haemoglobinRiseGPerDl: 3, unitHaematocrit: 60 });
    expect(run.ok).toBe(false);
    if (run.ok) return;
    expect(run.issues[0]).toMatchObject({ code: 'out_of_range', path: ['unitHaematocrit'] });
    expect(run.issues[0]?.message).toContain('enter it as a fraction (0.6)');
  });
});
