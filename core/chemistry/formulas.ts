import { chelatorIds } from '../chelators/catalogue';
import { findSource } from '../references';
import { issue, type Issue } from '../result';
import { doseEntryRefusals, type DoseEntryInputs } from '../formulas/doseEntry';
import { defineFormula, type AnyFormula, type Refusal } from '../formulas/types';
import { dailyDoseBounds, inputRange, weightBounds } from '../ranges';
import { kg, mg, mgPerKgPerDay } from '../units/quantity';
import { capacityComparisonRow, capacityMetalIds } from './capacityAndPm';
import { conditionalConstant } from './conditionalConstant';
import { logLigandFraction } from './ligandFraction';
import { constantSetIds, findConstantSet } from './sets';
import { speciate } from './speciation';
import { metalIds, molarFromMicromolar, ph, type LigandConstantSet, type MetalId } from './types';
import { choiceWords } from '../words';

/** Method sources shared by the chemistry calculators (each set's own sources are named in its text output). */
const methodSourceIds = ['harris-qca', 'ringbom-side-reactions', 'stefansson-2007', 'baes-mesmer-1976'] as const;
const solverSourceIds = [...methodSourceIds, 'pm-convention', 'boyd-vandenberghe-2004'] as const;

const constantSetInput = {
  kind: 'choice',
  label: 'constant set',
  choices: constantSetIds,
  meaning: 'one named constant set of a ligand (protonation and metal constants from one source, never mixed)',
} as const;

const metalInput = (label: string, defaultMetal?: MetalId) =>
  ({
    kind: 'choice',
    label,
    choices: metalIds,
    meaning: 'metal ion, e.g. Fe3+, Pb2+, Ca2+',
    ...(defaultMetal ? { default: defaultMetal } : {}),
  }) as const;

const phInput = {
  kind: 'number',
  label: 'pH',
  unit: '[pH]',
  min: 0,
  max: 14,
  default: 7.4,
  meaning: 'pH of the solution (7.4 for plasma)',
} as const;

const totalInput = (label: string, meaning: string, defaultValue?: number) =>
  ({
    kind: 'number',
    label,
    unit: 'umol/L',
    min: 0.000001,
    max: 100000,
    meaning,
    ...(defaultValue !== undefined ? { default: defaultValue } : {}),
  }) as const;

const constantSetOutput = {
  label: 'constant set used',
  unit: '',
  kind: 'text',
  meaning: 'the named constant set, its conditions, status and sources',
} as const;

/**
 * The text naming the constant set a result used: id, label, conditions, status and sources.
 *
 * @param set - the constant set
 * @returns one line of text
 * @example describeConstantSet(edta 25 °C set) starts 'edta-textbook-25c: EDTA, textbook protonation set'
 */
export function describeConstantSet(set: LigandConstantSet): string {
  const sources = set.sourceIds.map((id) => {
    const source = findSource(id);
    if (!source) throw new Error(`Constant set ${set.id} cites unknown source ${id}`);
    return `${source.authors}${source.year ? ` ${source.year}` : ''} [${choiceWords(source.status)}]`;
  });
  return `${set.id}: ${set.label} (${set.temperatureC} °C, I = ${set.ionicStrengthMolPerL} mol/L, ${set.medium}; status ${set.status}); sources: ${sources.join('; ')}`;
}

function setOrThrow(id: string): LigandConstantSet {
  const set = findConstantSet(id);
  // The choice list is built from the same catalogue, so an unknown id here is a bug.
  if (!set) throw new Error(`Unknown constant set ${id}`);
  return set;
}

function refuse(issues: readonly Issue[], rename: Readonly<Record<string, string>> = {}): Refusal {
  return {
    refused: issues.map((it) => {
      const last = it.path[it.path.length - 1];
      const input = typeof last === 'string' ? (rename[last] ?? last) : 'constantSet';
      return { ...it, path: [input] };
    }),
  };
}

export const ligandFractionFormula = defineFormula({
  id: 'ligand-fraction',
  title: 'Fraction of a ligand fully deprotonated at a given pH',
  expression: 'α_L = 1 / (1 + Σₙ 10^(Σᵢ≤ₙ log Kᵢᴴ − n·pH))',
  sourceIds: ['harris-qca'],
  notes: [
    'Uses the protonation constants of one named set only.',
    'Not defined for sets of conditional constants (transferrin), whose protonation is already inside the constants.',
  ],
  inputs: { constantSet: constantSetInput, ph: phInput },
  outputs: {
    fraction: { label: 'fraction fully deprotonated (α_L)', unit: '1', meaning: '[L] / total unbound ligand', decimals: 4 },
    log10Fraction: { label: 'log₁₀ α_L', unit: '1', meaning: 'decimal logarithm of α_L', decimals: 3 },
    constantSet: constantSetOutput,
  },
  compute: ({ constantSet, ph: phValue }) => {
    const set = setOrThrow(constantSet);
    if (set.conditionalAtPh !== undefined) {
      return refuse([
        issue(
          'not_applicable',
          ['constantSet'],
          `Constant set ${set.id} holds conditional constants at pH ${set.conditionalAtPh}: it has no protonation constants to give a fraction.`,
        ),
      ]);
    }
    const logFraction = logLigandFraction(set.protonationLogK, ph(phValue));
    return { fraction: 10 ** logFraction, log10Fraction: logFraction, constantSet: describeConstantSet(set) };
  },
});

export const conditionalConstantFormula = defineFormula({
  id: 'conditional-constant',
  title: 'Conditional formation constant of a ligand with a metal at a given pH',
  expression: "log K′ = log K + q·log α_L + log α_M + log α_ML (principal complex ML_q; α as fractions)",
  sourceIds: [...methodSourceIds],
  notes: [
    'Principal complex: the mononuclear complex with the most ligands (ML for EDTA, FeL3 for deferiprone); its protonated and hydroxo forms are included.',
    'α_M counts mononuclear hydrolysis only (Fe3+: Stefánsson 2007; other metals from memory of Baes & Mesmer 1976).',
  ],
  inputs: { constantSet: constantSetInput, metal: metalInput('metal', 'Fe3+'), ph: phInput },
  outputs: {
    logConditionalConstant: { label: 'log K′ (conditional)', unit: '1', meaning: 'conditional constant of the principal complex', decimals: 2 },
    logStabilityConstant: { label: 'log K (as entered)', unit: '1', meaning: 'overall formation constant of the principal complex', decimals: 2 },
    log10AlphaLigand: { label: 'log₁₀ α_L', unit: '1', meaning: 'fraction of ligand fully deprotonated', decimals: 3 },
    log10AlphaMetal: { label: 'log₁₀ α_M', unit: '1', meaning: 'fraction of unbound metal present as the aqua ion', decimals: 3 },
    complex: { label: 'principal complex', unit: '', kind: 'text', meaning: 'the complex the constant describes' },
    constantSet: constantSetOutput,
  },
  compute: ({ constantSet, metal, ph: phValue }) => {
    const set = setOrThrow(constantSet);
    const result = conditionalConstant(set, metal, ph(phValue));
    if (!result.ok) return refuse(result.issues);
    return {
      logConditionalConstant: result.value.logConditional,
      logStabilityConstant: result.value.logBeta,
      log10AlphaLigand: result.value.logAlphaLigand,
      log10AlphaMetal: result.value.logAlphaMetal,
      complex: result.value.complexName,
      constantSet: describeConstantSet(set),
    };
  },
});

export const pmFormula = defineFormula({
  id: 'pm',
  title: 'pM: free metal left by a ligand at a given pH (speciation)',
  expression: 'pM = −log₁₀[M free aqua ion], from the mass balances of metal and ligand at fixed pH',
  sourceIds: [...solverSourceIds],
  notes: [
    'Standard convention for comparing chelators: pH 7.4, 1 µM total metal, 10 µM total ligand, no precipitation.',
    'Higher pM means less free metal: a firmer hold at that pH. It says nothing about how much metal a dose removes in a patient.',
    'Solid hydroxides are excluded; soluble hydroxo species (Fe2(OH)2 included) are counted.',
  ],
  inputs: {
    constantSet: constantSetInput,
    metal: metalInput('metal', 'Fe3+'),
    ph: phInput,
    totalMetalUmolPerL: totalInput('total metal', 'total metal concentration', 1),
    totalLigandUmolPerL: totalInput('total ligand', 'total ligand concentration (molecules)', 10),
  },
  outputs: {
    pM: { label: 'pM', unit: '1', meaning: '−log₁₀ of the free metal aqua ion (mol/L)', decimals: 2 },
    boundFraction: { label: 'share of metal bound', unit: '1', meaning: 'share of the metal held by the ligand', decimals: 4 },
    unboundFraction: { label: 'share of metal not bound', unit: '1', meaning: 'aqua ion plus hydroxo species, as a share of the metal', decimals: 4 },
    dominantComplex: { label: 'main complex', unit: '', kind: 'text', meaning: 'the complex holding most of the metal' },
    constantSet: constantSetOutput,
  },
  compute: ({ constantSet, metal, ph: phValue, totalMetalUmolPerL, totalLigandUmolPerL }) => {
    const set = setOrThrow(constantSet);
    const result = speciate(
      set,
      [{ metal, totalMolar: molarFromMicromolar(totalMetalUmolPerL) }],
      molarFromMicromolar(totalLigandUmolPerL),
      ph(phValue),
    );
    if (!result.ok) return refuse(result.issues, { speciation: 'constantSet' });
    const metalResult = result.value.metals[0]!;
    return {
      pM: metalResult.pM,
      boundFraction: metalResult.boundFraction,
      unboundFraction: metalResult.unboundFraction,
      dominantComplex: metalResult.dominantComplex || 'none',
      constantSet: describeConstantSet(set),
    };
  },
});

export const metalCompetitionFormula = defineFormula({
  id: 'metal-competition',
  title: 'Two metals competing for one ligand at a given pH',
  expression: 'mass balances of both metals and the ligand solved together; pM = −log₁₀[M free] for each',
  sourceIds: [...solverSourceIds],
  notes: [
    'Example: lead against plasma calcium (about 1.2 mM) for edetate; the totals are totals, not free concentrations.',
    'Both metals must have constants in the chosen set.',
  ],
  inputs: {
    constantSet: constantSetInput,
    firstMetal: metalInput('first metal'),
    firstMetalTotalUmolPerL: totalInput('total of the first metal', 'total concentration of the first metal'),
    secondMetal: metalInput('second metal'),
    secondMetalTotalUmolPerL: totalInput('total of the second metal', 'total concentration of the second metal'),
    totalLigandUmolPerL: totalInput('total ligand', 'total ligand concentration (molecules)', 10),
    ph: phInput,
  },
  outputs: {
    firstMetalPm: { label: 'pM of the first metal', unit: '1', meaning: '−log₁₀ free first metal', decimals: 2 },
    firstMetalBoundFraction: { label: 'share of the first metal bound', unit: '1', meaning: 'share of the first metal held by the ligand', decimals: 4 },
    secondMetalPm: { label: 'pM of the second metal', unit: '1', meaning: '−log₁₀ free second metal', decimals: 2 },
    secondMetalBoundFraction: { label: 'share of the second metal bound', unit: '1', meaning: 'share of the second metal held by the ligand', decimals: 4 },
    ligandShareFirstMetal: { label: 'share of ligand on the first metal', unit: '1', meaning: 'share of all ligand in complexes of the first metal', decimals: 4 },
    ligandShareSecondMetal: { label: 'share of ligand on the second metal', unit: '1', meaning: 'share of all ligand in complexes of the second metal', decimals: 4 },
    constantSet: constantSetOutput,
  },
  compute: (inputs) => {
    const set = setOrThrow(inputs.constantSet);
    if (inputs.firstMetal === inputs.secondMetal) {
      return refuse([issue('inconsistent', ['secondMetal'], `Second metal ${inputs.secondMetal} is the same as the first; choose two different metals.`)]);
    }
    const result = speciate(
      set,
      [
        { metal: inputs.firstMetal, totalMolar: molarFromMicromolar(inputs.firstMetalTotalUmolPerL) },
        { metal: inputs.secondMetal, totalMolar: molarFromMicromolar(inputs.secondMetalTotalUmolPerL) },
      ],
      molarFromMicromolar(inputs.totalLigandUmolPerL),
      ph(inputs.ph),
    );
    if (!result.ok) {
      return {
        refused: result.issues.map((it) => {
          const input = it.path[0] === 'metals' ? (it.path[1] === 0 ? 'firstMetal' : 'secondMetal') : 'constantSet';
          const last = it.path[it.path.length - 1];
          return { ...it, path: [last === 'ph' ? 'ph' : input] };
        }),
      };
    }
    const [first, second] = result.value.metals;
    return {
      firstMetalPm: first!.pM,
      firstMetalBoundFraction: first!.boundFraction,
      secondMetalPm: second!.pM,
      secondMetalBoundFraction: second!.boundFraction,
      ligandShareFirstMetal: first!.ligandShare,
      ligandShareSecondMetal: second!.ligandShare,
      constantSet: describeConstantSet(set),
    };
  },
});

/**
 * The dose on a dosing day: in mg/kg/day with the body weight, or in mg (the refusal in
 * core/formulas/doseEntry.ts). Weight and daily dose take the case model's ranges (core/ranges).
 */
const capacityDoseInputs = {
  doseMg: { kind: 'number', label: 'dose', unit: 'mg', min: 1, max: 20000, optional: true, meaning: 'dose on a dosing day, mg of the form the product is dosed as' },
  perKg: {
    name: 'doseMgPerKgPerDay',
    spec: { kind: 'number', label: 'dose on a dosing day', ...inputRange(dailyDoseBounds), optional: true, meaning: 'mg/kg of the form the product is dosed as' },
  },
  weightKg: { kind: 'number', label: 'body weight', ...inputRange(weightBounds), optional: true, meaning: 'body weight for the mg/kg dose' },
} as const satisfies DoseEntryInputs;

export const capacityAndPmFormula = defineFormula({
  id: 'capacity-and-pm',
  title: 'Metal a day\'s chelator dose can bind, beside the ligand\'s pM at pH 7.4',
  expression:
    'metal bound (mg) = dose (mg) / M(chelator as dosed) / (chelator : metal ratio) × Ar(metal); pM = −log₁₀[M free] at pH 7.4, 1 µM metal, 10 µM ligand',
  sourceIds: ['poggiali-2012', 'ciaaw-2021', 'deferoxamine-aluminium-memory', ...solverSourceIds, 'nurchi-2015'],
  notes: [
    'Two different questions side by side: how much metal the dose could hold at full stoichiometry (a ceiling; excretion is a fraction of it), and how firmly the ligand holds the metal at plasma pH.',
    'pM of deferasirox is the published value (22.5, Nurchi et al. 2015), marked "literature value, not computed": its iron constants are unconfirmed.',
    'Enter the dose on a dosing day in mg/kg/day with the body weight, or in mg.',
  ],
  inputs: {
    chelator: { kind: 'choice', label: 'chelator', choices: chelatorIds, meaning: 'the product as dosed' },
    metal: { kind: 'choice', label: 'metal', choices: capacityMetalIds, default: 'Fe3+', meaning: 'Fe3+, or Al3+ (catalogued for deferoxamine)' },
    doseMgPerKgPerDay: capacityDoseInputs.perKg.spec,
    weightKg: capacityDoseInputs.weightKg,
    doseMg: capacityDoseInputs.doseMg,
    constantSet: { ...constantSetInput, optional: true, meaning: "the ligand's constant set (default: its default set)" },
  },
  outputs: {
    doseMg: { label: 'dose', unit: 'mg', meaning: 'dose used, mg (mg/kg/day × weight when given that way)', decimals: 0 },
    metalBoundMg: { label: 'metal bound at full stoichiometry', unit: 'mg', meaning: 'theoretical ceiling of metal held by the dose', decimals: 1 },
    capacityMgPerG: { label: 'binding capacity', unit: 'mg/g', meaning: 'mg of metal per g of chelator as dosed', decimals: 1 },
    pM: { label: 'pM at pH 7.4', unit: '1', meaning: '−log₁₀ free metal under the standard convention', decimals: 2 },
    pmBasis: { label: 'pM basis', unit: '', kind: 'text', meaning: 'computed from the named set, or a literature value not computed' },
    constantSet: constantSetOutput,
  },
  compute: (inputs) => {
    const refused = doseEntryRefusals({ doseMg: inputs.doseMg, perKg: inputs.doseMgPerKgPerDay, weightKg: inputs.weightKg }, capacityDoseInputs);
    if (refused.length > 0) return { refused };
    const set = inputs.constantSet === undefined ? undefined : setOrThrow(inputs.constantSet);
    const row = capacityComparisonRow(
      {
        chelatorId: inputs.chelator,
        ...(inputs.doseMg !== undefined ? { doseMg: mg(inputs.doseMg) } : {}),
        ...(inputs.doseMgPerKgPerDay !== undefined ? { doseMgPerKgPerDay: mgPerKgPerDay(inputs.doseMgPerKgPerDay), weightKg: kg(inputs.weightKg!) } : {}),
        doseBasis: 'entered',
      },
      inputs.metal,
      set,
    );
    if (!row.ok) return { refused: row.issues };
    const { capacityMgPerG, metalBoundMg, doseMg, pm } = row.value;
    if (capacityMgPerG === null || metalBoundMg === null || doseMg === null) {
      return { refused: [issue('not_applicable', ['metal'], row.value.capacityNote)] };
    }
    if (pm.pM === undefined) {
      return { refused: [issue('not_applicable', ['metal'], `No pM for ${inputs.metal} with ${pm.setId}: ${pm.note}`)] };
    }
    return {
      doseMg,
      metalBoundMg,
      capacityMgPerG,
      pM: pm.pM,
      pmBasis: pm.basis === 'computed' ? 'computed at pH 7.4, 1 µM metal, 10 µM ligand' : `literature value, not computed (${pm.sourceIds.join(', ')})`,
      constantSet: describeConstantSet(findConstantSet(pm.setId)!),
    };
  },
});

/** Every chemistry formula, in the order `calc --list` shows them. */
export const chemistryFormulas: readonly AnyFormula[] = [
  ligandFractionFormula,
  conditionalConstantFormula,
  pmFormula,
  metalCompetitionFormula,
  capacityAndPmFormula,
];
