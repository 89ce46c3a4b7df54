/**
 * Workspace figures: a folder of 1,000 generated case files (invented patients
 * "WS-0001"… built from the demo TH-0417 with their record, weights and doses
 * varied) opened, validated, computed and ranked by `chelation-ledger panel`
 * (app/host/workspaceReview.ts over the case store and core/panel, one thread
 * per core but one). Measured as a whole command in a child process, with its peak
 * resident memory (worker threads included: they share the process).
 */
import { spawnSync } from 'node:child_process';
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { performance } from 'node:perf_hooks';

type Json = Record<string, unknown>;

/** Case number `index` (0-based): the demo with a new label, its record scaled and its weights and doses varied. */
export function workspaceCase(demo: Json, index: number): Json {
  const copy = structuredClone(demo) as Json & { patient: Json & { weights: { weight: { value: number } }[] }; transfusions: { volume?: { value: number } }[]; chelationPeriods: { dose: { value: number } }[] };
  copy.patient.label = `WS-${String(index + 1).padStart(4, '0')}`;
  const weightFactor = 0.85 + (index % 7) * 0.05;
  for (const entry of copy.patient.weights) entry.weight.value = Math.round(entry.weight.value * weightFactor * 10) / 10;
  const volumeFactor = 0.8 + (index % 5) * 0.1;
  for (const entry of copy.transfusions) if (entry.volume) entry.volume.value = Math.round(entry.volume.value * volumeFactor);
  // Keep the last 1–4 years of the record, so the folder mixes short and long histories.
  const keep = Math.max(1, Math.round(copy.transfusions.length * (0.25 + (index % 4) * 0.25)));
  copy.transfusions = copy.transfusions.slice(-keep);
  for (const period of copy.chelationPeriods) period.dose.value = Math.round(period.dose.value * (0.9 + (index % 3) * 0.1));
  return copy;
}

export function writeWorkspace(root: string, folder: string, count: number): void {
  const demo = JSON.parse(readFileSync(`${root}assets/demo/th-0417.json`, 'utf8')) as Json;
  mkdirSync(folder, { recursive: true });
  for (let index = 0; index < count; index += 1) writeFileSync(`${folder}/ws-${String(index + 1).padStart(4, '0')}.json`, JSON.stringify(workspaceCase(demo, index), null, 2));
}

/** One `panel <folder> --json` run: wall time, peak memory, and the rows it reviewed. */
export function panelRun(root: string, folder: string): { readonly ms: number; readonly maxRssKib: number; readonly reviewed: number; readonly notReviewed: number } {
  const before = performance.now();
  const run = spawnSync(process.execPath, ['--require', `${root}bench/maxRss.cjs`, `${root}dist/cli.cjs`, 'panel', folder, '--json'], { cwd: root, encoding: 'utf8', maxBuffer: 256 * 1024 * 1024 });
  const ms = performance.now() - before;
  if (run.status !== 0) throw new Error(`panel exited ${run.status}: ${run.stderr.slice(0, 500)}`);
  const maxRssKib = Number(/bench-max-rss-kib (\d+)/.exec(run.stderr)?.[1] ?? Number.NaN);
  const output = JSON.parse(run.stdout) as { rows: unknown[]; notReviewed: unknown[] };
  return { ms, maxRssKib, reviewed: output.rows.length, notReviewed: output.notReviewed.length };
}
