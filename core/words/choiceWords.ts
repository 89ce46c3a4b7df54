/**
 * A choice id of the case file or the source list as a reader reads it:
 * "film-coated-tablet" → "film-coated tablets", "thalassaemia-major" →
 * "thalassaemia major". Ids stay ids in files and --json; human text (the
 * command line's readable output, findings, the screens and the sheet) uses
 * these words. The table holds the ids whose words are not the id with its
 * hyphens read as spaces; every other id is read that way.
 *
 * The words follow the trade's usage (a label's "film-coated tablets",
 * "oral solution"; "sickle cell disease" unhyphenated as in its clinical
 * literature): common practice.
 */
const words: Readonly<Record<string, string>> = {
  // Formulations (core/model/chelationPeriod.ts), plural as a label lists presentations.
  'dispersible-tablet': 'dispersible tablets',
  'film-coated-tablet': 'film-coated tablets',
  tablet: 'tablets',
  vial: 'vials',
  // Diagnosis groups (core/model/patient.ts).
  'thalassaemia-non-transfusion-dependent': 'non-transfusion-dependent thalassaemia',
  'diamond-blackfan': 'Diamond–Blackfan anaemia',
  'other-transfusion-dependent': 'other transfusion-dependent condition',
  'other-disease': 'other',
  // Co-medication timings and clinical state (core/model).
  'with-each-deferoxamine-infusion': 'with each deferoxamine infusion',
  'pre-existing-renal-condition': 'pre-existing renal condition',
  'nephrotoxic-co-medication': 'nephrotoxic co-medication',
  'comorbid-condition': 'comorbid condition',
};

/**
 * @param id - a kebab-case choice id ('film-coated-tablet', 'common-practice')
 * @returns its words ('film-coated tablets', 'common practice')
 * @example choiceWords('thalassaemia-major') === 'thalassaemia major'
 */
export function choiceWords(id: string): string {
  return Object.hasOwn(words, id) ? words[id]! : id.replace(/-/g, ' ');
}
