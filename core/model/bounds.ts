import { displayUnit } from '../units/displayUnit';
import { z } from 'zod';
import type { IssueCode } from '../result';

/**
 * Numbers in a case file are checked twice against two ranges:
 * - the possible range: outside it the value cannot be right (a negative
 *   volume, a haematocrit above 1), so the file is refused;
 * - the plausible range: outside it the value is possible but unusual (a
 *   ferritin above 20 000 µg/L), so it is kept and the user is warned.
 * Every message states the plausible range.
 *
 * The same schema is built at two levels (see {@link CheckLevel}) so that one
 * declaration of a field serves both checks and the paths come from zod.
 */
export type CheckLevel = 'refuse' | 'warn';

export interface Bounds {
  /** UCUM code of the unit the number is in; '1' for a fraction or a count. */
  readonly unit: string;
  /** Outside this range the value is refused. */
  readonly possible: { readonly min: number; readonly max: number; readonly minExclusive?: boolean };
  /** Outside this range the value is kept with a warning. */
  readonly plausible: { readonly min: number; readonly max: number };
  /** Decimals shown for the range bounds in messages (0.40–0.85 needs 2). */
  readonly decimals: number;
  readonly integer?: boolean;
  /** A fraction of 1: a percentage typed by mistake (60 for 0.60) gets advice. */
  readonly fraction?: boolean;
}

/** Issue parameters our checks attach to zod's 'custom' issues; see zodIssues.ts. */
export interface CustomIssueParams {
  readonly code: IssueCode;
}

export { displayUnit } from '../units/displayUnit';

function withUnit(text: string, ucumCode: string): string {
  const shown = displayUnit(ucumCode);
  return shown === '' ? text : `${text} ${shown}`;
}

/**
 * The plausible range as every message states it, with the bounds' decimals and display unit.
 *
 * @param bounds - the ranges of one field
 * @returns text such as "2–200 kg" or "0.40–0.85"
 * @example plausibleRangeText(weightBounds) === '2–200 kg'
 */
export function plausibleRangeText(bounds: Bounds): string {
  const { min, max } = bounds.plausible;
  return withUnit(`${min.toFixed(bounds.decimals)}–${max.toFixed(bounds.decimals)}`, bounds.unit);
}

function possibleRangeText(bounds: Bounds): string {
  const { min, max, minExclusive } = bounds.possible;
  const lower = minExclusive ? `more than ${min}` : `at least ${min}`;
  return `${lower} and at most ${withUnit(String(max), bounds.unit)}`;
}

function isOutsidePossible(value: number, bounds: Bounds): boolean {
  const { min, max, minExclusive } = bounds.possible;
  return (minExclusive ? value <= min : value < min) || value > max;
}

interface BoundsFinding {
  readonly code: IssueCode;
  /** The message after the field's name. */
  readonly message: string;
}

/**
 * Check one number against its bounds at one level. Pure; the schema builders
 * below turn the finding into a zod issue.
 *
 * @param value - a finite number in the unit of `bounds`
 * @param bounds - possible and plausible ranges
 * @param level - 'refuse' checks the possible range and whole numbers; 'warn' the plausible range
 * @returns the finding, or undefined when the value passes
 * @example checkBounds(60, unitHaematocritBounds, 'refuse')?.message === '60 is outside 0.40–0.85; enter it as a fraction (0.60).'
 */
export function checkBounds(value: number, bounds: Bounds, level: CheckLevel): BoundsFinding | undefined {
  const plausible = plausibleRangeText(bounds);
  if (level === 'refuse') {
    if (bounds.integer && !Number.isInteger(value)) {
      return { code: 'not_an_integer', message: `${value} is not a whole number; expected ${plausible}.` };
    }
    if (!isOutsidePossible(value, bounds)) return undefined;
    if (bounds.fraction && value > 1 && value <= 100) {
      return {
        code: 'out_of_range',
        message: `${value} is outside ${plausible}; enter it as a fraction (${(value / 100).toFixed(bounds.decimals)}).`,
      };
    }
    return {
      code: 'out_of_range',
      message: `${withUnit(String(value), bounds.unit)} is not possible (${possibleRangeText(bounds)}); the plausible range is ${plausible}.`,
    };
  }
  const { min, max } = bounds.plausible;
  if (value >= min && value <= max) return undefined;
  return {
    code: 'out_of_range',
    message: `${withUnit(String(value), bounds.unit)} is outside the plausible range ${plausible}; check the value and its unit.`,
  };
}

const isFiniteNumber = (value: unknown): value is number => typeof value === 'number' && Number.isFinite(value);

function numberSchema(expected: string) {
  return z.custom<number>(isFiniteNumber, {
    error: (problem) =>
      problem.input === undefined
        ? `is missing; expected a number, plausible ${expected}.`
        : `${JSON.stringify(problem.input) ?? String(problem.input)} is not a number; expected ${expected}.`,
    params: { code: 'not_a_number' } satisfies CustomIssueParams,
  });
}

function addFinding(ctx: z.RefinementCtx, finding: BoundsFinding | undefined, path: readonly (string | number)[] = []): void {
  if (!finding) return;
  ctx.addIssue({ code: 'custom', message: finding.message, path: [...path], params: { code: finding.code } satisfies CustomIssueParams });
}

/**
 * Schema of a plain number (a fraction, a count, hours) checked at one level.
 *
 * @param bounds - possible and plausible ranges
 * @param level - which range this schema checks
 * @example boundedNumber(daysPerWeekBounds, 'refuse').safeParse(8).success === false
 */
export function boundedNumber(bounds: Bounds, level: CheckLevel) {
  return numberSchema(plausibleRangeText(bounds)).superRefine((value, ctx) => addFinding(ctx, checkBounds(value, bounds, level)));
}

/**
 * Schema of a quantity as entered, `{ value, unit }`, where each allowed unit
 * has its own ranges (creatinine in mg/dL or µmol/L). The value is kept in the
 * unit the user typed; conversion happens in core/units, never here.
 *
 * @param boundsByUnit - ranges keyed by UCUM code; the keys are the allowed units
 * @param level - which range this schema checks
 * @example measuredQuantity({ kg: weightBounds }, 'refuse').safeParse({ value: 52, unit: 'kg' }).success === true
 */
export function measuredQuantity<const Unit extends string>(boundsByUnit: Readonly<Record<Unit, Bounds>>, level: CheckLevel) {
  const units = Object.keys(boundsByUnit) as [Unit, ...Unit[]];
  const expected = units.map((unit) => plausibleRangeText(boundsByUnit[unit])).join(' or ');
  return z
    .strictObject({ value: numberSchema(expected), unit: z.enum(units) })
    .superRefine((quantity, ctx) => addFinding(ctx, checkBounds(quantity.value, boundsByUnit[quantity.unit], level), ['value']));
}
