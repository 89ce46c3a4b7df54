import { MF } from 'mf-parser';
import { describe, expect, it } from 'vitest';
import { atomicWeight, molarMass, parseFormula, type ElementSymbol } from '../../../core/elements';

/** mf-parser reads "." followed by a digit as a decimal count, so adducts are written " . " for it. */
function mfInfo(formula: string): { mass: number; atoms: Record<string, number> } {
  const info = new MF(formula.replace(/·/g, ' . ')).getInfo();
  return { mass: info.mass, atoms: info.atoms as Record<string, number> };
}

/**
 * Tolerance for a molar mass against mf-parser: the two differ only through the atomic weights
 * (the element counts are checked to be identical), so the bound is Σ count × |Ar(ours) − Ar(mf-parser)|,
 * each of which tests/core/elements/atomicWeights.test.ts bounds by CIAAW's interval or uncertainty.
 */
function weightGapBound(atoms: Record<string, number>): number {
  return Object.entries(atoms).reduce(
    (sum, [symbol, count]) => sum + count * Math.abs(atomicWeight(symbol as ElementSymbol) - new MF(symbol).getInfo().mass),
    0,
  );
}

describe('molar masses printed in references.md (§3 chelators, §7 trientine)', () => {
  // Printed to two decimals (Poggiali et al., Blood Transfus 2012;10:411, Table I formulas with CIAAW
  // weights; EASL 2012 and AASLD 2022 for trientine). A correct computation rounds to the printed
  // value, so the tolerance is half a unit in the last printed place (toBeCloseTo(x, 2): |Δ| < 0.005).
  const printed: readonly [string, string, number][] = [
    ['deferoxamine mesylate', 'C25H48N6O8·CH4O3S', 656.79],
    ['deferoxamine base', 'C25H48N6O8', 560.69],
    ['deferiprone', 'C7H9NO2', 139.15],
    ['deferasirox', 'C21H15N3O4', 373.37],
    ['trientine base', 'C6H18N4', 146.24],
    ['trientine dihydrochloride', 'C6H18N4·2HCl', 219.15],
    ['trientine tetrahydrochloride', 'C6H18N4·4HCl', 292.07],
  ];
  for (const [name, formula, gPerMol] of printed) {
    it(`${name} ${formula} = ${gPerMol} g/mol`, () => {
      expect(molarMass(formula)).toBeCloseTo(gPerMol, 2);
    });
  }
});

describe('molarMass against mf-parser, with parentheses and adducts', () => {
  const formulas = [
    'C25H48N6O8·CH4O3S', // deferoxamine mesylate: adduct
    'C6H18N4·2HCl', // trientine dihydrochloride: adduct with a multiplier
    'C6H18N4·4HCl',
    'Ca(OH)2', // group with a count
    'Fe2(SO4)3',
    'Al2((SO4)3)', // nested groups
    'CuSO4·5H2O', // hydrate with a multiplier
    'Cu(C2H3O2)2·H2O', // group and adduct together
    'Pb(C2H3O2)2·3H2O',
    'C10H12CaN2Na2O8', // calcium disodium edetate (anhydrous)
    'C3H8OS2', // dimercaprol
    'C4H6O4S2', // succimer
    'C5H11NO2S', // penicillamine
    'HgCl2',
    'As2O3',
    'Zn(C2H3O2)2·2H2O',
    'Mg(OH)2',
  ];
  for (const formula of formulas) {
    it(`${formula}: same element counts as mf-parser, mass within the atomic-weight gap`, () => {
      const parsed = parseFormula(formula);
      expect(parsed.ok).toBe(true);
      if (!parsed.ok) return;
      const theirs = mfInfo(formula);
      expect(parsed.value).toEqual(theirs.atoms);
      expect(Math.abs(molarMass(formula) - theirs.mass)).toBeLessThanOrEqual(weightGapBound(theirs.atoms) + 1e-9);
    });
  }

  it('reads "·", "*" and "." as the same adduct separator', () => {
    // Same formula three ways: equal to floating-point rounding of one sum (1e-9).
    const reference = molarMass('CuSO4·5H2O');
    expect(molarMass('CuSO4*5H2O')).toBeCloseTo(reference, 9);
    expect(molarMass('CuSO4.5H2O')).toBeCloseTo(reference, 9);
  });
});

describe('parseFormula refuses what it cannot read', () => {
  it.each([
    ['C6H18N4·Xe', 'not in the atomic-weight table'],
    ['Ca(OH2', 'unmatched "("'],
    ['CaOH)2', 'unmatched ")"'],
    ['C7H9NO2·', 'empty part'],
    ['c7h9', 'cannot read'],
  ])('%s → an issue saying "%s"', (formula, words) => {
    const parsed = parseFormula(formula);
    expect(parsed.ok).toBe(false);
    if (parsed.ok) return;
    expect(parsed.issues[0]?.path).toEqual(['formula']);
    expect(parsed.issues[0]?.message).toContain(words);
  });

  it('molarMass throws on a formula it cannot read (catalogue formulas are typed by developers: a bad one is a bug)', () => {
    expect(() => molarMass('Ca(OH2')).toThrow();
  });
});
