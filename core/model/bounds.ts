import { displayUnit } from '../units/displayUnit';
import { ucumCodeForTypedUnit } from '../units/unitSpellings';
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

export type { Bounds } from '../ranges/bounds';
import type { Bounds } from '../ranges/bounds';

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
  }).meta({ type: 'number', description: `a number; plausible ${expected}` });
}

/** What the format's documentation and JSON Schema say of a bounded number (docs/case-file.md is generated from it). */
function boundsMeta(bounds: Bounds) {
  const { min, max, minExclusive } = bounds.possible;
  return {
    type: bounds.integer ? 'integer' : 'number',
    ...(minExclusive ? { exclusiveMinimum: min } : { minimum: min }),
    maximum: max,
    description: `${bounds.fraction ? 'a fraction of 1' : bounds.integer ? 'a whole number' : 'a number'}; plausible ${plausibleRangeText(bounds)} (refused: ${possibleRangeText(bounds)})`,
  };
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
  return numberSchema(plausibleRangeText(bounds))
    .superRefine((value, ctx) => addFinding(ctx, checkBounds(value, bounds, level)))
    .meta(boundsMeta(bounds));
}

/**
 * The plausible range of another allowed unit the value would fit: a
 * creatinine of 1.5 typed as µmol/L is plausible as mg/dL. Used to suggest
 * the other unit in the warning.
 */
function otherUnitThatFits<Unit extends string>(value: number, unit: Unit, boundsByUnit: Readonly<Record<Unit, Bounds>>): Unit | undefined {
  return (Object.keys(boundsByUnit) as Unit[]).find((other) => {
    if (other === unit) return false;
    const { min, max } = boundsByUnit[other].plausible;
    return value >= min && value <= max;
  });
}

/**
 * Schema of a quantity as entered, `{ value, unit, unitAsTyped? }`, where each
 * allowed unit has its own ranges (creatinine in mg/dL or µmol/L). The unit
 * may be typed as people write it ('µmol/l', 'ml', 'mg/g dry'): it is read to
 * its UCUM code (core/units/unitSpellings.ts) and the spelling typed is kept
 * in `unitAsTyped`, so nothing typed is lost. The value is kept in the unit
 * the user typed; conversion happens in core/units, never here. A value
 * outside its plausible range that would be plausible in another allowed unit
 * gets a warning naming that unit.
 *
 * @param boundsByUnit - ranges keyed by UCUM code; the keys are the allowed units
 * @param level - which range this schema checks
 * @example measuredQuantity({ kg: weightBounds }, 'refuse').safeParse({ value: 52, unit: 'kg' }).success === true
 * @example measuredQuantity(creatinineBounds, 'refuse').parse({ value: 88, unit: 'µmol/l' }) → { value: 88, unit: 'umol/L', unitAsTyped: 'µmol/l' }
 */
export function measuredQuantity<const Unit extends string>(boundsByUnit: Readonly<Record<Unit, Bounds>>, level: CheckLevel) {
  const units = Object.keys(boundsByUnit) as [Unit, ...Unit[]];
  const expected = units.map((unit) => plausibleRangeText(boundsByUnit[unit])).join(' or ');
  return z
    // The UCUM codes first, so the format's JSON Schema lists them; any other spelling is read below.
    .strictObject({ value: numberSchema(expected), unit: z.union([z.enum(units), z.string().max(40)]), unitAsTyped: z.string().max(40).optional() })
    .superRefine((quantity, ctx) => {
      if (ucumCodeForTypedUnit(quantity.unit, units) !== undefined) return;
      ctx.addIssue({
        code: 'custom',
        path: ['unit'],
        message: `${JSON.stringify(quantity.unit)} is not one of: ${units.join(', ')}.`,
        params: { code: 'unknown_choice' } satisfies CustomIssueParams,
      });
    })
    .transform((quantity): { value: number; unit: Unit; unitAsTyped?: string } => {
      const unit = ucumCodeForTypedUnit(quantity.unit, units)!;
      const unitAsTyped = quantity.unitAsTyped ?? (quantity.unit === unit ? undefined : quantity.unit);
      return unitAsTyped === undefined ? { value: quantity.value, unit } : { value: quantity.value, unit, unitAsTyped };
    })
    .superRefine((quantity, ctx) => {
      const finding = checkBounds(quantity.value, boundsByUnit[quantity.unit], level);
      const other = level === 'warn' && finding ? otherUnitThatFits(quantity.value, quantity.unit, boundsByUnit) : undefined;
      addFinding(
        ctx,
        finding && other ? { ...finding, message: `${finding.message.replace(/; check the value and its unit\.$/u, '')}; it would be plausible in ${displayUnit(other)} (${plausibleRangeText(boundsByUnit[other])}): check the unit.` } : finding,
        ['value'],
      );
    })
    .meta({ description: `a quantity { value, unit } in ${units.join(' or ')} (UCUM codes); plausible ${expected}` });
}
