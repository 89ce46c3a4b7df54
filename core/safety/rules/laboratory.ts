import { daysBetween } from '../../dates/isoDate';
import type { LigandId } from '../../chelators/catalogue';
import { continuousRunStart } from '../continuousRunStart';
import type { SafetyContext } from '../context';
import { defineRule } from '../rule';
import { thresholdText } from '../../thresholds';
import type { FindingDraft, TriggerValue } from '../types';
import { capitalised, forPrescriberReview, readableUnit, shown } from '../wording';

/** The active drugs among a list, in the list's order. */
function activeAmong(context: SafetyContext, drugs: readonly LigandId[]): LigandId[] {
  return drugs.filter((drug) => context.activeDrugs.has(drug));
}

const drugList = (drugs: readonly LigandId[]) => capitalised(drugs.join(' and '));

export const altRaisedRule = defineRule({
  id: 'alt-raised',
  title: 'Liver tests: ALT above a multiple of the upper limit of normal',
  severity: 'review',
  drugs: ['deferasirox', 'deferiprone'],
  sourceIds: ['alt-uln-memory', 'deferasirox-label-renal'],
  uncertain: true,
  evaluate: (context) => {
    const drugs = activeAmong(context, ['deferasirox', 'deferiprone']);
    const latest = context.resultsOf('alt').at(-1);
    if (drugs.length === 0 || !latest) return [];
    const uln = context.threshold('alt-upper-limit-of-normal');
    const multiple = context.threshold('alt-multiple-of-uln');
    const limitUPerL = uln.value * multiple.value;
    const alt = latest.entry.measured.value;
    if (!(alt > limitUPerL)) return [];
    const ulnText = uln.overridden ? `a local upper limit of normal of ${uln.value} U/L (${uln.reason}, ${uln.by})` : `an assumed upper limit of normal of ${uln.value} U/L (from memory; the reporting laboratory’s own limit applies)`;
    return [
      {
        severity: 'review',
        text: `${drugList(drugs)} with ALT ${shown(alt, 0)} U/L (${latest.entry.date}): above ${shown(multiple.value, 2)} × ${ulnText}, that is ${shown(limitUPerL, 0)} U/L; ${forPrescriberReview}.`,
        triggers: [{ name: 'ALT', value: alt, unit: 'U/L', date: latest.entry.date, ref: latest.ref }],
        thresholds: [uln, multiple],
        drugs,
      },
    ];
  },
});

export const lowIronRule = defineRule({
  id: 'low-iron-on-chelation',
  title: 'Ferritin consistently below 500 µg/L or LIC below 3 mg/g dry on deferasirox or deferiprone',
  severity: 'review',
  drugs: ['deferasirox', 'deferiprone'],
  sourceIds: ['low-iron-interruption-labels'],
  uncertain: false,
  evaluate: (context) => {
    const drugs = activeAmong(context, ['deferasirox', 'deferiprone']);
    if (drugs.length === 0) return [];
    const findings: FindingDraft[] = [];
    const ferritinLow = context.threshold('ferritin-low');
    const lastTwo = context.resultsOf('ferritin').slice(-2);
    if (lastTwo.length === 2 && lastTwo.every((it) => it.entry.measured.value < ferritinLow.value)) {
      findings.push({
        severity: 'review',
        text: `${drugList(drugs)} with ferritin ${lastTwo.map((it) => `${shown(it.entry.measured.value, 0)} µg/L (${it.entry.date})`).join(' and ')}: two consecutive results below ${thresholdText(ferritinLow, 'labelled')} µg/L, where the labels advise interrupting or considering interruption; ${forPrescriberReview}.`,
        triggers: lastTwo.map((it) => ({ name: 'ferritin', value: it.entry.measured.value, unit: it.entry.measured.unit, date: it.entry.date, ref: it.ref })),
        thresholds: [ferritinLow],
        drugs,
      });
    }
    const lic = context.results.bodyIron.lastMeasured;
    const licLow = context.threshold('lic-low');
    if (lic && lic.licMgPerGDry < licLow.value) {
      const entry = context.resultsOf('liver-iron').filter((it) => it.entry.date === lic.date).at(-1);
      findings.push({
        severity: 'review',
        text: `${drugList(drugs)} with liver iron ${shown(lic.licMgPerGDry, 1)} mg/g dry (${lic.method}, ${lic.date}): below ${thresholdText(licLow, 'labelled')} mg/g dry; ${forPrescriberReview}.`,
        triggers: [{ name: 'liver iron concentration', value: lic.licMgPerGDry, unit: 'mg/g{dry}', date: lic.date, ref: entry?.ref ?? null }],
        thresholds: [licLow],
        drugs,
      });
    }
    return findings;
  },
});

export const deferiproneNeutrophilsRule = defineRule({
  id: 'deferiprone-neutrophils',
  title: 'Deferiprone and the absolute neutrophil count',
  severity: 'urgent',
  drugs: ['deferiprone'],
  sourceIds: ['deferiprone-label-us-2025'],
  uncertain: false,
  evaluate: (context) => {
    if (!context.activeDrugs.has('deferiprone')) return [];
    const latest = context.resultsOf('neutrophils').at(-1);
    if (!latest) return [];
    const anc = latest.entry.measured.value;
    const neutropenia = context.threshold('deferiprone-anc-neutropenia');
    const severe = context.threshold('deferiprone-anc-severe');
    const agranulocytosis = context.threshold('deferiprone-anc-agranulocytosis');
    if (!(anc < neutropenia.value)) return [];
    const band =
      anc < agranulocytosis.value
        ? `agranulocytosis (below ${agranulocytosis.value}, US label 2025; older and EU texts use below 0.5)`
        : anc < severe.value
          ? `severe neutropenia (${agranulocytosis.value} to below ${severe.value}, US label 2025)`
          : `neutropenia (${severe.value} to below ${neutropenia.value}, US label 2025)`;
    return [
      {
        severity: 'urgent',
        text: `Deferiprone with an absolute neutrophil count of ${shown(anc, 2)} ${readableUnit(latest.entry.measured.unit)} (${latest.entry.date}): ${band}; the label advises interrupting deferiprone below ${thresholdText(neutropenia, 'labelled')}; ${forPrescriberReview}.`,
        triggers: [{ name: 'absolute neutrophil count', value: anc, unit: latest.entry.measured.unit, date: latest.entry.date, ref: latest.ref }],
        thresholds: [neutropenia, severe, agranulocytosis],
      },
    ];
  },
});

export const deferiproneAncMonitoringRule = defineRule({
  id: 'deferiprone-anc-monitoring',
  title: 'Deferiprone: neutrophil counts on record',
  severity: 'review',
  drugs: ['deferiprone'],
  sourceIds: ['deferiprone-label-us-2025'],
  uncertain: false,
  evaluate: (context) => {
    const runStart = continuousRunStart(context.caseFile.chelationPeriods, 'deferiprone', context.asOf);
    if (runStart === null) return [];
    const interval = context.threshold('deferiprone-anc-interval');
    const latest = context.resultsOf('neutrophils').at(-1);
    const wording = 'older labels asked for weekly counts; the 2025 US label asks for counts regularly and lets the frequency be reduced case by case';
    if (!latest || latest.entry.date < runStart) {
      return [
        {
          severity: 'review',
          text: `Deferiprone since ${runStart}: no absolute neutrophil count on record since then${latest ? ` (last ${latest.entry.date})` : ''}; ${wording}; ${forPrescriberReview}.`,
          triggers: latest ? [{ name: 'last absolute neutrophil count', value: latest.entry.measured.value, unit: latest.entry.measured.unit, date: latest.entry.date, ref: latest.ref }] : [],
          thresholds: [interval],
        },
      ];
    }
    const days = daysBetween(latest.entry.date, context.asOf);
    if (days <= interval.value) return [];
    return [
      {
        severity: 'information',
        text: `Deferiprone: the last absolute neutrophil count is from ${latest.entry.date}, ${days} days before the review date (more than ${interval.overridden ? thresholdText(interval, 'weekly') : interval.value} days); ${wording}.`,
        triggers: [
          { name: 'last absolute neutrophil count', value: latest.entry.measured.value, unit: latest.entry.measured.unit, date: latest.entry.date, ref: latest.ref },
          { name: 'days since the last count', value: days, unit: 'd', date: context.asOf, ref: null },
        ],
        thresholds: [interval],
      },
    ];
  },
});

/** A result kind the case may be missing, with the words for it. */
const monthlyTests = [
  { kind: 'creatinine', name: 'serum creatinine' },
  { kind: 'alt', name: 'ALT' },
] as const;

export const deferasiroxMonthlyTestsRule = defineRule({
  id: 'deferasirox-monthly-tests',
  title: 'Deferasirox: creatinine and ALT within the last month',
  severity: 'review',
  drugs: ['deferasirox'],
  sourceIds: ['deferasirox-label-renal'],
  uncertain: false,
  evaluate: (context) => {
    if (!context.activeDrugs.has('deferasirox')) return [];
    const interval = context.threshold('deferasirox-monthly-test-interval');
    return monthlyTests.flatMap(({ kind, name }): FindingDraft[] => {
      const latest = context.resultsOf(kind).at(-1);
      if (latest && daysBetween(latest.entry.date, context.asOf) <= interval.value) return [];
      const trigger: TriggerValue[] = latest
        ? [{ name: `last ${name}`, value: latest.entry.measured.value, unit: latest.entry.measured.unit, date: latest.entry.date, ref: latest.ref }]
        : [];
      const since = latest ? `the last is from ${latest.entry.date}, ${daysBetween(latest.entry.date, context.asOf)} days before the review date` : 'none is on record';
      return [
        {
          severity: 'review',
          text: `Deferasirox: no ${name} in the last ${interval.value} days (${since}); the label asks for it monthly; ${forPrescriberReview}.`,
          triggers: trigger,
          thresholds: [interval],
        },
      ];
    });
  },
});

export const laboratoryRules = [altRaisedRule, lowIronRule, deferiproneNeutrophilsRule, deferiproneAncMonitoringRule, deferasiroxMonthlyTestsRule] as const;
