import fc from 'fast-check';
import { MF } from 'mf-parser';
import { describe, expect, it } from 'vitest';
import { chelatingFormIds, metalBindingCapacityMgPerG, metalBoundByDoseMg } from '../../../core/chelators';
import { mg } from '../../../core/units/quantity';

function capacity(...args: Parameters<typeof metalBindingCapacityMgPerG>): number {
  const result = metalBindingCapacityMgPerG(...args);
  if (!result.ok) throw new Error(result.issues[0]!.message);
  return result.value;
}

describe('theoretical iron per gram (Poggiali et al., Blood Transfus 2012;10:411, Table I)', () => {
  // How we know the reference values ≈ 85, ≈ 134, ≈ 75 mg Fe per g: Table I gives the chelator : Fe
  // ratios (1 : 1, 3 : 1, 2 : 1) and the formulas; references.md §3 gives the arithmetic
  // 55.845 / (ratio × M) × 1000 with the printed molar masses 656.79, 139.15, 373.37 g/mol:
  //   deferoxamine mesylate 55.845 / 656.79 × 1000 = 85.03; deferiprone 55.845 / (3 × 139.15) × 1000 = 133.77;
  //   deferasirox 55.845 / (2 × 373.37) × 1000 = 74.79.
  // The deferoxamine figure also matches the label's statement (from memory) that 100 parts by weight
  // of the mesylate bind about 8.5 parts of ferric iron. Tolerance: the rounded reference (85, 134, 75)
  // to ± 0.5, i.e. its last printed digit; and the unrounded arithmetic above to ± 0.01 (it uses the
  // printed two-decimal molar masses, which differ from ours by < 0.005 g/mol, i.e. < 0.001 mg/g).
  it.each([
    ['deferoxamine-mesylate', 85, 85.03],
    ['deferiprone', 134, 133.77],
    ['deferasirox', 75, 74.79],
  ] as const)('%s binds ≈ %i mg Fe per g (%f by the printed arithmetic)', (formId, rounded, unrounded) => {
    const value = capacity(formId, 'Fe');
    expect(Math.abs(value - rounded)).toBeLessThanOrEqual(0.5);
    expect(Math.abs(value - unrounded)).toBeLessThanOrEqual(0.01);
  });

  it('agrees with the same arithmetic done with mf-parser’s molar masses (independent library)', () => {
    // Only the atomic weights differ (tests/core/elements): relative agreement 1e-4.
    const mfMass = (formula: string): number => new MF(formula).getInfo().mass;
    const feMass = mfMass('Fe');
    const independent = {
      'deferoxamine-mesylate': (1000 * feMass) / (1 * mfMass('C25H48N6O8 . CH4O3S')),
      'deferoxamine-base': (1000 * feMass) / (1 * mfMass('C25H48N6O8')),
      deferiprone: (1000 * feMass) / (3 * mfMass('C7H9NO2')),
      deferasirox: (1000 * feMass) / (2 * mfMass('C21H15N3O4')),
    } as const;
    for (const [formId, expected] of Object.entries(independent)) {
      const value = capacity(formId as keyof typeof independent, 'Fe');
      expect(Math.abs(value - expected) / expected, formId).toBeLessThan(1e-4);
    }
  });

  it('gives deferoxamine ≈ 4.1 mg Al per 100 mg of the mesylate (label, from memory: 4.1 parts Al³⁺ per 100 parts)', () => {
    // 26.98 / 656.79 × 100 = 4.108; the label figure is printed to two significant figures (± 0.05).
    expect(Math.abs(capacity('deferoxamine-mesylate', 'Al') / 10 - 4.1)).toBeLessThanOrEqual(0.05);
  });

  it('binds more per gram as the base than as the mesylate, by the ratio of molar masses', () => {
    // Same molecules, less mass per mole: 656.79 / 560.69 = 1.1714 (printed molar masses, ± 1e-4).
    expect(capacity('deferoxamine-base', 'Fe') / capacity('deferoxamine-mesylate', 'Fe')).toBeCloseTo(656.79 / 560.69, 4);
  });
});

describe('metal bound by a dose', () => {
  it('2 g of deferoxamine mesylate binds ≈ 170 mg Fe (label: 100 parts bind ≈ 8.5 parts, from memory)', () => {
    // 2000 mg × 8.5 % = 170 mg; label figure to two significant figures: ± 1 mg.
    const bound = metalBoundByDoseMg(mg(2000), 'deferoxamine-mesylate', 'Fe');
    expect(bound.ok && Math.abs(bound.value - 170)).toBeLessThanOrEqual(1);
  });

  it('is linear in the dose and zero at zero (property over any catalogued form and dose)', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...chelatingFormIds),
        fc.double({ min: 1, max: 20000, noNaN: true }),
        fc.double({ min: 0.01, max: 10, noNaN: true }),
        (formId, doseMg, factor) => {
          const one = metalBoundByDoseMg(mg(doseMg), formId, 'Fe');
          const scaled = metalBoundByDoseMg(mg(doseMg * factor), formId, 'Fe');
          const zero = metalBoundByDoseMg(mg(0), formId, 'Fe');
          if (!one.ok || !scaled.ok || !zero.ok) return false;
          // Relative floating-point tolerance: a few products and quotients, 1e-12.
          return Math.abs(scaled.value - one.value * factor) <= 1e-12 * Math.max(1, scaled.value) && zero.value === 0;
        },
      ),
    );
  });

  it('refuses a metal the ligand is not catalogued for, naming the metal and the catalogued ones', () => {
    const refused = metalBoundByDoseMg(mg(1000), 'deferiprone', 'Al');
    expect(refused.ok).toBe(false);
    if (refused.ok) return;
    expect(refused.issues[0]?.code).toBe('not_applicable');
    expect(refused.issues[0]?.path).toEqual(['metal']);
    expect(refused.issues[0]?.message).toBe('Metal Al is not catalogued for deferiprone: its binding stoichiometry is catalogued only for Fe.');
  });

  it('refuses a form with no catalogued ligand (trientine)', () => {
    const refused = metalBindingCapacityMgPerG('trientine-base', 'Cu');
    expect(refused.ok).toBe(false);
    expect(!refused.ok && refused.issues[0]?.path).toEqual(['chelatorForm']);
  });
});
