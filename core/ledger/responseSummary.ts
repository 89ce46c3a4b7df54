import { resolveAssumption } from '../assumptions';
import type { Derivation } from '../formulas/derivation';
import { runInternal } from '../formulas/run';
import { fail, ok, type Issue, type Result } from '../result';
import { efficiencyAssumptionOf } from './caseToLedger';
import { measuredChelation } from './formulas';
import { sumDaily } from './ironAccount';
import { measuredResponses, type MeasuredResponse } from './measuredResponse';
import { assumptionUse, dayIndexOf, efficiencyUsesOf, periodsBetween, transfusionalIronBetween, type ReviewContext } from './reviewContext';

export type ResponseSummary = MeasuredResponse & {
  readonly derivation: Derivation;
  /**
   * When one drug was on record through the interval: its published efficiency × measured ÷ expected,
   * the share of the dose that was in effect excreted as iron complex. Null otherwise.
   */
  readonly effectiveEfficiency: { readonly drug: string; readonly published: number; readonly effective: number } | null;
};

/**
 * The chelation response measured between each pair of consecutive LIC
 * results (the balance method, see measuredResponse.ts), each with its
 * derivation and, when one drug ran through the interval, the effective
 * efficiency it implies.
 *
 * @param context - the review (see reviewContext.ts)
 * @returns oldest interval first, or the issue of a total outside its formula's range
 */
export function responseSummaries(context: ReviewContext): Result<ResponseSummary[]> {
  const { account, normalised, overrides } = context;
  const basalAssumption = assumptionUse(resolveAssumption('basal-iron-loss-mg-per-day', overrides));
  const issues: Issue[] = [];
  const regimenShare = resolveAssumption('measured-response-regimen-share', overrides).value;
  const summaries = measuredResponses(account, normalised.input.licMeasurements, normalised.input.chelation, regimenShare).flatMap((response) => {
    const fromIndex = dayIndexOf(context, response.fromDate);
    const toIndex = dayIndexOf(context, response.toDate);
    const intervalIron = transfusionalIronBetween(context, response.fromDate, response.toDate);
    if (!intervalIron.ok) {
      issues.push(...intervalIron.issues);
      return [];
    }
    const intervalPeriods = periodsBetween(context, response.fromDate, response.toDate);
    const measured = runInternal(measuredChelation, {
      intakeMg: intervalIron.value.outputs.netMg,
      fromLicMgPerGDry: response.fromLicMgPerGDry,
      toLicMgPerGDry: response.toLicMgPerGDry,
      fromWeightKg: account.daily.weightKg[fromIndex]!,
      toWeightKg: account.daily.weightKg[toIndex]!,
      basalLossMg: sumDaily(account.daily.basalLossMg, fromIndex + 1, toIndex),
      intervalDays: response.days,
      meanWeightKg: response.meanWeightKg,
      expectedMg: response.expectedChelationMg,
    }, {
      origins: {
        intakeMg: { kind: 'computed', derivation: intervalIron.value.derivation },
        fromLicMgPerGDry: { kind: 'record', description: `LIC ${response.fromDate}`, refs: [] },
        toLicMgPerGDry: { kind: 'record', description: `LIC ${response.toDate}`, refs: [] },
        basalLossMg: { kind: 'record', description: `basal loss × ${response.days} days`, refs: [], assumptions: [basalAssumption] },
        expectedMg: {
          kind: 'record',
          description: 'expected removal of the regimens on record in the interval',
          refs: [],
          assumptions: efficiencyUsesOf(intervalPeriods, overrides),
        },
      },
    });
    if (!measured.ok) {
      issues.push(...measured.issues);
      return [];
    }
    const run = measured.value;
    const drugs = new Set(intervalPeriods.map((period) => period.drug));
    const [onlyDrug] = [...drugs];
    const effectiveEfficiency =
      drugs.size === 1 && onlyDrug !== undefined && response.measuredToExpectedRatio !== null
        ? (() => {
            const published = resolveAssumption(efficiencyAssumptionOf[onlyDrug], overrides).value;
            return { drug: onlyDrug, published, effective: published * response.measuredToExpectedRatio };
          })()
        : null;
    return [{ ...response, derivation: run.derivation, effectiveEfficiency }];
  });
  return issues.length > 0 ? fail(...issues) : ok(summaries);
}
