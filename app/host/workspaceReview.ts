import { Worker, type MessagePort } from 'node:worker_threads';
import { rankOutcomes, reviewPanelEntry, type PanelOptions, type PanelOutcome, type PanelReview } from '../../core/panel';
import { fail, issue, ok, type Result } from '../../core/result';
import { join } from 'node:path';
import { prepareToReadManyCases } from '../../core/model/parseCase';
import { readCaseFile } from './caseFiles';
import type { CaseStore } from './caseStore';

/**
 * The review of a whole workspace (the command line's `panel`): every case
 * file read, validated, computed and checked (core/panel reviewPanelEntry),
 * then all of them ranked together (core/panel rankOutcomes). The per-case work
 * is shared between this thread and worker threads (one thread per core but one); the
 * ranking runs here on the collected outcomes, so the result is the same, row
 * for row and value for value, whatever the number of threads. A worker that
 * cannot start or fails hands its unfinished cases back, and they are reviewed
 * here: no case is ever dropped.
 */

/** The worker threads a review may use: the bundled worker script and the number of threads in all, this one included. */
export interface WorkspaceWorkers {
  /** A CommonJS file that runs app/host/workspaceWorker.ts (built beside dist/cli.cjs as dist/workspaceWorker.cjs). */
  readonly script: string;
  /** Threads in all (1: this thread alone, no worker). */
  readonly threads: number;
}

/** The environment variable that sets the number of threads of a workspace review (1 for a single-threaded run). */
export const workersVariable = 'CHELATION_LEDGER_WORKERS';

/** The most threads a review uses whatever the machine: more gain nothing on a folder of a few thousand files (a modelling choice of ours). */
export const maxReviewThreads = 16;

/**
 * Cores left to V8's own threads: with one thread reviewing, its compiler and
 * garbage collector already keep about half of a second core busy (measured on
 * the 2-core machine of bench/results: 1,000 cases took 2.8 s of wall time
 * and 4.0 s of processor time), so on two cores a second reviewing thread
 * made the review slower, not faster (3.1 s against 2.8 s). A modelling
 * choice of ours, from that measurement.
 */
export const coresLeftToTheEngine = 1;

/**
 * The threads of a workspace review from the environment: `CHELATION_LEDGER_WORKERS`
 * when set (a whole number 1–16), else one per core but {@link coresLeftToTheEngine}.
 *
 * @param env - the process environment
 * @param cores - os.availableParallelism()
 * @param script - the bundled worker script
 * @returns the plan, or an issue naming the variable, its value and the range
 * @example workspaceWorkersFrom({}, 4, 'dist/workspaceWorker.cjs') → ok({ script: 'dist/workspaceWorker.cjs', threads: 3 })
 */
export function workspaceWorkersFrom(env: Readonly<Record<string, string | undefined>>, cores: number, script: string): Result<WorkspaceWorkers> {
  const raw = env[workersVariable];
  if (raw === undefined || raw.trim() === '') return ok({ script, threads: Math.max(1, Math.min(maxReviewThreads, Math.floor(cores) - coresLeftToTheEngine)) });
  const threads = Number(raw);
  if (!/^\s*\d+\s*$/.test(raw) || threads < 1 || threads > maxReviewThreads) {
    return fail(issue('out_of_range', [workersVariable], `${workersVariable} "${raw.slice(0, 40)}" is not a number of threads for a workspace review: a whole number 1–${maxReviewThreads} (1 reviews in one thread).`));
  }
  return ok({ script, threads });
}

/** How the review was shared out: for tests and diagnostics; the review itself does not depend on it. */
export interface ReviewSharing {
  /** Worker threads started (0: the review ran in this thread alone). */
  readonly workersStarted: number;
  readonly reviewedInWorkers: number;
  readonly reviewedHere: number;
  /** Why a worker stopped before its cases were done (its cases were then reviewed here). */
  readonly workerFailures: readonly string[];
}

export interface WorkspaceReviewOptions extends PanelOptions {
  /** Absent or null: this thread alone. */
  readonly workers?: WorkspaceWorkers | null;
}

/** Cases sent to a worker at a time, and how many batches it holds so it never waits for the next (modelling choices of ours). */
const batchCases = 10;
const batchesAhead = 2;
/** Fewer cases than this per thread and a worker costs more to start than it saves (a modelling choice of ours). */
const minCasesPerThread = 16;

/** A batch sent to a worker, and what it answers. */
interface BatchRequest {
  readonly batchId: number;
  readonly fileNames: readonly string[];
}
interface BatchAnswer {
  readonly batchId: number;
  readonly outcomes: readonly PanelOutcome[];
}
/** What a worker is started with. */
export interface ReviewWorkerData {
  readonly folder: string;
  readonly panel: PanelOptions;
}

const messageOf = (error: unknown): string => (error instanceof Error ? `${error.name}: ${error.message}` : String(error)).split('\n')[0]!.slice(0, 300);

/**
 * One case: read, validated and reviewed; an unexpected fault becomes a reason beside the ranking, never a lost case.
 * Read as the command line reads a case (app/host/caseFiles.ts readCaseFile: one synchronous read), not
 * opened through the store: a review writes nothing, so it needs neither the file's revision nor its
 * journal, and a thread that computes between reads gains nothing from reading asynchronously.
 * The messages are the store's (tests/app/host/workspaceReview.test.ts compares them).
 */
function outcomeOf(folder: string, fileName: string, panel: PanelOptions): PanelOutcome {
  try {
    const read = readCaseFile(join(folder, fileName));
    const loaded = read.ok ? read : fail(...read.issues.filter((it) => it.severity === 'error'));
    return reviewPanelEntry({ fileName, loaded }, panel);
  } catch (error) {
    return {
      fileName,
      label: null,
      issues: [issue('host_failed', [], `${fileName} could not be reviewed: an unexpected fault of the tool (${messageOf(error)}). The file was not changed; run check on it, and report the fault.`)],
    };
  }
}

/** Cases reviewed in this thread, one after another. */
const reviewHere = (folder: string, fileNames: readonly string[], panel: PanelOptions): PanelOutcome[] => fileNames.map((fileName) => outcomeOf(folder, fileName, panel));

/**
 * Review and rank every case file of a workspace folder.
 *
 * @param store - the workspace's case store (its folder is what workers open)
 * @param options - the review date (`asOf`, else each case's own, else `today`) and the threads to use
 * @returns the ranked review (core/panel's PanelReview) with how it was shared out, or why the folder could not be listed
 */
export async function reviewWorkspace(store: CaseStore, options: WorkspaceReviewOptions): Promise<Result<{ readonly review: PanelReview; readonly sharing: ReviewSharing }>> {
  const names = await store.caseFileNames();
  if (!names.ok) return names;
  const fileNames = names.value;
  if (fileNames.length > 1) prepareToReadManyCases();
  const panel: PanelOptions = { ...(options.asOf === undefined ? {} : { asOf: options.asOf }), today: options.today };
  const outcomes = new Array<PanelOutcome | undefined>(fileNames.length);
  const batches: number[][] = [];
  for (let start = 0; start < fileNames.length; start += batchCases) batches.push(Array.from({ length: Math.min(batchCases, fileNames.length - start) }, (_, k) => start + k));
  /** Batches a failed worker left: reviewed here only, so one case that brings a worker down cannot bring down another. */
  const handedBack: number[][] = [];
  let reviewedHere = 0;
  let reviewedInWorkers = 0;
  const workerFailures: string[] = [];

  const reviewBatchHere = async (batch: readonly number[]) => {
    // A turn of the event loop between batches, so the workers' answers are taken and their next batches sent.
    await new Promise<void>((resume) => setImmediate(resume));
    const reviewed = reviewHere(store.folder, batch.map((index) => fileNames[index]!), panel);
    batch.forEach((index, k) => (outcomes[index] = reviewed[k]));
    reviewedHere += batch.length;
  };
  const hereLane = async () => {
    for (let batch = handedBack.shift() ?? batches.shift(); batch !== undefined; batch = handedBack.shift() ?? batches.shift()) await reviewBatchHere(batch);
  };

  const workerLane = (script: string) =>
    new Promise<void>((settle) => {
      const inFlight = new Map<number, number[]>();
      let nextId = 0;
      let finished = false;
      let worker: Worker;
      const stop = (failure: string | null) => {
        if (finished) return;
        finished = true;
        if (failure !== null) {
          workerFailures.push(failure);
          handedBack.push(...inFlight.values());
        }
        void worker.terminate().catch(() => undefined);
        settle();
      };
      const sendNext = () => {
        const batch = batches.shift();
        if (batch === undefined) return;
        const batchId = nextId++;
        inFlight.set(batchId, batch);
        worker.postMessage({ batchId, fileNames: batch.map((index) => fileNames[index]!) } satisfies BatchRequest);
      };
      try {
        worker = new Worker(script, { workerData: { folder: store.folder, panel } satisfies ReviewWorkerData });
      } catch (error) {
        workerFailures.push(`the worker could not start: ${messageOf(error)}`);
        settle();
        return;
      }
      worker.on('message', (answer: BatchAnswer) => {
        const batch = inFlight.get(answer.batchId);
        if (batch === undefined || answer.outcomes.length !== batch.length) {
          stop(`the worker answered a batch it was not sent, or with ${answer.outcomes?.length ?? 0} outcomes for ${batch?.length ?? 0} cases`);
          return;
        }
        inFlight.delete(answer.batchId);
        batch.forEach((index, k) => (outcomes[index] = answer.outcomes[k]));
        reviewedInWorkers += batch.length;
        sendNext();
        if (inFlight.size === 0) stop(null);
      });
      worker.on('error', (error) => stop(`the worker failed: ${messageOf(error)}`));
      worker.on('exit', (code) => stop(`the worker stopped (exit code ${code}) before its cases were done`));
      for (let k = 0; k < batchesAhead; k += 1) sendNext();
      if (inFlight.size === 0) stop(null);
    });

  const threads = options.workers ? Math.min(options.workers.threads, Math.ceil(fileNames.length / minCasesPerThread)) : 1;
  const workerLanes = options.workers && threads > 1 ? Array.from({ length: threads - 1 }, () => workerLane(options.workers!.script)) : [];
  await Promise.all([hereLane(), ...workerLanes]);
  // What a worker handed back after this thread had finished its share.
  await hereLane();

  const reviewed: PanelOutcome[] = [];
  outcomes.forEach((outcome, index) => {
    // Never reached while every batch is answered or handed back; a case is still never dropped without a word.
    reviewed.push(outcome ?? { fileName: fileNames[index]!, label: null, issues: [issue('host_failed', [], `${fileNames[index]} was not reviewed: no thread returned its review. Run the panel again.`)] });
  });
  return ok({ review: rankOutcomes(reviewed), sharing: { workersStarted: workerLanes.length, reviewedInWorkers, reviewedHere, workerFailures } });
}

/**
 * The worker's side: answer each batch of file names with their outcomes, one
 * batch after another, read from the folder it was started with.
 * Called by app/host/workspaceWorker.ts, the worker script's entry.
 */
export function serveReviewBatches(port: MessagePort, data: ReviewWorkerData): void {
  prepareToReadManyCases();
  port.on('message', (request: BatchRequest) => {
    port.postMessage({ batchId: request.batchId, outcomes: reviewHere(data.folder, request.fileNames, data.panel) } satisfies BatchAnswer);
  });
}
