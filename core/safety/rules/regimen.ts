import { findChelator } from '../../chelators/catalogue';
import { deferoxamineTherapeuticIndexFormula } from '../../chelators/formulas';
import { runFormula } from '../../formulas/run';
import { isAscorbicAcid } from '../../model/coMedication';
import { coMedicationDoseMg } from '../coMedicationDose';
import { continuousRunStart } from '../../model/continuousRunStart';
import type { ActiveRegimen, SafetyContext } from '../context';
import { addMonthsIso } from '../../dates/isoDate';
import type { AppliedThreshold } from '../../thresholds';
import { defineRule } from '../rule';
import { doseThresholdId, thresholdText } from '../../thresholds';
import type { FindingDraft, TriggerValue } from '../types';
import { capitalised, forPrescriberReview, shown } from '../wording';
import { choiceWords } from '../../words';

/** 'Deferasirox film-coated tablets 21 mg/kg/day' — the regimen as a finding names it. */
function regimenName(regimen: ActiveRegimen, openingSentence = true): string {
  const drug = openingSentence ? capitalised(regimen.period.drug) : regimen.period.drug;
  return `${drug} ${choiceWords(regimen.period.formulation)} ${shown(regimen.doseMgPerKgPerDay, 1)} mg/kg/day`;
}

function doseTrigger(regimen: ActiveRegimen, asOf: string): TriggerValue {
  return { name: `${regimen.period.drug} dose per dosing day`, value: regimen.doseMgPerKgPerDay, unit: 'mg/kg/d', date: asOf, ref: regimen.ref };
}

/** Equal within floating-point noise: a dose of 920 mg for 23 kg is 40 mg/kg/day, not 40.000000001. */
const sameDose = (first: number, second: number) => Math.abs(first - second) <= 1e-9 * Math.max(1, Math.abs(second));

export const doseRangeRule = defineRule({
  id: 'dose-outside-published-range',
  title: 'Dose per kg per day outside the published range for the drug and formulation; far above the labelled maximum urgent',
  severity: 'urgent',
  drugs: ['deferoxamine', 'deferiprone', 'deferasirox'],
  sourceIds: ['deferoxamine-label', 'deferiprone-label', 'deferasirox-label-us'],
  uncertain: false,
  evaluate: (context) =>
    context.active.flatMap((regimen): FindingDraft[] => {
      const entry = findChelator(regimen.chelatorId);
      const minId = doseThresholdId('dose-min', regimen.chelatorId);
      const maxId = doseThresholdId('dose-max', regimen.chelatorId)!;
      const min = minId ? context.threshold(minId) : null;
      const max = context.threshold(maxId);
      const dose = regimen.doseMgPerKgPerDay;
      const range = `${min ? `${min.value}–` : 'up to '}${max.value} mg/kg/day`;
      const per = regimen.period.drug === 'deferoxamine' ? ' per dosing day' : '';
      const opening = `${regimenName(regimen)}${per} (${regimen.ref}, weight ${shown(context.weightKg, 1)} kg)`;
      const overridden = [min, max].filter((it) => it?.overridden).map((it) => thresholdText(it!, 'published'));
      const overrideText = overridden.length > 0 ? ` (${overridden.join('; ')})` : '';
      const base = { triggers: [doseTrigger(regimen, context.asOf)], thresholds: [...(min ? [min] : []), max], drugs: [entry.ligandId], extraSourceIds: entry.dose.sourceIds };
      if (min && dose < min.value && !sameDose(dose, min.value)) {
        return [{ ...base, severity: 'review', text: `${opening}: below the published range ${range} for ${entry.label}${overrideText}; ${forPrescriberReview}.` }];
      }
      const far = context.threshold('dose-far-above-maximum-multiple');
      if (dose > max.value * far.value && !sameDose(dose, max.value * far.value)) {
        const perAdministration = regimen.period.administrationsPerDay > 1 ? ` (${shown(dose / regimen.period.administrationsPerDay, 1)} mg/kg per administration × ${regimen.period.administrationsPerDay} a day; the dose field is per administration)` : '';
        return [
          {
            ...base,
            severity: 'urgent',
            text: `${opening}${perAdministration}: more than ${thresholdText(far, 'modelling-choice')} × the labelled daily maximum of ${max.value} mg/kg/day for ${entry.label}${overrideText}; a daily dose may have been entered per administration, and the expected removal and projections for it are not reliable; ${forPrescriberReview}.`,
            thresholds: [...base.thresholds, far],
          },
        ];
      }
      if (dose > max.value && !sameDose(dose, max.value)) {
        return [{ ...base, severity: 'review', text: `${opening}: above the published range ${range} for ${entry.label}${overrideText}; ${forPrescriberReview}.` }];
      }
      return [];
    }),
});

export const deferoxamineGrowthRule = defineRule({
  id: 'deferoxamine-growth-limit',
  title: (threshold) => `Deferoxamine at most ${threshold(doseThresholdId('dose-growing-max', 'deferoxamine')!).value} mg/kg/day while growing`,
  severity: 'review',
  drugs: ['deferoxamine'],
  sourceIds: ['deferoxamine-label', 'common-practice'],
  uncertain: false,
  evaluate: (context) =>
    context.active
      .filter((regimen) => regimen.period.drug === 'deferoxamine')
      .flatMap((regimen): FindingDraft[] => {
        const growingUntil = context.threshold('growing-until-age');
        const limit = context.threshold(doseThresholdId('dose-growing-max', regimen.chelatorId)!);
        const age = context.ageYears;
        if (age === null) {
          return [{ severity: 'information', text: `Deferoxamine: the age on ${context.asOf} is not known from the case file, so the limit of ${limit.value} mg/kg/day while growing is not checked; ${forPrescriberReview}.`, triggers: [doseTrigger(regimen, context.asOf)], thresholds: [limit] }];
        }
        if (age >= growingUntil.value) return [];
        const dose = regimen.doseMgPerKgPerDay;
        const ageText = `age ${Math.floor(age)}, under ${growingUntil.value} years, treated as growing (common practice)`;
        const triggers: TriggerValue[] = [doseTrigger(regimen, context.asOf), { name: 'age', value: Number(age.toFixed(2)), unit: 'a', date: context.asOf, ref: 'patient.age' }];
        if (sameDose(dose, limit.value)) {
          return [{ severity: 'information', text: `Deferoxamine ${shown(dose, 1)} mg/kg per dosing day (${regimen.ref}; ${ageText}): at ${thresholdText(limit, 'labelled')} mg/kg/day while growing.`, triggers, thresholds: [limit, growingUntil] }];
        }
        if (dose > limit.value) {
          return [{ severity: 'review', text: `Deferoxamine ${shown(dose, 1)} mg/kg per dosing day (${regimen.ref}; ${ageText}): above ${thresholdText(limit, 'labelled')} mg/kg/day while growing; ${forPrescriberReview}.`, triggers, thresholds: [limit, growingUntil] }];
        }
        return [];
      }),
});

export const deferoxamineIntravenousRateRule = defineRule({
  id: 'deferoxamine-intravenous-rate',
  title: (threshold) => `Intravenous deferoxamine at most ${threshold(doseThresholdId('dose-iv-rate-max', 'deferoxamine')!).value} mg/kg/h`,
  severity: 'review',
  drugs: ['deferoxamine'],
  sourceIds: ['deferoxamine-label'],
  uncertain: false,
  evaluate: (context) =>
    context.active.flatMap((regimen): FindingDraft[] => {
      const period = regimen.period;
      if (period.drug !== 'deferoxamine' || period.route !== 'intravenous' || period.infusionHours === undefined) return [];
      const rate = regimen.doseMgPerKgPerDay / period.administrationsPerDay / period.infusionHours;
      const limit = context.threshold(doseThresholdId('dose-iv-rate-max', regimen.chelatorId)!);
      if (!(rate > limit.value) || sameDose(rate, limit.value)) return [];
      return [
        {
          severity: 'review',
          text: `Intravenous deferoxamine ${shown(regimen.doseMgPerKgPerDay / period.administrationsPerDay, 1)} mg/kg over ${period.infusionHours} h (${regimen.ref}): ${shown(rate, 1)} mg/kg/h, above ${thresholdText(limit, 'labelled')} mg/kg/h; ${forPrescriberReview}.`,
          triggers: [{ name: 'infusion rate', value: rate, unit: 'mg/kg/h', date: context.asOf, ref: regimen.ref }],
          thresholds: [limit],
        },
      ];
    }),
});

export const deferoxamineTherapeuticIndexRule = defineRule({
  id: 'deferoxamine-therapeutic-index',
  title: 'Deferoxamine therapeutic index (Porter 1989)',
  severity: 'review',
  drugs: ['deferoxamine'],
  sourceIds: ['porter-1989', 'common-practice'],
  uncertain: false,
  evaluate: (context) => {
    const ferritins = context.resultsOf('ferritin');
    const latest = ferritins.at(-1);
    if (!latest) return [];
    const limit = context.threshold('deferoxamine-therapeutic-index');
    return context.active
      .filter((regimen) => regimen.period.drug === 'deferoxamine')
      .flatMap((regimen): FindingDraft[] => {
        const indexAt = (ferritin: typeof latest) =>
          runFormula(
            deferoxamineTherapeuticIndexFormula,
            { dosePerInfusionMgPerKg: regimen.doseMgPerKgPerDay, infusionsPerWeek: regimen.period.daysPerWeek, ferritinUgPerL: ferritin.entry.measured.value },
            {
              origins: {
                dosePerInfusionMgPerKg: { kind: 'record', description: `${regimen.ref}: dose per dosing day`, refs: [regimen.ref] },
                infusionsPerWeek: { kind: 'record', description: `${regimen.ref}: days a week`, refs: [regimen.ref] },
                ferritinUgPerL: { kind: 'entered', ref: ferritin.ref },
              },
            },
          );
        const run = indexAt(latest);
        if (!run.ok) {
          return [{ severity: 'information', text: `Deferoxamine: the therapeutic index cannot be computed: ${run.issues.map((it) => it.message).join(' ')}`, triggers: [doseTrigger(regimen, context.asOf)] }];
        }
        const index = run.value.outputs.therapeuticIndex;
        const meanDaily = run.value.outputs.meanDailyDoseMgPerKg;
        const previous = ferritins.at(-2);
        const previousRun = previous ? indexAt(previous) : null;
        const trend = previous && previousRun?.ok ? `; at the same dose the ferritin of ${previous.entry.date} (${shown(previous.entry.measured.value, 0)} µg/L) gives ${shown(previousRun.value.outputs.therapeuticIndex, 4)}` : '';
        const opening = `Deferoxamine therapeutic index ${shown(index, 4)} (mean daily dose ${shown(meanDaily, 1)} mg/kg, weekly dose ÷ 7 as common practice, ÷ ferritin ${shown(latest.entry.measured.value, 0)} µg/L of ${latest.entry.date})`;
        const triggers: TriggerValue[] = [
          { name: 'deferoxamine therapeutic index', value: index, unit: '(mg/kg/d)/(ug/L)', date: latest.entry.date, ref: regimen.ref, derivation: run.value.derivation },
          { name: 'ferritin', value: latest.entry.measured.value, unit: latest.entry.measured.unit, date: latest.entry.date, ref: latest.ref },
        ];
        // Porter's wording is "greater than 0.025": equality is not above.
        if (index > limit.value) {
          return [{ severity: 'review', text: `${opening}: above ${thresholdText(limit, 'published')} (Porter 1989), which marks a risk of hearing loss${trend}; ${forPrescriberReview}.`, triggers, thresholds: [limit] }];
        }
        return [{ severity: 'information', text: `${opening}: at or below ${thresholdText(limit, 'published')} (Porter 1989)${trend}.`, triggers, thresholds: [limit] }];
      });
  },
});

const examinations = [
  { id: 'hearing', kind: 'audiology', name: 'hearing (audiology)' },
  { id: 'eyes', kind: 'eye-examination', name: 'eye examination' },
] as const;

export const deferoxamineHearingEyesRule = defineRule({
  id: 'deferoxamine-hearing-eyes',
  title: 'Deferoxamine: yearly hearing and eye examinations',
  severity: 'review',
  drugs: ['deferoxamine'],
  sourceIds: ['deferoxamine-label'],
  uncertain: false,
  evaluate: (context) => {
    const runStart = continuousRunStart(context.caseFile.chelationPeriods, 'deferoxamine', context.asOf);
    if (runStart === null) return [];
    return examinations.flatMap(({ id, kind, name }): FindingDraft[] => {
      const item = context.monitoring.items.find((it) => it.id === id);
      const latest = context.resultsOf(kind).at(-1);
      const triggers: TriggerValue[] = latest ? [{ name: `last ${name}`, value: latest.entry.outcome, unit: '', date: latest.entry.date, ref: latest.ref }] : [];
      if (latest && latest.entry.outcome === 'changed-from-baseline') {
        return [{ severity: 'review', text: `Deferoxamine since ${runStart}: the ${name} of ${latest.entry.date} is recorded as changed from baseline; the label lists hearing and eye changes among the effects of deferoxamine; ${forPrescriberReview}.`, triggers }];
      }
      if (!item || item.status === 'upcoming') return [];
      const last = item.lastDate === null ? `no ${name} done is on record` : `the last done is from ${item.lastDate}`;
      return [{ severity: 'information', text: `Deferoxamine since ${runStart}: ${name} due on ${item.dueDate} (${item.intervalText}; ${last}); the label advises hearing and eye examinations at least yearly.`, triggers }];
    });
  },
});

export const chelatorCombinationRule = defineRule({
  id: 'chelator-combination',
  title: 'Two chelators at once',
  severity: 'information',
  drugs: ['deferoxamine', 'deferiprone', 'deferasirox'],
  sourceIds: ['chelation-combination-memory'],
  uncertain: true,
  evaluate: (context) => {
    if (context.activeDrugs.size < 2) return [];
    return [
      {
        severity: 'information',
        text: `Combined chelation on ${context.asOf}: ${context.active.map((regimen) => `${regimenName(regimen, false)}${regimen.period.daysPerWeek < 7 ? ` on ${regimen.period.daysPerWeek} days a week` : ''}`).join(' with ')}; the monitoring of each drug applies.`,
        triggers: context.active.map((regimen) => doseTrigger(regimen, context.asOf)),
        drugs: [...context.activeDrugs],
      },
    ];
  },
});

export const pregnancyRule = defineRule({
  id: 'pregnancy-or-breastfeeding',
  title: 'Pregnancy or breastfeeding recorded',
  severity: 'urgent',
  drugs: ['deferoxamine', 'deferiprone', 'deferasirox'],
  sourceIds: ['chelation-pregnancy-labels'],
  uncertain: false,
  evaluate: (context) => {
    const pregnancy = context.caseFile.patient.pregnancy;
    if (pregnancy.status === 'not-pregnant') return [];
    const status = pregnancy.status === 'pregnant' ? 'Pregnancy' : 'Breastfeeding';
    const recorded = pregnancy.recordedOn ? ` (recorded ${pregnancy.recordedOn})` : '';
    const drugs = [...context.activeDrugs];
    const on = drugs.length > 0 ? ` with ${drugs.join(' and ')} running` : ' with no chelator running';
    return [
      {
        severity: 'urgent',
        text: `${status}${recorded}${on}: flagged for the prescriber; the tool computes no dose or dose comparison for pregnancy or breastfeeding.`,
        triggers: [{ name: 'pregnancy status', value: pregnancy.status, unit: '', date: pregnancy.recordedOn, ref: 'patient.pregnancy' }],
        drugs,
      },
    ];
  },
});

/** The ascorbic acid cap that applies at an age: under 10 years, older children (to 18, common practice), adults. */
function ascorbicAcidCap(context: SafetyContext): { cap: AppliedThreshold; band: string } {
  const age = context.ageYears;
  const growingUntil = context.threshold('growing-until-age');
  if (age !== null && age < 10) return { cap: context.threshold('ascorbic-acid-daily-cap-under-10'), band: `under 10 years (age ${Math.floor(age)})` };
  if (age !== null && age < growingUntil.value) return { cap: context.threshold('ascorbic-acid-daily-cap-older-child'), band: `an older child (age ${Math.floor(age)})` };
  return { cap: context.threshold('ascorbic-acid-daily-cap'), band: age === null ? 'age unknown, so the adult amount is shown' : `an adult (age ${Math.floor(age)})` };
}

export const ascorbicAcidRule = defineRule({
  id: 'ascorbic-acid-with-deferoxamine',
  title: 'Ascorbic acid with regular deferoxamine after its first month, within the amount for the age, not in cardiac failure',
  severity: 'review',
  drugs: ['deferoxamine'],
  sourceIds: ['deferoxamine-label-interactions'],
  uncertain: false,
  evaluate: (context) =>
    context.activeCoMedications.flatMap(({ coMedication, ref }): FindingDraft[] => {
      if (!isAscorbicAcid(coMedication.name)) return [];
      const deferoxamine = context.active.find((regimen) => regimen.period.drug === 'deferoxamine');
      const dose = coMedication.dose;
      // With each infusion: as many doses a day as deferoxamine administrations (one overnight infusion → one dose).
      const dosesPerDay = coMedication.timing === 'with-each-deferoxamine-infusion' ? (deferoxamine?.period.administrationsPerDay ?? 1) : 1;
      const mgPerDay = dose === undefined ? null : coMedicationDoseMg(dose, context.weightKg) * dosesPerDay;
      const triggers: TriggerValue[] = mgPerDay === null ? [] : [{ name: 'ascorbic acid per day', value: mgPerDay, unit: 'mg/d', date: coMedication.startDate, ref }];
      const amount = mgPerDay === null ? `Ascorbic acid (no dose recorded; ${ref})` : `Ascorbic acid ${shown(mgPerDay, 0)} mg a day (${ref})`;
      if (!deferoxamine) {
        return [{ severity: 'review', text: `${amount} with no deferoxamine running: the deferoxamine label pairs vitamin C with regular deferoxamine only; ${forPrescriberReview}.`, triggers }];
      }
      const findings: FindingDraft[] = [];
      const runStart = continuousRunStart(context.caseFile.chelationPeriods, 'deferoxamine', context.asOf)!;
      const firstMonthEnds = addMonthsIso(runStart, 1);
      if (coMedication.startDate < firstMonthEnds) {
        findings.push({ severity: 'review', text: `${amount} recorded from ${coMedication.startDate}, within the first month of regular deferoxamine (from ${runStart}; the month ends ${firstMonthEnds}): the label starts vitamin C after an initial month of regular deferoxamine; ${forPrescriberReview}.`, triggers });
      }
      const failure = context.cardiacFailure;
      if (failure?.status === 'present') {
        findings.push({
          severity: 'review',
          text: `${amount} with cardiac failure recorded (${failure.date}): the label excludes vitamin C supplements in cardiac failure; ${forPrescriberReview}.`,
          triggers: [...triggers, { name: 'cardiac failure', value: 'present', unit: '', date: failure.date, ref: failure.ref }],
        });
      } else {
        const severeHeart = context.threshold('cardiac-t2star-severe');
        const heart = context.resultsOf('cardiac-t2star').at(-1);
        if (heart && heart.entry.measured.value < severeHeart.value) {
          findings.push({
            severity: 'review',
            text: `${amount} with cardiac T2* ${shown(heart.entry.measured.value, 1)} ms (${heart.entry.date}), severe heart iron with a high risk of cardiac failure (Kirk 2009); the label excludes vitamin C in cardiac failure and asks for cardiac monitoring with it; ${forPrescriberReview}.`,
            triggers: [...triggers, { name: 'cardiac T2*', value: heart.entry.measured.value, unit: 'ms', date: heart.entry.date, ref: heart.ref }],
            thresholds: [severeHeart],
            extraSourceIds: ['kirk-2009'],
          });
        }
      }
      if (mgPerDay === null) return findings;
      const { cap, band } = ascorbicAcidCap(context);
      const adultCap = context.threshold('ascorbic-acid-daily-cap');
      const failureText = failure === null ? '; cardiac failure is not recorded in the case file either way' : failure.status === 'absent' ? `; cardiac failure recorded as absent (${failure.date})` : '';
      if (mgPerDay > adultCap.value) {
        findings.push({ severity: 'review', text: `${amount} for ${band}: above ${thresholdText(adultCap, 'labelled')} mg a day, the most the label gives (adults; about 50 mg under 10 years and 100 mg in older children generally suffice, and larger amounts add no iron excretion); ${forPrescriberReview}.`, triggers, thresholds: [adultCap, ...(cap.id === adultCap.id ? [] : [cap])] });
        return findings;
      }
      if (mgPerDay > cap.value) {
        // The label's amounts for children are what "generally suffices", not a maximum: shown as information.
        findings.push({ severity: 'information', text: `${amount} for ${band} with deferoxamine: within the ${adultCap.value} mg a day the label gives for adults, but above ${thresholdText(cap, 'labelled')} mg a day that the label says generally suffices at this age; larger amounts add no iron excretion${failureText}.`, triggers, thresholds: [cap, adultCap] });
        return findings;
      }
      findings.push({ severity: 'information', text: `${amount} for ${band} with deferoxamine: within ${thresholdText(cap, 'labelled')} mg a day for the age${failureText}.`, triggers, thresholds: [cap] });
      return findings;
    }),
});

