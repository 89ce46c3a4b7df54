import type { Source } from './source';

/** Sources for transfusional iron, body iron and imaging (references.md §1–2). */
export const ironSources = [
  {
    id: 'cohen-2008',
    authors: 'Cohen AR, Glimm E, Porter JB',
    title: 'Effect of transfusional iron intake on response to chelation therapy in β-thalassemia major',
    publication: 'Blood 2008;111:583-587',
    year: 2008,
    status: 'confirmed',
    note: 'Source of the deferasirox response by intake figures; that it uses 1.08 mg Fe per mL of red cells is from memory.',
  },
  {
    id: 'iron-per-hb-derived',
    authors: 'derived',
    title: 'Iron per gram of haemoglobin: 4 × Ar(Fe) / M(Hb tetramer) = 4 × 55.845 / 64 458 = 3.466 mg/g',
    publication: 'CIAAW atomic weight of iron; haemoglobin tetramer molar mass 64 458 g/mol',
    year: null,
    status: 'derived',
  },
  {
    id: 'tif-guideline-iron-per-ml',
    authors: 'Thalassaemia guideline literature',
    title: 'Iron per mL of pure red cells 1.16 mg/mL',
    publication: 'thalassaemia management guidelines (edition not checked)',
    year: null,
    status: 'memory',
    note: 'Which guideline edition uses 1.16 is from memory (references.md §1).',
  },
  {
    id: 'fischer-harmatz-2009',
    authors: 'Fischer R, Harmatz PR',
    title: 'Non-invasive assessment of tissue iron overload',
    publication: 'Hematology Am Soc Hematol Educ Program 2009:215-221',
    year: 2009,
    status: 'secondary',
    note: 'Dry weight ≈ 3.33 × wet weight (about 70 % water).',
  },
  {
    id: 'hunt-2009',
    authors: 'Hunt JR, Zito CA, Johnson LK',
    title: 'Body iron excretion by healthy men and women',
    publication: 'Am J Clin Nutr 2009;89:1792-1798',
    year: 2009,
    status: 'confirmed',
    note: 'Median basal losses 1.18 mg/day (men), 1.58 (menstruating women), 0.99 (postmenopausal women); not strongly related to body weight.',
  },
] as const satisfies readonly Source[];
