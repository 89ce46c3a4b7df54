import type { LigandConstantSet } from '../types';
import { complex } from './build';

/**
 * Transferrin as a reference protein: conditional constants at pH 7.4 for the
 * two metal sites of one apotransferrin molecule (L):
 *   M + L → ML (K₁);  M + ML → M₂L (K₂);  β(M₂L) = K₁K₂.
 * The constants already contain protonation and the synergistic bicarbonate, so
 * they are valid only at pH 7.4 (other pH values are refused).
 *
 * 'transferrin-martin-1987': Martin RB, Savory J, Brown S, Bertholf RL, Wills MR,
 * "Transferrin binding of Al³⁺ and Fe³⁺", Clin Chem 1987;33:405-407, abstract
 * (confirmed): pH 7.4, 27 mmol/L HCO₃⁻: Fe³⁺ log K₁ 22.7, log K₂ 22.1;
 * Al³⁺ log K₁ 12.9, log K₂ 12.3.
 * 'transferrin-aisen-1978': Aisen P, Leibman A, Zweier J, J Biol Chem
 * 1978;253:1930 — FROM MEMORY: K₁ 4.7 × 10²⁰, K₂ 2.4 × 10¹⁹ M⁻¹ (log 20.67, 19.38)
 * at pH 7.4 with bicarbonate in equilibrium with air; Martin et al. say their
 * values agree with "a revision" of the dialysis values, i.e. not with these.
 */
export const transferrinSets: readonly LigandConstantSet[] = [
  {
    id: 'transferrin-martin-1987',
    ligand: 'transferrin',
    ligandName: 'transferrin (reference protein)',
    label: 'Transferrin, conditional constants at pH 7.4, 27 mM bicarbonate (Martin et al. 1987)',
    temperatureC: 25,
    ionicStrengthMolPerL: 0.15,
    medium: 'plasma-like: pH 7.4, 27 mmol/L bicarbonate',
    sourceIds: ['martin-1987'],
    status: 'confirmed',
    isDefault: true,
    defaultReason: 'Measured at plasma bicarbonate (27 mM) and said by its authors to agree with revised dialysis values.',
    protonationLogK: [],
    conditionalAtPh: 7.4,
    complexes: [
      complex('Fe3+', {}, 22.7, 'log K₁ = 22.7'),
      complex('Fe3+', { metals: 2 }, 22.7 + 22.1, 'log K₂ = 22.1 → log β(M₂L) = 22.7 + 22.1'),
      complex('Al3+', {}, 12.9, 'log K₁ = 12.9'),
      complex('Al3+', { metals: 2 }, 12.9 + 12.3, 'log K₂ = 12.3 → log β(M₂L) = 12.9 + 12.3'),
    ],
    cautions: [
      'Conditional constants at pH 7.4 only: no other pH is computed.',
      'One ligand unit is one transferrin molecule with two sites; enter transferrin as molecules, not sites.',
    ],
  },
  {
    id: 'transferrin-aisen-1978',
    ligand: 'transferrin',
    ligandName: 'transferrin (reference protein)',
    label: 'Transferrin, conditional constants at pH 7.4, air bicarbonate (Aisen et al. 1978), from memory',
    temperatureC: 25,
    ionicStrengthMolPerL: 0.1,
    medium: 'pH 7.4, bicarbonate in equilibrium with air (from memory)',
    sourceIds: ['aisen-1978'],
    status: 'memory',
    isDefault: false,
    protonationLogK: [],
    conditionalAtPh: 7.4,
    complexes: [
      complex('Fe3+', {}, 20.67, 'K₁ = 4.7 × 10²⁰ M⁻¹ (from memory) → log 20.67'),
      complex('Fe3+', { metals: 2 }, 20.67 + 19.38, 'K₂ = 2.4 × 10¹⁹ M⁻¹ (from memory) → log β(M₂L) = 40.05'),
    ],
    cautions: ['From memory; superseded at plasma bicarbonate by the 1987 values.', 'Conditional constants at pH 7.4 only.'],
  },
];
