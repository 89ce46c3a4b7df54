import type { AnyFormula } from '../formulas/types';

/** Every patient formula, in the order `calc --list` shows them. */
export const patientFormulas: readonly AnyFormula[] = [];
