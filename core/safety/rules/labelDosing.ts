import { addMonthsIso } from '../../dates/isoDate';
import { defaultProductCatalogue } from '../../dosing/productCatalogue';
import { latestWeightOnOrBefore } from '../../model/latestWeight';
import { continuousRunStart } from '../../model/continuousRunStart';
import { defineRule } from '../rule';
import type { FindingDraft, TriggerValue } from '../types';
import { capitalised, forPrescriberReview, shown } from '../wording';

export const productAdministrationsRule = defineRule({
  id: 'product-administrations-mismatch',
  title: 'A product made for a number of administrations a day recorded with another (the two deferiprone 1,000 mg tablets)',
  severity: 'review',
  drugs: ['deferiprone', 'deferasirox', 'deferoxamine'],
  sourceIds: ['deferiprone-label-us-2025'],
  uncertain: false,
  evaluate: (context) =>
    context.active.flatMap((regimen): FindingDraft[] => {
      const { productId, drug, administrationsPerDay } = regimen.period;
      if (productId === undefined) return [];
      const product = defaultProductCatalogue.find((it) => it.id === productId);
      const trigger: TriggerValue = { name: 'product', value: productId, unit: '', date: regimen.period.startDate, ref: regimen.ref };
      if (!product) {
        return [{ severity: 'information', text: `${capitalised(drug)} (${regimen.ref}) names the product "${productId}", which is not in the shipped product catalogue (${defaultProductCatalogue.filter((it) => it.drug === drug).map((it) => it.id).join(', ')}); the product and the regimen are not compared.`, triggers: [trigger], drugs: [drug] }];
      }
      if (product.drug !== drug) {
        return [{ severity: 'review', text: `${capitalised(drug)} (${regimen.ref}) is recorded with the product "${product.name}", which holds ${product.drug}; ${forPrescriberReview}.`, triggers: [trigger], drugs: [drug] }];
      }
      if (product.administrationsPerDay === undefined || product.administrationsPerDay === administrationsPerDay) return [];
      return [
        {
          severity: 'review',
          text: `${capitalised(drug)} (${regimen.ref}) ${administrationsPerDay} time(s) a day with ${product.name}, a product made for ${product.administrationsPerDay} administrations a day: the label says the two 1,000 mg tablets are not interchangeable and the tablet matches the regimen; ${forPrescriberReview}.`,
          triggers: [trigger, { name: 'administrations per day', value: administrationsPerDay, unit: '1', date: regimen.period.startDate, ref: regimen.ref }],
          drugs: [drug],
        },
      ];
    }),
});

export const deferasiroxHepaticImpairmentRule = defineRule({
  id: 'deferasirox-hepatic-impairment',
  title: 'Deferasirox in moderate (Child-Pugh B) or severe (Child-Pugh C) hepatic impairment',
  severity: 'urgent',
  drugs: ['deferasirox'],
  sourceIds: ['deferasirox-label-us'],
  uncertain: false,
  evaluate: (context) => {
    const childPugh = context.childPugh;
    if (!context.activeDrugs.has('deferasirox') || childPugh === null) return [];
    const triggers: TriggerValue[] = [{ name: 'Child-Pugh class', value: childPugh.childPughClass, unit: '', date: childPugh.date, ref: childPugh.ref }];
    if (childPugh.childPughClass === 'C') {
      return [{ severity: 'urgent', text: `Deferasirox with severe hepatic impairment (Child-Pugh C, recorded ${childPugh.date}): the US label advises avoiding deferasirox in Child-Pugh C (boxed warning, §2); ${forPrescriberReview}.`, triggers }];
    }
    if (childPugh.childPughClass === 'B') {
      return [{ severity: 'review', text: `Deferasirox with moderate hepatic impairment (Child-Pugh B, recorded ${childPugh.date}): the US label lowers the first dose (by 50 % per drug references) and asks for close monitoring (§2); ${forPrescriberReview}.`, triggers }];
    }
    return [];
  },
});

/** US label §2.1: at least 100 mL/kg of packed red cells and a ferritin consistently above 1,000 µg/L (references.md §9). */
const startPackedCellsMlPerKg = 100;
const startFerritinAboveUgPerL = 1000;

export const deferasiroxStartCriteriaRule = defineRule({
  id: 'deferasirox-start-criteria',
  title: 'Deferasirox: the label’s evidence of transfusional iron overload at the start of a run',
  severity: 'information',
  drugs: ['deferasirox'],
  sourceIds: ['deferasirox-label-us'],
  uncertain: false,
  evaluate: (context) => {
    const runStart = continuousRunStart(context.caseFile.chelationPeriods, 'deferasirox', context.asOf);
    // Shown while the run is in its first month: when a period starts.
    if (runStart === null || context.asOf >= addMonthsIso(runStart, 1)) return [];
    const weight = latestWeightOnOrBefore(context.caseFile.patient.weights, runStart);
    const weightKg = weight?.weight.value ?? context.weightKg;
    const transfusedMl = context.caseFile.transfusions.reduce((sum, it) => (it.date > runStart ? sum : it.kind === 'simple' ? sum + it.volume.value : it.kind === 'exchange' ? sum + it.volumeIn.value : sum), 0);
    const packedMlPerKg = transfusedMl / weightKg;
    const ferritins = context.resultsOf('ferritin').filter((it) => it.entry.date <= runStart).slice(-2);
    const ferritinConsistent = ferritins.length === 2 && ferritins.every((it) => it.entry.measured.value > startFerritinAboveUgPerL);
    const ferritinText = ferritins.length === 0 ? 'no ferritin on record before the run began' : `ferritin ${ferritins.map((it) => `${shown(it.entry.measured.value, 0)} µg/L (${it.entry.date})`).join(' and ')}`;
    const met = packedMlPerKg >= startPackedCellsMlPerKg && ferritinConsistent;
    return [
      {
        severity: 'information',
        text: `Deferasirox from ${runStart}: the record holds ${shown(packedMlPerKg, 0)} mL/kg of packed red cells before the run began (${shown(transfusedMl, 0)} mL at ${shown(weightKg, 1)} kg; the record may not hold every earlier transfusion) and ${ferritinText}; the US label’s evidence of transfusional iron overload for beginning deferasirox is at least ${startPackedCellsMlPerKg} mL/kg of packed red cells with a ferritin consistently above ${startFerritinAboveUgPerL} µg/L (§2.1)${met ? ', which the record meets' : ', which the record does not show'}.`,
        triggers: [
          { name: 'packed red cells before the run began', value: Number(packedMlPerKg.toFixed(1)), unit: 'mL/kg', date: runStart, ref: null },
          ...ferritins.map((it): TriggerValue => ({ name: 'ferritin before the run began', value: it.entry.measured.value, unit: it.entry.measured.unit, date: it.entry.date, ref: it.ref })),
        ],
      },
    ];
  },
});

/** US deferoxamine labels §2 (references.md §9): usual doses by ferritin. */
const deferoxamineFerritinBands = [
  { belowUgPerL: 2000, text: 'below 2,000 µg/L', usual: 'about 25 mg/kg/day' },
  { belowUgPerL: 3000, text: '2,000–3,000 µg/L', usual: 'about 35 mg/kg/day' },
  { belowUgPerL: Number.POSITIVE_INFINITY, text: 'above 3,000 µg/L', usual: 'up to 55 mg/kg/day' },
] as const;

export const deferoxamineFerritinBandRule = defineRule({
  id: 'deferoxamine-ferritin-band',
  title: 'Deferoxamine: the label’s usual dose for the ferritin band, as reference',
  severity: 'information',
  drugs: ['deferoxamine'],
  sourceIds: ['deferoxamine-label'],
  uncertain: false,
  evaluate: (context) => {
    const latest = context.resultsOf('ferritin').at(-1);
    if (!latest) return [];
    const ferritin = latest.entry.measured.value;
    const band = deferoxamineFerritinBands.find((it) => ferritin < it.belowUgPerL)!;
    return context.active
      .filter((regimen) => regimen.period.drug === 'deferoxamine')
      .map((regimen): FindingDraft => ({
        severity: 'information',
        text: `Deferoxamine ${shown(regimen.doseMgPerKgPerDay, 1)} mg/kg per dosing day (${regimen.ref}) with ferritin ${shown(ferritin, 0)} µg/L (${latest.entry.date}): the US label describes ${band.usual} as the usual dose with ferritin ${band.text}, within 20–60 mg/kg/day in adults and at most 40 mg/kg/day in children (§2); reference only.`,
        triggers: [
          { name: 'ferritin', value: ferritin, unit: latest.entry.measured.unit, date: latest.entry.date, ref: latest.ref },
          { name: 'deferoxamine dose per dosing day', value: regimen.doseMgPerKgPerDay, unit: 'mg/kg/d', date: context.asOf, ref: regimen.ref },
        ],
      }));
  },
});
