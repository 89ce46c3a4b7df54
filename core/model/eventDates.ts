import type { IsoDate } from '../dates';
import type { Case } from './caseFile';

/** A date in a case file and where it is. */
export interface DatedAt {
  readonly path: readonly (string | number)[];
  readonly date: IsoDate;
}

/** The lists whose entries record something that happened to the patient, and the field of each entry's date. */
function datedLists(theCase: Case): readonly { readonly base: readonly string[]; readonly field: string; readonly entries: readonly object[] }[] {
  return [
    { base: ['patient', 'weights'], field: 'date', entries: theCase.patient.weights },
    { base: ['patient', 'heights'], field: 'date', entries: theCase.patient.heights },
    { base: ['transfusions'], field: 'date', entries: theCase.transfusions },
    { base: ['results'], field: 'date', entries: theCase.results },
    { base: ['chelationPeriods'], field: 'startDate', entries: theCase.chelationPeriods },
    { base: ['coMedications'], field: 'startDate', entries: theCase.coMedications },
    { base: ['dispensings'], field: 'date', entries: theCase.dispensings },
    ...(['hepaticImpairment', 'cardiacFailure', 'renalRiskFactors'] as const).map((list) => ({ base: ['clinicalState', list], field: 'date', entries: theCase.clinicalState[list] })),
  ];
}

const dateIn = (entry: object, field: string): IsoDate => (entry as Record<string, IsoDate>)[field]!;

/**
 * Every date that records something that happened to the patient (not review or
 * sign-off dates, not proposed regimens), with its path.
 *
 * @param theCase - a parsed case; not changed
 * @returns the dates in file order
 */
export function eventDates(theCase: Case): DatedAt[] {
  return eventDatesWhere(theCase, () => true);
}

/**
 * The {@link eventDates} a test keeps, in file order, a path made only for those kept:
 * the case checks look for the few dates before a birth date or after a review date.
 *
 * @param theCase - a parsed case; not changed
 * @param keep - whether a date is wanted
 * @example eventDatesWhere(theCase, (date) => date > '2026-11-20') → the events after that review date
 */
export function eventDatesWhere(theCase: Case, keep: (date: IsoDate) => boolean): DatedAt[] {
  const dates: DatedAt[] = [];
  for (const { base, field, entries } of datedLists(theCase)) {
    entries.forEach((entry, index) => {
      const date = dateIn(entry, field);
      if (keep(date)) dates.push({ path: [...base, index, field], date });
    });
  }
  return dates;
}

/**
 * The earliest and the latest of the case's {@link eventDates}, or null when it has none:
 * what a review window needs, without a path per date.
 *
 * @param theCase - a parsed case; not changed
 * @example eventDateSpan(TH-0417) → { earliest: '2021-09-01', latest: '2026-11-17' }
 */
export function eventDateSpan(theCase: Case): { readonly earliest: IsoDate; readonly latest: IsoDate } | null {
  let earliest: IsoDate | null = null;
  let latest: IsoDate | null = null;
  for (const { field, entries } of datedLists(theCase)) {
    for (const entry of entries) {
      const date = dateIn(entry, field);
      if (earliest === null || date < earliest) earliest = date;
      if (latest === null || date > latest) latest = date;
    }
  }
  return earliest === null || latest === null ? null : { earliest, latest };
}
