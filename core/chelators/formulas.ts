import type { AnyFormula } from '../formulas/types';

/** Every chelators formula, in the order `calc --list` shows them. */
export const chelatorsFormulas: readonly AnyFormula[] = [];
