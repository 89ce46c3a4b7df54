import type { SafetyRule } from '../rule';
import { cardiacT2StarOverdueRule, cardiacT2StarRule, ferritinLicDiscordanceRule, liverIronOverdueRule, mriFieldStrengthRule, positiveBalanceRule } from './ironRecord';
import { altRaisedRule, deferasiroxMonthlyTestsRule, deferiproneAncMonitoringRule, deferiproneNeutrophilsRule, lowIronRule } from './laboratory';
import {
  ascorbicAcidRule,
  chelatorCombinationRule,
  deferoxamineGrowthRule,
  deferoxamineHearingEyesRule,
  deferoxamineIntravenousRateRule,
  deferoxamineTherapeuticIndexRule,
  doseRangeRule,
  pregnancyRule,
} from './regimen';
import { deferasiroxCrclRule, deferasiroxCreatinineRiseRule, deferasiroxEgfrRule } from './renal';
import { dispensingAdherenceRule } from './adherence';
import { labelInteractionRule } from './interactions';
import { deferasiroxHepaticImpairmentRule, deferasiroxStartCriteriaRule, deferoxamineFerritinBandRule, productAdministrationsRule } from './labelDosing';

/** Every safety rule, in the order findings of equal severity are listed (patient, organs, dose, record). */
export const safetyRules: readonly SafetyRule[] = [
  pregnancyRule,
  cardiacT2StarRule,
  deferiproneNeutrophilsRule,
  deferiproneAncMonitoringRule,
  deferasiroxEgfrRule,
  deferasiroxCrclRule,
  deferasiroxCreatinineRiseRule,
  deferasiroxHepaticImpairmentRule,
  altRaisedRule,
  lowIronRule,
  doseRangeRule,
  productAdministrationsRule,
  labelInteractionRule,
  deferoxamineGrowthRule,
  deferoxamineIntravenousRateRule,
  deferoxamineTherapeuticIndexRule,
  ascorbicAcidRule,
  positiveBalanceRule,
  mriFieldStrengthRule,
  ferritinLicDiscordanceRule,
  deferasiroxMonthlyTestsRule,
  liverIronOverdueRule,
  cardiacT2StarOverdueRule,
  deferoxamineHearingEyesRule,
  chelatorCombinationRule,
  deferasiroxStartCriteriaRule,
  deferoxamineFerritinBandRule,
  dispensingAdherenceRule,
];

const ids = new Set<string>();
for (const rule of safetyRules) {
  if (ids.has(rule.id)) throw new Error(`Duplicate safety rule id ${rule.id}`);
  ids.add(rule.id);
}
