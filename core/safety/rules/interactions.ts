import { comparableDrugName } from '../../model/coMedication';
import { labelInteractions } from '../interactionCatalogue';
import { defineRule } from '../rule';
import type { FindingDraft } from '../types';
import { capitalised, forPrescriberReview } from '../wording';

export const labelInteractionRule = defineRule({
  id: 'label-listed-interaction',
  title: 'Co-medication named among a running chelator’s label-listed interactions (matched by generic name)',
  severity: 'review',
  drugs: ['deferoxamine', 'deferiprone', 'deferasirox'],
  sourceIds: ['interaction-matching-by-name'],
  uncertain: false,
  evaluate: (context) =>
    context.activeCoMedications.flatMap(({ coMedication, ref }): FindingDraft[] => {
      const name = comparableDrugName(coMedication.name);
      return labelInteractions
        .filter((entry) => context.activeDrugs.has(entry.chelator) && entry.members.some((member) => comparableDrugName(member) === name))
        .map((entry) => ({
          severity: 'review',
          text: `${capitalised(entry.chelator)} with ${coMedication.name} (${ref}, from ${coMedication.startDate}): ${coMedication.name} is matched by name to ${entry.labelled} (${entry.section}); ${entry.effect}; matching is by name and may miss a drug typed otherwise; ${forPrescriberReview}.`,
          triggers: [{ name: 'co-medication', value: coMedication.name, unit: '', date: coMedication.startDate, ref }],
          drugs: [entry.chelator],
          extraSourceIds: entry.sourceIds,
        }));
    }),
});
