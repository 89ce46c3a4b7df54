import type { Source } from './source';

/**
 * Sources for body size, renal function and age (references.md §5).
 *
 * Status: the equations were seen as reproduced by secondary pages (drug
 * information sites, the NIDDK eGFR page, calculator documentation), not in
 * the primary papers themselves, so every equation is 'secondary' until someone
 * checks the printed text.
 */
export const patientSources = [
  {
    id: 'mosteller-1987',
    authors: 'Mosteller RD',
    title: 'Simplified calculation of body-surface area',
    publication: 'N Engl J Med 1987;317:1098 (letter)',
    year: 1987,
    status: 'secondary',
    note: 'BSA (m²) = √(height cm × weight kg / 3600); the letter also gives an inch–pound form with 3131 in place of 3600 (secondary).',
  },
  {
    id: 'dubois-1916',
    authors: 'Du Bois D, Du Bois EF',
    title: 'A formula to estimate the approximate surface area if height and weight be known',
    publication: 'Arch Intern Med 1916;17:863-871',
    year: 1916,
    status: 'secondary',
    note: 'Printed as A = W^0.425 × H^0.725 × 71.84 (A in cm², W in kg, H in cm); 71.84 cm² = 0.007184 m². Derived from direct measurements of nine subjects.',
  },
  {
    id: 'haycock-1978',
    authors: 'Haycock GB, Schwartz GJ, Wisotsky DH',
    title: 'Geometric method for measuring body surface area: a height-weight formula validated in infants, children, and adults',
    publication: 'J Pediatr 1978;93:62-66',
    year: 1978,
    status: 'secondary',
    note: 'BSA (m²) = 0.024265 × H(cm)^0.3964 × W(kg)^0.5378; validated from infancy to adulthood.',
  },
  {
    id: 'verbraecken-2006',
    authors: 'Verbraecken J, Van de Heyning P, De Backer W, Van Gaal L',
    title: 'Body surface area in normal-weight, overweight, and obese adults. A comparison study',
    publication: 'Metabolism 2006;55:515-524',
    year: 2006,
    status: 'secondary',
    note: 'The common BSA formulas agree closely in normal-weight adults; the Du Bois formula gives values about 3 % (men) to 5 % (women) lower in obesity (as quoted by secondary pages).',
  },
  {
    id: 'cockcroft-gault-1976',
    authors: 'Cockcroft DW, Gault MH',
    title: 'Prediction of creatinine clearance from serum creatinine',
    publication: 'Nephron 1976;16:31-41',
    year: 1976,
    status: 'secondary',
    note: 'CrCl (mL/min) = (140 − age) × weight (kg) / (72 × SCr mg/dL), × 0.85 for women. Derived in 249 adult men aged 18–92 years (from memory); the 0.85 for women was proposed, not fitted. Creatinine of the time was measured by the Jaffe method, before IDMS standardisation.',
  },
  {
    id: 'inker-2021',
    authors: 'Inker LA, Eneanya ND, Coresh J, et al.',
    title: 'New creatinine- and cystatin C-based equations to estimate GFR without race',
    publication: 'N Engl J Med 2021;385:1737-1749',
    year: 2021,
    status: 'secondary',
    note: 'eGFRcr (mL/min/1.73 m²) = 142 × min(SCr/κ, 1)^α × max(SCr/κ, 1)^−1.200 × 0.9938^age × 1.012 [female]; κ 0.7 (F) / 0.9 (M); α −0.241 (F) / −0.302 (M); SCr standardised (IDMS-traceable) in mg/dL; adults aged 18 and over (NIDDK adult eGFR page).',
  },
  {
    id: 'schwartz-2009',
    authors: 'Schwartz GJ, Muñoz A, Schneider MF, et al.',
    title: 'New equations to estimate GFR in children with CKD',
    publication: 'J Am Soc Nephrol 2009;20:629-637',
    year: 2009,
    status: 'secondary',
    note: 'Bedside eGFR (mL/min/1.73 m²) = 0.413 × height (cm) / SCr (mg/dL), enzymatic IDMS-traceable creatinine; derived in the CKiD cohort of children aged 1–16 years with chronic kidney disease (age span from memory).',
  },
  {
    id: 'leap-day-birthday',
    authors: '—',
    title: 'Birthday of a person born on 29 February in a common year',
    publication: 'common practice; date-fns 4 differenceInYears follows the same rule',
    year: null,
    status: 'common-practice',
    note: 'The year of age is counted complete on 1 March of a common year. Jurisdictions differ (some use 28 February); from memory.',
  },
] as const satisfies readonly Source[];
