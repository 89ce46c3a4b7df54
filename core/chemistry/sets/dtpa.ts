import type { LigandConstantSet } from '../types';
import { complex } from './build';

/**
 * DTPA (pentetate) constant sets. The two compilations disagree on Fe³⁺ by 0.6
 * log units (28.0 against 28.6), hence two sets.
 *
 * 'dtpa-nist46': Martell & Smith, Critical Stability Constants / NIST SRD 46,
 * 25 °C, 0.1 M — ALL VALUES FROM MEMORY: protonation 10.49, 8.60, 4.28, 2.64, 2.0;
 * log K(ML) Fe³⁺ 28.0, Fe²⁺ 16.5, Zn²⁺ 18.4, Ca²⁺ 10.8, Mg²⁺ 9.3, Pb²⁺ 18.8, Cu²⁺ 21.5,
 * Cd²⁺ 19.0.
 * 'dtpa-dojindo': the supplier compilation of chelate stability constants
 * (25 °C, 0.1 M), metal values seen reproduced on another page (secondary):
 * Fe³⁺ 28.6, Fe²⁺ 16.5, Zn²⁺ 18.75, Mg²⁺ 9.3, Ca²⁺ 10.74; its protonation constants
 * from memory of the same table: 10.56, 8.69, 4.37, 2.87, 1.94.
 */
export const dtpaSets: readonly LigandConstantSet[] = [
  {
    id: 'dtpa-nist46',
    ligand: 'dtpa',
    ligandName: 'pentetate (DTPA)',
    label: 'DTPA, Martell & Smith critical constants (25 °C, 0.1 M), from memory',
    temperatureC: 25,
    ionicStrengthMolPerL: 0.1,
    medium: '0.1 M KNO3 (from memory)',
    sourceIds: ['martell-smith-nist46'],
    status: 'memory',
    isDefault: true,
    defaultReason: 'A critically evaluated compilation; the alternative is a supplier table.',
    protonationLogK: [10.49, 8.6, 4.28, 2.64, 2.0],
    complexes: [
      complex('Fe3+', {}, 28.0, 'log K(FeL) = 28.0 (from memory)'),
      complex('Fe2+', {}, 16.5, 'log K(FeL) = 16.5 (from memory)'),
      complex('Zn2+', {}, 18.4, 'log K(ZnL) = 18.4 (from memory)'),
      complex('Ca2+', {}, 10.8, 'log K(CaL) = 10.8 (from memory)'),
      complex('Mg2+', {}, 9.3, 'log K(MgL) = 9.3 (from memory)'),
      complex('Pb2+', {}, 18.8, 'log K(PbL) = 18.8 (from memory)'),
      complex('Cu2+', {}, 21.5, 'log K(CuL) = 21.5 (from memory)'),
      complex('Cd2+', {}, 19.0, 'log K(CdL) = 19.0 (from memory)'),
    ],
    cautions: ['Every constant in this set is from memory: verify against the compilation before relying on it.'],
  },
  {
    id: 'dtpa-dojindo',
    ligand: 'dtpa',
    ligandName: 'pentetate (DTPA)',
    label: 'DTPA, supplier compilation (25 °C, 0.1 M)',
    temperatureC: 25,
    ionicStrengthMolPerL: 0.1,
    medium: '0.1 M',
    sourceIds: ['dojindo-stability-table'],
    status: 'memory',
    isDefault: false,
    protonationLogK: [10.56, 8.69, 4.37, 2.87, 1.94],
    complexes: [
      complex('Fe3+', {}, 28.6, 'log K(FeL) = 28.6 (secondary)'),
      complex('Fe2+', {}, 16.5, 'log K(FeL) = 16.5 (secondary)'),
      complex('Zn2+', {}, 18.75, 'log K(ZnL) = 18.75 (secondary)'),
      complex('Mg2+', {}, 9.3, 'log K(MgL) = 9.3 (secondary)'),
      complex('Ca2+', {}, 10.74, 'log K(CaL) = 10.74 (secondary)'),
    ],
    cautions: ['Metal constants secondary (seen reproduced, not in the table itself); protonation constants from memory.'],
  },
];
