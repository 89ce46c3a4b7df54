import type { AssumptionId } from '../assumptions';
import type { ElementSymbol } from '../elements/atomicWeights';
import type { SourceStatus } from '../references/source';
import type { SubstanceFormId } from './substanceForms';

/**
 * The iron-chelator catalogue: each ligand with its denticity and the metals
 * it is catalogued to bind (with stoichiometry), and each product as dosed
 * (form, formulation, routes, published dose range and schedule, and the
 * efficiency assumption used for expected excretion).
 *
 * Data only. Molar masses come from ./substanceForms (computed, never typed).
 */

export const ligandIds = ['deferoxamine', 'deferiprone', 'deferasirox'] as const;
export type LigandId = (typeof ligandIds)[number];

/** One metal a ligand binds: how many ligand molecules hold one metal ion. */
export interface MetalBinding {
  readonly metal: ElementSymbol;
  /** Chelator : metal ratio, e.g. 3 for deferiprone : Fe³⁺ = 3 : 1. */
  readonly ligandsPerMetal: number;
  readonly sourceIds: readonly string[];
}

export interface Ligand {
  readonly id: LigandId;
  readonly name: string;
  /** Donor atoms per ligand molecule: 6 hexadentate, 3 tridentate, 2 bidentate. */
  readonly denticity: number;
  readonly bindings: readonly MetalBinding[];
  /** Forms whose mass can be dosed or stated for this ligand (salt and base). */
  readonly formIds: readonly SubstanceFormId[];
}

export const ligandCatalogue = [
  {
    id: 'deferoxamine',
    name: 'deferoxamine',
    // Hexadentate, 1 : 1 with Fe³⁺: Poggiali et al., Blood Transfus 2012;10:411, Table I.
    denticity: 6,
    bindings: [
      { metal: 'Fe', ligandsPerMetal: 1, sourceIds: ['poggiali-2012'] },
      // 1 : 1 with Al³⁺ (aluminoxamine): deferoxamine label, from memory.
      { metal: 'Al', ligandsPerMetal: 1, sourceIds: ['deferoxamine-aluminium-memory'] },
    ],
    formIds: ['deferoxamine-mesylate', 'deferoxamine-base'],
  },
  {
    id: 'deferiprone',
    name: 'deferiprone',
    // Bidentate, 3 : 1 with Fe³⁺: Poggiali et al. 2012, Table I.
    denticity: 2,
    bindings: [{ metal: 'Fe', ligandsPerMetal: 3, sourceIds: ['poggiali-2012'] }],
    formIds: ['deferiprone'],
  },
  {
    id: 'deferasirox',
    name: 'deferasirox',
    // Tridentate, 2 : 1 with Fe³⁺: Poggiali et al. 2012, Table I.
    denticity: 3,
    bindings: [{ metal: 'Fe', ligandsPerMetal: 2, sourceIds: ['poggiali-2012'] }],
    formIds: ['deferasirox'],
  },
] as const satisfies readonly Ligand[];

export type Route = 'subcutaneous' | 'intravenous' | 'intramuscular' | 'oral';
export type Formulation = 'powder-for-injection' | 'tablet' | 'dispersible-tablet' | 'film-coated-tablet';

/** Published dose range and schedule of a product, all in mg/kg/day of the form the product is dosed as. */
export interface DoseGuidance {
  /** Usual daily dose; null where the source gives a range only. */
  readonly usualMgPerKgPerDay: number | null;
  /** Lower end of the published range; null where the source gives none. */
  readonly minMgPerKgPerDay: number | null;
  readonly maxMgPerKgPerDay: number;
  readonly daysPerWeekMin: number;
  readonly daysPerWeekMax: number;
  readonly administrationsPerDay: number;
  /** Schedule as the source states it, descriptive. */
  readonly schedule: string;
  /** Infusion length on a dosing day, hours. */
  readonly infusionHoursMin?: number;
  readonly infusionHoursMax?: number;
  /** Daily cap while a child is growing. */
  readonly growingMaxMgPerKgPerDay?: number;
  /** Intravenous rate cap. */
  readonly intravenousMaxMgPerKgPerHour?: number;
  readonly sourceIds: readonly string[];
  readonly status: SourceStatus;
}

export const chelatorIds = ['deferoxamine', 'deferiprone', 'deferasirox-dispersible', 'deferasirox-film-coated'] as const;
export type ChelatorId = (typeof chelatorIds)[number];

export interface ChelatorEntry {
  readonly id: ChelatorId;
  readonly label: string;
  readonly ligandId: LigandId;
  /** The form the published doses and label strengths refer to. */
  readonly dosedAsFormId: SubstanceFormId;
  readonly formulation: Formulation;
  readonly routes: readonly Route[];
  readonly dose: DoseGuidance;
  /** Assumption giving the share of a dose excreted as iron complex. */
  readonly efficiencyAssumptionId: AssumptionId;
  /**
   * Set when the efficiency was measured with another formulation: the dose is
   * divided by this assumption's factor to give the equivalent dose of the
   * formulation the efficiency belongs to (deferasirox film-coated ÷ 0.7).
   */
  readonly efficiencyDoseFactorAssumptionId?: AssumptionId;
}

export const chelatorCatalogue = [
  {
    id: 'deferoxamine',
    label: 'deferoxamine mesylate, powder for injection',
    ligandId: 'deferoxamine',
    dosedAsFormId: 'deferoxamine-mesylate',
    formulation: 'powder-for-injection',
    routes: ['subcutaneous', 'intravenous', 'intramuscular'],
    dose: {
      // 20–60 mg/kg/day SC over 8–12 h, 5–7 days a week; at most 40 mg/kg/day in children and 60 in adults;
      // IV at most 15 mg/kg/h: US deferoxamine labels 2023/2025 §2 (references.md §9, confirmed); Brittenham,
      // N Engl J Med 2011;364:146 gives the same range.
      usualMgPerKgPerDay: null,
      minMgPerKgPerDay: 20,
      maxMgPerKgPerDay: 60,
      daysPerWeekMin: 5,
      daysPerWeekMax: 7,
      administrationsPerDay: 1,
      schedule: 'subcutaneous infusion over 8–12 hours, 5–7 days a week',
      infusionHoursMin: 8,
      infusionHoursMax: 12,
      growingMaxMgPerKgPerDay: 40,
      intravenousMaxMgPerKgPerHour: 15,
      sourceIds: ['deferoxamine-label', 'brittenham-2011'],
      status: 'confirmed',
    },
    efficiencyAssumptionId: 'efficiency-deferoxamine',
  },
  {
    id: 'deferiprone',
    label: 'deferiprone, tablets or oral solution',
    ligandId: 'deferiprone',
    dosedAsFormId: 'deferiprone',
    formulation: 'tablet',
    routes: ['oral'],
    dose: {
      // 25 mg/kg three times a day = 75 mg/kg/day; doses above 100 mg/kg/day not recommended:
      // deferiprone EU summary of product characteristics 2004, section 4.2 (seen); references.md §3 lists it as secondary.
      usualMgPerKgPerDay: 75,
      minMgPerKgPerDay: null,
      maxMgPerKgPerDay: 100,
      daysPerWeekMin: 7,
      daysPerWeekMax: 7,
      administrationsPerDay: 3,
      schedule: 'by mouth in three doses a day',
      sourceIds: ['deferiprone-label'],
      status: 'confirmed',
    },
    efficiencyAssumptionId: 'efficiency-deferiprone',
  },
  {
    id: 'deferasirox-dispersible',
    label: 'deferasirox, dispersible tablets',
    ligandId: 'deferasirox',
    dosedAsFormId: 'deferasirox',
    formulation: 'dispersible-tablet',
    routes: ['oral'],
    dose: {
      // 20 (10–40) mg/kg/day once daily: deferasirox labels (references.md §3, secondary).
      usualMgPerKgPerDay: 20,
      minMgPerKgPerDay: 10,
      maxMgPerKgPerDay: 40,
      daysPerWeekMin: 7,
      daysPerWeekMax: 7,
      administrationsPerDay: 1,
      schedule: 'by mouth once a day, dispersed in liquid',
      sourceIds: ['deferasirox-label-us'],
      status: 'secondary',
    },
    efficiencyAssumptionId: 'efficiency-deferasirox',
  },
  {
    id: 'deferasirox-film-coated',
    label: 'deferasirox, film-coated tablets or oral granules',
    ligandId: 'deferasirox',
    dosedAsFormId: 'deferasirox',
    formulation: 'film-coated-tablet',
    routes: ['oral'],
    dose: {
      // 14 (7–28) mg/kg/day once daily: deferasirox labels (references.md §3, secondary).
      usualMgPerKgPerDay: 14,
      minMgPerKgPerDay: 7,
      maxMgPerKgPerDay: 28,
      daysPerWeekMin: 7,
      daysPerWeekMax: 7,
      administrationsPerDay: 1,
      schedule: 'by mouth once a day',
      sourceIds: ['deferasirox-label-us'],
      status: 'secondary',
    },
    // The efficiency was measured with the dispersible tablet: apply it to film-coated dose ÷ 0.7.
    efficiencyAssumptionId: 'efficiency-deferasirox',
    efficiencyDoseFactorAssumptionId: 'deferasirox-film-coated-factor',
  },
] as const satisfies readonly ChelatorEntry[];

/** The catalogued ligand with this id. */
export function findLigand(ligandId: LigandId): Ligand {
  const found = ligandCatalogue.find((it) => it.id === ligandId);
  if (!found) throw new Error(`Unknown ligand ${ligandId}`);
  return found;
}

/**
 * The catalogued product a chelation period as recorded belongs to:
 * deferasirox tablets for oral suspension are the dispersible tablets; the
 * oral granules are dosed as the film-coated tablets (US label for the
 * granules, references.md §9), so they share that entry's dose range.
 *
 * @param drug - the period's drug
 * @param formulation - the period's formulation as recorded
 * @returns the catalogue id
 * @example chelatorIdForPeriod('deferasirox', 'granules') === 'deferasirox-film-coated'
 */
export function chelatorIdForPeriod(drug: LigandId, formulation: string): ChelatorId {
  if (drug === 'deferasirox') return formulation === 'dispersible-tablet' ? 'deferasirox-dispersible' : 'deferasirox-film-coated';
  return drug;
}

/** The catalogued product with this id. */
export function findChelator(chelatorId: ChelatorId): ChelatorEntry {
  const found = chelatorCatalogue.find((it) => it.id === chelatorId);
  if (!found) throw new Error(`Unknown chelator ${chelatorId}`);
  return found;
}

/** The ligand a form belongs to, or undefined for forms of non-catalogued ligands (trientine). */
export function ligandOfForm(formId: SubstanceFormId): Ligand | undefined {
  return ligandCatalogue.find((ligand) => (ligand.formIds as readonly SubstanceFormId[]).includes(formId));
}

/** Forms that a catalogued ligand is dosed or stated as: the chelator choices for binding capacity. */
export const chelatingFormIds = ligandCatalogue.flatMap((ligand) => ligand.formIds) as readonly SubstanceFormId[];
