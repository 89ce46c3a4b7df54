/**
 * What every report chart returns: the SVG as a string (sized in points, so
 * the PDF writer places it 1:1 and a screen can scale it), and the values it
 * plots, series by series, which the screen shows as the chart's text
 * alternative and tests check the drawing against.
 */
export interface PlottedPoint {
  /** A calendar date 'YYYY-MM-DD', or a month 'YYYY-MM' for monthly bars. */
  readonly at: string;
  readonly value: number;
  /** Lower and upper edge of an uncertainty band, where the series has one. */
  readonly low?: number;
  readonly high?: number;
}

export interface PlottedSeries {
  /** Stable id: 'measured', 'estimate', 'projection:<scenario id>', 'iron-in', 'chelation-out', … */
  readonly id: string;
  readonly label: string;
  /** UCUM code of the values ('mg/g{dry}', 'mg'). */
  readonly unit: string;
  /** How it is drawn, in words, so a reader of the table can find it on the chart. */
  readonly drawnAs: string;
  readonly points: readonly PlottedPoint[];
}

export interface Chart {
  readonly title: string;
  /** One-sentence description for screen readers and the sheet's caption. */
  readonly description: string;
  readonly svg: string;
  /** Points (1/72 inch). */
  readonly width: number;
  readonly height: number;
  readonly plotted: readonly PlottedSeries[];
}
