import type { Derivation } from '../../core/formulas/derivation';
import { maxProposedRegimens, type Case } from '../../core/model/caseFile';
import { periodDoseLines, type PeriodDoseLine } from './regimenDoses';
import { formatNumber, formatQuantity } from './format';
import type { Review } from './review';

export interface RegimenColumn {
  readonly id: string;
  readonly name: string;
  readonly isCurrent: boolean;
  readonly removal: string;
  readonly net: string;
  readonly basis: string;
  readonly milestones: readonly { readonly months: number; readonly central: string; readonly band: string; readonly derivation: Derivation }[];
  readonly crossings: readonly string[];
  readonly doses: readonly PeriodDoseLine[];
  /** The label zones the projection enters, in core's words. */
  readonly labelZones: readonly string[];
}

export interface RegimensView {
  readonly columns: readonly RegimenColumn[];
  readonly canAddWhatIf: boolean;
  readonly note: string;
  readonly projectionSettings: string;
}

/** The Regimens screen: the current regimen and each what-if side by side, from core's projection. */
export function regimensView(review: Review, caseFile: Case): RegimensView {
  const projection = review.results.projection;
  const proposedCount = caseFile.proposedRegimens.length;
  const periodsOf = (scenarioId: string) =>
    scenarioId === 'current'
      ? caseFile.chelationPeriods.filter((period) => period.startDate <= review.asOf && (period.endDate === null || period.endDate >= review.asOf))
      : (caseFile.proposedRegimens.find((regimen) => regimen.id === scenarioId)?.periods ?? []);
  const columns: RegimenColumn[] = (projection?.scenarios ?? []).map((scenario) => ({
    id: scenario.id,
    name: scenario.name,
    isCurrent: scenario.id === 'current',
    removal: formatQuantity(scenario.removalMgPerDay, 0, 'mg/d'),
    net: formatQuantity(scenario.netMgPerKgPerDay, 2, 'mg/kg/d'),
    basis: scenario.efficiencyBasis === 'measured' ? "scaled by this patient's measured response" : 'published efficiencies',
    milestones: scenario.milestones
      .filter((milestone) => [6, 12, 24].includes(milestone.monthsAhead))
      .map((milestone) => {
        const month = scenario.months[milestone.monthsAhead]!;
        return {
          months: milestone.monthsAhead,
          central: formatQuantity(month.licMgPerGDry, 1, 'mg/g{dry}'),
          band: `${formatNumber(month.licP10, 1)}–${formatNumber(month.licP90, 1)}`,
          derivation: milestone.derivation,
        };
      }),
    crossings: scenario.crossings.map((crossing) =>
      crossing.monthsAhead === null
        ? `does not ${crossing.direction === 'falls below' ? 'fall below' : 'rise above'} ${formatNumber(crossing.thresholdMgPerGDry, 0)} within the horizon`
        : `${crossing.direction} ${formatNumber(crossing.thresholdMgPerGDry, 0)} at month ${crossing.monthsAhead} (${crossing.date}); across the band between month ${crossing.bandEarliestMonths ?? '—'} and ${crossing.bandLatestMonths === null ? 'beyond the horizon' : `month ${crossing.bandLatestMonths}`}`,
    ),
    doses: periodDoseLines(periodsOf(scenario.id), review.results.patient.weightKg),
    labelZones: scenario.labelZones.map((zone) => zone.text),
  }));
  return {
    columns,
    canAddWhatIf: proposedCount < maxProposedRegimens,
    note: projection
      ? `Projected LIC, mg/g dry weight: central value and 10th–90th percentile band (${formatNumber(projection.samples, 0)} seeded samples, seed ${projection.seed}); future intake held at ${formatQuantity(projection.intakeMgPerDay, 1, 'mg/d')}. ${projection.model === 'constant-rate' ? 'Removal is held constant (the constant-rate model), while real chelators remove less as iron falls: values far below 3 overstate the fall.' : `Removal falls as the chelatable iron falls (proportional to body iron above a floor of LIC ${formatNumber(projection.floorLicMgPerGDry, 1)} mg/g dry, set to today's removal); the balance approaches an equilibrium instead of crossing zero.`}`
      : 'No projection: it needs a liver iron result on record.',
    projectionSettings: projection ? `horizon ${projection.horizonMonths} months` : '',
  };
}
