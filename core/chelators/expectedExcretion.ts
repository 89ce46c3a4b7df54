import type { Fraction, MgPerDay, Milligrams } from '../units/quantity';
import { metalBoundByDoseMg } from './bindingCapacity';
import { findChelator, type ChelatorId } from './catalogue';

export interface ExpectedExcretionInput {
  readonly chelatorId: ChelatorId;
  /** Dose on a dosing day, mg of the form the product is dosed as (≥ 0). */
  readonly doseMgPerDosingDay: Milligrams;
  /** Dosing days per week, 1–7. */
  readonly daysPerWeek: number;
  /** Share of prescribed doses taken, 0–1. */
  readonly adherence: Fraction;
  /** Share of the (efficiency-basis) dose excreted as iron complex, 0–1 (assumption efficiency-<ligand>). */
  readonly efficiency: Fraction;
  /**
   * Film-coated dose as a fraction of the dispersible-tablet dose (assumption
   * deferasirox-film-coated-factor, 0.7). Used only for products whose entry
   * names efficiencyDoseFactorAssumptionId; ignored for the others.
   */
  readonly efficiencyDoseFactor: Fraction;
}

/**
 * Expected iron excretion per day, averaged over the week:
 *
 * excretion (mg/day) = dose (mg per dosing day) × days per week / 7 × adherence
 *                      × efficiency × theoretical Fe capacity (mg Fe per mg chelator)
 *
 * For deferasirox film-coated tablets the efficiency belongs to the
 * dispersible tablet, so it applies to the dispersible-equivalent dose
 * (film-coated dose ÷ 0.7). Sources: stoichiometry from Poggiali et al., Blood
 * Transfus 2012;10:411, Table I; efficiencies from Porter's reviews (from
 * memory: an uncertain assumption, not a fact about a patient); 0.7 from the
 * deferasirox labels (secondary).
 *
 * @param input - product, dose per dosing day (mg), days per week (1–7), adherence (0–1),
 *   efficiency (0–1), film-coated factor (0.6–0.8)
 * @returns expected iron excretion, mg/day (mean over the week)
 * @example expectedIronExcretionMgPerDay({ chelatorId: 'deferasirox-dispersible',
 *   doseMgPerDosingDay: mg(1000), daysPerWeek: 7, adherence: fraction(1),
 *   efficiency: fraction(0.27), efficiencyDoseFactor: fraction(0.7) }) ≈ 20.19 mg/day
 */
export function expectedIronExcretionMgPerDay(input: ExpectedExcretionInput): MgPerDay {
  const chelator = findChelator(input.chelatorId);
  const efficiencyBasisDoseMg =
    chelator.efficiencyDoseFactorAssumptionId === undefined
      ? input.doseMgPerDosingDay
      : ((input.doseMgPerDosingDay / input.efficiencyDoseFactor) as Milligrams);
  const bound = metalBoundByDoseMg(efficiencyBasisDoseMg, chelator.dosedAsFormId, 'Fe');
  // Every catalogued product's ligand binds Fe: a missing binding is a catalogue bug.
  if (!bound.ok) throw new Error(`Chelator ${chelator.id} has no Fe stoichiometry`);
  return (bound.value * (input.daysPerWeek / 7) * input.adherence * input.efficiency) as MgPerDay;
}
