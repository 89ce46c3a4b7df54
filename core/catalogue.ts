import { chelatorsFormulas } from './chelators/formulas';
import { chemistryFormulas } from './chemistry/formulas';
import { dosingFormulas } from './dosing/formulas';
import { ironFormulas } from './iron/formulas';
import { ledgerFormulas } from './ledger/formulas';
import { patientFormulas } from './patient/formulas';
import { unitFormulas } from './units/formulas';
import type { AnyFormula } from './formulas/types';

/**
 * The one catalogue of formulas. `calc --list`, the command-line calculators,
 * derivations and the sheet's method appendix all read it.
 * Each area owns its list; add a formula there, not here.
 */
export const formulaCatalogue: readonly AnyFormula[] = [
  ...ironFormulas,
  ...ledgerFormulas,
  ...chelatorsFormulas,
  ...patientFormulas,
  ...unitFormulas,
  ...chemistryFormulas,
  ...dosingFormulas,
];

const byId = new Map<string, AnyFormula>();
for (const formula of formulaCatalogue) {
  if (byId.has(formula.id)) throw new Error(`Duplicate formula id ${formula.id}`);
  byId.set(formula.id, formula);
}

export function findFormula(id: string): AnyFormula | undefined {
  return byId.get(id);
}

export const formulaIds: readonly string[] = formulaCatalogue.map((it) => it.id);
