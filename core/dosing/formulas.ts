import { inputRange, weightBounds } from '../ranges';
import { defineFormula, type AnyFormula } from '../formulas/types';
import { issue } from '../result';
import { kg } from '../units/quantity';
import { formatAmount } from '../numbers/formatNumber';
import { proposePracticalDose, defaultMeasurableStepMl, practicalDoseRanges } from './practicalDose';
import { defaultProductCatalogue, findProduct } from './productCatalogue';

const productIds = defaultProductCatalogue.map((it) => it.id) as [string, ...string[]];
const solutionIds = defaultProductCatalogue.filter((it) => it.kind === 'oral-solution').map((it) => it.id);

/**
 * The practical-dose calculator over the shipped product catalogue. A local
 * formulary (other strengths) goes through the `dose` command's --catalogue,
 * since a calculator input cannot carry a list of strengths.
 */
export const practicalDose = defineFormula({
  id: 'practical-dose',
  title: 'Practical dose from the available strengths',
  expression:
    'intended (mg per administration) = target (mg/kg/day) × weight (kg) ÷ administrations per day; closest combination of strengths (tablets, halves where allowed), measurable volume (solution) or vials opened (deferoxamine); proposed mg/kg/day = proposed mg × administrations ÷ weight; difference = proposed − intended (mg and %)',
  sourceIds: ['dosing-deferasirox-strengths-memory', 'dosing-deferiprone-strengths-memory', 'deferiprone-label', 'deferiprone-smpc-eu-2023', 'dosing-deferoxamine-vials-memory', 'dosing-measurable-volume'],
  notes: [
    'Product strengths are from memory of the labels: check them against the local formulary (the dose command takes an edited catalogue with --catalogue).',
    'On a tie the lower amount is shown; then the fewest tablets. Halves only for tablets marked breakable (the EU deferiprone film-coated tablets, 500 and 1000 mg: SmPC §3; §4.2 calculates the dose to the nearest half tablet).',
    'For deferoxamine, the target is the dose of one infusion day and the dose drawn is the intended dose; the vials shown are those with the least left over.',
    'Descriptive only: for review by the prescriber; follow local protocols.',
  ],
  inputs: {
    product: { kind: 'choice', label: 'product', choices: productIds, meaning: 'product from the shipped catalogue (strengths from memory of the labels)' },
    targetMgPerKgPerDay: {
      kind: 'number',
      label: 'intended dose',
      unit: 'mg/kg/d',
      min: practicalDoseRanges.mgPerKgPerDay.min,
      max: practicalDoseRanges.mgPerKgPerDay.max,
      meaning: 'intended dose per kg per day of treatment (for deferoxamine: per infusion day)',
    },
    weightKg: { kind: 'number', label: 'body weight', ...inputRange(weightBounds), meaning: 'body weight the dose refers to' },
    administrationsPerDay: {
      kind: 'number',
      label: 'administrations per day',
      unit: '1',
      min: practicalDoseRanges.administrationsPerDay.min,
      max: practicalDoseRanges.administrationsPerDay.max,
      integer: true,
      default: 1,
      meaning: 'administrations on a day of treatment (deferiprone usually 3)',
    },
    measurableStepMl: {
      kind: 'number',
      label: 'measurable volume step',
      unit: 'mL',
      min: practicalDoseRanges.measurableStepMl.min,
      max: practicalDoseRanges.measurableStepMl.max,
      default: defaultMeasurableStepMl,
      usedWhen: { input: 'product', oneOf: solutionIds },
      meaning: 'smallest step the oral syringe measures (0.1 mL: common practice)',
    },
  },
  outputs: {
    proposedMgPerAdministration: { label: 'amount per administration', unit: 'mg', meaning: 'amount the combination, volume or draw gives per administration', decimals: 1 },
    proposedMgPerKgPerDay: { label: 'resulting dose', unit: 'mg/kg/d', meaning: 'the proposed amount per kg per day of treatment', decimals: 2 },
    differenceMgPerDay: { label: 'difference', unit: 'mg/d', meaning: 'proposed minus intended, mg per day (negative: below)', decimals: 1 },
    differencePercent: { label: 'difference', unit: '%', meaning: 'proposed minus intended, % of the intended dose', decimals: 2 },
    combination: { label: 'combination', unit: '', kind: 'text', meaning: 'tablets, volume or vials per administration' },
    leftOver: { label: 'left over in opened vials', unit: '', kind: 'text', meaning: 'deferoxamine: mg left in the single-use vials opened; otherwise not applicable' },
  },
  compute: ({ product, targetMgPerKgPerDay, weightKg, administrationsPerDay, measurableStepMl }) => {
    const found = findProduct(defaultProductCatalogue, product);
    if (!found.ok) return { refused: found.issues };
    const proposed = proposePracticalDose({
      product: found.value,
      target: { kind: 'per-kg-per-day', mgPerKgPerDay: targetMgPerKgPerDay },
      weightKg: kg(weightKg),
      administrationsPerDay,
      ...(measurableStepMl !== undefined ? { measurableStepMl } : {}),
    });
    if (!proposed.ok) return { refused: proposed.issues };
    const value = proposed.value;
    return {
      proposedMgPerAdministration: value.proposedMgPerAdministration,
      proposedMgPerKgPerDay: value.proposedMgPerKgPerDay,
      differenceMgPerDay: value.differenceMgPerDay,
      differencePercent: value.differencePercent,
      combination: value.combinationText,
      leftOver: value.form.kind === 'vials' ? `${formatAmount(value.form.wasteMg)} mg` : 'not applicable',
    };
  },
});

/**
 * The proportion of days covered as a catalogued formula, so that the expected
 * removal it feeds shows it in its derivation (core/ledger/periodAdherence.ts
 * counts the covered days from the dispensing records).
 */
export const proportionOfDaysCoveredFormula = defineFormula({
  id: 'proportion-of-days-covered',
  title: 'Proportion of days covered by dispensings',
  expression:
    'PDC = days with the drug on hand ÷ days in the period; the period runs from the first dispensing (or the start of the chelation period, whichever is later) to its end or the review date; a supply dispensed while an earlier one lasts starts the day after it ends',
  sourceIds: ['nau-pqa-2012-pdc'],
  notes: [
    'Days supplied are as recorded at dispensing: drug on hand is not drug taken, so the proportion is an upper estimate of adherence.',
    'Descriptive only: for review by the prescriber; follow local protocols.',
  ],
  inputs: {
    coveredDays: { kind: 'number', label: 'days covered', unit: 'd', min: 0, max: 36600, integer: true, meaning: 'days in the period with the drug on hand' },
    periodDays: { kind: 'number', label: 'days in the period', unit: 'd', min: 1, max: 36600, integer: true, meaning: 'days from the first day of the period to the last, both included' },
  },
  outputs: {
    proportion: { label: 'proportion of days covered', unit: '1', meaning: 'share of the days with the drug on hand', decimals: 2 },
  },
  compute: ({ coveredDays, periodDays }) =>
    coveredDays > periodDays
      ? { refused: [issue('out_of_range', ['coveredDays'], `Days covered (${coveredDays}) cannot exceed the days in the period (${periodDays}).`)] }
      : { proportion: coveredDays / periodDays },
});

export const dosingFormulas: readonly AnyFormula[] = [practicalDose, proportionOfDaysCoveredFormula];
