import { creatinineMolarMassGPerMol } from '../../../core/units/concentration';
import {
  altBounds,
  astBounds,
  bilirubinBounds,
  bloodLeadBounds,
  creatinineBounds,
  ferritinBounds,
  haemoglobinBounds,
  liverIronBounds,
  neutrophilBounds,
  plateletBounds,
  urinaryCopperBounds,
} from '../../../core/ranges/plausibleRanges';
import type { Case } from '../../../core/model/caseFile';
import { ok, type Result } from '../../../core/result';
import { convertUcum } from './ucum';

/** One entry an import proposes, before it is added: where it came from and the entry without its id. */
export interface ProposedEntry {
  readonly list: 'transfusions' | 'results' | 'weights' | 'heights';
  /** "line 4" of a CSV file, or "Observation/f001" in a bundle. */
  readonly where: string;
  readonly entry: Readonly<Record<string, unknown>>;
  /** For a CSV row: the column each of the entry's keys came from, so a refusal by the case model names the column. */
  readonly columns?: Readonly<Record<string, string>>;
}

/**
 * A choice an import takes (named as the host contract's request names it):
 * a message that needs one names it in words; `choiceOf` lets the command line
 * add its flag and a screen point at its control.
 */
export type ImportChoice = 'kind' | 'columnMapping' | 'dateOrder';

/** The choice an issue of an import asks for, from its path ('dateOrder', ['columnMapping', 'date']), if any. */
export function choiceOf(found: { readonly path: readonly (string | number)[] }): ImportChoice | undefined {
  const first = found.path[0];
  return first === 'kind' || first === 'columnMapping' || first === 'dateOrder' ? first : undefined;
}

/** A row or resource not imported, with where and why. */
export interface Rejected {
  readonly where: string;
  readonly reason: string;
  /** The choice that would let the row be read (an ambiguous date: the date order). */
  readonly choice?: ImportChoice;
}

export interface ImportPlan {
  readonly format: 'csv' | 'fhir';
  /** What the import understood, shown to the user before anything is added (the column mapping, the date order). */
  readonly understood: readonly string[];
  readonly entries: readonly ProposedEntry[];
  readonly rejected: readonly Rejected[];
  /** Codes the import does not know, listed rather than dropped silently. */
  readonly unknownCodes: readonly { readonly where: string; readonly code: string; readonly display: string }[];
  /** From a FHIR Patient: birth date and sex only (never names or identifiers); compared, never written over the case. */
  readonly patient?: { readonly birthDate?: string; readonly sexAtBirth?: string };
}

/** A converted number without the conversion's floating-point noise (12 significant digits; the value keeps its precision). */
export const withoutConversionNoise = (value: number): number => Number(value.toPrecision(12));

/** A simple transfusion as an import proposes it (the case model checks every value when it is added). */
export function proposedTransfusion(where: string, date: string, volumeMl: number, unitHaematocrit: number | null, unitCount: number | string, note?: string): ProposedEntry {
  return {
    list: 'transfusions',
    where,
    entry: { date, kind: 'simple', volume: { value: withoutConversionNoise(volumeMl), unit: 'mL' }, unitHaematocrit, unitCount, ...(note ? { note } : {}) },
  };
}

/** The units the case file accepts for each result kind an import can bring (the case model's ranges, one table). */
export const resultUnitsByKind: Readonly<Record<string, readonly string[]>> = {
  ferritin: Object.keys(ferritinBounds),
  haemoglobin: Object.keys(haemoglobinBounds),
  creatinine: Object.keys(creatinineBounds),
  alt: Object.keys(altBounds),
  ast: Object.keys(astBounds),
  bilirubin: Object.keys(bilirubinBounds),
  neutrophils: Object.keys(neutrophilBounds),
  platelets: Object.keys(plateletBounds),
  'blood-lead': Object.keys(bloodLeadBounds),
  'urinary-copper': Object.keys(urinaryCopperBounds),
  'liver-iron': Object.keys(liverIronBounds),
};

/** Molecular weights for conversions between mass and moles (creatinine, core/units/concentration.ts). */
const molecularWeights: Readonly<Record<string, number>> = { creatinine: creatinineMolarMassGPerMol };

/**
 * The unit a result is stored in: the unit the case already uses for that
 * kind (its latest entry), else the imported unit when the case model accepts
 * it, else the kind's first unit. The value is converted through UCUM.
 *
 * @returns the value and unit to store, or an issue naming where
 */
export function toCaseUnit(caseFile: Case | null, kind: string, value: number, unit: string, where: string): Result<{ readonly value: number; readonly unit: string }> {
  const allowed = resultUnitsByKind[kind] ?? [];
  const inCase = caseFile?.results.filter((it) => it.kind === kind && 'measured' in it).at(-1);
  const caseUnit = inCase && 'measured' in inCase ? (inCase.measured as { unit: string }).unit : undefined;
  const target = caseUnit ?? (allowed.includes(unit) ? unit : allowed[0] ?? unit);
  const converted = convertUcum(value, unit, target, where, molecularWeights[kind]);
  if (!converted.ok) return converted;
  return ok({ value: withoutConversionNoise(converted.value), unit: target });
}
