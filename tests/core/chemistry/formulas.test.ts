import { describe, expect, it } from 'vitest';
import {
  conditionalConstantFormula,
  ligandFractionFormula,
  metalCompetitionFormula,
  pmFormula,
} from '../../../core/chemistry/formulas';
import { formulaIds } from '../../../core/catalogue';
import { runFormula } from '../../../core/formulas/run';

describe('chemistry calculators through runFormula', () => {
  it('are listed in the formula catalogue (so `calc --list` shows them)', () => {
    for (const id of ['ligand-fraction', 'conditional-constant', 'pm', 'metal-competition']) expect(formulaIds).toContain(id);
  });

  it('ligand-fraction: EDTA at pH 10 gives 0.30 (Harris, EDTA α(Y4−) table, 25 °C, 0.1 M) and names the set', () => {
    // Printed to two figures: ±0.005 (half the last digit).
    const result = runFormula(ligandFractionFormula, { constantSet: 'edta-textbook-25c', ph: '10' });
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(Math.abs(result.value.outputs.fraction - 0.3)).toBeLessThanOrEqual(0.005);
    expect(result.value.outputs.constantSet).toMatch(/^edta-textbook-25c: /);
    expect(result.value.outputs.constantSet).toContain('status memory');
  });

  it('conditional-constant: Ca2+–EDTA at pH 10 is log K + log α = 10.7 + log 0.30 (Harris worked method)', () => {
    // The textbook form K′ = α(Y4−)·K with the table's α at pH 10 (0.30): 10.7 − 0.52 = 10.18.
    // Calcium hydrolysis at pH 10 lowers it by log(1 + 10^(−12.85 + 10)) ≈ 0.0006 (from memory).
    // Tolerance 0.01: the table's α is printed to two figures (±0.005 on 0.30 is ±0.007 in log).
    const result = runFormula(conditionalConstantFormula, { constantSet: 'edta-textbook-25c', metal: 'Ca2+', ph: 10 });
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(Math.abs(result.value.outputs.logConditionalConstant - (10.7 + Math.log10(0.3)))).toBeLessThanOrEqual(0.01);
    expect(result.value.outputs.complex).toBe('CaL');
  });

  it('conditional-constant: deferiprone describes FeL3, with three times log α_L', () => {
    const result = runFormula(conditionalConstantFormula, { constantSet: 'deferiprone-remeasured-2019', metal: 'Fe3+', ph: 7.4 });
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    const out = result.value.outputs;
    expect(out.complex).toBe('FeL3');
    expect(out.logConditionalConstant).toBeCloseTo(37.4 + 3 * out.log10AlphaLigand + out.log10AlphaMetal, 12);
  });

  it('pm: defaults to the standard convention and reproduces the published deferoxamine pFe 26.6 within 0.3', () => {
    // Nurchi et al. 2015 (secondary); tolerance argued in speciation.test.ts (protonation-set spread).
    const result = runFormula(pmFormula, { constantSet: 'deferoxamine-schwarzenbach-1963' });
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(Math.abs(result.value.outputs.pM - 26.6)).toBeLessThanOrEqual(0.3);
    expect(result.value.outputs.dominantComplex).toBe('FeHL');
    const defaults = result.value.derivation.inputs.filter((it) => it.origin.kind === 'default').map((it) => it.name);
    expect(defaults).toEqual(['metal', 'ph', 'totalMetalUmolPerL', 'totalLigandUmolPerL']);
  });

  it('pm: refuses deferasirox and gives its published pFe as a literature value only', () => {
    const result = runFormula(pmFormula, { constantSet: 'deferasirox-aqueous' });
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.issues[0]!.code).toBe('not_applicable');
    expect(result.issues[0]!.path).toEqual(['constantSet']);
    expect(result.issues[0]!.message).toContain('pFe 22.5');
  });

  it('pm: refuses succimer (no confirmed metal constants) naming the metal', () => {
    const result = runFormula(pmFormula, { constantSet: 'succimer-37c-nacl', metal: 'Pb2+' });
    expect(result.ok).toBe(false);
    if (!result.ok) {
      expect(result.issues[0]!.path).toEqual(['metal']);
      expect(result.issues[0]!.message).toContain('protonation constants only');
    }
  });

  it('pm: refuses transferrin away from pH 7.4 on the pH input', () => {
    const result = runFormula(pmFormula, { constantSet: 'transferrin-martin-1987', ph: 6.5 });
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.issues[0]!.path).toEqual(['ph']);
  });

  it('pm: refuses an out-of-range total with the field, value and range', () => {
    const result = runFormula(pmFormula, { constantSet: 'edta-textbook-25c', totalLigandUmolPerL: 0 });
    expect(result.ok).toBe(false);
    if (!result.ok) {
      expect(result.issues[0]!.code).toBe('out_of_range');
      expect(result.issues[0]!.message).toBe('Total ligand 0 umol/L is outside the plausible range 0.000001–100000 umol/L.');
    }
  });

  it('ligand-fraction: refuses a set of conditional constants', () => {
    const result = runFormula(ligandFractionFormula, { constantSet: 'transferrin-martin-1987', ph: 7.4 });
    expect(result.ok).toBe(false);
  });

  it('rejects an unknown constant set id with the list of choices', () => {
    const result = runFormula(pmFormula, { constantSet: 'edta-sodium-corrected' });
    expect(result.ok).toBe(false);
    if (!result.ok) {
      expect(result.issues[0]!.code).toBe('unknown_choice');
      expect(result.issues[0]!.message).toContain('deferoxamine-schwarzenbach-1963');
    }
  });

  it('metal-competition: lead with plasma calcium for edetate (hand estimate: 9/10 of the ligand on calcium)', () => {
    // See speciation.test.ts for the derivation of the 0.9 share; tolerance 1e-4.
    const result = runFormula(metalCompetitionFormula, {
      constantSet: 'edta-textbook-25c',
      firstMetal: 'Pb2+',
      firstMetalTotalUmolPerL: 1,
      secondMetal: 'Ca2+',
      secondMetalTotalUmolPerL: 1200,
    });
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    const out = result.value.outputs;
    expect(out.ligandShareSecondMetal).toBeCloseTo(0.9, 4);
    expect(out.ligandShareFirstMetal).toBeCloseTo(0.1, 4);
    expect(out.firstMetalPm).toBeGreaterThan(out.secondMetalPm);
    expect(out.constantSet).toMatch(/^edta-textbook-25c: /);
  });

  it('metal-competition: refuses the same metal twice, on the second metal', () => {
    const result = runFormula(metalCompetitionFormula, {
      constantSet: 'edta-textbook-25c',
      firstMetal: 'Ca2+',
      firstMetalTotalUmolPerL: 1,
      secondMetal: 'Ca2+',
      secondMetalTotalUmolPerL: 1,
    });
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.issues[0]!.path).toEqual(['secondMetal']);
  });

  it('metal-competition: refuses a metal the set lacks, on that metal input', () => {
    const result = runFormula(metalCompetitionFormula, {
      constantSet: 'deferiprone-remeasured-2019',
      firstMetal: 'Fe3+',
      firstMetalTotalUmolPerL: 1,
      secondMetal: 'Zn2+',
      secondMetalTotalUmolPerL: 15,
    });
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.issues[0]!.path).toEqual(['secondMetal']);
  });
});
