import { z } from 'zod';
import { issueCodes, type Issue, type Result } from '../result';
import { isoDateSchema } from '../model/fields';
import { describeValue } from '../model/zodIssues';
import type { HostCallName } from './callNames';
import { settingsSchema, paperSizes } from './settings';

/**
 * The host contract: every call the renderer may make, with its request and
 * response schemas (design.md §6). Electron's main process and the browser
 * preview answer the same calls through one registration function
 * (app/host/hostDispatch.ts) that validates the payload, runs the host service
 * and validates the response; the renderer's host client (renderer/host/)
 * validates both ends again. Nothing throws across the boundary: every answer
 * is `{ ok: true, value } | { ok: false, issues }`.
 *
 * Cases are named by `caseId`, a file name inside the workspace folder: the
 * renderer never sends a path to read or write, so it cannot reach a file
 * outside the workspace. Imports carry the file's text, read in the page.
 */

/** An issue as it crosses the boundary (core/result's Issue). */
export const issueSchema = z.strictObject({
  code: z.enum(issueCodes),
  path: z.array(z.union([z.string(), z.number()])).readonly(),
  message: z.string(),
  severity: z.enum(['error', 'warning']),
});

/** The answer of every call: the value, or the issues that refused it. */
export function hostResultSchema<Value extends z.ZodType>(value: Value) {
  return z.discriminatedUnion('ok', [
    z.strictObject({ ok: z.literal(true), value, warnings: z.array(issueSchema).optional() }),
    z.strictObject({ ok: z.literal(false), issues: z.array(issueSchema).min(1) }),
  ]);
}

/**
 * A case's name in its workspace: a `.json` file name, no folders, no leading
 * dot, at most 120 characters (common file-system limits are 255 bytes; we keep
 * room for the archive's and journal's suffixes — a modelling choice of ours).
 */
export const caseIdSchema = z
  .string()
  .regex(/^[A-Za-z0-9][A-Za-z0-9 ._()-]{0,114}\.json$/, {
    message: 'must be a file name ending in .json: letters, digits, spaces, . _ - ( ), no folders.',
  })
  .refine((name) => !name.includes('..'), { message: 'must not contain "..".' });

/** A case file's content as JSON: an object, checked by the case model on the host (parseCase). */
export const caseDocumentSchema = z.record(z.string(), z.unknown());

/** An opaque token of the file's state on disk when it was read; a save names it so a change by someone else is detected. */
export const revisionSchema = z.string().min(1).max(200);

/** One line of the case list. */
export const caseSummarySchema = z.strictObject({
  caseId: caseIdSchema,
  /** The patient label (initials or a local code); null when the file cannot be read. */
  patientLabel: z.string().nullable(),
  archived: z.boolean(),
  /** ISO 8601 time of the last change on disk, from the file system. */
  modifiedAt: z.string().nullable(),
  /** Why the file cannot be opened, or its warnings; empty when it is clean. */
  issues: z.array(issueSchema),
});

const openedCaseSchema = z.strictObject({
  caseId: caseIdSchema,
  document: caseDocumentSchema,
  revision: revisionSchema,
  /** Warnings of the case model (values outside their plausible range, a label that looks like a name). */
  warnings: z.array(issueSchema),
});

const savedCaseSchema = z.strictObject({ caseId: caseIdSchema, revision: revisionSchema, warnings: z.array(issueSchema) });

const journalEntrySchema = z.strictObject({ at: z.string(), description: z.string() });

/**
 * The name the page gives one piece of long work (an import's dry run or commit), so that it can ask the
 * host how far it got (workProgress) and cancel it (cancelWork) while the call runs: 8 to 64 letters,
 * digits, _ or - (the page makes 24 hex digits from crypto.getRandomValues; the bounds are a modelling
 * choice of ours: long enough not to collide by chance, short enough for a log line).
 */
export const workIdSchema = z.string().superRefine((value, context) => {
  if (!/^[A-Za-z0-9_-]{8,64}$/.test(value)) {
    context.addIssue({ code: 'custom', params: { code: 'invalid_file' }, message: `${describeValue(value)} is not a work id: expected 8 to 64 letters, digits, _ or - (${value.length} characters given).` });
  }
});

/** How far a piece of long work got: the step under way in words, and how many of the steps foreseen are done. */
export const workProgressSchema = z.strictObject({
  /** The step under way, in the host's words ("Checking 60,000 rows against the case"). */
  step: z.string().min(1).max(300),
  /** Steps finished before this one. */
  done: z.number().int().nonnegative(),
  /** Steps foreseen, this one included (it grows when a step has to be repeated). */
  total: z.number().int().positive(),
});

/** Kinds of import the host reads (CSV of simple transfusions, of red-cell exchanges, of venesections or of results; an HL7 FHIR R4 Bundle). */
export const importKinds = ['csv-transfusions', 'csv-exchanges', 'csv-venesections', 'csv-results', 'fhir-bundle'] as const;

const importRequestSchema = z.strictObject({
  caseId: caseIdSchema,
  kind: z.enum(importKinds),
  /** The chosen file's name, for messages only. */
  sourceName: z.string().min(1).max(255),
  /** The file's text; 5 MB is far above a year of records (a modelling choice of ours). */
  sourceText: z.string().max(5_000_000),
  /** Column name → field, when the user corrected the guessed mapping. */
  columnMapping: z.record(z.string(), z.string()).optional(),
  /** For CSV dates written without the year first (03/04/2026): how to read them; ambiguous dates are refused, never guessed, without it. */
  dateOrder: z.enum(['day-first', 'month-first']).optional(),
  /** For a FHIR Bundle: a local code map (a JSON file of our own format, checked by the host) for Observations LOINC has no code for. */
  codeMap: z.strictObject({ sourceName: z.string().min(1).max(255), sourceText: z.string().max(1_000_000) }).optional(),
  /** The page's name for this call's work, to follow its progress (workProgress) and cancel it (cancelWork). */
  workId: workIdSchema.optional(),
});

const importPreviewSchema = z.strictObject({
  /** What would be added, by record kind. */
  counts: z.record(z.string(), z.number().int().nonnegative()),
  /** The first rows as they would be added, in words. */
  firstRows: z.array(z.string()),
  /** Every row refused, with its line number (null for a whole-file problem, a bundle entry or a code the import does not know) and reason. */
  rejected: z.array(z.strictObject({ line: z.number().int().positive().nullable(), reason: z.string() })),
  /** What the import understood, to show beside the preview: the column mapping (guessed or given), the date order, the resources read. */
  understood: z.array(z.string()).optional(),
  /**
   * For a CSV: its columns in order, each with the field it is read as (null: not read), the fields a
   * column may be mapped to and those the import needs, for the user to correct the mapping.
   * Answered also when a required column is missing (then nothing would be added and the refusal is among `rejected`).
   */
  csvMapping: z
    .strictObject({
      columns: z.array(z.strictObject({ column: z.string(), field: z.string().nullable() })),
      fields: z.array(z.string()),
      required: z.array(z.string()),
    })
    .optional(),
});

const emptyRequest = z.strictObject({});
const workspaceSchema = z.strictObject({ folder: z.string().nullable() });
const writtenFileSchema = z.strictObject({ path: z.string().min(1) });

/** One call of the contract. */
export interface HostCallSpec<Request extends z.ZodType = z.ZodType, Response extends z.ZodType = z.ZodType> {
  readonly summary: string;
  readonly request: Request;
  readonly response: Response;
}

function call<Request extends z.ZodType, Response extends z.ZodType>(summary: string, request: Request, response: Response): HostCallSpec<Request, Response> {
  return { summary, request, response };
}

export const hostContract = {
  appInfo: call('The app\'s name and version.', emptyRequest, z.strictObject({ name: z.string(), version: z.string() })),
  currentWorkspace: call('The workspace folder in use, or null before one is chosen.', emptyRequest, workspaceSchema),
  chooseWorkspace: call(
    'Ask the user for a workspace folder (a folder dialog); null when they cancel.',
    emptyRequest,
    workspaceSchema,
  ),
  listCases: call(
    'A summary line per case in the workspace, then one per case in its archive folder, marked archived (its caseId is its name there).',
    emptyRequest,
    z.array(caseSummarySchema),
  ),
  openCase: call('Read one case with its warnings.', z.strictObject({ caseId: caseIdSchema }), openedCaseSchema),
  createCase: call(
    'Create a new case file from a document (refused if the name is taken).',
    z.strictObject({ caseId: caseIdSchema, document: caseDocumentSchema }),
    savedCaseSchema,
  ),
  saveCase: call(
    'Save a case atomically; refused if the file changed on disk since `baseRevision`.',
    z.strictObject({ caseId: caseIdSchema, document: caseDocumentSchema, baseRevision: revisionSchema }),
    savedCaseSchema,
  ),
  saveCaseAs: call(
    'Save a document under a new name (refused if the name is taken); the old file stays.',
    z.strictObject({ newCaseId: caseIdSchema, document: caseDocumentSchema }),
    savedCaseSchema,
  ),
  renameCase: call('Rename a case file.', z.strictObject({ caseId: caseIdSchema, newCaseId: caseIdSchema }), caseSummarySchema),
  archiveCase: call('Move a case to the workspace\'s archive folder; never deleted.', z.strictObject({ caseId: caseIdSchema }), caseSummarySchema),
  recoverCase: call(
    'The latest state of a case from its journal after a crash, with the change history.',
    z.strictObject({ caseId: caseIdSchema }),
    z.strictObject({ caseId: caseIdSchema, document: caseDocumentSchema, revision: revisionSchema, history: z.array(journalEntrySchema) }),
  ),
  importDryRun: call('What an import would add to a case, without changing it.', importRequestSchema, importPreviewSchema),
  importCommit: call(
    'Add an import to a case and save it.',
    importRequestSchema.extend({ baseRevision: revisionSchema }),
    savedCaseSchema.extend({ counts: z.record(z.string(), z.number().int().nonnegative()) }),
  ),
  workProgress: call(
    'How far the work the page named (an import under way) has got; null when the host has no such work running.',
    z.strictObject({ workId: workIdSchema }),
    workProgressSchema.nullable(),
  ),
  cancelWork: call(
    'Ask the host to stop the work the page named at its next step; `stopping` is false when it has finished already or is past the point where it can stop (a save under way).',
    z.strictObject({ workId: workIdSchema }),
    z.strictObject({ stopping: z.boolean() }),
  ),
  exportSheetPdf: call(
    'Write the review sheet of a saved case as PDF; returns the file written.',
    z.strictObject({ caseId: caseIdSchema, asOfDate: isoDateSchema, paper: z.enum(paperSizes), workId: workIdSchema.optional() }),
    writtenFileSchema,
  ),
  exportCalendar: call(
    'Write the monitoring due for a saved case as an iCalendar file; returns the file written.',
    z.strictObject({ caseId: caseIdSchema, asOfDate: isoDateSchema, workId: workIdSchema.optional() }),
    writtenFileSchema,
  ),
  readSettings: call('The user\'s settings (defaults where none are stored).', emptyRequest, settingsSchema),
  writeSettings: call('Replace the user\'s settings; returns them as stored.', settingsSchema, settingsSchema),
  takeOpenRequest: call(
    'The case file the operating system (or the command line) asked the app to open, removed from the host; its folder becomes the workspace. Null when none is waiting.',
    emptyRequest,
    z.strictObject({ caseId: caseIdSchema, workspaceFolder: z.string().min(1) }).nullable(),
  ),
} as const satisfies Record<HostCallName, HostCallSpec>;

export type HostContract = typeof hostContract;
/** What a caller passes (defaults may be omitted). */
export type HostRequest<Name extends HostCallName> = z.input<HostContract[Name]['request']>;
/** What a service receives, after validation (defaults filled in). */
export type HostParsedRequest<Name extends HostCallName> = z.output<HostContract[Name]['request']>;
/** What a service returns and the renderer receives. */
export type HostValue<Name extends HostCallName> = z.output<HostContract[Name]['response']>;

/** core/result's Issue and Result are what crosses the boundary; issueSchema checks them. */
export type HostIssue = Issue;
export type HostResult<Value> = Result<Value>;

/** The renderer's view of the host: one async function per call, never throwing. */
export type HostApi = { readonly [Name in HostCallName]: (request: HostRequest<Name>) => Promise<HostResult<HostValue<Name>>> };

/** The host's side: one service per call, receiving a validated request. */
export type HostHandlers = {
  readonly [Name in HostCallName]: (request: HostParsedRequest<Name>) => Promise<HostResult<HostValue<Name>>> | HostResult<HostValue<Name>>;
};
