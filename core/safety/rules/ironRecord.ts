import { addMonthsIso } from '../../dates/isoDate';
import { licFromR2Star } from '../../iron/licFromR2Star';
import { r2StarCalibration, r2StarCalibrationIds, type R2StarCalibrationId } from '../../iron/r2StarCalibrations';
import { perSecond, tesla } from '../../units/quantity';
import { defineRule } from '../rule';
import { thresholdText } from '../../thresholds';
import type { FindingDraft, TriggerValue } from '../types';
import { forPrescriberReview, shown } from '../wording';

export const cardiacT2StarRule = defineRule({
  id: 'cardiac-t2star',
  title: (threshold) => {
    const [severe, iron] = [threshold('cardiac-t2star-severe').value, threshold('cardiac-t2star-iron').value];
    return `Cardiac T2*: heart iron (below ${severe} ms severe; ${severe}–${iron} ms mild to moderate)`;
  },
  severity: 'urgent',
  drugs: [],
  sourceIds: ['anderson-2001', 'kirk-2009'],
  uncertain: false,
  evaluate: (context) => {
    const latest = context.resultsOf('cardiac-t2star').at(-1);
    if (!latest) return [];
    const t2Star = latest.entry.measured.value;
    const severe = context.threshold('cardiac-t2star-severe');
    const iron = context.threshold('cardiac-t2star-iron');
    const fieldNote = latest.entry.fieldStrengthT === 3 ? '; measured at 3 T, while the thresholds were set at 1.5 T (T2* is shorter at 3 T)' : '';
    const opening = `Cardiac T2* ${shown(t2Star, 1)} ms (${latest.entry.fieldStrengthT} T, ${latest.entry.date})`;
    const triggers: TriggerValue[] = [{ name: 'cardiac T2*', value: t2Star, unit: 'ms', date: latest.entry.date, ref: latest.ref }];
    if (t2Star < severe.value) {
      return [{ severity: 'urgent', text: `${opening}: below ${thresholdText(severe, 'published')} ms, severe heart iron with a high risk of heart failure (Kirk 2009)${fieldNote}; ${forPrescriberReview}.`, triggers, thresholds: [severe], extraSourceIds: ['kirk-2009'] }];
    }
    if (t2Star <= iron.value) {
      return [{ severity: 'review', text: `${opening}: ${severe.value}–${iron.value} ms, mild to moderate heart iron (Anderson 2001)${fieldNote}; ${forPrescriberReview}.`, triggers, thresholds: [severe, iron] }];
    }
    return [];
  },
});

export const mriFieldStrengthRule = defineRule({
  id: 'mri-field-strength-mismatch',
  title: 'MRI liver iron: calibration and field strength disagree',
  severity: 'review',
  drugs: [],
  sourceIds: ['hernando-2022', 'common-practice'],
  uncertain: false,
  evaluate: (context) =>
    context.resultsOf('liver-iron').flatMap(({ entry, ref }): FindingDraft[] => {
      if (entry.method === 'biopsy' || entry.method === 'mri-r2') return [];
      if (!(r2StarCalibrationIds as readonly string[]).includes(entry.calibrationId)) return [];
      const calibration = r2StarCalibration(entry.calibrationId as R2StarCalibrationId);
      const trigger: TriggerValue = { name: `liver ${entry.method} field strength`, value: entry.fieldStrengthT, unit: 'T', date: entry.date, ref };
      if (entry.method === 'mri') {
        // A liver iron the report gives: the stated calibration must belong to the scan's field strength too.
        if (calibration.fieldStrengthTesla === entry.fieldStrengthT) return [];
        return [
          {
            severity: 'review',
            text: `Liver iron ${shown(entry.measured.value, 1)} ${entry.measured.unit === 'mg/g{dry}' ? 'mg/g dry' : entry.measured.unit} of ${entry.date} was measured at ${entry.fieldStrengthT} T but is recorded with the ${calibration.label} calibration for ${calibration.fieldStrengthTesla} T; a calibration applies only at its own field strength; ${forPrescriberReview}.`,
            triggers: [trigger],
          },
        ];
      }
      const r2Star = entry.method === 'mri-r2star' ? entry.measured.value : 1000 / entry.measured.value;
      const converted = licFromR2Star(perSecond(r2Star), tesla(entry.fieldStrengthT), calibration);
      if (converted.ok || !converted.issues.some((it) => it.code === 'field_strength_mismatch')) return [];
      return [
        {
          severity: 'review',
          text: `Liver ${entry.method === 'mri-r2star' ? 'R2*' : 'T2*'} of ${entry.date} measured at ${entry.fieldStrengthT} T is recorded with the ${calibration.label} calibration for ${calibration.fieldStrengthTesla} T: R2* rises with field strength, so the conversion is refused and the result is left out of the liver iron account; a calibration derived at ${entry.fieldStrengthT} T, or the liver iron the MRI report gives, is needed; ${forPrescriberReview}.`,
          triggers: [trigger],
        },
      ];
    }),
});

export const ferritinLicDiscordanceRule = defineRule({
  id: 'ferritin-lic-discordance',
  title: 'Ferritin and liver iron moving in opposite directions',
  severity: 'review',
  drugs: [],
  sourceIds: ['ferritin-guideline-literature'],
  uncertain: false,
  evaluate: (context) => {
    const ferritin = context.results.ferritin;
    const last = context.results.responses.at(-1);
    if (!ferritin.discordantWithLic || !ferritin.trend || !last) return [];
    const licDirection = last.toLicMgPerGDry > last.fromLicMgPerGDry ? 'rose' : 'fell';
    return [
      {
        severity: 'review',
        text: `Ferritin is ${ferritin.trend.direction} (${shown(ferritin.trend.changePerYear * 100, 0)} % a year since ${ferritin.windowFrom}) while liver iron ${licDirection} from ${shown(last.fromLicMgPerGDry, 1)} to ${shown(last.toLicMgPerGDry, 1)} mg/g dry (${last.fromDate} to ${last.toDate}): the two markers disagree; liver iron is the more direct measure${ferritin.note ? `; ${ferritin.note}` : ''}; ${forPrescriberReview}.`,
        triggers: [
          { name: 'ferritin change per year', value: ferritin.trend.changePerYear, unit: '1/a', date: ferritin.latest?.date ?? null, ref: null },
          { name: 'liver iron', value: last.toLicMgPerGDry, unit: 'mg/g{dry}', date: last.toDate, ref: null },
        ],
      },
    ];
  },
});

export const liverIronOverdueRule = defineRule({
  id: 'liver-iron-overdue',
  title: (threshold) => `No liver iron result in the last ${threshold('lic-interval').value} months`,
  severity: 'review',
  drugs: [],
  sourceIds: ['mri-monitoring-interval-memory'],
  uncertain: true,
  evaluate: (context) => {
    const yearAgo = addMonthsIso(context.asOf, -12);
    const transfusedThisYear = context.caseFile.transfusions.some((it) => it.date > yearAgo && it.date <= context.asOf);
    if (context.active.length === 0 && !transfusedThisYear) return [];
    const interval = context.threshold('lic-interval');
    const latest = context.resultsOf('liver-iron').at(-1);
    if (latest && latest.entry.date >= addMonthsIso(context.asOf, -interval.value)) return [];
    const why = context.active.length > 0 ? 'on chelation' : 'transfused in the last year';
    return [
      {
        severity: 'review',
        text: `No liver iron result in the last ${interval.value} months (${latest ? `last ${latest.entry.date}` : 'none on record'}) for a patient ${why}; liver iron is usually measured about yearly (from memory); ${forPrescriberReview}.`,
        triggers: latest ? [{ name: 'last liver iron result', value: latest.entry.measured.value, unit: latest.entry.measured.unit, date: latest.entry.date, ref: latest.ref }] : [],
        thresholds: [interval],
      },
    ];
  },
});

export const cardiacT2StarOverdueRule = defineRule({
  id: 'cardiac-t2star-overdue',
  title: (threshold) => `Thalassaemia major from 10 years: no cardiac T2* in the last ${threshold('cardiac-t2star-interval-short').value}–${threshold('cardiac-t2star-interval-long').value} months`,
  severity: 'review',
  drugs: [],
  sourceIds: ['mri-monitoring-interval-memory'],
  uncertain: true,
  evaluate: (context) => {
    // The same applicability as the monitoring calendar (thalassaemia major from 10 years), so the two never disagree.
    if (context.monitoring.notApplicable.some((it) => it.id === 'cardiac-t2star')) return [];
    const short = context.threshold('cardiac-t2star-interval-short');
    const long = context.threshold('cardiac-t2star-interval-long');
    const latest = context.resultsOf('cardiac-t2star').at(-1);
    const triggers: TriggerValue[] = latest ? [{ name: 'last cardiac T2*', value: latest.entry.measured.value, unit: 'ms', date: latest.entry.date, ref: latest.ref }] : [];
    const practice = `in thalassaemia major cardiac T2* is usually measured every ${short.value}–${long.value} months (from memory)`;
    if (!latest || latest.entry.date < addMonthsIso(context.asOf, -long.value)) {
      return [{ severity: 'review', text: `No cardiac T2* in the last ${long.value} months (${latest ? `last ${latest.entry.date}` : 'none on record'}); ${practice}; ${forPrescriberReview}.`, triggers, thresholds: [long] }];
    }
    if (latest.entry.date < addMonthsIso(context.asOf, -short.value)) {
      return [{ severity: 'information', text: `The last cardiac T2* is from ${latest.entry.date}, more than ${short.value} months before the review date; ${practice}.`, triggers, thresholds: [short, long] }];
    }
    return [];
  },
});

export const positiveBalanceRule = defineRule({
  id: 'positive-projected-balance',
  title: 'Intake above the expected removal of the current regimen',
  severity: 'review',
  drugs: [],
  sourceIds: ['angelucci-2000', 'porter-efficiency-memory'],
  uncertain: true,
  evaluate: (context) => {
    const results = context.results;
    const current = results.projection?.scenarios.find((scenario) => scenario.id === 'current');
    if (current) {
      // A net within rounding of zero (shown to 2 decimals) is not a finding.
      if (!(current.netMgPerKgPerDay >= 0.005)) return [];
      const milestone = current.milestones[0];
      return [
        {
          severity: 'review',
          text: `At this regimen intake exceeds the expected removal by ${shown(current.netMgPerKgPerDay, 2)} mg/kg/day (${current.name}; net of basal loss, ${current.efficiencyBasis} efficiency; trailing-year intake to ${results.asOf}); the projected liver iron rises; ${forPrescriberReview}.`,
          triggers: [
            { name: 'projected net iron balance', value: current.netMgPerKgPerDay, unit: 'mg/kg/d', date: results.asOf, ref: null, ...(milestone ? { derivation: milestone.derivation } : {}) },
            { name: 'expected removal', value: current.removalMgPerDay, unit: 'mg/d', date: results.asOf, ref: null },
          ],
        },
      ];
    }
    // No liver iron, so no projection: compare the trailing-year intake with the regimens' expected removal.
    // Net of basal loss, as the projection is (basal loss about 1 mg/day, assumption basal-iron-loss-mg-per-day).
    const removal = results.currentRegimens.reduce((sum, regimen) => sum + regimen.expectedRemovalMgPerKgPerDay, 0);
    const basalMgPerKgPerDay = (results.assumptions.find((it) => it.id === 'basal-iron-loss-mg-per-day')?.value ?? 1) / results.patient.weightKg;
    const net = results.intake.mgPerKgPerDay - removal - basalMgPerKgPerDay;
    if (!(net >= 0.005)) return [];
    return [
      {
        severity: 'review',
        text: `At the current regimen${results.currentRegimens.length === 0 ? ' (no chelation)' : ''} intake exceeds the expected removal by ${shown(net, 2)} mg/kg/day (trailing-year intake ${shown(results.intake.mgPerKgPerDay, 2)} mg/kg/day, net of basal loss; no liver iron on record, so no projection); ${forPrescriberReview}.`,
        triggers: [{ name: 'trailing-year intake', value: results.intake.mgPerKgPerDay, unit: 'mg/kg/d', date: results.asOf, ref: null, derivation: results.intake.derivation }],
      },
    ];
  },
});

