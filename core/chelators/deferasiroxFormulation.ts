import type { Fraction, MgPerKgPerDay } from '../units/quantity';

export const deferasiroxFormulations = ['dispersible-tablet', 'film-coated-tablet'] as const;
export type DeferasiroxFormulation = (typeof deferasiroxFormulations)[number];

/**
 * The deferasirox dose in the other tablet formulation that gives about the
 * same exposure: film-coated = dispersible × 0.7; dispersible = film-coated ÷ 0.7.
 *
 * Source: deferasirox labels (film-coated 14 mg/kg/day ≈ dispersible 20;
 * ranges 7–28 and 10–40), assumption 'deferasirox-film-coated-factor' (secondary).
 *
 * @param doseMgPerKgPerDay - dose in the `from` formulation, mg/kg/day (label ranges 10–40 dispersible, 7–28 film-coated)
 * @param from - formulation the dose is stated for
 * @param filmCoatedFactor - film-coated dose as a fraction of the dispersible dose (0.6–0.8; 0.7 default)
 * @returns dose in the other formulation, mg/kg/day
 * @example deferasiroxDoseInOtherFormulation(mgPerKgPerDay(20), 'dispersible-tablet', fraction(0.7)) ≈ 14
 */
export function deferasiroxDoseInOtherFormulation(
  doseMgPerKgPerDay: MgPerKgPerDay,
  from: DeferasiroxFormulation,
  filmCoatedFactor: Fraction,
): MgPerKgPerDay {
  const converted = from === 'dispersible-tablet' ? doseMgPerKgPerDay * filmCoatedFactor : doseMgPerKgPerDay / filmCoatedFactor;
  return converted as MgPerKgPerDay;
}

/** The formulation a conversion from `from` leads to. */
export function otherDeferasiroxFormulation(from: DeferasiroxFormulation): DeferasiroxFormulation {
  return from === 'dispersible-tablet' ? 'film-coated-tablet' : 'dispersible-tablet';
}
