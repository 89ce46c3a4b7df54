import { describe, expect, it } from 'vitest';
import { metalHydrolysisSets } from '../../../core/chemistry/hydrolysis';
import { ligandConstantSets } from '../../../core/chemistry/sets';
import { ligandIds, metalIds } from '../../../core/chemistry/types';
import { findSource } from '../../../core/references';

// Bookkeeping rules of the constant sets (references.md §6): whole sets, one default per ligand
// with its reason, every source known, memory said where it is memory.
describe('ligand constant sets', () => {
  it('has exactly one default per ligand, each with a reason', () => {
    for (const ligand of ligandIds) {
      const defaults = ligandConstantSets.filter((it) => it.ligand === ligand && it.isDefault);
      expect(defaults, ligand).toHaveLength(1);
      expect(defaults[0]!.defaultReason?.length ?? 0, ligand).toBeGreaterThan(10);
    }
  });

  it('cites only known sources, and a set is never surer than its least sure source', () => {
    const rank = { confirmed: 0, standard: 0, definition: 0, derived: 1, secondary: 1, 'common-practice': 2, memory: 3 } as const;
    for (const set of ligandConstantSets) {
      const sources = set.sourceIds.map((id) => findSource(id));
      for (const [index, source] of sources.entries()) expect(source, `${set.id} → ${set.sourceIds[index]}`).toBeDefined();
      const worst = Math.max(...sources.map((it) => rank[it!.status]));
      expect(rank[set.status], set.id).toBeGreaterThanOrEqual(worst);
    }
  });

  it('says "from memory" beside every constant of a set marked memory that is not otherwise sourced', () => {
    for (const set of ligandConstantSets.filter((it) => it.status === 'memory')) {
      expect(set.cautions.join(' ') + set.complexes.map((it) => it.asPrinted).join(' '), set.id).toMatch(/memory/);
    }
  });

  it('gives deferasirox no metal constants and only its published pFe 22.5 (Nurchi 2015)', () => {
    for (const set of ligandConstantSets.filter((it) => it.ligand === 'deferasirox')) {
      expect(set.complexes).toHaveLength(0);
      expect(set.metalConstantsUnconfirmed).toBe(true);
      expect(set.literaturePm?.[0]).toMatchObject({ metal: 'Fe3+', pM: 22.5, sourceId: 'nurchi-2015' });
    }
  });

  it('keeps the two deferasirox protonation sets apart (aqueous 4.57/8.71/10.56; water–DMSO 4.61/10.12/12.08)', () => {
    const aqueous = ligandConstantSets.find((it) => it.id === 'deferasirox-aqueous')!;
    const mixed = ligandConstantSets.find((it) => it.id === 'deferasirox-water-dmso')!;
    expect(aqueous.protonationLogK).toEqual([10.56, 8.71, 4.57]);
    expect(mixed.protonationLogK).toEqual([12.08, 10.12, 4.61]);
  });

  it('converts the succimer overall constants of PMC7997625 Table 2 to stepwise ones exactly', () => {
    // Printed overall log β (298.15 K): 11.01, 20.32, 23.87, 26.39; stepwise = successive differences.
    const set = ligandConstantSets.find((it) => it.id === 'succimer-25c-nacl')!;
    let cumulative = 0;
    const overall = set.protonationLogK.map((logK) => (cumulative += logK));
    expect(overall.map((it) => Number(it.toFixed(2)))).toEqual([11.01, 20.32, 23.87, 26.39]);
  });

  it('uses only known metals, and whole-number stoichiometry', () => {
    for (const set of ligandConstantSets) {
      for (const complex of set.complexes) {
        expect(metalIds).toContain(complex.metal);
        expect(Number.isInteger(complex.metalCount) && Number.isInteger(complex.ligandCount) && Number.isInteger(complex.protonCount)).toBe(true);
      }
    }
  });
});

describe('metal hydrolysis', () => {
  it('holds the Fe3+ constants of Stefánsson, Environ Sci Technol 2007;41:6117 (abstract) as printed', () => {
    const iron = metalHydrolysisSets.find((it) => it.metal === 'Fe3+')!;
    expect(iron.species.map((it) => [it.metalCount, it.hydroxideCount, it.logBetaStar])).toEqual([
      [1, 1, -2.19],
      [1, 2, -5.76],
      [1, 3, -14.3],
      [1, 4, -21.71],
      [2, 2, -2.92],
    ]);
  });

  it('covers every metal', () => {
    for (const metal of metalIds) expect(metalHydrolysisSets.some((it) => it.metal === metal), metal).toBe(true);
  });
});
