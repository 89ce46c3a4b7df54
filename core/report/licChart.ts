import type { IsoDate } from '../dates/isoDate';
import { licBand, licBandEdgesMgPerGDry } from '../iron/licBand';
import type { CaseResults } from '../ledger/computeCase';
import type { MgPerGDry } from '../units/quantity';
import type { Chart, PlottedSeries } from './chart';
import { bandPath, dateScale, isoOfInstant, linePath, max, min, valueScale } from './chartPrimitives';
import { chartStyle, scenarioDash, scenarioMark } from './chartStyle';
import { element, escapeXml, textElement } from './svgMarkup';

/** A range of LIC that a product label ties to an action (e.g. interruption below a value), marked on the chart. */
export interface LicLabelZone {
  readonly id: string;
  readonly fromMgPerGDry: number;
  readonly toMgPerGDry: number;
  /** Short text shown in the zone, in descriptive words, e.g. 'label: consider interruption below 3'. */
  readonly label: string;
}

export interface LicChartOptions {
  /** Overall width, points (default 500). */
  readonly width?: number;
  /** Height of the plotting area, points (default 210); the legend adds rows below. */
  readonly plotHeight?: number;
  /** Scenarios to draw, by id (default: every scenario of the projection). */
  readonly scenarioIds?: readonly string[];
  readonly labelZones?: readonly LicLabelZone[];
  /** Prefix of the ids inside the SVG, so several charts can share one page (default 'lic'). */
  readonly idPrefix?: string;
}

/** What the LIC chart reads from the results: the account's months and the projection. */
export type LicChartResults = Pick<CaseResults, 'asOf' | 'months' | 'projection'>;

const margin = { left: 34, right: 78, top: 14, bottom: 22 } as const;
const legendRowPt = 11;

/** Short names of the LIC bands for the chart's margin (the full labels are on the sheet). */
const bandShortLabel: Readonly<Record<ReturnType<typeof licBand>['id'], string>> = {
  normal: 'normal',
  'above-normal': 'above normal',
  'target-range': 'target 3–7',
  'raised-risk': 'raised risk',
  'high-cardiac-risk': 'high cardiac risk',
};
/** Alternate greys so neighbouring bands stay apart in greyscale; the labels say which is which. */
const bandFill: Readonly<Record<ReturnType<typeof licBand>['id'], string>> = {
  normal: '#f2f2f2',
  'above-normal': '#ffffff',
  'target-range': '#e4e4e4',
  'raised-risk': '#ffffff',
  'high-cardiac-risk': '#d6d6d6',
};

/** The label zones the shown scenarios report, one per threshold: from 0 up to the threshold. */
function projectedLabelZones(scenarios: NonNullable<LicChartResults['projection']>['scenarios']): LicLabelZone[] {
  const thresholds = [...new Set(scenarios.flatMap((scenario) => scenario.labelZones.map((zone) => zone.thresholdMgPerGDry)))];
  return thresholds.map((threshold) => ({ id: `label-below-${threshold}`, fromMgPerGDry: 0, toMgPerGDry: threshold, label: `label zone: below ${threshold} mg/g dry` }));
}

/**
 * Liver iron over time as an SVG chart: measured LIC results (dots), the
 * ledger's month-end estimate (solid line), and each scenario's projection
 * from the review date (dashed line, lettered at its end, with its
 * 10th–90th percentile band shaded), over the LIC bands shaded in greys and
 * any label zones hatched. Pure: the same results give the same bytes.
 *
 * @param results - computeCase results (asOf, months, projection)
 * @param options - size, scenarios to show, label zones, id prefix
 * @returns the SVG (width × height in points) and the plotted values, series by series
 * @example licChart(results).plotted[0].id === 'measured'
 */
export function licChart(results: LicChartResults, options: LicChartOptions = {}): Chart {
  const width = options.width ?? 500;
  const plotHeight = options.plotHeight ?? 210;
  const prefix = options.idPrefix ?? 'lic';
  const scenarios = (results.projection?.scenarios ?? []).filter((scenario) => options.scenarioIds === undefined || options.scenarioIds.includes(scenario.id));

  const measured = results.months
    .flatMap((month) => month.measuredLic)
    .slice()
    .sort((a, b) => a.date.localeCompare(b.date))
    .map((point) => ({ at: point.date, value: point.licMgPerGDry }));
  const estimate = results.months
    .filter((month) => month.licEstimateMgPerGDry !== null)
    .map((month) => ({ at: month.lastDay, value: month.licEstimateMgPerGDry! }));
  const plotted: PlottedSeries[] = [
    { id: 'measured', label: 'measured LIC', unit: 'mg/g{dry}', drawnAs: 'dots', points: measured },
    { id: 'estimate', label: 'ledger estimate (month end): the balance carried from each measured LIC, meeting the next one; after the last, carried forward', unit: 'mg/g{dry}', drawnAs: 'solid line, restarting at each measured LIC', points: estimate },
    ...scenarios.map((scenario, index) => ({
      id: `projection:${scenario.id}`,
      label: `projection, ${scenario.name} (band: 10th–90th percentile)`,
      unit: 'mg/g{dry}',
      drawnAs: `line dashed ${scenarioDash(index)}, marked ${scenarioMark(index)}, with a shaded band`,
      points: scenario.months.map((month) => ({ at: month.date, value: month.licMgPerGDry, low: month.licP10, high: month.licP90 })),
    })),
  ];

  const firstDate: IsoDate = results.months[0]?.firstDay ?? results.asOf;
  const lastDate: IsoDate = scenarios.reduce((latest, scenario) => {
    const end = scenario.months[scenario.months.length - 1]?.date ?? latest;
    return end > latest ? end : latest;
  }, results.asOf);
  const highest =
    max(plotted.flatMap((series) => series.points.map((point) => Math.max(point.value, point.high ?? point.value)))) ?? 0;
  // A negative ledger estimate (expected removal beyond what the record supports) stays in view.
  const lowest = Math.min(0, min(plotted.flatMap((series) => series.points.map((point) => Math.min(point.value, point.low ?? point.value)))) ?? 0);
  const edges = licBandEdgesMgPerGDry;
  // Show at least the high-cardiac-risk edge so every band is in view.
  const x = dateScale([firstDate, lastDate], [margin.left, width - margin.right]);
  const y = valueScale([lowest, Math.max(highest, edges.highCardiacFrom + 1)], [margin.top + plotHeight, margin.top]);
  const [yLow, yHigh] = y.domain() as [number, number];
  const left = margin.left;
  const right = width - margin.right;
  const top = margin.top;
  const bottom = margin.top + plotHeight;

  const parts: string[] = [];
  const defs = element('defs', {}, [
    element('clipPath', { id: `${prefix}-plot` }, element('rect', { x: left, y: top, width: right - left, height: bottom - top })),
    element(
      'pattern',
      { id: `${prefix}-hatch`, patternUnits: 'userSpaceOnUse', width: 6, height: 6 },
      element('path', { d: 'M0,6 L6,0', stroke: chartStyle.ink, 'stroke-width': 0.6 }),
    ),
  ]);
  parts.push(defs);

  // LIC bands, shaded and named in the right margin.
  const bandEdges = [Math.max(0, yLow), edges.normalUpTo, edges.targetFrom, edges.targetUpTo, edges.highCardiacFrom, yHigh];
  const bandParts: string[] = [];
  for (let index = 0; index < bandEdges.length - 1; index += 1) {
    const from = bandEdges[index]!;
    const to = bandEdges[index + 1]!;
    if (to <= from) continue;
    const band = licBand(((from + to) / 2) as MgPerGDry);
    const yTop = y(to);
    const yBottom = y(from);
    bandParts.push(element('rect', { x: left, y: yTop, width: right - left, height: yBottom - yTop, fill: bandFill[band.id], 'data-band': band.id }));
    if (yBottom - yTop >= chartStyle.fontSizePt) {
      bandParts.push(textElement(bandShortLabel[band.id], { x: right + 4, y: (yTop + yBottom) / 2 + chartStyle.fontSizePt / 3, 'font-size': chartStyle.fontSizePt, fill: chartStyle.mutedInk }));
    }
  }
  for (const edge of [edges.normalUpTo, edges.targetFrom, edges.targetUpTo, edges.highCardiacFrom]) {
    if (edge < yHigh) bandParts.push(element('line', { x1: left, x2: right, y1: y(edge), y2: y(edge), stroke: chartStyle.gridInk, 'stroke-width': 0.5 }));
  }
  parts.push(element('g', { 'data-role': 'lic-bands' }, bandParts));

  // Label zones: hatched, with their text at the left. Without zones given, the low-iron
  // zones the projection itself reports (core/ledger/projection.ts) are marked.
  const labelZones = options.labelZones ?? projectedLabelZones(scenarios);
  if (labelZones.length > 0) {
    const zoneParts = labelZones.map((zone) => {
      const zoneTop = y(Math.min(zone.toMgPerGDry, yHigh));
      const zoneBottom = y(Math.max(zone.fromMgPerGDry, yLow));
      return element('g', { 'data-zone': zone.id }, [
        element('rect', { x: left, y: zoneTop, width: right - left, height: zoneBottom - zoneTop, fill: `url(#${prefix}-hatch)`, 'fill-opacity': 0.35, stroke: chartStyle.ink, 'stroke-width': 0.5, 'stroke-dasharray': '1 2' }),
        textElement(zone.label, { x: left + 3, y: zoneTop + chartStyle.fontSizePt + 1, 'font-size': chartStyle.fontSizePt, fill: chartStyle.ink }),
      ]);
    });
    parts.push(element('g', { 'data-role': 'label-zones' }, zoneParts));
  }

  // Axes: y on the left with ticks and grid, x at the bottom with date ticks.
  const yTicks = y.ticks(6);
  parts.push(
    element('g', { 'data-role': 'y-axis' }, [
      element('line', { x1: left, x2: left, y1: top, y2: bottom, stroke: chartStyle.ink, 'stroke-width': 0.7 }),
      ...yTicks.map((tick) =>
        element('g', { 'data-tick': tick }, [
          element('line', { x1: left - 3, x2: left, y1: y(tick), y2: y(tick), stroke: chartStyle.ink, 'stroke-width': 0.7 }),
          textElement(String(tick), { x: left - 5, y: y(tick) + chartStyle.fontSizePt / 3, 'text-anchor': 'end', 'font-size': chartStyle.fontSizePt }),
        ]),
      ),
      textElement('LIC, mg/g dry weight', { x: left, y: top - 5, 'font-size': chartStyle.fontSizePt }),
    ]),
  );
  const xTicks = x.ticks(7);
  const everyTickIsJanuary = xTicks.every((tick) => tick.getUTCMonth() === 0 && tick.getUTCDate() === 1);
  parts.push(
    element('g', { 'data-role': 'x-axis' }, [
      element('line', { x1: left, x2: right, y1: bottom, y2: bottom, stroke: chartStyle.ink, 'stroke-width': 0.7 }),
      ...xTicks.map((tick) => {
        const iso = isoOfInstant(tick);
        return element('g', { 'data-tick': iso }, [
          element('line', { x1: x(tick), x2: x(tick), y1: bottom, y2: bottom + 3, stroke: chartStyle.ink, 'stroke-width': 0.7 }),
          textElement(everyTickIsJanuary ? iso.slice(0, 4) : iso.slice(0, 7), { x: x(tick), y: bottom + 3 + chartStyle.fontSizePt + 1, 'text-anchor': 'middle', 'font-size': chartStyle.fontSizePt }),
        ]);
      }),
    ]),
  );

  const xOf = (at: string) => x(new Date(`${at}T00:00:00Z`));

  // Review date.
  const asOfX = xOf(results.asOf);
  parts.push(
    element('g', { 'data-role': 'review-date' }, [
      element('line', { x1: asOfX, x2: asOfX, y1: top, y2: bottom, stroke: chartStyle.mutedInk, 'stroke-width': 0.6, 'stroke-dasharray': '1 1.5' }),
      textElement(`review ${results.asOf}`, { x: asOfX, y: top - 5, 'text-anchor': 'middle', 'font-size': chartStyle.fontSizePt, fill: chartStyle.mutedInk }),
    ]),
  );

  // Projections: band, then the central line, lettered at its end.
  const projectionParts = scenarios.map((scenario, index) => {
    const series = plotted[2 + index]!;
    const band = bandPath(series.points.map((point) => ({ x: xOf(point.at), low: y(point.low!), high: y(point.high!) })));
    const central = series.points.map((point) => [xOf(point.at), y(point.value)] as const);
    return element('g', { 'data-series': series.id }, [
      element('path', { d: band, fill: chartStyle.ink, 'fill-opacity': chartStyle.bandFillOpacity, stroke: chartStyle.ink, 'stroke-width': 0.4, 'stroke-dasharray': scenarioDash(index), 'data-role': 'band' }),
      element('path', { d: linePath(central), fill: 'none', stroke: chartStyle.ink, 'stroke-width': 1.2, 'stroke-dasharray': scenarioDash(index), 'data-role': 'line' }),
    ]);
  });
  parts.push(element('g', { 'data-role': 'projections', 'clip-path': `url(#${prefix}-plot)` }, projectionParts));
  // The letters sit just past the plot's right edge, outside the clip.
  parts.push(
    ...scenarios.map((scenario, index) => {
      const last = scenario.months[scenario.months.length - 1];
      return last ? textElement(scenarioMark(index), { x: xOf(last.date) + 3, y: y(last.licMgPerGDry) + chartStyle.fontSizePt / 3, 'font-size': chartStyle.fontSizePt + 1, 'font-weight': 'bold', 'data-mark': scenario.id }) : '';
    }),
  );

  // Ledger estimate and measured points on top.
  // The estimate is re-anchored at each measured LIC: one line per stretch between anchors,
  // each starting at its measurement, so a re-anchoring is never drawn as a trend.
  const segments: (readonly [number, number])[][] = [];
  for (const month of results.months) {
    if (month.licEstimateMgPerGDry === null) continue;
    const anchor = month.measuredLic[month.measuredLic.length - 1];
    if (anchor || segments.length === 0) segments.push(anchor ? [[xOf(anchor.date), y(anchor.licMgPerGDry)]] : []);
    segments[segments.length - 1]!.push([xOf(month.lastDay), y(month.licEstimateMgPerGDry)]);
  }
  parts.push(
    element(
      'g',
      { 'data-series': 'estimate', 'clip-path': `url(#${prefix}-plot)` },
      segments.map((segment) => element('path', { d: linePath(segment), fill: 'none', stroke: chartStyle.ink, 'stroke-width': 1.4, 'data-role': 'line' })),
    ),
  );
  parts.push(
    element(
      'g',
      { 'data-series': 'measured' },
      measured.map((point) => element('circle', { cx: xOf(point.at), cy: y(point.value), r: 2.6, fill: chartStyle.ink, stroke: '#ffffff', 'stroke-width': 0.8, 'data-at': point.at })),
    ),
  );

  // Legend below the plot, one entry a row: a sample of the mark, then its words.
  const legendTop = bottom + margin.bottom + 4;
  const legendEntries: { sample: string; text: string }[] = [
    { sample: element('circle', { cx: 9, cy: -2.5, r: 2.6, fill: chartStyle.ink }), text: 'measured LIC' },
    { sample: element('line', { x1: 0, x2: 18, y1: -2.5, y2: -2.5, stroke: chartStyle.ink, 'stroke-width': 1.4 }), text: 'ledger estimate, carried from each measured LIC to meet the next' },
    ...scenarios.map((scenario, index) => ({
      sample: element('line', { x1: 0, x2: 18, y1: -2.5, y2: -2.5, stroke: chartStyle.ink, 'stroke-width': 1.2, 'stroke-dasharray': scenarioDash(index) }),
      text: `${scenarioMark(index)}: ${scenario.name} (${scenario.efficiencyBasis} efficiency); shaded: 10th–90th percentile`,
    })),
  ];
  parts.push(
    element(
      'g',
      { 'data-role': 'legend' },
      legendEntries.map((entry, index) =>
        element('g', { transform: `translate(${left},${legendTop + index * legendRowPt + chartStyle.fontSizePt})` }, [
          entry.sample,
          textElement(entry.text, { x: 24, y: 0, 'font-size': chartStyle.fontSizePt }),
        ]),
      ),
    ),
  );
  const height = Math.ceil(legendTop + legendEntries.length * legendRowPt + 2);

  const title = 'Liver iron concentration over time';
  const description = `Measured LIC results, the ledger's estimate to the review date ${results.asOf}, and ${scenarios.length} projection(s) with their 10th–90th percentile bands, over the LIC bands (normal up to 1.8, target 3–7, high cardiac risk from 15 mg/g dry).`;
  const svg = element(
    'svg',
    { xmlns: 'http://www.w3.org/2000/svg', width, height, viewBox: `0 0 ${width} ${height}`, 'font-family': chartStyle.fontFamily, role: 'img' },
    [element('title', {}, escapeXml(title)), element('desc', {}, escapeXml(description)), ...parts],
  );
  return { title, description, svg, width, height, plotted };
}
