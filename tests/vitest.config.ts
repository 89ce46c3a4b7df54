import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

const root = fileURLToPath(new URL('..', import.meta.url));

export default defineConfig({
  root,
  test: {
    include: ['tests/**/*.test.ts', 'tests/**/*.test.tsx'],
    exclude: ['node_modules/**', 'dist/**', 'tests/browser/**'],
    environment: 'node',
    // Two cores on every machine here: keep one worker per core.
    maxWorkers: 2,
    // A guard against a hung test, not a speed check (speed lives in `npm run bench`): generous, because
    // property tests and schema compiles can take several seconds on a loaded two-core machine.
    testTimeout: 60_000,
    hookTimeout: 120_000,
    benchmark: { include: ['tests/bench/**/*.bench.ts'] },
  },
});
