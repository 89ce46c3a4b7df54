import type { AnyFormula } from '../formulas/types';

/** Unit-conversion calculators (laboratory units), in the order `calc --list` shows them. */
export const unitFormulas: readonly AnyFormula[] = [];
