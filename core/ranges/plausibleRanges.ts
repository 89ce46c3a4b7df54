import type { Bounds } from './bounds';

/**
 * The ranges every number in a case file is checked against (see bounds.ts), and the
 * ranges of the calculators' inputs for the same quantities (core/ranges/inputRange.ts).
 *
 * These are screens for typing errors (a weight in pounds, a haematocrit as a
 * percentage, a creatinine in the wrong unit), not clinical thresholds: the
 * published dose ranges and monitoring thresholds live in the safety rules.
 * Unless a comment names a source, a range is common practice, chosen wide
 * enough that a real patient rarely trips it. Ranges in a second unit are the
 * first unit's range converted (the factor is named) and rounded outward;
 * tests/core/model/units.test.ts checks each conversion with UCUM.
 */

/** A number that must be above zero (a volume, a dose). */
const positive = (max: number) => ({ min: 0, max, minExclusive: true }) as const;
/** A number that may be zero (a concentration below detection). */
const nonNegative = (max: number) => ({ min: 0, max }) as const;

// ── Patient ────────────────────────────────────────────────────────────────
/** Weight: refuse ≤ 0 or > 400 kg; warn outside 2–200 kg (a newborn to a heavy adult). */
export const weightBounds = { unit: 'kg', possible: positive(400), plausible: { min: 2, max: 200 }, decimals: 0 } as const satisfies Bounds;
/** Height: refuse ≤ 0 or > 275 cm (above the tallest person on record, about 272 cm; from memory). */
export const heightBounds = { unit: 'cm', possible: positive(275), plausible: { min: 40, max: 220 }, decimals: 0 } as const satisfies Bounds;
/** Age in years when no birth date is recorded. */
export const ageYearsBounds = { unit: 'a', possible: nonNegative(125), plausible: { min: 0, max: 105 }, decimals: 0 } as const satisfies Bounds;

// ── Transfusions, exchanges, venesections ──────────────────────────────────
/** Haematocrit of a red-cell unit: the same plausible range as the transfusion-iron calculator (core/iron/formulas.ts). */
export const unitHaematocritBounds = {
  unit: '1',
  possible: positive(1),
  plausible: { min: 0.4, max: 0.85 },
  decimals: 2,
  fraction: true,
} as const satisfies Bounds;
/** The patient's own haematocrit before an exchange or a venesection. */
export const patientHaematocritBounds = {
  unit: '1',
  possible: positive(1),
  plausible: { min: 0.15, max: 0.6 },
  decimals: 2,
  fraction: true,
} as const satisfies Bounds;
/** Total volume of one simple transfusion (all its units): a 10 mL/kg aliquot for an infant up to about six adult units. */
export const transfusionVolumeBounds = { unit: 'mL', possible: positive(10000), plausible: { min: 10, max: 2000 }, decimals: 0 } as const satisfies Bounds;
/** Donor volume given, or patient volume removed, in one red-cell exchange (automated exchanges move several litres). */
export const exchangeVolumeBounds = { unit: 'mL', possible: positive(20000), plausible: { min: 100, max: 8000 }, decimals: 0 } as const satisfies Bounds;
/** One venesection: about 6 mL/kg in a child to a 500 mL adult donation-size session. */
export const venesectionVolumeBounds = { unit: 'mL', possible: positive(2000), plausible: { min: 20, max: 600 }, decimals: 0 } as const satisfies Bounds;
/** Units of red cells in one simple transfusion. */
export const transfusionUnitCountBounds = { unit: '1', possible: { min: 1, max: 50 }, plausible: { min: 1, max: 6 }, decimals: 0, integer: true } as const satisfies Bounds;
/** Donor units in one exchange (an automated exchange often uses 6–12). */
export const exchangeUnitCountBounds = { unit: '1', possible: { min: 1, max: 50 }, plausible: { min: 1, max: 15 }, decimals: 0, integer: true } as const satisfies Bounds;

// ── Results ────────────────────────────────────────────────────────────────
/** Serum ferritin; µg/L and ng/mL are the same number. Above 20 000 is seen (e.g. haemophagocytic syndromes) but is far more often a typing error. */
const ferritin = { possible: nonNegative(500000), plausible: { min: 1, max: 20000 }, decimals: 0 } as const;
export const ferritinBounds = {
  'ug/L': { unit: 'ug/L', ...ferritin },
  'ng/mL': { unit: 'ng/mL', ...ferritin },
} as const satisfies Record<string, Bounds>;

/**
 * Liver iron concentration. mg/g dry: normal below about 1.8, MRI methods lose
 * accuracy above about 40 (references.md §2). µmol/g = mg/g × 17.907 (1000 / Ar(Fe) 55.845);
 * µg/g = mg/g × 1000.
 */
export const liverIronBounds = {
  'mg/g{dry}': { unit: 'mg/g{dry}', possible: nonNegative(100), plausible: { min: 0.2, max: 50 }, decimals: 1 },
  'umol/g{dry}': { unit: 'umol/g{dry}', possible: nonNegative(1800), plausible: { min: 3.5, max: 900 }, decimals: 1 },
  'ug/g{dry}': { unit: 'ug/g{dry}', possible: nonNegative(100000), plausible: { min: 200, max: 50000 }, decimals: 0 },
} as const satisfies Record<string, Bounds>;
/** Liver R2*, s⁻¹: normal liver about 30–70 at 1.5 T and about twice that at 3 T; severe overload above 1000. */
export const liverR2StarBounds = { 's-1': { unit: 's-1', possible: positive(3000), plausible: { min: 15, max: 2000 }, decimals: 0 } } as const satisfies Record<string, Bounds>;
/** Liver R2, s⁻¹ (spin echo): normal about 10–20, heavy overload up to about 300. */
export const liverR2Bounds = { 's-1': { unit: 's-1', possible: positive(1000), plausible: { min: 5, max: 400 }, decimals: 0 } } as const satisfies Record<string, Bounds>;
/** Liver T2*, ms (= 1000 / R2*): below 1 ms is at the limit of most sequences. */
export const liverT2StarBounds = { ms: { unit: 'ms', possible: positive(200), plausible: { min: 0.5, max: 60 }, decimals: 1 } } as const satisfies Record<string, Bounds>;
/** Cardiac T2*, ms: about 20–50 in a heart without iron at 1.5 T; below 10 is severe loading. */
export const cardiacT2StarBounds = { ms: { unit: 'ms', possible: positive(200), plausible: { min: 2, max: 80 }, decimals: 0 } } as const satisfies Record<string, Bounds>;
/** Serum creatinine. µmol/L = mg/dL × 88.40 (molar mass 113.12 g/mol, core/units/concentration.ts). */
export const creatinineBounds = {
  'mg/dL': { unit: 'mg/dL', possible: positive(30), plausible: { min: 0.1, max: 10 }, decimals: 1 },
  'umol/L': { unit: 'umol/L', possible: positive(2700), plausible: { min: 8, max: 890 }, decimals: 0 },
} as const satisfies Record<string, Bounds>;
/** Alanine aminotransferase, U/L. */
export const altBounds = { 'U/L': { unit: 'U/L', possible: nonNegative(20000), plausible: { min: 3, max: 1000 }, decimals: 0 } } as const satisfies Record<string, Bounds>;
/** Absolute neutrophil count; ×10⁹/L and ×10³/µL are the same number. Zero is possible (agranulocytosis). */
const neutrophils = { possible: nonNegative(200), plausible: { min: 0, max: 30 }, decimals: 0 } as const;
export const neutrophilBounds = {
  '10*9/L': { unit: '10*9/L', ...neutrophils },
  '10*3/uL': { unit: '10*3/uL', ...neutrophils },
} as const satisfies Record<string, Bounds>;
/** Haemoglobin. g/L = g/dL × 10; mmol/L (per haem) = g/dL × 0.6206 (16 114.5 g/mol, core/units/concentration.ts). */
export const haemoglobinBounds = {
  'g/dL': { unit: 'g/dL', possible: positive(30), plausible: { min: 3, max: 20 }, decimals: 0 },
  'g/L': { unit: 'g/L', possible: positive(300), plausible: { min: 30, max: 200 }, decimals: 0 },
  'mmol/L': { unit: 'mmol/L', possible: positive(19), plausible: { min: 1.8, max: 12.5 }, decimals: 1 },
} as const satisfies Record<string, Bounds>;
/** Blood lead. µmol/L = µg/dL × 0.04826 (× 10 / Ar(Pb) 207.2). */
export const bloodLeadBounds = {
  'ug/dL': { unit: 'ug/dL', possible: nonNegative(1000), plausible: { min: 0, max: 200 }, decimals: 0 },
  'umol/L': { unit: 'umol/L', possible: nonNegative(49), plausible: { min: 0, max: 9.7 }, decimals: 1 },
} as const satisfies Record<string, Bounds>;
/** Urinary copper over 24 h. µmol = µg / 63.546 (Ar(Cu)); on chelation for Wilson disease it can reach a few thousand µg. */
export const urinaryCopperBounds = {
  'ug/(24.h)': { unit: 'ug/(24.h)', possible: nonNegative(20000), plausible: { min: 0, max: 5000 }, decimals: 0 },
  'umol/(24.h)': { unit: 'umol/(24.h)', possible: nonNegative(315), plausible: { min: 0, max: 79 }, decimals: 0 },
} as const satisfies Record<string, Bounds>;

/** Platelets; ×10⁹/L and ×10³/µL are the same number. Zero is possible. */
const platelets = { possible: nonNegative(5000), plausible: { min: 5, max: 1500 }, decimals: 0 } as const;
export const plateletBounds = {
  '10*9/L': { unit: '10*9/L', ...platelets },
  '10*3/uL': { unit: '10*3/uL', ...platelets },
} as const satisfies Record<string, Bounds>;
/** Aspartate aminotransferase, U/L (the same screen as ALT). */
export const astBounds = { 'U/L': { unit: 'U/L', possible: nonNegative(20000), plausible: { min: 3, max: 1000 }, decimals: 0 } } as const satisfies Record<string, Bounds>;
/** Total bilirubin. mg/dL = µmol/L ÷ 17.10 (molar mass 584.66 g/mol, from the CIAAW weights of C33H36N4O6). */
export const bilirubinBounds = {
  'umol/L': { unit: 'umol/L', possible: nonNegative(1500), plausible: { min: 1, max: 500 }, decimals: 0 },
  'mg/dL': { unit: 'mg/dL', possible: nonNegative(88), plausible: { min: 0.055, max: 30 }, decimals: 3 },
} as const satisfies Record<string, Bounds>;
/**
 * Urine protein-to-creatinine ratio. mg/mmol (UK reports) × 8.84 = mg/g (US
 * reports; creatinine 113.12 g/mol: 1 mmol = 0.11312 g), rounded outward. Nephrotic range is
 * above about 300 mg/mmol; the screen is wider.
 */
export const urineProteinCreatinineRatioBounds = {
  'mg/mmol': { unit: 'mg/mmol', possible: nonNegative(5000), plausible: { min: 0, max: 1000 }, decimals: 0 },
  'mg/g': { unit: 'mg/g', possible: nonNegative(45000), plausible: { min: 0, max: 8900 }, decimals: 0 },
} as const satisfies Record<string, Bounds>;
/** Serum or plasma zinc. µg/dL = µmol/L × 6.538 (Ar(Zn) 65.38, CIAAW). */
export const zincBounds = {
  'umol/L': { unit: 'umol/L', possible: nonNegative(200), plausible: { min: 3, max: 40 }, decimals: 1 },
  'ug/dL': { unit: 'ug/dL', possible: nonNegative(1400), plausible: { min: 19, max: 270 }, decimals: 0 },
} as const satisfies Record<string, Bounds>;

// ── Weight by age, and weight change ───────────────────────────────────────
/**
 * Weight plausible for an age: a screen for a weight typed with a dropped or
 * added digit (6.1 for 61 kg), not a growth assessment. Each band runs from
 * about half the 3rd to about twice the 97th percentile of the CDC 2000 growth
 * charts at the band's ends (percentile values from memory; the bands are a
 * modelling choice of ours, deliberately wide). Ages in completed years:
 * `fromYears` inclusive, `toYears` exclusive.
 */
export const weightForAgeBands = [
  { fromYears: 0, toYears: 1, minKg: 1.5, maxKg: 25 },
  { fromYears: 1, toYears: 5, minKg: 5, maxKg: 45 },
  { fromYears: 5, toYears: 10, minKg: 8, maxKg: 90 },
  { fromYears: 10, toYears: 15, minKg: 14, maxKg: 150 },
  { fromYears: 15, toYears: 18, minKg: 22, maxKg: 200 },
  { fromYears: 18, toYears: 130, minKg: 28, maxKg: 250 },
] as const;
/**
 * A change of weight of more than this share within 90 days is flagged (a
 * modelling choice of ours: a real loss of a fifth of body weight in three
 * months is rare and clinically notable either way; a digit typed wrongly
 * changes the weight tenfold).
 */
export const weightChangeWithin90Days = { share: 0.2, windowDays: 90 } as const;

// ── Chelation ──────────────────────────────────────────────────────────────
/**
 * Dose per administration, per drug. A wide screen around the labelled ranges
 * (deferoxamine 20–60 mg/kg/day; deferiprone 75, at most about 100, mg/kg/day in three doses;
 * deferasirox film-coated 7–28, dispersible 10–40 mg/kg/day; references.md §3),
 * widened for split doses and for children; the safety rules check the real ranges.
 */
function doseBounds(mgPerKg: { readonly min: number; readonly max: number }, mg: { readonly min: number; readonly max: number }) {
  return {
    'mg/kg': { unit: 'mg/kg', possible: positive(200), plausible: mgPerKg, decimals: 0 },
    mg: { unit: 'mg', possible: positive(20000), plausible: mg, decimals: 0 },
  } as const satisfies Record<string, Bounds>;
}
export const deferoxamineDoseBounds = doseBounds({ min: 10, max: 60 }, { min: 100, max: 6000 });
export const deferiproneDoseBounds = doseBounds({ min: 10, max: 35 }, { min: 250, max: 4000 });
export const deferasiroxDoseBounds = doseBounds({ min: 3, max: 40 }, { min: 90, max: 4000 });
/** Ascorbic acid with deferoxamine: commonly 2–3 mg/kg, at most 200 mg a day (references.md §3, secondary). */
export const ascorbicAcidDoseBounds = {
  mg: { unit: 'mg', possible: positive(5000), plausible: { min: 25, max: 250 }, decimals: 0 },
  'mg/kg': { unit: 'mg/kg', possible: positive(100), plausible: { min: 1, max: 5 }, decimals: 0 },
} as const satisfies Record<string, Bounds>;
/** A co-medication's dose per administration, any drug: only impossible values are refused; the drug's own ranges are the prescriber's. */
export const coMedicationDoseBounds = {
  mg: { unit: 'mg', possible: positive(100000), plausible: { min: 0.01, max: 20000 }, decimals: 2 },
  'mg/kg': { unit: 'mg/kg', possible: positive(1000), plausible: { min: 0.001, max: 200 }, decimals: 3 },
  g: { unit: 'g', possible: positive(100), plausible: { min: 0.001, max: 20 }, decimals: 3 },
} as const satisfies Record<string, Bounds>;
/** A dispensing: tablets, vials or sachets counted ('{each}'), or mL of an oral solution. */
export const dispensedQuantityBounds = {
  '{each}': { unit: '{each}', possible: positive(10000), plausible: { min: 1, max: 1000 }, decimals: 0 },
  mL: { unit: 'mL', possible: positive(50000), plausible: { min: 10, max: 10000 }, decimals: 0 },
} as const satisfies Record<string, Bounds>;
/** Days of supply of one dispensing: a few days up to the longest usual supply (about 3 months; common practice). */
export const daysSuppliedBounds = { unit: 'd', possible: { min: 1, max: 366 }, plausible: { min: 1, max: 100 }, decimals: 0, integer: true } as const satisfies Bounds;
export const administrationsPerDayBounds = { unit: '1', possible: { min: 1, max: 6 }, plausible: { min: 1, max: 3 }, decimals: 0, integer: true } as const satisfies Bounds;
export const daysPerWeekBounds = { unit: '1', possible: { min: 1, max: 7 }, plausible: { min: 1, max: 7 }, decimals: 0, integer: true } as const satisfies Bounds;
/** Infusion length: subcutaneous deferoxamine usually 8–12 h; continuous intravenous 24 h. */
export const infusionHoursBounds = { unit: 'h', possible: positive(24), plausible: { min: 4, max: 24 }, decimals: 0 } as const satisfies Bounds;
/** Estimated adherence, a fraction of prescribed doses taken. */
export const adherenceBounds = { unit: '1', possible: nonNegative(1), plausible: { min: 0.2, max: 1 }, decimals: 2, fraction: true } as const satisfies Bounds;

/** Every Bounds in this module with a name, for tests and documentation. */
export const allQuantityBounds = {
  weightBounds: { kg: weightBounds },
  heightBounds: { cm: heightBounds },
  ferritinBounds,
  liverIronBounds,
  liverR2StarBounds,
  liverR2Bounds,
  liverT2StarBounds,
  cardiacT2StarBounds,
  creatinineBounds,
  altBounds,
  neutrophilBounds,
  haemoglobinBounds,
  bloodLeadBounds,
  urinaryCopperBounds,
  plateletBounds,
  astBounds,
  bilirubinBounds,
  urineProteinCreatinineRatioBounds,
  zincBounds,
  coMedicationDoseBounds,
  dispensedQuantityBounds,
  deferoxamineDoseBounds,
  deferiproneDoseBounds,
  deferasiroxDoseBounds,
  ascorbicAcidDoseBounds,
} as const;

// ── Quantities the calculators read that a case file holds per entry ────────
/**
 * Daily chelator dose, mg/kg/day on a dosing day: the case model accepts a dose per
 * administration up to 200 mg/kg and up to 6 administrations a day, so a review can
 * meet up to 1,200 mg/kg/day; the plausible range spans the labelled ranges of
 * deferoxamine (20–60), deferiprone (75–100) and deferasirox (7–40) with room for
 * split doses (references.md §3). Above it the safety rules' dose findings apply.
 */
export const dailyDoseBounds = { unit: 'mg/kg/d', possible: positive(1200), plausible: { min: 0.5, max: 150 }, decimals: 1 } as const satisfies Bounds;
