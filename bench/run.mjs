// `npm run bench`: bundle bench/main.ts (TypeScript, core included) with esbuild and run it in Node.
import { build } from 'esbuild';
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('..', import.meta.url));
if (!existsSync(`${root}dist/cli.cjs`)) spawnSync('npm', ['run', 'build'], { cwd: root, stdio: 'inherit' });
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
