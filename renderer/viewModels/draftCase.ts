import type { Case } from '../../core/model/caseFile';
import { migrateCase } from '../../core/model/migrate';
import { parseCase } from '../../core/model/parseCase';
import type { Issue } from '../../core/result';
import { entryToRow, recordTableIds, rowToEntry, tableColumns, type RecordTableId, type Row } from './recordTables';

/**
 * The case being edited: the case file without its four record lists (kept
 * as JSON, untouched), and those lists as rows of typed text. The draft is
 * what the user typed; the case is what core/model accepts from it.
 */
export interface Draft {
  readonly base: Readonly<Record<string, unknown>>;
  readonly tables: Readonly<Record<RecordTableId, readonly Row[]>>;
}

/**
 * The draft of a stored case file, migrated to the current version first
 * (an older file is saved in the current version from its first change on;
 * it is never written back in an older version).
 */
export function draftFromJson(json: unknown): Draft {
  const migrated = migrateCase(json);
  const source = ((migrated.ok ? migrated.value : json) ?? {}) as Record<string, unknown>;
  const base: Record<string, unknown> = { ...source };
  const tables = {} as Record<RecordTableId, Row[]>;
  for (const table of recordTableIds) {
    delete base[table];
    const list = Array.isArray(source[table]) ? (source[table] as Record<string, unknown>[]) : [];
    tables[table] = list.map((entry) => entryToRow(table, entry));
  }
  return { base, tables };
}

/** True when a value has a draft's shape (a kept draft read back from the browser's storage). */
export function isDraft(value: unknown): value is Draft {
  if (typeof value !== 'object' || value === null) return false;
  const { base, tables } = value as Partial<Draft>;
  if (typeof base !== 'object' || base === null || Array.isArray(base) || typeof tables !== 'object' || tables === null) return false;
  return recordTableIds.every((table) => {
    const rows = (tables as Record<string, unknown>)[table];
    return Array.isArray(rows) && rows.every((row: Partial<Row>) => typeof row === 'object' && row !== null && typeof row.id === 'string' && typeof row.cells === 'object' && row.cells !== null && Object.values(row.cells).every((cell) => typeof cell === 'string'));
  });
}

/** The case-file JSON a draft stands for (what the store writes when it checks). */
export function draftToJson(draft: Draft): Record<string, unknown> {
  const json: Record<string, unknown> = { ...draft.base };
  for (const table of recordTableIds) json[table] = draft.tables[table].map((row) => rowToEntry(table, row));
  return json;
}

export interface CellIssue {
  readonly table: RecordTableId;
  readonly rowId: string;
  /** Column key, or null when the issue concerns the whole row. */
  readonly column: string | null;
  readonly issue: Issue;
}

export interface DraftCheck {
  /** The accepted case, or null while the draft has errors. */
  readonly caseFile: Case | null;
  readonly cellIssues: readonly CellIssue[];
  /** Issues outside the four tables (patient, overrides, proposed regimens). */
  readonly otherIssues: readonly Issue[];
}

const startsWith = (path: readonly (string | number)[], prefix: readonly string[]) => prefix.every((part, index) => path[index] === part);

/** Where in the tables an issue of core/model belongs: table, row, column. */
export function placeIssue(draft: Draft, issue: Issue): CellIssue | null {
  const [table, index, ...rest] = issue.path;
  if (typeof table !== 'string' || typeof index !== 'number' || !(recordTableIds as readonly string[]).includes(table)) return null;
  const tableId = table as RecordTableId;
  const row = draft.tables[tableId][index];
  if (!row) return null;
  let best: { key: string; length: number } | null = null;
  for (const column of tableColumns[tableId]) {
    for (const fieldPath of column.fieldPaths) {
      if (startsWith(rest, fieldPath) && (best === null || fieldPath.length > best.length)) best = { key: column.key, length: fieldPath.length };
    }
  }
  return { table: tableId, rowId: row.id, column: best?.key ?? null, issue };
}

/** Check a draft with core/model: the case when it is accepted, and every issue placed beside its field. */
export function checkDraft(draft: Draft): DraftCheck {
  const parsed = parseCase(draftToJson(draft));
  const issues = parsed.ok ? (parsed.warnings ?? []) : parsed.issues;
  const cellIssues: CellIssue[] = [];
  const otherIssues: Issue[] = [];
  for (const issue of issues) {
    const placed = placeIssue(draft, issue);
    if (placed) cellIssues.push(placed);
    else otherIssues.push(issue);
  }
  return { caseFile: parsed.ok ? parsed.value : null, cellIssues, otherIssues };
}

/** An id for a new entry, unique in its table: 'tx-2026-11-24', then 'tx-2026-11-24-2'. */
export function freshEntryId(draft: Draft, table: RecordTableId, hint: string): string {
  const prefix = { transfusions: 'tx', results: 'res', chelationPeriods: 'chel', coMedications: 'comed' }[table];
  const taken = new Set(draft.tables[table].map((row) => row.id));
  const base = `${prefix}-${hint || 'new'}`;
  if (!taken.has(base)) return base;
  let count = 2;
  while (taken.has(`${base}-${count}`)) count += 1;
  return `${base}-${count}`;
}
