import { describe, expect, it } from 'vitest';
import { parseCase } from '../../../core/model/parseCase';
import { panelTiers, rankPanel, type PanelEntry } from '../../../core/panel';
import { fail, issue } from '../../../core/result';
import { deepFreeze, readDemo } from '../model/caseFixtures';
import { addDaysIso } from '../../../core/dates';
import { monitoringCalendar } from '../../../core/monitoring';
import { findingsFor, ofRule, parsed, period, result, reviewDate, smallCase } from '../safety/safetyCases';
import { computeCase } from '../../../core/ledger/computeCase';
import { findingsWithMonitoring } from '../../../core/safety';

// The tiers follow the order the issue sets (urgent findings, overdue
// monitoring, positive projected balance); the findings and due dates behind
// them are checked against their published sources in tests/core/safety and
// tests/core/monitoring. Here the scenarios are chosen so that each trigger is
// plain from a published threshold:
// - urgent: deferasirox with eGFR below 40 mL/min/1.73 m² (US label, boxed
//   warning; references.md §9): creatinine 3.0 mg/dL in a 30-year-old man gives
//   CKD-EPI 2021 eGFR about 28;
// - overdue: deferasirox with the last creatinine 75 days before the review
//   (the label asks for at least monthly creatinine);
// - positive balance: a transfusion every 21 days and no chelation, so iron
//   can only accumulate.
const entry = (fileName: string, json: unknown): PanelEntry => ({ fileName, loaded: parseCase(json) });
const upToDate = (creatinineDaysBefore: number, creatinineMgPerDl: number) => [
  result('liver-iron', 200, 5, 'mg/g{dry}', { method: 'biopsy' }),
  result('cardiac-t2star', 200, 30, 'ms', { fieldStrengthT: 1.5 }),
  result('ferritin', 60, 1500, 'ug/L'),
  result('ferritin', 10, 1500, 'ug/L'),
  result('creatinine', creatinineDaysBefore, creatinineMgPerDl, 'mg/dL'),
  result('alt', 10, 25, 'U/L'),
  result('neutrophils', 3, 3.2, '10*9/L'),
];
const withLabel = (json: Record<string, unknown>, label: string) => ({
  ...json,
  patient: { ...(json['patient'] as object), label },
  review: { reviewDate, notes: [], signOff: null },
});

const urgent = withLabel(smallCase({ results: upToDate(5, 3.0), chelationPeriods: [period('deferasirox', 20)] }), 'PN-URG');
const overdue = withLabel(smallCase({ results: upToDate(75, 0.8), chelationPeriods: [period('deferasirox', 20)] }), 'PN-DUE');
const accumulating = withLabel(smallCase({ transfusionEveryDays: 21 }), 'PN-ACC');

describe('rankPanel', () => {
  const entries = deepFreeze([
    entry('c-accumulating.json', accumulating),
    { fileName: 'b-broken.json', loaded: fail(issue('invalid_file', [], 'Case file b-broken.json is not valid JSON.')) },
    entry('a-overdue.json', overdue),
    entry('d-urgent.json', urgent),
  ]);
  const panel = rankPanel(entries, { today: '2030-01-01' });

  it('ranks urgent findings first, then overdue monitoring, then a positive projected balance', () => {
    expect(panel.rows.map((row) => [row.label, row.tier])).toEqual([
      ['PN-URG', 'urgent-finding'],
      ['PN-DUE', 'overdue-monitoring'],
      ['PN-ACC', 'positive-balance'],
    ]);
    expect(panel.rows[0]!.mostSevereFinding?.severity).toBe('urgent');
    expect(panel.rows[0]!.mostSevereFinding?.ruleId).toBe('deferasirox-egfr');
    expect(panel.rows[1]!.nextMonitoring?.what.toLowerCase()).toContain('creatinine');
    expect(panel.rows[1]!.nextMonitoring!.daysOverdue).toBeGreaterThan(0);
    expect(panel.rows[2]!.projectedNetMgPerKgPerDay).toBeGreaterThan(0);
    // By hand: the trailing year (2025-11-21 to 2026-11-20) holds 16 of the 21-day transfusions
    // (37, 58, …, 352 days before the review), each 560 mL × 0.60 × 1.08 mg iron per mL of red cells
    // (volume × haematocrit × iron per mL: the transfusional-iron relation, references.md §1):
    // 16 × 362.88 mg / 365 days / 60 kg = 0.2651 mg/kg/day; 0.5 % allows for rounding in the account.
    expect(panel.rows[2]!.trailingIntakeMgPerKgPerDay).toBeCloseTo((16 * 560 * 0.6 * 1.08) / 365 / 60, 3);
  });

  it('lists a case that does not open with its reason, never skipping it', () => {
    expect(panel.notReviewed).toEqual([{ fileName: 'b-broken.json', label: null, issues: [expect.objectContaining({ code: 'invalid_file' })] }]);
    expect(panel.rows.length + panel.notReviewed.length).toBe(entries.length);
  });

  it("reviews each case on its own review date unless one date is given", () => {
    expect(panel.rows.every((row) => row.asOf === reviewDate)).toBe(true);
    const later = rankPanel(entries, { asOf: '2026-12-31', today: '2030-01-01' });
    expect(later.rows.every((row) => row.asOf === '2026-12-31')).toBe(true);
  });

  it('gives the same order whatever order the cases come in, and keeps tiers in order', () => {
    const reversed = rankPanel([...entries].reverse(), { today: '2030-01-01' });
    expect(reversed).toEqual(panel);
    const demos = rankPanel([entry('th-0417.json', readDemo('th-0417')), entry('th-0093.json', readDemo('th-0093')), ...entries], { today: '2030-01-01' });
    const tierIndexes = demos.rows.map((row) => panelTiers.indexOf(row.tier));
    expect(tierIndexes).toEqual([...tierIndexes].sort((a, b) => a - b));
  });
});

describe('rankPanel: next monitoring follows the case’s local-protocol ANC interval, as findings and calendar do', () => {
  // Deferiprone for 400 days with the last ANC 10 days before the review: after a year without an interruption the
  // 2025 US deferiprone label (§2.1, §5.1) asks for counts every 2 to 4 weeks, so nothing is overdue; a local
  // protocol of weekly counts (threshold deferiprone-anc-interval, 7 days) makes the count due 3 days before the review.
  const results = [
    result('liver-iron', 200, 5, 'mg/g{dry}', { method: 'biopsy' }),
    result('cardiac-t2star', 200, 30, 'ms', { fieldStrengthT: 1.5 }),
    result('ferritin', 60, 1500, 'ug/L'),
    result('ferritin', 10, 1500, 'ug/L'),
    result('alt', 10, 25, 'U/L'),
    result('zinc', 10, 14, 'umol/L'),
    result('neutrophils', 10, 3.2, '10*9/L'),
  ];
  const onDeferiprone = withLabel(smallCase({ results, chelationPeriods: [period('deferiprone', 25, { startDaysBefore: 400 })] }), 'PN-DFP');
  const weekly = { ...onDeferiprone, thresholdOverrides: { 'deferiprone-anc-interval': { value: 7, reason: 'weekly counts throughout, local haematology protocol', by: 'Pharmacist AB', at: reviewDate } } };

  it('with the override the ANC is overdue by 3 days in the panel, the calendar and the findings alike', () => {
    const [row] = rankPanel([entry('dfp.json', weekly)], { today: '2030-01-01' }).rows;
    expect(row!.nextMonitoring).toMatchObject({ dueDate: addDaysIso(reviewDate, -3), daysOverdue: 3, status: 'overdue' });
    expect(row!.nextMonitoring!.what.toLowerCase()).toContain('neutrophil');
    expect(row!.tier).toBe('overdue-monitoring');
    const calendar = monitoringCalendar(parsed(weekly), reviewDate);
    expect(calendar.ok && calendar.value.items.find((it) => it.id === 'neutrophils')).toMatchObject({ dueDate: addDaysIso(reviewDate, -3), interval: { days: 7 } });
    const [finding] = ofRule(findingsFor(weekly, reviewDate, parsed(weekly).thresholdOverrides), 'deferiprone-anc-monitoring');
    expect(finding!.text).toContain('by the local protocol');
    expect(finding!.text).toContain('3 days overdue');
  });

  it('without it the label’s schedule applies: the ANC is not overdue', () => {
    const [row] = rankPanel([entry('dfp.json', onDeferiprone)], { today: '2030-01-01' }).rows;
    const calendar = monitoringCalendar(parsed(onDeferiprone), reviewDate);
    const anc = calendar.ok ? calendar.value.items.find((it) => it.id === 'neutrophils')! : null;
    expect(anc!.overdue).toBe(false);
    expect(row!.overdueMonitoringCount).toBe(0);
  });
});

describe('rankPanel: computed with a short projection, its rows are those of the full review', () => {
  // The panel computes each case over one month with 50 draws (a modelling choice, rankPanel.ts); what it
  // shows must not depend on that: the same net balance, intake, finding counts and most severe finding as
  // the review's own computeCase (24 months, 500 draws) and findings give, for every demo and scenario case.
  const cases: [string, unknown][] = [
    ['th-0417.json', readDemo('th-0417')],
    ['th-0093.json', readDemo('th-0093')],
    ['urgent.json', urgent],
    ['overdue.json', overdue],
    ['accumulating.json', accumulating],
  ];
  for (const [fileName, json] of cases) {
    it(fileName, () => {
      const loaded = parseCase(json);
      if (!loaded.ok) throw new Error(`${fileName} does not parse`);
      const [row] = rankPanel([{ fileName, loaded }], { today: '2030-01-01' }).rows;
      const asOf = row!.asOf;
      const full = computeCase(loaded.value, asOf);
      if (!full.ok) throw new Error(`${fileName} does not compute`);
      const evaluated = findingsWithMonitoring(loaded.value, full.value, asOf, loaded.value.thresholdOverrides);
      if (!evaluated.ok) throw new Error(`${fileName} findings do not evaluate`);
      const findings = evaluated.value.findings;
      expect(row!.projectedNetMgPerKgPerDay).toBe(full.value.projection?.scenarios[0]?.netMgPerKgPerDay ?? null);
      expect(row!.trailingIntakeMgPerKgPerDay).toBe(full.value.intake.mgPerKgPerDay);
      expect(row!.findingCounts).toEqual({
        urgent: findings.filter((it) => it.severity === 'urgent').length,
        review: findings.filter((it) => it.severity === 'review').length,
        information: findings.filter((it) => it.severity === 'information').length,
      });
      // The first finding of the most severe severity present (the rules' order within one).
      const first = (['urgent', 'review', 'information'] as const).map((severity) => findings.find((it) => it.severity === severity)).find((it) => it !== undefined);
      expect(row!.mostSevereFinding).toEqual(first ? { severity: first.severity, title: first.title, ruleId: first.ruleId } : null);
      expect(row!.overdueMonitoringCount).toBe(evaluated.value.monitoring.items.filter((item) => item.overdue).length);
    });
  }
});
