import { addDaysIso, type IsoDate } from '../dates/isoDate';
import { daysPerMonth } from '../units/time';
import type { LedgerNotice } from './caseToLedger';
import { logLinearTrend, type LogLinearTrend } from './logLinearTrend';
import type { ResponseSummary } from './responseSummary';
import type { ReviewContext } from './reviewContext';

export interface FerritinSummary {
  readonly trend: LogLinearTrend | null;
  readonly windowFrom: IsoDate;
  readonly latest: { readonly date: IsoDate; readonly valueUgPerL: number } | null;
  readonly discordantWithLic: boolean;
  readonly note: string | null;
}

/**
 * The ferritin trend over a window before the review date (log-linear
 * slope), the latest value, and whether it moves against the last LIC
 * interval; a note where ferritin is a poor marker (sickle cell disease).
 *
 * @param context - the review (see reviewContext.ts)
 * @param windowMonths - trend window, months before the review date (mean calendar months)
 * @param lastResponse - the latest measured LIC interval, if any
 */
export function ferritinSummary(
  context: ReviewContext,
  windowMonths: number,
  lastResponse: ResponseSummary | undefined,
): { readonly ferritin: FerritinSummary; readonly notices: readonly LedgerNotice[] } {
  const { caseFile, asOf } = context;
  const windowFrom = addDaysIso(asOf, -Math.round(windowMonths * daysPerMonth));
  const points = caseFile.results
    .filter((it): it is Extract<typeof it, { readonly kind: 'ferritin' }> => it.kind === 'ferritin' && it.date <= asOf)
    .map((it) => ({ date: it.date, value: it.measured.value }))
    .sort((a, b) => a.date.localeCompare(b.date));
  const trend = logLinearTrend(points.filter((it) => it.date >= windowFrom));
  const latest = points[points.length - 1];
  const licDirection = lastResponse ? Math.sign(lastResponse.toLicMgPerGDry - lastResponse.fromLicMgPerGDry) : 0;
  const ferritinDirection = trend ? (trend.direction === 'rising' ? 1 : trend.direction === 'falling' ? -1 : 0) : 0;
  const discordantWithLic = licDirection !== 0 && ferritinDirection !== 0 && licDirection !== ferritinDirection;
  const note =
    caseFile.patient.diagnosisGroup === 'sickle-cell-disease'
      ? 'Ferritin is a poor marker of iron load in sickle cell disease (inflammation raises it); rely on liver iron.'
      : null;
  const notices: LedgerNotice[] = discordantWithLic
    ? [{ severity: 'review', text: `Ferritin is ${trend!.direction} while the last LIC interval moved the other way: the two markers disagree; liver iron is the more direct measure.` }]
    : [];
  return {
    ferritin: { trend, windowFrom, latest: latest ? { date: latest.date, valueUgPerL: latest.value } : null, discordantWithLic, note },
    notices,
  };
}
