import { useWorkspace, workspaceStore } from '../state/store';
import { dateOrderChoices, importCaseChoices, importKindChoices, importKindLabels, importPreviewView, importProgressBar, importStepText, withColumnField, type DateOrder } from '../viewModels/recordImport';

/**
 * Records from a file (a CSV export of transfusions or of results, or an HL7
 * FHIR R4 Bundle) into one case: the file is read in the page and sent to the
 * host's import (a dry run first); the screen shows how the columns are read
 * (editable), what would be added, every refused row with its line and
 * reason, and adds it to the case only when asked. While the host reads or
 * adds the file, its step shows with a progress bar, and Cancel asks the host
 * to stop (it stops before saving anything).
 */
export function ImportView() {
  const session = useWorkspace((state) => state.importSession);
  const cases = useWorkspace((state) => state.cases);
  const { chooseImportFile, setImportChoices, commitImport, cancelImport, clearImport, openImport } = workspaceStore.getState();
  if (!session) return <p><button type="button" onClick={() => openImport()}>Start an import</button></p>;
  const caseChoices = importCaseChoices(cases);
  const caseLabel = caseChoices.find((it) => it.id === session.caseId)?.label ?? 'the case';
  const view = session.preview ? importPreviewView(session.preview, session.previewWarnings) : null;
  const isCsv = session.kind !== 'fhir-bundle';
  const mapping = session.preview?.csvMapping;
  const bar = session.pending ? importProgressBar(session.pending) : null;
  return (
    <div className="import-screen">
      <p className="hint">The file is read here and checked by the same import as the command line; nothing is added to the case until you choose to add it.</p>
      <form className="import-choices" onSubmit={(event) => event.preventDefault()}>
        <label>
          Into the case
          <select value={session.caseId ?? ''} onChange={(event) => setImportChoices({ caseId: event.target.value })}>
            {session.caseId === null ? <option value="">— choose a case —</option> : null}
            {caseChoices.map((it) => <option key={it.id} value={it.id}>{it.label}</option>)}
          </select>
        </label>
        <fieldset>
          <legend>The file holds</legend>
          {importKindChoices.map((kind) => (
            <label key={kind} className="inline-choice">
              <input type="radio" name="import-kind" value={kind} checked={session.kind === kind} onChange={() => setImportChoices({ kind })} /> {importKindLabels[kind]}
            </label>
          ))}
        </fieldset>
        <label>
          File to import (CSV or JSON)
          <input
            type="file"
            accept=".csv,.txt,.json,text/csv,application/json,application/fhir+json"
            onChange={async (event) => {
              const file = event.target.files?.[0];
              if (file) chooseImportFile(file.name, await file.text());
              event.target.value = '';
            }}
          />
        </label>
        <p className="chosen-file" aria-live="polite">{session.fileName ? `Chosen: ${session.fileName}${session.fileText === null ? ' (too large to have been kept across the reload: choose it again)' : ''}` : 'No file chosen yet.'}</p>
        {isCsv ? (
          <fieldset>
            <legend>Dates written as 03/04/2026 are read</legend>
            {dateOrderChoices.map((choice) => (
              <label key={choice.id ?? 'file'} className="inline-choice">
                <input type="radio" name="import-date-order" checked={session.dateOrder === choice.id} onChange={() => setImportChoices({ dateOrder: choice.id as DateOrder | null })} /> {choice.label}
              </label>
            ))}
          </fieldset>
        ) : null}
      </form>

      {session.pending && bar ? (
        <div className="busy import-progress" role="status">
          <progress aria-label={bar.label} {...(bar.value === null || bar.max === null ? {} : { value: bar.value, max: bar.max })} />
          <span className="import-step">{importStepText(session.pending)}</span>
          <button type="button" onClick={() => void cancelImport()}>Cancel</button>
        </div>
      ) : null}
      {session.refusal ? <p className="field-errors" role="alert">{session.refusal}</p> : null}
      {session.notice ? <p className="import-notice" role="status">{session.notice}</p> : null}

      {view ? (
        <>
          {mapping ? (
            <section aria-labelledby="import-columns">
              <h2 id="import-columns">How the columns are read</h2>
              <table className="import-mapping">
                <thead><tr><th scope="col">Column in the file</th><th scope="col">Read as</th></tr></thead>
                <tbody>
                  {view.columns.map((entry) => (
                    <tr key={entry.column}>
                      <th scope="row">{entry.column}</th>
                      <td>
                        <select
                          aria-label={`Column "${entry.column}" is read as`}
                          value={entry.field ?? ''}
                          onChange={(event) => setImportChoices({ columnMapping: withColumnField(mapping, entry.column, event.target.value === '' ? null : event.target.value) })}
                        >
                          <option value="">not read</option>
                          {view.fieldChoices.map((choice) => <option key={choice.id} value={choice.id}>{choice.label}</option>)}
                        </select>
                      </td>
                    </tr>
                  ))}
                </tbody>
              </table>
              {view.missingText ? <p className="field-errors">No column is read as {view.missingText}: choose the column for each.</p> : null}
            </section>
          ) : null}
          <section aria-labelledby="import-adds">
            <h2 id="import-adds">What would be added to {caseLabel}</h2>
            <p className="import-adds">{view.addsText}</p>
            {view.firstRows.length > 0 ? (
              <>
                <p className="hint">The first rows, as they would be added:</p>
                <ul className="import-rows">{view.firstRows.map((row) => <li key={row}>{row}</li>)}</ul>
              </>
            ) : null}
            {view.understood.length > 0 ? (
              <details className="understood">
                <summary>What the import understood</summary>
                <ul>{view.understood.map((line) => <li key={line}>{line}</li>)}</ul>
              </details>
            ) : null}
            {view.warnings.map((warning) => <p key={warning} className="field-message warning">{warning}</p>)}
          </section>
          <section aria-labelledby="import-refused">
            <h2 id="import-refused">Refused rows</h2>
            <p>{view.rejectedText}</p>
            {view.rejected.length > 0 ? (
              <table className="import-refused">
                <thead><tr><th scope="col">Where</th><th scope="col">Why it is refused</th></tr></thead>
                <tbody>{view.rejected.map((row, index) => <tr key={`${row.where}-${index}`}><th scope="row">{row.where}</th><td>{row.reason}</td></tr>)}</tbody>
              </table>
            ) : null}
          </section>
        </>
      ) : null}

      <div className="toolbar">
        <button type="button" className="primary" disabled={!view?.canCommit || session.pending !== null} onClick={() => void commitImport()}>
          Add to {caseLabel}
        </button>
        <button type="button" onClick={clearImport} disabled={session.fileName === null && session.columnMapping === null}>Start over</button>
      </div>
    </div>
  );
}
