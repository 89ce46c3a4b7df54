import { z } from 'zod';
import { assumptionCatalogue, findAssumption } from '../assumptions';
import { displayUnit, type CustomIssueParams } from './bounds';
import { isoDateSchema, requiredTextSchema } from './fields';

const knownIds: readonly string[] = assumptionCatalogue.map((it) => it.id);

/** Own keys of a raw object, including "__proto__", which zod's record drops silently. */
const refuseUnknownIds = z.unknown().superRefine((raw, ctx) => {
  if (typeof raw !== 'object' || raw === null || Array.isArray(raw)) return;
  for (const id of Object.keys(raw)) {
    if (knownIds.includes(id)) continue;
    ctx.addIssue({
      code: 'custom',
      path: [id],
      message: `is not an assumption this version knows; known: ${knownIds.join(', ')}.`,
      params: { code: 'unknown_choice' } satisfies CustomIssueParams,
    });
  }
});

const overrideSchema = z.strictObject({
  value: z.number(),
  reason: requiredTextSchema(1000),
  by: requiredTextSchema(100),
  at: isoDateSchema,
});

/**
 * Schema of the assumption overrides: keyed by an assumption id from
 * core/assumptions/catalogue.ts, each with the value, why, who and when. An
 * unknown id is refused ('unknown_choice'), and so is a value outside the
 * range the catalogue allows for that assumption ('out_of_range'). The result
 * has the shape core/formulas' runFormula takes as `overrides`.
 */
export const assumptionOverridesSchema = refuseUnknownIds.pipe(
  z.record(z.string(), overrideSchema).superRefine((overrides, ctx) => {
    for (const [id, override] of Object.entries(overrides)) {
      const assumption = findAssumption(id);
      if (!assumption || (override.value >= assumption.min && override.value <= assumption.max)) continue;
      const unit = displayUnit(assumption.unit);
      const suffix = unit === '' ? '' : ` ${unit}`;
      ctx.addIssue({
        code: 'custom',
        path: [id, 'value'],
        message: `${override.value}${suffix} is outside ${assumption.min}–${assumption.max}${suffix}, the range allowed for ${assumption.label}.`,
        params: { code: 'out_of_range' } satisfies CustomIssueParams,
      });
    }
  }),
);
