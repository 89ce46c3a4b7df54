import type { SubstanceFormId } from '../chelators/substanceForms';
import type { ElementSymbol } from '../elements/atomicWeights';

/**
 * The drugs of the heavy-metal courses, as dosed. Generic names only.
 * Formulas are used for the stoichiometric ceiling (molar mass from CIAAW
 * weights in core/elements); trientine's forms come from core/chelators.
 */
export const courseDrugIds = [
  'succimer',
  'calcium-disodium-edetate',
  'dimercaprol',
  'unithiol',
  'penicillamine',
  'trientine-dihydrochloride',
  'trientine-tetrahydrochloride',
  'zinc',
] as const;
export type CourseDrugId = (typeof courseDrugIds)[number];

export type CourseRoute = 'oral' | 'intramuscular' | 'intravenous' | 'intravenous or intramuscular';

export interface CourseDrug {
  readonly id: CourseDrugId;
  readonly label: string;
  /** What a dose in mg is a mass of, in words (the basis printed beside every dose). */
  readonly dosedAs: string;
  /** Molecular formula of what is dosed, for the stoichiometric ceiling; null for zinc (not a chelator). */
  readonly formula: string | null;
  /** The catalogued form in core/chelators when the drug has salt and base forms (trientine). */
  readonly substanceFormId?: SubstanceFormId;
  /** Chelator : metal ratio by metal (a ceiling; 'course-stoichiometry-memory'). */
  readonly bindings: readonly { readonly metal: ElementSymbol; readonly ligandsPerMetal: number }[];
  /** A ligand of core/chemistry with constants for pM, where one exists. */
  readonly chemistryLigand?: 'edta' | 'succimer';
  /** Cautions printed whenever the drug is in a plan. */
  readonly cautions: readonly string[];
  readonly sourceIds: readonly string[];
}

export const courseDrugs: readonly CourseDrug[] = [
  {
    id: 'succimer',
    label: 'succimer',
    dosedAs: 'succimer',
    formula: 'C4H6O4S2', // meso-2,3-dimercaptosuccinic acid, 182.2 g/mol ('course-molar-masses-memory')
    bindings: [
      { metal: 'Pb', ligandsPerMetal: 1 },
      { metal: 'Hg', ligandsPerMetal: 1 },
      { metal: 'As', ligandsPerMetal: 1 },
    ],
    chemistryLigand: 'succimer',
    cautions: ['Not for lead encephalopathy: succimer does not cross the blood-brain barrier (succimer label §1).'],
    sourceIds: ['succimer-label'],
  },
  {
    id: 'calcium-disodium-edetate',
    label: 'calcium disodium edetate',
    dosedAs: 'calcium disodium edetate',
    formula: 'C10H12CaN2Na2O8', // anhydrous, 374.3 g/mol ('course-molar-masses-memory')
    bindings: [
      { metal: 'Pb', ligandsPerMetal: 1 },
      { metal: 'Cu', ligandsPerMetal: 1 },
      { metal: 'Hg', ligandsPerMetal: 1 },
    ],
    chemistryLigand: 'edta',
    cautions: [
      'The recommended daily dose is never to be exceeded, at any time (calcium disodium edetate label, boxed warning).',
      'Not edetate disodium: the two names are confused, with fatal hypocalcaemia (MMWR 2006;55:204).',
    ],
    sourceIds: ['edetate-calcium-disodium-label', 'mmwr-2006-edetate-disodium'],
  },
  {
    id: 'dimercaprol',
    label: 'dimercaprol',
    dosedAs: 'dimercaprol',
    formula: 'C3H8OS2', // 124.2 g/mol ('course-molar-masses-memory')
    bindings: [
      { metal: 'Pb', ligandsPerMetal: 2 },
      { metal: 'Hg', ligandsPerMetal: 2 },
      { metal: 'As', ligandsPerMetal: 2 },
    ],
    cautions: [
      'Vehicle is peanut oil (about 700 mg/mL): peanut allergy matters; deep intramuscular injection only (dimercaprol references).',
      'Not for iron, cadmium or selenium poisoning: the complexes are toxic (dimercaprol references).',
    ],
    sourceIds: ['dimercaprol-label', 'dimercaprol-cautions'],
  },
  {
    id: 'unithiol',
    label: 'unithiol',
    dosedAs: 'unithiol (sodium salt)',
    formula: 'C3H7NaO3S3', // sodium 2,3-dimercaptopropane-1-sulfonate, 210.3 g/mol ('course-molar-masses-memory')
    bindings: [
      { metal: 'Hg', ligandsPerMetal: 1 },
      { metal: 'As', ligandsPerMetal: 1 },
      { metal: 'Pb', ligandsPerMetal: 1 },
    ],
    cautions: ['No approved indication in the US; the dose rests on a textbook chapter (secondary).'],
    sourceIds: ['unithiol-pharmacology-chapter'],
  },
  {
    id: 'penicillamine',
    label: 'penicillamine',
    dosedAs: 'penicillamine',
    formula: 'C5H11NO2S', // 149.2 g/mol ('course-molar-masses-memory')
    bindings: [{ metal: 'Cu', ligandsPerMetal: 2 }],
    cautions: ['Pyridoxine 25–50 mg/day is given with penicillamine (EASL 2012).'],
    sourceIds: ['penicillamine-wilson'],
  },
  {
    id: 'trientine-dihydrochloride',
    label: 'trientine dihydrochloride',
    dosedAs: 'trientine dihydrochloride (the salt)',
    formula: 'C6H18N4·2HCl',
    substanceFormId: 'trientine-dihydrochloride',
    bindings: [{ metal: 'Cu', ligandsPerMetal: 1 }],
    cautions: ['Dosed and labelled as the salt: 250 mg of the dihydrochloride holds about 167 mg of trientine base.'],
    sourceIds: ['trientine-dihydrochloride-label'],
  },
  {
    id: 'trientine-tetrahydrochloride',
    label: 'trientine tetrahydrochloride',
    dosedAs: 'trientine base',
    formula: 'C6H18N4',
    substanceFormId: 'trientine-base',
    bindings: [{ metal: 'Cu', ligandsPerMetal: 1 }],
    cautions: [
      'Dosed and labelled as trientine base: a 150 mg tablet holds about 300 mg of the tetrahydrochloride salt.',
      'Tablets and capsules of different trientine salts are not interchangeable mg for mg (trientine tetrahydrochloride SmPC).',
    ],
    sourceIds: ['trientine-tetrahydrochloride-smpc'],
  },
  {
    id: 'zinc',
    label: 'zinc',
    dosedAs: 'elemental zinc',
    formula: null,
    bindings: [],
    cautions: ['Doses are of elemental zinc, not of the salt; zinc blocks copper uptake and is not a chelator.'],
    sourceIds: ['zinc-wilson'],
  },
];

const byId = new Map(courseDrugs.map((drug) => [drug.id, drug]));

/**
 * The course drug with this id.
 * @example courseDrug('succimer').dosedAs === 'succimer'
 */
export function courseDrug(id: CourseDrugId): CourseDrug {
  const found = byId.get(id);
  if (!found) throw new Error(`Unknown course drug ${id}`);
  return found;
}
