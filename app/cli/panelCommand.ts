import { isIsoDate } from '../../core/dates/isoDate';
import type { PanelRow, PanelTier } from '../../core/panel';
import { formatIssues, type Result } from '../../core/result';
import { reviewWorkspace, type WorkspaceWorkers } from '../host/workspaceReview';
import type { ParsedArgs } from './args';
import type { StoreIo } from './editCommands';
import { decisionSupportCaution, formatNumber } from './format';
import { exitCodes, type CliIo } from './io';

export const panelUsage = `Usage:
  chelation-ledger panel <folder> [--as-of YYYY-MM-DD] [--json]
Reviews every case file in the folder (not archive/) and lists them ranked: urgent findings first,
then overdue monitoring, then a positive projected iron balance. Cases that cannot be opened are listed with why.`;

const tierText: Readonly<Record<PanelTier, string>> = {
  'urgent-finding': 'urgent finding',
  'overdue-monitoring': 'monitoring overdue',
  'positive-balance': 'iron accumulating at the current regimen',
  'review-finding': 'findings for review',
  routine: 'no finding above information',
};

function rowText(row: PanelRow, index: number): string {
  const finding = row.mostSevereFinding ? `${row.mostSevereFinding.title} (${row.mostSevereFinding.severity})` : 'no findings';
  const next = row.nextMonitoring
    ? row.nextMonitoring.daysOverdue > 0
      ? `${row.nextMonitoring.what} OVERDUE since ${row.nextMonitoring.dueDate} (${row.nextMonitoring.daysOverdue} days)`
      : `${row.nextMonitoring.what} due ${row.nextMonitoring.dueDate}`
    : 'none applies';
  const balance = row.projectedNetMgPerKgPerDay === null ? '' : `; projected net ${formatNumber(row.projectedNetMgPerKgPerDay, 2)} mg/kg/day`;
  return [
    `${index + 1}. ${row.label} (${row.fileName}) as of ${row.asOf}: ${tierText[row.tier]}`,
    `     most severe: ${finding}; findings ${row.findingCounts.urgent} urgent, ${row.findingCounts.review} for review`,
    `     next monitoring: ${next}`,
    `     trailing intake ${formatNumber(row.trailingIntakeMgPerKgPerDay, 2)} mg/kg/day over ${row.trailingIntakeWindowDays} days${balance}`,
  ].join('\n');
}

/** The threads a workspace review may use (the process boundary reads them from the environment); absent: this thread alone. */
export interface PanelIo {
  readonly workspaceWorkers?: () => Result<WorkspaceWorkers>;
}

/** `panel <folder> [--as-of DATE] [--json]`: every case reviewed and ranked by urgency (core/panel, through app/host/workspaceReview.ts). */
export async function panelCommand(args: ParsedArgs, io: CliIo & StoreIo & PanelIo): Promise<number> {
  if (args.switches.has('--help')) {
    io.out(panelUsage);
    return exitCodes.ok;
  }
  const folder = args.positionals[0];
  if (folder === undefined || args.positionals.length > 1) {
    io.err(panelUsage);
    return exitCodes.usage;
  }
  const problems = Object.keys(args.options)
    .filter((flag) => flag !== '--as-of')
    .map((flag) => `${flag}: not an option of panel (--as-of, --json).`);
  for (const flag of args.missingValues) problems.push(`${flag}: a value is missing after the flag.`);
  const asOf = args.options['--as-of'];
  if (asOf !== undefined && !isIsoDate(asOf)) problems.push(`--as-of: "${asOf}" is not a calendar date written YYYY-MM-DD.`);
  if (problems.length > 0) {
    io.err(problems.join('\n'));
    return exitCodes.usage;
  }
  const workers = io.workspaceWorkers?.() ?? null;
  if (workers !== null && !workers.ok) {
    io.err(formatIssues(workers.issues));
    return exitCodes.usage;
  }
  // Each case is read and validated once, then reviewed, shared over one thread per core but one (app/host/workspaceReview.ts coresLeftToTheEngine).
  const reviewed = await reviewWorkspace(io.openStore(folder), { ...(asOf === undefined ? {} : { asOf }), today: io.today(), workers: workers?.value ?? null });
  if (!reviewed.ok) {
    io.err(formatIssues(reviewed.issues));
    return exitCodes.invalidInput;
  }
  const panel = reviewed.value.review;
  if (args.switches.has('--json')) {
    io.out(JSON.stringify({ caution: decisionSupportCaution, folder, ...panel }, null, 2));
    return exitCodes.ok;
  }
  const lines = [`Panel review of ${folder}: ${panel.rows.length} case(s) reviewed, ${panel.notReviewed.length} not reviewed.`, `  ${decisionSupportCaution}`, ''];
  if (panel.notReviewed.length > 0) {
    lines.push('Not reviewed (the file needs attention first):');
    for (const problem of panel.notReviewed) {
      lines.push(`- ${problem.fileName}${problem.label ? ` (${problem.label})` : ''}: ${problem.issues[0]?.message ?? 'could not be reviewed'}${problem.issues.length > 1 ? ` (and ${problem.issues.length - 1} more; run check)` : ''}`);
    }
    lines.push('');
  }
  if (panel.rows.length === 0 && panel.notReviewed.length === 0) lines.push('(no case files in this folder)');
  panel.rows.forEach((row, index) => lines.push(rowText(row, index)));
  io.out(lines.join('\n'));
  return exitCodes.ok;
}
