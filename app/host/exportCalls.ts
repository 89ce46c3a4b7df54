import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import type { HostParsedRequest } from '../../core/contract';
import { computeCase } from '../../core/ledger/computeCase';
import type { Case } from '../../core/model/caseFile';
import { monitoringCalendar } from '../../core/monitoring';
import { buildSheet } from '../../core/report/buildSheet';
import { fail, issue, ok, type Result } from '../../core/result';
import { evaluateFindings } from '../../core/safety';
import { writeFileAtomic } from './atomicWrite';
import type { CaseStore } from './caseStore';
import { monitoringIcs } from './icalendar';
import { countedSteps, type WorkTicket } from './workInProgress';
import { exportsFolderName, insideFolder } from './workspaceFiles';

/**
 * The host contract's exports of a saved case into the workspace's exports
 * folder: the review sheet as PDF (app/host/sheetPdf.ts) and the monitoring
 * calendar as iCalendar (icalendar.ts), each never over an earlier export.
 *
 * Both run as steps on a work ticket (workInProgress.ts), so the page can show
 * how far the host got and stop it: the sheet "Opening <case>", "Reviewing
 * <case> on <date>", "Laying out the sheet's pages", "Writing <file stem>.pdf";
 * the calendar "Opening <case>", "Writing <file stem>.ics". A cancel is
 * honoured at the next step, before the writing at the latest: a cancelled
 * export writes no file. Once the writing has begun it is not stopped.
 */

/** Write into the exports folder under a free name: `stem.ext`, else `stem-2.ext`, `stem-3.ext`… (atomically, never over an earlier export). */
async function writeFresh(folder: string, stem: string, extension: string, data: string | Uint8Array): Promise<Result<string>> {
  try {
    mkdirSync(folder, { recursive: true });
  } catch (error) {
    return fail(issue('write_failed', ['output'], `Cannot make the exports folder ${folder}: ${(error as Error).message}.`));
  }
  for (let attempt = 1; attempt < 100; attempt += 1) {
    const path = join(folder, `${stem}${attempt === 1 ? '' : `-${attempt}`}.${extension}`);
    const written = await writeFileAtomic(path, data, { overwrite: false });
    if (written.ok) return ok(path);
    if (written.issues[0]?.code !== 'already_exists') return fail(...written.issues);
  }
  return fail(issue('already_exists', ['output'], `The exports folder ${folder} already holds 99 files named ${stem}; nothing was written.`));
}

/**
 * A case as saved in the workspace, read through the case store (exports are made from the file, not from
 * unsaved edits), with the SHA-256 of the bytes that were read (the sheet prints it; no second read of the file).
 */
async function savedCase(caseStore: CaseStore, caseId: string): Promise<Result<{ readonly caseFile: Case; readonly sha256: string }>> {
  const path = insideFolder(caseStore.folder, caseId);
  if (!path.ok) return path;
  const opened = await caseStore.open(caseId);
  return opened.ok ? ok({ caseFile: opened.value.caseFile, sha256: opened.value.revision.sha256 }) : opened;
}

/** The name an export of a case is written under, before the folder adds -2, -3… to keep earlier ones. */
const exportStem = (caseId: string, what: string) => `${caseId.replace(/\.json$/, '')}-${what}`;

/** The answer of an export the user cancelled before its file was written. */
const cancelledExport = (what: 'review sheet' | 'monitoring calendar', caseId: string): Result<never> =>
  fail(issue('cancelled', ['workId'], `The ${what} of ${caseId} was cancelled before it was written; no file was written.`));

/**
 * The review sheet of a saved case as PDF, in steps on the ticket.
 *
 * @param caseStore - the workspace's case store
 * @param request - the contract's exportSheetPdf request (case, review date, paper)
 * @param ticket - the work's ticket (an untracked one where nobody follows it)
 * @param toolVersion - printed on the sheet
 * @returns the file written, or why not ('cancelled' when stopped before the writing)
 */
export async function exportSheetPdf(caseStore: CaseStore, request: HostParsedRequest<'exportSheetPdf'>, ticket: WorkTicket, toolVersion: string): Promise<Result<{ readonly path: string }>> {
  const { caseId, asOfDate, paper } = request;
  const step = countedSteps(ticket, 4);
  if (!(await step(`Opening ${caseId}`))) return cancelledExport('review sheet', caseId);
  const saved = await savedCase(caseStore, caseId);
  if (!saved.ok) return saved;
  const { caseFile, sha256 } = saved.value;
  if (!(await step(`Reviewing ${caseFile.patient.label} on ${asOfDate}`))) return cancelledExport('review sheet', caseId);
  const computed = computeCase(caseFile, asOfDate);
  if (!computed.ok) return computed;
  // The local protocol's thresholds recorded in the case apply to every review of it (as on the command line).
  const findings = evaluateFindings(caseFile, computed.value, asOfDate, caseFile.thresholdOverrides);
  if (!findings.ok) return findings;
  const sheet = buildSheet({ caseFile, results: computed.value, findings: findings.value, caseFileSha256: sha256, toolVersion, preparedBy: null });
  if (!(await step("Laying out the sheet's pages"))) return cancelledExport('review sheet', caseId);
  // The PDF library loads only when a sheet is written (app/host/sheetPdf.ts owns it).
  const bytes = await (await import('./sheetPdf')).writeSheetPdf(sheet, { paper });
  const stem = exportStem(caseId, `sheet-${asOfDate}`);
  if (!(await step(`Writing ${stem}.pdf`))) return cancelledExport('review sheet', caseId);
  ticket.unstoppable();
  const written = await writeFresh(join(caseStore.folder, exportsFolderName), stem, 'pdf', bytes);
  return written.ok ? ok({ path: written.value }) : written;
}

/**
 * The monitoring calendar of a saved case as iCalendar, in steps on the ticket.
 *
 * @param caseStore - the workspace's case store
 * @param request - the contract's exportCalendar request (case, review date)
 * @param ticket - the work's ticket
 * @param now - the host's clock, for the calendar's time stamps
 * @returns the file written, or why not ('cancelled' when stopped before the writing)
 */
export async function exportCalendar(caseStore: CaseStore, request: HostParsedRequest<'exportCalendar'>, ticket: WorkTicket, now: Date): Promise<Result<{ readonly path: string }>> {
  const { caseId, asOfDate } = request;
  const step = countedSteps(ticket, 2);
  if (!(await step(`Opening ${caseId}`))) return cancelledExport('monitoring calendar', caseId);
  const saved = await savedCase(caseStore, caseId);
  if (!saved.ok) return saved;
  const calendar = monitoringCalendar(saved.value.caseFile, asOfDate);
  if (!calendar.ok) return calendar;
  const stem = exportStem(caseId, `monitoring-${asOfDate}`);
  if (!(await step(`Writing ${stem}.ics`))) return cancelledExport('monitoring calendar', caseId);
  ticket.unstoppable();
  const written = await writeFresh(join(caseStore.folder, exportsFolderName), stem, 'ics', monitoringIcs(calendar.value, now));
  return written.ok ? ok({ path: written.value }) : written;
}
