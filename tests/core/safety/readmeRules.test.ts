import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { safetyRules } from '../../../core/safety/rules';

// The README's findings paragraph lists the rules by the id a finding carries. The outside
// reference is the README a user reads; this keeps it and the rule table from drifting apart.
const readme = readFileSync(new URL('../../../README.md', import.meta.url), 'utf8');

function listedRuleIds(): string[] {
  const start = readme.indexOf('- `findings` runs the safety rules');
  expect(start, 'the findings paragraph of the README').toBeGreaterThanOrEqual(0);
  const end = readme.indexOf('\n- `', start + 1);
  const paragraph = readme.slice(start, end === -1 ? undefined : end);
  return [...paragraph.matchAll(/^ {2}- `([a-z0-9-]+)`: \S/gm)].map((match) => match[1]!);
}

describe('README findings paragraph', () => {
  it('lists every rule of core/safety once, in the rule table’s order, and no rule that is not in it', () => {
    expect(listedRuleIds()).toEqual(safetyRules.map((rule) => rule.id));
  });
});
