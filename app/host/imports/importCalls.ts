import type { HostParsedRequest, HostValue } from '../../../core/contract';
import { fail, issue, ok, type Issue, type Result } from '../../../core/result';
import type { CaseStore, OpenedCase } from '../caseStore';
import { revisionFromToken, revisionToken } from '../revisionToken';
import { readCodeMap } from './codeMap';
import { csvColumnMapping, csvFieldsByKind, type CsvKind } from './csvImport';
import { commitImport, describeEntry, previewImportStepwise, previewRowsShown, type ImportChoices, type ImportPreview } from './importCase';
import type { Rejected } from './importPlan';
import { countedSteps, type WorkTicket } from '../workInProgress';

/**
 * The host contract's importDryRun and importCommit over the shared import
 * (importCase.ts, the same code as the command line's `import`). The request
 * carries the chosen file's name and text (read in the page); the case is
 * named by its caseId inside the workspace and read through the case store.
 *
 * Both run as steps on a work ticket (workInProgress.ts): "Opening <case>",
 * "Reading <file>", "Checking N rows against the case" (again for each pass
 * without the rows the case model refused) and, for a commit, "Saving <case>".
 * Each step is reported before its work, and a cancel is honoured at the next
 * step: before "Saving" at the latest, so a cancelled commit writes nothing.
 * Once the save has begun, it is no longer stopped.
 */

type ImportRequest = HostParsedRequest<'importDryRun'>;

/** The contract's CSV import kinds, as the CSV reader names them. */
const csvKindOf: Readonly<Record<Exclude<ImportRequest['kind'], 'fhir-bundle'>, CsvKind>> = {
  'csv-transfusions': 'transfusions',
  'csv-exchanges': 'exchanges',
  'csv-venesections': 'venesections',
  'csv-results': 'results',
};


/** The request's column mapping (column → field) as the reader takes it (field → column), each field checked. */
function fieldMapping(request: ImportRequest, csvKind: CsvKind): Result<Record<string, string> | undefined> {
  if (!request.columnMapping) return ok(undefined);
  const fields = csvFieldsByKind[csvKind];
  const mapping: Record<string, string> = {};
  const problems: Issue[] = [];
  for (const [column, field] of Object.entries(request.columnMapping)) {
    if (!fields.includes(field)) {
      problems.push(issue('unknown_choice', ['columnMapping', column], `Column "${column.slice(0, 60)}" is mapped to "${field.slice(0, 40)}", which is not a field of a ${csvKind} import (${fields.join(', ')}).`));
    } else if (mapping[field] !== undefined) {
      problems.push(issue('inconsistent', ['columnMapping', column], `Columns "${mapping[field]!.slice(0, 60)}" and "${column.slice(0, 60)}" are both mapped to ${field}; map one column to each field.`));
    } else mapping[field] = column;
  }
  return problems.length > 0 ? fail(...problems) : ok(mapping);
}

/** A rejected row with its line number when it has one (a CSV line); a bundle entry or a code keeps where it is in the reason. */
function rejectedRow(row: Rejected): { line: number | null; reason: string } {
  const line = /^line (\d+)$/.exec(row.where);
  return line ? { line: Number(line[1]), reason: row.reason } : { line: null, reason: `${row.where}: ${row.reason}` };
}

/** The steps an import foresees: opening, reading, checking, and saving for a commit (a check repeated adds one). */
const foreseenSteps = { preview: 3, commit: 4 } as const;

type Step = ReturnType<typeof countedSteps>;

/** The answer of an import the user cancelled: nothing was written. */
const cancelledImport = (request: ImportRequest, what: 'preview' | 'commit'): Result<never> =>
  fail(
    issue(
      'cancelled',
      ['workId'],
      what === 'commit'
        ? `The import from ${request.sourceName} was cancelled; nothing was added to ${request.caseId}.`
        : `The preview of the import from ${request.sourceName} was cancelled; nothing was added to ${request.caseId}.`,
    ),
  );

/** Open the case and preview the import into it, step by step; every refusal names the file. */
async function preview(store: CaseStore, request: ImportRequest, step: Step, what: 'preview' | 'commit'): Promise<Result<{ readonly opened: OpenedCase; readonly preview: ImportPreview }>> {
  if (!(await step(`Opening ${request.caseId}`))) return cancelledImport(request, what);
  const opened = await store.open(request.caseId);
  if (!opened.ok) return fail(issue('invalid_file', ['caseId'], `${request.caseId}: the case cannot be opened; nothing was imported.`), ...opened.issues);
  const csvKind: CsvKind = csvKindOf[request.kind === 'fhir-bundle' ? 'csv-results' : request.kind];
  const mapping = request.kind === 'fhir-bundle' ? ok(undefined) : fieldMapping(request, csvKind);
  if (!mapping.ok) return mapping;
  let codeMap: ImportChoices['codeMap'];
  if (request.codeMap) {
    const read = readCodeMap(request.codeMap.sourceName, request.codeMap.sourceText);
    if (!read.ok) return read;
    codeMap = read.value;
  }
  const choices: ImportChoices =
    request.kind === 'fhir-bundle'
      ? { format: 'fhir', ...(codeMap ? { codeMap } : {}) }
      : { format: 'csv', csvKind, ...(mapping.value ? { mapping: mapping.value } : {}), ...(request.dateOrder ? { dateOrder: request.dateOrder } : {}) };
  const previewed = await previewImportStepwise({ name: request.sourceName, text: request.sourceText }, opened.value.caseFile, choices, (next) => step(next.step, next.repeated));
  if (previewed === 'stopped') return cancelledImport(request, what);
  if (!previewed.ok) {
    const named = previewed.issues[0]?.message.startsWith(request.sourceName) ?? false;
    return named ? previewed : fail(issue('invalid_file', ['sourceText'], `${request.sourceName}: nothing was imported.`), ...previewed.issues);
  }
  if (previewed.value.caseProblems.length > 0) {
    return fail(issue('inconsistent', ['caseId'], `${request.caseId}: the case has errors of its own; nothing can be imported until they are corrected.`), ...previewed.value.caseProblems);
  }
  return ok({ opened: opened.value, preview: previewed.value });
}

/** The Patient cautions (a birth date or sex that differs from the case) as warnings. */
const cautionWarnings = (found: ImportPreview): Issue[] => found.cautions.map((text) => issue('inconsistent', ['sourceText'], text, 'warning'));

/**
 * importDryRun: what the import would add, every row refused (with its line)
 * and every code not known (listed among the refused, never dropped). Nothing is written.
 */
export async function importDryRun(store: CaseStore, request: ImportRequest, ticket: WorkTicket): Promise<Result<HostValue<'importDryRun'>>> {
  const found = await preview(store, request, countedSteps(ticket, foreseenSteps.preview), 'preview');
  const csvKind = request.kind === 'fhir-bundle' ? null : csvKindOf[request.kind];
  const mapping = csvKind === null ? ok(undefined) : fieldMapping(request, csvKind);
  const columns = csvKind !== null && mapping.ok ? csvColumnMapping(request.sourceText, csvKind, mapping.value) : null;
  const csvMapping = columns && { columns: columns.columns.map((it) => ({ ...it })), fields: [...columns.fields], required: [...columns.required] };
  if (!found.ok) {
    // A CSV whose header row is read but does not map (a required column missing): the columns are
    // answered with the refusal as a whole-file rejection, so the user can map the columns and try again.
    if (csvMapping === null || found.issues[0]?.path[0] !== 'sourceText' || found.issues[0]?.code === 'cancelled') return found;
    return ok({
      counts: { transfusions: 0, results: 0, weights: 0, heights: 0 },
      firstRows: [],
      rejected: found.issues.slice(1).map((it) => ({ line: it.path[0] === 'line 1' || it.path[0] === 'columnMapping' ? 1 : null, reason: it.message })),
      understood: [],
      csvMapping,
    });
  }
  const { preview: previewed } = found.value;
  return ok(
    {
      ...(csvMapping ? { csvMapping } : {}),
      counts: { ...previewed.counts },
      firstRows: previewed.entries.slice(0, previewRowsShown).map((entry) => `${entry.where}: ${describeEntry(entry)}`),
      rejected: [
        ...previewed.rejected.map(rejectedRow),
        ...previewed.unknownCodes.map((it) => ({ line: null, reason: `${it.where}: code ${it.code}${it.display ? ` (${it.display})` : ''} is not one the import knows; not imported.` })),
      ],
      understood: [...previewed.understood],
    },
    cautionWarnings(previewed),
  );
}

/**
 * importCommit: the same preview, saved through the case store with one
 * journal line; refused, with nothing written, when the case changed on disk
 * since `baseRevision` (the preview the user saw would no longer be what is added),
 * and when the user cancelled it before the save began (the 'cancelled' issue).
 */
export async function importCommit(store: CaseStore, request: HostParsedRequest<'importCommit'>, ticket: WorkTicket): Promise<Result<HostValue<'importCommit'>>> {
  const expected = revisionFromToken(request.baseRevision);
  if (!expected.ok) return expected;
  const step = countedSteps(ticket, foreseenSteps.commit);
  const found = await preview(store, request, step, 'commit');
  if (!found.ok) return found;
  const { opened, preview: previewed } = found.value;
  if (opened.revision.sha256 !== expected.value.sha256) {
    return fail(
      issue('changed_on_disk', ['baseRevision'], `${request.caseId} changed on disk since the import was previewed (another window, program or machine); nothing was imported. Open it again and preview the import again.`),
    );
  }
  const counts = { ...previewed.counts };
  if (previewed.entries.length === 0) {
    // Nothing to add: the file is left as it is (no empty journal line).
    return ok({ caseId: opened.fileName, revision: revisionToken(opened.revision), warnings: [...opened.warnings], counts }, cautionWarnings(previewed));
  }
  // The last moment a cancel is honoured: after this step the save runs to its end (atomic: all or nothing).
  if (!(await step(`Saving ${request.caseId}`))) return cancelledImport(request, 'commit');
  ticket.unstoppable();
  const saved = await commitImport(store, opened, previewed, request.sourceName, expected.value);
  if (!saved.ok) return saved;
  return ok({ caseId: saved.value.fileName, revision: revisionToken(saved.value.revision), warnings: [...saved.value.warnings], counts }, [...cautionWarnings(previewed), ...(saved.warnings ?? [])]);
}
