import { MF } from 'mf-parser';
import { describe, expect, it } from 'vitest';
import { findAssumption } from '../../../core/assumptions';
import {
  chelatorCatalogue,
  findChelator,
  findLigand,
  ligandCatalogue,
  substanceForm,
  substanceForms,
} from '../../../core/chelators';
import { findSource } from '../../../core/references';

describe('chelator stoichiometry (Poggiali et al., Blood Transfus 2012;10:411, Table I)', () => {
  // Table I: deferoxamine hexadentate 1 : 1, deferiprone bidentate 3 : 1, deferasirox tridentate 2 : 1.
  // Exact integers: no tolerance.
  it.each([
    ['deferoxamine', 6, 1],
    ['deferiprone', 2, 3],
    ['deferasirox', 3, 2],
  ] as const)('%s: denticity %i, %i ligand(s) per Fe', (ligandId, denticity, ligandsPerFe) => {
    const ligand = findLigand(ligandId);
    expect(ligand.denticity).toBe(denticity);
    expect(ligand.bindings.find((it) => it.metal === 'Fe')?.ligandsPerMetal).toBe(ligandsPerFe);
  });

  it('fills Fe³⁺’s six coordination sites in every Fe complex (denticity × ligands per Fe = 6)', () => {
    // Octahedral Fe³⁺ has six coordination sites: a chemistry fact independent of the table,
    // so this checks the table's ratios against its denticities.
    for (const ligand of ligandCatalogue) {
      const fe = ligand.bindings.find((it) => it.metal === 'Fe');
      expect(ligand.denticity * (fe?.ligandsPerMetal ?? 0), ligand.id).toBe(6);
    }
  });

  it('catalogues aluminium only for deferoxamine, 1 : 1 (deferoxamine label, from memory)', () => {
    expect(findLigand('deferoxamine').bindings.find((it) => it.metal === 'Al')?.ligandsPerMetal).toBe(1);
    expect(findLigand('deferiprone').bindings.some((it) => it.metal === 'Al')).toBe(false);
    expect(findLigand('deferasirox').bindings.some((it) => it.metal === 'Al')).toBe(false);
  });
});

describe('substance forms', () => {
  it('computes every molar mass from its formula (mf-parser agrees to 0.01 %)', () => {
    // The catalogue never types a molar mass; mf-parser computes one independently from the same
    // formula. The two differ only by atomic-weight vintages (tests/core/elements), well under 1e-4.
    for (const form of substanceForms) {
      const theirs = new MF(form.formula.replace(/·/g, ' . ')).getInfo().mass;
      expect(Math.abs(form.molarMassGPerMol - theirs) / theirs, form.id).toBeLessThan(1e-4);
    }
  });

  it('pairs each salt with a base of the same substance, lighter than the salt', () => {
    for (const salt of substanceForms.filter((it) => it.basis === 'salt')) {
      const base = substanceForms.find((it) => it.substance === salt.substance && it.basis === 'base');
      expect(base, salt.id).toBeDefined();
      expect(base!.molarMassGPerMol).toBeLessThan(salt.molarMassGPerMol);
    }
  });

  it('cites sources that exist', () => {
    for (const form of substanceForms) for (const id of form.sourceIds) expect(findSource(id), id).toBeDefined();
  });
});

describe('chelator products', () => {
  it('gives the published dose ranges (deferoxamine label; deferiprone SmPC 2004; deferasirox labels)', () => {
    // Values as printed in references.md §3 and the sources named beside the catalogue entries.
    const deferoxamine = findChelator('deferoxamine');
    expect([deferoxamine.dose.minMgPerKgPerDay, deferoxamine.dose.maxMgPerKgPerDay]).toEqual([20, 60]);
    expect([deferoxamine.dose.daysPerWeekMin, deferoxamine.dose.daysPerWeekMax]).toEqual([5, 7]);
    expect([deferoxamine.dose.infusionHoursMin, deferoxamine.dose.infusionHoursMax]).toEqual([8, 12]);
    expect(deferoxamine.dose.growingMaxMgPerKgPerDay).toBe(40);
    expect(deferoxamine.dose.intravenousMaxMgPerKgPerHour).toBe(15);
    expect(deferoxamine.dosedAsFormId).toBe('deferoxamine-mesylate');
    const deferiprone = findChelator('deferiprone');
    expect([deferiprone.dose.usualMgPerKgPerDay, deferiprone.dose.maxMgPerKgPerDay, deferiprone.dose.administrationsPerDay]).toEqual([75, 100, 3]);
    const dispersible = findChelator('deferasirox-dispersible');
    expect([dispersible.dose.usualMgPerKgPerDay, dispersible.dose.minMgPerKgPerDay, dispersible.dose.maxMgPerKgPerDay]).toEqual([20, 10, 40]);
    const filmCoated = findChelator('deferasirox-film-coated');
    expect([filmCoated.dose.usualMgPerKgPerDay, filmCoated.dose.minMgPerKgPerDay, filmCoated.dose.maxMgPerKgPerDay]).toEqual([14, 7, 28]);
  });

  it('keeps the two deferasirox tablets 0.7 apart at every labelled dose (deferasirox labels)', () => {
    // 20 × 0.7 = 14, 10 × 0.7 = 7, 40 × 0.7 = 28: the label's own factor; floating-point tolerance only.
    const factor = findAssumption('deferasirox-film-coated-factor')!.value;
    const dispersible = findChelator('deferasirox-dispersible').dose;
    const filmCoated = findChelator('deferasirox-film-coated').dose;
    expect(dispersible.usualMgPerKgPerDay! * factor).toBeCloseTo(filmCoated.usualMgPerKgPerDay!, 9);
    expect(dispersible.minMgPerKgPerDay! * factor).toBeCloseTo(filmCoated.minMgPerKgPerDay!, 9);
    expect(dispersible.maxMgPerKgPerDay * factor).toBeCloseTo(filmCoated.maxMgPerKgPerDay, 9);
  });

  it('names a known efficiency assumption, sources that exist, and a form of its own ligand', () => {
    for (const chelator of chelatorCatalogue) {
      expect(findAssumption(chelator.efficiencyAssumptionId), chelator.id).toBeDefined();
      for (const id of chelator.dose.sourceIds) expect(findSource(id), id).toBeDefined();
      expect(substanceForm(chelator.dosedAsFormId).substance).toBe(chelator.ligandId);
    }
    for (const ligand of ligandCatalogue) {
      for (const binding of ligand.bindings) for (const id of binding.sourceIds) expect(findSource(id), id).toBeDefined();
    }
  });

  it('applies the film-coated factor to film-coated deferasirox only', () => {
    const withFactor = chelatorCatalogue.filter((it) => 'efficiencyDoseFactorAssumptionId' in it).map((it) => it.id);
    expect(withFactor).toEqual(['deferasirox-film-coated']);
  });
});
