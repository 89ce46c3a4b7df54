import type { Issue } from '../result';

/**
 * A formula is data plus a pure function. The same definition drives the
 * command line (`calc --list`, `calc <id>`), input validation, derivations and
 * the method appendix, so none of them can drift from what is computed.
 */

export interface NumberInputSpec {
  readonly kind: 'number';
  /** Short label in the trade's words, e.g. 'unit haematocrit'. */
  readonly label: string;
  /** Unit as shown to the user (UCUM code where one exists; '1' for a fraction). */
  readonly unit: string;
  /**
   * Accepted range, inclusive (the lower end exclusive with `minExclusive`). A value outside
   * it is refused with this range stated. Quantities a case file also holds take it from
   * core/ranges (`...inputRange(weightBounds)`), so a calculator and `check` agree.
   */
  readonly min: number;
  readonly max: number;
  readonly minExclusive?: boolean;
  readonly maxExclusive?: boolean;
  /** Plausible range: inside the accepted range but outside this one, the value is kept with a warning. */
  readonly plausible?: { readonly min: number; readonly max: number };
  /** Said after the range when a value is refused ("; for children use egfr-schwartz-bedside"). */
  readonly outsideAdvice?: string;
  readonly meaning: string;
  readonly integer?: boolean;
  /** A fixed default (not a published assumption). */
  readonly default?: number;
  /** Id of a published assumption in core/assumptions whose value is the default. */
  readonly assumption?: string;
  /** Optional inputs may be absent; compute receives undefined. */
  readonly optional?: boolean;
  /**
   * The name of a choice input that says the unit this number was entered in
   * (creatinine in mg/dL or µmol/L). Derivations then show the chosen unit.
   */
  readonly unitFrom?: string;
  /**
   * With `unitFrom`: the range checked in each unit (compute checks the value in its chosen unit,
   * core/units/formulas.ts checkLabValue); `min`/`max` are then their union. `calc --list` shows these.
   */
  readonly unitRanges?: Readonly<Record<string, { readonly min: number; readonly max: number }>>;
  /**
   * The input only applies when another (choice) input has one of these values
   * (the efficiency of the chosen chelator). Otherwise it is not read, not
   * defaulted and not listed in the derivation; compute receives undefined.
   */
  readonly usedWhen?: { readonly input: string; readonly oneOf: readonly string[] };
}

export interface ChoiceInputSpec<Choice extends string = string> {
  readonly kind: 'choice';
  readonly label: string;
  readonly choices: readonly Choice[];
  readonly meaning: string;
  readonly default?: Choice;
  readonly optional?: boolean;
}

export type InputSpec = NumberInputSpec | ChoiceInputSpec;
export type InputSpecs = Readonly<Record<string, InputSpec>>;

export interface OutputSpec {
  readonly label: string;
  /** Unit as shown; '' for text outputs. */
  readonly unit: string;
  readonly meaning: string;
  /** Text outputs carry a band name or a calibration label, not a number. */
  readonly kind?: 'number' | 'text';
  /** Significant decimals when printed for a reader (default 2). */
  readonly decimals?: number;
}
export type OutputSpecs = Readonly<Record<string, OutputSpec>>;

type ValueOf<Spec extends InputSpec> = Spec extends ChoiceInputSpec<infer Choice> ? Choice : number;

export type InputValues<Specs extends InputSpecs> = {
  readonly [Name in keyof Specs]: Specs[Name] extends { optional: true } | { usedWhen: object }
    ? ValueOf<Specs[Name]> | undefined
    : ValueOf<Specs[Name]>;
};

/**
 * The inputs a core caller passes to {@link runFormula} or `runInternal`, typed from the
 * formula's spec: a number for a number input, one of the choices for a choice input.
 * Every input may be left out (defaults and assumptions fill it, validation says what
 * is required), but a misspelt name or a value of the wrong type does not compile.
 */
export type RawInputs<Specs extends InputSpecs> = {
  readonly [Name in keyof Specs]?: ValueOf<Specs[Name]>;
};

export type OutputValues<Specs extends OutputSpecs> = {
  readonly [Name in keyof Specs]: Specs[Name] extends { kind: 'text' } ? string : number;
};

/** What compute returns instead of outputs when the inputs are valid one by one but not together. */
export interface Refusal {
  readonly refused: readonly Issue[];
}

export interface Formula<Inputs extends InputSpecs = InputSpecs, Outputs extends OutputSpecs = OutputSpecs> {
  /** Stable id, kebab-case; also the calculator name on the command line. Never rename. */
  readonly id: string;
  readonly title: string;
  /** The formula as a reader would write it, with units. */
  readonly expression: string;
  /** Ids of the sources in core/references for the formula and its constants. */
  readonly sourceIds: readonly string[];
  /** Preconditions, valid range of the method, cautions. */
  readonly notes?: readonly string[];
  readonly inputs: Inputs;
  readonly outputs: Outputs;
  /** Method syntax on purpose: catalogues hold formulas with their input types erased. */
  compute(inputs: InputValues<Inputs>): OutputValues<Outputs> | Refusal;
}

/** A formula with its input and output types erased, for catalogues. */
export type AnyFormula = Formula<InputSpecs, OutputSpecs>;

/**
 * Declare a formula. The identity function exists for its type inference:
 * input and output names and choice values flow into `compute`.
 */
export function defineFormula<const Inputs extends InputSpecs, const Outputs extends OutputSpecs>(
  formula: Formula<Inputs, Outputs>,
): Formula<Inputs, Outputs> {
  return formula;
}

export function isRefusal(value: unknown): value is Refusal {
  return typeof value === 'object' && value !== null && 'refused' in value;
}
