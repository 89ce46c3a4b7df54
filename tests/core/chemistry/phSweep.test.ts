import { describe, expect, it } from 'vitest';
import { conditionalConstantSweep, phGrid, pmSweep } from '../../../core/chemistry/phSweep';
import { pmComparisonAtPhysiologicalPh } from '../../../core/chemistry/pmComparison';
import { findConstantSet } from '../../../core/chemistry/sets';
import { speciate } from '../../../core/chemistry/speciation';
import { molar, ph } from '../../../core/chemistry/types';

describe('pH sweeps', () => {
  it('builds the grid pH 2–12 in steps of 1 (11 values, ends included)', () => {
    expect(phGrid(2, 12, 1)).toEqual([2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12]);
  });

  it('gives the same pM with a warm start as solving each pH from scratch (1e-9)', () => {
    const set = findConstantSet('deferiprone-remeasured-2019')!;
    const swept = pmSweep(set, 'Fe3+', molar(1e-6), molar(1e-5), phGrid(2, 12, 0.5));
    expect(swept).toHaveLength(21);
    for (const point of swept) {
      expect(point.ok).toBe(true);
      const cold = speciate(set, [{ metal: 'Fe3+', totalMolar: molar(1e-6) }], molar(1e-5), point.pH);
      if (point.ok && cold.ok) expect(Math.abs(point.value - cold.value.metals[0]!.pM)).toBeLessThan(1e-9);
    }
  });

  it('log K′ of Ca2+–EDTA rises with pH from 2 to 11.5, then calcium hydrolysis turns it down by pH 12', () => {
    // Invariant of the side-reaction form: α_L rises with pH until EDTA is fully deprotonated, while
    // α_M(Ca) falls only as 10^(pH − 12.85) (Baes & Mesmer, from memory) becomes comparable.
    const edta = findConstantSet('edta-textbook-25c')!;
    const points = conditionalConstantSweep(edta, 'Ca2+', phGrid(2, 11.5, 0.25));
    for (let i = 1; i < points.length; i += 1) {
      const previous = points[i - 1]!;
      const current = points[i]!;
      if (previous.ok && current.ok) expect(current.value).toBeGreaterThan(previous.value);
      else expect.unreachable('every point should compute');
    }
    const [at115, at12] = conditionalConstantSweep(edta, 'Ca2+', phGrid(11.5, 12, 0.5));
    expect(at115!.ok && at12!.ok && at12!.value < at115!.value).toBe(true);
  });

  it('reports the pH points a conditional set cannot compute, without dropping them', () => {
    const points = pmSweep(findConstantSet('transferrin-martin-1987')!, 'Fe3+', molar(1e-6), molar(1e-5), [ph(7.0), ph(7.4), ph(7.8)]);
    expect(points.map((it) => it.ok)).toEqual([false, true, false]);
  });
});

describe('pM comparison at pH 7.4 (the chemistry half of the per-dose capacity table)', () => {
  it('has a row per ligand, computed where constants exist and a literature value for deferasirox', () => {
    const rows = pmComparisonAtPhysiologicalPh();
    const byLigand = new Map(rows.map((it) => [it.ligand, it]));
    expect(rows).toHaveLength(7);
    expect(byLigand.get('deferasirox')).toMatchObject({ basis: 'literature', pM: 22.5 });
    expect(byLigand.get('succimer')!.basis).toBe('none');
    expect(byLigand.get('deferoxamine')!.basis).toBe('computed');
    // Published order of pFe (Nurchi 2015): deferoxamine 26.6 > deferasirox 22.5 > deferiprone 19.9.
    expect(byLigand.get('deferoxamine')!.pM!).toBeGreaterThan(byLigand.get('deferasirox')!.pM!);
    expect(byLigand.get('deferasirox')!.pM!).toBeGreaterThan(byLigand.get('deferiprone')!.pM!);
  });
});
