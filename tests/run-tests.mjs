// The whole suite: type-check, then vitest, then one closing line
// "N passed, N failed" that CI reads. Exits non-zero if anything failed.
import { spawnSync } from 'node:child_process';
import { mkdirSync, readFileSync, existsSync, rmSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('..', import.meta.url));
const run = (command, args) => spawnSync(command, args, { cwd: root, stdio: 'inherit' });

console.log('> type-check (tsc --noEmit)');
const typecheck = run('npx', ['tsc', '--noEmit', '-p', 'tsconfig.json']);
const typecheckFailed = typecheck.status !== 0;

const resultsDir = `${root}tests/.results`;
mkdirSync(resultsDir, { recursive: true });
const jsonPath = `${resultsDir}/vitest.json`;
if (existsSync(jsonPath)) rmSync(jsonPath);
const extra = process.argv.slice(2);
console.log('> vitest run');
const vitest = run('npx', [
  'vitest',
  'run',
  '--config',
  'tests/vitest.config.ts',
  '--reporter=default',
  '--reporter=json',
  `--outputFile.json=${jsonPath}`,
  ...extra,
]);

let passed = 0;
let failed = 0;
let skipped = 0;
if (existsSync(jsonPath)) {
  const report = JSON.parse(readFileSync(jsonPath, 'utf8'));
  passed = report.numPassedTests ?? 0;
  // A file that fails to load has no test results of its own: count it once.
  const brokenFiles = (report.testResults ?? []).filter(
    (file) => file.status === 'failed' && (file.assertionResults ?? []).length === 0,
  ).length;
  failed = (report.numFailedTests ?? 0) + brokenFiles;
  skipped = (report.numPendingTests ?? 0) + (report.numTodoTests ?? 0);
} else {
  failed += 1;
}
if (typecheckFailed) {
  console.log('type-check failed (counted as one failure)');
  failed += 1;
}
if (vitest.status !== 0 && failed === 0) failed = 1;
console.log(`${passed} passed, ${failed} failed${skipped ? `, ${skipped} skipped` : ''}`);
process.exit(failed > 0 || passed === 0 ? 1 : 0);
