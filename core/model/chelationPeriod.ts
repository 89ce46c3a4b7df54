import { z } from 'zod';
import { boundedNumber, measuredQuantity, type CheckLevel } from './bounds';
import { entryIdSchema, isoDateSchema, noteSchema } from './fields';
import {
  administrationsPerDayBounds,
  adherenceBounds,
  daysPerWeekBounds,
  deferasiroxDoseBounds,
  deferiproneDoseBounds,
  deferoxamineDoseBounds,
  infusionHoursBounds,
} from '../ranges/plausibleRanges';

export const chelatorDrugs = ['deferoxamine', 'deferiprone', 'deferasirox'] as const;
/**
 * Deferasirox forms: tablets for oral suspension ('dispersible-tablet'),
 * film-coated tablets, and oral granules (version 2), which the US label doses
 * as the film-coated tablets (references.md §9: US label, national drug code
 * records).
 */
export const deferasiroxFormulations = ['dispersible-tablet', 'film-coated-tablet', 'granules'] as const;
export const deferiproneFormulations = ['tablet', 'oral-solution'] as const;
export const deferoxamineFormulations = ['vial'] as const;
export const deferoxamineRoutes = ['subcutaneous', 'intravenous'] as const;

/**
 * Schema of one chelation period at one check level: what was prescribed from
 * `startDate` to `endDate` (inclusive; null while ongoing).
 *
 * The dose is per administration as entered, `{ value, unit: 'mg' | 'mg/kg' }`;
 * the daily and weekly amounts follow from `administrationsPerDay` and
 * `daysPerWeek`. Each drug allows only its own formulations and routes, so a
 * subcutaneous deferasirox cannot be recorded.
 *
 * `adherence` is an estimated fraction of prescribed doses taken (default 1).
 * It is an estimate the pharmacist makes, not a measurement; `adherenceNote`
 * says what it rests on (pharmacy refill record, the patient's account).
 *
 * `productId` (version 2, optional) names the product in the dosing
 * catalogue (core/dosing/productCatalogue.ts, or the local formulary's): the
 * two deferiprone 1,000 mg tablets for twice- and three-times-daily dosing are
 * different products, and a finding compares the product with the
 * administrations per day. Unknown ids are reported by the safety rules,
 * which know the catalogue in use.
 */
export function chelationPeriodSchemaAt(level: CheckLevel) {
  const shared = {
    id: entryIdSchema,
    startDate: isoDateSchema,
    endDate: isoDateSchema.nullable(),
    administrationsPerDay: boundedNumber(administrationsPerDayBounds, level),
    daysPerWeek: boundedNumber(daysPerWeekBounds, level),
    adherence: boundedNumber(adherenceBounds, level).default(1),
    adherenceNote: noteSchema.optional(),
    productId: z.string().min(1).max(64).optional(),
    note: noteSchema.optional(),
  };
  return z.discriminatedUnion('drug', [
    z.strictObject({
      ...shared,
      drug: z.literal('deferoxamine'),
      formulation: z.enum(deferoxamineFormulations),
      route: z.enum(deferoxamineRoutes),
      dose: measuredQuantity(deferoxamineDoseBounds, level),
      infusionHours: boundedNumber(infusionHoursBounds, level).optional(),
    }),
    z.strictObject({
      ...shared,
      drug: z.literal('deferiprone'),
      formulation: z.enum(deferiproneFormulations),
      route: z.literal('oral'),
      dose: measuredQuantity(deferiproneDoseBounds, level),
    }),
    z.strictObject({
      ...shared,
      drug: z.literal('deferasirox'),
      formulation: z.enum(deferasiroxFormulations),
      route: z.literal('oral'),
      dose: measuredQuantity(deferasiroxDoseBounds, level),
    }),
  ]);
}
