// Builds the desktop app's two Electron entry points, each to one CommonJS file:
// dist/main/main.cjs (runtime dependencies and electron external) and
// dist/preload/preload.cjs (only electron external: a sandboxed preload cannot
// require its own other files, stack-notes.md).
import { build } from 'esbuild';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('../..', import.meta.url));
const pkg = JSON.parse(readFileSync(`${root}package.json`, 'utf8'));

export async function buildDesktop(outFolder = `${root}dist`) {
  const common = { bundle: true, platform: 'node', format: 'cjs', logLevel: 'warning', legalComments: 'none' };
  await build({
    ...common,
    entryPoints: [`${root}app/main/main.ts`],
    outfile: `${outFolder}/main/main.cjs`,
    target: 'node22',
    sourcemap: true,
    external: ['electron', ...Object.keys(pkg.dependencies ?? {})],
  });
  await build({
    ...common,
    entryPoints: [`${root}app/preload/preload.ts`],
    outfile: `${outFolder}/preload/preload.cjs`,
    target: 'chrome130',
    sourcemap: false,
    external: ['electron'],
  });
  return { main: `${outFolder}/main/main.cjs`, preload: `${outFolder}/preload/preload.cjs` };
}

if (import.meta.url === `file://${process.argv[1]}`) {
  await buildDesktop();
}
