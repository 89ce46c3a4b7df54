import { z } from 'zod';
import { productCatalogueSchema } from '../dosing/productCatalogue';
import { assumptionOverridesSchema } from '../model/assumptionOverrides';
import { thresholdOverridesSchema } from '../model/caseFile';
import { checkThresholdOverrides } from '../thresholds';

/** How quantities are shown: SI (µmol/L, g/L) or the conventional units (mg/dL, g/dL). */
export const unitSystems = ['si', 'conventional'] as const;
/** Paper of the review sheet. */
export const paperSizes = ['a4', 'letter'] as const;

/** The version this code writes into settings.json. */
export const currentSettingsVersion = 1;

/**
 * The user's settings, stored as one JSON file in the user's config folder
 * (app/host/settingsStore.ts). Every field has a default so a missing or
 * partial file still reads; an unknown field or a wrong value is refused with
 * the field named.
 *
 * - `localFormulary`: the products and strengths the pharmacy stocks, in the
 *   shape `chelation-ledger dose --catalogue` reads; null means the built-in catalogue.
 * - `assumptionDefaults`: overrides of published assumptions a local protocol
 *   applies to every new case (same shape and ranges as a case's overrides).
 * - `thresholdDefaults`: a local protocol's safety thresholds (same shape and
 *   checks as a case's threshold overrides).
 */
export const settingsSchema = z
  .strictObject({
    version: z.literal(currentSettingsVersion).default(currentSettingsVersion),
    units: z.enum(unitSystems).default('si'),
    paper: z.enum(paperSizes).default('a4'),
    localFormulary: productCatalogueSchema.nullable().default(null),
    assumptionDefaults: assumptionOverridesSchema.default({}),
    thresholdDefaults: thresholdOverridesSchema.default({}),
  })
  .superRefine((settings, context) => {
    const checked = checkThresholdOverrides(settings.thresholdDefaults);
    if (checked.ok) return;
    for (const problem of checked.issues) {
      context.addIssue({ code: 'custom', path: ['thresholdDefaults', ...problem.path.slice(1)], message: problem.message, params: { code: problem.code } });
    }
  });

export type Settings = z.output<typeof settingsSchema>;

/** The settings of a first run: every default. */
export const defaultSettings: Settings = settingsSchema.parse({});
