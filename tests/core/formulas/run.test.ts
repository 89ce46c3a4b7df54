import { describe, expect, it } from 'vitest';
import { expectedExcretion } from '../../../core/chelators/formulas';
import { runFormula } from '../../../core/formulas/run';
import { findFormula } from '../../../core/catalogue';

// The framework's own rules (design.md §5; issue 6): a derivation lists exactly the
// inputs a result used, each with the unit it was entered in.
describe('runFormula derivations', () => {
  it('lists only the efficiency of the chosen chelator, and the film-coated factor only for film-coated deferasirox', () => {
    const dispersible = runFormula(expectedExcretion, { chelator: 'deferasirox-dispersible', doseMgPerKgPerDosingDay: 20, weightKg: 50 });
    if (!dispersible.ok) throw new Error('refused');
    const names = dispersible.value.derivation.inputs.map((it) => it.name);
    expect(names).toContain('efficiencyDeferasirox');
    expect(names).not.toContain('efficiencyDeferoxamine');
    expect(names).not.toContain('efficiencyDeferiprone');
    expect(names).not.toContain('filmCoatedFactor');
    const filmCoated = runFormula(expectedExcretion, { chelator: 'deferasirox-film-coated', doseMgPerKgPerDosingDay: 14, weightKg: 50 });
    if (!filmCoated.ok) throw new Error('refused');
    expect(filmCoated.value.derivation.inputs.map((it) => it.name)).toContain('filmCoatedFactor');
    // 14 ÷ 0.7 = 20 mg/kg/day dispersible-equivalent (deferasirox labels): the same removal.
    expect(filmCoated.value.outputs.excretionMgPerDay).toBeCloseTo(dispersible.value.outputs.excretionMgPerDay, 9);
  });

  it('refuses a value for an input that does not apply, naming the condition', () => {
    const result = runFormula(expectedExcretion, { chelator: 'deferiprone', doseMgPerKgPerDosingDay: 75, weightKg: 50, efficiencyDeferasirox: 0.3 });
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.issues[0]).toMatchObject({ code: 'not_applicable', path: ['efficiencyDeferasirox'] });
    expect(result.issues[0]!.message).toContain('applies only when chelator is deferasirox-dispersible or deferasirox-film-coated');
  });

  it('shows a laboratory value in the unit it was entered in', () => {
    const formula = findFormula('creatinine-units')!;
    const result = runFormula(formula, { serumCreatinine: 88.4, creatinineUnit: 'umol/L' });
    if (!result.ok) throw new Error('refused');
    expect(result.value.derivation.inputs.find((it) => it.name === 'serumCreatinine')!.unit).toBe('umol/L');
    // 88.4 µmol/L = 1.00 mg/dL (references.md §5: × 88.4).
    expect(result.value.outputs.creatinineMgPerDl as number).toBeCloseTo(1.0, 3);
  });
});
