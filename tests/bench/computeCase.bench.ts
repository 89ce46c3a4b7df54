import { bench, describe } from 'vitest';
import { readFileSync } from 'node:fs';
import { computeCase } from '../../core/ledger/computeCase';
import { derivationsOf } from '../../core/report/derivationIndex';
import { parseCase } from '../../core/model/parseCase';

// Speed of a full review recompute with derivations on (issue 6), on the demo cases.
// Measured here, never asserted in tests.
const load = (name: string) => {
  const parsed = parseCase(JSON.parse(readFileSync(new URL(`../../assets/demo/${name}.json`, import.meta.url), 'utf8')));
  if (!parsed.ok) throw new Error(`demo ${name} does not parse`);
  return parsed.value;
};
const th0417 = load('th-0417');
const th0093 = load('th-0093');
const json0417 = JSON.parse(readFileSync(new URL('../../assets/demo/th-0417.json', import.meta.url), 'utf8'));

describe('review recompute', () => {
  bench('parseCase TH-0417 (85 transfusions, 61 results)', () => {
    parseCase(json0417);
  });
  bench('computeCase TH-0417, 24-month horizon, 500 samples, with derivations', () => {
    const result = computeCase(th0417, '2026-11-20');
    if (result.ok) derivationsOf(result.value);
  });
  bench('computeCase TH-0093, 24-month horizon, 500 samples, with derivations', () => {
    const result = computeCase(th0093, '2026-11-20');
    if (result.ok) derivationsOf(result.value);
  });
});
