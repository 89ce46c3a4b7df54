import type { IsoDate } from '../dates/isoDate';
import { computeCase } from '../ledger/computeCase';
import type { Case } from '../model/caseFile';
import type { Issue, Result } from '../result';
import { findingsWithMonitoring, severities, type Severity } from '../safety';

/**
 * Panel review across a workspace: every case reviewed on its date and ranked
 * by how soon it asks for the pharmacist's attention. The command line's
 * `panel` reviews each case with reviewPanelEntry (in worker threads,
 * app/host/workspaceReview.ts) and ranks them all with rankOutcomes; rankPanel
 * is the two in one thread. (The workspace's Cases screen reviews each case in
 * the renderer, renderer/viewModels/casesList.ts, and sorts by its own keys.)
 * Descriptive only: a rank orders the reviews, it decides nothing.
 */

/** Why a case sits where it does, most pressing first (a modelling choice of ours, following the issue's order). */
export const panelTiers = ['urgent-finding', 'overdue-monitoring', 'positive-balance', 'review-finding', 'routine'] as const;
export type PanelTier = (typeof panelTiers)[number];

/** One case as the store gave it: opened and validated, or the reasons it could not be. */
export interface PanelEntry {
  readonly fileName: string;
  readonly loaded: Result<Case>;
}

export interface PanelRow {
  readonly fileName: string;
  readonly label: string;
  readonly asOf: IsoDate;
  readonly tier: PanelTier;
  /** The most severe finding (urgent before review before information; the rules' order within one). */
  readonly mostSevereFinding: { readonly severity: Severity; readonly title: string; readonly ruleId: string } | null;
  readonly findingCounts: Readonly<Record<Severity, number>>;
  /** The monitoring item due first (overdue ones first of all), or null when none applies. */
  readonly nextMonitoring: { readonly what: string; readonly dueDate: IsoDate; readonly status: string; readonly daysOverdue: number } | null;
  readonly overdueMonitoringCount: number;
  /** Net transfusional iron over the trailing year (or the record, if shorter), mg/kg/day. */
  readonly trailingIntakeMgPerKgPerDay: number;
  readonly trailingIntakeWindowDays: number;
  /** Net iron balance projected at the current regimen, mg/kg/day (positive: iron accumulates); null without a projection. */
  readonly projectedNetMgPerKgPerDay: number | null;
}

/** A case that could not be reviewed, with why; listed, never skipped. */
export interface PanelProblem {
  readonly fileName: string;
  /** The label when the case opened but could not be computed. */
  readonly label: string | null;
  readonly issues: readonly Issue[];
}

export interface PanelReview {
  /** Most pressing first. */
  readonly rows: readonly PanelRow[];
  /** In file-name order. */
  readonly notReviewed: readonly PanelProblem[];
}

export interface PanelOptions {
  /** One review date for every case; otherwise each case's own review date, else `today`. */
  readonly asOf?: IsoDate;
  /** The host's date, used for a case with no review date of its own. */
  readonly today: IsoDate;
}

/**
 * The panel shows no band and no month ahead: only the net balance of the
 * current regimen on the review date (which depends neither on the sampling nor
 * on the horizon) and the findings (whose rules read the review date's figures,
 * never a projected month's, and no projection but the current regimen's). So
 * each case is computed with the fewest samples the projection accepts
 * (core/ledger/projection.ts) rather than the review's 500, over a horizon of
 * one month rather than 24, and its proposed regimens are not projected: a
 * modelling choice of ours that keeps a clinic's workspace quick to rank, and
 * changes nothing the panel shows (tests/core/panel checks its rows against
 * the full review's). The workspace's Cases screen computes its summary lines
 * the same way.
 */
export const summaryComputeOptions = { samples: 50, horizonMonths: 1, projectProposed: false } as const;

const severityRank = (severity: Severity) => severities.indexOf(severity);

/** A case's place in the panel: a row to rank, or why it could not be reviewed. */
export type PanelOutcome = PanelRow | PanelProblem;

/** True for a reviewed case (a row to rank), false for one listed as not reviewed. */
export const isPanelRow = (outcome: PanelOutcome): outcome is PanelRow => 'tier' in outcome;

/**
 * Review one case of a workspace on its date: the per-case half of
 * {@link rankPanel}, which a host may run for many cases at once (app/host/workspaceReview.ts
 * runs it in worker threads) before {@link rankOutcomes} ranks them all.
 *
 * @param entry - the case file's name and its parse result
 * @param options - one review date for all (`asOf`), or each case's own review date, else `today`
 * @returns the case's row, or the case with the issues that kept it from being reviewed
 */
export function reviewPanelEntry(entry: PanelEntry, options: PanelOptions): PanelOutcome {
  if (!entry.loaded.ok) return { fileName: entry.fileName, label: null, issues: entry.loaded.issues.filter((it) => it.severity === 'error') };
  const caseFile = entry.loaded.value;
  const label = caseFile.patient.label;
  const asOf = options.asOf ?? caseFile.review.reviewDate ?? options.today;
  const computed = computeCase(caseFile, asOf, summaryComputeOptions);
  if (!computed.ok) return { fileName: entry.fileName, label, issues: computed.issues };
  // The findings with the monitoring calendar their rules read: the case's own overrides, the calendar's default too.
  const evaluated = findingsWithMonitoring(caseFile, computed.value, asOf, caseFile.thresholdOverrides);
  if (!evaluated.ok) return { fileName: entry.fileName, label, issues: evaluated.issues };
  const { findings, monitoring } = evaluated.value;

  const counts = { urgent: 0, review: 0, information: 0 };
  for (const finding of findings) counts[finding.severity] += 1;
  const mostSevere = [...findings].sort((a, b) => severityRank(a.severity) - severityRank(b.severity))[0];
  const overdue = monitoring.items.filter((item) => item.overdue);
  const next = [...monitoring.items].sort((a, b) => b.daysOverdue - a.daysOverdue || a.dueDate.localeCompare(b.dueDate))[0];
  const projectedNet = computed.value.projection?.scenarios[0]?.netMgPerKgPerDay ?? null;
  const tier: PanelTier =
    counts.urgent > 0
      ? 'urgent-finding'
      : overdue.length > 0
        ? 'overdue-monitoring'
        : projectedNet !== null && projectedNet > 0
          ? 'positive-balance'
          : counts.review > 0
            ? 'review-finding'
            : 'routine';
  return {
    fileName: entry.fileName,
    label,
    asOf,
    tier,
    mostSevereFinding: mostSevere ? { severity: mostSevere.severity, title: mostSevere.title, ruleId: mostSevere.ruleId } : null,
    findingCounts: counts,
    nextMonitoring: next ? { what: next.what, dueDate: next.dueDate, status: next.status, daysOverdue: next.daysOverdue } : null,
    overdueMonitoringCount: overdue.length,
    trailingIntakeMgPerKgPerDay: computed.value.intake.mgPerKgPerDay,
    trailingIntakeWindowDays: computed.value.intake.windowDays,
    projectedNetMgPerKgPerDay: projectedNet,
  };
}

/**
 * Order of two rows: by tier; within a tier by what made it (more urgent
 * findings; more days overdue; a larger positive balance; more review
 * findings), then by label and file name so the order is stable.
 */
export function comparePanelRows(a: PanelRow, b: PanelRow): number {
  const byTier = panelTiers.indexOf(a.tier) - panelTiers.indexOf(b.tier);
  if (byTier !== 0) return byTier;
  const within =
    a.tier === 'urgent-finding'
      ? b.findingCounts.urgent - a.findingCounts.urgent
      : a.tier === 'overdue-monitoring'
        ? (b.nextMonitoring?.daysOverdue ?? 0) - (a.nextMonitoring?.daysOverdue ?? 0)
        : a.tier === 'positive-balance'
          ? (b.projectedNetMgPerKgPerDay ?? 0) - (a.projectedNetMgPerKgPerDay ?? 0)
          : b.findingCounts.review - a.findingCounts.review;
  return within || a.label.localeCompare(b.label) || a.fileName.localeCompare(b.fileName);
}

/**
 * Review every case of a workspace and rank them: urgent findings first, then
 * overdue monitoring, then a positive projected balance at the current
 * regimen, then review findings, then the rest. Cases that could not be
 * opened or computed are returned beside the ranking with their issues.
 *
 * Pure: the entries come from the host's case store; nothing is read here.
 *
 * @param entries - each case file's name and its parse result (core/model parseCase)
 * @param options - one review date for all (`asOf`), or each case's own review date, else `today`
 * @returns the ranked rows and the cases not reviewed
 * @example rankPanel([{ fileName: 'th-0417.json', loaded: parseCase(th0417) }], { today: '2026-12-01' }).rows[0].tier
 *   === 'urgent-finding' (TH-0417 has an urgent finding on its review date 2026-11-20)
 */
export function rankPanel(entries: readonly PanelEntry[], options: PanelOptions): PanelReview {
  return rankOutcomes(entries.map((entry) => reviewPanelEntry(entry, options)));
}

/**
 * Rank reviewed cases: the ranking half of {@link rankPanel}. The order is
 * total (it ends on the file name, unique in a folder), so it does not depend
 * on the order the outcomes arrive in.
 *
 * @param outcomes - one per case, from {@link reviewPanelEntry}, in any order
 * @returns the rows most pressing first, and the cases not reviewed in file-name order
 */
export function rankOutcomes(outcomes: readonly PanelOutcome[]): PanelReview {
  const rows: PanelRow[] = [];
  const notReviewed: PanelProblem[] = [];
  for (const outcome of outcomes) {
    if (isPanelRow(outcome)) rows.push(outcome);
    else notReviewed.push(outcome);
  }
  return {
    rows: rows.sort(comparePanelRows),
    notReviewed: notReviewed.sort((a, b) => a.fileName.localeCompare(b.fileName)),
  };
}
