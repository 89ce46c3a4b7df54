import { dailyDoseBounds, inputRange, weightBounds } from '../ranges';
import { doseEntryRefusals, type DoseEntryInputs } from '../formulas/doseEntry';
import { defineFormula, type AnyFormula } from '../formulas/types';
import { fraction, mg, mgPerKg, mgPerKgPerDay, ugPerL } from '../units/quantity';
import { metalBindingCapacityMgPerG, metalBoundByDoseMg } from './bindingCapacity';
import { chelatingFormIds, chelatorIds, findChelator } from './catalogue';
import { deferasiroxDoseInOtherFormulation, deferasiroxFormulations, otherDeferasiroxFormulation } from './deferasiroxFormulation';
import {
  deferoxamineTherapeuticIndex,
  deferoxamineTherapeuticIndexAboveLimit,
  deferoxamineTherapeuticIndexLimit,
  meanDailyDeferoxamineDoseMgPerKg,
} from './deferoxamineTherapeuticIndex';
import { expectedIronExcretionMgPerDay } from './expectedExcretion';
import { massInForm } from './saltToBase';
import { substanceForm, substanceFormIds } from './substanceForms';

/** Metals offered by the binding calculator; each chelator refuses those it is not catalogued for. */
export const bindingMetalChoices = ['Fe', 'Al', 'Cu', 'Zn', 'Pb', 'Hg'] as const;

// Weight and daily dose take the case model's ranges (core/ranges), so a dose `check` accepts is computed (and the safety rules judge it).
const weightKgInput = { kind: 'number', label: 'body weight', ...inputRange(weightBounds), meaning: 'body weight used for the mg/kg dose' } as const;

/** One dose of the chelator: in mg, or in mg/kg with the body weight (the refusal in core/formulas/doseEntry.ts). */
const bindingDoseInputs = {
  doseMg: { kind: 'number', label: 'dose', unit: 'mg', min: 1, max: 20000, optional: true, meaning: 'one dose of the chelator, mg' },
  perKg: {
    name: 'doseMgPerKg',
    spec: { kind: 'number', label: 'dose per kg', unit: 'mg/kg', min: 0.1, max: 200, optional: true, meaning: 'one dose of the chelator, mg per kg body weight' },
  },
  weightKg: { ...weightKgInput, optional: true },
} as const satisfies DoseEntryInputs;

export const bindingCapacity = defineFormula({
  id: 'binding-capacity',
  title: 'Metal a chelator dose can bind (stoichiometric ceiling)',
  expression: 'metal (mg) = dose (mg) / M(chelator as dosed) (g/mol) / (chelator : metal ratio) × Ar(metal) (g/mol)',
  sourceIds: ['poggiali-2012', 'ciaaw-2021', 'deferoxamine-aluminium-memory'],
  notes: [
    'A ceiling: every ligand molecule bound to the metal. What is excreted is a fraction of it (expected-excretion).',
    'Enter the dose as the form it is stated in: deferoxamine strengths are labelled as the mesylate.',
    'Enter the dose in mg, or in mg/kg with the body weight.',
  ],
  inputs: {
    chelatorForm: { kind: 'choice', label: 'chelator as dosed', choices: chelatingFormIds, meaning: 'the chelator and the form (salt or base) the dose is stated as' },
    metal: { kind: 'choice', label: 'metal', choices: bindingMetalChoices, default: 'Fe', meaning: 'element symbol of the metal bound' },
    doseMg: bindingDoseInputs.doseMg,
    doseMgPerKg: bindingDoseInputs.perKg.spec,
    weightKg: bindingDoseInputs.weightKg,
  },
  outputs: {
    metalMg: { label: 'metal bound', unit: 'mg', meaning: 'theoretical mass of metal bound by the dose', decimals: 1 },
    capacityMgPerG: { label: 'binding capacity', unit: 'mg/g', meaning: 'theoretical mg of metal per g of chelator as dosed', decimals: 1 },
    doseMg: { label: 'dose', unit: 'mg', meaning: 'dose used, mg (from mg/kg × weight when given that way)', decimals: 0 },
  },
  compute: ({ chelatorForm, metal, doseMg, doseMgPerKg, weightKg }) => {
    const refused = doseEntryRefusals({ doseMg, perKg: doseMgPerKg, weightKg }, bindingDoseInputs);
    if (refused.length > 0) return { refused };
    const resolvedDoseMg = doseMg ?? doseMgPerKg! * weightKg!;
    const capacity = metalBindingCapacityMgPerG(chelatorForm, metal);
    const bound = metalBoundByDoseMg(mg(resolvedDoseMg), chelatorForm, metal);
    if (!capacity.ok) return { refused: capacity.issues };
    if (!bound.ok) return { refused: bound.issues };
    return { metalMg: bound.value, capacityMgPerG: capacity.value, doseMg: resolvedDoseMg };
  },
});

const filmCoatedFactorInput = {
  kind: 'number',
  label: 'deferasirox film-coated factor',
  unit: '1',
  min: 0.6,
  max: 0.8,
  assumption: 'deferasirox-film-coated-factor',
  meaning: 'film-coated dose as a fraction of the dispersible-tablet dose',
} as const;

const efficiencyInput = (ligand: string, assumption: string, products: readonly string[]) =>
  ({
    kind: 'number',
    label: `chelation efficiency of ${ligand}`,
    unit: '1',
    min: 0.01,
    max: 0.6,
    assumption,
    usedWhen: { input: 'chelator', oneOf: products },
    meaning: `share of a ${ligand} dose excreted as iron complex`,
  }) as const;

export const expectedExcretion = defineFormula({
  id: 'expected-excretion',
  title: 'Expected iron excretion from a chelation regimen',
  expression:
    'excretion (mg/day) = dose (mg per dosing day) × days per week / 7 × adherence × efficiency × Fe capacity (mg Fe per mg chelator); deferasirox film-coated: dose ÷ 0.7 before the efficiency',
  sourceIds: ['poggiali-2012', 'ciaaw-2021', 'porter-efficiency-memory', 'deferasirox-label-us', 'nisbet-brown-2003', 'porter-balance-goal-2005'],
  notes: [
    'The efficiencies are from memory and vary with iron burden and dose: an uncertain assumption, not a fact about a patient. Compare with the excretion measured from two liver iron results.',
    'The deferasirox efficiency belongs to the dispersible tablet; a film-coated dose is divided by the film-coated factor (0.7) first.',
    'A balance goal of about 0.4–0.5 mg/kg/day matches typical transfusional intake (Porter 2005, secondary).',
  ],
  inputs: {
    chelator: { kind: 'choice', label: 'chelator', choices: chelatorIds, meaning: 'the product as dosed' },
    doseMgPerKgPerDosingDay: { kind: 'number', label: 'dose on a dosing day', ...inputRange(dailyDoseBounds), meaning: 'dose on each day it is given, mg/kg of the form the product is dosed as' },
    weightKg: weightKgInput,
    daysPerWeek: { kind: 'number', label: 'dosing days per week', unit: 'd/wk', min: 1, max: 7, integer: true, default: 7, meaning: 'days a week the chelator is given' },
    adherence: { kind: 'number', label: 'adherence', unit: '1', min: 0, max: 1, default: 1, meaning: 'share of prescribed doses taken, as a fraction' },
    efficiencyDeferoxamine: efficiencyInput('deferoxamine', 'efficiency-deferoxamine', ['deferoxamine']),
    efficiencyDeferiprone: efficiencyInput('deferiprone', 'efficiency-deferiprone', ['deferiprone']),
    efficiencyDeferasirox: efficiencyInput('deferasirox', 'efficiency-deferasirox', ['deferasirox-dispersible', 'deferasirox-film-coated']),
    filmCoatedFactor: { ...filmCoatedFactorInput, usedWhen: { input: 'chelator', oneOf: ['deferasirox-film-coated'] } },
  },
  outputs: {
    excretionMgPerDay: { label: 'expected iron excretion', unit: 'mg/d', meaning: 'mean over the week', decimals: 1 },
    excretionMgPerKgPerDay: { label: 'expected iron excretion per kg', unit: 'mg/kg/d', meaning: 'mean over the week, per kg body weight', decimals: 2 },
    efficiencyApplied: { label: 'efficiency applied', unit: '1', meaning: 'the efficiency of the chosen chelator', decimals: 2 },
    efficiencyBasisDoseMgPerKgPerDay: {
      label: 'dose the efficiency applies to',
      unit: 'mg/kg/d',
      meaning: 'dispersible-equivalent dose for film-coated deferasirox; otherwise the dose entered',
      decimals: 1,
    },
  },
  compute: (inputs) => {
    const chelator = findChelator(inputs.chelator);
    const efficiencyByLigand = {
      deferoxamine: inputs.efficiencyDeferoxamine,
      deferiprone: inputs.efficiencyDeferiprone,
      deferasirox: inputs.efficiencyDeferasirox,
    } as const;
    // usedWhen guarantees the chosen chelator's efficiency (and, for film-coated
    // deferasirox, the factor) is present; the others are undefined and unused.
    const efficiency = efficiencyByLigand[chelator.ligandId]!;
    const filmCoatedFactor = inputs.filmCoatedFactor ?? 1;
    const excretionMgPerDay = expectedIronExcretionMgPerDay({
      chelatorId: chelator.id,
      doseMgPerDosingDay: mg(inputs.doseMgPerKgPerDosingDay * inputs.weightKg),
      daysPerWeek: inputs.daysPerWeek,
      adherence: fraction(inputs.adherence),
      efficiency: fraction(efficiency),
      efficiencyDoseFactor: fraction(filmCoatedFactor),
    });
    const basisDose =
      chelator.efficiencyDoseFactorAssumptionId === undefined
        ? inputs.doseMgPerKgPerDosingDay
        : inputs.doseMgPerKgPerDosingDay / filmCoatedFactor;
    return {
      excretionMgPerDay,
      excretionMgPerKgPerDay: excretionMgPerDay / inputs.weightKg,
      efficiencyApplied: efficiency,
      efficiencyBasisDoseMgPerKgPerDay: basisDose,
    };
  },
});

export const saltToBase = defineFormula({
  id: 'salt-to-base',
  title: 'Mass of a drug in another salt or base form',
  expression: 'mass in target form (mg) = mass (mg) / M(stated form) (g/mol) × M(target form) (g/mol)',
  sourceIds: ['ciaaw-2021', 'poggiali-2012', 'easl-wilson-2012', 'aasld-wilson-2022'],
  notes: [
    'Works both ways (salt to base, base to salt) and between two salts of one substance (trientine dihydrochloride to tetrahydrochloride).',
    'Each form holds one base moiety, so equal amounts of substance carry equal base.',
  ],
  inputs: {
    fromForm: { kind: 'choice', label: 'form the mass is stated as', choices: substanceFormIds, meaning: 'salt or base the strength or dose refers to' },
    toForm: { kind: 'choice', label: 'target form', choices: substanceFormIds, meaning: 'salt or base to express the mass as' },
    massMg: { kind: 'number', label: 'mass', unit: 'mg', min: 0.01, max: 100000, meaning: 'mass in the stated form, mg' },
  },
  outputs: {
    massInTargetFormMg: { label: 'mass in target form', unit: 'mg', meaning: 'same amount of substance, expressed as the target form', decimals: 2 },
    massRatio: { label: 'mass ratio', unit: '1', meaning: 'M(target) / M(stated)', decimals: 4 },
    fromMolarMassGPerMol: { label: 'molar mass of stated form', unit: 'g/mol', meaning: 'from CIAAW atomic weights', decimals: 2 },
    toMolarMassGPerMol: { label: 'molar mass of target form', unit: 'g/mol', meaning: 'from CIAAW atomic weights', decimals: 2 },
  },
  compute: ({ fromForm, toForm, massMg }) => {
    const converted = massInForm(mg(massMg), fromForm, toForm);
    if (!converted.ok) return { refused: converted.issues };
    const fromMolarMass = substanceForm(fromForm).molarMassGPerMol;
    const toMolarMass = substanceForm(toForm).molarMassGPerMol;
    return {
      massInTargetFormMg: converted.value,
      massRatio: toMolarMass / fromMolarMass,
      fromMolarMassGPerMol: fromMolarMass,
      toMolarMassGPerMol: toMolarMass,
    };
  },
});

export const deferasiroxFormulation = defineFormula({
  id: 'deferasirox-formulation',
  title: 'Deferasirox dose in the other tablet formulation',
  expression: 'film-coated (mg/kg/day) = dispersible (mg/kg/day) × 0.7; dispersible = film-coated ÷ 0.7',
  sourceIds: ['deferasirox-label-us'],
  notes: ['Label ranges: dispersible 10–40 mg/kg/day (usual 20), film-coated 7–28 mg/kg/day (usual 14).'],
  inputs: {
    fromFormulation: { kind: 'choice', label: 'formulation of the dose', choices: deferasiroxFormulations, meaning: 'tablet formulation the dose is stated for' },
    doseMgPerKgPerDay: { kind: 'number', label: 'deferasirox dose', unit: 'mg/kg/d', min: 1, max: 60, meaning: 'daily dose in the stated formulation' },
    filmCoatedFactor: filmCoatedFactorInput,
  },
  outputs: {
    otherDoseMgPerKgPerDay: { label: 'dose in the other formulation', unit: 'mg/kg/d', meaning: 'equivalent daily dose', decimals: 1 },
    otherFormulation: { label: 'other formulation', unit: '', kind: 'text', meaning: 'formulation of the equivalent dose' },
  },
  compute: ({ fromFormulation, doseMgPerKgPerDay, filmCoatedFactor }) => ({
    otherDoseMgPerKgPerDay: deferasiroxDoseInOtherFormulation(mgPerKgPerDay(doseMgPerKgPerDay), fromFormulation, fraction(filmCoatedFactor)),
    otherFormulation: otherDeferasiroxFormulation(fromFormulation),
  }),
});

export const deferoxamineTherapeuticIndexFormula = defineFormula({
  id: 'deferoxamine-therapeutic-index',
  title: 'Deferoxamine therapeutic index',
  expression: 'index = mean daily dose (mg/kg) / serum ferritin (µg/L); mean daily dose = dose per infusion × infusions per week / 7',
  sourceIds: ['porter-1989', 'common-practice'],
  notes: [
    'Above 0.025 marks a risk of sensorineural hearing loss (Porter et al. 1989): for review by the prescriber; follow local protocols.',
    'Porter 1989 does not define "mean daily dose" in its abstract; weekly dose ÷ 7 is common practice.',
    'Dose as deferoxamine mesylate, mg/kg.',
  ],
  inputs: {
    dosePerInfusionMgPerKg: { kind: 'number', label: 'dose per infusion', unit: 'mg/kg', min: 1, max: 100, meaning: 'deferoxamine mesylate per infusion, mg/kg' },
    infusionsPerWeek: { kind: 'number', label: 'infusions per week', unit: '/wk', min: 1, max: 7, integer: true, meaning: 'infusions given in a week' },
    ferritinUgPerL: { kind: 'number', label: 'serum ferritin', unit: 'ug/L', min: 1, max: 30000, meaning: 'serum ferritin, µg/L (= ng/mL)' },
  },
  outputs: {
    meanDailyDoseMgPerKg: { label: 'mean daily dose', unit: 'mg/kg/d', meaning: 'weekly dose ÷ 7', decimals: 1 },
    therapeuticIndex: { label: 'therapeutic index', unit: '(mg/kg/d)/(ug/L)', meaning: 'mean daily dose ÷ ferritin', decimals: 4 },
    finding: { label: 'finding', unit: '', kind: 'text', meaning: 'index against Porter’s 0.025' },
  },
  compute: ({ dosePerInfusionMgPerKg, infusionsPerWeek, ferritinUgPerL }) => {
    const meanDailyDose = meanDailyDeferoxamineDoseMgPerKg(mgPerKg(dosePerInfusionMgPerKg), infusionsPerWeek);
    const index = deferoxamineTherapeuticIndex(meanDailyDose, ugPerL(ferritinUgPerL));
    const finding = deferoxamineTherapeuticIndexAboveLimit(index)
      ? `above ${deferoxamineTherapeuticIndexLimit}: risk of sensorineural hearing loss (Porter et al. 1989); for review by the prescriber; follow local protocols`
      : `at or below ${deferoxamineTherapeuticIndexLimit} (Porter et al. 1989)`;
    return { meanDailyDoseMgPerKg: meanDailyDose, therapeuticIndex: index, finding };
  },
});

/** Every chelators formula, in the order `calc --list` shows them. */
export const chelatorsFormulas: readonly AnyFormula[] = [
  bindingCapacity,
  expectedExcretion,
  saltToBase,
  deferasiroxFormulation,
  deferoxamineTherapeuticIndexFormula,
];
