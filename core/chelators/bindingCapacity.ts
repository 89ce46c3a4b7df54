import { atomicWeight, type ElementSymbol } from '../elements/atomicWeights';
import { fail, issue, ok, type Result } from '../result';
import type { Milligrams } from '../units/quantity';
import { ligandOfForm } from './catalogue';
import { substanceForm, type SubstanceFormId } from './substanceForms';

/**
 * Theoretical mass of a metal bound by one gram of a chelator as dosed, from
 * stoichiometry alone (every ligand molecule bound, nothing lost):
 *
 * metal (mg per g) = 1000 / M(chelator as dosed) / ligands per metal × Ar(metal)
 *
 * Source: chelator : metal ratios from Poggiali et al., Blood Transfus
 * 2012;10:411, Table I (deferoxamine 1 : 1, deferiprone 3 : 1, deferasirox
 * 2 : 1 for Fe³⁺); molar masses and Ar from CIAAW 2021.
 *
 * @param formId - the form the dose is stated as (deferoxamine-mesylate, deferoxamine-base, deferiprone, deferasirox)
 * @param metal - element symbol; must be catalogued for the ligand ('Fe' for all; 'Al' for deferoxamine)
 * @returns mg of metal per g of chelator as dosed; or an issue (code 'not_applicable', path ['metal'])
 *   when the ligand has no catalogued stoichiometry for that metal
 * @example metalBindingCapacityMgPerG('deferiprone', 'Fe') → ok(≈ 133.8)
 */
export function metalBindingCapacityMgPerG(formId: SubstanceFormId, metal: ElementSymbol): Result<number> {
  const form = substanceForm(formId);
  const ligand = ligandOfForm(formId);
  if (!ligand) {
    return fail(issue('not_applicable', ['chelatorForm'], `No binding stoichiometry is catalogued for ${form.label}.`));
  }
  const binding = ligand.bindings.find((it) => it.metal === metal);
  if (!binding) {
    const catalogued = ligand.bindings.map((it) => it.metal).join(', ');
    return fail(
      issue(
        'not_applicable',
        ['metal'],
        `Metal ${metal} is not catalogued for ${ligand.name}: its binding stoichiometry is catalogued only for ${catalogued}.`,
      ),
    );
  }
  return ok((1000 / form.molarMassGPerMol / binding.ligandsPerMetal) * atomicWeight(metal));
}

/**
 * Theoretical mass of a metal that one dose of a chelator can bind:
 *
 * metal (mg) = dose (mg) / M(chelator as dosed) / ligands per metal × Ar(metal)
 *
 * Sources as for metalBindingCapacityMgPerG. This is a ceiling: what is
 * excreted is a fraction of it (see expectedIronExcretionMgPerDay).
 *
 * @param doseMg - dose as dosed, mg (≥ 0)
 * @param formId - the form the dose is stated as
 * @param metal - element symbol catalogued for the ligand
 * @returns metal bound, mg; or the issue from metalBindingCapacityMgPerG
 * @example metalBoundByDoseMg(mg(2000), 'deferoxamine-mesylate', 'Fe') → ok(≈ 170.1 mg)
 */
export function metalBoundByDoseMg(doseMg: Milligrams, formId: SubstanceFormId, metal: ElementSymbol): Result<Milligrams> {
  const capacity = metalBindingCapacityMgPerG(formId, metal);
  if (!capacity.ok) return capacity;
  return ok(((doseMg / 1000) * capacity.value) as Milligrams);
}
