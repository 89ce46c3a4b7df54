import type { LigandConstantSet } from '../types';

/**
 * Succimer (meso-2,3-dimercaptosuccinic acid, DMSA) protonation constants as
 * printed in PubMed Central PMC7997625, Table 2 ("Experimental protonation
 * constant values of DMSA in NaCl at I = 0.15 mol L⁻¹"), confirmed. Overall log β
 * (H⁺ + L⁴⁻ …):
 *   298.15 K: 11.01, 20.32, 23.87, 26.39 → stepwise 11.01, 9.31, 3.55, 2.52
 *   310.15 K: 11.27, 20.64, 24.35, 26.85 → stepwise 11.27, 9.37, 3.71, 2.50
 * (stepwise = differences of consecutive overall values).
 *
 * No metal constant is entered: none was confirmed (lead–succimer constants in the
 * literature depend on the isomer and on protonated and dinuclear species). pM is
 * therefore refused for succimer until a set is entered.
 * Measured in NaCl: the sodium interaction is inside the constants; never add a
 * sodium correction on top.
 */
export const succimerSets: readonly LigandConstantSet[] = [
  {
    id: 'succimer-37c-nacl',
    ligand: 'succimer',
    ligandName: 'succimer',
    label: 'Succimer protonation, 37 °C, 0.15 M NaCl (PMC7997625 Table 2)',
    temperatureC: 37,
    ionicStrengthMolPerL: 0.15,
    medium: '0.15 M NaCl',
    sourceIds: ['pmc7997625-succimer'],
    status: 'confirmed',
    isDefault: true,
    defaultReason: 'Body temperature and plasma ionic strength.',
    protonationLogK: [11.27, 9.37, 3.71, 2.5],
    complexes: [],
    cautions: ['No metal constants entered yet (none confirmed): pM is refused.', 'Sodium medium: no sodium correction on top.'],
  },
  {
    id: 'succimer-25c-nacl',
    ligand: 'succimer',
    ligandName: 'succimer',
    label: 'Succimer protonation, 25 °C, 0.15 M NaCl (PMC7997625 Table 2)',
    temperatureC: 25,
    ionicStrengthMolPerL: 0.15,
    medium: '0.15 M NaCl',
    sourceIds: ['pmc7997625-succimer'],
    status: 'confirmed',
    isDefault: false,
    protonationLogK: [11.01, 9.31, 3.55, 2.52],
    complexes: [],
    cautions: ['No metal constants entered yet (none confirmed): pM is refused.', 'Sodium medium: no sodium correction on top.'],
  },
];
