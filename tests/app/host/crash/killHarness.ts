import { spawn } from 'node:child_process';
import { mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { build } from 'esbuild';
import { readJournal } from '../../../../app/host/caseJournal';
import { openCaseStore, serializeCase } from '../../../../app/host/caseStore';
import { parseCase } from '../../../../core/model/parseCase';
import { stateAt, stateIndexOf } from './killStates';

/**
 * The kill test: a child process saves a case in a loop (saveLoop.ts) and is
 * killed with SIGKILL at a random moment; after each kill the case must open
 * and be exactly the old state or the new one. Used by
 * tests/app/host/killTest.test.ts (200 runs) and scripts/kill-test.mjs (1,000).
 *
 * Classification after each kill, n being the state in the file:
 * - new: the file holds the journal's latest state (the kill fell outside the
 *   window between the journal line and the rename);
 * - old: the journal is one state ahead (n + 1): the kill fell between the
 *   journal line and the rename; the file is the old state and recover()
 *   returns the new one;
 * - other: anything else (a file that does not open, a state that is neither)
 *   — a failure.
 */
export interface KillTestReport {
  readonly runs: number;
  readonly newState: number;
  readonly oldState: number;
  readonly other: number;
  /** Journal lines cut by a kill during the append (skipped on reading, as designed). */
  readonly tornJournalLines: number;
  /** Temporary files left by kills during the write (never listed as cases). */
  readonly temporaryFilesLeft: number;
  /** Saves completed across all runs (the highest state reached in each lane, summed). */
  readonly savesCompleted: number;
  readonly failures: readonly string[];
}

export interface KillTestOptions {
  readonly runs: number;
  readonly seed: number;
  /** The project root (the sources to bundle). */
  readonly root: string;
  /** Children running at once, each on its own folder. */
  readonly lanes?: number;
  /** The kill comes 0 to this many milliseconds after the child's first open. */
  readonly maxDelayMs?: number;
}

/** mulberry32: a small seeded generator, so a run's kill times are reproducible in intent. */
function seeded(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

async function killOnce(childPath: string, folder: string, delayMs: number): Promise<string | null> {
  const child = spawn(process.execPath, [childPath, folder, 'case.json'], {
    env: process.env,
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let stderr = '';
  child.stderr.on('data', (chunk: Buffer) => (stderr += chunk.toString()));
  const exited = new Promise<number | null>((resolve) => child.on('exit', (code) => resolve(code)));
  const ready = await new Promise<boolean>((resolve) => {
    child.stdout.on('data', (chunk: Buffer) => chunk.toString().includes('ready') && resolve(true));
    child.on('exit', () => resolve(false));
  });
  if (!ready) return `the saving child stopped before it was ready: ${stderr.trim()}`;
  await new Promise((resolve) => setTimeout(resolve, delayMs));
  child.kill('SIGKILL');
  const code = await exited;
  return code === 3 ? `the saving child failed: ${stderr.trim()}` : null;
}

function expectedText(n: number): string {
  const parsed = parseCase(stateAt(n));
  if (!parsed.ok) throw new Error('kill-test state is not a valid case');
  return serializeCase(parsed.value);
}

export async function runKillTest(options: KillTestOptions): Promise<KillTestReport> {
  const work = mkdtempSync(join(tmpdir(), 'kill-test-'));
  const childPath = join(work, 'saveLoop.cjs');
  await build({
    entryPoints: [join(options.root, 'tests/app/host/crash/saveLoop.ts')],
    outfile: childPath,
    bundle: true,
    platform: 'node',
    target: 'node20',
    format: 'cjs',
    minify: true, // the child is started hundreds of times: less to parse
    logLevel: 'warning',
  });
  const random = seeded(options.seed);
  const lanes = options.lanes ?? 2;
  const maxDelayMs = options.maxDelayMs ?? 40;
  const counts = { newState: 0, oldState: 0, other: 0, tornJournalLines: 0, temporaryFilesLeft: 0, savesCompleted: 0 };
  const failures: string[] = [];
  try {
    await Promise.all(
      Array.from({ length: lanes }, async (_, lane) => {
        const folder = join(work, `lane-${lane}`);
        mkdirSync(folder);
        const store = openCaseStore(folder);
        const created = await store.create('case.json', stateAt(0), 'save 0');
        if (!created.ok) throw new Error('could not create the kill-test case');
        let lastTorn = 0;
        let highest = 0;
        const runsHere = Math.floor(options.runs / lanes) + (lane < options.runs % lanes ? 1 : 0);
        for (let run = 0; run < runsHere; run += 1) {
          const problem = await killOnce(childPath, folder, random() * maxDelayMs);
          if (problem) {
            counts.other += 1;
            failures.push(problem);
            continue;
          }
          const verdict = await verify(folder, store);
          if (verdict.kind === 'other') {
            counts.other += 1;
            failures.push(verdict.why);
          } else {
            counts[verdict.kind === 'new' ? 'newState' : 'oldState'] += 1;
            highest = Math.max(highest, verdict.n);
          }
          const journal = await readJournal(join(folder, 'case.journal.jsonl'));
          const torn = journal.ok ? journal.value.unreadableLines.length : 0;
          counts.tornJournalLines += torn - lastTorn;
          lastTorn = torn;
        }
        counts.savesCompleted += highest;
        counts.temporaryFilesLeft += readdirSync(folder).filter((name) => name.endsWith('.tmp')).length;
      }),
    );
  } finally {
    rmSync(work, { recursive: true, force: true });
  }
  return { runs: options.runs, ...counts, failures };
}

type Verdict = { readonly kind: 'new' | 'old'; readonly n: number } | { readonly kind: 'other'; readonly why: string };

async function verify(folder: string, store: ReturnType<typeof openCaseStore>): Promise<Verdict> {
  const opened = await store.open('case.json');
  if (!opened.ok) return { kind: 'other', why: `the case did not open: ${opened.issues.map((it) => it.message).join('; ')}` };
  const n = stateIndexOf(opened.value.caseFile);
  if (readFileSync(join(folder, 'case.json'), 'utf8') !== expectedText(n)) return { kind: 'other', why: `the file is not exactly state ${n}` };
  const journal = await readJournal(join(folder, 'case.journal.jsonl'));
  const last = journal.ok ? journal.value.lines.at(-1) : undefined;
  if (!last) return { kind: 'other', why: 'the journal has no readable line' };
  const journalN = Number(/^save (\d+)$/.exec(last.change)?.[1]);
  if (journalN === n && opened.value.recoverable === null) return { kind: 'new', n };
  if (journalN === n + 1 && opened.value.recoverable?.reason === 'interrupted-save') {
    const recovered = await store.recover('case.json');
    if (recovered.ok && stateIndexOf(recovered.value.caseFile) === n + 1) return { kind: 'old', n };
    return { kind: 'other', why: `the journal is ahead (state ${n + 1}) but recover did not return it` };
  }
  return { kind: 'other', why: `file at state ${n}, journal at ${journalN}, recoverable ${JSON.stringify(opened.value.recoverable)}` };
}
