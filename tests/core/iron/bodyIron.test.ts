import { createRequire } from 'node:module';
import { describe, expect, it } from 'vitest';
import {
  angelucciSlopeMgPerKgPerMgPerGDry,
  bodyIron,
  bodyIronMgFromLic,
  bodyIronMgPerKgFromLic,
  licChange,
  licChangeMgPerGDry,
  licFromBodyIron,
  licFromBodyIronMgPerKg,
  licUnits,
} from '../../../core/iron';
import { runFormula } from '../../../core/formulas/run';
import { kg, mgPerGDry, mgPerKg } from '../../../core/units/quantity';

/** ucum-lhc (NLM's UCUM implementation) as the outside reference for the µmol conversion; no types ship with it. */
const ucum = (createRequire(import.meta.url)('@lhncbc/ucum-lhc') as {
  UcumLhcUtils: { getInstance(): { convertUnitTo(from: string, value: number, to: string, options?: { molecularWeight?: number }): { status: string; toVal: number | null } } };
}).UcumLhcUtils.getInstance();

describe('Angelucci relation (Angelucci et al., N Engl J Med 2000;343:327)', () => {
  it('uses the printed slope 10.6 mg/kg per mg/g dry', () => {
    expect(angelucciSlopeMgPerKgPerMgPerGDry).toBe(10.6);
    // "Total body iron stores (mg/kg) = 10.6 × LIC (mg/g dry)": LIC 10 → 106 mg/kg, exact to rounding.
    expect(bodyIronMgPerKgFromLic(mgPerGDry(10))).toBeCloseTo(106, 10);
  });

  it('gives the total for scenario TH-0417 (LIC 11.4, 52 kg) and runs as body-iron', () => {
    // 10.6 × 11.4 × 52 = 6283.68 mg; tolerance floating-point only.
    expect(bodyIronMgFromLic(mgPerGDry(11.4), kg(52))).toBeCloseTo(6283.68, 8);
    const run = runFormula(bodyIron, { licMgPerGDry: 11.4, weightKg: 52 });
    expect(run.ok).toBe(true);
    if (!run.ok) return;
    expect(run.value.outputs.bodyIronMgPerKg).toBeCloseTo(120.84, 10);
    expect(run.value.outputs.bodyIronMg).toBeCloseTo(6283.68, 8);
    expect(run.value.derivation.sourceIds).toContain('angelucci-2000');
  });

  it('puts the validated upper end, 250 mg/kg, at LIC about 23.6 mg/g dry (lic-from-body-iron)', () => {
    // Angelucci: reliable to about 250 mg/kg; 250 / 10.6 = 23.58.
    const run = runFormula(licFromBodyIron, { bodyIronMgPerKg: 250 });
    expect(run.ok && run.value.outputs.licMgPerGDry).toBeCloseTo(23.5849, 4);
  });

  it('round-trips LIC → body iron → LIC', () => {
    for (const lic of [0, 0.9, 1.8, 3, 7, 11.4, 15, 23.6, 43]) {
      expect(licFromBodyIronMgPerKg(bodyIronMgPerKgFromLic(mgPerGDry(lic)))).toBeCloseTo(lic, 12);
    }
  });

  it('is strictly increasing in LIC (monotonicity)', () => {
    const values = [0, 1, 2, 5, 10, 20, 40].map((lic) => bodyIronMgPerKgFromLic(mgPerGDry(lic)));
    for (let index = 1; index < values.length; index += 1) expect(values[index]!).toBeGreaterThan(values[index - 1]!);
  });
});

describe('change of LIC from a net iron balance', () => {
  it('matches the doc example: −53 mg/kg → −5 mg/g dry', () => {
    expect(licChangeMgPerGDry(mgPerKg(-53))).toBeCloseTo(-5, 12);
  });

  it('runs as lic-change: 0.3 mg/kg/day for 365 days raises LIC by about 10.3 mg/g dry', () => {
    // Hand arithmetic: net 0.3 × 365 = 109.5 mg/kg; ÷ 10.6 (Angelucci 2000) = 10.3302 mg/g dry.
    const run = runFormula(licChange, { netIronMgPerKgPerDay: 0.3, periodDays: 365 });
    expect(run.ok).toBe(true);
    if (!run.ok) return;
    expect(run.value.outputs.netIronMgPerKg).toBeCloseTo(109.5, 10);
    expect(run.value.outputs.licChangeMgPerGDry).toBeCloseTo(10.3302, 4);
  });

  it('is signed: more iron out than in lowers the LIC, balance 0 keeps it', () => {
    const falling = runFormula(licChange, { netIronMgPerKgPerDay: -0.2, periodDays: 180 });
    expect(falling.ok && falling.value.outputs.licChangeMgPerGDry).toBeLessThan(0);
    const even = runFormula(licChange, { netIronMgPerKgPerDay: 0, periodDays: 180 });
    expect(even.ok && even.value.outputs.licChangeMgPerGDry).toBe(0);
  });

  it('agrees with the difference of two body-iron states (the relation has no intercept)', () => {
    const before = bodyIronMgPerKgFromLic(mgPerGDry(9.8));
    const after = bodyIronMgPerKgFromLic(mgPerGDry(11.4));
    expect(licChangeMgPerGDry(mgPerKg(after - before))).toBeCloseTo(1.6, 12);
  });
});

describe('LIC units', () => {
  it('converts 1 mg/g dry to 17.907 µmol/g dry with CIAAW Ar(Fe) = 55.845, as UCUM does', () => {
    // CIAAW 2021: Ar(Fe) = 55.845(2); 1000 / 55.845 = 17.9067. Outside reference: ucum-lhc with
    // molecular weight 55.845. Tolerance 1e-9: both are exact arithmetic on the same weight.
    const reference = ucum.convertUnitTo('mg/g', 1, 'umol/g', { molecularWeight: 55.845 });
    expect(reference.status).toBe('succeeded');
    const run = runFormula(licUnits, { licMgPerGDry: 1 });
    expect(run.ok).toBe(true);
    if (!run.ok) return;
    expect(run.value.outputs.licUmolPerGDry).toBeCloseTo(reference.toVal!, 9);
    expect(run.value.outputs.licUmolPerGDry).toBeCloseTo(17.907, 3);
  });

  it('converts dry to wet with the published factor 3.33 (Fischer & Harmatz 2009) taken from the assumption', () => {
    const run = runFormula(licUnits, { licMgPerGDry: 3.33 });
    expect(run.ok).toBe(true);
    if (!run.ok) return;
    expect(run.value.outputs.licMgPerGWet).toBeCloseTo(1, 12);
    expect(run.value.derivation.inputs.find((it) => it.name === 'dryToWetRatio')?.origin).toMatchObject({
      kind: 'assumption',
      assumptionId: 'liver-dry-to-wet-ratio',
    });
  });

  it('round-trips from each unit back to the same value', () => {
    for (const [name, value] of [['licUmolPerGDry', 204.1], ['licMgPerGWet', 2.9], ['licMgPerGDry', 15]] as const) {
      const run = runFormula(licUnits, { [name]: value });
      expect(run.ok, name).toBe(true);
      if (!run.ok) return;
      expect(run.value.outputs[name]).toBeCloseTo(value, 10);
    }
  });

  it('refuses none or several values at once', () => {
    const none = runFormula(licUnits, {});
    expect(none.ok).toBe(false);
    if (!none.ok) expect(none.issues[0]?.code).toBe('required');
    const both = runFormula(licUnits, { licMgPerGDry: 5, licUmolPerGDry: 90 });
    expect(both.ok).toBe(false);
    if (!both.ok) expect(both.issues[0]).toMatchObject({ code: 'inconsistent', path: ['licUmolPerGDry'] });
  });
});
