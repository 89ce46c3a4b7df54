import { expectedExcretion } from '../chelators/formulas';
import type { Derivation } from '../formulas/derivation';
import { runInternal } from '../formulas/run';
import { ok, type Result } from '../result';
import type { Case, ChelationPeriod } from '../model/caseFile';
import { chelatorIdOf, describePeriod } from './caseToLedger';
import { adherenceOrigin, type PeriodAdherence } from './periodAdherence';

export interface RegimenSummary {
  readonly periodId: string;
  readonly label: string;
  readonly drug: ChelationPeriod['drug'];
  readonly doseMgPerKgPerDay: number;
  readonly expectedRemovalMgPerDay: number;
  readonly expectedRemovalMgPerKgPerDay: number;
  /** The entered adherence estimate and, where dispensings exist, the proportion of days covered that the expected removal uses. */
  readonly adherence: PeriodAdherence;
  readonly derivation: Derivation;
}

/**
 * Expected removal of one chelation period at a weight, at the published
 * efficiency, with its derivation; the adherence input is the proportion of
 * days covered (a nested derivation) where dispensings exist, else the entered estimate.
 *
 * @param period - a chelation period as recorded
 * @param weightKg - weight, kg (a dose in mg is turned into mg/kg by it)
 * @param overrides - the case's assumption overrides
 * @param adherence - the period's adherence (periodAdherence.ts)
 */
export function regimenSummary(period: ChelationPeriod, weightKg: number, overrides: Case['assumptionOverrides'], adherence: PeriodAdherence): Result<RegimenSummary> {
  const perAdministrationMgPerKg = period.dose.unit === 'mg/kg' ? period.dose.value : period.dose.value / weightKg;
  const doseMgPerKgPerDay = perAdministrationMgPerKg * period.administrationsPerDay;
  const expected = runInternal(
    expectedExcretion,
    {
      chelator: chelatorIdOf(period),
      doseMgPerKgPerDosingDay: doseMgPerKgPerDay,
      weightKg,
      daysPerWeek: period.daysPerWeek,
      adherence: adherence.used,
    },
    {
      overrides,
      origins: {
        doseMgPerKgPerDosingDay: { kind: 'record', description: `${period.id}: ${describePeriod(period)}`, refs: [period.id] },
        weightKg: { kind: 'record', description: 'latest weight', refs: [] },
        daysPerWeek: { kind: 'record', description: period.id, refs: [period.id] },
        adherence: adherenceOrigin(adherence, period),
      },
    },
  );
  if (!expected.ok) return expected;
  const run = expected.value;
  return ok({
    periodId: period.id,
    label: describePeriod(period),
    drug: period.drug,
    doseMgPerKgPerDay,
    expectedRemovalMgPerDay: run.outputs.excretionMgPerDay,
    expectedRemovalMgPerKgPerDay: run.outputs.excretionMgPerKgPerDay,
    adherence,
    derivation: run.derivation,
  });
}
