import { useOpenReview } from '../hooks/useReview';
import { useWorkspace, workspaceStore } from '../state/store';
import { findingGroups } from '../viewModels/findings';
import { ironCourseView } from '../viewModels/ironCourse';
import { methodsOf } from '../viewModels/review';
import { regimensView } from '../viewModels/regimens';
import { cautionText } from './cautionText';
import { licChartView } from '../viewModels/charts';
import { ChartFigure } from './ChartFigure';
import { ReviewProblem } from './ReviewProblem';

/** A preview of the review sheet, and its exports through the host (PDF, calendar). */
export function SheetView() {
  const { caseFile, asOf, outcome } = useOpenReview();
  const lastExport = useWorkspace((state) => state.lastExport);
  const saveState = useWorkspace((state) => state.saveState);
  if (!outcome || !caseFile) return <p>Open a case first.</p>;
  if (!outcome.ok) return <ReviewProblem issues={outcome.issues} />;
  const iron = ironCourseView(outcome.review);
  const regimens = regimensView(outcome.review, caseFile);
  const findings = findingGroups(outcome.review.findings);
  const appendix = methodsOf(outcome.review);
  const { exportSheet, exportCalendar } = workspaceStore.getState();
  return (
    <>
      <div className="toolbar">
        <button type="button" className="primary" disabled={saveState !== 'saved'} onClick={() => exportSheet(asOf)}>Export the sheet as PDF</button>
        <button type="button" disabled={saveState !== 'saved'} onClick={() => exportCalendar(asOf)}>Export the monitoring calendar</button>
        <span role="status">{lastExport ?? (saveState === 'saved' ? '' : 'Exports wait until the record is saved.')}</span>
      </div>
      <article className="sheet-preview" aria-label="Review sheet preview">
        <h2>Iron review — {caseFile.patient.label} — {asOf}</h2>
        <p className="caution"><strong>Caution.</strong> {cautionText}</p>
        <h3>Summary</h3>
        <ul>{iron.summary.map((item) => <li key={item.label}>{item.label}: {item.text}</li>)}</ul>
        <ChartFigure chart={licChartView(outcome.review)} id="sheet-lic-chart" />
        <h3>Regimens (what-if for the prescriber's review)</h3>
        <ul>{regimens.columns.map((column) => <li key={column.id}>{column.name}: {column.milestones.map((it) => `${it.months} months ${it.central} (${it.band})`).join('; ')}</li>)}</ul>
        <h3>Findings</h3>
        <ul>{findings.flatMap((group) => group.cards).map((card) => <li key={card.key}><strong>{card.severity}</strong>: {card.title} — {card.text}</li>)}</ul>
        <h3>Monitoring</h3>
        <ul>{(outcome.review.monitoring?.items ?? []).map((item) => <li key={item.id}>{item.what}: {item.status === 'overdue' ? 'overdue since' : 'due'} {item.dueDate} ({item.intervalText})</li>)}</ul>
        <h3>Methods</h3>
        <ul>{appendix.formulas.map((formula) => <li key={formula.formulaId}>{formula.title}: <code>{formula.expression}</code></li>)}</ul>
      </article>
    </>
  );
}
