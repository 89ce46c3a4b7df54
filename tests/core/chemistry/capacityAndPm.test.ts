import { describe, expect, it } from 'vitest';
import { metalBindingCapacityMgPerG, metalBoundByDoseMg } from '../../../core/chelators/bindingCapacity';
import { findChelator } from '../../../core/chelators/catalogue';
import { bindingCapacity } from '../../../core/chelators/formulas';
import { capacityComparison, capacityComparisonRow, usualDailyDoseOf } from '../../../core/chemistry/capacityAndPm';
import { capacityAndPmFormula, pmFormula } from '../../../core/chemistry/formulas';
import { findConstantSet } from '../../../core/chemistry/sets';
import { formulaIds } from '../../../core/catalogue';
import { runFormula } from '../../../core/formulas/run';
import { kg, mg, mgPerKgPerDay } from '../../../core/units/quantity';

const ironRows = capacityComparison('Fe3+', kg(52));
const row = (chelatorId: string) => ironRows.find((it) => it.chelatorId === chelatorId)!;

describe('capacity comparison: the stoichiometric column', () => {
  it('equals core/chelators binding capacity for every row (one arithmetic, not two)', () => {
    for (const it of ironRows) {
      const form = findChelator(it.chelatorId).dosedAsFormId;
      const capacity = metalBindingCapacityMgPerG(form, 'Fe');
      const bound = metalBoundByDoseMg(it.doseMg!, form, 'Fe');
      expect(capacity.ok && bound.ok).toBe(true);
      if (!capacity.ok || !bound.ok) return;
      expect(it.capacityMgPerG).toBe(capacity.value);
      expect(it.metalBoundMg!).toBeCloseTo(bound.value, 10);
    }
  });

  it('matches Poggiali et al., Blood Transfus 2012;10:411, Table I: about 85, 134 and 75 mg Fe per g', () => {
    // Table I gives the chelator : Fe ratios (1 : 1, 3 : 1, 2 : 1) and formulas; with the printed molar
    // masses (656.79, 139.15, 373.37 g/mol) the arithmetic 55.845 / (ratio × M) × 1000 is 85.03, 133.77,
    // 74.79 (references.md §3; tests/core/chelators/bindingCapacity.test.ts). Tolerance 0.5 mg/g on the
    // rounded 85 / 134 / 75 (their last digit), and 0.01 on the unrounded values (molar-mass rounding).
    expect(Math.abs(row('deferoxamine').capacityMgPerG! - 85)).toBeLessThanOrEqual(0.5);
    expect(Math.abs(row('deferiprone').capacityMgPerG! - 134)).toBeLessThanOrEqual(0.5);
    expect(Math.abs(row('deferasirox-dispersible').capacityMgPerG! - 75)).toBeLessThanOrEqual(0.5);
    expect(row('deferasirox-film-coated').capacityMgPerG).toBe(row('deferasirox-dispersible').capacityMgPerG);
    expect(Math.abs(row('deferoxamine').capacityMgPerG! - (55.845 / 656.79) * 1000)).toBeLessThanOrEqual(0.01);
    expect(Math.abs(row('deferiprone').capacityMgPerG! - (55.845 / (3 * 139.15)) * 1000)).toBeLessThanOrEqual(0.01);
    expect(Math.abs(row('deferasirox-dispersible').capacityMgPerG! - (55.845 / (2 * 373.37)) * 1000)).toBeLessThanOrEqual(0.01);
  });

  it('deferiprone 75 mg/kg/day at 52 kg binds 3900 / 139.15 / 3 × 55.845 ≈ 521.7 mg Fe (hand arithmetic)', () => {
    // Molar mass 139.15 as printed (references.md §3, Poggiali Table I); Ar(Fe) 55.845 (CIAAW).
    // Tolerance 0.05 mg: the printed molar mass is rounded to 0.005 g/mol, 4e-5 relative, 0.02 mg here.
    const expected = (3900 / 139.15 / 3) * 55.845;
    expect(row('deferiprone').doseMg).toBe(3900);
    expect(Math.abs(row('deferiprone').metalBoundMg! - expected)).toBeLessThanOrEqual(0.05);
    expect(Math.abs(row('deferiprone').metalBoundMgPerKg! - expected / 52)).toBeLessThanOrEqual(0.001);
  });

  it('uses the catalogue dose guidance and says which dose: deferoxamine has a range only, so its midpoint', () => {
    // Deferoxamine label 20–60 mg/kg/day (references.md §3); deferiprone 75; deferasirox 20 / 14 (labels).
    expect(usualDailyDoseOf('deferoxamine')).toMatchObject({ doseMgPerKgPerDay: 40 });
    expect(usualDailyDoseOf('deferoxamine').doseBasis).toContain('midpoint of the published range 20–60 mg/kg/day');
    expect(ironRows.map((it) => it.doseMgPerKgPerDay)).toEqual([40, 75, 20, 14]);
    expect(row('deferiprone').doseBasis).toContain("usual dose in the catalogue's dose guidance");
  });

  it('gives mg per kg only when no weight is given', () => {
    const perKg = capacityComparison('Fe3+');
    expect(perKg.every((it) => it.doseMg === null && it.metalBoundMg === null && it.metalBoundMgPerKg !== null)).toBe(true);
    expect(perKg[1]!.metalBoundMgPerKg).toBe(row('deferiprone').metalBoundMgPerKg);
  });

  it('offers Al3+ for deferoxamine only, naming the catalogue for the others', () => {
    // Deferoxamine : Al 1 : 1 (aluminoxamine; catalogue, from memory); Ar(Al) 26.982 (CIAAW):
    // 1000 / 656.79 × 26.982 ≈ 41.08 mg/g with the printed molar mass; tolerance 0.01 mg/g (rounding).
    const aluminium = capacityComparison('Al3+');
    expect(Math.abs(aluminium[0]!.capacityMgPerG! - (1000 / 656.79) * 26.982)).toBeLessThanOrEqual(0.01);
    expect(aluminium[0]!.pm.basis).toBe('computed');
    for (const other of aluminium.slice(1)) {
      expect(other.capacityMgPerG).toBeNull();
      expect(other.capacityNote).toMatch(/not catalogued/);
      expect(other.pm.pM).toBeUndefined();
    }
  });
});

describe('capacity comparison: the pM column', () => {
  it('equals the pm calculator (standard convention, default set) for every computed row', () => {
    for (const it of ironRows.filter((candidate) => candidate.pm.basis === 'computed')) {
      const result = runFormula(pmFormula, { constantSet: it.pm.setId });
      expect(result.ok).toBe(true);
      if (result.ok) expect(it.pm.pM).toBe(result.value.outputs.pM);
    }
  });

  it('shows deferasirox as the literature value 22.5 (Nurchi et al., Molecules 2015), not computed', () => {
    for (const id of ['deferasirox-dispersible', 'deferasirox-film-coated']) {
      expect(row(id).pm).toMatchObject({ basis: 'literature', pM: 22.5, sourceIds: ['nurchi-2015'], setId: 'deferasirox-aqueous' });
    }
  });

  it('orders pFe as published: deferoxamine 26.6 > deferasirox 22.5 > deferiprone 19.4–20.8', () => {
    // Nurchi 2015 (deferoxamine, deferasirox), Liu & Hider 2001 (19.4) and PMC6469224 (20.8).
    // Tolerances as argued in speciation.test.ts: 0.3 for deferoxamine (protonation-set spread),
    // 0.2 for deferiprone (β3 lineage and printed digit).
    const deferoxamine = row('deferoxamine').pm.pM!;
    const deferasirox = row('deferasirox-dispersible').pm.pM!;
    const deferiprone = row('deferiprone').pm.pM!;
    expect(Math.abs(deferoxamine - 26.6)).toBeLessThanOrEqual(0.3);
    expect(deferiprone).toBeGreaterThanOrEqual(19.4 - 0.2);
    expect(deferiprone).toBeLessThanOrEqual(20.8 + 0.2);
    expect(deferoxamine).toBeGreaterThan(deferasirox);
    expect(deferasirox).toBeGreaterThan(deferiprone);
  });

  it('names every set with its status', () => {
    expect(row('deferoxamine').pm).toMatchObject({ setId: 'deferoxamine-schwarzenbach-1963', setStatus: 'memory' });
    expect(row('deferasirox-film-coated').pm.setStatus).toBe('secondary');
  });

  it('takes another set of the same ligand, and refuses a set of another ligand', () => {
    const lower = capacityComparisonRow(
      { chelatorId: 'deferiprone', doseMgPerKgPerDay: mgPerKgPerDay(75), doseBasis: 'test' },
      'Fe3+',
      findConstantSet('deferiprone-motekaitis-martell-1991'),
    );
    // Liu & Hider 2001, pFe 19.4; tolerance 0.2 as in speciation.test.ts.
    expect(lower.ok && Math.abs(lower.value.pm.pM! - 19.4)).toBeLessThanOrEqual(0.2);
    const wrong = capacityComparisonRow({ chelatorId: 'deferiprone', doseMg: mg(1000), doseBasis: 'test' }, 'Fe3+', findConstantSet('edta-textbook-25c'));
    expect(wrong.ok).toBe(false);
    if (!wrong.ok) expect(wrong.issues[0]).toMatchObject({ code: 'inconsistent', path: ['constantSet'] });
    const none = capacityComparisonRow({ chelatorId: 'deferiprone', doseBasis: 'test' });
    expect(!none.ok && none.issues[0]!.code).toBe('required');
  });
});

describe('capacity-and-pm calculator', () => {
  it('is in the catalogue, so calc --list shows it', () => {
    expect(formulaIds).toContain('capacity-and-pm');
  });

  it('deferoxamine 40 mg/kg/day at 52 kg: 2080 mg binds 2080 / 656.79 × 55.845 ≈ 176.9 mg Fe, beside the pm calculator', () => {
    // Molar mass as printed (Poggiali Table I); tolerance 0.05 mg for its rounding (as above).
    const result = runFormula(capacityAndPmFormula, { chelator: 'deferoxamine', doseMgPerKgPerDay: 40, weightKg: 52 });
    const pm = runFormula(pmFormula, { constantSet: 'deferoxamine-schwarzenbach-1963' });
    expect(result.ok && pm.ok).toBe(true);
    if (!result.ok || !pm.ok) return;
    const out = result.value.outputs;
    expect(out.doseMg).toBe(2080);
    expect(Math.abs(out.metalBoundMg - (2080 / 656.79) * 55.845)).toBeLessThanOrEqual(0.05);
    expect(out.pM).toBe(pm.value.outputs.pM);
    expect(out.pmBasis).toBe('computed at pH 7.4, 1 µM metal, 10 µM ligand');
    expect(out.constantSet).toMatch(/^deferoxamine-schwarzenbach-1963: .*status memory/);
  });

  it('agrees with the binding-capacity calculator for the same dose in mg', () => {
    const mine = runFormula(capacityAndPmFormula, { chelator: 'deferiprone', doseMg: 1000 });
    const theirs = runFormula(bindingCapacity, { chelatorForm: 'deferiprone', metal: 'Fe', doseMg: 1000 });
    expect(mine.ok && theirs.ok).toBe(true);
    if (mine.ok && theirs.ok) {
      expect(mine.value.outputs.metalBoundMg).toBeCloseTo(theirs.value.outputs.metalMg, 10);
      expect(mine.value.outputs.capacityMgPerG).toBe(theirs.value.outputs.capacityMgPerG);
    }
  });

  it('marks deferasirox pFe as a literature value, not computed', () => {
    const result = runFormula(capacityAndPmFormula, { chelator: 'deferasirox-film-coated', doseMgPerKgPerDay: 14, weightKg: 52 });
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.value.outputs.pM).toBe(22.5);
    expect(result.value.outputs.pmBasis).toBe('literature value, not computed (nurchi-2015)');
  });

  it('refuses each inconsistent input on its field', () => {
    const cases: readonly [Record<string, unknown>, string, string][] = [
      [{ chelator: 'deferiprone', doseMg: 1000, doseMgPerKgPerDay: 75, weightKg: 52 }, 'inconsistent', 'doseMgPerKgPerDay'],
      [{ chelator: 'deferiprone' }, 'required', 'doseMg'],
      [{ chelator: 'deferiprone', doseMgPerKgPerDay: 75 }, 'required', 'weightKg'],
      [{ chelator: 'deferiprone', doseMg: 1000, metal: 'Al3+' }, 'not_applicable', 'metal'],
      [{ chelator: 'deferiprone', doseMg: 1000, constantSet: 'edta-textbook-25c' }, 'inconsistent', 'constantSet'],
      [{ chelator: 'deferiprone', doseMgPerKgPerDay: 500, weightKg: 52 }, 'out_of_range', 'doseMgPerKgPerDay'],
    ];
    for (const [raw, code, path] of cases) {
      const result = runFormula(capacityAndPmFormula, raw);
      expect(result.ok, JSON.stringify(raw)).toBe(false);
      if (!result.ok) expect(result.issues[0], JSON.stringify(raw)).toMatchObject({ code, path: [path] });
    }
  });
});
