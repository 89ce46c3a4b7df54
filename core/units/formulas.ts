import { checkNumber } from '../formulas/validate';
import { defineFormula, type AnyFormula, type ChoiceInputSpec, type NumberInputSpec } from '../formulas/types';
import { fail, issue, ok, type Issue, type Result } from '../result';
import {
  bloodLeadUgPerDlFromUmolPerL,
  bloodLeadUmolPerLFromUgPerDl,
  creatinineMgPerDlFromUmolPerL,
  creatinineUmolPerLFromMgPerDl,
  gPerDlFromGPerL,
  gPerLFromGPerDl,
  haemoglobinGPerDlFromMmolPerL,
  haemoglobinMmolPerLFromGPerDl,
  ugPerLFromNgPerMl,
  urinaryCopperUgPer24hFromUmolPer24h,
  urinaryCopperUmolPer24hFromUgPer24h,
} from './concentration';
import type { GPerDl, GPerL, MgPerDl, MicrogramsPer24h, MicrogramsPerDl, MmolPerL, NanogramsPerMl, UmolPer24h, UmolPerL } from './quantity';

/** Plausible range of a laboratory value in one unit, inclusive. */
export interface UnitRange {
  readonly min: number;
  readonly max: number;
}

/**
 * Check a value entered with a unit chosen beside it against the plausible
 * range for that unit. When the value is out of range in the chosen unit but
 * plausible in another, the message asks whether the unit is the other one
 * (creatinine 115 "mg/dL" is almost surely 115 µmol/L).
 *
 * @param name - input name (the issue path)
 * @param label - the field in the trade's words
 * @param value - the number as entered
 * @param unit - the unit chosen for it
 * @param ranges - plausible range per unit (UCUM codes)
 * @returns no issue, or one 'out_of_range' issue naming field, value and the range in that unit
 * @example checkInChosenUnit('serumCreatinine', 'serum creatinine', 115, 'mg/dL', creatinineRanges)
 *   → [issue: 'Serum creatinine 115 mg/dL is outside the plausible range 0.1–20 mg/dL; if it was measured in umol/L, choose umol/L.']
 */
export function checkInChosenUnit<Unit extends string>(
  name: string,
  label: string,
  value: number,
  unit: Unit,
  ranges: Readonly<Record<Unit, UnitRange>>,
): Issue[] {
  const range = ranges[unit];
  const found = checkNumber(name, value, { kind: 'number', label, unit, min: range.min, max: range.max, meaning: label });
  const first = found[0];
  if (first === undefined) return [];
  const otherUnits = (Object.keys(ranges) as Unit[]).filter(
    (other) => other !== unit && value >= ranges[other].min && value <= ranges[other].max,
  );
  if (otherUnits.length === 0) return found;
  const hint = `; if it was measured in ${otherUnits.join(' or ')}, choose that unit.`;
  return [issue(first.code, first.path, first.message.replace(/\.$/, hint), first.severity)];
}

/**
 * A laboratory quantity that users enter as a number with its unit chosen
 * beside it: the units offered and the plausible range in each.
 */
export interface LabQuantity<Unit extends string> {
  /** Input name of the number, e.g. 'serumCreatinine'; the unit input is named by {@link LabQuantity.unitName}. */
  readonly name: string;
  readonly unitName: string;
  /** The quantity in the trade's words, e.g. 'serum creatinine'. */
  readonly label: string;
  readonly units: readonly Unit[];
  readonly ranges: Readonly<Record<Unit, UnitRange>>;
}

function rangesText<Unit extends string>(quantity: LabQuantity<Unit>): string {
  return quantity.units.map((unit) => `${quantity.ranges[unit].min}–${quantity.ranges[unit].max} ${unit}`).join(' or ');
}

/**
 * The number input of a laboratory quantity. Its range is the union over the
 * units (so validation one input at a time accepts every unit); compute then
 * checks the value in its chosen unit with {@link checkLabValue}.
 */
export function labValueInput<Unit extends string>(quantity: LabQuantity<Unit>): NumberInputSpec {
  const mins = quantity.units.map((unit) => quantity.ranges[unit].min);
  const maxes = quantity.units.map((unit) => quantity.ranges[unit].max);
  return {
    kind: 'number',
    label: quantity.label,
    unit: quantity.units.join(' or '),
    min: Math.min(...mins),
    max: Math.max(...maxes),
    unitFrom: quantity.unitName,
    unitRanges: quantity.ranges,
    meaning: `${quantity.label} in the unit chosen with ${quantity.label} unit: ${rangesText(quantity)}`,
  };
}

/** The unit choice of a laboratory quantity (no default: a unit is never assumed). */
export function labUnitInput<Unit extends string>(quantity: LabQuantity<Unit>): ChoiceInputSpec<Unit> {
  return {
    kind: 'choice',
    label: `${quantity.label} unit`,
    choices: quantity.units,
    meaning: `unit of the ${quantity.label} as reported: ${quantity.units.join(', ')}`,
  };
}

/** {@link checkInChosenUnit} for a laboratory quantity. */
export function checkLabValue<Unit extends string>(quantity: LabQuantity<Unit>, value: number, unit: Unit): Issue[] {
  return checkInChosenUnit(quantity.name, quantity.label, value, unit, quantity.ranges);
}

// ——— Creatinine ———

export const creatinineUnits = ['mg/dL', 'umol/L'] as const;
export type CreatinineUnit = (typeof creatinineUnits)[number];

/**
 * Serum creatinine. Plausible from a small child's (about 0.1–0.2 mg/dL) to
 * untreated kidney failure (about 20 mg/dL): common practice. The µmol/L range
 * is the mg/dL range × 88.4 rounded outward (8.84 → 8, 1768 → 1770).
 */
export const serumCreatinine: LabQuantity<CreatinineUnit> = {
  name: 'serumCreatinine',
  unitName: 'creatinineUnit',
  label: 'serum creatinine',
  units: creatinineUnits,
  ranges: { 'mg/dL': { min: 0.1, max: 20 }, 'umol/L': { min: 8, max: 1770 } },
};

/** Inputs `serumCreatinine` and `creatinineUnit`, shared by every calculator that takes a creatinine. */
export const serumCreatinineInput = labValueInput(serumCreatinine);
export const creatinineUnitInput = labUnitInput(serumCreatinine);

/**
 * Serum creatinine as entered (value and unit) in mg/dL, after checking it is
 * plausible in the unit it was entered in.
 *
 * @param value - creatinine as entered, 0.1–20 mg/dL or 8–1770 µmol/L
 * @param unit - 'mg/dL' or 'umol/L'
 * @returns creatinine, mg/dL (µmol/L ÷ 88.40, CIAAW molar mass 113.12 g/mol); or an 'out_of_range' issue on 'serumCreatinine'
 * @example creatinineMgPerDlFromEntry(132.6, 'umol/L') → ok(1.4999…)
 */
export function creatinineMgPerDlFromEntry(value: number, unit: CreatinineUnit): Result<MgPerDl> {
  const issues = checkLabValue(serumCreatinine, value, unit);
  if (issues.length > 0) return fail(...issues);
  return ok(unit === 'mg/dL' ? (value as MgPerDl) : creatinineMgPerDlFromUmolPerL(value as UmolPerL));
}

export const creatinineUnitsFormula = defineFormula({
  id: 'creatinine-units',
  title: 'Serum creatinine: mg/dL and µmol/L',
  expression: 'µmol/L = mg/dL × 10 × 1000 / 113.12 g/mol (≈ × 88.40); mg/dL = µmol/L ÷ 88.40',
  sourceIds: ['ciaaw-2021', 'ucum'],
  notes: ['Molar mass of creatinine C4H7N3O from CIAAW standard atomic weights (113.12 g/mol); the printed factor 88.4 is the same to 0.01 %.'],
  inputs: { serumCreatinine: serumCreatinineInput, creatinineUnit: creatinineUnitInput },
  outputs: {
    creatinineMgPerDl: { label: 'serum creatinine', unit: 'mg/dL', meaning: 'serum creatinine in mg/dL', decimals: 2 },
    creatinineUmolPerL: { label: 'serum creatinine', unit: 'umol/L', meaning: 'serum creatinine in µmol/L', decimals: 0 },
  },
  compute: ({ serumCreatinine: value, creatinineUnit }) => {
    const entered = creatinineMgPerDlFromEntry(value, creatinineUnit);
    if (!entered.ok) return { refused: entered.issues };
    return {
      creatinineMgPerDl: entered.value,
      creatinineUmolPerL: creatinineUnit === 'umol/L' ? value : creatinineUmolPerLFromMgPerDl(entered.value),
    };
  },
});

// ——— Haemoglobin ———

export const haemoglobinUnits = ['g/dL', 'g/L', 'mmol/L'] as const;
export type HaemoglobinUnit = (typeof haemoglobinUnits)[number];

/**
 * Blood haemoglobin. Plausible 2–25 g/dL (common practice: below 2 is hardly
 * compatible with life, above 25 beyond severe polycythaemia); g/L × 10;
 * mmol/L (haem monomer) × 0.6206, rounded outward (1.24 → 1.2, 15.5 → 15.6).
 */
export const haemoglobin: LabQuantity<HaemoglobinUnit> = {
  name: 'haemoglobin',
  unitName: 'haemoglobinUnit',
  label: 'haemoglobin',
  units: haemoglobinUnits,
  ranges: { 'g/dL': { min: 2, max: 25 }, 'g/L': { min: 20, max: 250 }, 'mmol/L': { min: 1.2, max: 15.6 } },
};

export const haemoglobinUnitsFormula = defineFormula({
  id: 'haemoglobin-units',
  title: 'Haemoglobin: g/dL, g/L and mmol/L',
  expression: 'g/L = g/dL × 10; mmol/L = g/dL × 10 000 / 16 114.5 g/mol (≈ × 0.6206, per haem monomer)',
  sourceIds: ['ucum', 'common-practice'],
  notes: [
    'mmol/L counts haem monomers (16 114.5 g/mol), the convention of laboratories that report haemoglobin in mmol/L; a tetramer basis would give a quarter of the value.',
  ],
  inputs: { haemoglobin: labValueInput(haemoglobin), haemoglobinUnit: labUnitInput(haemoglobin) },
  outputs: {
    haemoglobinGPerDl: { label: 'haemoglobin', unit: 'g/dL', meaning: 'haemoglobin in g/dL', decimals: 1 },
    haemoglobinGPerL: { label: 'haemoglobin', unit: 'g/L', meaning: 'haemoglobin in g/L', decimals: 0 },
    haemoglobinMmolPerL: { label: 'haemoglobin', unit: 'mmol/L', meaning: 'haemoglobin in mmol/L (haem monomer)', decimals: 2 },
  },
  compute: ({ haemoglobin: value, haemoglobinUnit }) => {
    const issues = checkLabValue(haemoglobin, value, haemoglobinUnit);
    if (issues.length > 0) return { refused: issues };
    const gPerDl =
      haemoglobinUnit === 'g/dL'
        ? (value as GPerDl)
        : haemoglobinUnit === 'g/L'
          ? gPerDlFromGPerL(value as GPerL)
          : haemoglobinGPerDlFromMmolPerL(value as MmolPerL);
    return {
      haemoglobinGPerDl: gPerDl,
      haemoglobinGPerL: haemoglobinUnit === 'g/L' ? value : gPerLFromGPerDl(gPerDl),
      haemoglobinMmolPerL: haemoglobinUnit === 'mmol/L' ? value : haemoglobinMmolPerLFromGPerDl(gPerDl),
    };
  },
});

// ——— Ferritin ———

export const ferritinUnits = ['ng/mL', 'ug/L'] as const;
export type FerritinUnit = (typeof ferritinUnits)[number];

/** Serum ferritin. Plausible 1–100 000 µg/L (common practice: iron deficiency to hyperferritinaemic syndromes). */
export const serumFerritin: LabQuantity<FerritinUnit> = {
  name: 'ferritin',
  unitName: 'ferritinUnit',
  label: 'serum ferritin',
  units: ferritinUnits,
  ranges: { 'ng/mL': { min: 1, max: 100000 }, 'ug/L': { min: 1, max: 100000 } },
};

export const ferritinUnitsFormula = defineFormula({
  id: 'ferritin-units',
  title: 'Ferritin: ng/mL and µg/L',
  expression: 'µg/L = ng/mL (1 ng/mL = 10⁻⁹ g / 10⁻³ L = 10⁻⁶ g/L)',
  sourceIds: ['ucum', 'definition'],
  inputs: { ferritin: labValueInput(serumFerritin), ferritinUnit: labUnitInput(serumFerritin) },
  outputs: {
    ferritinNgPerMl: { label: 'serum ferritin', unit: 'ng/mL', meaning: 'ferritin in ng/mL', decimals: 0 },
    ferritinUgPerL: { label: 'serum ferritin', unit: 'ug/L', meaning: 'ferritin in µg/L (the same number)', decimals: 0 },
  },
  compute: ({ ferritin, ferritinUnit }) => {
    const issues = checkLabValue(serumFerritin, ferritin, ferritinUnit);
    if (issues.length > 0) return { refused: issues };
    // The two units are one quantity: the µg/L value is the ng/mL value.
    const ugPerL = ugPerLFromNgPerMl(ferritin as NanogramsPerMl);
    return { ferritinNgPerMl: ugPerL, ferritinUgPerL: ugPerL };
  },
});

// ——— Blood lead ———

export const bloodLeadUnits = ['ug/dL', 'umol/L'] as const;
export type BloodLeadUnit = (typeof bloodLeadUnits)[number];

/**
 * Venous blood lead. Plausible 0.5–300 µg/dL (common practice: from below the
 * CDC reference value 3.5 µg/dL to the worst encephalopathy reports); µmol/L
 * × 0.04826, rounded outward (0.024 → 0.02, 14.48 → 14.5).
 */
export const bloodLead: LabQuantity<BloodLeadUnit> = {
  name: 'bloodLead',
  unitName: 'bloodLeadUnit',
  label: 'blood lead',
  units: bloodLeadUnits,
  ranges: { 'ug/dL': { min: 0.5, max: 300 }, 'umol/L': { min: 0.02, max: 14.5 } },
};

export const bloodLeadUnitsFormula = defineFormula({
  id: 'blood-lead-units',
  title: 'Blood lead: µg/dL and µmol/L',
  expression: 'µmol/L = µg/dL × 10 / 207.2 g/mol (≈ × 0.04826); µg/dL = µmol/L × 20.72',
  sourceIds: ['ciaaw-2021', 'ucum'],
  notes: ['Ar(Pb) 207.2 is the CIAAW conventional value (lead varies in isotopic composition in nature).'],
  inputs: { bloodLead: labValueInput(bloodLead), bloodLeadUnit: labUnitInput(bloodLead) },
  outputs: {
    bloodLeadUgPerDl: { label: 'blood lead', unit: 'ug/dL', meaning: 'blood lead in µg/dL', decimals: 1 },
    bloodLeadUmolPerL: { label: 'blood lead', unit: 'umol/L', meaning: 'blood lead in µmol/L', decimals: 3 },
  },
  compute: ({ bloodLead: value, bloodLeadUnit }) => {
    const issues = checkLabValue(bloodLead, value, bloodLeadUnit);
    if (issues.length > 0) return { refused: issues };
    return bloodLeadUnit === 'ug/dL'
      ? { bloodLeadUgPerDl: value, bloodLeadUmolPerL: bloodLeadUmolPerLFromUgPerDl(value as MicrogramsPerDl) }
      : { bloodLeadUgPerDl: bloodLeadUgPerDlFromUmolPerL(value as UmolPerL), bloodLeadUmolPerL: value };
  },
});

// ——— Urinary copper (24-hour collection) ———

export const urinaryCopperUnits = ['ug/(24.h)', 'umol/(24.h)'] as const;
export type UrinaryCopperUnit = (typeof urinaryCopperUnits)[number];

/**
 * 24-hour urinary copper. Plausible 0–5000 µg/24 h: from normal (under about 40 µg)
 * to a patient with Wilson disease on chelation (a few thousand µg; common practice);
 * µmol/24 h ÷ 63.546, rounded outward (78.7 → 79).
 */
export const urinaryCopper: LabQuantity<UrinaryCopperUnit> = {
  name: 'urinaryCopper',
  unitName: 'urinaryCopperUnit',
  label: '24-hour urinary copper',
  units: urinaryCopperUnits,
  ranges: { 'ug/(24.h)': { min: 0, max: 5000 }, 'umol/(24.h)': { min: 0, max: 79 } },
};

export const urinaryCopperUnitsFormula = defineFormula({
  id: 'urinary-copper-units',
  title: 'Urinary copper: µg/24 h and µmol/24 h',
  expression: 'µmol/24 h = µg/24 h ÷ 63.546 g/mol (Ar(Cu)); µg/24 h = µmol/24 h × 63.546',
  sourceIds: ['ciaaw-2021', 'ucum'],
  notes: ['Ar(Cu) 63.546 is a CIAAW single value (± 0.003).'],
  inputs: { urinaryCopper: labValueInput(urinaryCopper), urinaryCopperUnit: labUnitInput(urinaryCopper) },
  outputs: {
    urinaryCopperUgPer24h: { label: '24-hour urinary copper', unit: 'ug/(24.h)', meaning: 'urinary copper in µg/24 h', decimals: 0 },
    urinaryCopperUmolPer24h: { label: '24-hour urinary copper', unit: 'umol/(24.h)', meaning: 'urinary copper in µmol/24 h', decimals: 2 },
  },
  compute: ({ urinaryCopper: value, urinaryCopperUnit }) => {
    const issues = checkLabValue(urinaryCopper, value, urinaryCopperUnit);
    if (issues.length > 0) return { refused: issues };
    return urinaryCopperUnit === 'ug/(24.h)'
      ? { urinaryCopperUgPer24h: value, urinaryCopperUmolPer24h: urinaryCopperUmolPer24hFromUgPer24h(value as MicrogramsPer24h) }
      : { urinaryCopperUgPer24h: urinaryCopperUgPer24hFromUmolPer24h(value as UmolPer24h), urinaryCopperUmolPer24h: value };
  },
});

/** Unit-conversion calculators (laboratory units), in the order `calc --list` shows them. */
export const unitFormulas: readonly AnyFormula[] = [
  creatinineUnitsFormula,
  haemoglobinUnitsFormula,
  ferritinUnitsFormula,
  bloodLeadUnitsFormula,
  urinaryCopperUnitsFormula,
];
