import { spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
// @ts-expect-error plain ESM build script without type declarations
import { buildCli, workspaceWorkerFile } from '../../../app/build/build-cli.mjs';
import { openCaseStore } from '../../../app/host/caseStore';
import { reviewWorkspace, workersVariable, workspaceWorkersFrom, type WorkspaceWorkers } from '../../../app/host/workspaceReview';
import { rankPanel } from '../../../core/panel';
import { fail, ok } from '../../../core/result';
import { writeWorkspace } from '../../../bench/workspaceBench';

// The workspace review shared over worker threads must give exactly what one thread gives:
// the reference here is the single-threaded path (core/panel rankPanel over the store's openAll,
// as the panel ran before the workers), compared value for value; no timing (figures: npm run bench).

const projectRoot = fileURLToPath(new URL('../../../', import.meta.url));
const today = '2026-12-01';
let buildFolder: string;
let cliFile: string;
let workerScript: string;
let workspace: string;

beforeAll(async () => {
  // Inside the project, so the bundles find their external runtime dependencies in node_modules.
  buildFolder = mkdtempSync(join(projectRoot, 'dist', 'test-ws-'));
  cliFile = await buildCli(join(buildFolder, 'cli.cjs'));
  workerScript = join(dirname(cliFile), workspaceWorkerFile);
  workspace = mkdtempSync(join(tmpdir(), 'cl-ws-'));
  // 40 invented cases (bench/workspaceBench.ts: the demo TH-0417 relabelled and varied), a file that is
  // not JSON, and a "file" that cannot be read (a folder named like a case file).
  writeWorkspace(projectRoot, workspace, 40);
  writeFileSync(join(workspace, 'broken.json'), '{ "format": "chelation-ledger-case", ');
  mkdirSync(join(workspace, 'unreadable.json'));
}, 120_000);

afterAll(() => {
  rmSync(buildFolder, { recursive: true, force: true });
  rmSync(workspace, { recursive: true, force: true });
});

const plan = (threads: number, script = workerScript): WorkspaceWorkers => ({ script, threads });

async function reviewed(workers: WorkspaceWorkers | null) {
  const result = await reviewWorkspace(openCaseStore(workspace), { today, workers });
  if (!result.ok) throw new Error(result.issues.map((it) => it.message).join('; '));
  return result.value;
}

describe('reviewWorkspace', () => {
  it('in one thread gives what core/panel rankPanel gives over the store’s openAll (the path before the workers)', async () => {
    const every = await openCaseStore(workspace).openAll();
    if (!every.ok) throw new Error('openAll failed');
    const reference = rankPanel(
      every.value.map(({ fileName, opened }) => ({ fileName, loaded: opened.ok ? ok(opened.value.caseFile) : fail(...opened.issues.filter((it) => it.severity === 'error')) })),
      { today },
    );
    const { review, sharing } = await reviewed(null);
    expect(sharing).toEqual({ workersStarted: 0, reviewedInWorkers: 0, reviewedHere: 42, workerFailures: [] });
    expect(review).toEqual(reference);
    expect(review.rows).toHaveLength(40);
  });

  it('shared with a worker thread gives exactly the single-threaded review, and the worker did review cases', async () => {
    const single = await reviewed(plan(1));
    expect(single.sharing.workersStarted).toBe(0);
    const shared = await reviewed(plan(2));
    expect(shared.sharing.workersStarted).toBe(1);
    expect(shared.sharing.workerFailures).toEqual([]);
    expect(shared.sharing.reviewedInWorkers).toBeGreaterThan(0);
    expect(shared.sharing.reviewedInWorkers + shared.sharing.reviewedHere).toBe(42);
    // Same order and every value, down to the JSON the command line prints.
    expect(JSON.stringify(shared.review)).toBe(JSON.stringify(single.review));
  });

  it('names the file that is not JSON and the one that cannot be read, beside the ranking', async () => {
    const { review } = await reviewed(plan(2));
    expect(review.notReviewed.map((it) => it.fileName)).toEqual(['broken.json', 'unreadable.json']);
    const [broken, unreadable] = review.notReviewed;
    expect(broken!.issues[0]!.message).toContain('broken.json is not valid JSON');
    expect(unreadable!.issues[0]!.message).toContain('Cannot read case file');
    expect(unreadable!.issues[0]!.message).toContain('unreadable.json');
  });

  it('reviews a worker’s cases here when the worker cannot start, and when it dies with cases in hand', async () => {
    const single = await reviewed(null);
    const scripts = mkdtempSync(join(tmpdir(), 'cl-ws-scripts-'));
    const throwsAtLoad = join(scripts, 'throws.cjs');
    writeFileSync(throwsAtLoad, "throw new Error('this worker cannot start');\n");
    const diesOnFirstBatch = join(scripts, 'dies.cjs');
    writeFileSync(diesOnFirstBatch, "require('node:worker_threads').parentPort.on('message', () => process.exit(7));\n");
    for (const [script, expected] of [
      [throwsAtLoad, 'this worker cannot start'],
      [diesOnFirstBatch, 'exit code 7'],
      [join(scripts, 'missing.cjs'), 'missing.cjs'],
    ] as const) {
      const { review, sharing } = await reviewed(plan(2, script));
      expect(sharing.workerFailures, script).toHaveLength(1);
      expect(sharing.workerFailures[0], script).toContain(expected);
      expect(sharing.reviewedInWorkers + sharing.reviewedHere).toBe(42);
      expect(JSON.stringify(review), script).toBe(JSON.stringify(single.review));
    }
    rmSync(scripts, { recursive: true, force: true });
  });
});

describe('the built command line’s panel', () => {
  it(`prints the same JSON with one thread (${workersVariable}=1) as shared over threads, and names the broken files`, () => {
    const run = (threads: string) => spawnSync(process.execPath, [cliFile, 'panel', workspace, '--json'], { encoding: 'utf8', env: { ...process.env, [workersVariable]: threads } });
    const one = run('1');
    const two = run('2');
    const four = run('4');
    expect(one.status).toBe(0);
    expect(two.status).toBe(0);
    expect(four.status).toBe(0);
    expect(two.stdout).toBe(one.stdout);
    expect(four.stdout).toBe(one.stdout);
    const output = JSON.parse(one.stdout) as { rows: unknown[]; notReviewed: { fileName: string }[] };
    expect(output.rows).toHaveLength(40);
    expect(output.notReviewed.map((it) => it.fileName)).toEqual(['broken.json', 'unreadable.json']);
    const text = spawnSync(process.execPath, [cliFile, 'panel', workspace], { encoding: 'utf8', env: { ...process.env, [workersVariable]: '2' } });
    expect(text.stdout).toContain('40 case(s) reviewed, 2 not reviewed');
    expect(text.stdout).toMatch(/- broken\.json: Case file .*broken\.json is not valid JSON/);
  });

  it(`refuses a ${workersVariable} that is not a number of threads, naming the variable, the value and the range`, () => {
    const bad = spawnSync(process.execPath, [cliFile, 'panel', workspace], { encoding: 'utf8', env: { ...process.env, [workersVariable]: 'many' } });
    expect(bad.status).toBe(2);
    expect(bad.stdout).toBe('');
    expect(bad.stderr).toContain(`${workersVariable} "many" is not a number of threads for a workspace review: a whole number 1–16`);
  });
});

describe('workspaceWorkersFrom', () => {
  it('uses one thread per core but one (left to the engine’s own threads) unless the variable says otherwise, from 1 to 16', () => {
    expect(workspaceWorkersFrom({}, 4, 'w.cjs')).toEqual(ok({ script: 'w.cjs', threads: 3 }));
    expect(workspaceWorkersFrom({}, 2, 'w.cjs')).toEqual(ok({ script: 'w.cjs', threads: 1 }));
    expect(workspaceWorkersFrom({}, 1, 'w.cjs')).toEqual(ok({ script: 'w.cjs', threads: 1 }));
    expect(workspaceWorkersFrom({}, 64, 'w.cjs')).toEqual(ok({ script: 'w.cjs', threads: 16 }));
    expect(workspaceWorkersFrom({ [workersVariable]: '1' }, 8, 'w.cjs')).toEqual(ok({ script: 'w.cjs', threads: 1 }));
    expect(workspaceWorkersFrom({ [workersVariable]: ' 3 ' }, 1, 'w.cjs')).toEqual(ok({ script: 'w.cjs', threads: 3 }));
    for (const raw of ['0', '17', '2.5', '-1', 'two']) {
      const refused = workspaceWorkersFrom({ [workersVariable]: raw }, 2, 'w.cjs');
      expect(refused.ok, raw).toBe(false);
      if (!refused.ok) expect(refused.issues[0]).toMatchObject({ code: 'out_of_range', path: [workersVariable] });
    }
  });
});
