/**
 * PLACEHOLDER — not a chart. The charts come from core's SVG builder
 * (core/report, being written for the review sheet); until it is on main the
 * screen shows this box and the table of the values the chart will plot,
 * which is also the chart's text alternative. No hand-made chart here.
 */
export function ChartPlaceholder({ title, valuesWhere = 'in the table below' }: { readonly title: string; readonly valuesWhere?: string }) {
  return (
    <figure className="chart-placeholder" role="note" aria-label={`${title}: chart not yet available`}>
      <figcaption>
        <strong>{title}</strong> — placeholder: the chart will be drawn by the same SVG builder as the review sheet. The values it will plot are {valuesWhere}.
      </figcaption>
    </figure>
  );
}
