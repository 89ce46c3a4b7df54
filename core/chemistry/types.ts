import type { Quantity } from '../units/quantity';
import type { SourceStatus } from '../references/source';

/**
 * Types of the binding-chemistry core: metals, ligands, named constant sets.
 *
 * Concentrations inside the chemistry core are molar (mol/L, UCUM 'mol/L');
 * pH is UCUM '[pH]'. Equilibrium constants are decimal logarithms (dimensionless
 * by the usual convention of concentration quotients in mol/L).
 */
export type Molar = Quantity<'mol/L'>;
export type Ph = Quantity<'[pH]'>;

/** Attach mol/L to a number. @example molar(1e-6) is 1 µmol/L */
export const molar = (value: number): Molar => value as Molar;
/** Attach the pH unit to a number. @example ph(7.4) */
export const ph = (value: number): Ph => value as Ph;
/** µmol/L → mol/L (× 1e-6). @example molarFromMicromolar(1) === 1e-6 */
export const molarFromMicromolar = (micromolar: number): Molar => (micromolar * 1e-6) as Molar;

/** Metal ions the constant sets cover. The id is the ion as a chemist writes it. */
export const metalIds = ['Fe3+', 'Fe2+', 'Al3+', 'Cu2+', 'Zn2+', 'Pb2+', 'Cd2+', 'Hg2+', 'Ca2+', 'Mg2+'] as const;
export type MetalId = (typeof metalIds)[number];

export const ligandIds = ['edta', 'dtpa', 'deferoxamine', 'deferiprone', 'deferasirox', 'succimer', 'transferrin'] as const;
export type LigandId = (typeof ligandIds)[number];

/**
 * One complex M_p L_q H_r (r < 0: hydroxo complex, one OH⁻ per negative unit),
 * with its overall formation constant from the free metal ion, the fully
 * deprotonated ligand and H⁺:
 *   β = [M_p L_q H_r] / ([M]^p [L]^q [H]^r)
 */
export interface ComplexConstant {
  readonly metal: MetalId;
  readonly metalCount: number;
  readonly ligandCount: number;
  readonly protonCount: number;
  readonly logBeta: number;
  /** The value as printed in the source and any conversion applied to reach logBeta. */
  readonly asPrinted: string;
}

/** A literature pM that this project did not compute (shown as a literature value only). */
export interface LiteraturePm {
  readonly metal: MetalId;
  readonly pM: number;
  readonly pH: number;
  readonly totalMetalUmolPerL: number;
  readonly totalLigandUmolPerL: number;
  readonly sourceId: string;
  readonly note: string;
}

/**
 * A named constant set: one study's (or one compilation's) protonation and
 * complex constants, kept whole. Sets are never mixed (references.md §6):
 * a computation uses exactly one set per ligand.
 */
export interface LigandConstantSet {
  readonly id: string;
  readonly ligand: LigandId;
  /** Ligand name as shown (generic names only). */
  readonly ligandName: string;
  /** Short label naming the source, e.g. 'Harris textbook set, 25 °C, 0.1 M'. */
  readonly label: string;
  readonly temperatureC: number;
  /** Ionic strength, mol/L; 0 for constants extrapolated to infinite dilution. */
  readonly ionicStrengthMolPerL: number;
  /** Background electrolyte, e.g. '0.1 M KNO3'; 'NaCl' matters: sodium binds some ligands. */
  readonly medium: string;
  readonly sourceIds: readonly string[];
  /** Worst status of any constant in the set (a set is as sure as its least sure value). */
  readonly status: SourceStatus;
  /** Exactly one set per ligand is the default. */
  readonly isDefault: boolean;
  readonly defaultReason?: string;
  /**
   * Stepwise protonation constants log K₁ᴴ, log K₂ᴴ, … of the fully deprotonated
   * ligand L: K₁ᴴ = [HL]/([H][L]) (the most basic site first).
   */
  readonly protonationLogK: readonly number[];
  readonly complexes: readonly ComplexConstant[];
  /**
   * Set only when the constants are conditional at one pH (transferrin):
   * protonation is then already inside the constants, and any other pH is refused.
   */
  readonly conditionalAtPh?: number;
  /** When true, the set's metal constants must not be used to compute (deferasirox). */
  readonly metalConstantsUnconfirmed?: boolean;
  readonly literaturePm?: readonly LiteraturePm[];
  readonly cautions: readonly string[];
}

/** One hydrolysis product M_p(OH)_q with log *β = log([M_p(OH)_q][H]^q / [M]^p). */
export interface HydrolysisConstant {
  readonly metalCount: number;
  readonly hydroxideCount: number;
  readonly logBetaStar: number;
  readonly asPrinted: string;
}

export interface MetalHydrolysisSet {
  readonly metal: MetalId;
  readonly label: string;
  readonly temperatureC: number;
  readonly ionicStrengthMolPerL: number;
  readonly sourceIds: readonly string[];
  readonly status: SourceStatus;
  readonly species: readonly HydrolysisConstant[];
  readonly cautions: readonly string[];
}
