import { findAssumption, type AssumptionOverrides } from '../assumptions';
import { assumptionOrigin } from '../assumptions/origin';
import { parseDecimal } from '../numbers/parseDecimal';
import { issue, type Issue } from '../result';
import type { Origin } from './derivation';
import type { ChoiceInputSpec, InputSpecs, NumberInputSpec } from './types';

export interface ValidatedInputs {
  readonly values: Readonly<Record<string, number | string | undefined>>;
  readonly origins: Readonly<Record<string, Origin>>;
  /** Values kept although outside their plausible range. */
  readonly warnings: readonly Issue[];
}

/** "0.40–0.85 mL" style range text used in every message; "0–400 kg (above 0)" when the lower end is excluded. */
export function describeRange(spec: Pick<NumberInputSpec, 'min' | 'max' | 'unit' | 'minExclusive' | 'maxExclusive'>): string {
  const unit = spec.unit === '1' ? '' : ` ${spec.unit}`;
  const ends = [...(spec.minExclusive ? [`above ${spec.min}`] : []), ...(spec.maxExclusive ? [`below ${spec.max}`] : [])];
  return `${spec.min}–${spec.max}${unit}${ends.length > 0 ? ` (${ends.join(', ')})` : ''}`;
}

function withUnit(value: number, unit: string): string {
  return unit === '1' ? `${value}` : `${value} ${unit}`;
}

/**
 * Which range a number is checked against. `entered`: a value typed at a calculator is
 * refused outside the plausible range (a height in metres, a weight in grams). `record`:
 * a value from a checked case file, which the case model accepted (warning about an
 * implausible one), is refused only outside the possible range, so a review computes
 * every case that `check` accepts. Both ranges come from the one table in core/ranges.
 */
export type CheckMode = 'entered' | 'record';

/** The range a mode checks: the plausible range for entered values, the possible range for record values. */
export function rangeFor(spec: NumberInputSpec, mode: CheckMode): Pick<NumberInputSpec, 'min' | 'max' | 'unit' | 'minExclusive' | 'maxExclusive'> {
  return mode === 'entered' && spec.plausible ? { min: spec.plausible.min, max: spec.plausible.max, unit: spec.unit } : spec;
}

/**
 * Check one number against its spec. Returns the issues (empty when valid).
 * A fraction typed as a percentage (0.6 entered as 60) gets advice to enter the fraction.
 */
export function checkNumber(name: string, value: number, spec: NumberInputSpec, mode: CheckMode = 'entered'): Issue[] {
  const range = rangeFor(spec, mode);
  if (!Number.isFinite(value)) {
    return [issue('not_a_number', [name], `${capitalise(spec.label)}: "${value}" is not a number; expected ${describeRange(range)}.`)];
  }
  if (spec.integer && !Number.isInteger(value)) {
    return [issue('not_an_integer', [name], `${capitalise(spec.label)} ${value} must be a whole number in ${describeRange(range)}.`)];
  }
  const belowMin = range.minExclusive ? value <= range.min : value < range.min;
  const aboveMax = range.maxExclusive ? value >= range.max : value > range.max;
  if (belowMin || aboveMax) {
    let advice = '';
    if (spec.unit === '1' && range.max <= 1 && value > 1 && value <= 100) {
      advice = `; enter it as a fraction (${roundForAdvice(value / 100)})`;
    }
    if (spec.outsideAdvice) advice += spec.outsideAdvice;
    const which = mode === 'record' && spec.plausible ? 'possible' : 'plausible';
    if (spec.unitRanges) {
      // A number entered with a chosen unit: state the range of each unit, as compute checks it (not their union).
      const perUnit = Object.entries(spec.unitRanges).map(([unit, it]) => `${it.min}–${it.max} ${unit}`).join(' or ');
      return [issue('out_of_range', [name], `${capitalise(spec.label)} ${value} is outside the ${which} range in every unit: ${perUnit}${advice}.`)];
    }
    return [issue('out_of_range', [name], `${capitalise(spec.label)} ${withUnit(value, spec.unit)} is outside the ${which} range ${describeRange(range)}${advice}.`)];
  }
  return [];
}

function roundForAdvice(value: number): number {
  return Math.round(value * 10000) / 10000;
}

export function capitalise(text: string): string {
  return text.length === 0 ? text : text[0]!.toUpperCase() + text.slice(1);
}

function checkChoice(name: string, raw: unknown, spec: ChoiceInputSpec): Issue[] {
  if (typeof raw !== 'string' || !spec.choices.includes(raw)) {
    return [
      issue('unknown_choice', [name], `${capitalise(spec.label)} "${String(raw)}" is not one of: ${spec.choices.join(', ')}.`),
    ];
  }
  return [];
}

/** Whether a conditional input applies, judged on the raw (or default) value of the choice it depends on. */
function isUsed(
  usedWhen: NonNullable<NumberInputSpec['usedWhen']>,
  raw: Readonly<Record<string, unknown>>,
  specs: InputSpecs,
): boolean {
  const choice = specs[usedWhen.input];
  const value = raw[usedWhen.input] ?? (choice?.kind === 'choice' ? choice.default : undefined);
  return typeof value === 'string' && usedWhen.oneOf.includes(value);
}

function toNumber(raw: unknown): number {
  if (typeof raw === 'number') return raw;
  if (typeof raw === 'string') return parseDecimal(raw) ?? Number.NaN;
  return Number.NaN;
}

/**
 * Validate raw inputs (numbers, or strings from a command line or a form)
 * against a formula's input specs. Missing inputs take the spec's default or
 * its published assumption (overridden if the caller passes an override);
 * every value gets an origin for the derivation.
 *
 * @param specs - the formula's inputs
 * @param raw - values by input name; strings are parsed as numbers for number inputs
 * @param given - origins of supplied values (default: entered)
 * @param overrides - assumption overrides from the case
 * @param mode - `entered` (a calculator: plausible ranges) or `record` (a checked case: possible ranges)
 * @returns values and origins, or the issues (every invalid input at once)
 */
export function validateInputs(
  specs: InputSpecs,
  raw: Readonly<Record<string, unknown>>,
  given: Readonly<Record<string, Origin>> = {},
  overrides: AssumptionOverrides = {},
  mode: CheckMode = 'entered',
): { ok: true; value: ValidatedInputs } | { ok: false; issues: Issue[] } {
  const values: Record<string, number | string | undefined> = {};
  const origins: Record<string, Origin> = {};
  const issues: Issue[] = [];
  for (const [name, spec] of Object.entries(specs)) {
    const supplied = raw[name];
    if (spec.kind === 'number' && spec.usedWhen && !isUsed(spec.usedWhen, raw, specs)) {
      if (supplied !== undefined && supplied !== null && supplied !== '') {
        const condition = specs[spec.usedWhen.input]?.label ?? spec.usedWhen.input;
        issues.push(
          issue('not_applicable', [name], `${capitalise(spec.label)} applies only when ${condition} is ${spec.usedWhen.oneOf.join(' or ')}.`),
        );
      }
      continue;
    }
    const present = supplied !== undefined && supplied !== null && supplied !== '';
    if (spec.kind === 'choice') {
      if (present) {
        const found = checkChoice(name, supplied, spec);
        issues.push(...found);
        values[name] = supplied as string;
        origins[name] = given[name] ?? { kind: 'entered' };
      } else if (spec.default !== undefined) {
        values[name] = spec.default;
        origins[name] = { kind: 'default' };
      } else if (!spec.optional) {
        issues.push(issue('required', [name], `${capitalise(spec.label)} is required: one of ${spec.choices.join(', ')}.`));
      }
      continue;
    }
    if (present) {
      const value = toNumber(supplied);
      if (Number.isNaN(value)) {
        issues.push(
          issue('not_a_number', [name], `${capitalise(spec.label)} "${String(supplied)}" is not a number; expected ${describeRange(spec)}.`),
        );
        continue;
      }
      issues.push(...checkNumber(name, value, spec, mode));
      values[name] = value;
      origins[name] = given[name] ?? { kind: 'entered' };
    } else if (spec.assumption !== undefined) {
      const assumption = findAssumption(spec.assumption);
      if (!assumption) throw new Error(`Formula input ${name} names unknown assumption ${spec.assumption}`);
      const override = overrides[spec.assumption];
      if (override) {
        issues.push(...checkNumber(name, override.value, { ...spec, min: assumption.min, max: assumption.max }));
        values[name] = override.value;
        origins[name] = assumptionOrigin(assumption.id, override);
      } else {
        values[name] = assumption.value;
        origins[name] = assumptionOrigin(assumption.id);
      }
    } else if (spec.default !== undefined) {
      values[name] = spec.default;
      origins[name] = { kind: 'default' };
    } else if (!spec.optional) {
      issues.push(issue('required', [name], `${capitalise(spec.label)} is required (${describeRange(spec)}).`));
    }
  }
  for (const name of Object.keys(raw)) {
    if (!(name in specs)) issues.push(issue('unknown_option', [name], `"${name}" is not an input of this calculation.`));
  }
  const errors = issues.filter((it) => it.severity === 'error');
  return errors.length > 0 ? { ok: false, issues } : { ok: true, value: { values, origins, warnings: issues } };
}
