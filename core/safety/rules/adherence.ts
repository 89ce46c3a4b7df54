import { addDaysIso } from '../../dates/isoDate';
import { coveredWindow, periodAdherence } from '../../ledger/periodAdherence';
import { defineRule } from '../rule';
import type { FindingDraft } from '../types';
import { capitalised, shown } from '../wording';

/**
 * A proportion of days covered of at least 0.80 is the usual threshold of
 * adequate adherence in the Pharmacy Quality Alliance's measures (nau-pqa-2012-pdc).
 */
const adequateProportion = 0.8;

export const dispensingAdherenceRule = defineRule({
  id: 'adherence-from-dispensings',
  title: 'Proportion of days covered by dispensings, beside the entered adherence and the measured response',
  severity: 'information',
  drugs: ['deferoxamine', 'deferiprone', 'deferasirox'],
  sourceIds: ['nau-pqa-2012-pdc', 'pdc-feeds-expected-removal-choice'],
  uncertain: false,
  evaluate: (context) =>
    context.caseFile.chelationPeriods.flatMap((period, index): FindingDraft[] => {
      if (period.startDate > context.asOf) return [];
      const adherence = periodAdherence(context.caseFile, period, context.asOf);
      const covered = adherence.covered;
      if (covered === null) return [];
      const ref = `chelationPeriods[${index}] ${period.id}`;
      const periodEnd = period.endDate ?? context.asOf;
      // The latest interval between LIC results that shares days with the period and was measured on it.
      const response = [...context.results.responses]
        .reverse()
        .find((it) => it.measuredToExpectedRatio !== null && it.toDate > period.startDate && it.fromDate < periodEnd);
      const intervalFrom = response ? (addDaysIso(response.fromDate, 1) > period.startDate ? addDaysIso(response.fromDate, 1) : period.startDate) : null;
      const intervalTo = response ? (response.toDate < periodEnd ? response.toDate : periodEnd) : null;
      const inInterval = response && intervalFrom !== null && intervalTo !== null && intervalFrom <= intervalTo ? coveredWindow(context.caseFile, period.drug, intervalFrom, intervalTo) : null;
      const responseText =
        response && inInterval
          ? `. Between the LIC results of ${response.fromDate} and ${response.toDate} the dispensings cover ${inInterval.coveredDays} of ${inInterval.periodDays} days (${shown(inInterval.proportion, 2)}, ${inInterval.proportion < adequateProportion ? 'below' : 'at or above'} the 0.80 usually taken as adequate) and the measured removal was ${shown(response.measuredToExpectedRatio! * 100, 0)} % of the expected; as the expected removal already counts the days covered, a shortfall against it looks like response rather than supply, and a low proportion of days covered looks like supply`
          : '';
      return [
        {
          severity: 'information',
          text: `${capitalised(period.drug)} ${covered.fromDate} to ${covered.toDate} (${ref}): ${covered.dispensings} dispensing(s) cover ${covered.coveredDays} of ${covered.periodDays} days, a proportion of days covered of ${shown(covered.proportion, 2)} (overlapping supplies carried forward; Nau, Pharmacy Quality Alliance 2012), beside the entered adherence estimate of ${shown(period.adherence, 2)}; the expected removal of this period uses the proportion of days covered${responseText}.`,
          triggers: [
            { name: 'proportion of days covered', value: Number(covered.proportion.toFixed(4)), unit: '1', date: covered.toDate, ref },
            { name: 'entered adherence', value: period.adherence, unit: '1', date: period.startDate, ref },
            ...(response && inInterval
              ? [
                  { name: 'proportion of days covered between the LIC results', value: Number(inInterval.proportion.toFixed(4)), unit: '1', date: response.toDate, ref: null },
                  { name: 'measured ÷ expected removal', value: Number(response.measuredToExpectedRatio!.toFixed(4)), unit: '1', date: response.toDate, ref: null },
                ]
              : []),
          ],
          drugs: [period.drug],
        },
      ];
    }),
});
