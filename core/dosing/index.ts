/**
 * Practical doses: the product catalogue (strengths with their sources, or the
 * local formulary's), the exact search for the nearest practical regimen, and
 * the practical-dose calculator. Descriptive only.
 */
export * from './productCatalogue';
export * from './practicalDose';
export { formatAmount } from '../numbers/formatNumber';
export { closestCombination, smallestCoveringCombination, halfMgUnitsFromMg, type Piece, type Combination } from './combinationSearch';
export { practicalDose, dosingFormulas } from './formulas';
export { proportionOfDaysCovered, type DaysCovered, type Supply } from './proportionOfDaysCovered';
