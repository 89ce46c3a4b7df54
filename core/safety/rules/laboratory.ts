import { daysBetween } from '../../dates/isoDate';
import type { LigandId } from '../../chelators/catalogue';
import { continuousRunStart } from '../../model/continuousRunStart';
import type { MonitoringItem } from '../../monitoring/monitoringCalendar';
import type { AppliedThreshold } from '../../thresholds';
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

/** The upper limit of normal of a transaminase result: the laboratory's, or the assumed one (threshold) when the result carries none. */
function upperLimitOf(entry: { readonly referenceRange?: { readonly high?: number } }, assumed: AppliedThreshold): { value: number; text: string } {
  const high = entry.referenceRange?.high;
  if (high !== undefined) return { value: high, text: `the reporting laboratory’s upper limit of normal of ${shown(high, 0)} U/L` };
  return assumed.overridden
    ? { value: assumed.value, text: `a local upper limit of normal of ${assumed.value} U/L (${assumed.reason}, ${assumed.by}; the result gives no laboratory range)` }
    : { value: assumed.value, text: `an assumed upper limit of normal of ${assumed.value} U/L (from memory; the result gives no laboratory range, and the laboratory’s own limit applies)` };
}

export const altRaisedRule = defineRule({
  id: 'alt-raised',
  title: 'Liver tests: transaminases above the upper limit of normal (labels: severe or persistent elevations)',
  severity: 'review',
  drugs: ['deferasirox', 'deferiprone'],
  sourceIds: ['deferasirox-label-us'],
  uncertain: false,
  evaluate: (context) => {
    const drugs = activeAmong(context, ['deferasirox', 'deferiprone']);
    if (drugs.length === 0) return [];
    const assumed = context.threshold('alt-upper-limit-of-normal');
    const multiple = context.threshold('alt-multiple-of-uln');
    return (['alt', 'ast'] as const).flatMap((kind): FindingDraft[] => {
      const name = kind === 'alt' ? 'ALT' : 'AST';
      const [previous, latest] = [context.resultsOf(kind).at(-2), context.resultsOf(kind).at(-1)];
      if (!latest) return [];
      const limit = upperLimitOf(latest.entry, assumed);
      const value = latest.entry.measured.value;
      const usedThresholds = latest.entry.referenceRange?.high === undefined ? [assumed] : [];
      const trigger = (it: NonNullable<typeof latest>): TriggerValue => ({ name, value: it.entry.measured.value, unit: 'U/L', date: it.entry.date, ref: it.ref });
      const wording = 'the deferasirox label asks for dose modification or interruption to be considered for severe or persistent elevations and gives no multiple of the upper limit';
      const sourceUncertain = usedThresholds.length > 0 ? ['alt-uln-memory'] : [];
      if (!(value > limit.value)) return [];
      // A local protocol's multiple (5 × ULN is a study protocol's cut-off, not a label value) applies only when set.
      if (multiple.overridden && value > limit.value * multiple.value) {
        return [{ severity: 'review', text: `${drugList(drugs)} with ${name} ${shown(value, 0)} U/L (${latest.entry.date}): above ${thresholdText(multiple, 'study-protocol')} × ${limit.text}; ${wording}; ${forPrescriberReview}.`, triggers: [trigger(latest)], thresholds: [...usedThresholds, multiple], drugs, extraSourceIds: sourceUncertain }];
      }
      const previousLimit = previous ? upperLimitOf(previous.entry, assumed) : null;
      if (previous && previousLimit && previous.entry.measured.value > previousLimit.value) {
        return [{ severity: 'review', text: `${drugList(drugs)} with ${name} above the upper limit of normal on two consecutive results, ${shown(previous.entry.measured.value, 0)} U/L (${previous.entry.date}) and ${shown(value, 0)} U/L (${latest.entry.date}), against ${limit.text}: a persistent elevation; ${wording}; ${forPrescriberReview}.`, triggers: [trigger(previous), trigger(latest)], thresholds: usedThresholds, drugs, extraSourceIds: sourceUncertain }];
      }
      return [{ severity: 'information', text: `${drugList(drugs)} with ${name} ${shown(value, 0)} U/L (${latest.entry.date}), above ${limit.text} on this result only; ${wording}.`, triggers: [trigger(latest)], thresholds: usedThresholds, drugs, extraSourceIds: sourceUncertain }];
    });
  },
});

export const lowIronRule = defineRule({
  id: 'low-iron-on-chelation',
  title: (threshold) => `Ferritin consistently below ${threshold('ferritin-low').value} µg/L or LIC below ${threshold('lic-low').value} mg/g dry on deferasirox or deferiprone`,
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

/** An item of the monitoring calendar as a finding's trigger. */
function lastTrigger(item: MonitoringItem, name: string): TriggerValue[] {
  return item.lastDate ? [{ name: `last ${name}`, value: item.lastDate, unit: '', date: item.lastDate, ref: null }] : [];
}

export const deferiproneAncMonitoringRule = defineRule({
  id: 'deferiprone-anc-monitoring',
  title: 'Deferiprone: neutrophil counts by time on the drug (US label 2025)',
  severity: 'review',
  drugs: ['deferiprone'],
  sourceIds: ['deferiprone-label-us-2025'],
  uncertain: false,
  evaluate: (context) => {
    const runStart = continuousRunStart(context.caseFile.chelationPeriods, 'deferiprone', context.asOf);
    const item = context.monitoring.items.find((it) => it.id === 'neutrophils');
    if (runStart === null || !item || (item.status !== 'overdue' && item.lastDate !== null)) return [];
    const local = context.threshold('deferiprone-anc-interval');
    const thresholds = local.overridden ? [local] : [];
    const since = item.lastDate === null ? 'none on record' : `the last is from ${item.lastDate}`;
    if (item.lastDate === null || item.lastDate < runStart) {
      return [{ severity: 'review', text: `Deferiprone since ${runStart}: no absolute neutrophil count on record since then (${since}); ${item.why} ${capitalised(forPrescriberReview)}.`, triggers: lastTrigger(item, 'absolute neutrophil count'), thresholds }];
    }
    return [
      {
        severity: 'days' in item.interval && item.interval.days === 1 ? 'review' : 'information',
        text: `Deferiprone: the absolute neutrophil count was due on ${item.dueDate} (${item.intervalText}; ${since}, ${item.daysOverdue} days overdue on the review date). ${item.why}`,
        triggers: [...lastTrigger(item, 'absolute neutrophil count'), { name: 'days overdue', value: item.daysOverdue, unit: 'd', date: context.asOf, ref: null }],
        thresholds,
      },
    ];
  },
});

const deferasiroxTests = [
  { id: 'creatinine', name: 'serum creatinine' },
  { id: 'alt', name: 'ALT' },
  { id: 'ast', name: 'AST' },
  { id: 'bilirubin', name: 'serum bilirubin' },
] as const;

export const deferasiroxMonthlyTestsRule = defineRule({
  id: 'deferasirox-monthly-tests',
  title: 'Deferasirox: creatinine and liver tests due (monthly; more often in the first month and with renal risk)',
  severity: 'review',
  drugs: ['deferasirox'],
  sourceIds: ['deferasirox-label-us'],
  uncertain: false,
  evaluate: (context) => {
    if (!context.activeDrugs.has('deferasirox')) return [];
    return deferasiroxTests.flatMap(({ id, name }): FindingDraft[] => {
      const item = context.monitoring.items.find((it) => it.id === id);
      if (!item || (item.status !== 'overdue' && item.lastDate !== null)) return [];
      const since = item.lastDate === null ? 'none on record' : `the last is from ${item.lastDate}`;
      return [
        {
          severity: 'review',
          text: `Deferasirox: ${name} was due on ${item.dueDate} (${item.intervalText}; ${since}); ${item.why} ${capitalised(forPrescriberReview)}.`,
          triggers: lastTrigger(item, name),
        },
      ];
    });
  },
});

