import { z } from 'zod';
import { refuseReservedKeys } from './reservedKeys';
import { assumptionOverridesSchema } from './assumptionOverrides';
import type { CheckLevel } from './bounds';
import { chelationPeriodSchemaAt } from './chelationPeriod';
import { clinicalStateSchema } from './clinicalState';
import { coMedicationSchemaAt } from './coMedication';
import { dispensingSchemaAt } from './dispensing';
import { entryIdSchema, isoDateSchema, requiredTextSchema } from './fields';
import { patientSchemaAt } from './patient';
import { resultEntrySchemaAt } from './resultEntry';
import { reviewSchema } from './review';
import { transfusionSchemaAt } from './transfusion';

/** The `format` every case file carries at its top. */
export const caseFileFormat = 'chelation-ledger.case';
/** The version this code writes; older versions are migrated forward on open (migrate.ts). */
export const currentCaseFileVersion = 2;
/** What-if regimens a case may hold beside the current one. */
export const maxProposedRegimens = 3;

/**
 * A local protocol's safety thresholds (core/thresholds), by threshold id,
 * with why, who and when; ids and ranges are checked by checkThresholdOverrides.
 */
export const thresholdOverridesSchema = refuseReservedKeys('a threshold id').pipe(
  z.record(z.string(), z.strictObject({ value: z.number(), reason: requiredTextSchema(1000), by: requiredTextSchema(100), at: isoDateSchema })),
);

/**
 * Schema of a version 2 case file at one check level ('refuse', 'warn' or 'both',
 * see bounds.ts). Lists may be omitted and default to empty. This schema is
 * the single source of the format: the types below are derived from it, and
 * version 1 files are read through the migration (migrate.ts).
 *
 * Version 2 adds: results (platelets, AST, bilirubin, urine
 * protein-to-creatinine ratio, zinc, audiology and eye examinations; a
 * laboratory reference range on any measured result), the clinical state
 * (Child-Pugh class, cardiac failure, renal risk factors), co-medications by
 * free generic name, dispensing records, deferasirox granules, a product id
 * on a chelation period, and units typed as people write them (kept as typed,
 * read as UCUM).
 *
 * A proposed regimen is a what-if: a name and the chelation periods it would
 * run, starting at the review date; the ledger projects it beside the current
 * regimen.
 */
export function caseSchemaAt(level: CheckLevel) {
  const chelationPeriod = chelationPeriodSchemaAt(level);
  return z.strictObject({
    format: z.literal(caseFileFormat),
    version: z.literal(currentCaseFileVersion),
    patient: patientSchemaAt(level),
    transfusions: z.array(transfusionSchemaAt(level)).default([]),
    results: z.array(resultEntrySchemaAt(level)).default([]),
    chelationPeriods: z.array(chelationPeriod).default([]),
    coMedications: z.array(coMedicationSchemaAt(level)).default([]),
    dispensings: z.array(dispensingSchemaAt(level)).default([]),
    clinicalState: clinicalStateSchema.default({ hepaticImpairment: [], cardiacFailure: [], renalRiskFactors: [] }),
    assumptionOverrides: assumptionOverridesSchema.default({}),
    thresholdOverrides: thresholdOverridesSchema.default({}),
    proposedRegimens: z
      .array(z.strictObject({ id: entryIdSchema, name: requiredTextSchema(80), periods: z.array(chelationPeriod).min(1) }))
      .max(maxProposedRegimens)
      .default([]),
    review: reviewSchema.default({ reviewDate: null, notes: [], signOff: null }),
  });
}

/**
 * The levels parseCase reads with, built once: 'both' (refusals and
 * warnings in one pass) and 'refuse' (for the parsed value when that pass
 * found warnings only: zod returns no value with issues).
 */
export const caseSchemas = { refuse: caseSchemaAt('refuse'), both: caseSchemaAt('both') } as const;

type DeepReadonly<T> = T extends string | number | boolean | null | undefined
  ? T
  : T extends readonly (infer Item)[]
    ? readonly DeepReadonly<Item>[]
    : { readonly [Key in keyof T]: DeepReadonly<T[Key]> };

/** A parsed, valid case file. Read-only all the way down: core never changes what the user typed. */
export type Case = DeepReadonly<z.output<typeof caseSchemas.refuse>>;
export type Patient = Case['patient'];
export type WeightEntry = Patient['weights'][number];
export type HeightEntry = Patient['heights'][number];
export type Transfusion = Case['transfusions'][number];
export type ResultEntry = Case['results'][number];
export type ResultKind = ResultEntry['kind'];
export type ChelationPeriod = Case['chelationPeriods'][number];
export type CoMedication = Case['coMedications'][number];
export type Dispensing = Case['dispensings'][number];
export type ClinicalState = Case['clinicalState'];
export type ProposedRegimen = Case['proposedRegimens'][number];
export type CaseAssumptionOverrides = Case['assumptionOverrides'];
/** A local protocol's safety thresholds (core/thresholds/catalogue.ts), by threshold id, with why, who and when. */
export type CaseThresholdOverrides = Case['thresholdOverrides'];
export type Review = Case['review'];
