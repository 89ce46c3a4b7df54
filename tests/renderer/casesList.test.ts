import { describe, expect, it } from 'vitest';
import { parseCase } from '../../core/model/parseCase';
import { severities } from '../../core/safety';
import { caseSummaryLine } from '../../renderer/viewModels/casesList';
import { formatQuantity } from '../../renderer/viewModels/format';
import { reviewOf } from '../../renderer/viewModels/review';
import { readDemo } from '../core/model/caseFixtures';

// The Cases screen computes each summary line as the panel does (one month ahead, 50 draws, no derivations:
// core/panel summaryComputeOptions, a modelling choice). What a line shows must be what the case's full review
// (24 months, 500 draws, the Iron course's and Findings' own computation) gives: the current regimen, the
// trailing-year intake and its band, the latest LIC, the most severe finding and the next monitoring due.
describe('Cases screen summary line', () => {
  for (const name of ['th-0417', 'th-0093'] as const) {
    it(`${name}: the same words as the full review of the case`, () => {
      const json = readDemo(name);
      const parsed = parseCase(json);
      if (!parsed.ok) throw new Error(`${name} does not parse`);
      const asOf = parsed.value.review.reviewDate ?? '2026-12-01';
      const full = reviewOf(parsed.value, asOf, 500);
      if (!full.ok) throw new Error(`${name} does not review`);
      const { results, findings, monitoring } = full.review;
      const worst = severities.map((severity) => findings.find((it) => it.severity === severity)).find((it) => it !== undefined);
      const next = monitoring?.items[0];
      const line = caseSummaryLine({ id: name, json }, '2026-12-01');
      expect(line.problem).toBeNull();
      expect(line.regimen).toBe(results.currentRegimens.map((regimen) => regimen.label).join(' + ') || 'no chelation on record');
      expect(line.intake).toBe(`${formatQuantity(results.intake.mgPerKgPerDay, 2, 'mg/kg/d')} (${results.intake.band})`);
      expect(line.latestLic).toBe(results.bodyIron.lastMeasured ? formatQuantity(results.bodyIron.lastMeasured.licMgPerGDry, 1, 'mg/g{dry}') : 'none on record');
      expect(line.mostSevereFinding).toBe(worst ? `${worst.severity}: ${worst.title}` : 'no findings');
      expect(line.nextDue).toBe(next ? `${next.what} ${next.status === 'overdue' ? 'overdue since' : 'due'} ${next.dueDate}` : '');
    });
  }

  it('still lists a case file with errors, saying so', () => {
    const line = caseSummaryLine({ id: 'broken', json: { version: 1, patient: { label: 'XX-0001' } } }, '2026-12-01');
    expect(line.label).toBe('XX-0001');
    expect(line.problem).toMatch(/error/);
  });
});
