/**
 * A band a value falls in: a stable id for code and tests, a label in the
 * trade's words for the screen and the sheet, and the source that draws the
 * boundary (an id in core/references).
 */
export interface Band<Id extends string = string> {
  readonly id: Id;
  readonly label: string;
  readonly sourceId: string;
  /** A caution that goes with the band wherever it is shown. */
  readonly caution?: string;
}
