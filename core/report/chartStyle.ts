/**
 * The look shared by every report chart, for paper and screen alike. Meaning
 * never rests on colour: greys, dash patterns, hatching and labels carry it,
 * so a greyscale print reads the same as the screen.
 */
export const chartStyle = {
  /** A family registered with the PDF writer (app/host embeds Roboto) and available to the screen. */
  fontFamily: 'Roboto',
  fontSizePt: 7,
  titleSizePt: 8,
  ink: '#000000',
  mutedInk: '#555555',
  gridInk: '#bbbbbb',
  /** Projection line dash patterns, one per scenario in order (current regimen first). */
  scenarioDashes: ['6 3', '2 2', '8 3 2 3', '1 3', '10 4 1 4'] as const,
  /** Letters that mark each scenario's line end and its legend entry. */
  scenarioMarks: ['A', 'B', 'C', 'D', 'E', 'F', 'G', 'H'] as const,
  bandFillOpacity: 0.16,
} as const;

/** Dash pattern of the scenario at `index` (patterns repeat after the list). */
export function scenarioDash(index: number): string {
  return chartStyle.scenarioDashes[index % chartStyle.scenarioDashes.length]!;
}

/** Mark of the scenario at `index` ('A', 'B', …; numbered past the list). */
export function scenarioMark(index: number): string {
  return chartStyle.scenarioMarks[index] ?? String(index + 1);
}
