/**
 * Safety findings: rules (data plus a pure predicate) that turn a computed
 * case into sourced, descriptive findings for the prescriber's review.
 */
export * from './types';
export * from '../thresholds';
export type { SafetyRule } from './rule';
export { safetyRules } from './rules';
export { evaluateFindings, findingsWithMonitoring } from './evaluateFindings';
export { continuousRunStart } from '../model/continuousRunStart';
