import { findAssumption } from '../assumptions';
import { findSource, type Source } from '../references';
import type { AnyFormula, InputSpec } from './types';
import { describeRange, rangeFor } from './validate';

/** A JSON-ready description of one formula input, as `calc --list` shows it. */
export interface InputDescription {
  readonly name: string;
  readonly flag: string;
  readonly label: string;
  readonly kind: 'number' | 'choice';
  readonly unit?: string;
  /** The range a calculator accepts: the same check `calc` runs (core/formulas/validate.ts rangeFor). */
  readonly min?: number;
  readonly max?: number;
  /** The range as messages state it, with excluded ends ("1–18 a (below 18)"). */
  readonly range?: string;
  /** Whole numbers only. */
  readonly integer?: boolean;
  /** For a number entered with a chosen unit: the range checked in each unit (the value is checked in its own unit). */
  readonly rangesByUnit?: Readonly<Record<string, { readonly min: number; readonly max: number }>>;
  readonly choices?: readonly string[];
  readonly meaning: string;
  readonly required: boolean;
  readonly default?: number | string;
  readonly defaultFrom?: string;
  /** When the input applies only for some values of a choice. */
  readonly usedWhen?: string;
}

export interface FormulaDescription {
  readonly id: string;
  readonly title: string;
  readonly expression: string;
  readonly notes: readonly string[];
  readonly inputs: readonly InputDescription[];
  readonly outputs: readonly { readonly name: string; readonly label: string; readonly unit: string; readonly meaning: string }[];
  readonly sources: readonly Source[];
}

/**
 * The command-line flag for an input name: camelCase → --kebab-case.
 * @example flagForInput('volumeMl') === '--volume-ml'
 */
export function flagForInput(name: string): string {
  return `--${name.replace(/([a-z0-9])([A-Z])/g, '$1-$2').replace(/([A-Z])([A-Z][a-z])/g, '$1-$2').toLowerCase()}`;
}

function describeInput(name: string, spec: InputSpec): InputDescription {
  const base = { name, flag: flagForInput(name), label: spec.label, meaning: spec.meaning };
  if (spec.kind === 'choice') {
    return {
      ...base,
      kind: 'choice',
      choices: spec.choices,
      required: spec.default === undefined && !spec.optional,
      ...(spec.default !== undefined ? { default: spec.default } : {}),
    };
  }
  const assumption = spec.assumption !== undefined ? findAssumption(spec.assumption) : undefined;
  const fallback = assumption?.value ?? spec.default;
  const range = rangeFor(spec, 'entered');
  return {
    ...base,
    kind: 'number',
    unit: spec.unit,
    min: range.min,
    max: range.max,
    range: describeRange(range),
    ...(spec.integer ? { integer: true } : {}),
    ...(spec.unitRanges ? { rangesByUnit: spec.unitRanges } : {}),
    required: fallback === undefined && !spec.optional && spec.usedWhen === undefined,
    ...(fallback !== undefined ? { default: fallback } : {}),
    ...(spec.usedWhen ? { usedWhen: `${flagForInput(spec.usedWhen.input)} ${spec.usedWhen.oneOf.join(' | ')}` } : {}),
    ...(assumption ? { defaultFrom: `assumption ${assumption.id}` } : {}),
  };
}

/** Describe a formula for listings: inputs with flags, units and ranges; outputs; full sources. */
export function describeFormula(formula: AnyFormula): FormulaDescription {
  return {
    id: formula.id,
    title: formula.title,
    expression: formula.expression,
    notes: formula.notes ?? [],
    inputs: Object.entries(formula.inputs).map(([name, spec]) => describeInput(name, spec)),
    outputs: Object.entries(formula.outputs).map(([name, spec]) => ({
      name,
      label: spec.label,
      unit: spec.unit,
      meaning: spec.meaning,
    })),
    sources: formula.sourceIds.map((id) => {
      const source = findSource(id);
      if (!source) throw new Error(`Formula ${formula.id} cites unknown source ${id}`);
      return source;
    }),
  };
}
