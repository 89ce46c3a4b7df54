// Builds the command line into one CommonJS file, dist/cli.cjs, and beside it the
// workspace review's worker thread, dist/workspaceWorker.cjs (app/host/workspaceReview.ts
// starts it from the folder the command line runs from).
// Runtime dependencies stay external (they are installed by npm), but for the pure ones
// bundled in: esbuild keeps only what is used, where a require of the package loads all of it
// (date-fns' index loads its 250 functions, zod every locale: 50 and 45 ms of every start-up,
// and again in each worker thread of a workspace review). pdfmake and fontkit read their
// font and metric files from beside themselves, and ucum-lhc its unit tables, so they stay out.
import { build } from 'esbuild';
import { readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('../..', import.meta.url));
const pkg = JSON.parse(readFileSync(`${root}package.json`, 'utf8'));

/** Runtime dependencies bundled into the command line (pure JavaScript, no files of their own read at run time). */
const bundledDependencies = ['zod', 'date-fns', '@date-fns/utc', '@date-fns/tz', 'papaparse'];

/** The worker script's name beside the command line's bundle. */
export const workspaceWorkerFile = 'workspaceWorker.cjs';

export async function buildCli(outfile = `${root}dist/cli.cjs`) {
  const common = { bundle: true, platform: 'node', target: 'node20', format: 'cjs', sourcemap: true, external: Object.keys(pkg.dependencies ?? {}).filter((name) => !bundledDependencies.includes(name)), logLevel: 'warning' };
  await Promise.all([
    build({ ...common, entryPoints: [`${root}app/cli/entry.ts`], outfile }),
    build({ ...common, entryPoints: [`${root}app/host/workspaceWorker.ts`], outfile: join(dirname(outfile), workspaceWorkerFile) }),
  ]);
  return outfile;
}

if (import.meta.url === `file://${process.argv[1]}`) {
  await buildCli();
}
