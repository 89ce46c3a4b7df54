import type { Derivation } from '../../formulas/derivation';
import { runFormula } from '../../formulas/run';
import { latestWeightOnOrBefore } from '../../model/latestWeight';
import { crclCockcroftGault, egfrCkdEpi2021Formula, egfrSchwartzBedsideFormula } from '../../patient/formulas';
import { continuousRunStart } from '../../model/continuousRunStart';
import type { SafetyContext } from '../context';
import { creatinineMgPerDl } from '../creatinine';
import { defineRule } from '../rule';
import { thresholdText } from '../../thresholds';
import type { FindingDraft, TriggerValue } from '../types';
import { forPrescriberReview, readableUnit, shown } from '../wording';

/**
 * Renal estimates are compared as a laboratory reports them, to one decimal,
 * so that 39.96 reads as 40.0 and floating-point noise cannot move a result
 * across a threshold. Common practice (laboratories report eGFR in whole numbers).
 */
const roundedToTenth = (value: number) => Math.round(value * 10) / 10;

/** Adults (18 and over) take CKD-EPI 2021; children bedside Schwartz (Inker 2021; Schwartz 2009). */
const adultAgeYears = 18;

type RenalEstimate =
  | { readonly ok: true; readonly estimator: string; readonly value: number; readonly derivation: Derivation }
  | { readonly ok: false; readonly reason: string };

function latestCreatinine(context: SafetyContext) {
  return context.resultsOf('creatinine').at(-1);
}

/** eGFR for the latest creatinine: CKD-EPI 2021 from 18 years, bedside Schwartz below (needs a height). */
function egfrFor(context: SafetyContext): { creatinine: ReturnType<typeof latestCreatinine>; estimate: RenalEstimate } | null {
  const creatinine = latestCreatinine(context);
  if (!creatinine) return null;
  const { entry, ref } = creatinine;
  const age = context.ageOn(entry.date);
  if (age === null) return { creatinine, estimate: { ok: false, reason: `the age on ${entry.date} is not known from the case file` } };
  const creatinineOrigin = { kind: 'entered', ref } as const;
  const ageOrigin = { kind: 'record', description: `age on ${entry.date}`, refs: ['patient.age'] } as const;
  if (age >= adultAgeYears) {
    const run = runFormula(
      egfrCkdEpi2021Formula,
      { serumCreatinine: entry.measured.value, creatinineUnit: entry.measured.unit, ageYears: age, sexAtBirth: context.caseFile.patient.sexAtBirth },
      { origins: { serumCreatinine: creatinineOrigin, creatinineUnit: creatinineOrigin, ageYears: ageOrigin, sexAtBirth: { kind: 'entered', ref: 'patient.sexAtBirth' } } },
    );
    return run.ok
      ? { creatinine, estimate: { ok: true, estimator: 'CKD-EPI 2021', value: run.value.outputs.egfrMlPerMinPer173M2, derivation: run.value.derivation } }
      : { creatinine, estimate: { ok: false, reason: run.issues.map((it) => it.message).join(' ') } };
  }
  const height = context.heightOn(entry.date) ?? context.heightOn(context.asOf);
  if (!height) {
    return { creatinine, estimate: { ok: false, reason: 'the bedside Schwartz equation for children needs a height and the case file holds none' } };
  }
  const run = runFormula(
    egfrSchwartzBedsideFormula,
    { heightCm: height.height.value, serumCreatinine: entry.measured.value, creatinineUnit: entry.measured.unit, ageYears: age },
    {
      origins: {
        heightCm: { kind: 'record', description: `height of ${height.date}`, refs: [`patient.heights ${height.date}`] },
        serumCreatinine: creatinineOrigin,
        creatinineUnit: creatinineOrigin,
        ageYears: ageOrigin,
      },
    },
  );
  return run.ok
    ? { creatinine, estimate: { ok: true, estimator: 'bedside Schwartz', value: run.value.outputs.egfrMlPerMinPer173M2, derivation: run.value.derivation } }
    : { creatinine, estimate: { ok: false, reason: run.issues.map((it) => it.message).join(' ') } };
}

export const deferasiroxEgfrRule = defineRule({
  id: 'deferasirox-egfr',
  title: 'Deferasirox and kidney function (eGFR)',
  severity: 'urgent',
  drugs: ['deferasirox'],
  sourceIds: ['deferasirox-label-us', 'inker-2021', 'schwartz-2009'],
  uncertain: false,
  evaluate: (context) => {
    if (!context.activeDrugs.has('deferasirox')) return [];
    const found = egfrFor(context);
    if (!found || !found.creatinine) return [];
    const { creatinine, estimate } = found;
    const creatinineTrigger: TriggerValue = {
      name: 'serum creatinine',
      value: creatinine.entry.measured.value,
      unit: creatinine.entry.measured.unit,
      date: creatinine.entry.date,
      ref: creatinine.ref,
    };
    if (!estimate.ok) {
      return [
        {
          severity: 'information',
          text: `Deferasirox: the eGFR for the creatinine of ${creatinine.entry.date} cannot be estimated: ${estimate.reason}; the renal thresholds of the label are not checked; ${forPrescriberReview}.`,
          triggers: [creatinineTrigger],
        },
      ];
    }
    const egfr = roundedToTenth(estimate.value);
    const lower = context.threshold('deferasirox-egfr-lower');
    const upper = context.threshold('deferasirox-egfr-reduced-band-upper');
    const trigger: TriggerValue = {
      name: `eGFR (${estimate.estimator})`,
      value: egfr,
      unit: 'mL/min/{1.73_m2}',
      date: creatinine.entry.date,
      ref: creatinine.ref,
      derivation: estimate.derivation,
    };
    const unit = readableUnit('mL/min/{1.73_m2}');
    const opening = `Deferasirox with eGFR ${shown(egfr, 1)} ${unit} (${estimate.estimator}, ${creatinine.entry.date})`;
    if (egfr < lower.value) {
      return [{ severity: 'urgent', text: `${opening}: below ${thresholdText(lower, 'labelled')}; ${forPrescriberReview}.`, triggers: [trigger, creatinineTrigger], thresholds: [lower] }];
    }
    if (egfr < upper.value) {
      return [
        {
          severity: 'review',
          text: `${opening}: in the ${lower.value}–${upper.value} band, where the US label halves the starting dose${upper.overridden || lower.overridden ? ` (${[lower, upper].filter((it) => it.overridden).map((it) => thresholdText(it, 'labelled')).join('; ')})` : ''}; ${forPrescriberReview}.`,
          triggers: [trigger, creatinineTrigger],
          thresholds: [lower, upper],
        },
      ];
    }
    return [];
  },
});

export const deferasiroxCrclRule = defineRule({
  id: 'deferasirox-crcl',
  title: 'Deferasirox and creatinine clearance (Cockcroft–Gault; EU threshold from memory)',
  severity: 'review',
  drugs: ['deferasirox'],
  sourceIds: ['deferasirox-smpc-eu', 'cockcroft-gault-1976'],
  uncertain: true,
  evaluate: (context) => {
    if (!context.activeDrugs.has('deferasirox')) return [];
    const creatinine = latestCreatinine(context);
    if (!creatinine) return [];
    const age = context.ageOn(creatinine.entry.date);
    // Cockcroft–Gault is an adult equation (core/patient/formulas.ts notes).
    if (age === null || age < adultAgeYears) return [];
    const weight = latestWeightOnOrBefore(context.caseFile.patient.weights, creatinine.entry.date);
    const weightKg = weight ? weight.weight.value : context.weightKg;
    const origin = { kind: 'entered', ref: creatinine.ref } as const;
    const run = runFormula(
      crclCockcroftGault,
      { ageYears: age, weightKg, serumCreatinine: creatinine.entry.measured.value, creatinineUnit: creatinine.entry.measured.unit, sexAtBirth: context.caseFile.patient.sexAtBirth },
      {
        origins: {
          ageYears: { kind: 'record', description: `age on ${creatinine.entry.date}`, refs: ['patient.age'] },
          weightKg: { kind: 'record', description: weight ? `weight of ${weight.date}` : 'latest weight', refs: weight ? [`patient.weights ${weight.date}`] : [] },
          serumCreatinine: origin,
          creatinineUnit: origin,
          sexAtBirth: { kind: 'entered', ref: 'patient.sexAtBirth' },
        },
      },
    );
    if (!run.ok) return [];
    const crcl = roundedToTenth(run.value.outputs.creatinineClearanceMlPerMin);
    const threshold = context.threshold('deferasirox-crcl-lower');
    if (crcl >= threshold.value) return [];
    return [
      {
        severity: 'review',
        text: `Deferasirox with creatinine clearance ${shown(crcl, 1)} mL/min (Cockcroft–Gault, ${shown(weightKg, 1)} kg, ${creatinine.entry.date}): below ${thresholdText(threshold, 'EU')} mL/min (recalled from memory, not checked against the current EU text); ${forPrescriberReview}.`,
        triggers: [
          { name: 'creatinine clearance (Cockcroft–Gault)', value: crcl, unit: 'mL/min', date: creatinine.entry.date, ref: creatinine.ref, derivation: run.value.derivation },
        ],
        thresholds: [threshold],
      },
    ];
  },
});

export const deferasiroxCreatinineRiseRule = defineRule({
  id: 'deferasirox-creatinine-rise',
  title: 'Deferasirox and a creatinine rise over baseline',
  severity: 'review',
  drugs: ['deferasirox'],
  sourceIds: ['deferasirox-label-us', 'deferasirox-creatinine-baseline'],
  uncertain: false,
  evaluate: (context) => {
    const runStart = continuousRunStart(context.caseFile.chelationPeriods, 'deferasirox', context.asOf);
    if (runStart === null) return [];
    const all = context.resultsOf('creatinine');
    const before = all.filter((it) => it.entry.date <= runStart);
    let onDrug = all.filter((it) => it.entry.date > runStart);
    let baselineMgPerDl: number;
    let baselineText: string;
    let baselineTriggers: TriggerValue[];
    const pre = before.at(-1);
    if (pre) {
      baselineMgPerDl = creatinineMgPerDl(pre.entry);
      baselineText = `${shown(pre.entry.measured.value, 2)} ${readableUnit(pre.entry.measured.unit)} (${pre.entry.date}, the latest before deferasirox began on ${runStart})`;
      baselineTriggers = [{ name: 'baseline creatinine', value: pre.entry.measured.value, unit: pre.entry.measured.unit, date: pre.entry.date, ref: pre.ref }];
    } else {
      if (onDrug.length < 4) return [];
      const [first, second] = [onDrug[0]!, onDrug[1]!];
      baselineMgPerDl = (creatinineMgPerDl(first.entry) + creatinineMgPerDl(second.entry)) / 2;
      baselineText = `${shown(baselineMgPerDl, 2)} mg/dL (mean of the first two results on deferasirox, ${first.entry.date} and ${second.entry.date}; none before ${runStart})`;
      baselineTriggers = [first, second].map((it) => ({ name: 'creatinine in the baseline', value: it.entry.measured.value, unit: it.entry.measured.unit, date: it.entry.date, ref: it.ref }));
      onDrug = onDrug.slice(2);
    }
    if (onDrug.length === 0) return [];
    const threshold = context.threshold('deferasirox-creatinine-rise');
    // Rise in per cent, compared to 0.1 % (deferasirox-creatinine-baseline) so 33.0 is not read as 33.00000001.
    const riseOf = (entry: (typeof onDrug)[number]['entry']) => Math.round((creatinineMgPerDl(entry) / baselineMgPerDl - 1) * 1000) / 10;
    const lastTwo = onDrug.slice(-2);
    const rises = lastTwo.map((it) => riseOf(it.entry));
    const triggers: TriggerValue[] = [
      ...baselineTriggers,
      ...lastTwo.map((it, index) => ({ name: `creatinine (${shown(rises[index]!, 1)} % over baseline)`, value: it.entry.measured.value, unit: it.entry.measured.unit, date: it.entry.date, ref: it.ref })),
    ];
    const resultsText = lastTwo.map((it) => `${shown(it.entry.measured.value, 2)} ${readableUnit(it.entry.measured.unit)} (${it.entry.date})`).join(' and ');
    const risesText = rises.map((rise) => `${shown(rise, 1)} %`).join(' and ');
    if (lastTwo.length === 2 && rises.every((rise) => rise > threshold.value)) {
      return [
        {
          severity: 'review',
          text: `Deferasirox: creatinine ${resultsText} ${lastTwo.length === 2 ? 'are' : 'is'} ${risesText} above the baseline of ${baselineText}: above ${thresholdText(threshold, 'labelled')} % on two consecutive results; ${forPrescriberReview}.`,
          triggers,
          thresholds: [threshold],
        },
      ];
    }
    const last = rises.at(-1)!;
    if (last > threshold.value) {
      const latest = lastTwo.at(-1)!;
      return [
        {
          severity: 'information',
          text: `Deferasirox: the latest creatinine ${shown(latest.entry.measured.value, 2)} ${readableUnit(latest.entry.measured.unit)} (${latest.entry.date}) is ${shown(last, 1)} % above the baseline of ${baselineText}, above ${thresholdText(threshold, 'labelled')} %; the label’s threshold concerns two consecutive results and the result before it is not above it; ${forPrescriberReview}.`,
          triggers,
          thresholds: [threshold],
        },
      ];
    }
    return [];
  },
});

