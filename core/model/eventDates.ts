import type { IsoDate } from '../dates';
import type { Case } from './caseFile';

/** A date in a case file and where it is. */
export interface DatedAt {
  readonly path: readonly (string | number)[];
  readonly date: IsoDate;
}

/**
 * Every date that records something that happened to the patient (not review or
 * sign-off dates, not proposed regimens), with its path.
 *
 * @param theCase - a parsed case; not changed
 * @returns the dates in file order
 */
export function eventDates(theCase: Case): DatedAt[] {
  const dates: DatedAt[] = [];
  theCase.patient.weights.forEach((it, index) => dates.push({ path: ['patient', 'weights', index, 'date'], date: it.date }));
  theCase.patient.heights.forEach((it, index) => dates.push({ path: ['patient', 'heights', index, 'date'], date: it.date }));
  theCase.transfusions.forEach((it, index) => dates.push({ path: ['transfusions', index, 'date'], date: it.date }));
  theCase.results.forEach((it, index) => dates.push({ path: ['results', index, 'date'], date: it.date }));
  theCase.chelationPeriods.forEach((it, index) => dates.push({ path: ['chelationPeriods', index, 'startDate'], date: it.startDate }));
  theCase.coMedications.forEach((it, index) => dates.push({ path: ['coMedications', index, 'startDate'], date: it.startDate }));
  theCase.dispensings.forEach((it, index) => dates.push({ path: ['dispensings', index, 'date'], date: it.date }));
  for (const list of ['hepaticImpairment', 'cardiacFailure', 'renalRiskFactors'] as const) {
    theCase.clinicalState[list].forEach((it, index) => dates.push({ path: ['clinicalState', list, index, 'date'], date: it.date }));
  }
  return dates;
}
