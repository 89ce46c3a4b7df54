import { ironFlowChart, licChart, type Chart } from '../../core/report';
import { formatNumber } from './format';
import { displayUnit } from '../../core/units/displayUnit';
import type { Review } from './review';

/** A chart as a screen shows it: the SVG from core's builder as an image, its description, and its plotted values as tables. */
export interface ChartView {
  readonly title: string;
  readonly description: string;
  readonly imageSrc: string;
  readonly widthPt: number;
  readonly heightPt: number;
  readonly series: readonly {
    readonly id: string;
    readonly caption: string;
    readonly hasBand: boolean;
    readonly rows: readonly { readonly at: string; readonly value: string; readonly band: string }[];
  }[];
}

/** A chart of core's builder as a screen shows it. */
export function chartView(chart: Chart): ChartView {
  return {
    title: chart.title,
    description: chart.description,
    // An image, not markup in the page: the SVG cannot run anything, and the CSP allows data: images only.
    imageSrc: `data:image/svg+xml;charset=utf-8,${encodeURIComponent(chart.svg)}`,
    widthPt: chart.width,
    heightPt: chart.height,
    series: chart.plotted.map((series) => ({
      id: series.id,
      caption: `${series.label} (${displayUnit(series.unit)}), drawn as ${series.drawnAs}`,
      hasBand: series.points.some((point) => point.low !== undefined),
      rows: series.points.map((point) => ({
        at: point.at,
        value: formatNumber(point.value, series.unit === 'mg' ? 0 : 1),
        band: point.low !== undefined && point.high !== undefined ? `${formatNumber(point.low, 1)}–${formatNumber(point.high, 1)}` : '',
      })),
    })),
  };
}

/** Liver iron over time with the projections (the same builder as the review sheet). */
export function licChartView(review: Review, scenarioIds?: readonly string[]): ChartView {
  return chartView(licChart(review.results, scenarioIds ? { scenarioIds } : {}));
}

/** Iron in against out by month, the last two years (the same builder as the review sheet). */
export function ironFlowChartView(review: Review): ChartView {
  return chartView(ironFlowChart(review.results, { lastMonths: 24 }));
}
