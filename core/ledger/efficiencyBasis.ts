import { resolveAssumption } from '../assumptions';
import type { IsoDate } from '../dates/isoDate';
import type { ResponseSummary } from './responseSummary';
import type { ReviewContext } from './reviewContext';

/**
 * The one efficiency basis of a review: "estimated now", the projections and
 * the intake-against-removal finding all use it. The patient's measured
 * response (measured ÷ expected between the last two LIC results) is used
 * when that interval is usable — at least 180 days, one LIC method, chelation
 * expected, and one regimen on at least the stated share of the days
 * (assumption measured-response-regimen-share, 90 %) — and then scales the
 * drugs of that regimen; otherwise the published efficiencies.
 */
export interface EfficiencyBasis {
  readonly basis: 'measured' | 'published';
  /** measured ÷ expected (≥ 0), 1 on the published basis. */
  readonly ratio: number;
  /** Drugs the ratio applies to (the dominant regimen's). */
  readonly drugs: readonly string[];
  readonly interval: { readonly fromDate: IsoDate; readonly toDate: IsoDate } | null;
  /** Regimens that ran on the other days of the interval, with their days. */
  readonly mixed: readonly { readonly label: string; readonly days: number }[];
  /** The basis and its reason, in one sentence. */
  readonly statement: string;
}

/**
 * Chooses the review's efficiency basis from the measured responses.
 *
 * @param context - the review
 * @param responses - the measured responses, oldest first
 * @returns the basis with the reason stated once
 */
export function efficiencyBasisOf(context: ReviewContext, responses: readonly ResponseSummary[]): EfficiencyBasis {
  const share = resolveAssumption('measured-response-regimen-share', context.overrides).value;
  const last = responses[responses.length - 1];
  if (!last) {
    return { basis: 'published', ratio: 1, drugs: [], interval: null, mixed: [], statement: 'Efficiency basis: the published efficiencies (fewer than two LIC results on record, so no measured response).' };
  }
  const usable = last.caveats.length === 0 && last.measuredToExpectedRatio !== null && last.dominantRegimen.drugs.length > 0;
  if (!usable) {
    return {
      basis: 'published',
      ratio: 1,
      drugs: [],
      interval: { fromDate: last.fromDate, toDate: last.toDate },
      mixed: last.mixedRegimens,
      statement: `Efficiency basis: the published efficiencies; the measured response of ${last.fromDate} to ${last.toDate} is not used (${last.caveatText.join(' ')}).`,
    };
  }
  const ratio = Math.max(0, last.measuredToExpectedRatio!);
  const mixedText =
    last.mixedRegimens.length > 0
      ? `; the other ${Math.round((1 - last.dominantRegimen.share) * 100)} % of the days were mixed (${last.mixedRegimens.map((it) => `${it.label}: ${it.days} days`).join('; ')})`
      : '';
  return {
    basis: 'measured',
    ratio,
    drugs: last.dominantRegimen.drugs,
    interval: { fromDate: last.fromDate, toDate: last.toDate },
    mixed: last.mixedRegimens,
    statement: `Efficiency basis: the patient's measured response between the LIC results of ${last.fromDate} and ${last.toDate} (${Math.round(ratio * 100)} % of the published expectation, whether from dose response or adherence) scales ${last.dominantRegimen.drugs.join(' and ')}, whose regimen ran on ${Math.round(last.dominantRegimen.share * 100)} % of the days (the threshold is ${Math.round(share * 100)} %)${mixedText}; other drugs use the published efficiencies. Estimated now, the projections and the intake-against-removal finding all use this basis.`,
  };
}

/** The factor a drug's published-basis removal is multiplied by under a basis. */
export function basisScaleOf(basis: EfficiencyBasis, drug: string): number {
  return basis.drugs.includes(drug) ? basis.ratio : 1;
}
