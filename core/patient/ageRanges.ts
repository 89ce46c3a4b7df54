/**
 * Age limits shared by the renal equations (years).
 * 18: the adult equations (Cockcroft–Gault, CKD-EPI 2021) were derived in adults
 * aged 18 and over (NIDDK adult eGFR page; 'inker-2021'); the bedside Schwartz
 * equation covers children from 1 year to under 18 here ('schwartz-2009': CKiD
 * enrolled children from 1 year). 120: the oldest plausible age (common practice).
 */
export const adultFromAgeYears = 18;
export const oldestAgeYears = 120;
export const schwartzFromAgeYears = 1;
