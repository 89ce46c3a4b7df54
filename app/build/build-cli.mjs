// Builds the command line into one CommonJS file, dist/cli.cjs, and beside it the
// workspace review's worker thread, dist/workspaceWorker.cjs (app/host/workspaceReview.ts
// starts it from the folder the command line runs from).
// Runtime dependencies stay external (they are installed by npm).
import { build } from 'esbuild';
import { readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('../..', import.meta.url));
const pkg = JSON.parse(readFileSync(`${root}package.json`, 'utf8'));

/** The worker script's name beside the command line's bundle. */
export const workspaceWorkerFile = 'workspaceWorker.cjs';

export async function buildCli(outfile = `${root}dist/cli.cjs`) {
  const common = { bundle: true, platform: 'node', target: 'node20', format: 'cjs', sourcemap: true, external: Object.keys(pkg.dependencies ?? {}), logLevel: 'warning' };
  await Promise.all([
    build({ ...common, entryPoints: [`${root}app/cli/entry.ts`], outfile }),
    build({ ...common, entryPoints: [`${root}app/host/workspaceWorker.ts`], outfile: join(dirname(outfile), workspaceWorkerFile) }),
  ]);
  return outfile;
}

if (import.meta.url === `file://${process.argv[1]}`) {
  await buildCli();
}
