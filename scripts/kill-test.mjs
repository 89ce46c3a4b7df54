// The kill test at full size: 1,000 saves killed at random points (the suite
// runs 200). Prints the figures: runs, states found new / old / other, torn
// journal lines, temporary files left. Usage: node scripts/kill-test.mjs [runs] [seed]
import { build } from 'esbuild';
import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

const root = fileURLToPath(new URL('..', import.meta.url));
const runs = Number(process.argv[2] ?? 1000);
const seed = Number(process.argv[3] ?? 20261202);
// Inside the project (ignored by git) so the bundle finds esbuild in node_modules.
mkdirSync(join(root, 'tests/.results'), { recursive: true });
const work = mkdtempSync(join(root, 'tests/.results/kill-test-'));
try {
  const harness = join(work, 'killHarness.mjs');
  await build({
    entryPoints: [join(root, 'tests/app/host/crash/killHarness.ts')],
    outfile: harness,
    bundle: true,
    platform: 'node',
    target: 'node20',
    format: 'esm',
    external: ['esbuild'],
    logLevel: 'warning',
  });
  const { runKillTest } = await import(pathToFileURL(harness).href);
  const report = await runKillTest({ runs, seed, root });
  console.log(JSON.stringify(report, null, 2));
  process.exitCode = report.other === 0 && report.failures.length === 0 ? 0 : 1;
} finally {
  rmSync(work, { recursive: true, force: true });
}
