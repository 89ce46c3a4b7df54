import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { relativeResidualTolerance, solveEquilibrium, type EquilibriumSystem } from '../../../core/chemistry/equilibriumSolver';
import { ph } from '../../../core/chemistry/types';

/** M + L ⇌ ML with no side reactions: the textbook 1:1 system. */
function oneToOne(logK: number, totalMetal: number, totalLigand: number): EquilibriumSystem {
  return {
    components: [
      { name: 'M', totalMolar: totalMetal },
      { name: 'L', totalMolar: totalLigand },
    ],
    species: [
      { name: 'M', stoichiometry: [1, 0], protonCount: 0, logBeta: 0 },
      { name: 'L', stoichiometry: [0, 1], protonCount: 0, logBeta: 0 },
      { name: 'ML', stoichiometry: [1, 1], protonCount: 0, logBeta: logK },
    ],
  };
}

/**
 * Hand-derived closed form (outside the solver): K[M](Tl − Tm + [M]) + [M] = Tm, i.e.
 * K[M]² + (K(Tl − Tm) + 1)[M] − Tm = 0, whose positive root, written without cancellation, is
 * [M] = 2·Tm / (b + √(b² + 4K·Tm)), b = K(Tl − Tm) + 1 (b ≥ 1 when Tl ≥ Tm).
 * With metal in excess the same root is taken for the ligand (roles swapped) and
 * [M] = Tm − Tl + [L], which then has no cancellation either.
 */
function freeMetalClosedForm(logK: number, totalMetal: number, totalLigand: number): number {
  const k = 10 ** logK;
  const smallerFree = (scarce: number, plentiful: number): number => {
    const b = k * (plentiful - scarce) + 1;
    return (2 * scarce) / (b + Math.sqrt(b * b + 4 * k * scarce));
  };
  if (totalLigand >= totalMetal) return smallerFree(totalMetal, totalLigand);
  return totalMetal - totalLigand + smallerFree(totalLigand, totalMetal);
}

describe('speciation solver against the closed form of a 1:1 complex', () => {
  // Tolerance 1e-9 relative (the brief): the solver stops only when each mass balance closes to
  // 1e-10 of its total and then polishes with full Newton steps; the closed form is exact to
  // about 1e-15. Cases include ligand excess (the pM convention), equal totals, and metal excess.
  const cases: readonly [number, number, number][] = [
    [6, 1e-6, 1e-5],
    [10, 1e-6, 1e-5],
    [25, 1e-6, 1e-5],
    [3, 1e-3, 1e-3],
    [8, 1e-6, 1e-6],
    [12, 1e-4, 1e-6],
    [2, 1e-2, 5e-3],
  ];
  for (const [logK, totalMetal, totalLigand] of cases) {
    it(`log K ${logK}, metal ${totalMetal} M, ligand ${totalLigand} M`, () => {
      const result = solveEquilibrium(oneToOne(logK, totalMetal, totalLigand), ph(7));
      expect(result.ok).toBe(true);
      if (!result.ok) return;
      const free = 10 ** result.value.logFree[0]!;
      const expected = freeMetalClosedForm(logK, totalMetal, totalLigand);
      expect(Math.abs(free / expected - 1)).toBeLessThan(1e-9);
    });
  }

  it('worked example of the doc comment: log K 6, 1 µM metal, 10 µM ligand → 9.902e-8 M free metal', () => {
    const result = solveEquilibrium(oneToOne(6, 1e-6, 1e-5), ph(7));
    expect(result.ok && 10 ** result.value.logFree[0]!).toBeCloseTo(9.902e-8, 11);
  });
});

describe('speciation solver invariants', () => {
  it('closes every mass balance to 1e-10 of its total and obeys the law of mass action, for random systems', () => {
    // Property: for any constants and totals in a wide range, either the answer satisfies every
    // mass balance (relative 1e-10, the convergence test) and each species equals β·Π free^ν,
    // or the solver returns an issue. Checked here independently of the solver's own bookkeeping.
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 30, noNaN: true }),
        fc.double({ min: 0, max: 20, noNaN: true }),
        fc.double({ min: -9, max: -2, noNaN: true }),
        fc.double({ min: -9, max: -2, noNaN: true }),
        fc.double({ min: 2, max: 12, noNaN: true }),
        (logBeta1, logK3, logTm, logTl, pHValue) => {
          const system: EquilibriumSystem = {
            components: [
              { name: 'M', totalMolar: 10 ** logTm },
              { name: 'L', totalMolar: 10 ** logTl },
            ],
            species: [
              { name: 'M', stoichiometry: [1, 0], protonCount: 0, logBeta: 0 },
              { name: 'L', stoichiometry: [0, 1], protonCount: 0, logBeta: 0 },
              { name: 'HL', stoichiometry: [0, 1], protonCount: 1, logBeta: 9 },
              { name: 'MOH', stoichiometry: [1, 0], protonCount: -1, logBeta: -3 },
              { name: 'M2(OH)2', stoichiometry: [2, 0], protonCount: -2, logBeta: -3 },
              { name: 'ML', stoichiometry: [1, 1], protonCount: 0, logBeta: logBeta1 },
              { name: 'ML3', stoichiometry: [1, 3], protonCount: 0, logBeta: logBeta1 + logK3 + 10 },
            ],
          };
          const result = solveEquilibrium(system, ph(pHValue));
          if (!result.ok) return result.issues[0]!.code === 'not_converged';
          const c = result.value.species.map((it) => it.molar);
          const metal = c[0]! + c[3]! + 2 * c[4]! + c[5]! + c[6]!;
          const ligand = c[1]! + c[2]! + c[5]! + 3 * c[6]!;
          const [uM, uL] = result.value.logFree as [number, number];
          const ml3Log = logBeta1 + logK3 + 10 + uM + 3 * uL;
          return (
            Math.abs(metal / system.components[0]!.totalMolar - 1) < relativeResidualTolerance &&
            Math.abs(ligand / system.components[1]!.totalMolar - 1) < relativeResidualTolerance &&
            Math.abs(result.value.species[6]!.log10Molar - ml3Log) < 1e-9
          );
        },
      ),
      { numRuns: 300, seed: 20260507 },
    );
  });

  it('reports failure, not a number, when the iteration limit is too small to converge', () => {
    const result = solveEquilibrium(oneToOne(25, 1e-6, 1e-5), ph(7), { maxIterations: 1 });
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.issues[0]!.code).toBe('not_converged');
    expect(result.issues[0]!.message).toMatch(/No result is shown/);
  });

  it('recovers from a warm start that would overflow (log β 400 from free = 1 M) and still closes the balances', () => {
    // At the given start [ML] would be 10^400 mol/L; the solver discards that start for its bounded
    // start (no species above its smallest total) and converges: the closed form gives the answer.
    const result = solveEquilibrium(oneToOne(400, 1e-3, 2e-3), ph(7), { initialLogFree: [0, 0] });
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.value.maxRelativeResidual).toBeLessThan(relativeResidualTolerance);
    // log[M] = log(Tm) − log K − log(Tl − Tm) = −3 − 400 + 3 = −400 (ligand excess, complete binding).
    expect(result.value.logFree[0]!).toBeCloseTo(-400, 9);
  });

  it('refuses a total of zero with the component named', () => {
    const result = solveEquilibrium(oneToOne(6, 0, 1e-5), ph(7));
    expect(result.ok).toBe(false);
    if (!result.ok) {
      expect(result.issues[0]!.code).toBe('out_of_range');
      expect(result.issues[0]!.message).toContain('Total M 0 mol/L');
    }
  });

  it('does not mutate its inputs', () => {
    const system = Object.freeze(oneToOne(10, 1e-6, 1e-5));
    const copy = JSON.parse(JSON.stringify(system));
    solveEquilibrium(system, ph(7.4));
    expect(system).toEqual(copy);
  });
});
