import type { HostValue } from '../../core/contract';

/**
 * The long work the host is doing for the page (an import's dry run or its
 * commit), by the work id the page gave the call: the step under way, for
 * `workProgress`, and a cancel, for `cancelWork`. The work itself asks its
 * ticket, between steps, whether it was cancelled; nothing is interrupted in
 * the middle of a step, and once a ticket is marked unstoppable (a save has
 * begun) a cancel is answered `{ stopping: false }`: what is being written is
 * written.
 *
 * A cancel may reach the host before the call it names (two requests on their
 * way at once): it is remembered, and the work starts cancelled and stops at
 * its first step. Finished and early-cancelled ids are remembered for a while
 * (the last `rememberedIds`), so that a late cancel is answered truthfully.
 */

export type WorkProgress = NonNullable<HostValue<'workProgress'>>;

/** What a piece of work holds while it runs. */
export interface WorkTicket {
  /**
   * Say which step begins (in words) and how many of the steps foreseen are done, then
   * yield a moment so that a progress poll or a cancel waiting for the host is answered.
   */
  report(step: string, done: number, total: number): Promise<void>;
  /** True once the page has asked to stop this work. */
  cancelled(): boolean;
  /** From here on the work does not stop (a save has begun); a later cancel is told so. */
  unstoppable(): void;
}

export interface WorkInProgress {
  /**
   * Run `work` with a ticket under `workId`; without an id (the command line, a caller that
   * does not follow the work) the ticket reports to no one and is never cancelled.
   */
  run<T>(workId: string | undefined, work: (ticket: WorkTicket) => Promise<T>): Promise<T>;
  /** The step under way of the work of that id, or null when none of that id is running. */
  progress(workId: string): WorkProgress | null;
  /** Ask the work of that id to stop at its next step; `stopping` says whether it will. */
  cancel(workId: string): { readonly stopping: boolean };
}

/**
 * The pause after each reported step, in milliseconds: a modelling choice of
 * ours. The import's steps are synchronous work on the host's one thread, so
 * a poll from the page is answered only between them; 15 ms is long enough for
 * the waiting requests to be read and answered and adds well under a tenth of
 * a second to an import of four steps.
 */
export const stepYieldMs = 15;

/** How many finished or early-cancelled ids are remembered (a modelling choice of ours: far more than a page starts in a minute). */
const rememberedIds = 200;

type Stage = 'waiting' | 'running' | 'unstoppable' | 'finished';

interface Entry {
  stage: Stage;
  cancelRequested: boolean;
  progress: WorkProgress | null;
}

const pause = () => new Promise<void>((resolve) => setTimeout(resolve, stepYieldMs));

/** A ticket followed by no one: steps go unreported and unpaused, and it is never cancelled. */
const untracked: WorkTicket = { report: () => Promise.resolve(), cancelled: () => false, unstoppable: () => undefined };

/** A new registry of running work (one per host: hostServices.ts makes it). */
export function createWorkInProgress(): WorkInProgress {
  const entries = new Map<string, Entry>();
  /** Forget the oldest ids that are not running once more than `rememberedIds` are kept. */
  const trim = () => {
    let excess = entries.size - rememberedIds;
    for (const [workId, entry] of entries) {
      if (excess <= 0) break;
      if (entry.stage === 'waiting' || entry.stage === 'finished') {
        entries.delete(workId);
        excess -= 1;
      }
    }
  };
  return {
    async run(workId, work) {
      if (workId === undefined) return work(untracked);
      const earlier = entries.get(workId);
      const entry: Entry = { stage: 'running', cancelRequested: earlier?.stage === 'waiting' && earlier.cancelRequested, progress: null };
      // Re-inserted, so the id counts as the newest when old ones are forgotten.
      entries.delete(workId);
      entries.set(workId, entry);
      const ticket: WorkTicket = {
        report: async (step, done, total) => {
          entry.progress = { step, done, total };
          await pause();
        },
        cancelled: () => entry.cancelRequested,
        unstoppable: () => {
          if (entry.stage === 'running') entry.stage = 'unstoppable';
        },
      };
      try {
        return await work(ticket);
      } finally {
        entry.stage = 'finished';
        entry.progress = null;
        trim();
      }
    },
    progress(workId) {
      const entry = entries.get(workId);
      return entry && (entry.stage === 'running' || entry.stage === 'unstoppable') ? entry.progress : null;
    },
    cancel(workId) {
      const entry = entries.get(workId);
      if (!entry) {
        entries.set(workId, { stage: 'waiting', cancelRequested: true, progress: null });
        trim();
        return { stopping: true };
      }
      if (entry.stage === 'waiting' || entry.stage === 'running') {
        entry.cancelRequested = true;
        return { stopping: true };
      }
      return { stopping: false };
    },
  };
}

/**
 * The steps of one piece of work, counted on its ticket: each call reports the step that begins
 * (with the steps done of those foreseen) and answers whether to go on (false: cancelled).
 * `repeated` adds a step not foreseen (an import's check run again).
 *
 * @param ticket - the work's ticket
 * @param foreseen - steps expected at the start
 */
export function countedSteps(ticket: WorkTicket, foreseen: number): (step: string, repeated?: boolean) => Promise<boolean> {
  let done = 0;
  let total = foreseen;
  return async (step, repeated = false) => {
    if (repeated) total += 1;
    await ticket.report(step, done, total);
    done += 1;
    return !ticket.cancelled();
  };
}
