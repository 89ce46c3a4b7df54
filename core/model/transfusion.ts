import { z } from 'zod';
import { boundedNumber, measuredQuantity, type CheckLevel } from './bounds';
import { entryIdSchema, isoDateSchema, noteSchema } from './fields';
import {
  exchangeUnitCountBounds,
  exchangeVolumeBounds,
  patientHaematocritBounds,
  transfusionUnitCountBounds,
  transfusionVolumeBounds,
  unitHaematocritBounds,
  venesectionVolumeBounds,
} from '../ranges/plausibleRanges';

/**
 * The assumption that stands in for a unit haematocrit the record does not
 * give (`unitHaematocrit: null`). Its value is shown to the user as assumed,
 * and a case may override it like any other assumption.
 */
export const unitHaematocritAssumptionId = 'unit-haematocrit-red-cells';

export const exchangeMethods = ['manual', 'automated'] as const;

/**
 * Schema of one entry of the transfusion record at one check level: blood in
 * (a simple transfusion), blood in and out (a red-cell exchange), or blood out
 * (a venesection). Volumes are as entered, `{ value, unit: 'mL' }`.
 *
 * - simple: `volume` is the total of all `unitCount` units given that day.
 * - exchange: donor cells in (`volumeIn`, `unitHaematocrit`) and the patient's
 *   blood out (`volumeRemoved`, `patientHaematocrit` before the procedure; the
 *   haematocrit of the removed blood drifts during it, so the iron removed is
 *   an approximation).
 * - venesection: blood removed and the patient's haematocrit.
 * A `unitHaematocrit` of null records that it was not entered: the product
 * default ({@link unitHaematocritAssumptionId}) applies and is shown as assumed.
 */
export function transfusionSchemaAt(level: CheckLevel) {
  const unitHaematocrit = boundedNumber(unitHaematocritBounds, level).nullable();
  return z.discriminatedUnion('kind', [
    z.strictObject({
      id: entryIdSchema,
      date: isoDateSchema,
      kind: z.literal('simple'),
      volume: measuredQuantity({ mL: transfusionVolumeBounds }, level),
      unitHaematocrit,
      unitCount: boundedNumber(transfusionUnitCountBounds, level),
      note: noteSchema.optional(),
    }),
    z.strictObject({
      id: entryIdSchema,
      date: isoDateSchema,
      kind: z.literal('exchange'),
      method: z.enum(exchangeMethods),
      volumeIn: measuredQuantity({ mL: exchangeVolumeBounds }, level),
      unitHaematocrit,
      unitCount: boundedNumber(exchangeUnitCountBounds, level),
      volumeRemoved: measuredQuantity({ mL: exchangeVolumeBounds }, level),
      patientHaematocrit: boundedNumber(patientHaematocritBounds, level),
      note: noteSchema.optional(),
    }),
    z.strictObject({
      id: entryIdSchema,
      date: isoDateSchema,
      kind: z.literal('venesection'),
      volumeRemoved: measuredQuantity({ mL: venesectionVolumeBounds }, level),
      patientHaematocrit: boundedNumber(patientHaematocritBounds, level),
      note: noteSchema.optional(),
    }),
  ]);
}
