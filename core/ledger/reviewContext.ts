import { resolveAssumption, type ResolvedAssumption } from '../assumptions';
import { assumptionUseOf } from '../assumptions/origin';
import { addDaysIso, daysBetween, type IsoDate } from '../dates/isoDate';
import type { AssumptionUse } from '../formulas/derivation';
import { runInternal } from '../formulas/run';
import type { Case, ChelationPeriod } from '../model/caseFile';
import { periodsOverlapping } from '../model/periodsOverlapping';
import { efficiencyAssumptionOf, type NormalisedCase } from './caseToLedger';
import { netTransfusionalIronFormula } from './formulas';
import type { IronAccount } from './ironAccount';

/**
 * What every summary of one review reads: the case, the review date, the
 * normalised flows and the daily account built from them, and the weight on
 * the review date. Built once by computeCase and handed to each summary.
 */
export interface ReviewContext {
  readonly caseFile: Case;
  readonly asOf: IsoDate;
  readonly overrides: Case['assumptionOverrides'];
  readonly normalised: NormalisedCase;
  readonly account: IronAccount;
  /** Index of the review date in the daily series. */
  readonly lastIndex: number;
  /** Weight on the review date, kg. */
  readonly weightKg: number;
}

/** Index of a date in the account's daily series (0 = the account's first day). */
export function dayIndexOf(context: ReviewContext, date: IsoDate): number {
  return daysBetween(context.account.firstDay, date);
}

/** A resolved assumption as a derivation records it. */
export function assumptionUse(assumption: ResolvedAssumption): AssumptionUse {
  return assumptionUseOf(assumption.origin, assumption.value);
}

/** The efficiency assumptions (and the film-coated factor) behind the expected removal of some periods. */
export function efficiencyUsesOf(periods: readonly ChelationPeriod[], overrides: Case['assumptionOverrides']): AssumptionUse[] {
  const ids = new Set<string>(periods.map((period) => efficiencyAssumptionOf[period.drug]));
  if (periods.some((period) => period.drug === 'deferasirox' && period.formulation === 'film-coated-tablet')) ids.add('deferasirox-film-coated-factor');
  return [...ids].map((id) => assumptionUse(resolveAssumption(id, overrides)));
}

/** The chelation periods on record with a day after `afterDate` up to `toDate` (the ledger's one overlap rule). */
export function periodsBetween(context: ReviewContext, afterDate: IsoDate, toDate: IsoDate): ChelationPeriod[] {
  return periodsOverlapping(context.caseFile.chelationPeriods, afterDate, toDate);
}

/** Net transfusional iron of the records dated after `afterDate` up to `toDate`, with its derivation (a refusal is a value). */
export function transfusionalIronBetween(context: ReviewContext, afterDate: IsoDate, toDate: IsoDate) {
  const inWindow = context.normalised.input.movements.filter((it) => it.date > afterDate && it.date <= toDate);
  return runInternal(
    netTransfusionalIronFormula,
    {
      redCellsInMl: inWindow.reduce((sum, it) => sum + (it.redCellsInMl ?? 0), 0),
      redCellsOutMl: inWindow.reduce((sum, it) => sum + (it.redCellsOutMl ?? 0), 0),
    },
    {
      overrides: context.overrides,
      origins: {
        redCellsInMl: { kind: 'record', description: `Σ volume × haematocrit of ${inWindow.length} record(s) ${addDaysIso(afterDate, 1)} to ${toDate}`, refs: inWindow.map((it) => it.ref) },
        redCellsOutMl: { kind: 'record', description: `Σ volume removed × patient haematocrit, ${addDaysIso(afterDate, 1)} to ${toDate}`, refs: inWindow.filter((it) => (it.redCellsOutMl ?? 0) > 0).map((it) => it.ref) },
      },
    },
  );
}
