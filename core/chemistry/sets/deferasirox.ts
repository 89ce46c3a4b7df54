import type { LigandConstantSet } from '../types';

/**
 * Deferasirox: two protonation sets that must not be mixed (references.md §6),
 * both secondary (via the Merck Index): aqueous pKa 4.57 / 8.71 / 10.56 and
 * water–DMSO pKa 4.61 / 10.12 / 12.08 (stepwise protonation constants, most basic
 * first: 10.56, 8.71, 4.57 and 12.08, 10.12, 4.61).
 *
 * Its Fe³⁺ log β₂ is NOT confirmed (secondary pages disagree), so no metal
 * constant is entered and pM is never computed for it. Its published pFe 22.5
 * (Nurchi et al., Molecules 2015;20:19725; seen through a page citing it:
 * secondary) is shown as a literature value only, until a primary set is found.
 */
const literaturePfe = [
  {
    metal: 'Fe3+',
    pM: 22.5,
    pH: 7.4,
    totalMetalUmolPerL: 1,
    totalLigandUmolPerL: 10,
    sourceId: 'nurchi-2015',
    note: 'Literature value only: not computed here, because the constants behind it are unconfirmed.',
  },
] as const;

export const deferasiroxSets: readonly LigandConstantSet[] = [
  {
    id: 'deferasirox-aqueous',
    ligand: 'deferasirox',
    ligandName: 'deferasirox',
    label: 'Deferasirox, aqueous pKa set (via the Merck Index); iron constants unconfirmed',
    temperatureC: 25,
    ionicStrengthMolPerL: 0.1,
    medium: 'water (conditions not seen)',
    sourceIds: ['merck-index-deferasirox', 'nurchi-2015'],
    status: 'secondary',
    isDefault: true,
    defaultReason: 'Measured in water, the medium of every other set here.',
    protonationLogK: [10.56, 8.71, 4.57],
    complexes: [],
    metalConstantsUnconfirmed: true,
    literaturePm: literaturePfe,
    cautions: ['Iron constants unconfirmed: pFe is shown only as the published literature value (22.5).'],
  },
  {
    id: 'deferasirox-water-dmso',
    ligand: 'deferasirox',
    ligandName: 'deferasirox',
    label: 'Deferasirox, water–DMSO pKa set (via the Merck Index); iron constants unconfirmed',
    temperatureC: 25,
    ionicStrengthMolPerL: 0.1,
    medium: 'water–DMSO mixture (conditions not seen)',
    sourceIds: ['merck-index-deferasirox', 'nurchi-2015'],
    status: 'secondary',
    isDefault: false,
    protonationLogK: [12.08, 10.12, 4.61],
    complexes: [],
    metalConstantsUnconfirmed: true,
    literaturePm: literaturePfe,
    cautions: [
      'Mixed-solvent constants: not comparable with aqueous sets.',
      'Iron constants unconfirmed: pFe is shown only as the published literature value (22.5).',
    ],
  },
];
