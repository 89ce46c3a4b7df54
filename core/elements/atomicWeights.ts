import type { Quantity } from '../quantity';

/** Molar mass and atomic weight, g/mol (the same brand as core/units' GramsPerMole). */
type GramsPerMole = Quantity<'g/mol'>;

/**
 * Standard atomic weights used by the core, in g/mol.
 *
 * Source: CIAAW, "Standard atomic weights of the elements 2021", Prohaska et
 * al., Pure Appl Chem 2022;94:573 (source id 'ciaaw-2021'). Where CIAAW gives a
 * single value we use it with the printed precision; where it gives an interval
 * (H, C, N, O, Mg, S, Cl, Pb) we use CIAAW's conventional value, which is what
 * chemistry references and molar-mass tables use. Typed from memory of the
 * table; tests/core/elements checks every value against the mf-parser package
 * (cheminfo's element table) and against the molar masses in references.md.
 */
export const atomicWeightsGPerMol = {
  H: 1.008, // interval [1.00784, 1.00811]; conventional 1.008
  C: 12.011, // interval [12.0096, 12.0116]; conventional 12.011
  N: 14.007, // interval [14.00643, 14.00728]; conventional 14.007
  O: 15.999, // interval [15.99903, 15.99977]; conventional 15.999
  Na: 22.98976928, // single value
  Mg: 24.305, // interval [24.304, 24.307]; conventional 24.305
  Al: 26.9815384, // single value
  S: 32.06, // interval [32.059, 32.076]; conventional 32.06
  Cl: 35.45, // interval [35.446, 35.457]; conventional 35.45
  Ca: 40.078, // single value
  Fe: 55.845, // single value (± 0.002)
  Cu: 63.546, // single value (± 0.003)
  Zn: 65.38, // single value (± 0.02)
  As: 74.921595, // single value
  Hg: 200.592, // single value (± 0.003)
  Pb: 207.2, // interval [206.14, 207.94] since 2020; conventional 207.2
} as const satisfies Record<string, number>;

export type ElementSymbol = keyof typeof atomicWeightsGPerMol;

export const elementSymbols = Object.keys(atomicWeightsGPerMol) as readonly ElementSymbol[];

export function isElementSymbol(symbol: string): symbol is ElementSymbol {
  return Object.prototype.hasOwnProperty.call(atomicWeightsGPerMol, symbol);
}

/**
 * Standard atomic weight of an element.
 *
 * @param symbol - element symbol from the table above, e.g. 'Fe'
 * @returns g/mol
 * @example atomicWeight('Fe') === 55.845
 */
export function atomicWeight(symbol: ElementSymbol): GramsPerMole {
  return atomicWeightsGPerMol[symbol] as GramsPerMole;
}
