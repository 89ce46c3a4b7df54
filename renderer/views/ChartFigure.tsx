import type { ChartView } from '../viewModels/charts';

/**
 * A chart from core's SVG builder, with its text alternative: the
 * description as the image's alternative text, and the plotted values,
 * series by series, in tables a screen reader or a keyboard user can read.
 */
export function ChartFigure({ chart, id }: { readonly chart: ChartView; readonly id: string }) {
  return (
    <figure className="chart" aria-labelledby={`${id}-caption`}>
      <img src={chart.imageSrc} alt={chart.description} className="chart-image" />
      <figcaption id={`${id}-caption`}><strong>{chart.title}.</strong> {chart.description}</figcaption>
      <details className="plotted">
        <summary>Plotted values of “{chart.title}” as tables</summary>
        {chart.series.map((series) => (
          <table key={series.id} className="plotted-table">
            <caption>{series.caption}</caption>
            <thead><tr><th scope="col">Date or month</th><th scope="col">Value</th>{series.hasBand ? <th scope="col">10th–90th percentile band</th> : null}</tr></thead>
            <tbody>
              {series.rows.map((row) => (
                <tr key={row.at}><th scope="row">{row.at}</th><td>{row.value}</td>{series.hasBand ? <td>{row.band}</td> : null}</tr>
              ))}
            </tbody>
          </table>
        ))}
      </details>
    </figure>
  );
}
