import { describe, expect, it } from 'vitest';
import { monitoringCalendar, type MonitoringCalendar } from '../../../core/monitoring';
import { parseCase } from '../../../core/model/parseCase';
import type { Case } from '../../../core/model/caseFile';
import { findSource } from '../../../core/references';
import { deepFreeze, readDemo } from '../model/caseFixtures';

function caseFrom(json: unknown): Case {
  const parsed = parseCase(json);
  if (!parsed.ok) throw new Error(parsed.issues.map((it) => it.message).join('; '));
  return parsed.value;
}

function calendar(theCase: Case, asOf: string, ancIntervalDays?: number): MonitoringCalendar {
  const result = monitoringCalendar(theCase, asOf, ancIntervalDays === undefined ? {} : { ancIntervalDays });
  if (!result.ok) throw new Error(result.issues.map((it) => it.message).join('; '));
  return result.value;
}

/** Independent day count: whole UTC days between two ISO dates with plain Date.UTC (no date library). */
function utcDays(from: string, to: string): number {
  const at = (iso: string) => Date.UTC(Number(iso.slice(0, 4)), Number(iso.slice(5, 7)) - 1, Number(iso.slice(8, 10)));
  return (at(to) - at(from)) / 86_400_000;
}

const row = (cal: MonitoringCalendar, id: string) => cal.items.find((it) => it.id === id);

describe('monitoring calendar, scenario TH-0417 (scenarios.md §1) on 2026-11-20', () => {
  const cal = calendar(caseFrom(readDemo('th-0417')), '2026-11-20');

  it('has creatinine and ALT monthly on deferasirox, last 2026-09-29, due 2026-10-29, overdue by 22 days', () => {
    // Monthly: deferasirox label (references.md §4, secondary). Calendar by hand: one month after
    // 29 September is 29 October; 29 October → 20 November is 2 + 20 = 22 days (checked with Date.UTC).
    for (const id of ['creatinine', 'alt'] as const) {
      expect(row(cal, id)).toMatchObject({ lastDate: '2026-09-29', dueDate: '2026-10-29', status: 'overdue', overdue: true, intervalText: 'monthly', drugs: ['deferasirox'] });
      expect(row(cal, id)!.daysOverdue).toBe(utcDays('2026-10-29', '2026-11-20'));
      expect(row(cal, id)!.daysOverdue).toBe(22);
    }
  });

  it('has hearing and eyes yearly on deferasirox with none on record, so due now', () => {
    for (const id of ['hearing', 'eyes'] as const) {
      expect(row(cal, id)).toMatchObject({ lastDate: null, dueDate: '2026-11-20', status: 'due-now', overdue: false });
    }
  });

  it('has ferritin 3 months, liver iron and cardiac T2* 12 months after their last results', () => {
    // Ferritin 2026-11-10 + 3 months = 2027-02-10; MRI 2026-11-17 + 12 months = 2027-11-17 (age 15, thalassaemia major).
    expect(row(cal, 'ferritin')).toMatchObject({ lastDate: '2026-11-10', dueDate: '2027-02-10', status: 'upcoming' });
    expect(row(cal, 'liver-iron')).toMatchObject({ lastDate: '2026-11-17', dueDate: '2027-11-17', status: 'upcoming' });
    expect(row(cal, 'cardiac-t2star')).toMatchObject({ lastDate: '2026-11-17', dueDate: '2027-11-17', status: 'upcoming' });
  });

  it('lists the items earliest due first and says why ANC is not listed', () => {
    // AST and bilirubin (US deferasirox label §5.2) have none on record in TH-0417: due on the review date.
    expect(cal.items.map((it) => it.id)).toEqual(['creatinine', 'alt', 'ast', 'bilirubin', 'hearing', 'eyes', 'ferritin', 'liver-iron', 'cardiac-t2star']);
    expect(cal.notApplicable).toEqual([{ id: 'neutrophils', what: 'absolute neutrophil count (ANC)', reason: 'no deferiprone running on 2026-11-20' }]);
  });

  it('cites a known source for every item', () => {
    for (const item of cal.items) for (const id of item.sourceIds) expect(findSource(id), id).toBeDefined();
  });
});

describe('monitoring calendar, scenario TH-0093 (scenarios.md §3) on 2026-11-20', () => {
  const cal = calendar(caseFrom(readDemo('th-0093')), '2026-11-20');

  it('has hearing and eyes due now on deferoxamine (label, yearly), none on record', () => {
    for (const id of ['hearing', 'eyes'] as const) {
      expect(row(cal, id)).toMatchObject({ lastDate: null, dueDate: '2026-11-20', status: 'due-now', drugs: ['deferoxamine'] });
      // Only the drug that is running is cited: the deferoxamine label (references.md §4, confirmed).
      expect(row(cal, id)!.sourceIds).toEqual(['deferoxamine-label']);
      expect(row(cal, id)!.why).toMatch(/^On deferoxamine: .* yearly \(label; confirmed\)\.$/);
    }
  });

  it('has the liver MRI overdue: last 2025-10-07, due 2026-10-07, 44 days before the review', () => {
    expect(row(cal, 'liver-iron')).toMatchObject({ lastDate: '2025-10-07', dueDate: '2026-10-07', status: 'overdue', daysOverdue: utcDays('2026-10-07', '2026-11-20') });
    expect(row(cal, 'ferritin')).toMatchObject({ lastDate: '2026-10-13', dueDate: '2027-01-13' });
  });

  it('leaves out creatinine and ALT (no deferasirox) and cardiac T2* at 7 years, with reasons', () => {
    expect(cal.items.map((it) => it.id).sort()).toEqual(['eyes', 'ferritin', 'hearing', 'liver-iron']);
    const skipped = Object.fromEntries(cal.notApplicable.map((it) => [it.id, it.reason]));
    expect(skipped['cardiac-t2star']).toBe('age 7 years on 2026-11-20, under 10; earlier where indicated (local decision)');
    expect(skipped['creatinine']).toBe('no deferasirox running on 2026-11-20');
  });
});

describe('monitoring calendar rules', () => {
  it('checks liver tests every two weeks in the first month of a deferasirox period, and creatinine weekly then only with a renal risk factor (US label §5.2, boxed warning and §2.1)', () => {
    const json = readDemo('th-0417');
    const periods = json['chelationPeriods'] as Record<string, unknown>[];
    periods[1]!['endDate'] = '2026-11-09';
    periods.push({ ...periods[1]!, id: 'chel-dfx-28', dose: { value: 28, unit: 'mg/kg' }, startDate: '2026-11-10', endDate: null });
    (json['results'] as unknown[]).push(
      { id: 'creat-new', date: '2026-11-10', kind: 'creatinine', measured: { value: 0.55, unit: 'mg/dL' } },
      { id: 'alt-new', date: '2026-11-10', kind: 'alt', measured: { value: 20, unit: 'U/L' } },
    );
    const withoutRisk = calendar(caseFrom(json), '2026-11-20');
    expect(row(withoutRisk, 'alt')).toMatchObject({ dueDate: '2026-11-24', status: 'upcoming', intervalText: 'every 14 days' });
    expect(row(withoutRisk, 'creatinine')).toMatchObject({ dueDate: '2026-12-10', intervalText: 'monthly' });
    json['clinicalState'] = { renalRiskFactors: [{ id: 'rr', date: '2026-11-01', factor: 'nephrotoxic-co-medication', status: 'present' }] };
    const withRisk = calendar(caseFrom(json), '2026-11-20');
    expect(row(withRisk, 'creatinine')).toMatchObject({ dueDate: '2026-11-17', status: 'overdue', daysOverdue: 3, intervalText: 'weekly' });
    // A month after the start, back to monthly.
    expect(row(calendar(caseFrom(json), '2026-12-10'), 'creatinine')).toMatchObject({ dueDate: '2026-12-10', intervalText: 'monthly' });
    // The factor recorded as absent later no longer counts.
    json['clinicalState'] = { renalRiskFactors: [{ id: 'rr', date: '2026-11-01', factor: 'nephrotoxic-co-medication', status: 'present' }, { id: 'rr2', date: '2026-11-15', factor: 'nephrotoxic-co-medication', status: 'absent' }] };
    expect(row(calendar(caseFrom(json), '2026-11-20'), 'creatinine')).toMatchObject({ intervalText: 'monthly' });
  });

  it('reacts to a creatinine rise on deferasirox: weekly while the latest is more than 33 % above the baseline (TH-0417: 0.56 mg/dL on 2025-05-13, the last before the run; 0.75 is 33.9 %, 0.74 is 32.1 %)', () => {
    const at = (value: number) => {
      const json = readDemo('th-0417');
      (json['results'] as unknown[]).push({ id: 'creat-rise', date: '2026-11-15', kind: 'creatinine', measured: { value, unit: 'mg/dL' } });
      return row(calendar(caseFrom(json), '2026-11-20'), 'creatinine');
    };
    expect(at(0.75)).toMatchObject({ dueDate: '2026-11-22', intervalText: 'weekly' });
    expect(at(0.74)).toMatchObject({ dueDate: '2026-12-15', intervalText: 'monthly' });
  });

  it('checks ANC on deferiprone every 7 days by default, or at the interval given', () => {
    const json = readDemo('th-0417');
    (json['chelationPeriods'] as unknown[]).push({
      id: 'chel-dfp',
      drug: 'deferiprone',
      formulation: 'tablet',
      route: 'oral',
      dose: { value: 25, unit: 'mg/kg' },
      administrationsPerDay: 3,
      daysPerWeek: 7,
      startDate: '2026-06-01',
      endDate: null,
    });
    (json['results'] as unknown[]).push({ id: 'anc-1', date: '2026-11-12', kind: 'neutrophils', measured: { value: 2.1, unit: '10*9/L' } });
    const theCase = caseFrom(json);
    expect(row(calendar(theCase, '2026-11-20'), 'neutrophils')).toMatchObject({ lastDate: '2026-11-12', dueDate: '2026-11-19', status: 'overdue', intervalText: 'weekly' });
    expect(row(calendar(theCase, '2026-11-20', 28), 'neutrophils')).toMatchObject({ dueDate: '2026-12-10', status: 'upcoming', intervalText: 'every 28 days' });
    const bad = monitoringCalendar(theCase, '2026-11-20', { ancIntervalDays: 0 });
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.issues[0]).toMatchObject({ code: 'out_of_range', path: ['ancIntervalDays'], message: 'ANC interval 0 days is outside the plausible range 1–90 whole days.' });
  });

  it('ignores results dated after the review date', () => {
    // As of 2026-10-15 the last creatinine on record is 2026-09-29 → due 2026-10-29, not yet overdue.
    const cal = calendar(caseFrom(readDemo('th-0417')), '2026-10-15');
    expect(row(cal, 'creatinine')).toMatchObject({ lastDate: '2026-09-29', status: 'upcoming' });
    expect(row(cal, 'liver-iron')).toMatchObject({ lastDate: '2025-11-18', dueDate: '2026-11-18' });
  });

  it('refuses a review date that is not a calendar date', () => {
    const result = monitoringCalendar(caseFrom(readDemo('th-0093')), '2026-02-30');
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.issues[0]!.code).toBe('invalid_date');
  });

  it('does not change the case', () => {
    const theCase = deepFreeze(caseFrom(readDemo('th-0417')));
    const before = JSON.stringify(theCase);
    expect(monitoringCalendar(theCase, '2026-11-20').ok).toBe(true);
    expect(JSON.stringify(theCase)).toBe(before);
  });

  it('uses descriptive wording only', () => {
    for (const name of ['th-0417', 'th-0093'] as const) {
      const cal = calendar(caseFrom(readDemo(name)), '2026-11-20');
      for (const text of [...cal.items.map((it) => it.why), ...cal.notApplicable.map((it) => it.reason), ...cal.assumptions]) {
        expect(text).not.toMatch(/\b(give|administer|increase the dose|reduce the dose|stop|must)\b/i);
      }
    }
  });
});

describe('doc-comment examples', () => {
  it('monitoringRules() checks ALT every 14 days in a first month; halfMgUnitsFromMg(62.5) is 125', async () => {
    const { monitoringRules } = await import('../../../core/monitoring');
    const { halfMgUnitsFromMg } = await import('../../../core/dosing');
    expect(monitoringRules().find((it) => it.itemId === 'alt')?.firstMonthInterval).toEqual({ days: 14 });
    expect(halfMgUnitsFromMg(62.5)).toBe(125);
  });
});
