import type { Source } from './source';

/** Sources for the chelator catalogue, capacities and doses (references.md §3). */
export const chelatorsSources = [
  {
    id: 'porter-efficiency-memory',
    authors: 'Porter JB (reviews and guideline chapters on iron chelation)',
    title: 'Chelation efficiency: share of a chelator dose excreted as its iron complex',
    publication: 'review articles and thalassaemia guideline chapters (not checked)',
    year: null,
    status: 'memory',
    note: 'Deferoxamine about 13 %, deferiprone about 7 %, deferasirox about 27 % (dispersible-tablet dose). Varies with iron burden and dose: an uncertain assumption, not a fact about a patient.',
  },
  {
    id: 'deferasirox-label',
    authors: 'Marketing authorisation holder',
    title: 'Deferasirox prescribing information (dispersible and film-coated tablets)',
    publication: 'product labels (US and EU)',
    year: null,
    status: 'secondary',
    note: 'Film-coated tablet dose = 0.7 × dispersible-tablet dose (14 vs 20 mg/kg/day); ranges 10–40 (dispersible) and 7–28 (film-coated) mg/kg/day.',
  },
] as const satisfies readonly Source[];
