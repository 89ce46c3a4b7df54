import { resolveAssumption, type ResolvedAssumption } from '../assumptions';
import { expectedIronExcretionMgPerDay } from '../chelators/expectedExcretion';
import { chelatorIdForPeriod, type ChelatorId } from '../chelators/catalogue';
import { licFromR2Star } from '../iron/licFromR2Star';
import { r2StarCalibration, r2StarCalibrationIds, type R2StarCalibrationId } from '../iron/r2StarCalibrations';
import { licMgPerGDryFromUmolPerGDry } from '../units/liverIron';
import { fraction, mg, perSecond, tesla, type UmolPerGDry } from '../units/quantity';
import type { Case, ChelationPeriod } from '../model/caseFile';
import type { ChelationSpan, IronMovement, LedgerInput, LicMeasurement } from './ledgerInput';
import { choiceWords } from '../words';
import { periodAdherence, type PeriodAdherence } from './periodAdherence';

/** Something the conversion assumed or left out, said in the trade's words. */
export interface LedgerNotice {
  readonly severity: 'information' | 'review';
  readonly text: string;
  readonly ref?: string;
}

export interface NormalisedCase {
  readonly input: LedgerInput;
  readonly notices: readonly LedgerNotice[];
  /** Every assumption the conversion used, with its value and origin. */
  readonly assumptions: readonly ResolvedAssumption[];
  /** The adherence each started chelation period's expected removal uses, by period id (periodAdherence.ts). */
  readonly adherence: ReadonlyMap<string, PeriodAdherence>;
}

/** The catalogue product for a chelation period as recorded. */
export function chelatorIdOf(period: Pick<ChelationPeriod, 'drug' | 'formulation'>): ChelatorId {
  return chelatorIdForPeriod(period.drug, period.formulation);
}

/** 'deferasirox film-coated tablets 21 mg/kg × 1/day, 7 days/week, adherence 0.9'. */
export function describePeriod(period: ChelationPeriod): string {
  const adherence = period.adherence < 1 ? `, adherence ${period.adherence}` : '';
  return `${period.drug} ${choiceWords(period.formulation)} ${period.dose.value} ${period.dose.unit} × ${period.administrationsPerDay}/day, ${period.daysPerWeek} days/week${adherence}`;
}

/**
 * Expected removal of one chelation period, mg/day averaged over the week, at a weight.
 * A dose entered in mg/kg follows the weight; one entered in mg does not. The
 * adherence is the one periodAdherence gives (the proportion of days covered
 * where dispensings exist, else the entered estimate).
 */
export function periodRemovalMgPerDay(
  period: ChelationPeriod,
  weightKg: number,
  efficiency: number,
  filmCoatedFactor: number,
  adherence: number,
): number {
  const perAdministrationMg = period.dose.unit === 'mg/kg' ? period.dose.value * weightKg : period.dose.value;
  return expectedIronExcretionMgPerDay({
    chelatorId: chelatorIdOf(period),
    doseMgPerDosingDay: mg(perAdministrationMg * period.administrationsPerDay),
    daysPerWeek: period.daysPerWeek,
    adherence: fraction(adherence),
    efficiency: fraction(efficiency),
    efficiencyDoseFactor: fraction(filmCoatedFactor),
  });
}

/**
 * The method label used to compare two LIC results: an MRI LIC converted here
 * from R2* and one the MRI report gives are the same method when the field
 * strength and the calibration are the same.
 */
function mriMethod(fieldStrengthT: number, calibrationId: string): string {
  return `MRI ${fieldStrengthT} T, calibration ${calibrationId}`;
}

export const efficiencyAssumptionOf = {
  deferoxamine: 'efficiency-deferoxamine',
  deferiprone: 'efficiency-deferiprone',
  deferasirox: 'efficiency-deferasirox',
} as const;

/**
 * Turns a case into the iron account's flows: transfusions into mg of iron in
 * and out (volume × haematocrit × iron per mL of red cells), chelation periods
 * into daily expected removal, LIC results (biopsy, MRI in mg/g, or raw R2* or T2*
 * through the named calibration) into anchors. What had to be assumed or left
 * out is returned as notices.
 */
export function caseToLedgerInput(caseFile: Case, asOf: string): NormalisedCase {
  const overrides = caseFile.assumptionOverrides;
  const ironPerMl = resolveAssumption('iron-per-ml-red-cells', overrides);
  const defaultHaematocrit = resolveAssumption('unit-haematocrit-red-cells', overrides);
  const basalLoss = resolveAssumption('basal-iron-loss-mg-per-day', overrides);
  const filmCoated = resolveAssumption('deferasirox-film-coated-factor', overrides);
  const efficiencies = {
    deferoxamine: resolveAssumption(efficiencyAssumptionOf.deferoxamine, overrides),
    deferiprone: resolveAssumption(efficiencyAssumptionOf.deferiprone, overrides),
    deferasirox: resolveAssumption(efficiencyAssumptionOf.deferasirox, overrides),
  };
  const notices: LedgerNotice[] = [];
  const used = new Map<string, ResolvedAssumption>([
    [ironPerMl.id, ironPerMl],
    [basalLoss.id, basalLoss],
  ]);

  let assumedHaematocritCount = 0;
  const movements: IronMovement[] = [];
  caseFile.transfusions.forEach((entry, index) => {
    if (entry.date > asOf) return;
    const ref = `transfusions[${index}] ${entry.date}`;
    if (entry.kind === 'venesection') {
      const redCellsOutMl = entry.volumeRemoved.value * entry.patientHaematocrit;
      movements.push({ date: entry.date, ironInMg: 0, ironOutMg: redCellsOutMl * ironPerMl.value, ref, redCellsInMl: 0, redCellsOutMl });
      return;
    }
    const haematocrit = entry.unitHaematocrit ?? defaultHaematocrit.value;
    if (entry.unitHaematocrit === null) assumedHaematocritCount += 1;
    const volumeInMl = entry.kind === 'simple' ? entry.volume.value : entry.volumeIn.value;
    const redCellsInMl = volumeInMl * haematocrit;
    const redCellsOutMl = entry.kind === 'exchange' ? entry.volumeRemoved.value * entry.patientHaematocrit : 0;
    movements.push({ date: entry.date, ironInMg: redCellsInMl * ironPerMl.value, ironOutMg: redCellsOutMl * ironPerMl.value, ref, redCellsInMl, redCellsOutMl });
  });
  if (assumedHaematocritCount > 0) {
    used.set(defaultHaematocrit.id, defaultHaematocrit);
    notices.push({
      severity: 'information',
      text: `Unit haematocrit not entered for ${assumedHaematocritCount} transfusion(s): ${defaultHaematocrit.value} assumed (${defaultHaematocrit.origin.overridden ? 'overridden' : 'product default'}).`,
    });
  }
  if (caseFile.transfusions.some((it) => it.kind === 'exchange')) {
    notices.push({
      severity: 'information',
      text: 'Iron removed by exchange uses the pre-procedure patient haematocrit; the haematocrit of the removed blood drifts during the procedure, so it is an approximation.',
    });
  }

  const adherence = new Map<string, PeriodAdherence>();
  const chelation: ChelationSpan[] = caseFile.chelationPeriods
    .filter((period) => period.startDate <= asOf)
    .map((period) => {
      const efficiency = efficiencies[period.drug];
      used.set(efficiency.id, efficiency);
      if (period.drug === 'deferasirox' && period.formulation === 'film-coated-tablet') used.set(filmCoated.id, filmCoated);
      const periodUse = periodAdherence(caseFile, period, asOf);
      adherence.set(period.id, periodUse);
      if (periodUse.covered !== null) {
        const { covered } = periodUse;
        notices.push({
          severity: 'information',
          ref: period.id,
          text: `Expected removal of ${period.id} uses the proportion of days covered by ${covered.dispensings} dispensing(s), ${covered.coveredDays} of ${covered.periodDays} days from ${covered.fromDate} to ${covered.toDate} (${covered.proportion.toFixed(2)}), in place of the entered adherence estimate (${period.adherence.toFixed(2)}).`,
        });
      }
      return {
        id: period.id,
        label: describePeriod(period),
        drug: period.drug,
        start: period.startDate,
        end: period.endDate,
        expectedRemovalMgPerDay: (weightKg: number) => periodRemovalMgPerDay(period, weightKg, efficiency.value, filmCoated.value, periodUse.used),
      };
    });

  const licMeasurements: LicMeasurement[] = [];
  caseFile.results.forEach((result, index) => {
    if (result.kind !== 'liver-iron' || result.date > asOf) return;
    const ref = `results[${index}] ${result.date}`;
    if (result.method === 'biopsy' || result.method === 'mri') {
      const value = result.measured.value;
      const licMgPerGDry =
        result.measured.unit === 'mg/g{dry}'
          ? value
          : result.measured.unit === 'umol/g{dry}'
            ? licMgPerGDryFromUmolPerGDry(value as UmolPerGDry)
            : value / 1000;
      const method = result.method === 'biopsy' ? 'biopsy' : mriMethod(result.fieldStrengthT, result.calibrationId);
      licMeasurements.push({ date: result.date, licMgPerGDry, method, ref });
      return;
    }
    if (result.method === 'mri-r2') {
      notices.push({ severity: 'review', ref, text: `Liver R2 result of ${result.date} not converted: no R2 calibration is catalogued yet; enter the LIC from the MRI report.` });
      return;
    }
    if (!(r2StarCalibrationIds as readonly string[]).includes(result.calibrationId)) {
      notices.push({ severity: 'review', ref, text: `Liver ${result.method} result of ${result.date}: calibration "${result.calibrationId}" is not catalogued (${r2StarCalibrationIds.join(', ')}); not converted.` });
      return;
    }
    const r2Star = result.method === 'mri-r2star' ? result.measured.value : 1000 / result.measured.value;
    const converted = licFromR2Star(perSecond(r2Star), tesla(result.fieldStrengthT), r2StarCalibration(result.calibrationId as R2StarCalibrationId));
    if (!converted.ok) {
      notices.push({ severity: 'review', ref, text: `Liver iron of ${result.date} not converted. ${converted.issues.map((it) => it.message).join(' ')}` });
      return;
    }
    licMeasurements.push({ date: result.date, licMgPerGDry: converted.value, method: mriMethod(result.fieldStrengthT, result.calibrationId), ref });
  });

  const weights = caseFile.patient.weights.map((it) => ({ date: it.date, weightKg: it.weight.value }));
  return {
    input: { asOf, movements, chelation, weights, licMeasurements, basalLossMgPerDay: basalLoss.value },
    notices,
    assumptions: [...used.values()],
    adherence,
  };
}
