/**
 * Published assumptions: values that a guideline, a label or a local protocol
 * may set differently. Each has a default with its source, named alternatives,
 * and a plausible range for an override. The user may override any of them in
 * a case; the override (value, reason, who, when) then shows in every
 * derivation that used it.
 */
export interface AssumptionAlternative {
  readonly value: number;
  readonly label: string;
  readonly sourceIds: readonly string[];
}

export interface Assumption {
  readonly id: string;
  readonly label: string;
  readonly unit: string;
  readonly value: number;
  readonly sourceIds: readonly string[];
  readonly alternatives: readonly AssumptionAlternative[];
  readonly min: number;
  readonly max: number;
  readonly note?: string;
}

export const assumptionCatalogue = [
  {
    id: 'iron-per-ml-red-cells',
    label: 'iron per mL of pure red cells',
    unit: 'mg/mL',
    // 1.08 mg/mL: Cohen, Glimm & Porter, Blood 2008;111:583 (from memory which source uses which value;
    // references.md §1). Red-cell haemoglobin about 31 g/dL × 3.466 mg Fe/g Hb ≈ 1.07–1.08.
    value: 1.08,
    sourceIds: ['cohen-2008', 'iron-per-hb-derived'],
    alternatives: [
      // 1.16 mg/mL: thalassaemia guideline literature (red-cell Hb about 33–34 g/dL); memory.
      { value: 1.16, label: 'thalassaemia guideline value (about 33–34 g/dL red-cell haemoglobin)', sourceIds: ['tif-guideline-iron-per-ml'] },
    ],
    min: 0.9,
    max: 1.25,
    note: 'Or derive it from the red-cell MCHC with the calculator iron-per-ml-from-mchc.',
  },
  {
    id: 'liver-dry-to-wet-ratio',
    label: 'dry-to-wet liver weight factor (mg/g dry ÷ factor = mg/g wet)',
    unit: '1',
    // Dry ≈ 3.33 × wet, i.e. about 70 % water: Fischer & Harmatz, Hematology ASH Educ Program 2009:215 (secondary).
    value: 3.33,
    sourceIds: ['fischer-harmatz-2009'],
    alternatives: [],
    min: 2.5,
    max: 4.5,
  },
  {
    id: 'deferasirox-film-coated-factor',
    label: 'deferasirox film-coated dose as a fraction of the dispersible-tablet dose',
    unit: '1',
    // 0.7: deferasirox labels (film-coated 14 mg/kg/day ≈ dispersible 20 mg/kg/day); secondary.
    value: 0.7,
    sourceIds: ['deferasirox-label-us'],
    alternatives: [],
    min: 0.6,
    max: 0.8,
  },
  {
    id: 'efficiency-deferoxamine',
    label: 'chelation efficiency of deferoxamine (share of a dose excreted as iron complex)',
    unit: '1',
    // about 13 %: Porter's reviews and guideline chapters; from memory (references.md §3).
    value: 0.13,
    sourceIds: ['porter-efficiency-memory'],
    alternatives: [],
    min: 0.01,
    max: 0.5,
  },
  {
    id: 'efficiency-deferiprone',
    label: 'chelation efficiency of deferiprone (share of a dose excreted as iron complex)',
    unit: '1',
    // 5.5 % (was 7 % from memory): Hoffbrand et al., Blood 1998;91:295 (abstract, confirmed) —
    // deferiprone 75 mg/kg/day, mean urine iron 31.2 mg/24 h (range 16.3–58.2) at stable stores in
    // adults; at a mean adult weight of about 55 kg (from memory: the abstract gives no weight) that is
    // 31.2 ÷ (75 × 55 × 55.845 ⁄ (3 × 139.15) mg Fe per g) ≈ 5.7 %, and deferiprone's iron leaves
    // almost entirely in urine (from memory). 5.5 % gives 0.55 mg/kg/day at 75 mg/kg/day, the abstract's
    // 31.2 mg/day ÷ 55 kg = 0.57. The 7 % of the reviews would credit 0.70 mg/kg/day.
    value: 0.055,
    sourceIds: ['hoffbrand-1998-deferiprone', 'porter-efficiency-memory'],
    alternatives: [],
    min: 0.01,
    max: 0.5,
  },
  {
    id: 'efficiency-deferasirox',
    label: 'chelation efficiency of deferasirox, applied to the dispersible-equivalent dose',
    unit: '1',
    // about 27 % of the dispersible-tablet dose: Porter's reviews; from memory (references.md §3).
    value: 0.27,
    sourceIds: ['porter-efficiency-memory'],
    alternatives: [],
    min: 0.01,
    max: 0.6,
  },
  {
    id: 'unit-haematocrit-red-cells',
    label: 'haematocrit of a red-cell unit when the transfusion record does not state it',
    unit: '1',
    // 0.60: common practice for red cells in additive solution (blood-component guides quote
    // about 0.50–0.70; from memory). Range as the transfusion-iron calculator's unit haematocrit.
    value: 0.6,
    sourceIds: ['common-practice'],
    alternatives: [],
    min: 0.4,
    max: 0.85,
    note: 'Used by core/model for a transfusion entered with unitHaematocrit null; shown as assumed.',
  },
  {
    id: 'basal-iron-loss-mg-per-day',
    label: 'basal iron loss',
    unit: 'mg/d',
    // About 1 mg/day, not strongly related to body weight: Hunt et al., Am J Clin Nutr 2009;
    // Institute of Medicine DRI 2001 (references.md §1, confirmed).
    value: 1.0,
    sourceIds: ['hunt-2009'],
    alternatives: [
      { value: 1.58, label: 'menstruating women (median)', sourceIds: ['hunt-2009'] },
      { value: 0.99, label: 'postmenopausal women (median)', sourceIds: ['hunt-2009'] },
    ],
    min: 0,
    max: 3,
  },
  {
    id: 'projection-floor-lic-mg-per-g-dry',
    label: 'projection floor: LIC below which chelation is modelled as removing no more iron',
    unit: 'mg/g{dry}',
    // 1.8 mg/g dry, the upper limit of normal liver iron (Olivieri & Brittenham, Blood 1997;89:739;
    // confirmed). A modelling choice of ours: iron up to normal stores is taken as not chelatable, so the
    // projected LIC approaches an equilibrium above it instead of crossing zero.
    value: 1.8,
    sourceIds: ['olivieri-brittenham-1997', 'projection-model-choice'],
    alternatives: [{ value: 1.0, label: 'a lower floor (more of the stores chelatable)', sourceIds: ['projection-model-choice'] }],
    min: 0,
    max: 7,
  },
  {
    id: 'projection-burden-share',
    label: 'share of the expected removal that falls in proportion to the chelatable iron (projection shape)',
    unit: '1',
    // 1: removal wholly proportional to body iron above the floor (a first-order fall), calibrated so
    // that today it equals today's expected or measured removal. A modelling choice of ours, checked
    // against the THALASSA 2-year and the 5-year deferasirox trajectories (tests/core/ledger/
    // publishedTrajectories.test.ts). 0 is the constant-rate model (removal held until the floor).
    value: 1,
    sourceIds: ['projection-model-choice'],
    alternatives: [
      { value: 0, label: 'constant-rate model (removal held at today’s rate until the floor)', sourceIds: ['projection-model-choice'] },
      { value: 0.5, label: 'half proportional, half constant', sourceIds: ['projection-model-choice'] },
    ],
    min: 0,
    max: 1,
  },
  {
    id: 'measured-response-regimen-share',
    label: 'share of the days between two LIC results on one regimen for the measured response to be used',
    unit: '1',
    // 0.9: a modelling choice of ours. A week of overlap between two periods in a year-long interval
    // (2 %) should not discard the patient's own response; a regimen covering less than 90 % of the
    // days leaves too much of the change to the other regimen.
    value: 0.9,
    sourceIds: ['projection-model-choice'],
    alternatives: [],
    min: 0.5,
    max: 1,
  },
  {
    id: 'lic-measurement-sd-biopsy',
    label: 'measurement spread of a biopsy LIC (relative standard deviation)',
    unit: '1',
    // 0.19: sampling variability of needle-biopsy liver iron (coefficient of variation about 19 %
    // between cores; from memory — Emond et al., Clin Chem 1999;45:340; Villeneuve et al., J Hepatol 1996).
    value: 0.19,
    sourceIds: ['biopsy-variability-memory'],
    alternatives: [],
    min: 0,
    max: 0.6,
  },
  {
    id: 'lic-measurement-sd-mri',
    label: 'measurement spread of an MRI LIC (relative standard deviation)',
    unit: '1',
    // 0.15: liver T2* reproducibility across scanners and field strengths, coefficient of variation 6.6 %
    // (repeatability 5.5 %; Bachtiar et al., PLoS One 2019;14:e0214921, abstract, confirmed), combined in
    // quadrature with the scatter of an R2*-to-LIC calibration about its line (about 13 %, from memory):
    // √(6.6² + 13²) ≈ 15 %. Applied to a report's own LIC too (its method's spread is not stated).
    value: 0.15,
    sourceIds: ['bachtiar-2019', 'hernando-2022', 'calibration-scatter-memory'],
    alternatives: [],
    min: 0,
    max: 0.6,
  },
] as const satisfies readonly Assumption[];

export type AssumptionId = (typeof assumptionCatalogue)[number]['id'];

export function findAssumption(id: string): Assumption | undefined {
  return assumptionCatalogue.find((it) => it.id === id);
}

/** A user's override of an assumption, kept with the case. */
export interface AssumptionOverride {
  readonly value: number;
  readonly reason: string;
  readonly by?: string;
  readonly at?: string;
}
export type AssumptionOverrides = Readonly<Record<string, AssumptionOverride>>;
