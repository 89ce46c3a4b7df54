/**
 * The monitoring calendar: which checks the active regimens call for, when
 * each was last done, and when it is due. Pure; the host writes the iCalendar file.
 */
export * from './monitoringRules';
export * from './monitoringCalendar';
