import { defineFormula, isRefusal, type AnyFormula, type Refusal } from '../formulas/types';
import type { Result } from '../result';
import {
  creatinineMgPerDlFromEntry,
  creatinineUnitInput,
  serumCreatinineInput,
  type CreatinineUnit,
} from '../units/formulas';
import { cm, kg, years, type Centimetres, type Kilograms, type MgPerDl, type SquareMetres } from '../units/quantity';
import { heightBounds, inputRange, weightBounds } from '../ranges';
import { adultFromAgeYears, oldestAgeYears, schwartzFromAgeYears } from './ageRanges';
import { bsaDuBoisM2, bsaHaycockM2, bsaMostellerM2 } from './bodySurfaceArea';
import { egfrCkdEpi2021 } from './ckdEpi2021';
import { creatinineClearanceCockcroftGault } from './cockcroftGault';
import { egfrSchwartzBedside } from './schwartzBedside';
import { sexesAtBirth } from './sexAtBirth';

// ——— Shared input specs (one definition, so every calculator states the same ranges) ———

// Height and weight take the case model's ranges (core/ranges): a calculator accepts what `check` accepts.
const bsaHeightInput = { kind: 'number', label: 'height', ...inputRange(heightBounds), meaning: 'standing height (length lying down in infants), cm' } as const;

const bsaWeightInput = { kind: 'number', label: 'weight', ...inputRange(weightBounds), meaning: 'body weight, kg' } as const;

const bsaOutputs = {
  bsaM2: { label: 'body-surface area', unit: 'm2', meaning: 'estimated body-surface area', decimals: 2 },
} as const;

const ageInput = {
  kind: 'number',
  label: 'age',
  unit: 'a',
  min: 0,
  max: oldestAgeYears,
  meaning: 'age in years on the day of the creatinine sample (decimals allowed for children)',
} as const;

// The age ranges each renal equation was validated for, stated where `calc --list` reads them
// (the equations' own refusals use the same constants, core/patient/ageRanges.ts).
const adultAgeInput = { ...ageInput, min: adultFromAgeYears, outsideAdvice: '; for children use egfr-schwartz-bedside' } as const;
const childAgeInput = { ...ageInput, min: schwartzFromAgeYears, max: adultFromAgeYears, maxExclusive: true, outsideAdvice: '; from 18 years use egfr-ckd-epi-2021 or crcl-cockcroft-gault' } as const;

const sexAtBirthInput = {
  kind: 'choice',
  label: 'sex at birth',
  choices: sexesAtBirth,
  meaning: 'sex at birth, as the renal equations were fitted',
} as const;

const creatinineUsedOutput = {
  label: 'serum creatinine used',
  unit: 'mg/dL',
  meaning: 'the entered creatinine in mg/dL, as it enters the equation',
  decimals: 2,
} as const;

// ——— Body-surface area ———

/** The three BSA calculators differ only in their equation, source and notes. */
function bsaFormula(
  about: { id: string; title: string; expression: string; sourceIds: readonly string[]; notes: readonly string[] },
  bsaM2: (heightCm: Centimetres, weightKg: Kilograms) => SquareMetres,
) {
  return defineFormula({
    ...about,
    inputs: { heightCm: bsaHeightInput, weightKg: bsaWeightInput },
    outputs: bsaOutputs,
    compute: ({ heightCm, weightKg }) => ({ bsaM2: bsaM2(cm(heightCm), kg(weightKg)) }),
  });
}

export const bsaMosteller = bsaFormula(
  {
    id: 'bsa-mosteller',
    title: 'Body-surface area (Mosteller)',
    expression: 'BSA (m²) = √(height (cm) × weight (kg) / 3600)',
    sourceIds: ['mosteller-1987'],
    notes: ['An estimate from height and weight; courses dosed per m² state which formula they use.'],
  },
  bsaMostellerM2,
);

export const bsaDuBois = bsaFormula(
  {
    id: 'bsa-dubois',
    title: 'Body-surface area (Du Bois)',
    expression: 'BSA (m²) = 0.007184 × height (cm)^0.725 × weight (kg)^0.425',
    sourceIds: ['dubois-1916'],
    notes: [
      'Fitted to nine subjects; gives lower values than Mosteller in obesity (about 3–5 %, Verbraecken et al. 2006) and in infants.',
    ],
  },
  bsaDuBoisM2,
);

export const bsaHaycock = bsaFormula(
  {
    id: 'bsa-haycock',
    title: 'Body-surface area (Haycock)',
    expression: 'BSA (m²) = 0.024265 × height (cm)^0.3964 × weight (kg)^0.5378',
    sourceIds: ['haycock-1978'],
    notes: ['Validated in infants, children and adults.'],
  },
  bsaHaycockM2,
);

// ——— Renal function ———

const egfrOutputs = {
  egfrMlPerMinPer173M2: { label: 'eGFR', unit: 'mL/min/{1.73_m2}', meaning: 'estimated GFR per 1.73 m²', decimals: 0 },
  creatinineMgPerDl: creatinineUsedOutput,
} as const;

interface RenalEstimate {
  readonly estimate: number;
  readonly creatinineMgPerDl: number;
}

/** Read the entered creatinine, then run a renal equation on it; either step may refuse. */
function estimateFromCreatinine(
  value: number,
  unit: CreatinineUnit,
  estimate: (creatinineMgPerDl: MgPerDl) => Result<number>,
): RenalEstimate | Refusal {
  const creatinine = creatinineMgPerDlFromEntry(value, unit);
  if (!creatinine.ok) return { refused: creatinine.issues };
  const estimated = estimate(creatinine.value);
  if (!estimated.ok) return { refused: estimated.issues };
  return { estimate: estimated.value, creatinineMgPerDl: creatinine.value };
}

export const crclCockcroftGault = defineFormula({
  id: 'crcl-cockcroft-gault',
  title: 'Creatinine clearance (Cockcroft–Gault)',
  expression: 'CrCl (mL/min) = (140 − age) × weight (kg) / (72 × SCr (mg/dL)), × 0.85 if female',
  sourceIds: ['cockcroft-gault-1976'],
  notes: [
    'Adults only (18 years and over). Not normalised to body-surface area.',
    'Uses the weight entered; in obesity local protocols may use ideal or adjusted weight. Unreliable when creatinine is not stable, and in very low muscle mass.',
    'Results are for review by the prescriber; follow local protocols.',
  ],
  inputs: {
    ageYears: adultAgeInput,
    weightKg: { kind: 'number', label: 'weight', ...inputRange(weightBounds), meaning: 'body weight, kg (see notes on obesity)' },
    serumCreatinine: serumCreatinineInput,
    creatinineUnit: creatinineUnitInput,
    sexAtBirth: sexAtBirthInput,
  },
  outputs: {
    creatinineClearanceMlPerMin: { label: 'creatinine clearance', unit: 'mL/min', meaning: 'estimated creatinine clearance', decimals: 0 },
    creatinineMgPerDl: creatinineUsedOutput,
  },
  compute: ({ ageYears, weightKg, serumCreatinine, creatinineUnit, sexAtBirth }) => {
    const run = estimateFromCreatinine(serumCreatinine, creatinineUnit, (creatinineMgPerDl) =>
      creatinineClearanceCockcroftGault(years(ageYears), kg(weightKg), creatinineMgPerDl, sexAtBirth),
    );
    return isRefusal(run) ? run : { creatinineClearanceMlPerMin: run.estimate, creatinineMgPerDl: run.creatinineMgPerDl };
  },
});

export const egfrCkdEpi2021Formula = defineFormula({
  id: 'egfr-ckd-epi-2021',
  title: 'eGFR (CKD-EPI 2021 creatinine, race-free)',
  expression:
    'eGFR (mL/min/1.73 m²) = 142 × min(SCr/κ, 1)^α × max(SCr/κ, 1)^−1.200 × 0.9938^age × 1.012 [female]; κ 0.7 F / 0.9 M; α −0.241 F / −0.302 M',
  sourceIds: ['inker-2021'],
  notes: [
    'Adults only (18 years and over); for children the bedside Schwartz equation (egfr-schwartz-bedside).',
    'Needs an IDMS-traceable creatinine and a steady state; normalised to 1.73 m².',
    'Results are for review by the prescriber; follow local protocols.',
  ],
  inputs: {
    serumCreatinine: serumCreatinineInput,
    creatinineUnit: creatinineUnitInput,
    ageYears: adultAgeInput,
    sexAtBirth: sexAtBirthInput,
  },
  outputs: egfrOutputs,
  compute: ({ serumCreatinine, creatinineUnit, ageYears, sexAtBirth }) => {
    const run = estimateFromCreatinine(serumCreatinine, creatinineUnit, (creatinineMgPerDl) =>
      egfrCkdEpi2021(creatinineMgPerDl, years(ageYears), sexAtBirth),
    );
    return isRefusal(run) ? run : { egfrMlPerMinPer173M2: run.estimate, creatinineMgPerDl: run.creatinineMgPerDl };
  },
});

export const egfrSchwartzBedsideFormula = defineFormula({
  id: 'egfr-schwartz-bedside',
  title: 'eGFR in children (bedside Schwartz)',
  expression: 'eGFR (mL/min/1.73 m²) = 0.413 × height (cm) / SCr (mg/dL)',
  sourceIds: ['schwartz-2009'],
  notes: [
    'Children from 1 to under 18 years; derived in children with chronic kidney disease, with enzymatic IDMS-traceable creatinine.',
    'Results are for review by the prescriber; follow local protocols.',
  ],
  inputs: {
    heightCm: { kind: 'number', label: 'height', ...inputRange(heightBounds), meaning: 'height (length lying down under 2 years), cm' },
    serumCreatinine: serumCreatinineInput,
    creatinineUnit: creatinineUnitInput,
    ageYears: childAgeInput,
  },
  outputs: egfrOutputs,
  compute: ({ heightCm, serumCreatinine, creatinineUnit, ageYears }) => {
    const run = estimateFromCreatinine(serumCreatinine, creatinineUnit, (creatinineMgPerDl) =>
      egfrSchwartzBedside(cm(heightCm), creatinineMgPerDl, years(ageYears)),
    );
    return isRefusal(run) ? run : { egfrMlPerMinPer173M2: run.estimate, creatinineMgPerDl: run.creatinineMgPerDl };
  },
});

/** Every patient formula, in the order `calc --list` shows them. */
export const patientFormulas: readonly AnyFormula[] = [
  bsaMosteller,
  bsaDuBois,
  bsaHaycock,
  crclCockcroftGault,
  egfrCkdEpi2021Formula,
  egfrSchwartzBedsideFormula,
];
