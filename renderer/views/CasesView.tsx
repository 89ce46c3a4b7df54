import { useMemo, useState, type FormEvent } from 'react';
import { diagnosisGroups, sexesAtBirth } from '../../core/model';
import { choiceWords } from '../../core/words';
import { todayIso } from '../hooks/useReview';
import { useWorkspace, workspaceStore } from '../state/store';
import { caseCountText, caseSortKeys, caseSortLabels, caseSummaryLine, visibleCaseLines, type CaseSortKey } from '../viewModels/casesList';
import { emptyNewCaseFields, isNewCaseFields, newCaseJson, type NewCaseFields } from '../viewModels/newCase';
import { useKeptDraft } from '../hooks/useKeptDraft';
import { KeptEntryNotice } from './KeptEntryNotice';

/** The workspace's cases with a summary line each; search, sort, new, open, import. */
export function CasesView() {
  const cases = useWorkspace((state) => state.cases);
  const folder = useWorkspace((state) => state.workspaceFolder);
  const [search, setSearch] = useState('');
  const [sortKey, setSortKey] = useState<CaseSortKey>('label');
  const today = todayIso();
  const lines = useMemo(() => cases.map((stored) => caseSummaryLine(stored, today)), [cases, today]);
  const shown = visibleCaseLines(lines, search, sortKey);
  const { openCase, importCase, openImport } = workspaceStore.getState();
  return (
    <>
      <div className="toolbar">
        <label>
          Search <input type="search" value={search} onChange={(event) => setSearch(event.target.value)} placeholder="label, diagnosis, regimen, finding" />
        </label>
        <label>
          Sort by{' '}
          <select value={sortKey} onChange={(event) => setSortKey(event.target.value as CaseSortKey)}>
            {caseSortKeys.map((key) => <option key={key} value={key}>{caseSortLabels[key]}</option>)}
          </select>
        </label>
        <button type="button" onClick={() => openImport()} disabled={cases.length === 0}>Import records (CSV or FHIR) into a case</button>
        <label className="file-button">
          Add a case file (JSON)
          <input
            type="file"
            accept=".json,application/json"
            onChange={async (event) => {
              const file = event.target.files?.[0];
              if (file) await importCase(await file.text());
              event.target.value = '';
            }}
          />
        </label>
      </div>
      <p aria-live="polite">{caseCountText(shown.length, lines.length, folder)}</p>
      <table className="cases">
        <caption className="visually-hidden">Cases in this workspace</caption>
        <thead>
          <tr>
            <th scope="col">Case</th><th scope="col">Diagnosis group</th><th scope="col">Current regimen</th><th scope="col">Trailing-year intake</th>
            <th scope="col">Latest LIC</th><th scope="col">Most severe finding</th><th scope="col">Next monitoring due</th>
          </tr>
        </thead>
        <tbody>
          {shown.map((line) => (
            <tr key={line.id}>
              <th scope="row"><button type="button" className="open-button" onClick={() => openCase(line.id)} aria-label={`Open ${line.label}`}>{line.label}</button></th>
              <td>{line.diagnosis}</td>
              <td>{line.problem ?? line.regimen}</td>
              <td>{line.intake}</td>
              <td>{line.latestLic}{line.latestLicDate ? ` (${line.latestLicDate})` : ''}</td>
              <td className={`severity-text severity-${line.mostSevereFinding.split(':')[0]}`}>{line.mostSevereFinding}</td>
              <td>{line.nextDue}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <NewCaseForm />
    </>
  );
}

function NewCaseForm() {
  const kept = useKeptDraft<NewCaseFields>('new-case', emptyNewCaseFields(todayIso()), isNewCaseFields);
  const { fields, setFields } = kept;
  const [problems, setProblems] = useState<readonly string[]>([]);
  const set = (key: keyof NewCaseFields) => (event: { target: { value: string } }) => setFields({ ...fields, [key]: event.target.value });
  const submit = async (event: FormEvent) => {
    event.preventDefault();
    const built = newCaseJson(fields);
    if (!built.ok) {
      setProblems(built.issues.map((issue) => issue.message));
      return;
    }
    setProblems([]);
    if (await workspaceStore.getState().createCase(built.value)) kept.discard();
  };
  return (
    <form className="new-case" onSubmit={submit} aria-labelledby="new-case-title">
      <h2 id="new-case-title">New case</h2>
      <p className="hint">Use a local code as the label (e.g. TH-0417), never a name.</p>
      {kept.restoredAt ? <KeptEntryNotice what="new case" keptAt={kept.restoredAt} onKeep={kept.dismissNotice} onDiscard={kept.discard} /> : null}
      <div className="form-grid">
        <label>Label <input value={fields.label} onChange={set('label')} required /></label>
        <label>Birth date <input value={fields.birthDate} onChange={set('birthDate')} placeholder="YYYY-MM-DD" /></label>
        <label>Sex at birth (for the renal equations)
          <select value={fields.sexAtBirth} onChange={set('sexAtBirth')}>{sexesAtBirth.map((sex) => <option key={sex} value={sex}>{sex}</option>)}</select>
        </label>
        <label>Diagnosis group
          <select value={fields.diagnosisGroup} onChange={set('diagnosisGroup')}>{diagnosisGroups.map((group) => <option key={group} value={group}>{choiceWords(group)}</option>)}</select>
        </label>
        <label>Weight, kg <input value={fields.weightKg} onChange={set('weightKg')} inputMode="decimal" /></label>
        <label>Weighed on <input value={fields.weightDate} onChange={set('weightDate')} placeholder="YYYY-MM-DD" /></label>
      </div>
      {problems.length > 0 ? <ul className="field-errors" role="alert">{problems.map((problem) => <li key={problem}>{problem}</li>)}</ul> : null}
      <button type="submit">Create the case</button>
    </form>
  );
}
