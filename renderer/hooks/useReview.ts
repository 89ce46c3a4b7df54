import { useEffect, useMemo } from 'react';
import type { IsoDate } from '../../core/dates/isoDate';
import type { Case } from '../../core/model/caseFile';
import { useWorkspace } from '../state/store';
import { cachedReviewOf, type ReviewOutcome } from '../viewModels/review';

/** Today's date in UTC, 'YYYY-MM-DD': the review date of a case that names none (the renderer may read the clock; core never does). */
export function todayIso(): IsoDate {
  return new Date().toISOString().slice(0, 10) as IsoDate;
}

/** The open case as core last accepted it, its review date, and core's review of it (recomputed only when the case changes). */
export function useOpenReview(): { readonly caseFile: Case | null; readonly asOf: IsoDate; readonly outcome: ReviewOutcome | null } {
  const caseFile = useWorkspace((state) => state.accepted);
  const asOf = (caseFile?.review.reviewDate ?? todayIso()) as IsoDate;
  const outcome = useMemo(() => (caseFile ? cachedReviewOf(caseFile, asOf) : null), [caseFile, asOf]);
  return { caseFile, asOf, outcome };
}

/**
 * Compute the open case's review in the background once the record screen is
 * painted, so that moving to the Iron course, Regimens, Findings or Sheet
 * shows it at once.
 */
export function useReviewWarmUp(): void {
  const caseFile = useWorkspace((state) => state.accepted);
  useEffect(() => {
    if (!caseFile) return undefined;
    const timer = setTimeout(() => cachedReviewOf(caseFile, (caseFile.review.reviewDate ?? todayIso()) as IsoDate), 50);
    return () => clearTimeout(timer);
  }, [caseFile]);
}
