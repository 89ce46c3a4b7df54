import type { CaseResults } from '../ledger/computeCase';
import type { Chart, PlottedSeries } from './chart';
import { categoryScale, max, valueScale } from './chartPrimitives';
import { chartStyle } from './chartStyle';
import { element, textElement } from './svgMarkup';

export interface IronFlowChartOptions {
  /** Overall width, points (default 500). */
  readonly width?: number;
  /** Height of the plotting area, points (default 170); the legend adds rows below. */
  readonly plotHeight?: number;
  /** Show only the last N months of the account (default: every month). */
  readonly lastMonths?: number;
  /** Prefix of the ids inside the SVG (default 'flow'). */
  readonly idPrefix?: string;
}

/** What the chart reads from the results: the account's months. */
export type IronFlowChartResults = Pick<CaseResults, 'months'>;

const margin = { left: 40, right: 14, top: 14, bottom: 22 } as const;
const legendRowPt = 11;

/**
 * Iron in against iron out, month by month, as an SVG chart: transfused iron
 * as a dark bar above the zero line; iron out below it, stacked as expected
 * chelation removal (hatched), iron in removed blood (light grey) and basal
 * loss (white, outlined); the month's net as a short black bar mark. Pure: the
 * same results give the same bytes.
 *
 * @param results - computeCase results (months)
 * @param options - size, months shown, id prefix
 * @returns the SVG (width × height in points) and the plotted values, mg per month
 * @example ironFlowChart(results).plotted.map((it) => it.id) — ['iron-in', 'chelation-out', 'blood-out', 'basal-out', 'net']
 */
export function ironFlowChart(results: IronFlowChartResults, options: IronFlowChartOptions = {}): Chart {
  const width = options.width ?? 500;
  const plotHeight = options.plotHeight ?? 170;
  const prefix = options.idPrefix ?? 'flow';
  const months = options.lastMonths === undefined ? results.months : results.months.slice(-options.lastMonths);
  const seriesOf = (id: string, label: string, drawnAs: string, pick: (month: (typeof months)[number]) => number): PlottedSeries => ({
    id,
    label,
    unit: 'mg',
    drawnAs,
    points: months.map((month) => ({ at: month.month, value: pick(month) })),
  });
  const plotted: PlottedSeries[] = [
    seriesOf('iron-in', 'iron in with transfused red cells', 'dark bar above zero', (month) => month.transfusedInMg),
    seriesOf('chelation-out', 'expected chelation removal', 'hatched bar below zero', (month) => month.chelationOutMg),
    seriesOf('blood-out', 'iron in removed blood (exchange, venesection)', 'light grey bar below zero, after the hatched part', (month) => month.removedWithBloodMg),
    seriesOf('basal-out', 'basal loss', 'white outlined bar below zero, lowest part', (month) => month.basalLossMg),
    seriesOf('net', 'net (in − out)', 'short black bar mark', (month) => month.netMg),
  ];
  const outOf = (month: (typeof months)[number]) => month.chelationOutMg + month.removedWithBloodMg + month.basalLossMg;
  const highestIn = max(months, (month) => month.transfusedInMg) ?? 0;
  const highestOut = max(months, outOf) ?? 0;
  const left = margin.left;
  const right = width - margin.right;
  const top = margin.top;
  const bottom = margin.top + plotHeight;
  const x = categoryScale(months.map((month) => month.month), [left, right]);
  const y = valueScale([-Math.max(highestOut, 1), Math.max(highestIn, 1)], [bottom, top]);
  const barWidth = x.bandwidth();

  const parts: string[] = [
    element(
      'defs',
      {},
      element(
        'pattern',
        { id: `${prefix}-hatch`, patternUnits: 'userSpaceOnUse', width: 4, height: 4 },
        [element('rect', { x: 0, y: 0, width: 4, height: 4, fill: '#ffffff' }), element('path', { d: 'M0,4 L4,0', stroke: chartStyle.ink, 'stroke-width': 0.7 })],
      ),
    ),
  ];
  const yTicks = y.ticks(6);
  parts.push(
    element('g', { 'data-role': 'y-axis' }, [
      ...yTicks.map((tick) =>
        element('g', { 'data-tick': tick }, [
          element('line', { x1: left, x2: right, y1: y(tick), y2: y(tick), stroke: tick === 0 ? chartStyle.ink : chartStyle.gridInk, 'stroke-width': tick === 0 ? 0.8 : 0.4 }),
          textElement(String(Math.abs(tick)), { x: left - 4, y: y(tick) + chartStyle.fontSizePt / 3, 'text-anchor': 'end', 'font-size': chartStyle.fontSizePt }),
        ]),
      ),
      element('line', { x1: left, x2: left, y1: top, y2: bottom, stroke: chartStyle.ink, 'stroke-width': 0.7 }),
      textElement('iron, mg per month: in above zero, out below', { x: left, y: top - 5, 'font-size': chartStyle.fontSizePt }),
    ]),
  );
  const labelEvery = months.length <= 13 ? 1 : 0;
  parts.push(
    element(
      'g',
      { 'data-role': 'x-axis' },
      months
        .filter((month) => labelEvery === 1 || month.month.endsWith('-01'))
        .map((month) =>
          element('g', { 'data-tick': month.month }, [
            element('line', { x1: x(month.month)! + barWidth / 2, x2: x(month.month)! + barWidth / 2, y1: bottom, y2: bottom + 3, stroke: chartStyle.ink, 'stroke-width': 0.7 }),
            textElement(labelEvery === 1 ? month.month : month.month.slice(0, 4), { x: x(month.month)! + barWidth / 2, y: bottom + 4 + chartStyle.fontSizePt, 'text-anchor': 'middle', 'font-size': chartStyle.fontSizePt }),
          ]),
        ),
    ),
  );
  const zero = y(0);
  const bars = months.map((month) => {
    const barX = x(month.month)!;
    const stack: string[] = [];
    if (month.transfusedInMg > 0) stack.push(element('rect', { x: barX, y: y(month.transfusedInMg), width: barWidth, height: zero - y(month.transfusedInMg), fill: '#505050', 'data-series': 'iron-in' }));
    let depth = 0;
    const outParts: [string, number, string, string][] = [
      ['chelation-out', month.chelationOutMg, `url(#${prefix}-hatch)`, chartStyle.ink],
      ['blood-out', month.removedWithBloodMg, '#b4b4b4', chartStyle.ink],
      ['basal-out', month.basalLossMg, '#ffffff', chartStyle.ink],
    ];
    for (const [id, mg, fill, stroke] of outParts) {
      if (mg <= 0) continue;
      const from = y(-depth);
      const to = y(-(depth + mg));
      stack.push(element('rect', { x: barX, y: from, width: barWidth, height: to - from, fill, stroke, 'stroke-width': 0.3, 'data-series': id }));
      depth += mg;
    }
    stack.push(element('rect', { x: barX - 0.5, y: y(month.netMg) - 0.6, width: barWidth + 1, height: 1.2, fill: chartStyle.ink, 'data-series': 'net' }));
    return element('g', { 'data-month': month.month }, stack);
  });
  parts.push(element('g', { 'data-role': 'bars' }, bars));

  const legendTop = bottom + margin.bottom + 4;
  const swatch = (fill: string, stroke = 'none') => element('rect', { x: 0, y: -6, width: 12, height: 7, fill, stroke, 'stroke-width': 0.5 });
  const legendEntries = [
    { sample: swatch('#505050'), text: 'iron in with transfused red cells (above zero)' },
    { sample: swatch(`url(#${prefix}-hatch)`, chartStyle.ink), text: 'expected chelation removal (below zero)' },
    { sample: swatch('#b4b4b4', chartStyle.ink), text: 'iron in removed blood: exchange, venesection (below zero)' },
    { sample: swatch('#ffffff', chartStyle.ink), text: 'basal loss (below zero)' },
    { sample: element('rect', { x: 0, y: -3, width: 12, height: 1.2, fill: chartStyle.ink }), text: 'net for the month (in − out)' },
  ];
  const columnWidth = (right - left) / 2;
  parts.push(
    element(
      'g',
      { 'data-role': 'legend' },
      legendEntries.map((entry, index) =>
        element('g', { transform: `translate(${left + (index % 2) * columnWidth},${legendTop + Math.floor(index / 2) * legendRowPt + chartStyle.fontSizePt})` }, [
          entry.sample,
          textElement(entry.text, { x: 16, y: 0, 'font-size': chartStyle.fontSizePt }),
        ]),
      ),
    ),
  );
  const height = Math.ceil(legendTop + Math.ceil(legendEntries.length / 2) * legendRowPt + 2);
  const first = months[0]?.month ?? '';
  const last = months[months.length - 1]?.month ?? '';
  const title = 'Iron in against iron out, by month';
  const description = `Monthly iron in with transfusions against the expected iron out (chelation, removed blood, basal loss), ${first} to ${last}, in mg, with each month's net.`;
  const svg = element(
    'svg',
    { xmlns: 'http://www.w3.org/2000/svg', width, height, viewBox: `0 0 ${width} ${height}`, 'font-family': chartStyle.fontFamily, role: 'img' },
    [element('title', {}, title), element('desc', {}, description.replace(/&/g, '&amp;')), ...parts],
  );
  return { title, description, svg, width, height, plotted };
}
