import type { Milliseconds, MgPerGDry, MgPerKgPerDay } from '../units/quantity';
import type { Band } from './band';
import { cardiacT2StarBand, type CardiacT2StarBandId } from './cardiacT2StarBand';
import { intakeBand, type IntakeBandId } from './intakeBand';
import { licBand, type LicBandId } from './licBand';

/**
 * The usual-dose grid of Brittenham, "Iron-chelating therapy for transfusional
 * iron overload", N Engl J Med 2011;364:146–156, Table 2: usual doses of
 * deferoxamine or deferasirox by liver iron, daily transfusional iron intake
 * and cardiac T2*. Shown as what the publication reports, never as a
 * recommendation.
 *
 * What could be read: the intake bands of the table (< 0.3, 0.3–0.5, > 0.5
 * mg/kg/day; brittenham-2011, confirmed) and the liver iron levels the paper
 * names (3–7 mg/g dry usual target, > 7 raised risk, ≥ 15 high cardiac risk).
 * What could not: no row, cell or footnote of the dose grid itself was found in
 * a stored source in this project, so no cell is encoded; every profile says
 * that its cell is not available. A cell added here must carry the row it
 * comes from and a test against the publication.
 */
export interface DoseGridCell {
  readonly intakeBand: IntakeBandId;
  readonly licBand: LicBandId;
  readonly cardiacT2StarBand: CardiacT2StarBandId | 'any';
  /** The usual doses as printed, e.g. 'deferoxamine 25–35 mg/kg/day'. */
  readonly usualDoses: string;
  /** Where in Table 2 the cell was read (row, column, footnote). */
  readonly locator: string;
}

/** Cells of Table 2 read from a stored source: none yet (see above). */
export const doseGridCells: readonly DoseGridCell[] = [];

export interface DoseGridProfile {
  readonly intake: { readonly mgPerKgPerDay: number; readonly band: Band<IntakeBandId> };
  readonly lic: { readonly mgPerGDry: number; readonly band: Band<LicBandId> } | null;
  readonly cardiacT2Star: { readonly ms: number; readonly band: Band<CardiacT2StarBandId> } | null;
  /** The grid cell for the profile, or null when it is not available (no cell is encoded yet). */
  readonly cell: DoseGridCell | null;
  /** One descriptive sentence naming the bands, the values and whether the cell is available. */
  readonly statement: string;
}

/**
 * The patient's place in the bands of Brittenham 2011 Table 2 and, where it has
 * been read, the table's cell; otherwise a plain statement that the cell is not available.
 *
 * @param intakeMgPerKgPerDay - net transfusional iron intake, mg/kg/day (0 or more)
 * @param licMgPerGDry - liver iron, mg/g dry weight, or null without one
 * @param cardiacT2StarMs - cardiac T2*, ms, or null without one
 * @example doseGridProfile(0.4, 9, 25).statement → 'Bands of Brittenham 2011 (N Engl J Med 2011;364:146) Table 2:
 *   intake 0.4 mg/kg/day, intermediate intake (0.3–0.5 mg/kg/day); … the usual-dose cell of the table for this profile is not available in this tool …'
 */
export function doseGridProfile(intakeMgPerKgPerDay: number, licMgPerGDry: number | null, cardiacT2StarMs: number | null): DoseGridProfile {
  const intake = { mgPerKgPerDay: intakeMgPerKgPerDay, band: intakeBand(intakeMgPerKgPerDay as MgPerKgPerDay) };
  const lic = licMgPerGDry === null ? null : { mgPerGDry: licMgPerGDry, band: licBand(Math.max(0, licMgPerGDry) as MgPerGDry) };
  const cardiacT2Star = cardiacT2StarMs === null ? null : { ms: cardiacT2StarMs, band: cardiacT2StarBand(cardiacT2StarMs as Milliseconds) };
  const cell =
    lic === null
      ? null
      : (doseGridCells.find(
          (it) => it.intakeBand === intake.band.id && it.licBand === lic.band.id && (it.cardiacT2StarBand === 'any' || it.cardiacT2StarBand === cardiacT2Star?.band.id),
        ) ?? null);
  const parts = [
    `intake ${round(intake.mgPerKgPerDay, 2)} mg/kg/day, ${intake.band.label}`,
    lic === null ? 'no liver iron on record' : `liver iron ${round(lic.mgPerGDry, 1)} mg/g dry, ${lic.band.label}`,
    cardiacT2Star === null ? 'no cardiac T2* on record' : `cardiac T2* ${round(cardiacT2Star.ms, 1)} ms, ${cardiacT2Star.band.label}`,
  ];
  const cellText =
    cell === null
      ? 'the usual-dose cell of the table for this profile is not available in this tool (the table’s cells were not read from a stored source)'
      : `the table reports usual doses of ${cell.usualDoses} (${cell.locator}), as information for the prescriber`;
  return { intake, lic, cardiacT2Star, cell, statement: `Bands of Brittenham 2011 (N Engl J Med 2011;364:146) Table 2: ${parts.join('; ')}; ${cellText}.` };
}

function round(value: number, decimals: number): string {
  return String(Number(value.toFixed(decimals)));
}
