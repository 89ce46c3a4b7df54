import { inputRange, liverIronBounds, weightBounds } from '../ranges';
import { defineFormula, type AnyFormula } from '../formulas/types';
import { ironPerMlRedCellsInput } from '../iron/formulas';
import { angelucciSlopeMgPerKgPerMgPerGDry } from '../iron/bodyIron';
import { daysPerYear } from '../units/time';
import { carriedForwardStores, measuredChelationMg, netIronBalanceMg, netTransfusionalIron } from './balance';
import { calibrationExcessMg, storesAfterDays } from './removalModel';

const lic = (label: string) =>
  ({ kind: 'number', label, ...inputRange(liverIronBounds['mg/g{dry}']), meaning: `${label}, mg Fe per g dry liver` }) as const;
const weight = (label: string) => ({ kind: 'number', label, ...inputRange(weightBounds), meaning: label }) as const;

export const netTransfusionalIronFormula = defineFormula({
  id: 'net-transfusional-iron',
  title: 'Iron in transfused red cells, net of iron in removed blood',
  expression: 'iron in (mg) = Σ volume × unit haematocrit × iron per mL of pure red cells; iron out = Σ volume removed × patient haematocrit × iron per mL; net = in − out',
  sourceIds: ['cohen-2008', 'iron-per-hb-derived'],
  notes: ['Exchange and venesection use the pre-procedure patient haematocrit, an approximation for an automated exchange.'],
  inputs: {
    redCellsInMl: { kind: 'number', label: 'pure red cells transfused', unit: 'mL', min: 0, max: 1000000, meaning: 'Σ volume × unit haematocrit' },
    redCellsOutMl: { kind: 'number', label: 'pure red cells removed', unit: 'mL', min: 0, max: 1000000, meaning: 'Σ volume removed × patient haematocrit' },
    ironPerMlRedCellsMg: ironPerMlRedCellsInput,
  },
  outputs: {
    ironInMg: { label: 'iron in', unit: 'mg', meaning: 'iron in transfused red cells', decimals: 0 },
    ironOutMg: { label: 'iron out with removed blood', unit: 'mg', meaning: 'iron in removed blood', decimals: 0 },
    netMg: { label: 'net transfusional iron', unit: 'mg', meaning: 'in − out', decimals: 0 },
  },
  compute: ({ redCellsInMl, redCellsOutMl, ironPerMlRedCellsMg }) => netTransfusionalIron(redCellsInMl, redCellsOutMl, ironPerMlRedCellsMg),
});

export const netIronBalance = defineFormula({
  id: 'net-iron-balance',
  title: 'Net iron balance over a period',
  expression: 'net (mg) = net transfusional iron − expected chelation removal − basal loss (mg/day) × days',
  sourceIds: ['hunt-2009'],
  inputs: {
    transfusionalNetMg: { kind: 'number', label: 'net transfusional iron', unit: 'mg', min: -1000000, max: 1000000, meaning: 'iron in transfused red cells minus iron in removed blood' },
    chelationRemovalMg: { kind: 'number', label: 'expected chelation removal', unit: 'mg', min: 0, max: 1000000, meaning: 'sum of the regimens’ expected removal over the period' },
    basalLossMgPerDay: { kind: 'number', label: 'basal loss', unit: 'mg/d', min: 0, max: 3, assumption: 'basal-iron-loss-mg-per-day', meaning: 'basal iron loss per day' },
    periodDays: { kind: 'number', label: 'period', unit: 'd', min: 0, max: 36600, meaning: 'days in the period' },
  },
  outputs: {
    netMg: { label: 'net iron balance', unit: 'mg', meaning: 'iron in minus iron out', decimals: 0 },
  },
  compute: ({ transfusionalNetMg, chelationRemovalMg, basalLossMgPerDay, periodDays }) => ({
    netMg: netIronBalanceMg(transfusionalNetMg, chelationRemovalMg, basalLossMgPerDay, periodDays),
  }),
});

export const bodyIronCarriedForward = defineFormula({
  id: 'body-iron-carried-forward',
  title: 'Body iron and LIC carried forward from the last measured LIC',
  expression: `stores (mg) = ${angelucciSlopeMgPerKgPerMgPerGDry} × LIC at the anchor × weight at the anchor + net balance since; LIC now = stores ÷ (${angelucciSlopeMgPerKgPerMgPerGDry} × weight now)`,
  sourceIds: ['angelucci-2000'],
  notes: ['The net balance is transfused iron minus iron in removed blood, expected chelation removal and basal loss since the measurement.'],
  inputs: {
    anchorLicMgPerGDry: lic('measured LIC at the anchor'),
    anchorWeightKg: weight('weight on the day of the measurement'),
    netSinceMg: { kind: 'number', label: 'net iron balance since the measurement', unit: 'mg', min: -100000, max: 100000, meaning: 'iron in minus iron out since the measurement' },
    weightNowKg: weight('weight now'),
  },
  outputs: {
    bodyIronMg: { label: 'estimated body iron stores', unit: 'mg', meaning: 'stores carried forward', decimals: 0 },
    licMgPerGDry: { label: 'estimated LIC', unit: 'mg/g{dry}', meaning: 'LIC estimate carried forward', decimals: 1 },
  },
  compute: ({ anchorLicMgPerGDry, anchorWeightKg, netSinceMg, weightNowKg }) =>
    carriedForwardStores(anchorLicMgPerGDry, anchorWeightKg, netSinceMg, weightNowKg),
});

export const measuredChelation = defineFormula({
  id: 'measured-chelation',
  title: 'Chelation removal achieved between two LIC results (balance method)',
  expression:
    'Δstores = 10.6 × (LIC₂ × weight₂ − LIC₁ × weight₁); removal (mg) = intake − Δstores − basal loss; per kg per day = removal ÷ mean weight ÷ days; ratio = removal ÷ expected removal',
  sourceIds: ['angelucci-2000', 'cohen-2008'],
  notes: ['Intervals under 180 days, a change of LIC method or of regimen inside the interval make the result uncertain; the ledger says which applies.'],
  inputs: {
    intakeMg: { kind: 'number', label: 'net transfusional intake in the interval', unit: 'mg', min: -100000, max: 200000, meaning: 'transfused iron minus iron in removed blood' },
    fromLicMgPerGDry: lic('first LIC'),
    toLicMgPerGDry: lic('second LIC'),
    fromWeightKg: weight('weight at the first LIC'),
    toWeightKg: weight('weight at the second LIC'),
    basalLossMg: { kind: 'number', label: 'basal loss in the interval', unit: 'mg', min: 0, max: 20000, meaning: 'basal iron loss over the interval' },
    intervalDays: { kind: 'number', label: 'interval', unit: 'd', min: 1, max: 7300, meaning: 'days between the two LIC results' },
    meanWeightKg: weight('mean weight over the interval'),
    expectedMg: { kind: 'number', label: 'expected chelation removal in the interval', unit: 'mg', min: 0, max: 200000, meaning: 'sum of the regimens’ expected removal' },
  },
  outputs: {
    storesChangeMg: { label: 'change of body iron stores', unit: 'mg', meaning: 'Angelucci relation at each date’s weight', decimals: 0 },
    measuredMg: { label: 'measured chelation removal', unit: 'mg', meaning: 'intake − Δstores − basal loss', decimals: 0 },
    measuredMgPerKgPerDay: { label: 'measured chelation removal', unit: 'mg/kg/d', meaning: 'per kg per day', decimals: 3 },
    expectedMgPerKgPerDay: { label: 'expected chelation removal', unit: 'mg/kg/d', meaning: 'per kg per day', decimals: 3 },
    measuredToExpected: { label: 'measured ÷ expected', unit: '1', meaning: 'share of the expected removal achieved (0 when none was expected)', decimals: 2 },
  },
  compute: (inputs) => {
    const balance = measuredChelationMg({
      intakeMg: inputs.intakeMg,
      fromLic: inputs.fromLicMgPerGDry,
      toLic: inputs.toLicMgPerGDry,
      fromWeightKg: inputs.fromWeightKg,
      toWeightKg: inputs.toWeightKg,
      basalLossMg: inputs.basalLossMg,
    });
    const perKgPerDay = (mg: number) => mg / inputs.meanWeightKg / inputs.intervalDays;
    return {
      storesChangeMg: balance.storesChangeMg,
      measuredMg: balance.chelationMg,
      measuredMgPerKgPerDay: perKgPerDay(balance.chelationMg),
      expectedMgPerKgPerDay: perKgPerDay(inputs.expectedMg),
      measuredToExpected: inputs.expectedMg > 0 ? balance.chelationMg / inputs.expectedMg : 0,
    };
  },
});

export const projectedLicFormula = defineFormula({
  id: 'projected-lic',
  title: 'Projected LIC: removal that falls as the chelatable iron falls (or held at today’s rate)',
  expression:
    'excess E = stores − floor LIC × 10.6 × weight; removal = R₀ × [(1 − s) + s × E ÷ E_cal]; dE/dt = intake − basal loss − removal (closed form); at the floor nothing more is removed; LIC = stores ÷ (10.6 × weight)',
  sourceIds: ['angelucci-2000', 'olivieri-brittenham-1997', 'projection-model-choice'],
  notes: [
    'Burden-dependent model (default): s = 1, removal proportional to the iron above the floor, calibrated so that on the review date it equals the expected (or measured) removal R₀; the LIC approaches an equilibrium instead of crossing zero.',
    'Constant-rate model (--model constant-rate): s = 0, today’s removal held until the floor.',
    'Under 18 the weight follows the patient’s own recent trend (bounded) until age 18; otherwise it is held.',
  ],
  inputs: {
    startBodyIronMg: { kind: 'number', label: 'body iron stores at the review date', unit: 'mg', min: 0, max: 100000, meaning: 'estimated stores at the start' },
    weightKg: weight('weight at the review date'),
    weightGainKgPerYear: { kind: 'number', label: 'weight gain while growing', unit: 'kg/a', min: 0, max: 10, meaning: 'the patient’s own recent trend, bounded; 0 for an adult' },
    growthDays: { kind: 'number', label: 'days the weight gain applies', unit: 'd', min: 0, max: 7000, meaning: 'days until age 18 (0 for an adult)' },
    daysAhead: { kind: 'number', label: 'days ahead', unit: 'd', min: 0, max: 3660, meaning: 'days from the review date' },
    intakeMgPerDay: { kind: 'number', label: 'future intake', unit: 'mg/d', min: -500, max: 500, meaning: 'transfusional iron net of blood removed, per day' },
    removalMgPerDay: { kind: 'number', label: 'chelation removal on the review date', unit: 'mg/d', min: 0, max: 500, meaning: 'expected (or measured) removal of the regimen, per day: the calibration point' },
    basalLossMgPerDay: { kind: 'number', label: 'basal loss', unit: 'mg/d', min: 0, max: 3, assumption: 'basal-iron-loss-mg-per-day', meaning: 'basal iron loss per day' },
    floorLicMgPerGDry: { kind: 'number', label: 'projection floor', unit: 'mg/g{dry}', min: 0, max: 7, assumption: 'projection-floor-lic-mg-per-g-dry', meaning: 'LIC at or below which no more iron is removed' },
    burdenShare: { kind: 'number', label: 'burden-proportional share of removal', unit: '1', min: 0, max: 1, assumption: 'projection-burden-share', meaning: '1 burden-dependent, 0 constant-rate' },
  },
  outputs: {
    licMgPerGDry: { label: 'projected LIC', unit: 'mg/g{dry}', meaning: 'central projection', decimals: 1 },
    equilibriumLicMgPerGDry: { label: 'equilibrium LIC of the model', unit: 'mg/g{dry}', meaning: 'where the burden-dependent projection levels off at constant weight (0 when the model has no equilibrium above the floor)', decimals: 1 },
  },
  compute: (inputs) => {
    const model = {
      startStoresMg: inputs.startBodyIronMg,
      startWeightKg: inputs.weightKg,
      weightGainKgPerDay: inputs.weightGainKgPerYear / daysPerYear,
      growthDays: inputs.growthDays,
      netInflowMgPerDay: inputs.intakeMgPerDay - inputs.basalLossMgPerDay,
      removalAtStartMgPerDay: inputs.removalMgPerDay,
      floorLicMgPerGDry: inputs.floorLicMgPerGDry,
      burdenShare: inputs.burdenShare,
      calibrationExcessMg: calibrationExcessMg(inputs.startBodyIronMg, inputs.weightKg, inputs.floorLicMgPerGDry),
    };
    const stores = storesAfterDays(model, inputs.daysAhead);
    const storesPerLic = angelucciSlopeMgPerKgPerMgPerGDry * inputs.weightKg;
    const rate = (model.burdenShare * model.removalAtStartMgPerDay) / model.calibrationExcessMg;
    const drive = model.netInflowMgPerDay - (1 - model.burdenShare) * model.removalAtStartMgPerDay;
    return {
      licMgPerGDry: stores.storesMg / (angelucciSlopeMgPerKgPerMgPerGDry * stores.weightKg),
      equilibriumLicMgPerGDry: rate > 0 ? Math.max(inputs.floorLicMgPerGDry, inputs.floorLicMgPerGDry + drive / rate / storesPerLic) : 0,
    };
  },
});

/** Ledger formulas, in the order `calc --list` shows them. */
export const ledgerFormulas: readonly AnyFormula[] = [netTransfusionalIronFormula, netIronBalance, bodyIronCarriedForward, measuredChelation, projectedLicFormula];
