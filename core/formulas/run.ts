import type { AssumptionOverrides } from '../assumptions';
import { fail, ok, type Result } from '../result';
import type { Derivation, DerivedInput, DerivedValue, Origin } from './derivation';
import { isRefusal, type Formula, type InputSpecs, type InputValues, type OutputSpecs, type OutputValues } from './types';
import { validateInputs } from './validate';

export interface FormulaRun<Outputs extends OutputSpecs = OutputSpecs> {
  readonly outputs: OutputValues<Outputs>;
  readonly derivation: Derivation;
}

export interface RunOptions {
  /** Origins of the supplied inputs (entered by default; computed inputs carry their derivation). */
  readonly origins?: Readonly<Record<string, Origin>>;
  readonly overrides?: AssumptionOverrides;
}

/**
 * Validate the inputs, compute, and record the derivation in one pass.
 *
 * @param formula - a formula from the catalogue
 * @param raw - input values by name (numbers, or strings to be parsed)
 * @returns outputs and their derivation, or every issue with the inputs
 * @example runFormula(transfusionIron, { volumeMl: 280, unitHaematocrit: 0.6 })
 *   → ok({ outputs: { ironMg: 181.44 }, derivation: {...} })
 */
export function runFormula<Inputs extends InputSpecs, Outputs extends OutputSpecs>(
  formula: Formula<Inputs, Outputs>,
  raw: Readonly<Record<string, unknown>>,
  options: RunOptions = {},
): Result<FormulaRun<Outputs>> {
  const validated = validateInputs(formula.inputs, raw, options.origins, options.overrides);
  if (!validated.ok) return fail(...validated.issues);
  const computed = formula.compute(validated.value.values as InputValues<Inputs>);
  if (isRefusal(computed)) return fail(...computed.refused);
  const inputs: DerivedInput[] = Object.entries(formula.inputs)
    .filter(([name]) => validated.value.values[name] !== undefined)
    .map(([name, spec]) => ({
      name,
      label: spec.label,
      value: validated.value.values[name]!,
      unit:
        spec.kind !== 'number'
          ? ''
          : spec.unitFrom !== undefined && typeof validated.value.values[spec.unitFrom] === 'string'
            ? (validated.value.values[spec.unitFrom] as string)
            : spec.unit,
      origin: validated.value.origins[name]!,
    }));
  const outputs: DerivedValue[] = Object.entries(formula.outputs).map(([name, spec]) => ({
    name,
    label: spec.label,
    value: (computed as Record<string, number | string>)[name]!,
    unit: spec.unit,
  }));
  for (const output of outputs) {
    if (typeof output.value === 'number' && !Number.isFinite(output.value)) {
      throw new Error(`Formula ${formula.id} produced a non-finite ${output.name} from valid inputs`);
    }
  }
  return ok({
    outputs: computed,
    derivation: {
      formulaId: formula.id,
      title: formula.title,
      expression: formula.expression,
      inputs,
      outputs,
      sourceIds: formula.sourceIds,
    },
  });
}

/** Run a formula whose inputs are known to be valid (core-internal use); throws on issues, which would be a bug. */
export function runTrusted<Inputs extends InputSpecs, Outputs extends OutputSpecs>(
  formula: Formula<Inputs, Outputs>,
  raw: Readonly<Record<string, unknown>>,
  options: RunOptions = {},
): FormulaRun<Outputs> {
  const result = runFormula(formula, raw, options);
  if (!result.ok) {
    throw new Error(`Formula ${formula.id} refused trusted inputs: ${result.issues.map((it) => it.message).join('; ')}`);
  }
  return result.value;
}
