import { resolveAssumption, type ResolvedAssumption } from '../assumptions';
import type { IsoDate } from '../dates/isoDate';
import type { Case } from '../model/caseFile';
import { periodsActiveOn } from '../model/periodsActiveOn';
import { checkReviewDate } from '../model/reviewWindow';
import { ageOnDate } from '../patient/ageOnDate';
import { fail, issue, ok, type Result } from '../result';
import { bodyIronOnDate, type BodyIronSummary } from './bodyIronOnDate';
import { caseToLedgerInput, type LedgerNotice } from './caseToLedger';
import { efficiencyBasisOf } from './efficiencyBasis';
import { projectionModels, type ProjectionModel } from './removalModel';
import { ferritinSummary, type FerritinSummary } from './ferritinSummary';
import { intakeSummary, type IntakeSummary } from './intakeSummary';
import { computeIronAccount, type MonthOfAccount } from './ironAccount';
import { projectionSummary, type ProjectionSummary } from './projectionSummary';
import { regimenSummary, type RegimenSummary } from './regimenSummary';
import { responseSummaries, type ResponseSummary } from './responseSummary';
import type { ReviewContext } from './reviewContext';

export type { RegimenSummary } from './regimenSummary';

export interface ComputeOptions {
  /** Projection horizon, months (1–120; default 24). */
  readonly horizonMonths?: number;
  /** Seed of the projection band (default 1). */
  readonly seed?: number;
  /** Monte Carlo samples for the band (default 500). */
  readonly samples?: number;
  /** Ferritin trend window, months before the review date (default 12). */
  readonly ferritinWindowMonths?: number;
  /** Projection model (default 'burden-dependent'; 'constant-rate' for comparison). */
  readonly model?: ProjectionModel;
  /** Project the case's proposed regimens beside the current one (default true; false: the current regimen only). */
  readonly projectProposed?: boolean;
}

export interface CaseResults {
  readonly asOf: IsoDate;
  readonly patient: {
    readonly label: string;
    readonly ageYears: number | null;
    readonly weightKg: number;
    readonly diagnosisGroup: string;
  };
  readonly intake: IntakeSummary;
  readonly months: readonly MonthOfAccount[];
  readonly bodyIron: BodyIronSummary;
  readonly currentRegimens: readonly RegimenSummary[];
  readonly responses: readonly ResponseSummary[];
  readonly ferritin: FerritinSummary;
  readonly projection: ProjectionSummary | null;
  readonly notices: readonly LedgerNotice[];
  readonly assumptions: readonly ResolvedAssumption[];
}

/**
 * The whole iron review of one case on a review date: intake over the
 * trailing year (intakeSummary.ts), the month-by-month account
 * (ironAccount.ts), the body iron estimate (bodyIronOnDate.ts), the expected
 * removal of the current regimens (regimenSummary.ts), the measured response
 * between LIC results (responseSummary.ts), the ferritin trend
 * (ferritinSummary.ts), and projections for the current and proposed
 * regimens with a seeded band (projectionSummary.ts). Descriptive only:
 * every number is for review by the prescriber.
 *
 * @param caseFile - a parsed case (core/model parseCase)
 * @param asOf - the review date 'YYYY-MM-DD' (core never reads the clock)
 * @returns the results, or issues when the case lacks what the account needs (a weight), the review
 *   date is outside the case's window (core/model/reviewWindow.ts), or a total leaves the range of
 *   the formula that reports it (never a throw)
 */
export function computeCase(caseFile: Case, asOf: IsoDate, options: ComputeOptions = {}): Result<CaseResults> {
  const horizonMonths = options.horizonMonths ?? 24;
  const seed = options.seed ?? 1;
  const samples = options.samples ?? 500;
  if (caseFile.patient.weights.length === 0) {
    return fail(issue('required', ['patient', 'weights'], 'At least one dated weight is needed to compute the iron account (kg, plausible 2–200).'));
  }
  if (options.model !== undefined && !projectionModels.includes(options.model)) {
    return fail(issue('unknown_choice', ['model'], `Projection model "${options.model}" is not one of ${projectionModels.join(', ')}.`));
  }
  if (!Number.isInteger(horizonMonths) || horizonMonths < 1 || horizonMonths > 120) {
    return fail(issue('out_of_range', ['horizonMonths'], `Projection horizon ${horizonMonths} months is outside 1–120 months.`));
  }
  const window = checkReviewDate(caseFile, asOf);
  if (!window.ok) return window;
  const normalised = caseToLedgerInput(caseFile, asOf);
  const account = computeIronAccount(normalised.input);
  const lastIndex = account.daily.transfusedInMg.length - 1;
  const weightKg = account.daily.weightKg[lastIndex]!;
  const context: ReviewContext = { caseFile, asOf, overrides: caseFile.assumptionOverrides, normalised, account, lastIndex, weightKg };

  const intake = intakeSummary(context);
  if (!intake.ok) return intake;
  const responseRun = responseSummaries(context);
  if (!responseRun.ok) return responseRun;
  const responses = responseRun.value;
  const lastResponse = responses[responses.length - 1];
  const basis = efficiencyBasisOf(context, responses);
  const bodyIron = bodyIronOnDate(context, basis, { seed, samples });
  const currentRegimens: RegimenSummary[] = [];
  for (const period of periodsActiveOn(caseFile.chelationPeriods, asOf)) {
    const regimen = regimenSummary(period, weightKg, context.overrides, normalised.adherence.get(period.id)!);
    if (!regimen.ok) return regimen;
    currentRegimens.push(regimen.value);
  }
  const ferritin = ferritinSummary(context, options.ferritinWindowMonths ?? 12, lastResponse);
  const ageYears = ageOnDate(caseFile.patient.age, asOf);
  const model = options.model ?? 'burden-dependent';
  const projectionRun = projectionSummary(context, intake.value.intake, bodyIron.bodyIron, basis, ageYears, { horizonMonths, seed, samples, model, projectProposed: options.projectProposed ?? true });
  if (!projectionRun.ok) return projectionRun;
  const projection = projectionRun.value;
  // The projection's and the basis' own assumptions, listed with the conversion's.
  const modelAssumptionIds = [
    'measured-response-regimen-share',
    ...(bodyIron.bodyIron.lastMeasured ? ['projection-floor-lic-mg-per-g-dry', 'projection-burden-share', bodyIron.bodyIron.lastMeasured.method === 'biopsy' ? 'lic-measurement-sd-biopsy' : 'lic-measurement-sd-mri'] : []),
  ];

  return ok({
    asOf,
    patient: { label: caseFile.patient.label, ageYears, weightKg, diagnosisGroup: caseFile.patient.diagnosisGroup },
    intake: intake.value.intake,
    months: account.months,
    bodyIron: bodyIron.bodyIron,
    currentRegimens,
    responses,
    ferritin: ferritin.ferritin,
    projection: projection.projection,
    notices: [...normalised.notices, ...intake.value.notices, ...bodyIron.notices, ...ferritin.notices, ...projection.notices],
    assumptions: [...normalised.assumptions, ...modelAssumptionIds.map((id) => resolveAssumption(id, context.overrides))],
  });
}
