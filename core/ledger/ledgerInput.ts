import type { IsoDate } from '../dates/isoDate';

/**
 * The iron account's inputs, already normalised from a case file: every
 * transfusion turned into mg of iron in and out, every chelation period into
 * a daily expected removal. Keeping the account independent of the case-file
 * schema lets it be tested on small hand-made records.
 */

/** Iron moved by one dated record (a transfusion, an exchange, a venesection). */
export interface IronMovement {
  readonly date: IsoDate;
  /** Iron brought in, mg (transfused red cells). */
  readonly ironInMg: number;
  /** Iron taken out with removed blood, mg (exchange or venesection). */
  readonly ironOutMg: number;
  /** Where it came from, e.g. 'transfusions[12] 2026-03-04'. */
  readonly ref: string;
  /** Pure red cells brought in and taken out, mL (volume × haematocrit), when the movement comes from a case record. */
  readonly redCellsInMl?: number;
  readonly redCellsOutMl?: number;
}

/** A chelation regimen over a date range with its expected removal. */
export interface ChelationSpan {
  readonly id: string;
  /** Short description, e.g. 'deferasirox film-coated 21 mg/kg/day, 7 days/week'. */
  readonly label: string;
  readonly drug: string;
  readonly start: IsoDate;
  /** Last day on the regimen (inclusive), or null if ongoing. */
  readonly end: IsoDate | null;
  /**
   * Expected iron removal averaged over the week (mg/day), at a body weight.
   * Already includes days per week, adherence and efficiency.
   */
  readonly expectedRemovalMgPerDay: (weightKg: number) => number;
}

export interface DatedWeight {
  readonly date: IsoDate;
  readonly weightKg: number;
}

export interface LicMeasurement {
  readonly date: IsoDate;
  readonly licMgPerGDry: number;
  /** Method label, e.g. 'MRI R2* 1.5 T (hernando-2022)' or 'biopsy'; used to flag method changes. */
  readonly method: string;
  readonly ref: string;
}

export interface LedgerInput {
  readonly asOf: IsoDate;
  readonly movements: readonly IronMovement[];
  readonly chelation: readonly ChelationSpan[];
  readonly weights: readonly DatedWeight[];
  readonly licMeasurements: readonly LicMeasurement[];
  /** Basal iron loss, mg/day (about 1; Hunt et al., Am J Clin Nutr 2009). */
  readonly basalLossMgPerDay: number;
}
