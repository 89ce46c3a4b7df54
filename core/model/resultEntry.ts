import { z } from 'zod';
import { measuredQuantity, type Bounds, type CheckLevel } from './bounds';
import { entryIdSchema, isoDateSchema, noteSchema, requiredTextSchema } from './fields';
import {
  altBounds,
  astBounds,
  bilirubinBounds,
  bloodLeadBounds,
  cardiacT2StarBounds,
  creatinineBounds,
  ferritinBounds,
  haemoglobinBounds,
  liverIronBounds,
  liverR2Bounds,
  liverR2StarBounds,
  liverT2StarBounds,
  neutrophilBounds,
  plateletBounds,
  urinaryCopperBounds,
  urineProteinCreatinineRatioBounds,
  zincBounds,
} from '../ranges/plausibleRanges';
import type { CustomIssueParams } from './bounds';

/** Outcomes of an examination recorded without a number (audiology, eye examination). */
export const examinationOutcomes = ['normal', 'changed-from-baseline', 'not-done'] as const;

/**
 * The reporting laboratory's reference range, in the unit of the result
 * (`low`, `high`, either may be absent). Rules that speak of the upper limit
 * of normal use it where it is given (the deferasirox label's transaminase
 * wording refers to the laboratory's limit).
 */
export const referenceRangeSchema = z
  .strictObject({ low: z.number().min(0).optional(), high: z.number().positive().optional() })
  .superRefine((range, ctx) => {
    if (range.low === undefined || range.high === undefined || range.low < range.high) return;
    ctx.addIssue({
      code: 'custom',
      path: ['high'],
      message: `${range.high} is not above the lower limit ${range.low}; enter the laboratory's range as low and high.`,
      params: { code: 'inconsistent' } satisfies CustomIssueParams,
    });
  });

/** MRI field strengths a calibration may be tied to, tesla. A 1.5 T calibration never applies to a 3 T result (references.md §2). */
export const fieldStrengthsT = [1.5, 3] as const;

/** Ways a liver iron result was obtained; the raw MRI ones are converted to LIC in core/iron by the named calibration. */
export const liverIronMethods = ['biopsy', 'mri', 'mri-r2star', 'mri-t2star', 'mri-r2'] as const;

/**
 * Schema of one result at one check level. Each result keeps the value and
 * unit the user typed in `measured: { value, unit }` (UCUM codes); the
 * conversions live in core/units.
 *
 * Liver iron carries its method: a biopsy, an MRI result already in mg/g dry
 * (with the scanner's field strength and the calibration the report used), or
 * a raw R2*, T2* or R2 with the field strength and the calibration core/iron
 * should apply. Calibration ids are checked by core/iron, which owns them.
 *
 * Version 2 adds platelets, AST, bilirubin, the urine protein-to-creatinine
 * ratio and zinc (each with an optional laboratory `referenceRange`), and the
 * audiology and eye examinations, recorded by outcome (normal, changed from
 * baseline, not done) rather than a number.
 */
export function resultEntrySchemaAt(level: CheckLevel) {
  const base = { id: entryIdSchema, date: isoDateSchema, note: noteSchema.optional() };
  const fieldStrengthT = z.literal(fieldStrengthsT);
  const calibrationId = requiredTextSchema(64);
  const simple = <const Kind extends string, const Unit extends string>(kind: Kind, bounds: Readonly<Record<Unit, Bounds>>) =>
    z.strictObject({ ...base, kind: z.literal(kind), measured: measuredQuantity(bounds, level), referenceRange: referenceRangeSchema.optional() });
  const examination = <const Kind extends string>(kind: Kind) =>
    z.strictObject({ ...base, kind: z.literal(kind), outcome: z.enum(examinationOutcomes) });
  const liver = <const Method extends (typeof liverIronMethods)[number], const Unit extends string>(
    method: Method,
    bounds: Readonly<Record<Unit, Bounds>>,
  ) =>
    z.strictObject({
      ...base,
      kind: z.literal('liver-iron'),
      method: z.literal(method),
      measured: measuredQuantity(bounds, level),
      fieldStrengthT,
      calibrationId,
    });

  return z.discriminatedUnion('kind', [
    simple('ferritin', ferritinBounds),
    z.discriminatedUnion('method', [
      z.strictObject({ ...base, kind: z.literal('liver-iron'), method: z.literal('biopsy'), measured: measuredQuantity(liverIronBounds, level) }),
      liver('mri', liverIronBounds),
      liver('mri-r2star', liverR2StarBounds),
      liver('mri-t2star', liverT2StarBounds),
      liver('mri-r2', liverR2Bounds),
    ]),
    z.strictObject({ ...base, kind: z.literal('cardiac-t2star'), measured: measuredQuantity(cardiacT2StarBounds, level), fieldStrengthT }),
    simple('creatinine', creatinineBounds),
    simple('alt', altBounds),
    simple('neutrophils', neutrophilBounds),
    simple('haemoglobin', haemoglobinBounds),
    simple('blood-lead', bloodLeadBounds),
    simple('urinary-copper', urinaryCopperBounds),
    // Version 2:
    simple('platelets', plateletBounds),
    simple('ast', astBounds),
    simple('bilirubin', bilirubinBounds),
    simple('urine-protein-creatinine-ratio', urineProteinCreatinineRatioBounds),
    simple('zinc', zincBounds),
    examination('audiology'),
    examination('eye-examination'),
  ]);
}
