// Builds the command line into one CommonJS file, dist/cli.cjs.
// Runtime dependencies stay external (they are installed by npm).
import { build } from 'esbuild';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('../..', import.meta.url));
const pkg = JSON.parse(readFileSync(`${root}package.json`, 'utf8'));

export async function buildCli(outfile = `${root}dist/cli.cjs`) {
  await build({
    entryPoints: [`${root}app/cli/entry.ts`],
    outfile,
    bundle: true,
    platform: 'node',
    target: 'node20',
    format: 'cjs',
    sourcemap: true,
    external: Object.keys(pkg.dependencies ?? {}),
    logLevel: 'warning',
  });
  return outfile;
}

if (import.meta.url === `file://${process.argv[1]}`) {
  await buildCli();
}
