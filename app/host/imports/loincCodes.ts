/**
 * LOINC codes read by the imports, each mapped to a result kind of the case
 * file. Codes are matched, never display names (LOINC display names change
 * between releases). LOINC is © Regenstrief Institute; codes are used under
 * its licence, carried as codes only.
 *
 * Sources: references.md §8 table (codes confirmed there); AST 1920-8 and
 * total bilirubin 1975-2 as listed in the value sets "Aspartate Transaminase
 * (AST/SGOT) Lab Tests" and "Total Bilirubin Lab Tests" of the HL7 dQM CMS
 * Content Implementation Guide 2026.1.0 (expansion from LOINC 2.82), and in the
 * US Core serum total bilirubin example (LOINC 1975-2, mg/dL).
 * No LOINC code was found for MRI liver iron, liver R2-star or T2-star, or cardiac T2-star:
 * those are listed as unknown codes, unless a local code map (codeMap.ts) names
 * the site's codes for them.
 */
export type LoincTarget =
  | { readonly list: 'results'; readonly kind: string; readonly method?: 'biopsy' }
  | { readonly list: 'weights' }
  | { readonly list: 'heights' };

export const loincCodes: Readonly<Record<string, { readonly target: LoincTarget; readonly what: string }>> = {
  '2276-4': { target: { list: 'results', kind: 'ferritin' }, what: 'ferritin, serum or plasma' },
  '718-7': { target: { list: 'results', kind: 'haemoglobin' }, what: 'haemoglobin, blood' },
  '2160-0': { target: { list: 'results', kind: 'creatinine' }, what: 'creatinine, serum or plasma (mass)' },
  '14682-9': { target: { list: 'results', kind: 'creatinine' }, what: 'creatinine, serum or plasma (moles)' },
  '1742-6': { target: { list: 'results', kind: 'alt' }, what: 'alanine aminotransferase' },
  '1920-8': { target: { list: 'results', kind: 'ast' }, what: 'aspartate aminotransferase, serum or plasma' },
  '1975-2': { target: { list: 'results', kind: 'bilirubin' }, what: 'bilirubin total, serum or plasma' },
  '751-8': { target: { list: 'results', kind: 'neutrophils' }, what: 'neutrophils, absolute (automated)' },
  '26499-4': { target: { list: 'results', kind: 'neutrophils' }, what: 'neutrophils, absolute' },
  '777-3': { target: { list: 'results', kind: 'platelets' }, what: 'platelets (automated)' },
  '26515-7': { target: { list: 'results', kind: 'platelets' }, what: 'platelets' },
  '5671-3': { target: { list: 'results', kind: 'blood-lead' }, what: 'lead, blood' },
  '77307-7': { target: { list: 'results', kind: 'blood-lead' }, what: 'lead, venous blood' },
  '5633-3': { target: { list: 'results', kind: 'urinary-copper' }, what: 'copper, 24-hour urine' },
  '15357-7': { target: { list: 'results', kind: 'liver-iron', method: 'biopsy' }, what: 'iron, liver tissue (biopsy)' },
  '29463-7': { target: { list: 'weights' }, what: 'body weight' },
  '8302-2': { target: { list: 'heights' }, what: 'body height' },
};

export const loincSystem = 'http://loinc.org';
export const ucumSystem = 'http://unitsofmeasure.org';
/** SNOMED CT 116863004 "transfusion of red blood cells", as in HL7's examples (references.md §8). */
export const redCellTransfusionSnomed = { system: 'http://snomed.info/sct', code: '116863004' } as const;
