import type { MetalHydrolysisSet, MetalId } from './types';

/**
 * Metal hydrolysis constants: the metal's own side reaction with water.
 *
 * Fe³⁺: Stefánsson A., "Iron(III) hydrolysis and solubility at 25 °C",
 * Environ Sci Technol 2007;41:6117-6123, abstract (confirmed): log *β at infinite
 * dilution, 25 °C: FeOH²⁺ −2.19; Fe(OH)₂⁺ −5.76; Fe(OH)₃(aq) −14.30; Fe(OH)₄⁻ −21.71;
 * Fe₂(OH)₂⁴⁺ −2.92. Used as printed.
 *
 * Decisions (references.md §6, pM convention):
 * - Fe₂(OH)₂⁴⁺ is kept: the solver handles polynuclear species. At 1 µM total iron
 *   with a chelator present it is negligible (free Fe³⁺ near 1e-20 mol/L makes
 *   [Fe₂(OH)₂] = 10^−2.92 [Fe]²/[H]² vanish), so keeping it changes no pM; it
 *   matters only without ligand at high iron and low pH.
 * - Solid Fe(OH)₃ / ferrihydrite is excluded: the pM convention of the
 *   iron-chelator literature is a solution without precipitation. Without a
 *   chelator, real solutions at pH 7.4 would precipitate above about 1e-9 mol/L iron.
 *
 * Other metals: Baes CF, Mesmer RE, The Hydrolysis of Cations (Wiley 1976),
 * I → 0, 25 °C — ALL FROM MEMORY, status 'memory'; only the first one or two
 * steps are entered, so the metal side reaction is underestimated above about
 * pH 10 for divalent ions.
 */
export const metalHydrolysisSets: readonly MetalHydrolysisSet[] = [
  {
    metal: 'Fe3+',
    label: 'Stefánsson 2007, 25 °C, I → 0',
    temperatureC: 25,
    ionicStrengthMolPerL: 0,
    sourceIds: ['stefansson-2007'],
    status: 'confirmed',
    species: [
      { metalCount: 1, hydroxideCount: 1, logBetaStar: -2.19, asPrinted: 'log β(1,1) = −2.19 ± 0.02' },
      { metalCount: 1, hydroxideCount: 2, logBetaStar: -5.76, asPrinted: 'log β(1,2) = −5.76 ± 0.06' },
      { metalCount: 1, hydroxideCount: 3, logBetaStar: -14.3, asPrinted: 'log β(1,3) = −14.30 ± 0.32' },
      { metalCount: 1, hydroxideCount: 4, logBetaStar: -21.71, asPrinted: 'log β(1,4) = −21.71 ± 0.24' },
      { metalCount: 2, hydroxideCount: 2, logBetaStar: -2.92, asPrinted: 'log β(2,2) = −2.92 ± 0.02' },
    ],
    cautions: [
      'Constants at infinite dilution combined with ligand constants at 0.1–0.15 M: the usual practice of the pFe literature; it mixes ionic strengths for the metal side reaction only.',
      'Precipitation of iron(III) hydroxide is excluded by convention.',
    ],
  },
  memorySet('Fe2+', [[1, -9.5]]),
  memorySet('Al3+', [
    [1, -4.97],
    [2, -9.3],
    [3, -15.0],
    [4, -23.0],
  ]),
  memorySet('Cu2+', [[1, -8.0]]),
  memorySet('Zn2+', [[1, -8.96]]),
  memorySet('Pb2+', [[1, -7.71]]),
  memorySet('Cd2+', [[1, -10.08]]),
  memorySet('Hg2+', [
    [1, -3.4],
    [2, -6.17],
  ]),
  memorySet('Ca2+', [[1, -12.85]]),
  memorySet('Mg2+', [[1, -11.44]]),
];

function memorySet(metal: MetalId, steps: readonly (readonly [number, number])[]): MetalHydrolysisSet {
  return {
    metal,
    label: 'Baes & Mesmer 1976, 25 °C, I → 0 (from memory)',
    temperatureC: 25,
    ionicStrengthMolPerL: 0,
    sourceIds: ['baes-mesmer-1976'],
    status: 'memory',
    species: steps.map(([hydroxideCount, logBetaStar]) => ({
      metalCount: 1,
      hydroxideCount,
      logBetaStar,
      asPrinted: `log *β(1,${hydroxideCount}) = ${logBetaStar} (from memory)`,
    })),
    cautions: ['Values from memory of Baes & Mesmer; verify before relying on them. Higher hydroxo complexes omitted.'],
  };
}

/**
 * The hydrolysis set of a metal (every metal in metalIds has one; a missing one is a bug).
 *
 * @param metal - the metal ion
 * @returns its hydrolysis constants with source
 * @example hydrolysisOf('Fe3+').species[0].logBetaStar === −2.19
 */
export function hydrolysisOf(metal: MetalId): MetalHydrolysisSet {
  const found = metalHydrolysisSets.find((it) => it.metal === metal);
  if (!found) throw new Error(`No hydrolysis set for ${metal}`);
  return found;
}
