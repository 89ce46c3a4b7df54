import { resolveAssumption } from '../assumptions';
import { daysBetween } from '../dates/isoDate';
import type { Derivation } from '../formulas/derivation';
import { runInternal } from '../formulas/run';
import { fail, ok, type Issue, type Result } from '../result';
import type { ChelationPeriod } from '../model/caseFile';
import { periodsActiveOn } from '../model/periodsActiveOn';
import { describePeriod, efficiencyAssumptionOf, periodRemovalMgPerDay, type LedgerNotice } from './caseToLedger';
import { projectedLicFormula } from './formulas';
import type { IntakeSummary } from './intakeSummary';
import type { BodyIronSummary } from './bodyIronOnDate';
import { projectScenarios, type ScenarioProjection } from './projection';
import { basisScaleOf, type EfficiencyBasis } from './efficiencyBasis';
import { growthTrendOf, type GrowthTrend } from './growthTrend';
import type { ProjectionModel } from './removalModel';
import { assumptionUse, efficiencyUsesOf, periodsBetween, type ReviewContext } from './reviewContext';

export interface ProjectionSummary {
  /** Added with the burden-dependent model: the model, its floor, the efficiency basis and the growth rule, each stated once. */
  readonly model: ProjectionModel;
  readonly floorLicMgPerGDry: number;
  readonly basis: EfficiencyBasis;
  readonly growth: GrowthTrend;
  readonly horizonMonths: number;
  readonly seed: number;
  readonly samples: number;
  readonly intakeMgPerDay: number;
  readonly scenarios: readonly (ScenarioProjection & { readonly milestones: readonly { readonly monthsAhead: number; readonly derivation: Derivation }[] })[];
}

export interface ProjectionOptions {
  readonly horizonMonths: number;
  readonly seed: number;
  readonly samples: number;
  readonly model: ProjectionModel;
  /** False: the current regimen only, the proposed ones not projected. */
  readonly projectProposed: boolean;
}

/**
 * Projections of the current regimen and of each proposed one from the body
 * iron on the review date, with a seeded band and the derivation of each
 * milestone (6, 12, 24 months and the horizon).
 *
 * @param context - the review (see reviewContext.ts)
 * @returns null with no body iron estimate (no LIC on record), and notices
 */
export function projectionSummary(
  context: ReviewContext,
  intake: IntakeSummary,
  bodyIron: BodyIronSummary,
  basis: EfficiencyBasis,
  ageYears: number | null,
  options: ProjectionOptions,
): Result<{ readonly projection: ProjectionSummary | null; readonly notices: readonly LedgerNotice[] }> {
  if (bodyIron.bodyIronMg === null) return ok({ projection: null, notices: [] });
  const { caseFile, asOf, overrides, weightKg } = context;
  const { horizonMonths, seed, samples } = options;
  const notices: LedgerNotice[] = [];
  const intakeMgPerDay = intake.netMg / intake.windowDays;
  const basal = resolveAssumption('basal-iron-loss-mg-per-day', overrides);
  const currentPeriods = periodsActiveOn(caseFile.chelationPeriods, asOf);
  const measuredDrugs = new Set(basis.drugs);
  const scaleOf = (period: ChelationPeriod) => basisScaleOf(basis, period.drug);
  const measuredRatio = basis.ratio;
  const filmCoatedFactor = resolveAssumption('deferasirox-film-coated-factor', overrides).value;
  // A current period's removal uses the adherence the account used (dispensings where recorded); a proposed regimen's, its entered estimate.
  const adherenceOf = (period: ChelationPeriod) => (currentPeriods.includes(period) ? context.normalised.adherence.get(period.id)?.used : undefined) ?? period.adherence;
  const removalOf = (periods: readonly ChelationPeriod[]) => (weight: number) =>
    periods.reduce(
      (sum, period) =>
        sum +
        periodRemovalMgPerDay(period, weight, resolveAssumption(efficiencyAssumptionOf[period.drug], overrides).value, filmCoatedFactor, adherenceOf(period)) * scaleOf(period),
      0,
    );
  const basisOf = (periods: readonly ChelationPeriod[]) => (periods.some((period) => measuredDrugs.has(period.drug)) ? ('measured' as const) : ('published' as const));
  const proposedRegimens = options.projectProposed ? caseFile.proposedRegimens : [];
  const periodsOfScenario = new Map<string, readonly ChelationPeriod[]>([
    ['current', currentPeriods],
    ...proposedRegimens.map((regimen) => [regimen.id, regimen.periods] as const),
  ]);
  const scenarios = [
    {
      id: 'current',
      name: currentPeriods.length > 0 ? `current regimen (${currentPeriods.map(describePeriod).join(' + ')})` : 'current: no chelation',
      periods: currentPeriods,
    },
    ...proposedRegimens.map((regimen) => ({ id: regimen.id, name: regimen.name, periods: regimen.periods })),
  ].map(({ id, name, periods }) => ({ id, name, removalMgPerDay: removalOf(periods), efficiencyBasis: basisOf(periods), efficiencyScale: 1 }));
  const floor = resolveAssumption('projection-floor-lic-mg-per-g-dry', overrides);
  const share = resolveAssumption('projection-burden-share', overrides);
  const burdenShare = options.model === 'constant-rate' ? 0 : share.value;
  const growth = growthTrendOf(context.normalised.input.weights, asOf, ageYears);
  if (growth.gainKgPerYear > 0 || growth.growthDays > 0) notices.push({ severity: 'information', text: growth.statement });
  const startBodyIronMg = Math.max(0, bodyIron.bodyIronMg);
  const projected = projectScenarios({
    asOf,
    startBodyIronMg,
    weightKg,
    intakeMgPerDay,
    basalLossMgPerDay: basal.value,
    horizonMonths,
    seed,
    samples,
    scenarios,
    model: options.model,
    floorLicMgPerGDry: floor.value,
    burdenShare,
    weightGainKgPerYear: growth.gainKgPerYear,
    growthDays: growth.growthDays,
    ...(bodyIron.anchorStoresMg !== null && bodyIron.anchorRelativeSd !== null ? { anchorStoresMg: bodyIron.anchorStoresMg, anchorRelativeSd: bodyIron.anchorRelativeSd } : {}),
  });
  const milestoneMonths = [6, 12, 24, horizonMonths].filter((months, index, all) => months <= horizonMonths && all.indexOf(months) === index);
  const issues: Issue[] = [];
  const projection: ProjectionSummary = {
      model: options.model,
      floorLicMgPerGDry: floor.value,
      basis,
      growth,
      horizonMonths,
      seed,
      samples,
      intakeMgPerDay,
      scenarios: projected.map((scenario) => ({
        ...scenario,
        milestones: milestoneMonths.map((monthsAhead) => {
          const point = scenario.months[monthsAhead]!;
          const periods = periodsOfScenario.get(scenario.id) ?? [];
          const run = runInternal(
            projectedLicFormula,
            {
              startBodyIronMg,
              weightKg,
              daysAhead: daysBetween(asOf, point.date),
              intakeMgPerDay: Math.max(-500, intakeMgPerDay),
              removalMgPerDay: scenario.removalMgPerDay,
              weightGainKgPerYear: growth.gainKgPerYear,
              growthDays: growth.growthDays,
              ...(options.model === 'constant-rate' ? { burdenShare: 0 } : {}),
            },
            {
              overrides,
              origins: {
                startBodyIronMg: { kind: 'computed', derivation: bodyIron.derivation! },
                weightGainKgPerYear: { kind: 'record', description: growth.statement, refs: [] },
                growthDays: { kind: 'record', description: growth.growthDays > 0 ? 'days from the review date to age 18' : 'adult: no growth', refs: [] },
                ...(options.model === 'constant-rate'
                  ? { burdenShare: { kind: 'record' as const, description: 'constant-rate model chosen (--model constant-rate): removal held at today’s rate until the floor', refs: [] } }
                  : {}),
                intakeMgPerDay: {
                  kind: 'record',
                  description: `net transfusional iron ${intake.windowFrom} to ${asOf} ÷ ${intake.windowDays} days`,
                  refs: [],
                  assumptions: [assumptionUse(resolveAssumption('iron-per-ml-red-cells', overrides))],
                },
                removalMgPerDay: {
                  kind: 'record',
                  description:
                    scenario.efficiencyBasis === 'measured'
                      ? `${options.model} model calibrated on the removal of ${scenario.name} on the review date: ${[...measuredDrugs].join(' and ')} × measured ÷ expected ${measuredRatio.toFixed(2)}`
                      : `${options.model} model calibrated on the removal of ${scenario.name} on the review date at the published efficiencies`,
                  refs: periods.map((period) => period.id),
                  assumptions: efficiencyUsesOf(periods, overrides),
                },
              },
            },
          );
          if (!run.ok) issues.push(...run.issues);
          return { monthsAhead, derivation: run.ok ? run.value.derivation : null! };
        }),
      })),
  };
  return issues.length > 0 ? fail(...issues) : ok({ projection, notices });
}
