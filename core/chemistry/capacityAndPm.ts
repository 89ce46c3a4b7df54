import { metalBindingCapacityMgPerG } from '../chelators/bindingCapacity';
import { chelatorIds, findChelator, type ChelatorId } from '../chelators/catalogue';
import { substanceForm } from '../chelators/substanceForms';
import { fail, issue, ok, type Issue, type Result } from '../result';
import type { Kilograms, MgPerKgPerDay, Milligrams } from '../units/quantity';
import { pmComparisonAtPhysiologicalPh, type PmComparisonRow } from './pmComparison';
import { defaultSetOf } from './sets';
import type { LigandConstantSet } from './types';
import type { SourceStatus } from '../references/source';

/**
 * Metal ions the capacity comparison offers: those whose binding stoichiometry
 * core/chelators catalogues (Fe³⁺ for every iron chelator; Al³⁺ for deferoxamine).
 * The stoichiometry there is per element; these are the ions it was published for
 * (Poggiali et al. 2012, Table I: Fe³⁺ complexes; aluminoxamine for Al³⁺).
 */
export const capacityMetalIds = ['Fe3+', 'Al3+'] as const;
export type CapacityMetalId = (typeof capacityMetalIds)[number];

const elementOfCapacityMetal = { 'Fe3+': 'Fe', 'Al3+': 'Al' } as const;

/** A daily dose of one catalogued chelator product, with the reason it was chosen. */
export interface ChelatorDailyDose {
  readonly chelatorId: ChelatorId;
  /** Dose on a dosing day, mg/kg of the form the product is dosed as; absent when given in mg only. */
  readonly doseMgPerKgPerDay?: MgPerKgPerDay;
  readonly weightKg?: Kilograms;
  /** Dose on a dosing day in mg, when given directly (then no mg/kg and no weight). */
  readonly doseMg?: Milligrams;
  /** Where the dose comes from, in words (e.g. "usual dose in the catalogue's dose guidance"). */
  readonly doseBasis: string;
}

/** The pM half of a row: a pM comparison row plus the status of the set it names. */
export interface CapacityPm extends PmComparisonRow {
  readonly setStatus: SourceStatus;
}

/** One row of the per-dose capacity comparison. */
export interface CapacityComparisonRow {
  readonly chelatorId: ChelatorId;
  readonly chelatorLabel: string;
  /** The form the dose is stated as, e.g. 'deferoxamine mesylate'. */
  readonly dosedAs: string;
  readonly metal: CapacityMetalId;
  readonly doseMgPerKgPerDay: MgPerKgPerDay | null;
  readonly weightKg: Kilograms | null;
  /** Dose on a dosing day, mg; null when the dose is per kg and no weight was given. */
  readonly doseMg: Milligrams | null;
  readonly doseBasis: string;
  /** Stoichiometric capacity, mg metal per g of chelator as dosed; null when not catalogued for the metal. */
  readonly capacityMgPerG: number | null;
  /** Metal bound by a dosing day's dose at full stoichiometry, mg per kg; null without a per-kg dose or capacity. */
  readonly metalBoundMgPerKg: number | null;
  /** Metal bound by a dosing day's dose at full stoichiometry, mg; null without a dose in mg or capacity. */
  readonly metalBoundMg: Milligrams | null;
  /** Why the capacity is missing (the metal is not catalogued for the ligand), else ''. */
  readonly capacityNote: string;
  readonly capacitySourceIds: readonly string[];
  readonly pm: CapacityPm;
}

/**
 * The dose a comparison uses for a catalogued product: the usual dose of its
 * dose guidance, or, where the guidance gives a range only (deferoxamine
 * 20–60 mg/kg/day), the midpoint of that range, saying so.
 *
 * @param chelatorId - a catalogued product
 * @returns the dose in mg/kg/day on a dosing day with the reason in words
 * @example usualDailyDoseOf('deferoxamine').doseMgPerKgPerDay === 40 ("midpoint of the published range 20–60 mg/kg/day")
 */
export function usualDailyDoseOf(chelatorId: ChelatorId): { doseMgPerKgPerDay: MgPerKgPerDay; doseBasis: string } {
  const { dose } = findChelator(chelatorId);
  if (dose.usualMgPerKgPerDay !== null) {
    return {
      doseMgPerKgPerDay: dose.usualMgPerKgPerDay as MgPerKgPerDay,
      doseBasis: `usual dose in the catalogue's dose guidance (${dose.sourceIds.join(', ')}, ${dose.status})`,
    };
  }
  // A range without a usual dose: its midpoint, stated as such. Every catalogued range has a lower end.
  const low = dose.minMgPerKgPerDay ?? dose.maxMgPerKgPerDay;
  return {
    doseMgPerKgPerDay: ((low + dose.maxMgPerKgPerDay) / 2) as MgPerKgPerDay,
    doseBasis: `midpoint of the published range ${low}–${dose.maxMgPerKgPerDay} mg/kg/day (no single usual dose published; ${dose.sourceIds.join(', ')}, ${dose.status})`,
  };
}

/**
 * One row of the capacity comparison: for one day's dose of one chelator, the
 * metal bound by stoichiometry (core/chelators binding capacity: a ceiling,
 * every ligand molecule bound) next to the ligand's pM at pH 7.4 under the
 * standard convention (1 µM metal, 10 µM ligand; computed by the speciation
 * engine from the named set, or the published value marked "literature value,
 * not computed" when the set's metal constants are unconfirmed, as for deferasirox).
 * The two columns answer different questions: how much a dose could hold, and how
 * firmly the ligand holds the metal against hydrolysis at plasma pH.
 *
 * @param dose - the day's dose: mg/kg/day (with or without weight) or mg, and its basis in words
 * @param metal - Fe3+ (default) or Al3+ (catalogued for deferoxamine only)
 * @param set - the ligand's constant set (default: its default set); must belong to the product's ligand
 * @returns the row, or an issue: 'inconsistent' on ['constantSet'] when the set is another ligand's,
 *   'required' on ['dose'] when no dose is given
 * @example capacityComparisonRow({ chelatorId: 'deferiprone', doseMgPerKgPerDay: 75, weightKg: 52, doseBasis: '…' })
 *   → capacityMgPerG ≈ 133.8, metalBoundMgPerKg ≈ 10.03, metalBoundMg ≈ 521.7, pm.pM ≈ 20.7 (computed)
 */
export function capacityComparisonRow(
  dose: ChelatorDailyDose,
  metal: CapacityMetalId = 'Fe3+',
  set?: LigandConstantSet,
): Result<CapacityComparisonRow> {
  const chelator = findChelator(dose.chelatorId);
  const constantSet = set ?? defaultSetOf(chelator.ligandId);
  if (constantSet.ligand !== chelator.ligandId) {
    return fail(
      issue(
        'inconsistent',
        ['constantSet'],
        `Constant set ${constantSet.id} belongs to ${constantSet.ligandName}, not to ${chelator.ligandId}; choose a ${chelator.ligandId} set.`,
      ),
    );
  }
  const perKg = dose.doseMgPerKgPerDay ?? null;
  const weight = dose.weightKg ?? null;
  const doseMg = dose.doseMg ?? (perKg !== null && weight !== null ? ((perKg * weight) as Milligrams) : null);
  if (perKg === null && doseMg === null) {
    return fail(issue('required', ['dose'], `A dose of ${chelator.label} is required: in mg/kg/day, or in mg.`));
  }
  const capacity = metalBindingCapacityMgPerG(chelator.dosedAsFormId, elementOfCapacityMetal[metal]);
  const capacityMgPerG = capacity.ok ? capacity.value : null;
  const pmRow = pmComparisonAtPhysiologicalPh(metal, undefined, undefined, [constantSet])[0]!;
  return ok({
    chelatorId: chelator.id,
    chelatorLabel: chelator.label,
    dosedAs: substanceForm(chelator.dosedAsFormId).label,
    metal,
    doseMgPerKgPerDay: perKg,
    weightKg: weight,
    doseMg,
    doseBasis: dose.doseBasis,
    capacityMgPerG,
    metalBoundMgPerKg: capacityMgPerG !== null && perKg !== null ? (perKg * capacityMgPerG) / 1000 : null,
    metalBoundMg: capacityMgPerG !== null && doseMg !== null ? (((doseMg / 1000) * capacityMgPerG) as Milligrams) : null,
    capacityNote: capacity.ok ? '' : capacity.issues.map((it: Issue) => it.message).join(' '),
    capacitySourceIds: ['poggiali-2012', 'ciaaw-2021', ...(metal === 'Al3+' ? ['deferoxamine-aluminium-memory'] : [])],
    pm: { ...pmRow, setStatus: constantSet.status },
  });
}

/**
 * The whole capacity comparison: every catalogued iron-chelator product at its
 * usual daily dose (usualDailyDoseOf), one row each, for one metal.
 *
 * @param metal - Fe3+ (default) or Al3+
 * @param weightKg - body weight, kg (1–250), optional: without it rows give mg per kg only
 * @returns one row per catalogued product, in catalogue order
 * @example capacityComparison('Fe3+', kg(52)) → 4 rows: deferoxamine 40 mg/kg/day → ≈ 3.40 mg Fe/kg, pFe ≈ 26.7 (computed);
 *   deferiprone 75 → ≈ 10.03, pFe ≈ 20.8; deferasirox dispersible 20 → ≈ 1.50, film-coated 14 → ≈ 1.05, pFe 22.5 (literature)
 */
export function capacityComparison(metal: CapacityMetalId = 'Fe3+', weightKg?: Kilograms): CapacityComparisonRow[] {
  return chelatorIds.map((chelatorId) => {
    const usual = usualDailyDoseOf(chelatorId);
    const row = capacityComparisonRow({ chelatorId, ...usual, ...(weightKg !== undefined ? { weightKg } : {}) }, metal);
    // Default set of the product's own ligand and a per-kg dose: a refusal here is a bug.
    if (!row.ok) throw new Error(row.issues.map((it) => it.message).join(' '));
    return row.value;
  });
}
