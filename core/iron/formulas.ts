import { inputRange, weightBounds } from '../ranges';
import { defineFormula, type AnyFormula } from '../formulas/types';
import { issue } from '../result';
import {
  licMgPerGDryFromMgPerGWet,
  licMgPerGDryFromUmolPerGDry,
  licMgPerGWetFromMgPerGDry,
  licUmolPerGDryFromMgPerGDry,
} from '../units/liverIron';
import {
  days,
  fraction,
  gPerDl,
  kg,
  mg,
  mgPerGDry,
  mgPerKg,
  mgPerKgPerDay,
  mgPerMl,
  ml,
  msec,
  perSecond,
  tesla,
  ugPerL,
  type MgPerGWet,
  type MlPerKgPerYear,
  type UmolPerGDry,
} from '../units/quantity';
import { dailyIronLoadingMgPerKgPerDay } from './annualIronLoading';
import { angelucciSlopeMgPerKgPerMgPerGDry as angelucci, bodyIronMgFromLic, bodyIronMgPerKgFromLic, licFromBodyIronMgPerKg } from './bodyIron';
import { cardiacT2StarBand, cardiacT2StarBandsText } from './cardiacT2StarBand';
import { exchangeIronRemovedMg } from './exchangeIronRemoved';
import { ferritinBand, ferritinBandsText } from './ferritinBand';
import { intakeBand, intakeBandsBarred, intakeBandsText } from './intakeBand';
import { daysPerYear } from '../units/time';
import { ironIntakeRateMgPerKgPerDay } from './ironIntakeRate';
import { ironPerGramHaemoglobinMg, ironPerMlRedCellsFromMchc } from './ironPerMlFromMchc';
import { licBand, licBandsText } from './licBand';
import { licChangeMgPerGDry } from './licChange';
import { licFromR2Star } from './licFromR2Star';
import { exactlyOneInput } from './oneOfInputs';
import { r2StarCalibration, r2StarCalibrationIds } from './r2StarCalibrations';
import { r2StarPerSFromT2StarMs, t2StarMsFromR2StarPerS } from './r2StarT2Star';
import { transfusionIronMg } from './transfusionIron';
import { transfusionVolumeForHbRiseMl } from './transfusionVolume';

/** Shared spec of the published assumption 'iron-per-ml-red-cells'. */
export const ironPerMlRedCellsInput = {
  kind: 'number',
  label: 'iron per mL of pure red cells',
  unit: 'mg/mL',
  min: 0.9,
  max: 1.25,
  assumption: 'iron-per-ml-red-cells',
  meaning: 'mg of iron in 1 mL of pure red cells (1.08 default; 1.16 in some guidelines)',
} as const;

// Weight takes the case model's ranges (core/ranges): a review never meets a weight `check` accepts and this refuses.
const weightInput = { kind: 'number', label: 'body weight', ...inputRange(weightBounds), meaning: 'body weight' } as const;

/** Text output when an optional input of a band calculator was not given. */
const notGiven = 'not given';

export const transfusionIron = defineFormula({
  id: 'transfusion-iron',
  title: 'Iron brought in by a transfusion',
  expression: 'iron (mg) = volume (mL) × unit haematocrit × iron per mL of pure red cells (mg/mL)',
  sourceIds: ['cohen-2008', 'iron-per-hb-derived'],
  notes: ['For a red-cell exchange or a venesection, the calculator exchange-iron-removed gives the iron taken out.'],
  inputs: {
    volumeMl: { kind: 'number', label: 'volume transfused', unit: 'mL', min: 1, max: 10000, meaning: 'volume of red-cell product transfused' },
    unitHaematocrit: { kind: 'number', label: 'unit haematocrit', unit: '1', min: 0.4, max: 0.85, meaning: 'haematocrit of the unit as a fraction (packed cells about 0.55–0.65)' },
    ironPerMlRedCellsMg: ironPerMlRedCellsInput,
  },
  outputs: {
    ironMg: { label: 'iron', unit: 'mg', meaning: 'iron in the transfused red cells', decimals: 1 },
  },
  compute: ({ volumeMl, unitHaematocrit, ironPerMlRedCellsMg }) => ({
    ironMg: transfusionIronMg(ml(volumeMl), fraction(unitHaematocrit), mgPerMl(ironPerMlRedCellsMg)),
  }),
});

export const exchangeIronRemoved = defineFormula({
  id: 'exchange-iron-removed',
  title: 'Iron taken out by a red-cell exchange or a venesection',
  expression:
    'iron removed (mg) = volume removed (mL) × patient haematocrit × iron per mL of pure red cells; net (mg) = iron transfused − iron removed',
  sourceIds: ['cohen-2008', 'iron-per-hb-derived', 'common-practice'],
  notes: [
    'The haematocrit of the removed blood drifts during an automated exchange; the pre-procedure value makes the result an approximation.',
    'For a venesection leave the donor volume out: the iron transfused is then 0.',
  ],
  inputs: {
    volumeRemovedMl: { kind: 'number', label: 'volume removed', unit: 'mL', min: 1, max: 10000, meaning: "volume of the patient's blood removed" },
    patientHaematocrit: {
      kind: 'number',
      label: 'patient haematocrit',
      unit: '1',
      min: 0.15,
      max: 0.65,
      meaning: "the patient's haematocrit as a fraction (before the procedure)",
    },
    donorVolumeMl: {
      kind: 'number',
      label: 'donor red-cell volume transfused',
      unit: 'mL',
      min: 0,
      max: 10000,
      optional: true,
      meaning: 'volume of donor red-cell product given during the exchange (leave out for a venesection)',
    },
    unitHaematocrit: {
      kind: 'number',
      label: 'unit haematocrit',
      unit: '1',
      min: 0.4,
      max: 0.85,
      default: 0.6,
      meaning: 'haematocrit of the donor product as a fraction (0.6 when not given: common practice for packed cells)',
    },
    ironPerMlRedCellsMg: ironPerMlRedCellsInput,
  },
  outputs: {
    ironRemovedMg: { label: 'iron removed', unit: 'mg', meaning: 'iron in the red cells of the removed blood', decimals: 1 },
    ironTransfusedMg: { label: 'iron transfused', unit: 'mg', meaning: 'iron in the donor red cells given (0 for a venesection)', decimals: 1 },
    netIronMg: { label: 'net iron', unit: 'mg', meaning: 'iron transfused minus iron removed (negative: the procedure took iron out)', decimals: 1 },
  },
  compute: ({ volumeRemovedMl, patientHaematocrit, donorVolumeMl, unitHaematocrit, ironPerMlRedCellsMg }) => {
    const ironPerMl = mgPerMl(ironPerMlRedCellsMg);
    const ironRemovedMg = exchangeIronRemovedMg(ml(volumeRemovedMl), fraction(patientHaematocrit), ironPerMl);
    const ironTransfusedMg = donorVolumeMl === undefined ? 0 : transfusionIronMg(ml(donorVolumeMl), fraction(unitHaematocrit), ironPerMl);
    return { ironRemovedMg, ironTransfusedMg, netIronMg: ironTransfusedMg - ironRemovedMg };
  },
});

export const ironPerMlFromMchc = defineFormula({
  id: 'iron-per-ml-from-mchc',
  title: 'Iron per mL of pure red cells from the MCHC',
  expression: 'iron (mg/mL) = MCHC (g/dL) × 10 × (4 × Ar(Fe) / 64 458 × 1000 = 3.466 mg Fe/g Hb) ÷ 1000',
  sourceIds: ['iron-per-hb-derived', 'ciaaw-2021'],
  notes: ['The result can replace the assumption iron-per-ml-red-cells (1.08 mg/mL corresponds to an MCHC of about 31 g/dL).'],
  inputs: {
    mchcGPerDl: { kind: 'number', label: 'MCHC', unit: 'g/dL', min: 25, max: 40, meaning: 'mean corpuscular haemoglobin concentration of the red cells' },
  },
  outputs: {
    ironPerMlRedCellsMg: { label: 'iron per mL of pure red cells', unit: 'mg/mL', meaning: 'iron in 1 mL of pure red cells', decimals: 3 },
    ironPerGramHaemoglobinMg: { label: 'iron per gram of haemoglobin', unit: 'mg/g', meaning: '4 × Ar(Fe) per haemoglobin tetramer (64 458 g/mol)', decimals: 4 },
  },
  compute: ({ mchcGPerDl }) => ({
    ironPerMlRedCellsMg: ironPerMlRedCellsFromMchc(gPerDl(mchcGPerDl)),
    ironPerGramHaemoglobinMg: ironPerGramHaemoglobinMg,
  }),
});

export const ironIntakeRate = defineFormula({
  id: 'iron-intake-rate',
  title: 'Iron intake per kg per day over a window',
  expression: `intake (mg/kg/day) = total iron (mg) ÷ weight (kg) ÷ window (days); band ${intakeBandsText}`,
  sourceIds: ['brittenham-2011', 'hoffbrand-2012'],
  notes: ['For the trailing year before a review use a window of 365 days (366 across 29 February).'],
  inputs: {
    totalIronMg: { kind: 'number', label: 'total iron', unit: 'mg', min: 0, max: 200000, meaning: 'iron brought in over the window (sum of transfusions)' },
    weightKg: weightInput,
    windowDays: { kind: 'number', label: 'window', unit: 'd', min: 1, max: 3660, meaning: 'length of the window in days' },
  },
  outputs: {
    intakeMgPerKgPerDay: { label: 'iron intake', unit: 'mg/kg/d', meaning: 'iron brought in per kg of body weight per day', decimals: 3 },
    intakeBand: { label: 'intake band', unit: '', kind: 'text', meaning: 'Brittenham 2011 Table 2 band' },
  },
  compute: ({ totalIronMg, weightKg, windowDays }) => {
    const intake = ironIntakeRateMgPerKgPerDay(mg(totalIronMg), kg(weightKg), days(windowDays));
    return { intakeMgPerKgPerDay: intake, intakeBand: intakeBand(intake).label };
  },
});

export const annualIronLoading = defineFormula({
  id: 'annual-iron-loading',
  title: 'Daily iron loading from the yearly volume of red cells transfused',
  expression: `loading (mg/kg/day) = pure red cells (mL/kg/yr) × iron per mL of pure red cells (mg/mL) ÷ ${daysPerYear}`,
  sourceIds: ['hoffbrand-2012', 'brittenham-2011', 'cohen-2008'],
  notes: ['Pure red-cell volume = volume transfused × unit haematocrit. 2–4 units a month is about 0.3–0.6 mg/kg/day (Hoffbrand 2012).'],
  inputs: {
    annualRedCellMlPerKgPerYear: {
      kind: 'number',
      label: 'pure red cells transfused per year',
      unit: 'mL/kg/a',
      min: 0,
      max: 400,
      meaning: 'volume of pure red cells transfused in a year per kg of body weight',
    },
    ironPerMlRedCellsMg: ironPerMlRedCellsInput,
  },
  outputs: {
    loadingMgPerKgPerDay: { label: 'iron loading', unit: 'mg/kg/d', meaning: 'transfusional iron per kg of body weight per day', decimals: 3 },
    intakeBand: { label: 'intake band', unit: '', kind: 'text', meaning: 'Brittenham 2011 Table 2 band' },
  },
  compute: ({ annualRedCellMlPerKgPerYear, ironPerMlRedCellsMg }) => {
    const loading = dailyIronLoadingMgPerKgPerDay(annualRedCellMlPerKgPerYear as MlPerKgPerYear, mgPerMl(ironPerMlRedCellsMg));
    return { loadingMgPerKgPerDay: loading, intakeBand: intakeBand(loading).label };
  },
});

export const transfusionVolume = defineFormula({
  id: 'transfusion-volume',
  title: 'Volume of red cells for a haemoglobin rise (Davies formula)',
  expression: 'volume (mL) = weight (kg) × haemoglobin rise (g/dL) × 3 ÷ unit haematocrit',
  sourceIds: ['davies-2007'],
  notes: [
    'Derived in children without bleeding, haemolysis or large fluid infusions.',
    'An estimate for review by the prescriber; follow local protocols for volumes and rates.',
  ],
  inputs: {
    weightKg: weightInput,
    haemoglobinRiseGPerDl: { kind: 'number', label: 'haemoglobin rise', unit: 'g/dL', min: 0.1, max: 10, meaning: 'desired haemoglobin minus current haemoglobin' },
    unitHaematocrit: { kind: 'number', label: 'unit haematocrit', unit: '1', min: 0.4, max: 0.85, meaning: 'haematocrit of the unit as a fraction (about 0.6 in the study)' },
  },
  outputs: {
    volumeMl: { label: 'volume', unit: 'mL', meaning: 'volume of the red-cell product', decimals: 0 },
    volumeMlPerKg: { label: 'volume per kg', unit: 'mL/kg', meaning: 'the same volume per kg of body weight', decimals: 1 },
  },
  compute: ({ weightKg, haemoglobinRiseGPerDl, unitHaematocrit }) => {
    const volumeMl = transfusionVolumeForHbRiseMl(kg(weightKg), gPerDl(haemoglobinRiseGPerDl), fraction(unitHaematocrit));
    return { volumeMl, volumeMlPerKg: volumeMl / weightKg };
  },
});

const licInput = {
  kind: 'number',
  label: 'liver iron concentration',
  unit: 'mg/g{dry}',
  min: 0,
  max: 60,
  meaning: 'liver iron concentration, mg Fe per g dry liver',
} as const;

const angelucciNotes = [
  'Derived in non-cirrhotic thalassaemia major; reliable to about 250 mg/kg of body iron (LIC about 24 mg/g dry).',
] as const;

export const bodyIron = defineFormula({
  id: 'body-iron',
  title: 'Body iron stores from liver iron (Angelucci relation)',
  expression: `body iron stores (mg/kg) = ${angelucci} × LIC (mg/g dry); total (mg) = mg/kg × weight (kg)`,
  sourceIds: ['angelucci-2000'],
  notes: angelucciNotes,
  inputs: { licMgPerGDry: licInput, weightKg: weightInput },
  outputs: {
    bodyIronMgPerKg: { label: 'body iron stores', unit: 'mg/kg', meaning: 'body iron stores per kg of body weight', decimals: 1 },
    bodyIronMg: { label: 'total body iron stores', unit: 'mg', meaning: 'body iron stores for this weight', decimals: 0 },
  },
  compute: ({ licMgPerGDry, weightKg }) => ({
    bodyIronMgPerKg: bodyIronMgPerKgFromLic(mgPerGDry(licMgPerGDry)),
    bodyIronMg: bodyIronMgFromLic(mgPerGDry(licMgPerGDry), kg(weightKg)),
  }),
});

export const licFromBodyIron = defineFormula({
  id: 'lic-from-body-iron',
  title: 'Liver iron from body iron stores (Angelucci relation, inverted)',
  expression: `LIC (mg/g dry) = body iron stores (mg/kg) ÷ ${angelucci}`,
  sourceIds: ['angelucci-2000'],
  notes: angelucciNotes,
  inputs: {
    bodyIronMgPerKg: { kind: 'number', label: 'body iron stores', unit: 'mg/kg', min: 0, max: 650, meaning: 'body iron stores per kg of body weight' },
  },
  outputs: {
    licMgPerGDry: { label: 'liver iron concentration', unit: 'mg/g{dry}', meaning: 'liver iron concentration, mg Fe per g dry liver', decimals: 2 },
  },
  compute: ({ bodyIronMgPerKg }) => ({ licMgPerGDry: licFromBodyIronMgPerKg(mgPerKg(bodyIronMgPerKg)) }),
});

export const licChange = defineFormula({
  id: 'lic-change',
  title: 'Change of liver iron from a net iron balance',
  expression: `net (mg/kg) = net balance (mg/kg/day) × days; ΔLIC (mg/g dry) = net (mg/kg) ÷ ${angelucci}`,
  sourceIds: ['angelucci-2000'],
  notes: [
    'Net balance = iron in (transfusions) minus iron out (chelation, venesection, basal loss); positive raises the LIC.',
    'Linear: near normal iron the excretion of a chelator falls and the projection no longer holds.',
  ],
  inputs: {
    netIronMgPerKgPerDay: { kind: 'number', label: 'net iron balance', unit: 'mg/kg/d', min: -3, max: 3, meaning: 'iron in minus iron out per kg per day' },
    periodDays: { kind: 'number', label: 'period', unit: 'd', min: 1, max: 3660, meaning: 'length of the period in days' },
  },
  outputs: {
    netIronMgPerKg: { label: 'net iron over the period', unit: 'mg/kg', meaning: 'net balance × days', decimals: 1 },
    licChangeMgPerGDry: { label: 'change of liver iron', unit: 'mg/g{dry}', meaning: 'signed change of LIC over the period', decimals: 2 },
  },
  compute: ({ netIronMgPerKgPerDay, periodDays }) => {
    const netIronMgPerKg = mgPerKg(netIronMgPerKgPerDay * periodDays);
    return { netIronMgPerKg, licChangeMgPerGDry: licChangeMgPerGDry(netIronMgPerKg) };
  },
});

export const licUnits = defineFormula({
  id: 'lic-units',
  title: 'Liver iron in mg/g dry, µmol/g dry and mg/g wet',
  expression: 'µmol/g dry = mg/g dry × 1000 ÷ Ar(Fe); mg/g wet = mg/g dry ÷ dry-to-wet factor',
  sourceIds: ['ciaaw-2021', 'fischer-harmatz-2009'],
  notes: ['Give exactly one of the three values.'],
  inputs: {
    licMgPerGDry: { ...licInput, optional: true },
    licUmolPerGDry: {
      kind: 'number',
      label: 'liver iron concentration (µmol/g dry)',
      unit: 'umol/g{dry}',
      min: 0,
      max: 1100,
      optional: true,
      meaning: 'liver iron concentration, µmol Fe per g dry liver',
    },
    licMgPerGWet: {
      kind: 'number',
      label: 'liver iron concentration (mg/g wet)',
      unit: 'mg/g{wet}',
      min: 0,
      max: 20,
      optional: true,
      meaning: 'liver iron concentration, mg Fe per g wet liver',
    },
    dryToWetRatio: {
      kind: 'number',
      label: 'dry-to-wet factor',
      unit: '1',
      min: 2.5,
      max: 4.5,
      assumption: 'liver-dry-to-wet-ratio',
      meaning: 'mg/g dry ÷ this factor = mg/g wet (3.33: about 70 % water)',
    },
  },
  outputs: {
    licMgPerGDry: { label: 'LIC, mg/g dry', unit: 'mg/g{dry}', meaning: 'mg Fe per g dry liver', decimals: 2 },
    licUmolPerGDry: { label: 'LIC, µmol/g dry', unit: 'umol/g{dry}', meaning: 'µmol Fe per g dry liver', decimals: 1 },
    licMgPerGWet: { label: 'LIC, mg/g wet', unit: 'mg/g{wet}', meaning: 'mg Fe per g wet liver', decimals: 2 },
  },
  compute: (inputs) => {
    const missing = exactlyOneInput(inputs, {
      licMgPerGDry: 'LIC in mg/g dry',
      licUmolPerGDry: 'LIC in µmol/g dry',
      licMgPerGWet: 'LIC in mg/g wet',
    });
    if (missing) return { refused: [missing] };
    const { licMgPerGDry, licUmolPerGDry, licMgPerGWet, dryToWetRatio } = inputs;
    const dry =
      licMgPerGDry !== undefined
        ? mgPerGDry(licMgPerGDry)
        : licUmolPerGDry !== undefined
          ? licMgPerGDryFromUmolPerGDry(licUmolPerGDry as UmolPerGDry)
          : licMgPerGDryFromMgPerGWet(licMgPerGWet as MgPerGWet, dryToWetRatio);
    return {
      licMgPerGDry: dry,
      licUmolPerGDry: licUmolPerGDryFromMgPerGDry(dry),
      licMgPerGWet: licMgPerGWetFromMgPerGDry(dry, dryToWetRatio),
    };
  },
});

const r2StarInput = {
  kind: 'number',
  label: 'R2*',
  unit: 's-1',
  min: 10,
  max: 2000,
  optional: true,
  meaning: 'transverse relaxation rate R2*, per second',
} as const;
const t2StarInput = {
  kind: 'number',
  label: 'T2*',
  unit: 'ms',
  min: 0.5,
  max: 100,
  optional: true,
  meaning: 'transverse relaxation time T2*, milliseconds',
} as const;

export const r2StarT2Star = defineFormula({
  id: 'r2star-t2star',
  title: 'R2* and T2*',
  expression: 'R2* (s⁻¹) = 1000 ÷ T2* (ms)',
  sourceIds: ['definition'],
  notes: ['Give exactly one of the two.'],
  inputs: { r2StarPerS: r2StarInput, t2StarMs: t2StarInput },
  outputs: {
    r2StarPerS: { label: 'R2*', unit: 's-1', meaning: 'relaxation rate', decimals: 1 },
    t2StarMs: { label: 'T2*', unit: 'ms', meaning: 'relaxation time', decimals: 2 },
  },
  compute: (inputs) => {
    const missing = exactlyOneInput(inputs, { r2StarPerS: 'R2* (s-1)', t2StarMs: 'T2* (ms)' });
    if (missing) return { refused: [missing] };
    const r2Star = inputs.r2StarPerS !== undefined ? perSecond(inputs.r2StarPerS) : r2StarPerSFromT2StarMs(msec(inputs.t2StarMs!));
    return { r2StarPerS: r2Star, t2StarMs: t2StarMsFromR2StarPerS(r2Star) };
  },
});

export const licFromR2StarFormula = defineFormula({
  id: 'lic-from-r2star',
  title: 'Liver iron from liver R2* through a named calibration',
  expression: 'LIC (mg/g dry) = intercept + slope × R2* (s⁻¹), coefficients and field strength of the chosen calibration',
  sourceIds: ['hernando-2022', 'wood-2005', 'henninger-2015', 'definition'],
  notes: [
    'A calibration applies only at the field strength it was derived at; a result from another field strength is refused.',
    'Give liver R2* or liver T2* (R2* = 1000 ÷ T2*).',
  ],
  inputs: {
    r2StarPerS: { ...r2StarInput, label: 'liver R2*' },
    t2StarMs: { ...t2StarInput, label: 'liver T2*' },
    scanFieldStrengthTesla: {
      kind: 'choice',
      label: 'field strength of the scan (T)',
      choices: ['1.5', '3'],
      meaning: 'field strength of the MRI scanner that measured R2* (3 covers 2.89 T and 3.0 T)',
    },
    calibration: {
      kind: 'choice',
      label: 'calibration',
      choices: r2StarCalibrationIds,
      meaning: 'published R2*-to-LIC calibration; it must match the field strength of the scan',
    },
  },
  outputs: {
    licMgPerGDry: { label: 'liver iron concentration', unit: 'mg/g{dry}', meaning: 'mg Fe per g dry liver', decimals: 2 },
    r2StarPerS: { label: 'liver R2*', unit: 's-1', meaning: 'R2* used (from T2* if T2* was given)', decimals: 1 },
    licBand: { label: 'LIC band', unit: '', kind: 'text', meaning: 'band of the result (Brittenham 2011; Olivieri & Brittenham 1997)' },
    calibrationUsed: { label: 'calibration', unit: '', kind: 'text', meaning: 'the calibration, its field strength and its caution' },
  },
  compute: (inputs) => {
    const missing = exactlyOneInput(inputs, { r2StarPerS: 'liver R2* (s-1)', t2StarMs: 'liver T2* (ms)' });
    if (missing) return { refused: [missing] };
    const r2Star = inputs.r2StarPerS !== undefined ? perSecond(inputs.r2StarPerS) : r2StarPerSFromT2StarMs(msec(inputs.t2StarMs!));
    const calibration = r2StarCalibration(inputs.calibration);
    const lic = licFromR2Star(r2Star, tesla(Number(inputs.scanFieldStrengthTesla)), calibration);
    if (!lic.ok) return { refused: lic.issues };
    const caution = calibration.caution ? ` ${calibration.caution}` : '';
    return {
      licMgPerGDry: lic.value,
      r2StarPerS: r2Star,
      licBand: licBand(lic.value).label,
      calibrationUsed: `${calibration.label}.${caution}`,
    };
  },
});

export const ironBands = defineFormula({
  id: 'iron-bands',
  title: 'Bands of iron intake, liver iron, cardiac T2* and ferritin',
  // Built from the bands' own edges, so the text cannot drift from what the bands compute.
  expression: `intake ${intakeBandsBarred} mg/kg/day; LIC ${licBandsText} mg/g dry; cardiac T2* ${cardiacT2StarBandsText} ms; ferritin ${ferritinBandsText} µg/L`,
  sourceIds: ['brittenham-2011', 'olivieri-brittenham-1997', 'anderson-2001', 'kirk-2009', 'ferritin-guideline-literature'],
  notes: ['Give any of the four values. Ferritin is a surrogate of body iron, and a poor one in sickle cell disease.'],
  inputs: {
    intakeMgPerKgPerDay: { kind: 'number', label: 'iron intake', unit: 'mg/kg/d', min: 0, max: 3, optional: true, meaning: 'transfusional iron intake' },
    licMgPerGDry: { ...licInput, optional: true },
    cardiacT2StarMs: { kind: 'number', label: 'cardiac T2*', unit: 'ms', min: 1, max: 100, optional: true, meaning: 'myocardial T2* at 1.5 T' },
    ferritinUgPerL: { kind: 'number', label: 'serum ferritin', unit: 'ug/L', min: 0, max: 50000, optional: true, meaning: 'serum ferritin (µg/L = ng/mL)' },
    diagnosisGroup: {
      kind: 'choice',
      label: 'diagnosis group',
      choices: ['thalassaemia', 'sickle-cell-disease', 'other'],
      default: 'other',
      meaning: 'sickle-cell-disease adds the caution that ferritin is a poor marker there',
    },
  },
  outputs: {
    intakeBand: { label: 'intake band', unit: '', kind: 'text', meaning: 'Brittenham 2011 Table 2' },
    licBand: { label: 'LIC band', unit: '', kind: 'text', meaning: 'Olivieri & Brittenham 1997; Brittenham 2011 Table 2' },
    cardiacT2StarBand: { label: 'cardiac T2* band', unit: '', kind: 'text', meaning: 'Anderson 2001; Kirk 2009' },
    ferritinBand: { label: 'ferritin band', unit: '', kind: 'text', meaning: 'guideline literature (secondary), with its caution' },
  },
  compute: (inputs) => {
    const { intakeMgPerKgPerDay, licMgPerGDry, cardiacT2StarMs, ferritinUgPerL, diagnosisGroup } = inputs;
    if ([intakeMgPerKgPerDay, licMgPerGDry, cardiacT2StarMs, ferritinUgPerL].every((it) => it === undefined)) {
      return {
        refused: [
          issue(
            'required',
            ['intakeMgPerKgPerDay'],
            'Give at least one of: iron intake (mg/kg/d), liver iron concentration (mg/g dry), cardiac T2* (ms), serum ferritin (µg/L).',
          ),
        ],
      };
    }
    const ferritin =
      ferritinUgPerL === undefined ? undefined : ferritinBand(ugPerL(ferritinUgPerL), { sickleCellDisease: diagnosisGroup === 'sickle-cell-disease' });
    return {
      intakeBand: intakeMgPerKgPerDay === undefined ? notGiven : intakeBand(mgPerKgPerDay(intakeMgPerKgPerDay)).label,
      licBand: licMgPerGDry === undefined ? notGiven : licBand(mgPerGDry(licMgPerGDry)).label,
      cardiacT2StarBand: cardiacT2StarMs === undefined ? notGiven : cardiacT2StarBand(msec(cardiacT2StarMs)).label,
      ferritinBand: ferritin === undefined ? notGiven : `${ferritin.label}. ${ferritin.caution ?? ''}`.trim(),
    };
  },
});

/** Every iron formula, in the order `calc --list` shows them. */
export const ironFormulas: readonly AnyFormula[] = [
  transfusionIron,
  exchangeIronRemoved,
  ironPerMlFromMchc,
  ironIntakeRate,
  annualIronLoading,
  transfusionVolume,
  bodyIron,
  licFromBodyIron,
  licChange,
  licUnits,
  r2StarT2Star,
  licFromR2StarFormula,
  ironBands,
];
