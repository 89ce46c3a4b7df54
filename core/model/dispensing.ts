import { z } from 'zod';
import { boundedNumber, measuredQuantity, type CheckLevel } from './bounds';
import { chelatorDrugs } from './chelationPeriod';
import { entryIdSchema, isoDateSchema, noteSchema } from './fields';
import { daysSuppliedBounds, dispensedQuantityBounds } from '../ranges/plausibleRanges';

/**
 * Schema of one dispensing record (version 2): a pharmacy supply of a
 * chelator on a date — the product (an id of the dosing catalogue, optional),
 * the quantity (tablets or vials counted as '{each}', or mL of an oral
 * solution) and the days of supply the dispensing was meant to cover. From
 * these the proportion of days covered per chelation period is computed
 * (core/safety adherence); nothing here is an estimate.
 */
export function dispensingSchemaAt(level: CheckLevel) {
  return z.strictObject({
    id: entryIdSchema,
    date: isoDateSchema,
    drug: z.enum(chelatorDrugs),
    productId: z.string().min(1).max(64).optional(),
    quantity: measuredQuantity(dispensedQuantityBounds, level),
    daysSupplied: boundedNumber(daysSuppliedBounds, level),
    note: noteSchema.optional(),
  });
}
