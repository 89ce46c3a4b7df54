import type { IsoDate } from '../../core/dates/isoDate';
import { computeCase } from '../../core/ledger/computeCase';
import { parseCase } from '../../core/model/parseCase';
import { summaryComputeOptions } from '../../core/panel';
import { findingsWithMonitoring, severities } from '../../core/safety';
import type { StoredCase } from '../hostPort';
import { choiceWords } from '../../core/words';
import { formatNumber, formatQuantity } from './format';

/** One line of the Cases screen. */
export interface CaseSummaryLine {
  readonly id: string;
  readonly label: string;
  readonly diagnosis: string;
  readonly regimen: string;
  readonly intake: string;
  readonly latestLic: string;
  readonly latestLicDate: string;
  readonly mostSevereFinding: string;
  /** 0 urgent, 1 review, 2 information, 3 none: for sorting. */
  readonly severityRank: number;
  readonly nextDue: string;
  readonly problem: string | null;
}

export const caseSortKeys = ['label', 'severity', 'latest-lic-date', 'next-due'] as const;
export type CaseSortKey = (typeof caseSortKeys)[number];
export const caseSortLabels: Readonly<Record<CaseSortKey, string>> = {
  label: 'label',
  severity: 'most severe finding first',
  'latest-lic-date': 'oldest liver iron result first',
  'next-due': 'next monitoring due first',
};

/**
 * The summary line of a stored case, reviewed on its own review date (or
 * `today` when it has none). A case file with errors still gets a line that
 * says so; the list never hides a case.
 */
export function caseSummaryLine(stored: StoredCase, today: IsoDate): CaseSummaryLine {
  const parsed = parseCase(stored.json);
  const empty = { regimen: '—', intake: '—', latestLic: '—', latestLicDate: '', mostSevereFinding: '—', severityRank: severities.length, nextDue: '' };
  if (!parsed.ok) {
    const label = (stored.json as { patient?: { label?: string } } | null)?.patient?.label ?? stored.id;
    return { id: stored.id, label, diagnosis: '—', ...empty, problem: `The case file has ${parsed.issues.length} error(s): ${parsed.issues[0]?.message ?? ''}` };
  }
  const caseFile = parsed.value;
  const asOf = caseFile.review.reviewDate ?? today;
  const base = { id: stored.id, label: caseFile.patient.label, diagnosis: choiceWords(caseFile.patient.diagnosisGroup) };
  // As the panel computes a case (core/panel summaryComputeOptions): a line shows no projected month and no
  // band, and no derivation, so none is worked out; the findings come with the calendar their rules read.
  const computed = computeCase(caseFile, asOf, summaryComputeOptions);
  if (!computed.ok) return { ...base, ...empty, problem: computed.issues[0]?.message ?? 'The review could not be computed.' };
  const evaluated = findingsWithMonitoring(caseFile, computed.value, asOf, caseFile.thresholdOverrides);
  if (!evaluated.ok) return { ...base, ...empty, problem: evaluated.issues[0]?.message ?? 'The findings could not be evaluated.' };
  const results = computed.value;
  const { findings, monitoring } = evaluated.value;
  const worst = findings.reduce<(typeof findings)[number] | null>(
    (best, finding) => (best === null || severities.indexOf(finding.severity) < severities.indexOf(best.severity) ? finding : best),
    null,
  );
  const next = monitoring.items[0];
  return {
    ...base,
    regimen: results.currentRegimens.map((regimen) => regimen.label).join(' + ') || 'no chelation on record',
    intake: `${formatQuantity(results.intake.mgPerKgPerDay, 2, 'mg/kg/d')} (${results.intake.band})`,
    latestLic: results.bodyIron.lastMeasured ? formatQuantity(results.bodyIron.lastMeasured.licMgPerGDry, 1, 'mg/g{dry}') : 'none on record',
    latestLicDate: results.bodyIron.lastMeasured?.date ?? '',
    mostSevereFinding: worst ? `${worst.severity}: ${worst.title}` : 'no findings',
    severityRank: worst ? severities.indexOf(worst.severity) : severities.length,
    nextDue: next ? `${next.what} ${next.status === 'overdue' ? 'overdue since' : 'due'} ${next.dueDate}` : '',
    problem: null,
  };
}

/** The lines that match `search` (label, diagnosis, regimen or finding), sorted by `sortKey`. */
export function visibleCaseLines(lines: readonly CaseSummaryLine[], search: string, sortKey: CaseSortKey): CaseSummaryLine[] {
  const needle = search.trim().toLowerCase();
  const matching = lines.filter((line) =>
    needle === '' ? true : [line.label, line.diagnosis, line.regimen, line.mostSevereFinding].some((text) => text.toLowerCase().includes(needle)),
  );
  const byText = (a: string, b: string) => (a === b ? 0 : a === '' ? 1 : b === '' ? -1 : a.localeCompare(b));
  const compare: Record<CaseSortKey, (a: CaseSummaryLine, b: CaseSummaryLine) => number> = {
    label: (a, b) => a.label.localeCompare(b.label),
    severity: (a, b) => a.severityRank - b.severityRank || a.label.localeCompare(b.label),
    'latest-lic-date': (a, b) => byText(a.latestLicDate, b.latestLicDate) || a.label.localeCompare(b.label),
    'next-due': (a, b) => byText(a.nextDue.slice(-10), b.nextDue.slice(-10)) || a.label.localeCompare(b.label),
  };
  return [...matching].sort(compare[sortKey]);
}

/** Count line for the list heading: "2 of 3 cases". */
export function caseCountText(shown: number, total: number, folder: string | null = null): string {
  const count = shown === total ? `${formatNumber(total, 0)} case${total === 1 ? '' : 's'}` : `${formatNumber(shown, 0)} of ${formatNumber(total, 0)} cases`;
  return folder === null ? count : `${count} in ${folder}`;
}
