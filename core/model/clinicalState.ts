import { z } from 'zod';
import { entryIdSchema, isoDateSchema, noteSchema } from './fields';

/** Child-Pugh classes (A mild, B moderate, C severe hepatic impairment). */
export const childPughClasses = ['A', 'B', 'C'] as const;

/**
 * Renal risk factors the deferasirox label names for closer creatinine
 * monitoring (pre-existing renal conditions, comorbid conditions, medicines
 * that depress renal function; references.md §9, US label boxed warning and
 * §2.1). Older age is read from the patient's age, not recorded here.
 */
export const renalRiskFactors = ['pre-existing-renal-condition', 'nephrotoxic-co-medication', 'comorbid-condition', 'other'] as const;

/** Whether a recorded condition is present from its date on, or recorded as absent or resolved. */
export const conditionStatuses = ['present', 'absent'] as const;

/**
 * Schema of the clinical state (version 2): dated records of hepatic
 * impairment by Child-Pugh class, cardiac failure, and renal risk factors.
 * Each list is a history: the latest entry on or before a date says how
 * things stood then. The rules read them (deferasirox in Child-Pugh B and C,
 * ascorbic acid not in cardiac failure, weekly creatinine in the first month
 * with renal risk).
 */
export const clinicalStateSchema = z.strictObject({
  hepaticImpairment: z
    .array(z.strictObject({ id: entryIdSchema, date: isoDateSchema, childPughClass: z.enum(childPughClasses), note: noteSchema.optional() }))
    .default([]),
  cardiacFailure: z.array(z.strictObject({ id: entryIdSchema, date: isoDateSchema, status: z.enum(conditionStatuses), note: noteSchema.optional() })).default([]),
  renalRiskFactors: z
    .array(z.strictObject({ id: entryIdSchema, date: isoDateSchema, factor: z.enum(renalRiskFactors), status: z.enum(conditionStatuses), note: noteSchema.optional() }))
    .default([]),
});
