import { fail, issue, ok, type Result } from '../result';
import { findCourseRegimen, type CourseRegimen } from './regimens';

/** Words a pharmacist may type for a regimen, beside the ids themselves (lower case, spaces or hyphens). */
const aliases: Readonly<Record<string, string>> = {
  succimer: 'succimer-lead',
  'calcium disodium edetate': 'edetate-calcium-disodium-lead',
  'edetate calcium disodium': 'edetate-calcium-disodium-lead',
  'sodium calcium edetate': 'edetate-calcium-disodium-lead',
  'dimercaprol edetate': 'dimercaprol-edetate-encephalopathy',
  unithiol: 'unithiol-iv',
  penicillamine: 'penicillamine-wilson',
  'trientine dihydrochloride': 'trientine-dihydrochloride-wilson',
  'trientine tetrahydrochloride': 'trientine-tetrahydrochloride-wilson',
  zinc: 'zinc-wilson',
};

function normalise(text: string): string {
  return text.toLowerCase().replace(/[-_,]+/g, ' ').replace(/\s+/g, ' ').trim();
}

/**
 * True when a typed drug name is edetate disodium (disodium edetate, Na2EDTA)
 * and not calcium disodium edetate: the look-alike whose confusion killed two
 * children (MMWR 2006;55:204).
 * @example isEdetateDisodium('Edetate disodium') === true; isEdetateDisodium('edetate calcium disodium') === false
 */
export function isEdetateDisodium(typed: string): boolean {
  const words = normalise(typed);
  const isEdetate = /\bedetate\b|\bedta\b|\bedetic\b/.test(words) || /na2 ?edta/.test(words);
  const mentionsSodium = /disodium|\bna2\b|na2 ?edta|\bsodium\b/.test(words);
  const mentionsCalcium = /calcium|\bca\b|\bcana2\b|ca ?na2|\bcaedta\b/.test(words);
  return isEdetate && mentionsSodium && !mentionsCalcium;
}

/**
 * Resolve what was typed as the regimen: an id from the catalogue or a
 * generic name. Edetate disodium is refused with the reason and pointed to
 * calcium disodium edetate; a bare "EDTA" or "edetate" is refused as
 * ambiguous. Nothing typed is rewritten: the refusal quotes it.
 *
 * @param typed - the regimen as typed
 * @returns the regimen; or 'not_applicable' (edetate disodium), 'inconsistent' (ambiguous) or
 *   'unknown_choice' (no such regimen) on ['regimen']
 * @example resolveCourseRegimen('edetate disodium') → fail: refused, "fatal hypocalcaemia … MMWR 2006;55:204 … calcium disodium edetate"
 */
export function resolveCourseRegimen(typed: string): Result<CourseRegimen> {
  if (isEdetateDisodium(typed)) {
    return fail(
      issue(
        'not_applicable',
        ['regimen'],
        `"${typed}" is edetate disodium, which is not a treatment for lead poisoning: given in place of calcium disodium edetate it has caused deaths from hypocalcaemia and cardiac arrest, two of them children (CDC, MMWR 2006;55:204). The lead regimen is calcium disodium edetate (edetate-calcium-disodium-lead, or dimercaprol-edetate-encephalopathy in encephalopathy); for review by the prescriber and a toxicologist.`,
      ),
    );
  }
  const words = normalise(typed);
  if (/^(edta|edetate|ca edta|sodium edetate)$/.test(words)) {
    return fail(
      issue(
        'inconsistent',
        ['regimen'],
        `"${typed}" does not say which edetate: calcium disodium edetate treats lead poisoning, edetate disodium does not (MMWR 2006;55:204). Enter "calcium disodium edetate" (edetate-calcium-disodium-lead).`,
      ),
    );
  }
  const id = aliases[words] ?? typed.trim();
  const regimen = findCourseRegimen(id);
  if (!regimen) {
    return fail(issue('unknown_choice', ['regimen'], `Regimen "${typed}" is not in the course catalogue; course --list shows the regimens.`));
  }
  return ok(regimen);
}
