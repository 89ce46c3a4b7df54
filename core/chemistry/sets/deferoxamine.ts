import type { LigandConstantSet } from '../types';
import { complex } from './build';

/**
 * Deferoxamine (desferrioxamine B) constant set.
 *
 * Schwarzenbach G, Schwarzenbach K. Hydroxamatkomplexe I. Helv Chim Acta
 * 1963;46:1390 (20 °C, 0.1 M) — protonation constants FROM MEMORY: terminal
 * ammonium 10.84; hydroxamates 9.70, 9.03, 8.32 (stepwise, most basic first).
 * Fe³⁺: log K = 30.6 for Fe³⁺ + HL²⁻ → FeHL⁺ with HL the ammonium-protonated
 * ligand (references.md §6). Conversion: relative to the fully deprotonated L³⁻,
 * β(FeHL) = K × K₁ᴴ → 30.6 + 10.84 = 41.44. FeL (ammonium deprotonated) is entered
 * with log β = 30.6, on the common-practice assumption that the remote,
 * non-coordinating amine keeps the same pKa in the complex; it matters only above
 * about pH 10.
 * Other metals, from memory, entered the same way (on HL): Al³⁺ 24.1, Cu²⁺ 14.1, Zn²⁺ 10.1.
 * Published protonation sets differ by up to 0.15 per hydroxamate step
 * (references.md §6); only this set is entered until another is checked.
 */
export const deferoxamineSets: readonly LigandConstantSet[] = [
  {
    id: 'deferoxamine-schwarzenbach-1963',
    ligand: 'deferoxamine',
    ligandName: 'deferoxamine',
    label: 'Deferoxamine, Schwarzenbach & Schwarzenbach 1963 (20 °C, 0.1 M)',
    temperatureC: 20,
    ionicStrengthMolPerL: 0.1,
    medium: '0.1 M KCl (from memory)',
    sourceIds: ['schwarzenbach-1963', 'nurchi-2015'],
    status: 'memory',
    isDefault: true,
    defaultReason: 'The only deferoxamine set entered so far; its Fe³⁺ constant (30.6) is the value quoted across the literature.',
    protonationLogK: [10.84, 9.7, 9.03, 8.32],
    complexes: [
      complex('Fe3+', { protons: 1 }, 41.44, 'log K(Fe + HL → FeHL) = 30.6; + log K₁ᴴ 10.84 → log β(FeHL) = 41.44'),
      complex('Fe3+', {}, 30.6, 'FeL taken as log K 30.6 (amine not coordinated; common practice)'),
      complex('Al3+', { protons: 1 }, 24.1 + 10.84, 'log K(AlHL) on HL = 24.1 (from memory) + 10.84'),
      complex('Cu2+', { protons: 1 }, 14.1 + 10.84, 'log K(CuHL) on HL = 14.1 (from memory) + 10.84'),
      complex('Zn2+', { protons: 1 }, 10.1 + 10.84, 'log K(ZnHL) on HL = 10.1 (from memory) + 10.84'),
    ],
    literaturePm: [
      {
        metal: 'Fe3+',
        pM: 26.6,
        pH: 7.4,
        totalMetalUmolPerL: 1,
        totalLigandUmolPerL: 10,
        sourceId: 'nurchi-2015',
        note: 'Published pFe under the standard convention.',
      },
    ],
    cautions: [
      'Protonation constants from memory; other published sets differ by up to 0.15 per hydroxamate step.',
      'Protonated iron complexes below pH 3 (FeH2L, FeH3L) are not entered: pFe below pH 3 is underestimated.',
    ],
  },
];
