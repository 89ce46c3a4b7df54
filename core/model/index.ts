/**
 * The case file: its zod schema (version 1), parsing with issues in the
 * trade's words, migration of older versions, and the small date queries the
 * ledger needs. Values keep the units the user entered.
 */
export { earliestCaseDate, isCaseDate, latestCaseDate } from './caseDate';
export { checkBounds, displayUnit, plausibleRangeText, type Bounds, type CheckLevel } from './bounds';
export * from '../ranges/plausibleRanges';
export { diagnosisGroups, pregnancyStatuses, sexesAtBirth } from './patient';
export { exchangeMethods, unitHaematocritAssumptionId } from './transfusion';
export { fieldStrengthsT, liverIronMethods } from './resultEntry';
export {
  chelatorDrugs,
  deferasiroxFormulations,
  deferiproneFormulations,
  deferoxamineFormulations,
  deferoxamineRoutes,
} from './chelationPeriod';
export { coMedicationTimings } from './coMedication';
export * from './caseFile';
export { migrateCase } from './migrate';
export { parseCase } from './parseCase';
export { pathText } from './zodIssues';
export { sortedByDate } from './sortedByDate';
export { latestWeightOnOrBefore } from './latestWeight';
export { periodsActiveOn, type DatedPeriod } from './periodsActiveOn';
export { periodsOverlapping } from './periodsOverlapping';
export { resultsByKindBetween, resultsOfKindBetween } from './resultsOfKindBetween';
export { continuousRunStart } from './continuousRunStart';
export { eventDates, type DatedAt } from './eventDates';
export { checkReviewDate, reviewWindow, reviewYearsAfterRecord, type ReviewWindow } from './reviewWindow';
