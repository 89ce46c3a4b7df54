import { z } from 'zod';
import { boundedNumber, measuredQuantity, type CheckLevel } from './bounds';
import { isoDateSchema, requiredTextSchema } from './fields';
import { ageYearsBounds, heightBounds, weightBounds } from '../ranges/plausibleRanges';

/** Diagnosis groups: they decide which safety rules and which caveats apply (ferritin is a poor marker in sickle cell disease). */
export const diagnosisGroups = [
  'thalassaemia-major',
  'thalassaemia-non-transfusion-dependent',
  'sickle-cell-disease',
  'myelodysplastic-syndrome',
  'diamond-blackfan',
  'other-transfusion-dependent',
  'lead-poisoning',
  'wilson-disease',
  'other',
] as const;

/** Sex at birth, asked only because the renal equations (Cockcroft–Gault, CKD-EPI 2021) use it. */
export const sexesAtBirth = ['female', 'male'] as const;

/** Pregnancy and breastfeeding are flagged to the prescriber; nothing prescriptive is computed for them. */
export const pregnancyStatuses = ['not-pregnant', 'pregnant', 'breastfeeding'] as const;

/**
 * Schema of the patient block at one check level.
 *
 * The label is a code (TH-0417), never a name: the tool invites
 * de-identification, and the consistency checks warn on a label that looks
 * like a name. Age is a birth date, or an age in years on a stated date when
 * the birth date is withheld.
 */
export function patientSchemaAt(level: CheckLevel) {
  return z.strictObject({
    label: requiredTextSchema(40),
    age: z.discriminatedUnion('kind', [
      z.strictObject({ kind: z.literal('birth-date'), birthDate: isoDateSchema }),
      z.strictObject({ kind: z.literal('years-on-date'), years: boundedNumber(ageYearsBounds, level), onDate: isoDateSchema }),
    ]),
    sexAtBirth: z.enum(sexesAtBirth),
    diagnosisGroup: z.enum(diagnosisGroups),
    pregnancy: z.strictObject({ status: z.enum(pregnancyStatuses), recordedOn: isoDateSchema.nullable() }),
    weights: z.array(z.strictObject({ date: isoDateSchema, weight: measuredQuantity({ kg: weightBounds }, level) })),
    heights: z.array(z.strictObject({ date: isoDateSchema, height: measuredQuantity({ cm: heightBounds }, level) })).default([]),
  });
}
