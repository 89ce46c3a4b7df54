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

/**
 * Ids a formula was known by before a rename, still accepted by `calc` so a command line a user
 * relies on keeps working. Output always names the current id.
 */
export const formulaIdAliases: Readonly<Record<string, string>> = {
  'dfo-therapeutic-index': 'deferoxamine-therapeutic-index',
};

/**
 * Input names a formula used before a rename (formula id → former name → current name), still
 * accepted by `calc` as flags (`--days`), so a command line a user relies on keeps working.
 */
export const formulaInputAliases: Readonly<Record<string, Readonly<Record<string, string>>>> = {
  'net-iron-balance': { days: 'periodDays' },
  'measured-chelation': { days: 'intervalDays' },
  'projected-lic': { days: 'daysAhead' },
};

/** The formula with this id, or with a former id listed in `formulaIdAliases`. */
export function findFormula(id: string): AnyFormula | undefined {
  return byId.get(id) ?? (Object.hasOwn(formulaIdAliases, id) ? byId.get(formulaIdAliases[id]!) : undefined);
}

export const formulaIds: readonly string[] = formulaCatalogue.map((it) => it.id);
