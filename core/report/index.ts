/**
 * What is printed and shown from a review, as pure data: the method appendix,
 * the charts (one SVG builder for the sheet and the screen) and the sheet.
 *
 * Charts: `licChart(results, options) → { title, description, svg, width, height, plotted }`
 * and `ironFlowChart(results, options)` with the same shape. `svg` is a string sized in
 * points (font-family Roboto, greyscale: dashes, hatching and labels carry meaning);
 * `plotted` is the table of plotted values, series by series, for a text alternative.
 */
export type { Chart, PlottedPoint, PlottedSeries } from './chart';
export { licChart, type LicChartOptions, type LicChartResults, type LicLabelZone } from './licChart';
export { ironFlowChart, type IronFlowChartOptions, type IronFlowChartResults } from './ironFlowChart';
export { methodAppendix, type AppendixAssumption, type AppendixFormula, type MethodAppendix } from './methodAppendix';
export { derivationsOf, type NamedDerivation } from './derivationIndex';
