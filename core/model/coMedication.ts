import { z } from 'zod';
import { addFinding, checkBounds, measuredQuantity, type CheckLevel, type CustomIssueParams } from './bounds';
import { entryIdSchema, isoDateSchema, noteSchema, requiredTextSchema } from './fields';
import { ascorbicAcidDoseBounds, coMedicationDoseBounds } from '../ranges/plausibleRanges';

/** When a co-medication is taken: ascorbic acid belongs with deferoxamine infusions (references.md §9). */
export const coMedicationTimings = ['with-each-deferoxamine-infusion', 'daily', 'other'] as const;

/**
 * A generic name as it is compared: lower case, single spaces, hyphens as
 * spaces ("Ascorbic-Acid " → "ascorbic acid"). The name as typed is what the
 * file keeps.
 *
 * @param name - a generic drug name as typed
 * @returns the compared form
 * @example comparableDrugName(' Ascorbic-acid ') === 'ascorbic acid'
 */
export function comparableDrugName(name: string): string {
  return name.trim().toLowerCase().replace(/[-_]+/gu, ' ').replace(/\s+/gu, ' ');
}

/** Names under which ascorbic acid is recorded (generic names; vitamin C is its common name). */
export const ascorbicAcidNames = ['ascorbic acid', 'vitamin c', 'sodium ascorbate'] as const;

/** Whether a co-medication is ascorbic acid, by name. */
export function isAscorbicAcid(name: string): boolean {
  return (ascorbicAcidNames as readonly string[]).includes(comparableDrugName(name));
}

/**
 * Schema of one co-medication period at one check level (version 2): any
 * drug the patient takes, by its generic name as typed (`name`), with an
 * optional dose per administration and timing. The interaction checks of
 * core/safety match names against the label-listed interactions; matching is
 * by name, so a drug typed under another name is missed.
 *
 * Ascorbic acid keeps its own dose screen (it has its own caps with
 * deferoxamine); other drugs' doses are screened only for impossible values.
 */
export function coMedicationSchemaAt(level: CheckLevel) {
  return z
    .strictObject({
      id: entryIdSchema,
      name: requiredTextSchema(80),
      dose: measuredQuantity(coMedicationDoseBounds, level).optional(),
      timing: z.enum(coMedicationTimings).optional(),
      startDate: isoDateSchema,
      endDate: isoDateSchema.nullable(),
      note: noteSchema.optional(),
    })
    .superRefine((coMedication, ctx) => {
      if (!isAscorbicAcid(coMedication.name) || coMedication.dose === undefined) return;
      const { unit, value } = coMedication.dose;
      if (unit !== 'mg' && unit !== 'mg/kg') {
        ctx.addIssue({
          code: 'custom',
          path: ['dose', 'unit'],
          message: `${JSON.stringify(unit)} is not one of: ${Object.keys(ascorbicAcidDoseBounds).join(', ')} (ascorbic acid is recorded in mg or mg/kg).`,
          params: { code: 'unknown_choice' } satisfies CustomIssueParams,
        });
        return;
      }
      addFinding(ctx, checkBounds(value, ascorbicAcidDoseBounds[unit], level), ['dose', 'value']);
    });
}
