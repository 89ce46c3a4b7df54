import type { LigandId } from '../chelators/catalogue';

/**
 * The label-listed interactions of each chelator, as data: which co-medications
 * (by generic name) each names, what the label says in our own words, and
 * where it says it. Where a label names a class, `members` lists the generic
 * names matched for it; matching is by name (core/model comparableDrugName),
 * so a drug typed under another name, a combination product or a class member
 * not listed here is missed (source interaction-matching-by-name).
 */
export interface LabelInteraction {
  /** Stable kebab-case id. */
  readonly id: string;
  readonly chelator: LigandId;
  /** The class or drug as the label names it. */
  readonly labelled: string;
  /** Generic names matched (lower case, single spaces). */
  readonly members: readonly string[];
  /** What the label says, in our own words (descriptive). */
  readonly effect: string;
  readonly sourceIds: readonly string[];
  /** Label section the entry rests on. */
  readonly section: string;
}

// Deferasirox: EU SmPC §4.5 as reproduced (deferasirox-smpc-eu, secondary); busulfan from memory of the US label §7.
const deferasirox: readonly LabelInteraction[] = [
  {
    id: 'deferasirox-gi-bleeding',
    chelator: 'deferasirox',
    labelled: 'drugs that raise the risk of gastrointestinal ulceration or bleeding (NSAIDs, corticosteroids, oral bisphosphonates, anticoagulants)',
    members: [
      'ibuprofen', 'naproxen', 'diclofenac', 'ketoprofen', 'indometacin', 'indomethacin', 'meloxicam', 'piroxicam', 'celecoxib', 'etoricoxib', 'aspirin', 'acetylsalicylic acid', 'mefenamic acid',
      'prednisolone', 'prednisone', 'methylprednisolone', 'dexamethasone', 'hydrocortisone',
      'alendronic acid', 'alendronate', 'risedronic acid', 'risedronate', 'ibandronic acid', 'ibandronate',
      'warfarin', 'acenocoumarol', 'phenprocoumon', 'apixaban', 'rivaroxaban', 'edoxaban', 'dabigatran', 'heparin', 'enoxaparin', 'dalteparin', 'tinzaparin',
    ],
    effect: 'the label describes a raised risk of gastrointestinal ulceration or bleeding when deferasirox is taken with these, and asks for caution',
    sourceIds: ['deferasirox-smpc-eu'],
    section: 'EU SmPC §4.5',
  },
  {
    id: 'deferasirox-cyp3a4',
    chelator: 'deferasirox',
    labelled: 'substances metabolised by CYP3A4, notably those with a narrow therapeutic range',
    members: ['ciclosporin', 'cyclosporine', 'simvastatin', 'ethinylestradiol', 'levonorgestrel', 'norethisterone', 'desogestrel', 'bepridil', 'ergotamine', 'midazolam', 'tacrolimus', 'sirolimus'],
    effect: 'deferasirox lowers the exposure to CYP3A4 substrates (midazolam exposure fell in a study), so their effect may be reduced; the label asks for caution',
    sourceIds: ['deferasirox-smpc-eu'],
    section: 'EU SmPC §4.5',
  },
  {
    id: 'deferasirox-cyp2c8',
    chelator: 'deferasirox',
    labelled: 'CYP2C8 substrates (repaglinide; paclitaxel not excluded)',
    members: ['repaglinide', 'paclitaxel'],
    effect: 'deferasirox raised repaglinide exposure about 2.3-fold; the label advises avoiding the combination, or close blood glucose monitoring if it is needed, and does not exclude other CYP2C8 substrates',
    sourceIds: ['deferasirox-smpc-eu'],
    section: 'EU SmPC §4.5',
  },
  {
    id: 'deferasirox-cyp1a2',
    chelator: 'deferasirox',
    labelled: 'CYP1A2 substrates with a narrow therapeutic range (theophylline, clozapine, tizanidine)',
    members: ['theophylline', 'aminophylline', 'clozapine', 'tizanidine'],
    effect: 'deferasirox raised theophylline exposure by 84 %; the label does not recommend the combination and names the same concern for other narrow-range CYP1A2 substrates',
    sourceIds: ['deferasirox-smpc-eu'],
    section: 'EU SmPC §4.5',
  },
  {
    id: 'deferasirox-ugt-inducers',
    chelator: 'deferasirox',
    labelled: 'strong UGT inducers',
    members: ['rifampicin', 'rifampin', 'phenytoin', 'phenobarbital', 'ritonavir', 'carbamazepine'],
    effect: 'strong UGT inducers lower deferasirox exposure (rifampicin by 44 %), so its effect may be reduced; the label asks for ferritin to be followed during and after the combination',
    sourceIds: ['deferasirox-smpc-eu'],
    section: 'EU SmPC §4.5',
  },
  {
    id: 'deferasirox-bile-acid-sequestrants',
    chelator: 'deferasirox',
    labelled: 'bile-acid sequestrants',
    members: ['colestyramine', 'cholestyramine', 'colesevelam', 'colestipol'],
    effect: 'cholestyramine lowered deferasirox exposure by about 45 %, so its effect may be reduced',
    sourceIds: ['deferasirox-smpc-eu'],
    section: 'EU SmPC §4.5',
  },
  {
    id: 'deferasirox-aluminium-antacids',
    chelator: 'deferasirox',
    labelled: 'aluminium-containing antacids',
    members: ['aluminium hydroxide', 'aluminum hydroxide', 'algeldrate', 'magaldrate', 'sucralfate'],
    effect: 'the label advises against taking deferasirox with aluminium-containing antacids, as it also binds aluminium',
    sourceIds: ['deferasirox-smpc-eu'],
    section: 'EU SmPC §4.5',
  },
  {
    id: 'deferasirox-busulfan',
    chelator: 'deferasirox',
    labelled: 'busulfan',
    members: ['busulfan'],
    effect: 'busulfan exposure may rise with deferasirox (from memory of the US label); busulfan levels are followed where it is used',
    sourceIds: ['deferasirox-smpc-eu'],
    section: 'US label §7 (from memory)',
  },
];

// Deferiprone: US label (2025) §7 and EU SmPC §4.5, as summarised (deferiprone-label-us-2025 §7, as summarised: secondary).
const deferiprone: readonly LabelInteraction[] = [
  {
    id: 'deferiprone-neutropenia-drugs',
    chelator: 'deferiprone',
    labelled: 'other drugs associated with neutropenia or agranulocytosis',
    // The label names the class, not its members: these are drugs commonly associated with neutropenia or
    // agranulocytosis (our choice, from memory of drug references); a drug missing here is not cleared.
    members: ['clozapine', 'carbamazepine', 'metamizole', 'dipyrone', 'methimazole', 'thiamazole', 'carbimazole', 'propylthiouracil', 'sulfasalazine', 'azathioprine', 'mercaptopurine', 'methotrexate', 'hydroxycarbamide', 'hydroxyurea', 'valganciclovir', 'ganciclovir', 'co-trimoxazole', 'dapsone'],
    effect: 'the label advises avoiding other drugs associated with neutropenia or agranulocytosis, or monitoring the neutrophil count more closely when one is needed',
    sourceIds: ['deferiprone-label-us-2025'],
    section: 'US §7; EU §4.5',
  },
  {
    id: 'deferiprone-ugt1a6-inhibitors',
    chelator: 'deferiprone',
    labelled: 'UGT1A6 inhibitors',
    // The US label's examples, from memory: diclofenac, probenecid, silymarin (milk thistle).
    members: ['diclofenac', 'probenecid', 'silymarin'],
    effect: 'deferiprone is cleared by UGT1A6 conjugation; the label advises avoiding UGT1A6 inhibitors, which may raise its exposure',
    sourceIds: ['deferiprone-label-us-2025'],
    section: 'US §7',
  },
  {
    id: 'deferiprone-polyvalent-cations',
    chelator: 'deferiprone',
    labelled: 'polyvalent cations (aluminium-containing antacids, zinc, iron and other mineral supplements)',
    members: ['aluminium hydroxide', 'aluminum hydroxide', 'algeldrate', 'magaldrate', 'sucralfate', 'zinc', 'zinc sulfate', 'zinc acetate', 'zinc gluconate', 'ferrous sulfate', 'ferrous fumarate', 'ferrous gluconate', 'calcium carbonate', 'magnesium hydroxide'],
    effect: 'deferiprone binds polyvalent cations; the label asks for an interval between them (at least 4 hours in the US label, from memory)',
    sourceIds: ['deferiprone-label-us-2025'],
    section: 'US §7; EU §4.5',
  },
];

// Deferoxamine: the US label's drug interactions (older revision, deferoxamine-label-interactions). Ascorbic acid has its own rule.
const deferoxamine: readonly LabelInteraction[] = [
  {
    id: 'deferoxamine-prochlorperazine',
    chelator: 'deferoxamine',
    labelled: 'prochlorperazine (a phenothiazine)',
    members: ['prochlorperazine'],
    effect: 'the label describes temporary impairment of consciousness with the combination',
    sourceIds: ['deferoxamine-label-interactions'],
    section: 'drug interactions',
  },
  {
    id: 'deferoxamine-gallium-67',
    chelator: 'deferoxamine',
    labelled: 'gallium-67 imaging',
    members: ['gallium-67', 'gallium 67', 'gallium citrate ga-67', 'gallium citrate ga 67', 'gallium (67ga) citrate'],
    effect: 'gallium-67 images may be distorted by its rapid urinary excretion bound to deferoxamine; the label advises stopping deferoxamine 48 hours before scintigraphy',
    sourceIds: ['deferoxamine-label-interactions'],
    section: 'drug interactions',
  },
];

/** Every catalogued interaction, by chelator then as listed. */
export const labelInteractions: readonly LabelInteraction[] = [...deferasirox, ...deferiprone, ...deferoxamine];
