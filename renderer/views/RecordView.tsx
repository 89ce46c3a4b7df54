import { useWorkspace, workspaceStore, type UnitSystem } from '../state/store';
import { pastedCells, recordTableIds, type RecordTableId } from '../viewModels/recordTables';
import { addRows, deleteRow, pasteRows, setCell } from '../viewModels/recordEdits';
import { convertedText, preferredUnit } from '../viewModels/unitSystems';
import { EditableTable, type TableIntents } from './EditableTable';

/** The record: transfusions, results, chelation periods and co-medications, edited in place and saved as core accepts them. */
export function RecordView() {
  const draft = useWorkspace((state) => state.draft);
  const check = useWorkspace((state) => state.check);
  const unitSystem = useWorkspace((state) => state.unitSystem);
  const openId = useWorkspace((state) => state.openId);
  const { edit, setUnitSystem, openImport } = workspaceStore.getState();
  if (!draft) return <p>Open a case first.</p>;
  const preferred = (kind: string) => preferredUnit(unitSystem, kind);
  const intentsOf = (table: RecordTableId): TableIntents => ({
    onCell: (rowId, key, value) => edit((current) => setCell(current, table, rowId, key, value)),
    onAddRow: () => edit((current) => addRows(current, table, [{}], null, preferred)),
    onPaste: (rowId, fromColumn, text) => edit((current) => pasteRows(current, table, rowId, pastedCells(table, text, fromColumn), preferred)),
    onDelete: (rowId) => edit((current) => deleteRow(current, table, rowId)),
  });
  const other = check?.otherIssues ?? [];
  return (
    <>
      <div className="toolbar">
        <fieldset className="unit-system">
          <legend>Units shown beside results</legend>
          {(['si', 'conventional'] as const satisfies readonly UnitSystem[]).map((system) => (
            <label key={system}>
              <input type="radio" name="unit-system" value={system} checked={unitSystem === system} onChange={() => setUnitSystem(system)} /> {system === 'si' ? 'SI' : 'conventional'}
            </label>
          ))}
        </fieldset>
        <button type="button" onClick={() => openImport(openId ?? undefined)}>Import records from a file</button>
        <p className="hint">Paste rows from a spreadsheet into any cell: the columns fill from that cell rightwards. Enter moves down a column; Ctrl+Z undoes.</p>
      </div>
      {other.length > 0 ? (
        <ul className="field-errors" role="alert">{other.map((issue) => <li key={issue.message}>{issue.message}</li>)}</ul>
      ) : null}
      {recordTableIds.map((table) => (
        <EditableTable
          key={table}
          table={table}
          rows={draft.tables[table]}
          issues={check?.cellIssues.filter((it) => it.table === table) ?? []}
          intents={intentsOf(table)}
          {...(table === 'results' ? { extraColumn: { label: `In ${unitSystem === 'si' ? 'SI' : 'conventional'} units`, value: (row) => convertedText(unitSystem, row.cells) } } : {})}
        />
      ))}
    </>
  );
}
