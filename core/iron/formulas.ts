import { defineFormula, type AnyFormula } from '../formulas/types';
import { fraction, mgPerMl, ml } from '../units/quantity';
import { transfusionIronMg } from './transfusionIron';

export const transfusionIron = defineFormula({
  id: 'transfusion-iron',
  title: 'Iron brought in by a transfusion',
  expression: 'iron (mg) = volume (mL) × unit haematocrit × iron per mL of pure red cells (mg/mL)',
  sourceIds: ['cohen-2008', 'iron-per-hb-derived'],
  notes: ['For a red-cell exchange, the same formula with the removed volume and the patient haematocrit gives the iron taken out.'],
  inputs: {
    volumeMl: { kind: 'number', label: 'volume transfused', unit: 'mL', min: 1, max: 10000, meaning: 'volume of red-cell product transfused' },
    unitHaematocrit: { kind: 'number', label: 'unit haematocrit', unit: '1', min: 0.4, max: 0.85, meaning: 'haematocrit of the unit as a fraction (packed cells about 0.55–0.65)' },
    ironPerMlRedCellsMg: {
      kind: 'number',
      label: 'iron per mL of pure red cells',
      unit: 'mg/mL',
      min: 0.9,
      max: 1.25,
      assumption: 'iron-per-ml-red-cells',
      meaning: 'mg of iron in 1 mL of pure red cells (1.08 default; 1.16 in some guidelines)',
    },
  },
  outputs: {
    ironMg: { label: 'iron', unit: 'mg', meaning: 'iron in the transfused red cells', decimals: 1 },
  },
  compute: ({ volumeMl, unitHaematocrit, ironPerMlRedCellsMg }) => ({
    ironMg: transfusionIronMg(ml(volumeMl), fraction(unitHaematocrit), mgPerMl(ironPerMlRedCellsMg)),
  }),
});

/** Every iron formula, in the order `calc --list` shows them. */
export const ironFormulas: readonly AnyFormula[] = [transfusionIron];
