import type { Source } from './source';

/**
 * Sources for practical doses (product strengths) and the monitoring calendar
 * (references.md §3 and §4). Product strengths are recalled from the labels,
 * not read in this project: each says so, and the local formulary can replace
 * the whole catalogue (core/dosing/productCatalogue.ts).
 */
export const dosingSources = [
  {
    id: 'dosing-deferasirox-strengths-memory',
    authors: 'Marketing authorisation holder',
    title: 'Deferasirox prescribing information: presentations (film-coated and dispersible tablets)',
    publication: 'product labels, US and EU (not checked in this project)',
    year: null,
    locator: 'dosage forms and strengths',
    status: 'memory',
    note: 'From memory: film-coated tablets 90, 180 and 360 mg; dispersible tablets (tablets for oral suspension) 125, 250 and 500 mg. Neither label is recalled as describing tablet halves, so the catalogue treats both as whole tablets only.',
  },
  {
    id: 'dosing-deferasirox-granules-ndc',
    authors: 'US Food and Drug Administration',
    title: 'National Drug Code directory: deferasirox oral granules (packets of 90, 180 and 360 mg)',
    publication: 'NDC directory records as served by openFDA (record update 2026); the prescribing information itself (§3 dosage forms and strengths, revision date) was not seen',
    year: 2026,
    status: 'secondary',
    note: 'Deferasirox oral granules in single-dose packets, 30 packets a carton; 180 mg and 360 mg packets seen in the records in 2026, 90 mg from the national drug code records read in an earlier pass. The label’s own section 3 text and its revision date were not seen.',
  },
  {
    id: 'dosing-deferiprone-strengths-memory',
    authors: 'Marketing authorisation holder',
    title: 'Deferiprone prescribing information: presentations (tablets and oral solution)',
    publication: 'product labels, US and EU (not checked in this project)',
    year: null,
    locator: 'dosage forms and strengths',
    status: 'memory',
    note: 'From memory: 500 mg and 1000 mg film-coated tablets; oral solution 100 mg/mL. That both EU film-coated tablets are scored and breakable into equal halves was read in the EU texts (deferiprone-label §3 for 500 mg, 2004; deferiprone-smpc-eu-2023 §3 for both), which the catalogue follows.',
  },
  {
    id: 'dosing-deferoxamine-vials-memory',
    authors: 'Marketing authorisation holder',
    title: 'Deferoxamine mesylate for injection: presentations',
    publication: 'product labels (not checked in this project)',
    year: null,
    locator: 'how supplied',
    status: 'memory',
    note: 'From memory: single-use vials of 500 mg and 2 g of the mesylate (lyophilised powder). Contents left in an opened vial are discarded (single use), which is why the waste is shown.',
  },
  {
    id: 'dosing-measurable-volume',
    authors: '—',
    title: 'Measurable volume of an oral solution with an oral syringe',
    publication: 'common practice (no single published source)',
    year: null,
    status: 'common-practice',
    note: 'A volume is rounded to a step an oral syringe can measure; 0.1 mL is the default step (a 1–5 mL syringe graduated in 0.1 mL). The local step may differ (0.2 or 0.5 mL on larger syringes): it is an input.',
  },


  {
    id: 'monitoring-ferritin-quarterly',
    authors: '—',
    title: 'Serum ferritin every three months on a transfusion programme or chelation',
    publication: 'common practice (guideline literature; editions not checked)',
    year: null,
    status: 'common-practice',
    note: 'Every three months is the usual interval; some protocols check at each transfusion visit.',
  },
  {
    id: 'monitoring-mri-yearly',
    authors: 'Thalassaemia guideline literature',
    title: 'Liver iron by MRI yearly; cardiac T2* yearly in thalassaemia major from about 10 years of age',
    publication: 'thalassaemia management guidelines (editions not checked)',
    year: null,
    status: 'secondary',
    note: 'Liver iron by MRI once a year is common practice and guideline advice. Cardiac T2* yearly from about 10 years of age in thalassaemia major (younger children often cannot be scanned without sedation; earlier where indicated): guideline advice as reproduced secondarily, edition not checked. More often when results are abnormal: a local decision.',
  },
] as const satisfies readonly Source[];
