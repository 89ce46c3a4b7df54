import { z } from 'zod';
import { measuredQuantity, type CheckLevel } from './bounds';
import { entryIdSchema, isoDateSchema, noteSchema } from './fields';
import { ascorbicAcidDoseBounds } from './plausibleRanges';

/** When a co-medication is taken: ascorbic acid belongs with deferoxamine infusions (references.md §3). */
export const coMedicationTimings = ['with-each-deferoxamine-infusion', 'daily'] as const;

/**
 * Schema of one co-medication period at one check level. Only ascorbic acid
 * for now (it raises the iron deferoxamine can reach, and has its own cap);
 * the dose is per administration as entered.
 */
export function coMedicationSchemaAt(level: CheckLevel) {
  return z.strictObject({
    id: entryIdSchema,
    substance: z.literal('ascorbic-acid'),
    dose: measuredQuantity(ascorbicAcidDoseBounds, level),
    timing: z.enum(coMedicationTimings),
    startDate: isoDateSchema,
    endDate: isoDateSchema.nullable(),
    note: noteSchema.optional(),
  });
}
