import { issue, type Issue } from '../result';
import type { NumberInputSpec } from './types';
import { describeRange, rangeFor } from './validate';

/** The inputs of a calculator that takes a dose in mg, or per kg with the body weight. */
export interface DoseEntryInputs {
  /** The dose in mg: its input spec. */
  readonly doseMg: NumberInputSpec;
  /** The dose per kg: its input name and spec (mg/kg or mg/kg/d). */
  readonly perKg: { readonly name: string; readonly spec: NumberInputSpec };
  /** The body weight: its input spec. */
  readonly weightKg: NumberInputSpec;
}

/**
 * The one refusal of a dose given in mg, or per kg with the body weight: both given, neither
 * given, or a dose per kg without the weight. The ranges named come from the inputs' own specs
 * (the plausible range a typed value is checked against), so the message and the check agree.
 *
 * @param given - the validated values (absent ones undefined)
 * @param inputs - the three inputs' specs
 * @returns the refusals (empty when the dose can be resolved)
 * @example doseEntryRefusals({ doseMg: 500, perKg: undefined, weightKg: undefined }, inputs).length === 0
 */
export function doseEntryRefusals(
  given: { readonly doseMg: number | undefined; readonly perKg: number | undefined; readonly weightKg: number | undefined },
  inputs: DoseEntryInputs,
): Issue[] {
  const perKgRange = rangeFor(inputs.perKg.spec, 'entered');
  const perKgUnit = inputs.perKg.spec.unit;
  if (given.doseMg !== undefined && given.perKg !== undefined) {
    return [issue('inconsistent', [inputs.perKg.name], `Enter the dose either in mg (${given.doseMg} mg given) or in ${perKgUnit} with the weight, not both.`)];
  }
  if (given.doseMg === undefined && given.perKg === undefined) {
    return [
      issue(
        'required',
        ['doseMg'],
        `Dose is required: in mg (${describeRange(rangeFor(inputs.doseMg, 'entered'))}), or in ${perKgUnit} (${describeRange(perKgRange)}) with the body weight.`,
      ),
    ];
  }
  if (given.perKg !== undefined && given.weightKg === undefined) {
    return [issue('required', ['weightKg'], `Body weight is required with a dose of ${given.perKg} ${perKgUnit} (${describeRange(rangeFor(inputs.weightKg, 'entered'))}).`)];
  }
  return [];
}
