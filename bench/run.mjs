// `npm run bench`: bundle bench/main.ts (TypeScript, core included) with esbuild and run it in Node.
import { build } from 'esbuild';
import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('..', import.meta.url));
// The command line is built afresh too, so the workspace and start-up figures time the current code, not an older bundle.
const cli = spawnSync(process.execPath, [`${root}app/build/build-cli.mjs`], { cwd: root, stdio: 'inherit' });
if (cli.status !== 0) process.exit(cli.status ?? 1);
// The renderer is built afresh so its bundle size is the current one.
const renderer = spawnSync('npm', ['run', 'build:renderer'], { cwd: root, stdio: 'inherit' });
if (renderer.status !== 0) process.exit(renderer.status ?? 1);
await build({
  entryPoints: [`${root}bench/main.ts`],
  outfile: `${root}dist/bench/main.mjs`,
  bundle: true,
  platform: 'node',
  format: 'esm',
  target: 'node20',
  packages: 'external',
  logLevel: 'warning',
});
const run = spawnSync(process.execPath, [`${root}dist/bench/main.mjs`, ...process.argv.slice(2)], { cwd: root, stdio: 'inherit' });
process.exit(run.status ?? 1);
