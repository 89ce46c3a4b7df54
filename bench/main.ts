/**
 * `npm run bench`: speed and memory figures, each as a ratio against a baseline
 * measured in the same run where the issue asks for one, printed as a table and
 * written to bench/results/latest.json (one row per figure: name, value, unit,
 * target, met). Benchmarks never run inside `npm test`; tests never time anything.
 */
import { spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { cpus, loadavg, tmpdir } from 'node:os';
import { performance } from 'node:perf_hooks';
import { computeCase } from '../core/ledger/computeCase';
import { parseCase } from '../core/model/parseCase';
import { derivationsOf } from '../core/report/derivationIndex';
import { findConstantSet } from '../core/chemistry/sets';
import { speciate } from '../core/chemistry/speciation';
import { phGrid } from '../core/chemistry/phSweep';
import { molar } from '../core/chemistry/types';
import type { Case } from '../core/model/caseFile';
import { baselineKernel, type KernelInput } from './baselineKernel';
import { generatedCaseJson, generatedCaseWithPeriods, generatedReviewDate } from './generatedCase';
import { evaluateFindings } from '../core/safety';
import { monitoringCalendar } from '../core/monitoring';
import { measure, measurePaired, scalingExponent, type Timing } from './harness';
import { bundleGzipBytes, casesListedMs, ironCourseNavigationMs } from './rendererBench';
import { panelRun, writeWorkspace } from './workspaceBench';
import { barePdf, chartSvgsOf, demoSheet, pdfPageCount, plainLinesOf, writeSheetPdf } from './sheetBench';

// bench/run.mjs runs the bundle from the project folder.
const root = `${process.cwd()}/`;

export interface BenchRow {
  readonly name: string;
  readonly value: number;
  readonly unit: string;
  /** The limit, in the row's unit, or null for a figure reported without one. */
  readonly target: number | null;
  /** Whether the figure is inside its target (≤), or null without a target. */
  readonly met: boolean | null;
  readonly note?: string;
}

const rows: BenchRow[] = [];
const row = (name: string, value: number, unit: string, target: number | null, note?: string, higherIsBetter = false) => {
  const met = target === null ? null : higherIsBetter ? value >= target : value <= target;
  rows.push({ name, value: Number(value.toPrecision(4)), unit, target, met, ...(note ? { note } : {}) });
};

const epochDay = (iso: string) => Date.UTC(Number(iso.slice(0, 4)), Number(iso.slice(5, 7)) - 1, Number(iso.slice(8, 10))) / 86_400_000;

/** The kernel's typed arrays, extracted from the parsed case outside the timed region. */
function kernelInputOf(caseFile: Case, horizonMonths: number, samples: number): KernelInput {
  const first = epochDay(caseFile.transfusions[0]!.date);
  const last = epochDay(generatedReviewDate);
  const transfusions = caseFile.transfusions;
  const periods = caseFile.chelationPeriods;
  const weightKg = 70;
  const removalOf = (dose: number, perDay: number, daysPerWeek: number) => (dose * weightKg * perDay * daysPerWeek * 0.8 * 0.1) / 7 / 10;
  return {
    recordDays: last - first + 1,
    transfusionDay: Int32Array.from(transfusions, (entry) => epochDay(entry.date) - first),
    transfusionRedCellMl: Float64Array.from(transfusions, (entry) => ('volume' in entry ? entry.volume.value * 0.6 : 0)),
    periodStartDay: Int32Array.from(periods, (period) => epochDay(period.startDate) - first),
    periodEndDay: Int32Array.from(periods, (period) => (period.endDate ? epochDay(period.endDate) : last) - first),
    periodRemovalMgPerDay: Float64Array.from(periods, (period) => removalOf(period.dose.value, period.administrationsPerDay, period.daysPerWeek)),
    weightKg,
    startLicMgPerGDry: 11,
    scenarioRemovalMgPerDay: Float64Array.from([20, 28, 25, 30]),
    horizonMonths,
    samples,
  };
}

function parsedGenerated(density: number): Case {
  const parsed = parseCase(generatedCaseJson(density));
  if (!parsed.ok) throw new Error(`generated case (density ${density}) does not parse: ${parsed.issues.map((it) => it.message).join('; ')}`);
  return parsed.value;
}

function recompute(caseFile: Case, horizonMonths: number, samples: number): unknown {
  const result = computeCase(caseFile, generatedReviewDate, { horizonMonths, samples });
  if (!result.ok) throw new Error(`generated case does not compute: ${result.issues.map((it) => it.message).join('; ')}`);
  return derivationsOf(result.value);
}

const print = (timing: Timing) => console.log(`  ${timing.name}: median ${timing.medianMs.toFixed(2)} ms (p10 ${timing.p10Ms.toFixed(2)}, p90 ${timing.p90Ms.toFixed(2)}; ${timing.runs} runs)`);

async function recomputeFigures(): Promise<void> {
  console.log('1. Full case recompute (20 years every 3 weeks, 100 results, 10 periods, 4 scenarios × 24 months × 2,000 draws)');
  const caseFile = parsedGenerated(1);
  const kernelInput = kernelInputOf(caseFile, 24, 2000);
  const kernel = await measure('baseline kernel', () => baselineKernel(kernelInput));
  const full = await measure('computeCase + derivations', () => recompute(caseFile, 24, 2000));
  print(kernel);
  print(full);
  row('recompute: median', full.medianMs, 'ms', 16);
  row('recompute: ratio to bare kernel', full.medianMs / kernel.medianMs, '×', 10, `kernel median ${kernel.medianMs.toFixed(2)} ms`);
  const json = JSON.stringify(generatedCaseJson(1));
  const parse = await measure('JSON.parse + parseCase', () => parseCase(JSON.parse(json)));
  print(parse);
  row('parse + validate generated case: median', parse.medianMs, 'ms', null, `${(json.length / 1024).toFixed(0)} KiB of JSON`);
}

async function scalingFigures(): Promise<void> {
  console.log('2. Scaling with record length (1×, 4×, 16×), with horizon (24, 120 months) and with chelation periods (100, 1,000, 2,667)');
  const byDensity: { size: number; ms: number }[] = [];
  for (const density of [1, 4, 16]) {
    const caseFile = parsedGenerated(density);
    const timing = await measure(`records ×${density}, 24 months, 500 draws`, () => recompute(caseFile, 24, 500), { minRuns: 5, minTimeMs: 1000 });
    print(timing);
    byDensity.push({ size: density, ms: timing.medianMs });
    row(`scaling: records ×${density}`, timing.medianMs, 'ms', null);
  }
  row('scaling: exponent in record length', scalingExponent(byDensity), '', 1.2, 'least-squares slope of log time on log length; 1 is linear');
  const caseFile = parsedGenerated(1);
  const byHorizon: { size: number; ms: number }[] = [];
  for (const horizon of [24, 120]) {
    const timing = await measure(`horizon ${horizon} months, 2,000 draws`, () => recompute(caseFile, horizon, 2000), { minRuns: 5, minTimeMs: 1000 });
    print(timing);
    byHorizon.push({ size: horizon, ms: timing.medianMs });
    row(`scaling: horizon ${horizon} months`, timing.medianMs, 'ms', null);
  }
  row('scaling: exponent in horizon', scalingExponent(byHorizon), '', 1.2, 'the record part does not grow with the horizon, so this is at most 1');
  // A whole review (parse, compute, findings, monitoring calendar) of one unbroken run of dose changes.
  const byPeriods: { size: number; ms: number }[] = [];
  for (const periodCount of [100, 1000, 2667]) {
    const json = generatedCaseWithPeriods(periodCount);
    const review = () => {
      const parsed = parseCase(json);
      if (!parsed.ok) throw new Error(`periods case (${periodCount}) does not parse`);
      const computed = computeCase(parsed.value, generatedReviewDate);
      if (!computed.ok) throw new Error(`periods case (${periodCount}) does not compute`);
      return [evaluateFindings(parsed.value, computed.value, generatedReviewDate, parsed.value.thresholdOverrides), monitoringCalendar(parsed.value, generatedReviewDate)];
    };
    const timing = await measure(`${periodCount} chelation periods, whole review`, review, { minRuns: 5, minTimeMs: 1000, warmupRuns: 1 });
    print(timing);
    byPeriods.push({ size: periodCount, ms: timing.medianMs });
    row(`scaling: ${periodCount} chelation periods, whole review`, timing.medianMs, 'ms', null);
  }
  row('scaling: exponent in chelation periods', scalingExponent(byPeriods), '', 1.2, 'parse, compute, findings and calendar of one run of dose changes; the rest of the record is fixed, so this is below 1');
}

async function chemistryFigures(): Promise<void> {
  console.log('3. Chemistry: pM sweep, 281 points (pH 2–9 by 0.025), EDTA with Pb²⁺, Ca²⁺ and Zn²⁺ competing');
  const set = findConstantSet('edta-textbook-25c');
  if (!set) throw new Error('EDTA set missing');
  const grid = phGrid(2, 9, 0.025);
  const metals = [
    { metal: 'Pb2+' as const, totalMolar: molar(2.4e-6) },
    { metal: 'Ca2+' as const, totalMolar: molar(1.2e-3) },
    { metal: 'Zn2+' as const, totalMolar: molar(1.5e-5) },
  ];
  const sweep = () => {
    let warm: readonly number[] | undefined;
    let solved = 0;
    for (const pH of grid) {
      const result = speciate(set, metals, molar(1e-3), pH, warm ? { initialLogFree: warm } : {});
      if (result.ok) {
        warm = result.value.solution.logFree;
        solved += 1;
      }
    }
    return solved;
  };
  const solved = sweep();
  const timing = await measure(`${grid.length}-point sweep`, sweep);
  print(timing);
  row('chemistry: 281-point sweep, three metals', timing.medianMs, 'ms', 15, `${solved} of ${grid.length} points solved`);
  row('chemistry: solves per second', (grid.length / timing.medianMs) * 1000, '/s', null);
}

function spawnMs(command: string, args: readonly string[]): number {
  const before = performance.now();
  const run = spawnSync(command, args, { cwd: root, stdio: 'ignore' });
  if (run.status !== 0) throw new Error(`${command} ${args.join(' ')} exited ${run.status}`);
  return performance.now() - before;
}

async function commandLineFigures(): Promise<void> {
  console.log('7. Command-line start-up: chelation-ledger --help against node -e 0');
  const node = await measure('node -e 0', () => spawnMs(process.execPath, ['-e', '0']), { minRuns: 10, minTimeMs: 500, warmupRuns: 2 });
  const cli = await measure('node dist/cli.cjs --help', () => spawnMs(process.execPath, ['dist/cli.cjs', '--help']), { minRuns: 10, minTimeMs: 500, warmupRuns: 2 });
  print(node);
  print(cli);
  row('command line: --help start-up ratio to node -e 0', cli.medianMs / node.medianMs, '×', null, `--help ${cli.medianMs.toFixed(0)} ms, node -e 0 ${node.medianMs.toFixed(0)} ms`);
}

async function sheetFigures(): Promise<void> {
  console.log('4. Sheet: the demo TH-0417 through our writer against bare pdfmake (same charts and words as plain paragraphs, same page count)');
  const sheet = demoSheet(root);
  const ours = await writeSheetPdf(sheet, { paper: 'a4' });
  const pages = pdfPageCount(ours);
  const svgs = chartSvgsOf(sheet);
  const lines = plainLinesOf(sheet);
  const creationDate = new Date(Date.UTC(2026, 10, 20));
  const padding = Math.max(0, pages - pdfPageCount(await barePdf(svgs, lines, 0, creationDate)));
  const bare = await barePdf(svgs, lines, padding, creationDate);
  console.log(`  ours: ${pages} pages, ${svgs.length} charts, ${(ours.length / 1024).toFixed(0)} KiB; baseline: ${pdfPageCount(bare)} pages, ${lines.length} lines of text`);
  // Interleaved (bare, ours, bare, ours …) so drift on a shared machine falls on both alike; the ratio is the median of the pairs'.
  const paired = await measurePaired(
    { baseline: 'bare pdfmake', subject: 'our sheet writer (build + write)' },
    () => barePdf(svgs, lines, padding, creationDate),
    () => writeSheetPdf(demoSheet(root), { paper: 'a4' }),
    { minRuns: 12, minTimeMs: 4000, warmupRuns: 2 },
  );
  const { baseline, subject: writer, ratio } = paired;
  print(baseline);
  print(writer);
  const ratioSpread = `p10 ${ratio.p10.toFixed(2)}, p90 ${ratio.p90.toFixed(2)}`;
  console.log(`  ratio of each pair: median ${ratio.median.toFixed(2)} × (${ratioSpread}; ${ratio.runs} pairs)`);
  row('sheet: demo sheet, warm', writer.medianMs / 1000, 's', 0.5, `${pages} pages, ${svgs.length} charts; includes building the sheet from the case; p10 ${(writer.p10Ms / 1000).toFixed(3)}, p90 ${(writer.p90Ms / 1000).toFixed(3)} s`);
  row('sheet: ratio to bare pdfmake', ratio.median, '×', 1.5, `median of ${ratio.runs} interleaved pairs (${ratioSpread}); bare pdfmake median ${baseline.medianMs.toFixed(0)} ms for ${pdfPageCount(bare)} pages`);
}

async function workspaceFigures(): Promise<void> {
  console.log('5. Workspace: 1,000 generated case files opened, validated, computed and ranked (panel --json)');
  const folder = mkdtempSync(join(tmpdir(), 'chelation-workspace-'));
  try {
    writeWorkspace(root, folder, 1000);
    const runs = [panelRun(root, folder), panelRun(root, folder), panelRun(root, folder)];
    const best = runs.reduce((left, right) => (right.ms < left.ms ? right : left));
    console.log(`  ${best.reviewed} reviewed, ${best.notReviewed} not reviewed; runs ${runs.map((run) => run.ms.toFixed(0)).join(', ')} ms; peak memory ${(best.maxRssKib / 1024).toFixed(0)} MiB`);
    row('workspace: 1,000 cases opened, computed and ranked', median(runs.map((run) => run.ms)) / 1000, 's', 2, `median of 3 runs of the panel command (start-up included); ${best.reviewed} reviewed`);
    row('workspace: peak memory', best.maxRssKib / 1024, 'MiB', null);
  } finally {
    rmSync(folder, { recursive: true, force: true });
  }
}

const median = (values: readonly number[]) => {
  const sorted = [...values].sort((left, right) => left - right);
  return sorted.length % 2 ? sorted[(sorted.length - 1) / 2]! : (sorted[sorted.length / 2 - 1]! + sorted[sorted.length / 2]!) / 2;
};

async function rendererFigures(): Promise<void> {
  console.log('6. Renderer: bundle size and navigation to the demo\'s iron course (headless Chromium, preview server)');
  const bundle = bundleGzipBytes(`${root}dist/renderer`);
  console.log(`  dist/renderer: ${bundle.files} files, ${(bundle.rawBytes / 1024).toFixed(0)} KiB, gzip ${(bundle.gzipBytes / 1024).toFixed(0)} KiB`);
  row('renderer: bundle gzip size', bundle.gzipBytes / 1024, 'KiB', 300, `${(bundle.rawBytes / 1024).toFixed(0)} KiB before gzip, ${bundle.files} files`);
  const timings = await ironCourseNavigationMs(root, 7);
  console.log(`  page load to Cases: median ${median(timings.loadMs).toFixed(0)} ms; Iron course: median ${median(timings.navigationMs).toFixed(0)} ms (${timings.navigationMs.map((ms) => ms.toFixed(0)).join(', ')})`);
  row('renderer: navigation to the iron course, interactive', median(timings.navigationMs), 'ms', 500, 'click on the screen button to summary painted, median of 7 fresh pages');
  row('renderer: page load to the Cases screen', median(timings.loadMs), 'ms', null);
  // A clinic's workspace on the Cases screen: no target in the issue; reported so the figure is seen.
  const folder = mkdtempSync(join(tmpdir(), 'chelation-cases-'));
  try {
    writeWorkspace(root, folder, 300);
    const listed = await casesListedMs(root, folder, 'WS-0300', 3);
    console.log(`  Cases screen, 300 generated cases: ${listed.map((ms) => ms.toFixed(0)).join(', ')} ms`);
    row('renderer: Cases screen listing 300 generated cases', median(listed), 'ms', null, 'page load to every summary line shown, median of 3 fresh pages (preview server)');
  } finally {
    rmSync(folder, { recursive: true, force: true });
  }
}

async function main(): Promise<void> {
  const machine = `${cpus().length} × ${cpus()[0]?.model ?? 'unknown CPU'}, Node ${process.version}, load average ${loadavg().map((load) => load.toFixed(1)).join(' ')}`;
  console.log(`Benchmarks on ${machine}\n`);
  await recomputeFigures();
  await scalingFigures();
  await chemistryFigures();
  await sheetFigures();
  await workspaceFigures();
  await commandLineFigures();
  await rendererFigures();

  console.log('\n| figure | value | unit | target | met |\n| --- | ---: | --- | ---: | --- |');
  for (const entry of rows) console.log(`| ${entry.name} | ${entry.value} | ${entry.unit} | ${entry.target ?? '—'} | ${entry.met === null ? '—' : entry.met ? 'yes' : 'NO'} |`);
  mkdirSync(`${root}bench/results`, { recursive: true });
  writeFileSync(`${root}bench/results/latest.json`, `${JSON.stringify({ machine, rows }, null, 2)}\n`);
  console.log('\nwritten: bench/results/latest.json');
}

await main();
