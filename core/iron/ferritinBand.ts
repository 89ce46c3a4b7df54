import type { MicrogramsPerLitre } from '../units/quantity';
import type { Band } from './band';

export type FerritinBandId = 'below-500' | 'from-500-to-1000' | 'above-1000';

/** The band edges, µg/L (guideline literature, see the source beside ferritinBand). */
export const ferritinBandEdgesUgPerL = { maintenanceFrom: 500, maintenanceUpTo: 1000 } as const;
const { maintenanceFrom, maintenanceUpTo } = ferritinBandEdgesUgPerL;

/** The bands as a formula's expression states them: '< 500 | 500–1000 | > 1000'. */
export const ferritinBandsText = `< ${maintenanceFrom} | ${maintenanceFrom}–${maintenanceUpTo} | > ${maintenanceUpTo}`;

/** Shown with every ferritin band: ferritin is a surrogate of body iron. */
export const ferritinSurrogateCaution =
  'Ferritin is a surrogate of body iron (raised by inflammation and liver damage); review it with the liver iron concentration.';

/** Added in sickle cell disease, where ferritin tracks body iron poorly. */
export const ferritinSickleCellCaution =
  'In sickle cell disease ferritin is a poor marker of body iron (vaso-occlusive episodes and inflammation raise it); rely on the liver iron concentration.';

/**
 * Band of a serum ferritin, with the caution that it is a surrogate.
 *
 * below 500; 500–1000 (both ends included), a usual maintenance range; above
 * 1000, consistently above which is a usual point to consider chelation (µg/L).
 *
 * Source: thalassaemia and sickle cell guideline literature (references.md §2,
 * secondary): 'ferritin-guideline-literature'.
 *
 * @param ferritin - serum ferritin, µg/L (= ng/mL; 0 or more)
 * @param context - sickleCellDisease adds the caution that ferritin is a poor marker there
 * @returns band id, label, source id and caution
 * @example ferritinBand(ugPerL(750), { sickleCellDisease: true }).id === 'from-500-to-1000'
 */
export function ferritinBand(
  ferritin: MicrogramsPerLitre,
  context: { readonly sickleCellDisease: boolean },
): Band<FerritinBandId> {
  const caution = context.sickleCellDisease ? `${ferritinSickleCellCaution} ${ferritinSurrogateCaution}` : ferritinSurrogateCaution;
  const sourceId = 'ferritin-guideline-literature';
  if (ferritin < maintenanceFrom) return { id: 'below-500', label: `below ${maintenanceFrom} µg/L`, sourceId, caution };
  if (ferritin <= maintenanceUpTo) return { id: 'from-500-to-1000', label: `${maintenanceFrom}–${maintenanceUpTo} µg/L (a usual maintenance range)`, sourceId, caution };
  return { id: 'above-1000', label: `above ${maintenanceUpTo} µg/L (consistently above ${maintenanceUpTo} is a usual point to consider chelation)`, sourceId, caution };
}
