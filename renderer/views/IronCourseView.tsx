import { useState } from 'react';
import type { Derivation } from '../../core/formulas/derivation';
import { useOpenReview } from '../hooks/useReview';
import { ironCourseView } from '../viewModels/ironCourse';
import { licChartView, ironFlowChartView } from '../viewModels/charts';
import { ChartFigure } from './ChartFigure';
import { DerivationTree } from './DerivationTree';
import { ExplainedNumber } from './ExplainedNumber';
import { ReviewProblem } from './ReviewProblem';

/** The iron course: intake, body iron, measured against expected removal per LIC interval, and the monthly account. */
export function IronCourseView() {
  const { outcome } = useOpenReview();
  const [explained, setExplained] = useState<{ label: string; derivation: Derivation } | null>(null);
  if (!outcome) return <p>Open a case first.</p>;
  if (!outcome.ok) return <ReviewProblem issues={outcome.issues} />;
  const view = ironCourseView(outcome.review);
  return (
    <div className="with-explain">
      <div>
        <section aria-labelledby="summary-title">
          <h2 id="summary-title">Summary</h2>
          <dl className="summary">
            {view.summary.map((item) => (
              <div key={item.label}>
                <dt>{item.label}</dt>
                <dd><ExplainedNumber text={item.text} label={item.label} derivation={item.derivation} onExplain={setExplained} /></dd>
              </div>
            ))}
          </dl>
          {view.notices.length > 0 ? <ul className="notices">{view.notices.map((notice) => <li key={notice.text}><strong>{notice.severity}:</strong> {notice.text}</li>)}</ul> : null}
        </section>
        <section aria-labelledby="lic-title">
          <h2 id="lic-title">Liver iron over time</h2>
          <ChartFigure chart={licChartView(outcome.review, ['current'])} id="lic-chart" />
        </section>
        <section aria-labelledby="intervals-title">
          <h2 id="intervals-title">Measured against expected removal, per LIC interval</h2>
          <table>
            <thead><tr><th scope="col">Interval</th><th scope="col">LIC</th><th scope="col">Measured chelation</th><th scope="col">Expected</th><th scope="col">Measured ÷ expected</th><th scope="col">Effective efficiency</th><th scope="col">Caveats</th></tr></thead>
            <tbody>
              {view.intervals.map((row) => (
                <tr key={row.key}>
                  <th scope="row">{row.period}</th><td>{row.licChange}</td><td>{row.measured}</td><td>{row.expected}</td>
                  <td><ExplainedNumber text={row.ratio} label={`measured response ${row.period}`} derivation={row.derivation} onExplain={setExplained} /></td>
                  <td>{row.effectiveEfficiency}</td><td>{row.caveats}</td>
                </tr>
              ))}
            </tbody>
          </table>
          {view.intervals.length === 0 ? <p>Needs two liver iron results to compare measured with expected removal.</p> : null}
        </section>
        <section aria-labelledby="account-title">
          <h2 id="account-title">Iron in and out by month</h2>
          <ChartFigure chart={ironFlowChartView(outcome.review)} id="flow-chart" />
          <div className="table-scroll short" tabIndex={0} role="region" aria-label="Monthly iron account, scrollable">
            <table>
              <caption>Monthly iron account, mg, every month on record</caption>
              <thead><tr><th scope="col">Month</th><th scope="col">In with red cells</th><th scope="col">Out with removed blood</th><th scope="col">Expected chelation</th><th scope="col">Basal loss</th><th scope="col">Net</th></tr></thead>
              <tbody>
                {view.months.map((month) => (
                  <tr key={month.month}><th scope="row">{month.month}</th><td>{month.inMg}</td><td>{month.outWithBloodMg}</td><td>{month.chelationMg}</td><td>{month.basalMg}</td><td>{month.netMg}</td></tr>
                ))}
              </tbody>
            </table>
          </div>
        </section>
      </div>
      <aside className="explain-panel" aria-live="polite" aria-label="How the number was computed">
        <h2>How it was computed</h2>
        {explained ? (<><p className="explained-label">{explained.label}</p><DerivationTree derivation={explained.derivation} /></>) : <p>Focus or hover a number to see its derivation.</p>}
      </aside>
    </div>
  );
}
