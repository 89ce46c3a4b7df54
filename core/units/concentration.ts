import { atomicWeight } from '../elements/atomicWeights';
import { molarMass } from '../elements/molarMass';
import type {
  GPerDl,
  GPerL,
  GramsPerMole,
  MgPerDl,
  MicrogramsPerDl,
  MicrogramsPer24h,
  MicrogramsPerLitre,
  MmolPerL,
  NanogramsPerMl,
  UmolPer24h,
  UmolPerL,
} from './quantity';

/** Creatinine C4H7N3O, molar mass from CIAAW weights: 113.12 g/mol. */
export const creatinineMolarMassGPerMol: GramsPerMole = molarMass('C4H7N3O');

/**
 * Haemoglobin molar mass per haem (monomer), 16 114.5 g/mol: the convention
 * under which SI laboratories report haemoglobin in mmol/L (g/dL × 0.6206).
 * The tetramer is 4 × 16 114.5 = 64 458 g/mol (references.md §1).
 * Source: common practice of SI haemoglobin reporting; value from memory.
 */
export const haemoglobinMonomerMolarMassGPerMol = 16114.5 as GramsPerMole;

/**
 * Ferritin: µg/L and ng/mL are the same quantity (1 µg/L = 1 ng/mL).
 * @example ugPerLFromNgPerMl(2400 as NanogramsPerMl) === 2400
 */
export const ugPerLFromNgPerMl = (ferritin: NanogramsPerMl): MicrogramsPerLitre => ferritin as number as MicrogramsPerLitre;

/**
 * Creatinine mg/dL → µmol/L: × 10 (dL→L) × 1000 (mg→µg) / 113.12 g/mol = × 88.40.
 * references.md §5 quotes the rounded factor 88.4.
 * @example umolPerLFromMgPerDl(mgPerDl(1.0)) ≈ 88.40
 */
export const creatinineUmolPerLFromMgPerDl = (creatinine: MgPerDl): UmolPerL =>
  ((creatinine * 10 * 1000) / creatinineMolarMassGPerMol) as UmolPerL;

/** Creatinine µmol/L → mg/dL (inverse of the above). @example ≈ 1.0 for 88.4 */
export const creatinineMgPerDlFromUmolPerL = (creatinine: UmolPerL): MgPerDl =>
  ((creatinine * creatinineMolarMassGPerMol) / (10 * 1000)) as MgPerDl;

/** Haemoglobin g/dL → g/L (× 10). */
export const gPerLFromGPerDl = (haemoglobin: GPerDl): GPerL => (haemoglobin * 10) as GPerL;
/** Haemoglobin g/L → g/dL (÷ 10). */
export const gPerDlFromGPerL = (haemoglobin: GPerL): GPerDl => (haemoglobin / 10) as GPerDl;
/** Haemoglobin g/dL → mmol/L (monomer convention): × 10 000 / 16 114.5 ≈ × 0.6206. */
export const haemoglobinMmolPerLFromGPerDl = (haemoglobin: GPerDl): MmolPerL =>
  ((haemoglobin * 10 * 1000) / haemoglobinMonomerMolarMassGPerMol) as MmolPerL;
/** Haemoglobin mmol/L (monomer) → g/dL. */
export const haemoglobinGPerDlFromMmolPerL = (haemoglobin: MmolPerL): GPerDl =>
  ((haemoglobin * haemoglobinMonomerMolarMassGPerMol) / (10 * 1000)) as GPerDl;

/**
 * Blood lead µg/dL → µmol/L: × 10 (dL→L) / 207.2 (Ar(Pb), CIAAW conventional) → × 0.04826.
 * @example bloodLeadUmolPerLFromUgPerDl(45) ≈ 2.17
 */
export const bloodLeadUmolPerLFromUgPerDl = (lead: MicrogramsPerDl): UmolPerL =>
  ((lead * 10) / atomicWeight('Pb')) as UmolPerL;
/** Blood lead µmol/L → µg/dL. */
export const bloodLeadUgPerDlFromUmolPerL = (lead: UmolPerL): MicrogramsPerDl =>
  ((lead * atomicWeight('Pb')) / 10) as MicrogramsPerDl;

/**
 * Urinary copper µg/24 h → µmol/24 h: ÷ 63.546 (Ar(Cu), CIAAW 2021 single value).
 * @example urinaryCopperUmolPer24hFromUgPer24h(500) ≈ 7.87
 */
export const urinaryCopperUmolPer24hFromUgPer24h = (copper: MicrogramsPer24h): UmolPer24h =>
  (copper / atomicWeight('Cu')) as UmolPer24h;
/** Urinary copper µmol/24 h → µg/24 h (× 63.546). @example ≈ 500 for 7.868 */
export const urinaryCopperUgPer24hFromUmolPer24h = (copper: UmolPer24h): MicrogramsPer24h =>
  (copper * atomicWeight('Cu')) as MicrogramsPer24h;
