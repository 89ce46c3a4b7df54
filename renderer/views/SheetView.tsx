import type { SheetBlock } from '../../core/report/sheet';
import { useOpenReview } from '../hooks/useReview';
import { useWorkspace, workspaceStore } from '../state/store';
import { chartView } from '../viewModels/charts';
import { sheetOf } from '../viewModels/review';
import { ChartFigure } from './ChartFigure';
import { ReviewProblem } from './ReviewProblem';

/** A preview of the review sheet exactly as core builds it for the PDF, and its exports through the host. */
export function SheetView() {
  const { caseFile, outcome, asOf } = useOpenReview();
  const lastExport = useWorkspace((state) => state.lastExport);
  const saveState = useWorkspace((state) => state.saveState);
  const version = useWorkspace((state) => state.version);
  // One export at a time: while one runs (the busy line above shows it), the buttons wait.
  const exporting = useWorkspace((state) => state.busy !== null);
  if (!outcome || !caseFile) return <p>Open a case first.</p>;
  if (!outcome.ok) return <ReviewProblem issues={outcome.issues} />;
  const sheet = sheetOf(caseFile, outcome.review, version);
  const { exportSheet, exportCalendar } = workspaceStore.getState();
  return (
    <>
      <div className="toolbar">
        <button type="button" className="primary" disabled={saveState !== 'saved' || exporting} onClick={() => exportSheet(asOf)}>Export the sheet as PDF</button>
        <button type="button" disabled={saveState !== 'saved' || exporting} onClick={() => exportCalendar(asOf)}>Export the monitoring calendar</button>
        <span role="status">{lastExport ?? (saveState === 'saved' ? '' : 'Exports wait until the record is saved.')}</span>
      </div>
      <article className="sheet-preview" aria-label="Review sheet preview">
        <header>
          <h2>{sheet.header.title}</h2>
          <p>{sheet.header.patientLine}</p>
          <p className="hint">Review date {sheet.header.reviewDate} · {sheet.header.toolVersion} · case file SHA-256: {sheet.header.caseFileSha256}</p>
        </header>
        <p className="caution"><strong>Caution.</strong> {sheet.caution}</p>
        {sheet.sections.map((section) => (
          <section key={section.id} aria-labelledby={`sheet-${section.id}`}>
            <h3 id={`sheet-${section.id}`}>{section.title}</h3>
            {section.blocks.map((block, index) => <SheetBlockView key={`${section.id}-${index}`} block={block} id={`${section.id}-${index}`} />)}
          </section>
        ))}
        <section aria-labelledby="sheet-sign-off">
          <h3 id="sheet-sign-off">Sign-off</h3>
          <p>Reviewed by: {sheet.signOff.reviewedBy ?? '________________'} · Date: {sheet.signOff.date ?? '__________'}</p>
          {sheet.signOff.notes.length > 0 ? <ul>{sheet.signOff.notes.map((note) => <li key={note}>{note}</li>)}</ul> : null}
          <ul className="plain">{sheet.signOff.prescriberFields.map((field) => <li key={field}>{field}: ________________</li>)}</ul>
        </section>
      </article>
    </>
  );
}

function SheetBlockView({ block, id }: { readonly block: SheetBlock; readonly id: string }) {
  switch (block.kind) {
    case 'paragraph':
      return <p className={`sheet-${block.style}`}>{block.text}</p>;
    case 'facts':
      return <dl className="sheet-facts">{block.rows.map((row) => <div key={row.label}><dt>{row.label}</dt><dd>{row.value}</dd></div>)}</dl>;
    case 'table':
      return block.rows.length === 0 ? (
        <p>{block.caption}: {block.emptyText}</p>
      ) : (
        <div className="table-scroll" tabIndex={0} role="region" aria-label={block.caption}>
          <table>
            <caption>{block.caption}</caption>
            <thead><tr>{block.columns.map((column) => <th key={column.title} scope="col">{column.title}</th>)}</tr></thead>
            <tbody>
              {block.rows.map((row, rowIndex) => <tr key={rowIndex}>{row.map((cell, cellIndex) => <td key={cellIndex} className={block.columns[cellIndex]?.align === 'right' ? 'num' : undefined}>{cell}</td>)}</tr>)}
              {block.totals ? <tr className="totals">{block.totals.map((cell, cellIndex) => <td key={cellIndex}>{cell}</td>)}</tr> : null}
            </tbody>
          </table>
          {block.note ? <p className="hint">{block.note}</p> : null}
        </div>
      );
    case 'chart':
      return <ChartFigure chart={chartView(block.chart)} id={`sheet-${id}`} />;
    case 'findings':
      return block.items.length === 0 ? (
        <p>{block.emptyText}</p>
      ) : (
        <ul>{block.items.map((item) => <li key={`${item.severity}-${item.title}-${item.text}`}><strong>{item.severity}</strong>: {item.title} — {item.text}{item.sourceUncertain ? ' (a source is from memory or secondary)' : ''}</li>)}</ul>
      );
  }
}
