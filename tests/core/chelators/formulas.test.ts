import { describe, expect, it } from 'vitest';
import {
  bindingCapacity,
  chelatorsFormulas,
  deferasiroxFormulation,
  deferoxamineTherapeuticIndexFormula,
  expectedExcretion,
  saltToBase,
} from '../../../core/chelators';
import { findFormula } from '../../../core/catalogue';
import { runFormula } from '../../../core/formulas/run';

function outputsOf<T>(result: { ok: true; value: { outputs: T } } | { ok: false; issues: readonly unknown[] }): T {
  if (!result.ok) throw new Error(JSON.stringify(result.issues));
  return result.value.outputs;
}

describe('chelators calculators through runFormula', () => {
  it('are all in the formula catalogue under their ids', () => {
    expect(chelatorsFormulas.map((it) => it.id)).toEqual([
      'binding-capacity',
      'expected-excretion',
      'salt-to-base',
      'deferasirox-formulation',
      'deferoxamine-therapeutic-index',
    ]);
    for (const formula of chelatorsFormulas) expect(findFormula(formula.id)).toBe(formula);
  });

  it('binding-capacity: deferiprone 25 mg/kg for 61 kg (TH-0322, scenarios.md §5) binds ≈ 204 mg Fe', () => {
    // 25 × 61 = 1525 mg × 133.77 mg Fe/g (Poggiali Table I arithmetic) / 1000 = 204.0 mg. Tolerance 0.1 mg
    // (the hand figure's four significant figures).
    const outputs = outputsOf(runFormula(bindingCapacity, { chelatorForm: 'deferiprone', doseMgPerKg: 25, weightKg: 61 }));
    expect(outputs.doseMg).toBe(1525);
    expect(Math.abs(outputs.metalMg - 204.0)).toBeLessThan(0.1);
    expect(Math.abs(outputs.capacityMgPerG - 133.77)).toBeLessThan(0.01);
  });

  it('binding-capacity: refuses a metal the chelator is not catalogued for', () => {
    const result = runFormula(bindingCapacity, { chelatorForm: 'deferasirox', metal: 'Al', doseMg: 1000 });
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.issues[0]).toMatchObject({ code: 'not_applicable', path: ['metal'] });
    expect(result.issues[0]?.message).toContain('Al');
    expect(result.issues[0]?.message).toContain('only for Fe');
  });

  it('binding-capacity: asks for the dose, or the weight with a mg/kg dose, and refuses both doses at once', () => {
    const none = runFormula(bindingCapacity, { chelatorForm: 'deferiprone' });
    expect(!none.ok && none.issues[0]).toMatchObject({ code: 'required', path: ['doseMg'] });
    expect(!none.ok && none.issues[0]?.message).toContain('1–20000 mg');
    const noWeight = runFormula(bindingCapacity, { chelatorForm: 'deferiprone', doseMgPerKg: 25 });
    expect(!noWeight.ok && noWeight.issues[0]).toMatchObject({ code: 'required', path: ['weightKg'] });
    expect(!noWeight.ok && noWeight.issues[0]?.message).toContain('25 mg/kg');
    const both = runFormula(bindingCapacity, { chelatorForm: 'deferiprone', doseMg: 1500, doseMgPerKg: 25, weightKg: 61 });
    expect(!both.ok && both.issues[0]).toMatchObject({ code: 'inconsistent', path: ['doseMgPerKg'] });
  });

  it('expected-excretion: TH-0417 (scenarios.md §1) on film-coated 21 mg/kg/day, 52 kg, defaults from the assumptions', () => {
    // Dispersible-equivalent 21 / 0.7 = 30 mg/kg/day × 74.79 mg Fe/g / 1000 × 0.27 = 0.6057 mg/kg/day;
    // × 52 kg = 31.50 mg/day. Tolerance: the hand figures' four significant figures.
    const result = runFormula(expectedExcretion, { chelator: 'deferasirox-film-coated', doseMgPerKgPerDosingDay: 21, weightKg: 52 });
    const outputs = outputsOf(result);
    expect(outputs.efficiencyBasisDoseMgPerKgPerDay).toBeCloseTo(30, 9);
    expect(outputs.efficiencyApplied).toBe(0.27);
    expect(Math.abs(outputs.excretionMgPerKgPerDay - 0.6057)).toBeLessThan(0.0005);
    expect(Math.abs(outputs.excretionMgPerDay - 31.5)).toBeLessThan(0.05);
    const origins = result.ok ? Object.fromEntries(result.value.derivation.inputs.map((it) => [it.name, it.origin])) : {};
    expect(origins.efficiencyDeferasirox).toEqual({ kind: 'assumption', assumptionId: 'efficiency-deferasirox', overridden: false });
    expect(origins.filmCoatedFactor).toEqual({ kind: 'assumption', assumptionId: 'deferasirox-film-coated-factor', overridden: false });
  });

  it('expected-excretion: an overridden efficiency is used and recorded', () => {
    // Halving the deferasirox efficiency halves the excretion (linear); 1e-12 relative.
    const defaults = outputsOf(runFormula(expectedExcretion, { chelator: 'deferasirox-dispersible', doseMgPerKgPerDosingDay: 20, weightKg: 52 }));
    const result = runFormula(
      expectedExcretion,
      { chelator: 'deferasirox-dispersible', doseMgPerKgPerDosingDay: 20, weightKg: 52 },
      { overrides: { 'efficiency-deferasirox': { value: 0.135, reason: 'local audit', by: 'AB' } } },
    );
    expect(outputsOf(result).excretionMgPerDay).toBeCloseTo(defaults.excretionMgPerDay / 2, 9);
  });

  it('expected-excretion: refuses adherence typed as a percentage, with the range and the fraction', () => {
    const result = runFormula(expectedExcretion, { chelator: 'deferiprone', doseMgPerKgPerDosingDay: 75, weightKg: 61, adherence: 80 });
    expect(!result.ok && result.issues[0]).toMatchObject({ code: 'out_of_range', path: ['adherence'] });
    expect(!result.ok && result.issues[0]?.message).toBe('Adherence 80 is outside the plausible range 0–1; enter it as a fraction (0.8).');
  });

  it('expected-excretion: refuses 8 dosing days a week and a fractional day count', () => {
    const eight = runFormula(expectedExcretion, { chelator: 'deferoxamine', doseMgPerKgPerDosingDay: 40, weightKg: 23, daysPerWeek: 8 });
    expect(!eight.ok && eight.issues[0]).toMatchObject({ code: 'out_of_range', path: ['daysPerWeek'] });
    expect(!eight.ok && eight.issues[0]?.message).toContain('8');
    expect(!eight.ok && eight.issues[0]?.message).toContain('1–7');
    const fractional = runFormula(expectedExcretion, { chelator: 'deferoxamine', doseMgPerKgPerDosingDay: 40, weightKg: 23, daysPerWeek: 4.5 });
    expect(!fractional.ok && fractional.issues[0]).toMatchObject({ code: 'not_an_integer', path: ['daysPerWeek'] });
  });

  it('salt-to-base: trientine dihydrochloride 300 mg → base and back (EASL 2012 / AASLD 2022 molar masses)', () => {
    // 300 × 146.24 / 219.15 = 200.19 mg (printed molar masses; tolerance 0.05 mg as in saltToBase.test.ts).
    const there = outputsOf(runFormula(saltToBase, { fromForm: 'trientine-dihydrochloride', toForm: 'trientine-base', massMg: 300 }));
    expect(Math.abs(there.massInTargetFormMg - 200.19)).toBeLessThan(0.05);
    expect(there.fromMolarMassGPerMol).toBeCloseTo(219.15, 2);
    const back = outputsOf(runFormula(saltToBase, { fromForm: 'trientine-base', toForm: 'trientine-dihydrochloride', massMg: there.massInTargetFormMg }));
    expect(back.massInTargetFormMg).toBeCloseTo(300, 9);
  });

  it('salt-to-base: refuses forms of two substances and an unknown form', () => {
    const mixed = runFormula(saltToBase, { fromForm: 'deferoxamine-mesylate', toForm: 'trientine-base', massMg: 500 });
    expect(!mixed.ok && mixed.issues[0]).toMatchObject({ code: 'inconsistent', path: ['toForm'] });
    const unknown = runFormula(saltToBase, { fromForm: 'trientine-sulfate', toForm: 'trientine-base', massMg: 500 });
    expect(!unknown.ok && unknown.issues[0]).toMatchObject({ code: 'unknown_choice', path: ['fromForm'] });
    expect(!unknown.ok && unknown.issues[0]?.message).toContain('trientine-tetrahydrochloride');
  });

  it('deferasirox-formulation: film-coated 21 → dispersible 30 mg/kg/day (labels: ÷ 0.7)', () => {
    const outputs = outputsOf(runFormula(deferasiroxFormulation, { fromFormulation: 'film-coated-tablet', doseMgPerKgPerDay: 21 }));
    expect(outputs.otherDoseMgPerKgPerDay).toBeCloseTo(30, 9);
    expect(outputs.otherFormulation).toBe('dispersible-tablet');
  });

  it('deferasirox-formulation: refuses a dose outside 1–60 mg/kg/day, naming the value and range', () => {
    const result = runFormula(deferasiroxFormulation, { fromFormulation: 'dispersible-tablet', doseMgPerKgPerDay: 200 });
    expect(!result.ok && result.issues[0]).toMatchObject({ code: 'out_of_range', path: ['doseMgPerKgPerDay'] });
    expect(!result.ok && result.issues[0]?.message).toBe('Deferasirox dose 200 mg/kg/d is outside the plausible range 1–60 mg/kg/d.');
  });

  it('deferoxamine-therapeutic-index: TH-0093 at ferritin 1250 is at or below 0.025; at 1000 µg/L it is above', () => {
    // 40 × 5 / 7 / 1250 = 0.02286 (Porter 1989 limit 0.025); / 1000 = 0.02857.
    const below = outputsOf(runFormula(deferoxamineTherapeuticIndexFormula, { dosePerInfusionMgPerKg: 40, infusionsPerWeek: 5, ferritinUgPerL: 1250 }));
    expect(below.therapeuticIndex).toBeCloseTo(0.02286, 5);
    expect(below.finding).toMatch(/^at or below 0.025/);
    const above = outputsOf(runFormula(deferoxamineTherapeuticIndexFormula, { dosePerInfusionMgPerKg: 40, infusionsPerWeek: 5, ferritinUgPerL: 1000 }));
    expect(above.finding).toMatch(/^above 0.025/);
    expect(above.finding).toContain('for review by the prescriber');
  });

  it('deferoxamine-therapeutic-index: refuses a ferritin of 0 and a dose typed per week', () => {
    const zero = runFormula(deferoxamineTherapeuticIndexFormula, { dosePerInfusionMgPerKg: 40, infusionsPerWeek: 5, ferritinUgPerL: 0 });
    expect(!zero.ok && zero.issues[0]).toMatchObject({ code: 'out_of_range', path: ['ferritinUgPerL'] });
    expect(!zero.ok && zero.issues[0]?.message).toBe('Serum ferritin 0 ug/L is outside the plausible range 1–30000 ug/L.');
    const weekly = runFormula(deferoxamineTherapeuticIndexFormula, { dosePerInfusionMgPerKg: 200, infusionsPerWeek: 5, ferritinUgPerL: 1250 });
    expect(!weekly.ok && weekly.issues[0]).toMatchObject({ code: 'out_of_range', path: ['dosePerInfusionMgPerKg'] });
  });

  it('do not mutate their raw inputs', () => {
    const raw = Object.freeze({ chelatorForm: 'deferasirox', doseMg: 1000 });
    expect(runFormula(bindingCapacity, raw).ok).toBe(true);
    expect(raw).toEqual({ chelatorForm: 'deferasirox', doseMg: 1000 });
  });

  it('use descriptive wording only (no imperative dosing)', () => {
    const texts = chelatorsFormulas.flatMap((formula) => [formula.title, formula.expression, ...(formula.notes ?? [])]);
    for (const text of texts) expect(text).not.toMatch(/\b(give|administer|increase the dose to|reduce the dose to)\b/i);
  });
});
