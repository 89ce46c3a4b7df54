import type { AnyFormula } from '../formulas/types';

/** Every chemistry formula, in the order `calc --list` shows them. */
export const chemistryFormulas: readonly AnyFormula[] = [];
