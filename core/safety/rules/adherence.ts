import { proportionOfDaysCovered } from '../../dosing/proportionOfDaysCovered';
import { defineRule } from '../rule';
import type { FindingDraft } from '../types';
import { capitalised, shown } from '../wording';

export const dispensingAdherenceRule = defineRule({
  id: 'adherence-from-dispensings',
  title: 'Proportion of days covered by dispensings, beside the entered adherence and the measured response',
  severity: 'information',
  drugs: ['deferoxamine', 'deferiprone', 'deferasirox'],
  sourceIds: ['nau-pqa-2012-pdc'],
  uncertain: false,
  evaluate: (context) =>
    context.caseFile.chelationPeriods.flatMap((period, index): FindingDraft[] => {
      if (period.startDate > context.asOf) return [];
      const supplies = context.caseFile.dispensings.filter((it) => it.drug === period.drug);
      if (supplies.length === 0) return [];
      const toDate = period.endDate !== null && period.endDate < context.asOf ? period.endDate : context.asOf;
      const covered = proportionOfDaysCovered(supplies, period.startDate, toDate);
      const ref = `chelationPeriods[${index}] ${period.id}`;
      const response = context.results.responses.at(-1);
      const responseText =
        response && response.measuredToExpectedRatio !== null && response.toDate > period.startDate
          ? `; between the LIC results of ${response.fromDate} and ${response.toDate} the measured removal was ${shown(response.measuredToExpectedRatio * 100, 0)} % of the expected, so a shortfall in supply ${covered.proportion < 0.8 ? 'may explain part of it' : 'does not look like the main reason'}`
          : '';
      return [
        {
          severity: 'information',
          text: `${capitalised(period.drug)} ${period.startDate} to ${toDate} (${ref}): ${covered.dispensings} dispensing(s) cover ${covered.coveredDays} of ${covered.periodDays} days, a proportion of days covered of ${shown(covered.proportion, 2)} (overlapping supplies carried forward; Nau, Pharmacy Quality Alliance 2012), beside the entered adherence estimate of ${shown(period.adherence, 2)}${responseText}.`,
          triggers: [
            { name: 'proportion of days covered', value: Number(covered.proportion.toFixed(4)), unit: '1', date: toDate, ref },
            { name: 'entered adherence', value: period.adherence, unit: '1', date: period.startDate, ref },
          ],
          drugs: [period.drug],
        },
      ];
    }),
});
