import type { LigandConstantSet } from '../types';
import { complex } from './build';

/**
 * EDTA (edetate) constant sets.
 *
 * Default 'edta-textbook-25c': protonation constants as printed in Harris,
 * Quantitative Chemical Analysis (W.H. Freeman), EDTA chapter: pK₁…pK₆ of H₆Y²⁺ =
 * 0.0, 1.5, 2.00, 2.69, 6.13, 10.37 at 25 °C, I = 0.1 M (edition and table number
 * from memory; the same six values are reproduced in a textbook exercise seen via
 * the search tool: secondary). As stepwise protonation constants of Y⁴⁻ (most basic
 * first) they are 10.37, 6.13, 2.69, 2.00, 1.5, 0.0.
 * Metal log K(MY) from references.md §6 (Martell & Smith, Critical Stability
 * Constants / NIST SRD 46, 25 °C, 0.1 M): Fe³⁺ 25.1, Fe²⁺ 14.3, Pb²⁺ 18.0, Cu²⁺ 18.8,
 * Zn²⁺ 16.5, Ca²⁺ 10.7, Mg²⁺ 8.8, Hg²⁺ 21.5 (21.5–21.9 contested; lower value taken).
 * Cd²⁺ 16.5 and Al³⁺ 16.4: from memory (same compilation).
 * Fe(III) side complexes, from memory: FeHY (log K(MHL) = 1.3 on FeY⁻) and
 * Fe(OH)Y²⁻ (FeY⁻ acid dissociation pKa about 7.5), entered as overall β:
 * FeHY 25.1 + 1.3 = 26.4; Fe(OH)Y: 25.1 − 7.5 = 17.6 (protons −1).
 */
export const edtaSets: readonly LigandConstantSet[] = [
  {
    id: 'edta-textbook-25c',
    ligand: 'edta',
    ligandName: 'edetate (EDTA)',
    label: 'EDTA, textbook protonation set (25 °C, 0.1 M) with Martell & Smith metal constants',
    temperatureC: 25,
    ionicStrengthMolPerL: 0.1,
    medium: '0.1 M (background electrolyte as in the textbook table; not sodium-corrected)',
    sourceIds: ['harris-qca', 'martell-smith-nist46'],
    status: 'memory',
    isDefault: true,
    defaultReason:
      'Its fraction of Y⁴⁻ can be checked against a printed textbook table, and its metal constants come from the critical compilation that table quotes.',
    protonationLogK: [10.37, 6.13, 2.69, 2.0, 1.5, 0.0],
    complexes: [
      complex('Fe3+', {}, 25.1, 'log K(FeY) = 25.1'),
      complex('Fe3+', { protons: 1 }, 26.4, 'log K(FeHY) = 1.3 on FeY (from memory) → log β = 25.1 + 1.3'),
      complex('Fe3+', { protons: -1 }, 17.6, 'pKa of FeY(H2O)⁻ ≈ 7.5 (from memory) → log β(Fe(OH)Y) = 25.1 − 7.5'),
      complex('Fe2+', {}, 14.3, 'log K(FeY) = 14.3'),
      complex('Pb2+', {}, 18.0, 'log K(PbY) = 18.0'),
      complex('Cu2+', {}, 18.8, 'log K(CuY) = 18.8'),
      complex('Zn2+', {}, 16.5, 'log K(ZnY) = 16.5'),
      complex('Ca2+', {}, 10.7, 'log K(CaY) = 10.7'),
      complex('Mg2+', {}, 8.8, 'log K(MgY) = 8.8'),
      complex('Hg2+', {}, 21.5, 'log K(HgY) = 21.5 (21.5–21.9 contested)'),
      complex('Cd2+', {}, 16.5, 'log K(CdY) = 16.5 (from memory)'),
      complex('Al3+', {}, 16.4, 'log K(AlY) = 16.4 (from memory)'),
    ],
    cautions: [
      'Protonation and metal constants are one set: do not combine them with protonation constants from another medium.',
      'Sodium binds EDTA weakly: never add a sodium correction to constants measured in a sodium medium.',
      'Hg²⁺–EDTA constant is contested (21.5–21.9).',
    ],
  },
  {
    id: 'edta-textbook-20c',
    ligand: 'edta',
    ligandName: 'edetate (EDTA)',
    label: 'EDTA, older textbook protonation set (20 °C, 0.1 M; four steps), protonation only',
    temperatureC: 20,
    ionicStrengthMolPerL: 0.1,
    medium: '0.1 M',
    sourceIds: ['edta-alpha4-textbook-table', 'skoog-edta-constants-memory'],
    status: 'memory',
    isDefault: false,
    // pK 2.00, 2.67, 6.16, 10.26 (K4 = 5.50 × 10⁻¹¹): the four-step set of Schwarzenbach as many
    // textbooks print it (Skoog et al.; from memory). It reproduces every value of a textbook
    // table of α4 against pH seen through the search tool (pH 7: 4.8 × 10⁻⁴; pH 10: 0.35), which
    // is how these constants were chosen over the 10.24 / 2.66 recalled earlier. The table uses
    // four steps; the two carboxyl-nitrogen steps (1.5, 0.0) matter only below pH 3.
    protonationLogK: [10.26, 6.16, 2.67, 2.0],
    complexes: [],
    cautions: ['Protonation constants only (from memory, checked against a printed α4 table): use it for the fraction of Y⁴⁻, not for pM.'],
  },
];
