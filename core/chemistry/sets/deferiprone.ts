import type { LigandConstantSet } from '../types';
import { complex } from './build';

/**
 * Deferiprone constant sets: two study lineages whose Fe³⁺ log β₃ differ by 1.5
 * (35.9 against 37.2–37.4, references.md §6), so their pFe differ by about 1.4.
 *
 * Only FeL₃ is entered in each set: at the pM convention (10:1 ligand excess) it
 * carries more than 99 % of the iron. Without FeL and FeL₂, pM at ligand : metal
 * ratios below about 3 is too low (the lower complexes would hold iron there).
 *
 * 'deferiprone-remeasured-2019': pKa 3.5 and 9.8 as printed in PubMed Central
 * PMC6469224, Table 2 (deferiprone re-measured as a reference ligand; that table
 * also prints its pFe 20.8 at pH 7.4, 1 µM Fe, 10 µM ligand) — confirmed.
 * Stepwise protonation constants of L⁻: 9.8, 3.5. log β₃ = 37.4: the upper value of
 * the higher lineage (references.md §6), FROM MEMORY; that table does not print β₃.
 *
 * 'deferiprone-motekaitis-martell-1991': Motekaitis RJ, Martell AE, Inorg Chim
 * Acta 1991;183:71 — FROM MEMORY: pKa 9.77 and 3.6; log β₃ 35.9 (references.md
 * gives 35.9 for the lower lineage). The confirmed pFe 19.4 (Liu, Hider et al.,
 * Bioorg Med Chem 2001;9:563, abstract) sits in this lineage.
 */
export const deferiproneSets: readonly LigandConstantSet[] = [
  {
    id: 'deferiprone-remeasured-2019',
    ligand: 'deferiprone',
    ligandName: 'deferiprone',
    label: 'Deferiprone, pKa 9.8 / 3.5 (re-measured, PMC6469224) with log β₃ 37.4',
    temperatureC: 25,
    ionicStrengthMolPerL: 0.1,
    medium: '0.1 M KCl (from memory)',
    sourceIds: ['pmc6469224-deferiprone', 'hider-deferiprone-beta3'],
    status: 'memory',
    isDefault: true,
    defaultReason:
      'Its protonation constants and its pFe (20.8) were seen in print from one recent re-measurement; β₃ 37.4 reproduces that pFe.',
    protonationLogK: [9.8, 3.5],
    complexes: [complex('Fe3+', { ligands: 3 }, 37.4, 'log β₃ = 37.4 (from memory; lineage 37.2–37.4)')],
    literaturePm: [
      {
        metal: 'Fe3+',
        pM: 20.8,
        pH: 7.4,
        totalMetalUmolPerL: 1,
        totalLigandUmolPerL: 10,
        sourceId: 'pmc6469224-deferiprone',
        note: 'Re-measured reference value (Table 2).',
      },
    ],
    cautions: ['FeL and FeL₂ not entered: pFe at ligand : iron ratios below about 3 is too low.'],
  },
  {
    id: 'deferiprone-motekaitis-martell-1991',
    ligand: 'deferiprone',
    ligandName: 'deferiprone',
    label: 'Deferiprone, Motekaitis & Martell 1991 lineage (log β₃ 35.9), from memory',
    temperatureC: 25,
    ionicStrengthMolPerL: 0.1,
    medium: '0.1 M KCl (from memory)',
    sourceIds: ['motekaitis-martell-1991', 'liu-hider-2001'],
    status: 'memory',
    isDefault: false,
    protonationLogK: [9.77, 3.6],
    complexes: [complex('Fe3+', { ligands: 3 }, 35.9, 'log β₃ = 35.9 (from memory)')],
    literaturePm: [
      {
        metal: 'Fe3+',
        pM: 19.4,
        pH: 7.4,
        totalMetalUmolPerL: 1,
        totalLigandUmolPerL: 10,
        sourceId: 'liu-hider-2001',
        note: 'pFe of deferiprone in the abstract.',
      },
    ],
    cautions: ['Every constant from memory.', 'FeL and FeL₂ not entered: pFe at ligand : iron ratios below about 3 is too low.'],
  },
];
