import { parentPort, workerData } from 'node:worker_threads';
import { serveReviewBatches, type ReviewWorkerData } from './workspaceReview';

// The entry of a workspace-review worker thread (app/host/workspaceReview.ts), bundled on its own to
// dist/workspaceWorker.cjs beside dist/cli.cjs, so a worker loads only what reviewing a case needs.
if (parentPort) serveReviewBatches(parentPort, workerData as ReviewWorkerData);
