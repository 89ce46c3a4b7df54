import { z } from 'zod';
import { isoDateSchema, noteSchema, requiredTextSchema } from './fields';

/**
 * Schema of the review block: the date the review is made as of (the ledger's
 * `asOf` unless the caller passes another), the notes, and the sign-off. A
 * sign-off records who reviewed the case and when; it never stands for a
 * prescriber's decision.
 */
export const reviewSchema = z.strictObject({
  reviewDate: isoDateSchema.nullable(),
  notes: z.array(z.strictObject({ date: isoDateSchema, by: requiredTextSchema(100), text: requiredTextSchema(4000) })).default([]),
  signOff: z.strictObject({ reviewer: requiredTextSchema(100), date: isoDateSchema, text: noteSchema }).nullable(),
});
