/**
 * Branded quantities: a number that carries its unit in the type, so that
 * milligrams cannot be passed where kilograms are expected (style.md habit 3).
 * Values are converted only by the named functions in core/units.
 *
 * The unit strings are UCUM codes where UCUM has one, so the brand also names
 * the unit used at the boundaries (imports, exports, the command line).
 */
import type { Quantity } from '../quantity';

export type { Quantity };

export type Milligrams = Quantity<'mg'>;
export type Grams = Quantity<'g'>;
export type Kilograms = Quantity<'kg'>;
export type Millilitres = Quantity<'mL'>;
export type Litres = Quantity<'L'>;
/** A dimensionless fraction between 0 and 1 (haematocrit, adherence, efficiency). */
export type Fraction = Quantity<'1'>;
export type Centimetres = Quantity<'cm'>;
export type SquareMetres = Quantity<'m2'>;
export type Days = Quantity<'d'>;
export type Years = Quantity<'a'>;
export type Hours = Quantity<'h'>;
export type Milliseconds = Quantity<'ms'>;
/** Relaxation rate R2* or R2, per second. */
export type PerSecond = Quantity<'s-1'>;
export type Tesla = Quantity<'T'>;
export type GramsPerMole = Quantity<'g/mol'>;
export type Millimoles = Quantity<'mmol'>;
export type Micromoles = Quantity<'umol'>;

export type MgPerMl = Quantity<'mg/mL'>;
export type MgPerKg = Quantity<'mg/kg'>;
export type MgPerKgPerDay = Quantity<'mg/kg/d'>;
export type MgPerDay = Quantity<'mg/d'>;
export type MlPerKg = Quantity<'mL/kg'>;
export type MlPerKgPerYear = Quantity<'mL/kg/a'>;
export type MgPerM2 = Quantity<'mg/m2'>;

/** Liver iron concentration, mg Fe per g dry liver tissue. */
export type MgPerGDry = Quantity<'mg/g{dry}'>;
export type UmolPerGDry = Quantity<'umol/g{dry}'>;
export type MgPerGWet = Quantity<'mg/g{wet}'>;

export type MicrogramsPerLitre = Quantity<'ug/L'>;
export type NanogramsPerMl = Quantity<'ng/mL'>;
export type MgPerDl = Quantity<'mg/dL'>;
export type MgPerL = Quantity<'mg/L'>;
export type UmolPerL = Quantity<'umol/L'>;
export type GPerDl = Quantity<'g/dL'>;
export type GPerL = Quantity<'g/L'>;
export type MmolPerL = Quantity<'mmol/L'>;
export type MicrogramsPerDl = Quantity<'ug/dL'>;
export type MlPerMin = Quantity<'mL/min'>;
/** eGFR normalised to 1.73 m² body-surface area. */
export type MlPerMinPer173M2 = Quantity<'mL/min/{1.73_m2}'>;
/** Urinary excretion over a 24-hour collection (UCUM 'ug/(24.h)', 'umol/(24.h)'). */
export type MicrogramsPer24h = Quantity<'ug/(24.h)'>;
export type UmolPer24h = Quantity<'umol/(24.h)'>;
export type PerNanoLitre = Quantity<'10*9/L'>;

/** Attach a unit to a plain number (the only cast in the units layer). */
export function quantity<Unit extends string>(value: number, _unit: Unit): Quantity<Unit> {
  return value as Quantity<Unit>;
}

export const mg = (value: number): Milligrams => value as Milligrams;
export const grams = (value: number): Grams => value as Grams;
export const kg = (value: number): Kilograms => value as Kilograms;
export const ml = (value: number): Millilitres => value as Millilitres;
export const fraction = (value: number): Fraction => value as Fraction;
export const cm = (value: number): Centimetres => value as Centimetres;
export const m2 = (value: number): SquareMetres => value as SquareMetres;
export const days = (value: number): Days => value as Days;
export const years = (value: number): Years => value as Years;
export const msec = (value: number): Milliseconds => value as Milliseconds;
export const perSecond = (value: number): PerSecond => value as PerSecond;
export const tesla = (value: number): Tesla => value as Tesla;
export const mgPerMl = (value: number): MgPerMl => value as MgPerMl;
export const mgPerKg = (value: number): MgPerKg => value as MgPerKg;
export const mgPerKgPerDay = (value: number): MgPerKgPerDay => value as MgPerKgPerDay;
export const mgPerGDry = (value: number): MgPerGDry => value as MgPerGDry;
export const ugPerL = (value: number): MicrogramsPerLitre => value as MicrogramsPerLitre;
export const mgPerDl = (value: number): MgPerDl => value as MgPerDl;
export const umolPerL = (value: number): UmolPerL => value as UmolPerL;
export const gPerDl = (value: number): GPerDl => value as GPerDl;
export const gramsPerMole = (value: number): GramsPerMole => value as GramsPerMole;
