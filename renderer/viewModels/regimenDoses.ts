import { metalBoundByDoseMg } from '../../core/chelators/bindingCapacity';
import type { SubstanceFormId } from '../../core/chelators/substanceForms';
import { defaultProductCatalogue, findProduct, proposePracticalDose } from '../../core/dosing';
import type { ChelationPeriod } from '../../core/model/caseFile';
import { mg, type Kilograms } from '../../core/units/quantity';
import { formatQuantity } from './format';

/** The product a period's drug and formulation are dispensed as, in the default catalogue (a local formulary may differ). */
const productOf: Readonly<Record<string, string>> = {
  'deferasirox:film-coated-tablet': 'deferasirox-film-coated',
  'deferasirox:dispersible-tablet': 'deferasirox-dispersible',
  'deferiprone:tablet': 'deferiprone-tablets',
  'deferiprone:oral-solution': 'deferiprone-oral-solution',
  'deferoxamine:vial': 'deferoxamine-vials',
};

/** The form a dose is stated as: deferoxamine is dosed as its mesylate salt (the vial's content), the oral chelators as the base. */
const formOf: Readonly<Record<ChelationPeriod['drug'], SubstanceFormId>> = {
  deferoxamine: 'deferoxamine-mesylate',
  deferiprone: 'deferiprone',
  deferasirox: 'deferasirox',
};

export interface PeriodDoseLine {
  readonly period: string;
  readonly capacity: string;
  readonly practical: string;
}

/**
 * For each period of a regimen: the iron one administration can bind by
 * stoichiometry (a ceiling, core/chelators) and the practical dose with the
 * shelf strengths (core/dosing's proposal), both at the given weight.
 */
export function periodDoseLines(periods: readonly ChelationPeriod[], weightKg: number): PeriodDoseLine[] {
  return periods.map((period) => {
    const label = `${period.drug} ${formatQuantity(period.dose.value, 0, period.dose.unit)}`;
    if (period.dose.unit !== 'mg/kg') {
      const bound = metalBoundByDoseMg(mg(period.dose.value), formOf[period.drug], 'Fe');
      return {
        period: label,
        capacity: bound.ok ? `binds at most ${formatQuantity(bound.value, 0, 'mg')} iron per administration` : bound.issues[0]!.message,
        practical: 'entered in mg: the practical dose is the dose as entered',
      };
    }
    const product = findProduct(defaultProductCatalogue, productOf[`${period.drug}:${period.formulation}`] ?? '');
    if (!product.ok) return { period: label, capacity: '—', practical: 'no product of this formulation in the catalogue' };
    const proposal = proposePracticalDose({
      product: product.value,
      target: { kind: 'per-kg-per-administration', mgPerKgPerAdministration: period.dose.value },
      weightKg: weightKg as Kilograms,
      administrationsPerDay: period.administrationsPerDay,
    });
    if (!proposal.ok) return { period: label, capacity: '—', practical: proposal.issues.map((it) => it.message).join(' ') };
    const bound = metalBoundByDoseMg(proposal.value.intendedMgPerAdministration, formOf[period.drug], 'Fe');
    return {
      period: label,
      capacity: bound.ok
        ? `${formatQuantity(proposal.value.intendedMgPerAdministration, 0, 'mg')} per administration binds at most ${formatQuantity(bound.value, 0, 'mg')} iron (stoichiometric ceiling)`
        : bound.issues[0]!.message,
      practical: `${proposal.value.combinationText} (${product.value.name}): ${proposal.value.description}`,
    };
  });
}
