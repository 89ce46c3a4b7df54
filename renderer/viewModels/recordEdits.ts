import { freshEntryId, type Draft } from './draftCase';
import { choiceFromText, newRowCells, withCell, type Cells, type RecordTableId, type Row } from './recordTables';

/** Pure edits of a draft's tables: each returns a new draft, the input is untouched (undo keeps the old one). */
const withTable = (draft: Draft, table: RecordTableId, rows: readonly Row[]): Draft => ({ ...draft, tables: { ...draft.tables, [table]: rows } });

const idHint = (table: RecordTableId, cells: Cells): string => (table === 'chelationPeriods' || table === 'coMedications' ? (cells.startDate ?? '') : (cells.date ?? '')).trim();

/** One cell changed to the text typed. */
export function setCell(draft: Draft, table: RecordTableId, rowId: string, key: string, value: string): Draft {
  const rows = draft.tables[table];
  const index = rows.findIndex((row) => row.id === rowId);
  const row = rows[index];
  if (!row || row.cells[key] === value) return draft;
  const next = [...rows];
  next[index] = { ...row, cells: withCell(table, row.cells, key, value) };
  return withTable(draft, table, next);
}

/**
 * Rows added after `afterIndex` (or at the end), each from the cells given
 * (a paste, or a blank row), filled with the defaults of a new row.
 */
export function addRows(draft: Draft, table: RecordTableId, givenRows: readonly Cells[], afterIndex: number | null, preferred?: (kind: string) => string | undefined): Draft {
  let working = draft;
  const added: Row[] = [];
  for (const given of givenRows) {
    const cells = newRowCells(table, given, preferred);
    const id = freshEntryId(withTable(working, table, [...working.tables[table], ...added]), table, idHint(table, cells));
    added.push({ id, cells });
  }
  const rows = [...working.tables[table]];
  const at = afterIndex === null ? rows.length : afterIndex + 1;
  rows.splice(at, 0, ...added);
  working = withTable(working, table, rows);
  return working;
}

/**
 * A paste of spreadsheet rows at a cell: the first pasted line fills the row
 * it lands on from that column on (keeping its other cells), the rest become
 * new rows below it.
 */
export function pasteRows(draft: Draft, table: RecordTableId, rowId: string, pasted: readonly Cells[], preferred?: (kind: string) => string | undefined): Draft {
  const rows = draft.tables[table];
  const index = rows.findIndex((row) => row.id === rowId);
  const row = rows[index];
  if (!row || pasted.length === 0) return draft;
  const [first, ...rest] = pasted;
  let cells = row.cells;
  for (const [key, value] of Object.entries(first!)) cells = withCell(table, cells, key, choiceFromText(table, cells, key, value));
  const next = [...rows];
  next[index] = { ...row, cells };
  return addRows(withTable(draft, table, next), table, rest.map((given) => asChoices(table, given)), index, preferred);
}

/** Pasted cells with select texts read as their choices, column by column in order. */
function asChoices(table: RecordTableId, given: Cells): Cells {
  let cells: Record<string, string> = {};
  for (const [key, value] of Object.entries(given)) cells = { ...cells, [key]: choiceFromText(table, cells, key, value) };
  return cells;
}

/** A row removed. */
export function deleteRow(draft: Draft, table: RecordTableId, rowId: string): Draft {
  return withTable(draft, table, draft.tables[table].filter((row) => row.id !== rowId));
}

/** A change to the case file outside the tables (proposed regimens, overrides). */
export function setBaseField(draft: Draft, key: string, value: unknown): Draft {
  return { ...draft, base: { ...draft.base, [key]: value } };
}
