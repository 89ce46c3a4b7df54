import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { deferasiroxDoseInOtherFormulation, otherDeferasiroxFormulation } from '../../../core/chelators';
import { fraction, mgPerKgPerDay } from '../../../core/units/quantity';

describe('deferasirox formulation', () => {
  it.each([
    [20, 14],
    [10, 7],
    [40, 28],
  ])('dispersible %i mg/kg/day ↔ film-coated %i (deferasirox labels)', (dispersible, filmCoated) => {
    // Label pairs, exact in decimal; floating-point tolerance 1e-9.
    expect(deferasiroxDoseInOtherFormulation(mgPerKgPerDay(dispersible), 'dispersible-tablet', fraction(0.7))).toBeCloseTo(filmCoated, 9);
    expect(deferasiroxDoseInOtherFormulation(mgPerKgPerDay(filmCoated), 'film-coated-tablet', fraction(0.7))).toBeCloseTo(dispersible, 9);
  });

  it('round-trips any dose and any factor (invariant)', () => {
    fc.assert(
      fc.property(fc.double({ min: 1, max: 60, noNaN: true }), fc.double({ min: 0.6, max: 0.8, noNaN: true }), (dose, factor) => {
        const there = deferasiroxDoseInOtherFormulation(mgPerKgPerDay(dose), 'dispersible-tablet', fraction(factor));
        const back = deferasiroxDoseInOtherFormulation(there, otherDeferasiroxFormulation('dispersible-tablet'), fraction(factor));
        return Math.abs(back - dose) <= 1e-12 * dose;
      }),
    );
  });
});
