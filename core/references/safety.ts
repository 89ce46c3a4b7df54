import type { Source } from './source';

/**
 * Sources for the safety findings (references.md §4 and the monitoring rows of
 * §2 and §3). Labels are cited by drug and country; the wording of a label
 * changes between revisions, so every rule names the status of what it rests on.
 */
export const safetySources = [
  {
    id: 'deferasirox-creatinine-baseline',
    authors: '—',
    title: 'Creatinine baseline for the 33 % rise: the latest creatinine on or before the first day of the current deferasirox period; when there is none, the mean of the first two creatinines on the drug',
    publication: 'this project’s reading of the label’s "pre-treatment average"',
    year: null,
    status: 'common-practice',
    note: 'The label speaks of the average of pre-treatment values; a case file often holds one pre-treatment result. Rises are compared rounded to 0.1 %.',
  },
  {
    id: 'alt-uln-memory',
    authors: '—',
    title: 'ALT upper limit of normal 40 U/L and the 5 × ULN review threshold',
    publication: 'laboratory reference intervals vary; deferasirox and deferiprone labels (not checked)',
    year: null,
    status: 'memory',
    note: 'From memory: labels ask for transaminases monthly and for review of persistent or progressive rises; 5 × ULN is a common grading cut-off. The ULN of 40 U/L is an assumption: use the reporting laboratory’s own.',
  },
  {
    id: 'low-iron-interruption-labels',
    authors: 'Marketing authorisation holders',
    title: 'Deferasirox and deferiprone labels: consistently low ferritin or liver iron',
    publication: 'product labels (as summarised secondarily)',
    year: null,
    status: 'secondary',
    note: 'Deferasirox: interruption is advised when ferritin is consistently below 500 µg/L; the US label also names LIC below 3 mg/g dry. Deferiprone: interruption is to be considered when ferritin is consistently below 500 µg/L. "Consistently" is read here as two consecutive results.',
  },
  {
    id: 'deferiprone-label-us-2025',
    authors: 'Marketing authorisation holder',
    title: 'Deferiprone prescribing information (US), revision of March 2025',
    publication: 'US product label; recent major change "Warnings and Precautions, Agranulocytosis and Neutropenia (5.1) 3/2025" (openFDA label record)',
    year: 2025,
    locator: 'boxed warning; §2.1 dosage and monitoring; §5.1 agranulocytosis and neutropenia; §7 drug interactions',
    status: 'confirmed',
    note: 'ANC before starting; weekly during the first 6 months, every 2 weeks during the next 6 months, then every 2 to 4 weeks (or at the transfusion interval) after a year without an interruption for low ANC; daily during neutropenia until recovery. Bands: neutropenia ANC 0.5 to < 1.5 × 10⁹/L, severe neutropenia 0.2 to < 0.5, agranulocytosis < 0.2 (older and EU texts: agranulocytosis < 0.5); interrupt at ANC < 1.5 or with an infection. Two different 1,000 mg tablets, one for twice-a-day and one for three-times-a-day dosing, not interchangeable: the tablet must match the regimen (§2.1). ALT monthly; zinc before and regularly. §7 interactions, as summarised by drug-information pages (the interactions entry that cited this label together with the EU text is merged here): avoid other drugs associated with neutropenia or agranulocytosis; deferiprone is conjugated by UGT1A6, so UGT1A6 inhibitors may raise its exposure; polyvalent cations (aluminium-based antacids, zinc, iron and other mineral supplements) bind it, and the label asks for an interval between them (at least 4 hours: from memory).',
  },


  {
    id: 'chelation-combination-memory',
    authors: 'thalassaemia guideline literature',
    title: 'Two chelators at once',
    publication: 'guideline chapters (not checked)',
    year: null,
    status: 'memory',
    note: 'From memory: deferiprone with deferoxamine is used for cardiac iron; other combinations are less studied; the monitoring of each drug applies.',
  },
  {
    id: 'chelation-pregnancy-labels',
    authors: 'Marketing authorisation holders',
    title: 'Iron chelators in pregnancy and breastfeeding',
    publication: 'product labels (as summarised secondarily)',
    year: null,
    status: 'secondary',
    note: 'Flagged for the prescriber; nothing prescriptive is computed.',
  },
  {
    id: 'mri-monitoring-interval-memory',
    authors: 'thalassaemia guideline literature',
    title: 'How often liver iron and cardiac T2* are measured',
    publication: 'guideline chapters (not checked)',
    year: null,
    status: 'memory',
    note: 'From memory: liver iron by MRI about yearly on chelation; cardiac T2* every 12–24 months in thalassaemia major (more often when below 20 ms).',
  },

  {
    id: 'deferasirox-label-us',
    authors: 'Marketing authorisation holder',
    title: 'Deferasirox prescribing information (US): tablets, tablets for oral suspension and oral granules',
    publication: 'US product label (revision date not recorded when it was read again in 2026)',
    year: null,
    locator: 'boxed warning; §2 dosage and administration (starting dose, renal and hepatic impairment); §5 warnings and precautions (§5.2 hepatic toxicity)',
    status: 'confirmed',
    note: 'One record for the US label (the renal, monitoring and dose entries that cited it separately are merged here). Read again in 2026 (confirmed): start when there is evidence of chronic transfusional iron overload, at least 100 mL/kg of packed red blood cells (about 20 units for 40 kg) and a serum ferritin consistently above 1,000 µg/L; doses of the tablets for oral suspension to the nearest whole tablet (§2.1); contraindicated at eGFR < 40 mL/min/1.73 m² (boxed warning); serum creatinine in duplicate before starting, at least monthly, weekly in the first month with renal risk (boxed warning, §2.1); transaminases (AST, ALT) and bilirubin before starting, every 2 weeks during the first month, then at least monthly (§5.2); dose modification or interruption to be considered for severe or persistent elevations, the label giving no multiple of the upper limit of normal (a 5 × ULN cut-off is a study protocol’s); avoid in severe (Child-Pugh C) hepatic impairment, reduce the starting dose in moderate (Child-Pugh B). As summarised secondarily, not checked against the current text: the starting dose reduced by half at eGFR 40–60 mL/min/1.73 m² and in Child-Pugh B; a rise in serum creatinine of more than 33 % above the pre-treatment average on two consecutive measurements leading to a dose reduction; tablets (film-coated) dosed at 0.7 × the dose of the tablets for oral suspension (14 vs 20 mg/kg/day), ranges 7–28 and 10–40 mg/kg/day. From memory: auditory and ophthalmic testing before starting and yearly.',
  },
  {
    id: 'deferasirox-smpc-eu',
    authors: 'Marketing authorisation holder',
    title: 'Deferasirox summary of product characteristics (EU and UK)',
    publication: 'EU SmPC as reproduced by drug-information pages, and the UK SmPC (2023) (revision dates of the EU text not shown there)',
    year: null,
    locator: '§4.1 indications; §4.3 contraindications; §4.5 interaction with other medicinal products',
    status: 'secondary',
    note: 'One record for the EU text (the creatinine-clearance and interaction entries that cited it separately are merged here). §4.1 (UK SmPC 2023, read): start at about 7 mL/kg/month of packed red cells. §4.3 from memory: contraindicated at an estimated creatinine clearance below 60 mL/min (verify against the current EU text before relying on it). §4.5, read in reproductions: potent UGT inducers (rifampicin, phenytoin, phenobarbital, ritonavir, carbamazepine) decrease deferasirox exposure (ferritin to be followed); cholestyramine (a bile-acid sequestrant) reduces it; substances metabolised by CYP3A4 (ciclosporin, simvastatin, hormonal contraceptives, bepridil, ergotamine) may lose effect; repaglinide (CYP2C8) exposure rises about 2.3-fold, the combination is to be avoided, other CYP2C8 substrates such as paclitaxel are not excluded; theophylline and narrow-range CYP1A2 substrates (clozapine, tizanidine) rise; aluminium-containing antacids are not to be taken with it; NSAIDs, corticosteroids, oral bisphosphonates and anticoagulants raise the risk of gastrointestinal ulceration or bleeding. Busulfan (raised exposure) is from memory of the US label §7.',
  },


  {
    id: 'deferoxamine-label-interactions',
    authors: 'Marketing authorisation holder',
    title: 'Deferoxamine mesylate prescribing information (US, older revision): drug interactions',
    publication: 'US product label, drug interactions section, as reproduced by a drug-information portal (revision date not shown)',
    year: null,
    locator: 'precautions: drug interactions',
    status: 'confirmed',
    note: 'Vitamin C: up to 200 mg a day in adults in divided doses, starting after an initial month of regular deferoxamine; 50 mg daily generally suffices under 10 years and 100 mg daily in older children; larger doses add no iron excretion; not in cardiac failure (SmPC: impairment of cardiac function with more than 500 mg a day). Prochlorperazine: temporary impairment of consciousness. Gallium-67: imaging distorted; deferoxamine discontinued 48 hours before scintigraphy is advised.',
  },
  {
    id: 'nau-pqa-2012-pdc',
    authors: 'Nau DP; Pharmacy Quality Alliance',
    title: 'Proportion of days covered (PDC) as a preferred method of measuring medication adherence',
    publication: 'Pharmacy Quality Alliance, Springfield VA, 2012 (as cited by pharmacy-practice pages)',
    year: 2012,
    status: 'secondary',
    note: 'PDC = days in the period with the drug on hand ÷ days in the period; a supply that overlaps an earlier one is shifted forward to start when the earlier one ends, so no day is counted twice; the period starts at the first fill in it (the index date) and ends at the end of the measurement period (the definition as stated by pharmacy-practice sources and the PQA measure examples, whose claims list the shifted first and last dose dates; the 2012 PQA document itself was not read). 0.80 is the usual threshold of adequate adherence in PQA measures.',
  },
  {
    id: 'pdc-feeds-expected-removal-choice',
    authors: '—',
    title: 'Where dispensings are recorded, the proportion of days covered takes the place of the entered adherence estimate in a chelation period’s expected removal',
    publication: 'a modelling choice of this tool',
    year: null,
    status: 'common-practice',
    note: 'The proportion is counted from the first dispensing of the drug on record (or the period’s start) to the period’s end or the review date and is used for the whole period, days before the first dispensing on record included. Drug on hand is not drug taken: the proportion is an upper estimate of adherence, and the entered estimate is shown beside it.',
  },
  {
    id: 'dose-far-above-maximum-choice',
    authors: '—',
    title: 'A daily dose more than 1.5 times the labelled daily maximum is shown as urgent',
    publication: 'a modelling choice of this tool',
    year: null,
    status: 'common-practice',
    note: 'Above the labelled maximum a dose is for review; far above it (1.5 × by default) the likeliest cause is a daily dose typed as the dose per administration, and the expected removal and projections are not reliable. A local protocol may set the multiple.',
  },
  {
    id: 'interaction-matching-by-name',
    authors: '—',
    title: 'Interaction checks match co-medications by generic name against a small catalogue of the label-listed drugs',
    publication: 'a modelling choice of this tool',
    year: null,
    status: 'common-practice',
    note: 'A drug typed under another name, a combination product or a member of a class that the catalogue does not list is missed; the checks do not replace a full interaction reference.',
  },
] as const satisfies readonly Source[];
