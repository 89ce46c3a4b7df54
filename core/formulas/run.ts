import type { AssumptionOverrides } from '../assumptions';
import { fail, issue, ok, type Result } from '../result';
import type { Derivation, DerivedInput, DerivedValue, Origin } from './derivation';
import { isRefusal, type Formula, type InputSpecs, type InputValues, type OutputSpecs, type RawInputs, type OutputValues } from './types';
import { validateInputs, type CheckMode } from './validate';

export interface FormulaRun<Outputs extends OutputSpecs = OutputSpecs> {
  readonly outputs: OutputValues<Outputs>;
  readonly derivation: Derivation;
}

export interface RunOptions {
  /** Origins of the supplied inputs (entered by default; computed inputs carry their derivation). */
  readonly origins?: Readonly<Record<string, Origin>>;
  readonly overrides?: AssumptionOverrides;
  /** `entered` (default; a calculator) or `record` (values from a checked case; see core/formulas/validate.ts). */
  readonly mode?: CheckMode;
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
  const validated = validateInputs(formula.inputs, raw, options.origins, options.overrides, options.mode);
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
    // Valid inputs at the edge of floating point (a denormal divisor) can still overflow.
    if (typeof output.value === 'number' && !Number.isFinite(output.value)) {
      return fail(
        issue('out_of_range', [output.name], `${formula.title}: the inputs give no finite ${output.label} (an input is too close to zero or too large for the calculation); nothing was computed.`),
      );
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
  }, validated.value.warnings);
}

/**
 * Run a formula from inside core (a review's headline numbers) on values from a checked
 * case: the possible ranges apply (the case model already warned about implausible ones), with the inputs typed from the formula's spec so a misspelt
 * name or a value of the wrong type does not compile. A refusal is a value: the
 * caller turns it into an issue or a notice, never a throw.
 *
 * @example runInternal(ironIntakeRate, { totalIronMg: 5000, weightKg: 50, windowDays: 365 }).ok === true
 */
export function runInternal<Inputs extends InputSpecs, Outputs extends OutputSpecs>(
  formula: Formula<Inputs, Outputs>,
  raw: RawInputs<Inputs>,
  options: RunOptions = {},
): Result<FormulaRun<Outputs>> {
  const result = runFormula(formula, raw as Readonly<Record<string, unknown>>, { mode: 'record', ...options });
  if (result.ok) return result;
  return fail(...result.issues.map((it) => (it.severity === 'error' ? { ...it, message: `Not computed (${formula.id}): ${it.message}` } : it)));
}
