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
import type { ResponseSummary } from './responseSummary';
import { assumptionUse, efficiencyUsesOf, periodsBetween, type ReviewContext } from './reviewContext';

export interface ProjectionSummary {
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
  lastResponse: ResponseSummary | undefined,
  options: ProjectionOptions,
): Result<{ readonly projection: ProjectionSummary | null; readonly notices: readonly LedgerNotice[] }> {
  if (bodyIron.bodyIronMg === null) return ok({ projection: null, notices: [] });
  const { caseFile, asOf, overrides, weightKg } = context;
  const { horizonMonths, seed, samples } = options;
  const notices: LedgerNotice[] = [];
  const intakeMgPerDay = intake.netMg / intake.windowDays;
  const basal = resolveAssumption('basal-iron-loss-mg-per-day', overrides);
  const currentPeriods = periodsActiveOn(caseFile.chelationPeriods, asOf);
  const usableResponse = lastResponse && lastResponse.caveats.length === 0 && lastResponse.measuredToExpectedRatio !== null ? lastResponse : undefined;
  // The measured ÷ expected ratio belongs to the drugs of the regimen it was measured on;
  // a scenario's periods of those drugs are scaled by it (it reflects adherence and this
  // patient's response), other drugs use the published efficiency.
  const measuredDrugs = new Set(usableResponse ? periodsBetween(context, usableResponse.fromDate, usableResponse.toDate).map((period) => period.drug) : []);
  const measuredRatio = usableResponse ? Math.max(0, usableResponse.measuredToExpectedRatio!) : 1;
  const scaleOf = (period: ChelationPeriod) => (measuredDrugs.has(period.drug) ? measuredRatio : 1);
  const filmCoatedFactor = resolveAssumption('deferasirox-film-coated-factor', overrides).value;
  const removalOf = (periods: readonly ChelationPeriod[]) => (weight: number) =>
    periods.reduce(
      (sum, period) =>
        sum + periodRemovalMgPerDay(period, weight, resolveAssumption(efficiencyAssumptionOf[period.drug], overrides).value, filmCoatedFactor) * scaleOf(period),
      0,
    );
  const basisOf = (periods: readonly ChelationPeriod[]) => (periods.some((period) => measuredDrugs.has(period.drug)) ? ('measured' as const) : ('published' as const));
  const periodsOfScenario = new Map<string, readonly ChelationPeriod[]>([
    ['current', currentPeriods],
    ...caseFile.proposedRegimens.map((regimen) => [regimen.id, regimen.periods] as const),
  ]);
  const scenarios = [
    {
      id: 'current',
      name: currentPeriods.length > 0 ? `current regimen (${currentPeriods.map(describePeriod).join(' + ')})` : 'current: no chelation',
      periods: currentPeriods,
    },
    ...caseFile.proposedRegimens.map((regimen) => ({ id: regimen.id, name: regimen.name, periods: regimen.periods })),
  ].map(({ id, name, periods }) => ({ id, name, removalMgPerDay: removalOf(periods), efficiencyBasis: basisOf(periods), efficiencyScale: 1 }));
  if (usableResponse && measuredDrugs.size > 0) {
    notices.push({
      severity: 'information',
      text: `Projections scale ${[...measuredDrugs].join(' and ')} by the removal measured between the LIC results of ${usableResponse.fromDate} and ${usableResponse.toDate} (${Math.round(measuredRatio * 100)} % of the published expectation, whether from dose response or adherence); other drugs use the published efficiencies.`,
    });
  }
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
  });
  const milestoneMonths = [6, 12, 24, horizonMonths].filter((months, index, all) => months <= horizonMonths && all.indexOf(months) === index);
  const issues: Issue[] = [];
  const projection: ProjectionSummary = {
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
              days: daysBetween(asOf, point.date),
              intakeMgPerDay: Math.max(-500, intakeMgPerDay),
              removalMgPerDay: scenario.removalMgPerDay,
            },
            {
              overrides,
              origins: {
                startBodyIronMg: { kind: 'computed', derivation: bodyIron.derivation! },
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
                      ? `expected removal of ${scenario.name}, ${[...measuredDrugs].join(' and ')} × measured ÷ expected ${measuredRatio.toFixed(2)}`
                      : `expected removal of ${scenario.name} at the published efficiencies`,
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
