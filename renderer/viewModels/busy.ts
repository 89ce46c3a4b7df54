import type { WorkProgress } from '../hostPort';
import { formatNumber } from './format';

/**
 * Long work of the workspace under way (reading the workspace, writing an
 * export), as the busy line shows it. `workId` is set for work the host
 * follows (an export), whose steps come from the host's workProgress.
 */
export interface BusyWork {
  readonly label: string;
  readonly done: number;
  /** Steps or cases foreseen; null before the first report (an indeterminate bar). */
  readonly total: number | null;
  /** The host's step under way, in words, or a note of our own ("Stopping: …"). */
  readonly step?: string;
  readonly workId?: string;
}

/**
 * The host's step with how many of the steps foreseen it is: "Checking 60,000 rows against the
 * case (step 3 of 4)" (`done` counts the steps finished before this one). Imports and exports alike.
 */
export function hostStepText(progress: WorkProgress): string {
  return `${progress.step} (step ${formatNumber(progress.done + 1, 0)} of ${formatNumber(progress.total, 0)})`;
}

/** The busy line's words: the work, then the host's step with its count, or the cases read so far ("120 of 1,000"). */
export function busyText(busy: BusyWork): string {
  if (busy.step !== undefined) {
    return busy.total === null ? `${busy.label}: ${busy.step}` : `${busy.label}: ${hostStepText({ step: busy.step, done: busy.done, total: busy.total })}`;
  }
  return busy.total === null ? `${busy.label}…` : `${busy.label}: ${formatNumber(busy.done, 0)} of ${formatNumber(busy.total, 0)}`;
}

/** The busy line's bar: done of foreseen, or an indeterminate bar (value null) before the first report. */
export function busyBar(busy: BusyWork): { readonly label: string; readonly value: number | null; readonly max: number | null } {
  return busy.total === null ? { label: busy.label, value: null, max: null } : { label: busy.label, value: busy.done, max: busy.total };
}

/** The busy state of an export once the host reports a step. */
export function exportBusy(label: string, workId: string, progress: WorkProgress): BusyWork {
  return { label, workId, step: progress.step, done: progress.done, total: progress.total };
}

/** Said on the busy line as soon as Cancel is pressed during an export, until the host answers. */
export const exportStoppingStep = 'Stopping: the host was asked to stop before it writes the file';

/** What the Sheet screen says when an export ends: written, stopped before the file was written, or written because the stop came too late. */
export function exportOutcomeText(what: 'review sheet' | 'monitoring calendar', outcome: { readonly location: string; readonly cancelAsked: boolean } | 'stopped'): string {
  const title = what === 'review sheet' ? 'Review sheet' : 'Monitoring calendar';
  if (outcome === 'stopped') return `Export stopped: the ${what} was not written.`;
  return outcome.cancelAsked ? `Too late to stop: the host had begun writing; ${title.toLowerCase()} written to ${outcome.location}` : `${title} written to ${outcome.location}`;
}
