import { addMonthsIso, type IsoDate } from '../dates';
import type { Case } from '../model/caseFile';
import { resultsOfKindBetween } from '../model/resultsOfKindBetween';

/** Below this ANC (× 10⁹/L) deferiprone is interrupted for neutropenia: US label (March 2025) §5.1 (references.md §4, §9). */
export const ancNeutropeniaBelow = 1.5;

export interface AncInterval {
  readonly days: number;
  /** The step of the schedule, in the label's words. */
  readonly step: 'neutropenia' | 'first-6-months' | 'months-7-to-12' | 'after-a-year' | 'after-a-year-with-low-anc' | 'local-protocol';
  /** A sentence for the calendar and the findings. */
  readonly why: string;
}

/**
 * How often the absolute neutrophil count is due on deferiprone, by time on
 * the drug (US label, March 2025 revision, §2.1 and §5.1; references.md §9):
 * weekly for the first 6 months, every 2 weeks for the next 6 months, then
 * every 2 to 4 weeks (or at the transfusion interval) after a year without an
 * interruption for low ANC; during neutropenia (latest ANC below 1.5 × 10⁹/L)
 * daily until recovery. Due dates after the first year use 4 weeks, the
 * label's longest interval; when the first year had an ANC below 1.5 the count
 * stays every 2 weeks (the label's condition for the longer interval is not
 * met). A local protocol's fixed interval ("weekly throughout", the older
 * texts) replaces the schedule when given.
 *
 * @param theCase - a parsed case; not changed
 * @param runStart - first day of the unbroken deferiprone run ('YYYY-MM-DD')
 * @param asOf - review date
 * @param localIntervalDays - a local protocol's fixed interval in days (1–90), or undefined for the label's schedule
 * @returns the interval in days and the step of the schedule
 * @example deferiproneAncInterval(theCase, '2026-01-01', '2026-03-01', undefined).days === 7 (first 6 months)
 */
export function deferiproneAncInterval(theCase: Case, runStart: IsoDate, asOf: IsoDate, localIntervalDays: number | undefined): AncInterval {
  const counts = resultsOfKindBetween(theCase.results, 'neutrophils', runStart, asOf);
  const latest = counts.at(-1);
  if (latest && latest.measured.value < ancNeutropeniaBelow) {
    return { days: 1, step: 'neutropenia', why: `On deferiprone with the latest ANC ${latest.measured.value} below ${ancNeutropeniaBelow} × 10⁹/L (${latest.date}): the label follows the count daily until recovery (US label 2025 §5.1).` };
  }
  if (localIntervalDays !== undefined) {
    return { days: localIntervalDays, step: 'local-protocol', why: `On deferiprone: ANC every ${localIntervalDays} days by the local protocol (the 2025 US label's schedule runs by time on the drug).` };
  }
  if (asOf < addMonthsIso(runStart, 6)) {
    return { days: 7, step: 'first-6-months', why: `On deferiprone since ${runStart}: ANC weekly during the first 6 months (US label 2025 §2.1, §5.1).` };
  }
  const firstYearEnds = addMonthsIso(runStart, 12);
  if (asOf < firstYearEnds) {
    return { days: 14, step: 'months-7-to-12', why: `On deferiprone since ${runStart}: ANC every 2 weeks during months 7 to 12 (US label 2025 §2.1, §5.1).` };
  }
  const lowInRun = counts.some((it) => it.measured.value < ancNeutropeniaBelow);
  if (lowInRun) {
    return { days: 14, step: 'after-a-year-with-low-anc', why: `On deferiprone for more than a year with an ANC below ${ancNeutropeniaBelow} × 10⁹/L on record since ${runStart}: the label's longer interval is for a year without an interruption for low ANC, so every 2 weeks is kept here (US label 2025 §2.1).` };
  }
  return { days: 28, step: 'after-a-year', why: `On deferiprone for more than a year without a low ANC on record: ANC every 2 to 4 weeks or at the transfusion interval (US label 2025 §2.1); due here at 4 weeks, the label's longest interval.` };
}
