// Builds the command line into one CommonJS file, dist/cli-bundle.cjs, run by dist/cli.cjs
// (app/build/cliLoader.cjs) from V8's code cache dist/cli-bundle.cache, which this build makes by
// running the demo workspace's panel once; and beside them the workspace review's worker thread,
// dist/workspaceWorker.cjs (app/host/workspaceReview.ts starts it from the folder the command
// line runs from).
// Runtime dependencies stay external (they are installed by npm), but for the pure ones
// bundled in: esbuild keeps only what is used, where a require of the package loads all of it
// (date-fns' index loads its 250 functions, zod every locale: 50 and 45 ms of every start-up,
// and again in each worker thread of a workspace review). pdfmake and fontkit read their
// font and metric files from beside themselves, and ucum-lhc its unit tables, so they stay out.
import { build } from 'esbuild';
import { spawnSync } from 'node:child_process';
import { copyFileSync, readFileSync, rmSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('../..', import.meta.url));
const pkg = JSON.parse(readFileSync(`${root}package.json`, 'utf8'));

/** Runtime dependencies bundled into the command line (pure JavaScript, no files of their own read at run time). */
const bundledDependencies = ['zod', 'date-fns', '@date-fns/utc', '@date-fns/tz', 'papaparse'];

/** The worker script's name beside the command line's bundle. */
export const workspaceWorkerFile = 'workspaceWorker.cjs';

/** The bundle and its code cache beside the entry (the names app/build/cliLoader.cjs reads). */
export const cliBundleFile = 'cli-bundle.cjs';
export const cliCodeCacheFile = 'cli-bundle.cache';

/** The command the code cache is made from: it runs the case model, the review and the findings, the code most commands run. */
const codeCacheRun = ['panel', `${root}assets/demo`, '--json'];

export async function buildCli(outfile = `${root}dist/cli.cjs`) {
  const common = { bundle: true, platform: 'node', target: 'node20', format: 'cjs', sourcemap: true, external: Object.keys(pkg.dependencies ?? {}).filter((name) => !bundledDependencies.includes(name)), logLevel: 'warning' };
  const folder = dirname(outfile);
  await Promise.all([
    build({ ...common, entryPoints: [`${root}app/cli/entry.ts`], outfile: join(folder, cliBundleFile) }),
    build({ ...common, entryPoints: [`${root}app/host/workspaceWorker.ts`], outfile: join(folder, workspaceWorkerFile) }),
  ]);
  copyFileSync(`${root}app/build/cliLoader.cjs`, outfile);
  // A cache of the bundle built before is not this bundle's: V8 would refuse it, but it is not left to.
  rmSync(join(folder, cliCodeCacheFile), { force: true });
  const warmed = spawnSync(process.execPath, [outfile, ...codeCacheRun], { cwd: root, env: { ...process.env, CHELATION_LEDGER_WRITE_CODE_CACHE: '1' }, stdio: ['ignore', 'ignore', 'pipe'], encoding: 'utf8' });
  // Without a cache the command line still runs (it compiles the bundle at each start), so a failure here is reported, not fatal.
  if (warmed.status !== 0) process.stderr.write(`build-cli: the code cache was not made (panel exited ${warmed.status}): ${(warmed.stderr ?? '').slice(0, 300)}\n`);
  return outfile;
}

if (import.meta.url === `file://${process.argv[1]}`) {
  await buildCli();
}
