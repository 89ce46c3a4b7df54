import { useEffect, useRef, useState, type ClipboardEvent, type KeyboardEvent } from 'react';
import { pathText } from '../../core/model/zodIssues';
import type { CellIssue } from '../viewModels/draftCase';
import { choiceText, columnUnitText, isMultiCellPaste, tableColumns, tableTitles, visibleRows, type RecordTableId, type Row } from '../viewModels/recordTables';

export interface TableIntents {
  readonly onCell: (rowId: string, key: string, value: string) => void;
  readonly onAddRow: () => void;
  readonly onPaste: (rowId: string, fromColumn: string, text: string) => void;
  readonly onDelete: (rowId: string) => void;
}

/** A message without the path core puts in front of it (the field is beside it on screen). */
const messageText = (issue: CellIssue['issue']) => {
  const prefix = `${pathText(issue.path)} `;
  return issue.message.startsWith(prefix) ? issue.message.slice(prefix.length) : issue.message;
};

/**
 * One record table: a row per entry, a cell per field; Tab moves along a row,
 * Enter and the arrow keys move down and up a column (Enter on the last row
 * adds one), a paste of several spreadsheet cells fills rows from the cell.
 * Messages from core stand beside their field.
 */
export function EditableTable({ table, rows, issues, intents, extraColumn }: {
  readonly table: RecordTableId;
  readonly rows: readonly Row[];
  readonly issues: readonly CellIssue[];
  readonly intents: TableIntents;
  readonly extraColumn?: { readonly label: string; readonly value: (row: Row) => string };
}) {
  const columns = tableColumns[table];
  const [showAll, setShowAll] = useState(false);
  const shown = visibleRows(rows, issues.map((it) => it.rowId), showAll);
  const tableRef = useRef<HTMLTableElement>(null);
  const scrollRef = useRef<HTMLDivElement>(null);
  // A focus asked for before the row exists (Enter on the last row, Add a row) lands once it is rendered.
  const pendingFocus = useRef<{ row: number; key: string } | null>(null);
  const tryFocus = () => {
    const wanted = pendingFocus.current;
    if (!wanted) return;
    const cell = tableRef.current?.querySelector<HTMLElement>(`[data-row="${wanted.row}"][data-col="${wanted.key}"]`);
    if (cell) {
      pendingFocus.current = null;
      cell.focus();
    }
  };
  const focusCell = (rowIndex: number, key: string) => {
    pendingFocus.current = { row: rowIndex, key };
    tryFocus();
  };
  useEffect(tryFocus, [rows.length]);
  useEffect(() => {
    // The latest entries are at the end: show them first.
    const box = scrollRef.current;
    if (box) box.scrollTop = box.scrollHeight;
  }, []);
  const addRowAndFocus = () => {
    intents.onAddRow();
    focusCell(rows.length, columns[0]!.key);
  };
  const onKeyDown = (event: KeyboardEvent<HTMLElement>, rowIndex: number, key: string, isSelect: boolean) => {
    const last = rows.length - 1;
    if (event.key === 'Enter') {
      event.preventDefault();
      if (event.shiftKey) {
        if (rowIndex > 0) focusCell(rowIndex - 1, key);
        return;
      }
      if (rowIndex === last) intents.onAddRow();
      focusCell(rowIndex + 1, key);
    } else if (!isSelect && event.key === 'ArrowDown' && rowIndex < last) {
      event.preventDefault();
      focusCell(rowIndex + 1, key);
    } else if (!isSelect && event.key === 'ArrowUp' && rowIndex > 0) {
      event.preventDefault();
      focusCell(rowIndex - 1, key);
    }
  };
  const onPaste = (event: ClipboardEvent<HTMLElement>, rowId: string, key: string) => {
    const text = event.clipboardData.getData('text/plain');
    if (!isMultiCellPaste(text)) return;
    event.preventDefault();
    intents.onPaste(rowId, key, text);
  };
  const titleId = `table-${table}`;
  return (
    <section className="record-table" aria-labelledby={titleId}>
      <h2 id={titleId}>{tableTitles[table]}</h2>
      <div className="table-scroll record-scroll" ref={scrollRef}>
        <table ref={tableRef}>
          <thead>
            <tr>
              {columns.map((column) => (
                <th key={column.key} scope="col" className={`col-${column.width}`}>
                  {column.label}{columnUnitText(column) ? <span className="unit"> ({columnUnitText(column)})</span> : null}
                </th>
              ))}
              {extraColumn ? <th scope="col">{extraColumn.label}</th> : null}
              <th scope="col"><span className="visually-hidden">Remove</span></th>
            </tr>
          </thead>
          <tbody>
            {shown.rows.map(({ row, rowIndex }) => {
              const rowIssues = issues.filter((it) => it.rowId === row.id);
              const rowLevel = rowIssues.filter((it) => it.column === null);
              return (
                <tr key={row.id} className={rowIssues.some((it) => it.issue.severity === 'error') ? 'row-error' : undefined}>
                  {columns.map((column) => {
                    const cellIssues = rowIssues.filter((it) => it.column === column.key);
                    const messageId = cellIssues.length > 0 ? `msg-${table}-${row.id}-${column.key}` : undefined;
                    const label = `${column.label}, row ${rowIndex + 1}`;
                    const value = row.cells[column.key] ?? '';
                    const choices = column.choices?.(row.cells);
                    const common = {
                      'data-row': rowIndex,
                      'data-col': column.key,
                      'aria-label': label,
                      'aria-invalid': cellIssues.some((it) => it.issue.severity === 'error') || undefined,
                      'aria-describedby': messageId,
                    };
                    return (
                      <td key={column.key}>
                        {choices && !(choices.length === 1 && choices[0] === '') ? (
                          <select {...common} value={value} onChange={(event) => intents.onCell(row.id, column.key, event.target.value)} onKeyDown={(event) => onKeyDown(event, rowIndex, column.key, true)}>
                            {choices.includes(value) ? null : <option value={value}>{value === '' ? '—' : `${value} (not a choice here)`}</option>}
                            {choices.map((choice) => <option key={choice} value={choice}>{choiceText(column, choice)}</option>)}
                          </select>
                        ) : choices ? (
                          <span className="not-applicable" aria-label={`${label}: not applicable`}>—</span>
                        ) : (
                          <input
                            {...common}
                            className={`cell-${column.width}`}
                            value={value}
                            placeholder={column.width === 'date' ? 'YYYY-MM-DD' : undefined}
                            onChange={(event) => intents.onCell(row.id, column.key, event.target.value)}
                            onKeyDown={(event) => onKeyDown(event, rowIndex, column.key, false)}
                            onPaste={(event) => onPaste(event, row.id, column.key)}
                          />
                        )}
                        {cellIssues.map((it) => (
                          <span key={it.issue.message} id={messageId} className={`field-message ${it.issue.severity}`}>
                            {it.issue.severity === 'warning' ? 'Check: ' : 'Not accepted: '}{messageText(it.issue)}
                          </span>
                        ))}
                      </td>
                    );
                  })}
                  {extraColumn ? <td className="converted">{extraColumn.value(row)}</td> : null}
                  <td>
                    <button type="button" className="remove" onClick={() => intents.onDelete(row.id)} aria-label={`Remove row ${rowIndex + 1} of ${tableTitles[table]}`}>Remove</button>
                    {rowLevel.map((it) => <span key={it.issue.message} className={`field-message ${it.issue.severity}`}>{it.issue.message}</span>)}
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      {shown.hiddenCount > 0 || showAll ? (
        <button type="button" onClick={() => setShowAll(!showAll)}>{showAll ? 'Show the latest rows only' : `Show all ${rows.length} rows (${shown.hiddenCount} earlier ones hidden)`}</button>
      ) : null}{' '}
      <button type="button" onClick={addRowAndFocus}>Add a row to {tableTitles[table].toLowerCase()}</button>
    </section>
  );
}
