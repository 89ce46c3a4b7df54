import { fail, issue, ok, type Result } from '../result';
import type { Milligrams } from '../units/quantity';
import { substanceForm, type SubstanceFormId } from './substanceForms';

/**
 * Convert a mass of a drug from one chemical form to another form of the same
 * substance: salt to base, base to salt, or salt to another salt (trientine
 * dihydrochloride to tetrahydrochloride). Each catalogued form holds one base
 * moiety per formula unit, so equal amounts of substance (mol) carry equal
 * amounts of base:
 *
 * mass in target form (mg) = mass (mg) / M(source form) × M(target form)
 *
 * Source: stoichiometry (definition) with molar masses computed from CIAAW
 * weights (ciaaw-2021).
 *
 * @param massMg - mass stated in the source form, mg (> 0)
 * @param fromFormId - the form the mass is stated as
 * @param toFormId - the form wanted; must be a form of the same substance
 * @returns mass in the target form, mg; or an issue (code 'inconsistent', path ['toForm'])
 *   when the two forms belong to different substances
 * @example massInForm(mg(500), 'deferoxamine-mesylate', 'deferoxamine-base') → ok(≈ 426.84 mg)
 */
export function massInForm(massMg: Milligrams, fromFormId: SubstanceFormId, toFormId: SubstanceFormId): Result<Milligrams> {
  const from = substanceForm(fromFormId);
  const to = substanceForm(toFormId);
  if (from.substance !== to.substance) {
    return fail(
      issue(
        'inconsistent',
        ['toForm'],
        `Target form "${to.label}" is not a form of ${from.substance}; choose a form of the same substance as "${from.label}".`,
      ),
    );
  }
  return ok(((massMg / from.molarMassGPerMol) * to.molarMassGPerMol) as Milligrams);
}
