import { resolveAssumption, type ResolvedAssumption } from '../assumptions';
import { chelatorIdOf, describePeriod, efficiencyAssumptionOf, caseToLedgerInput, periodRemovalMgPerDay, type LedgerNotice } from './caseToLedger';
import { expectedExcretion } from '../chelators/formulas';
import { addDaysIso, daysBetween, type IsoDate } from '../dates/isoDate';
import type { AssumptionUse, Derivation } from '../formulas/derivation';
import { runTrusted } from '../formulas/run';
import { ironIntakeRate } from '../iron/formulas';
import { intakeBand } from '../iron/intakeBand';
import type { Case, ChelationPeriod } from '../model/caseFile';
import { ageInDecimalYears } from '../patient/age';
import { fail, issue, ok, type Result } from '../result';
import type { MgPerKgPerDay } from '../units/quantity';
import { bodyIronCarriedForward, measuredChelation, netIronBalance, netTransfusionalIronFormula, projectedLicFormula } from './formulas';
import { computeIronAccount, sumDaily, type MonthOfAccount } from './ironAccount';
import { logLinearTrend, type LogLinearTrend } from './logLinearTrend';
import { measuredResponses, type MeasuredResponse } from './measuredResponse';
import { projectScenarios, type ScenarioProjection } from './projection';

export interface ComputeOptions {
  /** Projection horizon, months (1–120; default 24). */
  readonly horizonMonths?: number;
  /** Seed of the projection band (default 1). */
  readonly seed?: number;
  /** Monte Carlo samples for the band (default 500). */
  readonly samples?: number;
  /** Ferritin trend window, months before the review date (default 12). */
  readonly ferritinWindowMonths?: number;
}

export interface RegimenSummary {
  readonly periodId: string;
  readonly label: string;
  readonly drug: ChelationPeriod['drug'];
  readonly doseMgPerKgPerDay: number;
  readonly expectedRemovalMgPerDay: number;
  readonly expectedRemovalMgPerKgPerDay: number;
  readonly derivation: Derivation;
}

export interface CaseResults {
  readonly asOf: IsoDate;
  readonly patient: {
    readonly label: string;
    readonly ageYears: number | null;
    readonly weightKg: number;
    readonly diagnosisGroup: string;
  };
  readonly intake: {
    readonly windowFrom: IsoDate;
    readonly windowDays: number;
    readonly transfusedMg: number;
    readonly removedWithBloodMg: number;
    readonly netMg: number;
    readonly mgPerKgPerDay: number;
    readonly band: string;
    readonly cumulativeNetMg: number;
    readonly cumulativeSince: IsoDate;
    readonly derivation: Derivation;
  };
  readonly months: readonly MonthOfAccount[];
  readonly bodyIron: {
    readonly lastMeasured: { readonly date: IsoDate; readonly licMgPerGDry: number; readonly method: string } | null;
    readonly bodyIronMg: number | null;
    readonly licMgPerGDry: number | null;
    readonly derivation: Derivation | null;
  };
  readonly currentRegimens: readonly RegimenSummary[];
  readonly responses: readonly (MeasuredResponse & {
    readonly derivation: Derivation;
    /**
     * When one drug was on record through the interval: its published efficiency × measured ÷ expected,
     * the share of the dose that was in effect excreted as iron complex. Null otherwise.
     */
    readonly effectiveEfficiency: { readonly drug: string; readonly published: number; readonly effective: number } | null;
  })[];
  readonly ferritin: {
    readonly trend: LogLinearTrend | null;
    readonly windowFrom: IsoDate;
    readonly latest: { readonly date: IsoDate; readonly valueUgPerL: number } | null;
    readonly discordantWithLic: boolean;
    readonly note: string | null;
  };
  readonly projection: {
    readonly horizonMonths: number;
    readonly seed: number;
    readonly samples: number;
    readonly intakeMgPerDay: number;
    readonly scenarios: readonly (ScenarioProjection & { readonly milestones: readonly { readonly monthsAhead: number; readonly derivation: Derivation }[] })[];
  } | null;
  readonly notices: readonly LedgerNotice[];
  readonly assumptions: readonly ResolvedAssumption[];
}

const trailingDays = 365;

function assumptionUse(assumption: ResolvedAssumption): AssumptionUse {
  return {
    assumptionId: assumption.id,
    value: assumption.value,
    overridden: assumption.origin.overridden,
    ...(assumption.origin.reason !== undefined ? { reason: assumption.origin.reason } : {}),
    ...(assumption.origin.by !== undefined ? { by: assumption.origin.by } : {}),
  };
}

/**
 * The whole iron review of one case on a review date: intake over the
 * trailing year, the month-by-month account, the body iron estimate, the
 * expected removal of the current regimens, the measured response between LIC
 * results, the ferritin trend, and projections for the current and proposed
 * regimens with a seeded band. Descriptive only: every number is for review
 * by the prescriber.
 *
 * @param caseFile - a parsed case (core/model parseCase)
 * @param asOf - the review date 'YYYY-MM-DD' (core never reads the clock)
 * @returns the results, or issues when the case lacks what the account needs (a weight)
 */
export function computeCase(caseFile: Case, asOf: IsoDate, options: ComputeOptions = {}): Result<CaseResults> {
  const horizonMonths = options.horizonMonths ?? 24;
  const seed = options.seed ?? 1;
  const samples = options.samples ?? 500;
  if (caseFile.patient.weights.length === 0) {
    return fail(issue('required', ['patient', 'weights'], 'At least one dated weight is needed to compute the iron account (kg, plausible 2–200).'));
  }
  if (!Number.isInteger(horizonMonths) || horizonMonths < 1 || horizonMonths > 120) {
    return fail(issue('out_of_range', ['horizonMonths'], `Projection horizon ${horizonMonths} months is outside 1–120 months.`));
  }
  const overrides = caseFile.assumptionOverrides;
  const normalised = caseToLedgerInput(caseFile, asOf);
  const notices: LedgerNotice[] = [...normalised.notices];
  const account = computeIronAccount(normalised.input);
    const dayCount = account.daily.transfusedInMg.length;
  const lastIndex = dayCount - 1;
  const weightKg = account.daily.weightKg[lastIndex]!;
  const efficiencyUsesOf = (periods: readonly ChelationPeriod[]): AssumptionUse[] => {
    const ids = new Set(periods.map((period) => efficiencyAssumptionOf[period.drug] as string));
    if (periods.some((period) => period.drug === 'deferasirox' && period.formulation === 'film-coated-tablet')) ids.add('deferasirox-film-coated-factor');
    return [...ids].map((id) => assumptionUse(resolveAssumption(id, overrides)));
  };
  /** The assumptions behind the expected removal of the periods on record after `afterDate` up to `toDate`. */
  const chelationAssumptionsBetween = (afterDate: IsoDate, toDate: IsoDate) =>
    efficiencyUsesOf(caseFile.chelationPeriods.filter((period) => period.startDate <= toDate && (period.endDate === null || period.endDate > afterDate)));
  const basalAssumption = assumptionUse(resolveAssumption('basal-iron-loss-mg-per-day', overrides));

  /** Net transfusional iron of the records dated after `afterDate` up to `toDate`, with its derivation. */
  const transfusionalIron = (afterDate: IsoDate, toDate: IsoDate) => {
    const inWindow = normalised.input.movements.filter((it) => it.date > afterDate && it.date <= toDate);
    return runTrusted(
      netTransfusionalIronFormula,
      {
        redCellsInMl: inWindow.reduce((sum, it) => sum + (it.redCellsInMl ?? 0), 0),
        redCellsOutMl: inWindow.reduce((sum, it) => sum + (it.redCellsOutMl ?? 0), 0),
      },
      {
        overrides,
        origins: {
          redCellsInMl: { kind: 'record', description: `Σ volume × haematocrit of ${inWindow.length} record(s) ${addDaysIso(afterDate, 1)} to ${toDate}`, refs: inWindow.map((it) => it.ref) },
          redCellsOutMl: { kind: 'record', description: `Σ volume removed × patient haematocrit, ${addDaysIso(afterDate, 1)} to ${toDate}`, refs: inWindow.filter((it) => (it.redCellsOutMl ?? 0) > 0).map((it) => it.ref) },
        },
      },
    );
  };

  // Intake over the trailing year (or the record, if shorter).
  const windowDays = Math.min(trailingDays, dayCount);
  const fromIndex = dayCount - windowDays;
  const transfusedMg = sumDaily(account.daily.transfusedInMg, fromIndex, lastIndex);
  const removedWithBloodMg = sumDaily(account.daily.removedWithBloodMg, fromIndex, lastIndex);
  const windowFrom = addDaysIso(account.firstDay, fromIndex);
  const netInWindow = transfusedMg - removedWithBloodMg;
  if (windowDays < trailingDays) {
    notices.push({ severity: 'information', text: `The record covers only ${windowDays} days before the review date: the intake is averaged over those days.` });
  }
  const windowIron = transfusionalIron(addDaysIso(windowFrom, -1), asOf);
  const intakeRun = runTrusted(
    ironIntakeRate,
    { totalIronMg: Math.max(0, windowIron.outputs.netMg), weightKg, windowDays },
    {
      origins: {
        totalIronMg: { kind: 'computed', derivation: windowIron.derivation },
        weightKg: { kind: 'record', description: `latest weight on or before ${asOf}`, refs: [] },
        windowDays: { kind: 'record', description: `days ${windowFrom} to ${asOf}`, refs: [] },
      },
    },
  );
  if (netInWindow < 0) {
    notices.push({ severity: 'information', text: `More iron left with removed blood than came in over the trailing year (net ${Math.round(netInWindow)} mg); the intake rate is shown as 0.` });
  }
  const cumulativeNetMg =
    sumDaily(account.daily.transfusedInMg, 0, lastIndex) - sumDaily(account.daily.removedWithBloodMg, 0, lastIndex);

  // Body iron on the review date, carried forward from the last measured LIC.
  const sortedLics = [...normalised.input.licMeasurements].sort((a, b) => a.date.localeCompare(b.date));
  const lastLic = sortedLics[sortedLics.length - 1];
  let bodyIron: CaseResults['bodyIron'] = { lastMeasured: null, bodyIronMg: null, licMgPerGDry: null, derivation: null };
  if (lastLic) {
    const anchorIndex = daysBetween(account.firstDay, lastLic.date);
    const anchorWeight = account.daily.weightKg[anchorIndex]!;
    const sameDay = sortedLics.filter((it) => it.date === lastLic.date);
    const anchorLic = sameDay.reduce((sum, it) => sum + it.licMgPerGDry, 0) / sameDay.length;
    const sinceIron = transfusionalIron(lastLic.date, asOf);
    const netSince = runTrusted(
      netIronBalance,
      {
        transfusionalNetMg: sinceIron.outputs.netMg,
        chelationRemovalMg: sumDaily(account.daily.chelationOutMg, anchorIndex + 1, lastIndex),
        days: lastIndex - anchorIndex,
      },
      {
        overrides,
        origins: {
          transfusionalNetMg: { kind: 'computed', derivation: sinceIron.derivation },
          chelationRemovalMg: {
            kind: 'record',
            description: `expected removal of the regimens on record ${addDaysIso(lastLic.date, 1)} to ${asOf}`,
            refs: normalised.input.chelation.filter((it) => it.start <= asOf && (it.end === null || it.end > lastLic.date)).map((it) => it.id),
            assumptions: chelationAssumptionsBetween(lastLic.date, asOf),
          },
          days: { kind: 'record', description: `days ${addDaysIso(lastLic.date, 1)} to ${asOf}`, refs: [] },
        },
      },
    );
    const carried = runTrusted(
      bodyIronCarriedForward,
      { anchorLicMgPerGDry: anchorLic, anchorWeightKg: anchorWeight, netSinceMg: netSince.outputs.netMg, weightNowKg: weightKg },
      {
        origins: {
          anchorLicMgPerGDry: { kind: 'record', description: `LIC ${lastLic.date} (${lastLic.method})`, refs: sameDay.map((it) => it.ref) },
          anchorWeightKg: { kind: 'record', description: `weight on ${lastLic.date}`, refs: [] },
          netSinceMg: { kind: 'computed', derivation: netSince.derivation },
          weightNowKg: { kind: 'record', description: `latest weight on or before ${asOf}`, refs: [] },
        },
      },
    );
    bodyIron = {
      lastMeasured: { date: lastLic.date, licMgPerGDry: anchorLic, method: lastLic.method },
      bodyIronMg: carried.outputs.bodyIronMg,
      licMgPerGDry: carried.outputs.licMgPerGDry,
      derivation: carried.derivation,
    };
    if (carried.outputs.bodyIronMg < 0) {
      notices.push({ severity: 'review', text: 'The carried-forward body iron falls below zero: the expected removal exceeds what the record supports. Review the efficiency and adherence assumptions.' });
    }
  } else {
    notices.push({ severity: 'review', text: 'No liver iron result on record: body iron, LIC estimates and projections need at least one.' });
  }

  // Current regimens: expected removal at today's weight.
  const currentRegimens = caseFile.chelationPeriods
    .filter((period) => period.startDate <= asOf && (period.endDate === null || period.endDate >= asOf))
    .map((period) => regimenSummary(period, weightKg, overrides));

  // Measured response between consecutive LIC results.
  const responses = measuredResponses(account, normalised.input.licMeasurements, normalised.input.chelation).map((response) => {
    const intervalIron = transfusionalIron(response.fromDate, response.toDate);
    const run = runTrusted(measuredChelation, {
      intakeMg: intervalIron.outputs.netMg,
      fromLicMgPerGDry: response.fromLicMgPerGDry,
      toLicMgPerGDry: response.toLicMgPerGDry,
      fromWeightKg: account.daily.weightKg[daysBetween(account.firstDay, response.fromDate)]!,
      toWeightKg: account.daily.weightKg[daysBetween(account.firstDay, response.toDate)]!,
      basalLossMg: sumDaily(account.daily.basalLossMg, daysBetween(account.firstDay, response.fromDate) + 1, daysBetween(account.firstDay, response.toDate)),
      days: response.days,
      meanWeightKg: response.meanWeightKg,
      expectedMg: response.expectedChelationMg,
    }, {
      origins: {
        intakeMg: { kind: 'computed', derivation: intervalIron.derivation },
        fromLicMgPerGDry: { kind: 'record', description: `LIC ${response.fromDate}`, refs: [] },
        toLicMgPerGDry: { kind: 'record', description: `LIC ${response.toDate}`, refs: [] },
        basalLossMg: { kind: 'record', description: `basal loss × ${response.days} days`, refs: [], assumptions: [basalAssumption] },
        expectedMg: {
          kind: 'record',
          description: 'expected removal of the regimens on record in the interval',
          refs: [],
          assumptions: chelationAssumptionsBetween(response.fromDate, response.toDate),
        },
      },
    });
    const drugs = new Set(
      caseFile.chelationPeriods
        .filter((period) => period.startDate <= response.toDate && (period.endDate === null || period.endDate > response.fromDate))
        .map((period) => period.drug),
    );
    const [onlyDrug] = [...drugs];
    const effectiveEfficiency =
      drugs.size === 1 && onlyDrug !== undefined && response.measuredToExpectedRatio !== null
        ? (() => {
            const published = resolveAssumption(efficiencyAssumptionOf[onlyDrug], overrides).value;
            return { drug: onlyDrug, published, effective: published * response.measuredToExpectedRatio };
          })()
        : null;
    return { ...response, derivation: run.derivation, effectiveEfficiency };
  });

  // Ferritin trend over the window.
  const ferritinWindowFrom = addDaysIso(asOf, -Math.round((options.ferritinWindowMonths ?? 12) * 30.436875));
  const ferritinPoints = caseFile.results
    .filter((it) => it.kind === 'ferritin' && it.date <= asOf)
    .map((it) => ({ date: it.date, value: it.measured.value }))
    .sort((a, b) => a.date.localeCompare(b.date));
  const trend = logLinearTrend(ferritinPoints.filter((it) => it.date >= ferritinWindowFrom));
  const latestFerritin = ferritinPoints[ferritinPoints.length - 1];
  const lastResponse = responses[responses.length - 1];
  const licDirection = lastResponse ? Math.sign(lastResponse.toLicMgPerGDry - lastResponse.fromLicMgPerGDry) : 0;
  const ferritinDirection = trend ? (trend.direction === 'rising' ? 1 : trend.direction === 'falling' ? -1 : 0) : 0;
  const discordantWithLic = licDirection !== 0 && ferritinDirection !== 0 && licDirection !== ferritinDirection;
  let ferritinNote: string | null = null;
  if (caseFile.patient.diagnosisGroup === 'sickle-cell-disease') {
    ferritinNote = 'Ferritin is a poor marker of iron load in sickle cell disease (inflammation raises it); rely on liver iron.';
  }
  if (discordantWithLic) {
    notices.push({ severity: 'review', text: `Ferritin is ${trend!.direction} while the last LIC interval moved the other way: the two markers disagree; liver iron is the more direct measure.` });
  }

  // Projections.
  let projection: CaseResults['projection'] = null;
  if (bodyIron.bodyIronMg !== null) {
    const intakeMgPerDay = netInWindow / windowDays;
    const basal = resolveAssumption('basal-iron-loss-mg-per-day', overrides);
    const currentPeriods = caseFile.chelationPeriods.filter((period) => period.startDate <= asOf && (period.endDate === null || period.endDate >= asOf));
    const usableResponse = lastResponse && lastResponse.caveats.length === 0 && lastResponse.measuredToExpectedRatio !== null ? lastResponse : undefined;
    // The measured ÷ expected ratio belongs to the drugs of the regimen it was measured on;
    // a scenario's periods of those drugs are scaled by it (it reflects adherence and this
    // patient's response), other drugs use the published efficiency.
    const measuredDrugs = new Set(
      usableResponse
        ? caseFile.chelationPeriods
            .filter((period) => period.startDate <= usableResponse.toDate && (period.endDate === null || period.endDate >= usableResponse.fromDate))
            .map((period) => period.drug)
        : [],
    );
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
    const scenarios = [
      {
        id: 'current',
        name: currentPeriods.length > 0 ? `current regimen (${currentPeriods.map(describePeriod).join(' + ')})` : 'current: no chelation',
        removalMgPerDay: removalOf(currentPeriods),
        efficiencyBasis: basisOf(currentPeriods),
        efficiencyScale: 1,
      },
      ...caseFile.proposedRegimens.map((regimen) => ({
        id: regimen.id,
        name: regimen.name,
        removalMgPerDay: removalOf(regimen.periods),
        efficiencyBasis: basisOf(regimen.periods),
        efficiencyScale: 1,
      })),
    ];
    const periodsOfScenario = new Map<string, readonly ChelationPeriod[]>([
      ['current', currentPeriods],
      ...caseFile.proposedRegimens.map((regimen) => [regimen.id, regimen.periods] as const),
    ]);
    if (usableResponse && measuredDrugs.size > 0) {
      notices.push({
        severity: 'information',
        text: `Projections scale ${[...measuredDrugs].join(' and ')} by the removal measured between the LIC results of ${usableResponse.fromDate} and ${usableResponse.toDate} (${Math.round(measuredRatio * 100)} % of the published expectation, whether from dose response or adherence); other drugs use the published efficiencies.`,
      });
    }
    const projected = projectScenarios({
      asOf,
      startBodyIronMg: Math.max(0, bodyIron.bodyIronMg),
      weightKg,
      intakeMgPerDay,
      basalLossMgPerDay: basal.value,
      horizonMonths,
      seed,
      samples,
      scenarios,
    });
    projection = {
      horizonMonths,
      seed,
      samples,
      intakeMgPerDay,
      scenarios: projected.map((scenario) => ({
        ...scenario,
        milestones: [6, 12, 24, horizonMonths]
          .filter((months, index, all) => months <= horizonMonths && all.indexOf(months) === index)
          .map((monthsAhead) => {
            const point = scenario.months[monthsAhead]!;
            const run = runTrusted(
              projectedLicFormula,
              {
                startBodyIronMg: Math.max(0, bodyIron.bodyIronMg!),
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
                    description: `net transfusional iron ${windowFrom} to ${asOf} ÷ ${windowDays} days`,
                    refs: [],
                    assumptions: [assumptionUse(resolveAssumption('iron-per-ml-red-cells', overrides))],
                  },
                  removalMgPerDay: {
                    kind: 'record',
                    description:
                      scenario.efficiencyBasis === 'measured'
                        ? `expected removal of ${scenario.name}, ${[...measuredDrugs].join(' and ')} × measured ÷ expected ${measuredRatio.toFixed(2)}`
                        : `expected removal of ${scenario.name} at the published efficiencies`,
                    refs: (periodsOfScenario.get(scenario.id) ?? []).map((period) => period.id),
                    assumptions: efficiencyUsesOf(periodsOfScenario.get(scenario.id) ?? []),
                  },
                },
              },
            );
            return { monthsAhead, derivation: run.derivation };
          }),
      })),
    };
  }

  const age = ageOn(caseFile, asOf);
  return ok({
    asOf,
    patient: { label: caseFile.patient.label, ageYears: age, weightKg, diagnosisGroup: caseFile.patient.diagnosisGroup },
    intake: {
      windowFrom,
      windowDays,
      transfusedMg,
      removedWithBloodMg,
      netMg: netInWindow,
      mgPerKgPerDay: intakeRun.outputs.intakeMgPerKgPerDay,
      band: intakeBand(intakeRun.outputs.intakeMgPerKgPerDay as MgPerKgPerDay).label,
      cumulativeNetMg,
      cumulativeSince: account.firstDay,
      derivation: intakeRun.derivation,
    },
    months: account.months,
    bodyIron,
    currentRegimens,
    responses,
    ferritin: { trend, windowFrom: ferritinWindowFrom, latest: latestFerritin ? { date: latestFerritin.date, valueUgPerL: latestFerritin.value } : null, discordantWithLic, note: ferritinNote },
    projection,
    notices,
    assumptions: normalised.assumptions,
  });
}

function regimenSummary(period: ChelationPeriod, weightKg: number, overrides: Case['assumptionOverrides']): RegimenSummary {
  const perAdministrationMgPerKg = period.dose.unit === 'mg/kg' ? period.dose.value : period.dose.value / weightKg;
  const doseMgPerKgPerDay = perAdministrationMgPerKg * period.administrationsPerDay;
  const run = runTrusted(
    expectedExcretion,
    {
      chelator: chelatorIdOf(period),
      doseMgPerKgPerDosingDay: doseMgPerKgPerDay,
      weightKg,
      daysPerWeek: period.daysPerWeek,
      adherence: period.adherence,
    },
    {
      overrides,
      origins: {
        doseMgPerKgPerDosingDay: { kind: 'record', description: `${period.id}: ${describePeriod(period)}`, refs: [period.id] },
        weightKg: { kind: 'record', description: 'latest weight', refs: [] },
        daysPerWeek: { kind: 'record', description: period.id, refs: [period.id] },
        adherence: { kind: 'record', description: `${period.id}: estimated adherence${period.adherenceNote ? ` (${period.adherenceNote})` : ''}`, refs: [period.id] },
      },
    },
  );
  return {
    periodId: period.id,
    label: describePeriod(period),
    drug: period.drug,
    doseMgPerKgPerDay,
    expectedRemovalMgPerDay: run.outputs.excretionMgPerDay,
    expectedRemovalMgPerKgPerDay: run.outputs.excretionMgPerKgPerDay,
    derivation: run.derivation,
  };
}

function ageOn(caseFile: Case, asOf: IsoDate): number | null {
  const age = caseFile.patient.age;
  if (age.kind === 'birth-date') {
    const years = ageInDecimalYears(age.birthDate, asOf);
    return years.ok ? years.value : null;
  }
  return age.years + daysBetween(age.onDate, asOf) / 365.2425;
}
