import { checkThresholdOverrides } from '../thresholds';
import { issue, type Issue } from '../result';
import type { Case, ChelationPeriod } from './caseFile';
import type { IsoDate } from '../dates';
import { r2StarCalibrations } from '../iron/r2StarCalibrations';
import { plausibleRangeText } from './bounds';
import { weightBounds, weightChangeWithin90Days, weightForAgeBands } from '../ranges/plausibleRanges';
import { daysBetween } from '../dates';
import { ageOnDate } from '../patient/ageOnDate';
import { chelatorIdForPeriod, findChelator } from '../chelators/catalogue';
import { latestWeightOnOrBefore } from './latestWeight';
import { pathText } from './zodIssues';
import { eventDatesWhere } from './eventDates';

type Path = readonly (string | number)[];

function periodsWithPaths(theCase: Case): { path: Path; period: { readonly startDate: IsoDate; readonly endDate: IsoDate | null } }[] {
  return [
    ...theCase.chelationPeriods.map((period, index) => ({ path: ['chelationPeriods', index] as Path, period })),
    ...theCase.coMedications.map((period, index) => ({ path: ['coMedications', index] as Path, period })),
    ...theCase.proposedRegimens.flatMap((regimen, regimenIndex) =>
      regimen.periods.map((period, index) => ({ path: ['proposedRegimens', regimenIndex, 'periods', index] as Path, period })),
    ),
  ];
}

/** The lists whose entries carry an id, in the order their duplicates are reported. */
function listsWithIds(theCase: Case): { readonly base: Path; readonly entries: readonly { readonly id: string }[] }[] {
  return [
    { base: ['transfusions'], entries: theCase.transfusions },
    { base: ['results'], entries: theCase.results },
    { base: ['chelationPeriods'], entries: theCase.chelationPeriods },
    { base: ['coMedications'], entries: theCase.coMedications },
    { base: ['proposedRegimens'], entries: theCase.proposedRegimens },
    { base: ['dispensings'], entries: theCase.dispensings },
    ...(['hepaticImpairment', 'cardiacFailure', 'renalRiskFactors'] as const).map((list) => ({ base: ['clinicalState', list], entries: theCase.clinicalState[list] })),
  ];
}

function duplicateIds(theCase: Case): Issue[] {
  // One loop over every list (entries of many shapes, read only for their id), and a path made only
  // for a duplicate: this runs for every case opened.
  const seen = new Map<string, { readonly base: Path; readonly index: number }>();
  const found: Issue[] = [];
  for (const { base, entries } of listsWithIds(theCase)) {
    for (let index = 0; index < entries.length; index += 1) {
      const id = entries[index]!.id;
      const first = seen.get(id);
      if (first === undefined) {
        seen.set(id, { base, index });
        continue;
      }
      const path = [...base, index, 'id'];
      found.push(issue('inconsistent', path, `${pathText(path)} "${id}" is already used by ${pathText([...first.base, first.index, 'id'])}; each entry needs its own id.`));
    }
  }
  return found;
}

function overlappingSameDrug(periods: readonly ChelationPeriod[], base: Path = ['chelationPeriods']): Issue[] {
  const endOf = (index: number) => periods[index]!.endDate ?? '9999-12-31';
  // The overlapping pairs (later index, earlier index), found drug by drug in one sweep over the start
  // dates: a period still open when another starts overlaps it. Comparing every pair was quadratic
  // in the number of periods (a record of weekly dose changes has thousands).
  const pairs: [laterIndex: number, earlierIndex: number][] = [];
  const byDrug = new Map<string, number[]>();
  periods.forEach((period, index) => {
    const ofDrug = byDrug.get(period.drug);
    if (ofDrug) ofDrug.push(index);
    else byDrug.set(period.drug, [index]);
  });
  for (const indices of byDrug.values()) {
    const byStart = [...indices].sort((a, b) => (periods[a]!.startDate < periods[b]!.startDate ? -1 : periods[a]!.startDate > periods[b]!.startDate ? 1 : a - b));
    let open: number[] = [];
    for (const index of byStart) {
      const start = periods[index]!.startDate;
      // Ended before this start: ended before every later start too.
      open = open.filter((other) => endOf(other) >= start);
      for (const other of open) if (periods[other]!.startDate <= endOf(index)) pairs.push(other < index ? [index, other] : [other, index]);
      open.push(index);
    }
  }
  pairs.sort((a, b) => a[0] - b[0] || a[1] - b[1]);
  const found: Issue[] = [];
  for (const [laterIndex, earlierIndex] of pairs) {
    const later = periods[laterIndex]!;
    const path = [...base, laterIndex];
    found.push(
      issue(
        'inconsistent',
        path,
        `${pathText(path)} (${later.drug} from ${later.startDate}) overlaps ${pathText([...base, earlierIndex])} of the same drug; end the earlier period if the regimen changed${base[0] === 'proposedRegimens' ? ' (in a proposal, each drug once: a duplicate counts its dose twice)' : ''}.`,
        'warning',
      ),
    );
  }
  return found;
}

/**
 * A raw R2* or T2* is turned into liver iron by a calibration core/iron knows,
 * at the field strength it was derived at; anything else cannot be converted.
 * The file still opens (the other results stand); core/iron refuses the conversion.
 */
function calibrationProblems(theCase: Case): Issue[] {
  const found: Issue[] = [];
  theCase.results.forEach((result, index) => {
    if (result.kind !== 'liver-iron' || (result.method !== 'mri-r2star' && result.method !== 'mri-t2star')) return;
    const path = ['results', index, 'calibrationId'];
    const calibration = r2StarCalibrations.find((it) => it.id === result.calibrationId);
    if (!calibration) {
      const known = r2StarCalibrations.map((it) => it.id).join(', ');
      found.push(issue('unknown_choice', path, `${pathText(path)} "${result.calibrationId}" is not a known R2* calibration (${known}); this result cannot be converted to liver iron.`, 'warning'));
    } else if (calibration.fieldStrengthTesla !== result.fieldStrengthT) {
      found.push(
        issue(
          'field_strength_mismatch',
          path,
          `${pathText(path)} "${calibration.id}" was derived at ${calibration.fieldStrengthTesla} T but the result was measured at ${result.fieldStrengthT} T; choose a calibration for ${result.fieldStrengthT} T.`,
          'warning',
        ),
      );
    }
  });
  return found;
}

/**
 * Weights that look mistyped: outside the band for the age on the day
 * (plausibleRanges.ts weightForAgeBands), or more than a fifth away from a
 * weight of the 90 days before (a 6.1 entered for 61 kg).
 */
function weightProblems(theCase: Case): Issue[] {
  const found: Issue[] = [];
  const { weights } = theCase.patient;
  const { share, windowDays } = weightChangeWithin90Days;
  weights.forEach((entry, index) => {
    const path = ['patient', 'weights', index, 'weight', 'value'];
    const kg = entry.weight.value;
    const age = ageOnDate(theCase.patient.age, entry.date) ?? undefined;
    const band = age === undefined ? undefined : weightForAgeBands.find((it) => age >= it.fromYears && age < it.toYears);
    if (band && (kg < band.minKg || kg > band.maxKg)) {
      found.push(
        issue(
          'out_of_range',
          path,
          `${pathText(path)} ${kg} kg on ${entry.date} is outside ${band.minKg}–${band.maxKg} kg, the plausible range at age ${Math.floor(age!)} (${band.fromYears}–${band.toYears < 130 ? band.toYears : 'any'} years); check the value and its unit.`,
          'warning',
        ),
      );
    }
    const earlier = weights
      .filter((other) => other.date < entry.date && daysBetween(other.date, entry.date) <= windowDays)
      .sort((first, second) => (first.date < second.date ? 1 : -1))[0];
    if (earlier) {
      const change = kg / earlier.weight.value - 1;
      if (Math.abs(change) > share) {
        found.push(
          issue(
            'inconsistent',
            path,
            `${pathText(path)} ${kg} kg on ${entry.date} is ${Math.round(Math.abs(change) * 100)} % ${change < 0 ? 'below' : 'above'} the ${earlier.weight.value} kg of ${earlier.date} (${daysBetween(earlier.date, entry.date)} days before): more than ${share * 100} % within ${windowDays} days; check the value.`,
            'warning',
          ),
        );
      }
    }
  });
  return found;
}

/**
 * The dose field is per administration: a dose typed as the daily amount and
 * multiplied by the administrations per day gives a daily total far above the
 * label. Warns with the daily total whenever it is above the labelled daily
 * maximum of the product (core/chelators/catalogue.ts, with its sources).
 */
function dailyDoseProblems(theCase: Case): Issue[] {
  const found: Issue[] = [];
  const periods = [
    ...theCase.chelationPeriods.map((period, index) => ({ period, path: ['chelationPeriods', index] as Path })),
    ...theCase.proposedRegimens.flatMap((regimen, regimenIndex) =>
      regimen.periods.map((period, index) => ({ period, path: ['proposedRegimens', regimenIndex, 'periods', index] as Path })),
    ),
  ];
  for (const { period, path } of periods) {
    const weight = latestWeightOnOrBefore(theCase.patient.weights, period.startDate) ?? theCase.patient.weights[0];
    const perAdministrationMgPerKg = period.dose.unit === 'mg/kg' ? period.dose.value : weight ? period.dose.value / weight.weight.value : undefined;
    if (perAdministrationMgPerKg === undefined) continue;
    const entry = findChelator(chelatorIdForPeriod(period.drug, period.formulation));
    const dailyMgPerKg = perAdministrationMgPerKg * period.administrationsPerDay;
    const maxMgPerKg = entry.dose.maxMgPerKgPerDay;
    if (dailyMgPerKg <= maxMgPerKg * (1 + 1e-9)) continue;
    const where = [...path, 'dose'];
    const perWeight = period.dose.unit === 'mg' && weight ? ` (${round1(perAdministrationMgPerKg)} mg/kg at ${weight.weight.value} kg)` : '';
    found.push(
      issue(
        'out_of_range',
        where,
        `${pathText(where)} ${period.dose.value} ${period.dose.unit}${perWeight} is per administration: × ${period.administrationsPerDay} a day = ${round1(dailyMgPerKg)} mg/kg/day, above the labelled daily maximum of ${maxMgPerKg} mg/kg/day for ${entry.label}; check whether the daily dose was entered as the dose per administration.`,
        'warning',
      ),
    );
  }
  return found;
}

const round1 = (value: number) => String(Math.round(value * 10) / 10);

/**
 * Initials (JS) and local codes (TH-0417) are what a label should be; two or
 * more words of letters ("Jane Smith", "Smith, J") or one capitalised word
 * ("Smith") look like a name.
 */
function labelLooksLikeName(label: string): boolean {
  return /^[\p{L}'’.-]+(?:[\s,]+[\p{L}'’.-]+)+$/u.test(label.trim()) || /^\p{Lu}\p{Ll}{2,}$/u.test(label.trim());
}

/**
 * Checks that need more than one field: unique ids, periods that end before
 * they start, events before birth (refused); events after the review date,
 * proposed periods starting before it, overlapping periods of one drug,
 * pregnancy recorded with male sex at birth, a label that looks like a name,
 * no weight on record, a weight implausible for the age or changed by more
 * than a fifth within 90 days, a dose per administration whose daily total is
 * above the labelled daily maximum, a raw R2* or T2* with an unknown
 * calibration or one of another field strength (warnings).
 *
 * @param theCase - a case that passed the schema
 * @returns errors and warnings, each with its path; empty when all is consistent
 * @example consistencyIssues(caseWithEndBeforeStart)[0].code === 'inconsistent'
 */
export function consistencyIssues(theCase: Case): Issue[] {
  const found: Issue[] = [...duplicateIds(theCase)];

  // A local protocol's threshold must name a catalogued threshold and sit in its plausible range.
  const thresholds = checkThresholdOverrides(theCase.thresholdOverrides);
  if (!thresholds.ok) {
    for (const problem of thresholds.issues) found.push({ ...problem, path: ['thresholdOverrides', ...problem.path.slice(1)] });
  }

  for (const { path, period } of periodsWithPaths(theCase)) {
    if (period.endDate !== null && period.endDate < period.startDate) {
      const where = [...path, 'endDate'];
      found.push(issue('inconsistent', where, `${pathText(where)} ${period.endDate} is before its start date ${period.startDate}.`));
    }
  }

  const { age } = theCase.patient;
  if (age.kind === 'birth-date') {
    for (const { path, date } of eventDatesWhere(theCase, (date) => date < age.birthDate)) {
      found.push(issue('inconsistent', path, `${pathText(path)} ${date} is before the birth date ${age.birthDate}.`));
    }
  }

  const { reviewDate } = theCase.review;
  if (reviewDate !== null) {
    for (const { path, date } of eventDatesWhere(theCase, (date) => date > reviewDate)) {
      found.push(issue('inconsistent', path, `${pathText(path)} ${date} is after the review date ${reviewDate}; check the date.`, 'warning'));
    }
    theCase.proposedRegimens.forEach((regimen, regimenIndex) =>
      regimen.periods.forEach((period, index) => {
        if (period.startDate >= reviewDate) return;
        const path = ['proposedRegimens', regimenIndex, 'periods', index, 'startDate'];
        found.push(
          issue('inconsistent', path, `${pathText(path)} ${period.startDate} is before the review date ${reviewDate}; a proposed regimen starts at the review.`, 'warning'),
        );
      }),
    );
  }

  found.push(...overlappingSameDrug(theCase.chelationPeriods));
  theCase.proposedRegimens.forEach((regimen, index) => found.push(...overlappingSameDrug(regimen.periods, ['proposedRegimens', index, 'periods'])));
  found.push(...weightProblems(theCase));
  found.push(...dailyDoseProblems(theCase));
  found.push(...calibrationProblems(theCase));

  const { pregnancy, sexAtBirth, label, weights } = theCase.patient;
  if (pregnancy.status !== 'not-pregnant' && sexAtBirth === 'male') {
    const path = ['patient', 'pregnancy', 'status'];
    found.push(issue('inconsistent', path, `${pathText(path)} "${pregnancy.status}" is recorded with sex at birth male; check both fields.`, 'warning'));
  }
  if (labelLooksLikeName(label)) {
    const path = ['patient', 'label'];
    found.push(
      issue('inconsistent', path, `${pathText(path)} "${label}" looks like a name; use a local code such as TH-0417 so the file carries no name.`, 'warning'),
    );
  }
  if (weights.length === 0) {
    const path = ['patient', 'weights'];
    found.push(issue('required', path, `${pathText(path)} is empty; doses in mg/kg and intake per kg need a weight (plausible ${plausibleRangeText(weightBounds)}).`, 'warning'));
  }
  return found;
}
