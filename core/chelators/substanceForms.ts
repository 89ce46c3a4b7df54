import { molarMass } from '../elements/molarMass';
import type { GramsPerMole } from '../units/quantity';

/**
 * The chemical forms in which a chelating drug is dosed or labelled: a salt
 * (deferoxamine mesylate, trientine dihydrochloride) or the base (the active
 * moiety alone). Every form here holds exactly one base moiety per formula
 * unit, so converting between two forms of one substance is a ratio of molar
 * masses (see massInForm). Molar masses are computed from the formulas with
 * the CIAAW weights in core/elements, never typed; the printed values beside
 * each entry are what tests/core/elements checks them against.
 */

export const substanceIds = ['deferoxamine', 'deferiprone', 'deferasirox', 'trientine'] as const;
export type SubstanceId = (typeof substanceIds)[number];

export const substanceFormIds = [
  'deferoxamine-mesylate',
  'deferoxamine-base',
  'deferiprone',
  'deferasirox',
  'trientine-base',
  'trientine-dihydrochloride',
  'trientine-tetrahydrochloride',
] as const;
export type SubstanceFormId = (typeof substanceFormIds)[number];

export interface SubstanceForm {
  readonly id: SubstanceFormId;
  /** Generic name of the form as a label or a prescription states it. */
  readonly label: string;
  readonly substance: SubstanceId;
  /** 'salt' when the formula includes a counter-ion or acid; 'base' for the active moiety alone. */
  readonly basis: 'salt' | 'base';
  /** Molecular formula; salts as base·acid, e.g. 'C6H18N4·2HCl'. */
  readonly formula: string;
  /** Computed from `formula` with the CIAAW weights. */
  readonly molarMassGPerMol: GramsPerMole;
  readonly sourceIds: readonly string[];
}

type FormData = Omit<SubstanceForm, 'molarMassGPerMol'>;

const formData: readonly FormData[] = [
  // Deferoxamine mesylate C25H48N6O8·CH4O3S, printed 656.79 g/mol; base C25H48N6O8, printed 560.69 g/mol:
  // Poggiali et al., Blood Transfus 2012;10:411, Table I (formulas) and references.md §3 (molar masses from CIAAW weights).
  // Labels state deferoxamine strengths as the mesylate.
  { id: 'deferoxamine-mesylate', label: 'deferoxamine mesylate', substance: 'deferoxamine', basis: 'salt', formula: 'C25H48N6O8·CH4O3S', sourceIds: ['poggiali-2012', 'ciaaw-2021'] },
  { id: 'deferoxamine-base', label: 'deferoxamine (base)', substance: 'deferoxamine', basis: 'base', formula: 'C25H48N6O8', sourceIds: ['poggiali-2012', 'ciaaw-2021'] },
  // Deferiprone C7H9NO2, printed 139.15 g/mol; deferasirox C21H15N3O4, printed 373.37 g/mol (same sources).
  { id: 'deferiprone', label: 'deferiprone', substance: 'deferiprone', basis: 'base', formula: 'C7H9NO2', sourceIds: ['poggiali-2012', 'ciaaw-2021'] },
  { id: 'deferasirox', label: 'deferasirox', substance: 'deferasirox', basis: 'base', formula: 'C21H15N3O4', sourceIds: ['poggiali-2012', 'ciaaw-2021'] },
  // Trientine base C6H18N4 146.24 g/mol; dihydrochloride C6H18N4·2HCl 219.15 g/mol; tetrahydrochloride
  // C6H18N4·4HCl 292.07 g/mol, as printed in EASL Clinical Practice Guidelines: Wilson's disease, J Hepatol
  // 2012;56:671 and AASLD practice guidance on Wilson disease, Hepatology 2022 (references.md §7, confirmed).
  { id: 'trientine-base', label: 'trientine (base)', substance: 'trientine', basis: 'base', formula: 'C6H18N4', sourceIds: ['easl-wilson-2012', 'aasld-wilson-2022', 'ciaaw-2021'] },
  { id: 'trientine-dihydrochloride', label: 'trientine dihydrochloride', substance: 'trientine', basis: 'salt', formula: 'C6H18N4·2HCl', sourceIds: ['easl-wilson-2012', 'aasld-wilson-2022', 'ciaaw-2021'] },
  { id: 'trientine-tetrahydrochloride', label: 'trientine tetrahydrochloride', substance: 'trientine', basis: 'salt', formula: 'C6H18N4·4HCl', sourceIds: ['easl-wilson-2012', 'aasld-wilson-2022', 'ciaaw-2021'] },
];

/** Every catalogued form, with its molar mass computed from its formula. */
export const substanceForms: readonly SubstanceForm[] = formData.map((form) => ({
  ...form,
  molarMassGPerMol: molarMass(form.formula),
}));

const formsById = new Map<SubstanceFormId, SubstanceForm>(substanceForms.map((form) => [form.id, form]));

/**
 * The catalogued form with this id.
 *
 * @param formId - one of substanceFormIds
 * @returns the form, with its computed molar mass in g/mol
 * @example substanceForm('deferiprone').molarMassGPerMol ≈ 139.15
 */
export function substanceForm(formId: SubstanceFormId): SubstanceForm {
  const form = formsById.get(formId);
  if (!form) throw new Error(`Unknown substance form ${formId}`);
  return form;
}

/** The forms of one substance (salts and base), in catalogue order. */
export function formsOfSubstance(substance: SubstanceId): readonly SubstanceForm[] {
  return substanceForms.filter((form) => form.substance === substance);
}
