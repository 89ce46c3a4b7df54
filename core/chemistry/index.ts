/** Binding chemistry: ligand constant sets, conditional constants, speciation and pM (pure). */
export * from './types';
export { ligandConstantSets, constantSetIds, findConstantSet, defaultSetOf } from './sets';
export { metalHydrolysisSets, hydrolysisOf } from './hydrolysis';
export { logLigandFraction, ligandFraction, log10SumOfPowers } from './ligandFraction';
export { conditionalConstant, logMetalFraction, checkSetApplies, type ConditionalConstant } from './conditionalConstant';
export {
  solveEquilibrium,
  relativeResidualTolerance,
  type EquilibriumSystem,
  type EquilibriumSolution,
  type SpeciesDefinition,
  type Component,
  type SolveOptions,
} from './equilibriumSolver';
export { speciate, type Speciation, type MetalSpeciation, type MetalTotal } from './speciation';
export { pmSweep, conditionalConstantSweep, phGrid, type SweepPoint } from './phSweep';
export { pmComparisonAtPhysiologicalPh, type PmComparisonRow } from './pmComparison';
export {
  capacityComparison,
  capacityComparisonRow,
  usualDailyDoseOf,
  capacityMetalIds,
  type CapacityMetalId,
  type CapacityComparisonRow,
  type ChelatorDailyDose,
  type CapacityPm,
} from './capacityAndPm';
export {
  leadCalciumCompetition,
  plasmaIonizedCalciumUmolPerL,
  illustrativeEdetateUmolPerL,
  type LeadCalciumCompetition,
  type LeadCalciumState,
  type LeadCalciumOptions,
} from './metalCompetition';
export { speciesName, elementOf } from './speciesName';
export { chemistryFormulas, describeConstantSet, capacityAndPmFormula } from './formulas';
