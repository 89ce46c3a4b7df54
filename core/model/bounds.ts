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
 * The same schema is built at each level (see {@link CheckLevel}) so that one
 * declaration of a field serves both checks and the paths come from zod.
 *
 * - 'refuse': the possible range (and whole numbers); its issues are errors;
 * - 'warn': the plausible range; its issues are warnings;
 * - 'both': what 'refuse' checks and, for a value that passes, what 'warn'
 *   checks, its issues marked `warning` in their params. parseCase reads a
 *   case in this one pass: a warning issue is non-aborting in zod (a
 *   refinement's issue continues), so the errors of this pass are exactly
 *   those of the 'refuse' pass and its warnings those of the 'warn' pass, in
 *   the same order (tests/core/model/onePassParse.test.ts compares them).
 */
export type CheckLevel = 'refuse' | 'warn' | 'both';

export type { Bounds } from '../ranges/bounds';
import type { Bounds } from '../ranges/bounds';

/** Issue parameters our checks attach to zod's 'custom' issues; see zodIssues.ts. */
export interface CustomIssueParams {
  readonly code: IssueCode;
  /** Set on a plausibility finding raised at the 'both' level: a warning, not a refusal. */
  readonly warning?: true;
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
  /** A plausibility finding at the 'both' level (at 'warn' every finding is one; at 'refuse' none is). */
  readonly warning?: true;
}

/**
 * Check one number against its bounds at one level. Pure; the schema builders
 * below turn the finding into a zod issue.
 *
 * @param value - a finite number in the unit of `bounds`
 * @param bounds - possible and plausible ranges
 * @param level - 'refuse' checks the possible range and whole numbers; 'warn' the plausible range; 'both' the
 *   first and, if the value passes it, the second (that finding marked `warning`)
 * @returns the finding, or undefined when the value passes
 * @example checkBounds(60, unitHaematocritBounds, 'refuse')?.message === '60 is outside 0.40–0.85; enter it as a fraction (0.60).'
 */
export function checkBounds(value: number, bounds: Bounds, level: CheckLevel): BoundsFinding | undefined {
  if (level === 'both') {
    const refused = checkBounds(value, bounds, 'refuse');
    if (refused) return refused;
    const screened = checkBounds(value, bounds, 'warn');
    return screened ? { ...screened, warning: true } : undefined;
  }
  // The range text is built only for a value that is reported: most values pass, and this runs for every number of every case opened.
  if (level === 'refuse') {
    if (bounds.integer && !Number.isInteger(value)) {
      return { code: 'not_an_integer', message: `${value} is not a whole number; expected ${plausibleRangeText(bounds)}.` };
    }
    if (!isOutsidePossible(value, bounds)) return undefined;
    const plausible = plausibleRangeText(bounds);
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
    message: `${withUnit(String(value), bounds.unit)} is outside the plausible range ${plausibleRangeText(bounds)}; check the value and its unit.`,
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

/**
 * Raise a bounds finding as a zod issue at a path below the refinement, a
 * 'both'-level plausibility finding marked as a warning.
 *
 * @param ctx - the refinement's context
 * @param finding - from {@link checkBounds}; nothing is raised without one
 * @param path - below the refined value, e.g. ['dose', 'value']
 */
export function addFinding(ctx: z.RefinementCtx, finding: BoundsFinding | undefined, path: readonly (string | number)[] = []): void {
  if (!finding) return;
  const params: CustomIssueParams = finding.warning ? { code: finding.code, warning: true } : { code: finding.code };
  ctx.addIssue({ code: 'custom', message: finding.message, path: [...path], params });
}

/**
 * Whether a zod issue is a plausibility warning raised at the 'both' level.
 *
 * @param zodIssue - an issue of a 'both'-level parse
 * @returns true for a warning; false for a refusal
 */
export function isWarningIssue(zodIssue: z.core.$ZodIssue): boolean {
  return zodIssue.code === 'custom' && (zodIssue.params as Partial<CustomIssueParams> | undefined)?.warning === true;
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
      const other = finding && (level === 'warn' || finding.warning) ? otherUnitThatFits(quantity.value, quantity.unit, boundsByUnit) : undefined;
      addFinding(
        ctx,
        finding && other ? { ...finding, message: `${finding.message.replace(/; check the value and its unit\.$/u, '')}; it would be plausible in ${displayUnit(other)} (${plausibleRangeText(boundsByUnit[other])}): check the unit.` } : finding,
        ['value'],
      );
    })
    .meta({ description: `a quantity { value, unit } in ${units.join(' or ')} (UCUM codes); plausible ${expected}` });
}
