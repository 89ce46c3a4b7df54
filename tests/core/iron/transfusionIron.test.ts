import { describe, expect, it } from 'vitest';
import { transfusionIron } from '../../../core/iron/formulas';
import { transfusionIronMg } from '../../../core/iron/transfusionIron';
import { runFormula } from '../../../core/formulas/run';
import { fraction, mgPerMl, ml } from '../../../core/units/quantity';

describe('transfusion iron', () => {
  it('gives 200–250 mg for a unit of packed cells (Hoffbrand, Taher & Cappellini, Blood 2012;120:3657)', () => {
    // A typical unit: 250–350 mL at haematocrit 0.55–0.65. The published range is
    // "about 200–250 mg per unit"; a central unit (300 mL, 0.65 → 195 mL red cells)
    // at 1.08 mg/mL gives 210.6 mg. Tolerance: the published range itself.
    const ironMg = transfusionIronMg(ml(300), fraction(0.65), mgPerMl(1.08));
    expect(ironMg).toBeGreaterThanOrEqual(200);
    expect(ironMg).toBeLessThanOrEqual(250);
  });

  it('matches hand arithmetic: 280 mL × 0.60 × 1.08 = 181.44 mg', () => {
    // Exact product of three decimals; floating-point error only (1e-9).
    expect(transfusionIronMg(ml(280), fraction(0.6), mgPerMl(1.08))).toBeCloseTo(181.44, 9);
  });

  it('takes 1.08 mg/mL from the published assumption when not given, and records it in the derivation', () => {
    const result = runFormula(transfusionIron, { volumeMl: 280, unitHaematocrit: 0.6 });
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.value.outputs.ironMg).toBeCloseTo(181.44, 9);
    const assumed = result.value.derivation.inputs.find((it) => it.name === 'ironPerMlRedCellsMg');
    expect(assumed?.origin).toEqual({ kind: 'assumption', assumptionId: 'iron-per-ml-red-cells', overridden: false });
  });

  it('shows an overridden assumption with its reason', () => {
    const result = runFormula(
      transfusionIron,
      { volumeMl: 280, unitHaematocrit: 0.6 },
      { overrides: { 'iron-per-ml-red-cells': { value: 1.16, reason: 'local protocol', by: 'AB' } } },
    );
    expect(result.ok && result.value.outputs.ironMg).toBeCloseTo(194.88, 9);
    const assumed = result.ok ? result.value.derivation.inputs.find((it) => it.name === 'ironPerMlRedCellsMg') : undefined;
    expect(assumed?.origin).toMatchObject({ kind: 'assumption', overridden: true, reason: 'local protocol', by: 'AB' });
  });

  it('refuses a haematocrit typed as a percentage and suggests the fraction', () => {
    const result = runFormula(transfusionIron, { volumeMl: 280, unitHaematocrit: 60 });
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.issues[0]?.code).toBe('out_of_range');
    expect(result.issues[0]?.path).toEqual(['unitHaematocrit']);
    expect(result.issues[0]?.message).toBe(
      'Unit haematocrit 60 is outside the plausible range 0.4–0.85; enter it as a fraction (0.6).',
    );
  });

  it('does not mutate its raw inputs', () => {
    const raw = Object.freeze({ volumeMl: 280, unitHaematocrit: 0.6 });
    expect(runFormula(transfusionIron, raw).ok).toBe(true);
    expect(raw).toEqual({ volumeMl: 280, unitHaematocrit: 0.6 });
  });
});
