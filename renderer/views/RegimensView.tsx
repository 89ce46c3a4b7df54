import { useState } from 'react';
import type { Derivation } from '../../core/formulas/derivation';
import { chelatorDrugs } from '../../core/model';
import { useOpenReview } from '../hooks/useReview';
import { useWorkspace, workspaceStore } from '../state/store';
import { setBaseField } from '../viewModels/recordEdits';
import { choiceText, tableColumns } from '../viewModels/recordTables';
import { regimensView } from '../viewModels/regimens';
import { whatIfFromCurrent, withAddedPeriod, withPeriodCell, withoutPeriod, withWhatIf, type WhatIfForm } from '../viewModels/whatIf';
import { licChartView } from '../viewModels/charts';
import { ChartFigure } from './ChartFigure';
import { DerivationTree } from './DerivationTree';
import { ExplainedNumber } from './ExplainedNumber';
import { ReviewProblem } from './ReviewProblem';

const formKeys = ['drug', 'formulation', 'route', 'dose', 'doseUnit', 'administrationsPerDay', 'daysPerWeek', 'infusionHours'] as const;

/** The current regimen and up to three what-ifs side by side, from core's projection. */
export function RegimensView() {
  const { caseFile, asOf, outcome } = useOpenReview();
  const draft = useWorkspace((state) => state.draft);
  const otherIssues = useWorkspace((state) => state.check?.otherIssues);
  const [explained, setExplained] = useState<{ label: string; derivation: Derivation } | null>(null);
  const currentPeriods = (caseFile?.chelationPeriods ?? []).filter((period) => period.startDate <= asOf && (period.endDate === null || period.endDate >= asOf));
  const [form, setForm] = useState<WhatIfForm>(() => whatIfFromCurrent(currentPeriods as unknown as Record<string, unknown>[]));
  const [addDrug, setAddDrug] = useState<string>('deferoxamine');
  if (!outcome || !draft) return <p>Open a case first.</p>;
  if (!outcome.ok) return <ReviewProblem issues={outcome.issues} />;
  const proposed = (draft.base.proposedRegimens ?? []) as Record<string, unknown>[];
  const view = regimensView(outcome.review, caseFile!);
  const { edit } = workspaceStore.getState();
  const columns = tableColumns.chelationPeriods.filter((column) => (formKeys as readonly string[]).includes(column.key));
  const proposalIssues = (otherIssues ?? []).filter((issue) => issue.path[0] === 'proposedRegimens');
  return (
    <div className="with-explain">
      <div>
        <p className="what-if-banner" role="note"><strong>What-if for the prescriber's review.</strong> Projections hold today's intake (under 18, weight follows the patient's own trend); they are estimates with a band, not outcomes.</p>
        <p>{view.note}</p>
        <div className="table-scroll">
          <table className="side-by-side">
            <thead>
              <tr><th scope="col">Regimen</th>{view.columns.map((column) => <th key={column.id} scope="col">{column.isCurrent ? '' : 'What-if: '}{column.name}</th>)}</tr>
            </thead>
            <tbody>
              <tr><th scope="row">Expected removal</th>{view.columns.map((column) => <td key={column.id}>{column.removal}</td>)}</tr>
              <tr><th scope="row">Net balance</th>{view.columns.map((column) => <td key={column.id}>{column.net}</td>)}</tr>
              <tr><th scope="row">Efficiency basis</th>{view.columns.map((column) => <td key={column.id}>{column.basis}</td>)}</tr>
              {[6, 12, 24].map((months) => (
                <tr key={months}>
                  <th scope="row">Projected LIC at {months} months (band)</th>
                  {view.columns.map((column) => {
                    const milestone = column.milestones.find((it) => it.months === months);
                    return (
                      <td key={column.id}>
                        {milestone ? (<><ExplainedNumber text={milestone.central} label={`projected LIC at ${months} months, ${column.name}`} derivation={milestone.derivation} onExplain={setExplained} /> <span className="band">({milestone.band})</span></>) : '—'}
                      </td>
                    );
                  })}
                </tr>
              ))}
              <tr><th scope="row">Crossings of 15, 7 and 3 mg/g</th>{view.columns.map((column) => <td key={column.id}><ul className="plain">{column.crossings.map((text) => <li key={text}>{text}</li>)}</ul></td>)}</tr>
              <tr>
                <th scope="row">Iron bound per administration (ceiling)</th>
                {view.columns.map((column) => <td key={column.id}><ul className="plain">{column.doses.map((dose) => <li key={dose.period}>{dose.period}: {dose.capacity}</li>)}</ul></td>)}
              </tr>
              <tr>
                <th scope="row">Practical dose with the shelf strengths</th>
                {view.columns.map((column) => <td key={column.id}><ul className="plain">{column.doses.map((dose) => <li key={dose.period}>{dose.practical}</li>)}</ul></td>)}
              </tr>
              <tr>
                <th scope="row">Label zones</th>
                {view.columns.map((column) => <td key={column.id}>{column.labelZones.length > 0 ? <ul className="plain">{column.labelZones.map((text) => <li key={text}>{text}</li>)}</ul> : 'none: the projection starts below the label threshold'}</td>)}
              </tr>
              <tr>
                <th scope="row"><span className="visually-hidden">Actions</span></th>
                {view.columns.map((column) => (
                  <td key={column.id}>
                    {column.isCurrent ? null : (
                      <button type="button" onClick={() => edit((current) => setBaseField(current, 'proposedRegimens', proposed.filter((regimen) => regimen.id !== column.id)))}>Remove this what-if</button>
                    )}
                  </td>
                ))}
              </tr>
            </tbody>
          </table>
        </div>
        <ChartFigure chart={licChartView(outcome.review)} id="regimens-lic-chart" />
        {proposalIssues.length > 0 ? <ul className="field-errors" role="alert">{proposalIssues.map((issue) => <li key={issue.message}>{issue.message}</li>)}</ul> : null}
        <section aria-labelledby="what-if-title" className="what-if-form">
          <h2 id="what-if-title">Add a what-if</h2>
          <p className="hint">Starts from the current regimen; each period runs from the review date ({asOf}).</p>
          {form.periods.map((cells, index) => (
            <fieldset key={index}>
              <legend>Drug {index + 1}</legend>
              {columns.map((column) => {
                const choices = column.choices?.(cells);
                const label = `${column.label}, what-if drug ${index + 1}`;
                if (column.key === 'infusionHours' && cells.drug !== 'deferoxamine') return null;
                return (
                  <label key={column.key}>
                    {column.label}
                    {choices ? (
                      <select aria-label={label} value={cells[column.key] ?? ''} onChange={(event) => setForm(withPeriodCell(form, index, column.key, event.target.value))}>
                        {choices.map((choice) => <option key={choice} value={choice}>{choiceText(column, choice)}</option>)}
                      </select>
                    ) : (
                      <input aria-label={label} className="cell-narrow" value={cells[column.key] ?? ''} onChange={(event) => setForm(withPeriodCell(form, index, column.key, event.target.value))} />
                    )}
                  </label>
                );
              })}
              {form.periods.length > 1 ? <button type="button" onClick={() => setForm(withoutPeriod(form, index))}>Remove drug {index + 1}</button> : null}
            </fieldset>
          ))}
          <div className="toolbar">
            <label>
              Second drug
              <select value={addDrug} onChange={(event) => setAddDrug(event.target.value)}>{chelatorDrugs.map((drug) => <option key={drug} value={drug}>{drug}</option>)}</select>
            </label>
            <button type="button" disabled={form.periods.length >= 2} onClick={() => setForm(withAddedPeriod(form, addDrug))}>Add the second drug</button>
            <button type="button" className="primary" disabled={!view.canAddWhatIf} onClick={() => edit((current) => setBaseField(current, 'proposedRegimens', withWhatIf(proposed, form, asOf)))}>
              Add this what-if
            </button>
            {!view.canAddWhatIf ? <span>Three what-ifs at most: remove one to add another.</span> : null}
          </div>
        </section>
      </div>
      <aside className="explain-panel" aria-live="polite" aria-label="How the number was computed">
        <h2>How it was computed</h2>
        {explained ? (<><p className="explained-label">{explained.label}</p><DerivationTree derivation={explained.derivation} /></>) : <p>Focus or hover a projected value to see its derivation.</p>}
      </aside>
    </div>
  );
}
