import {
  capacityComparison,
  capacityMetalIds,
  conditionalConstantSweep,
  constantSetIds,
  defaultSetOf,
  describeConstantSet,
  elementOf,
  findConstantSet,
  leadCalciumCompetition,
  metalIds,
  molarFromMicromolar,
  phGrid,
  pmComparisonAtPhysiologicalPh,
  pmSweep,
  type CapacityComparisonRow,
  type CapacityMetalId,
  type LeadCalciumCompetition,
  type LeadCalciumState,
  type MetalId,
  type PmComparisonRow,
  type SweepPoint,
} from '../../core/chemistry';
import { parseDecimal } from '../../core/numbers/parseDecimal';
import { citeShort, findSource } from '../../core/references';
import { weightBounds } from '../../core/ranges';
import { kg } from '../../core/units/quantity';
import { parseArgs, repeatedOptionProblems, type ParsedArgs } from './args';
import { decisionSupportCaution, formatNumber } from './format';
import { exitCodes, type CliIo } from './io';

export const bindingUsage = `Usage:
  chelation-ledger binding [--metal Fe3+|Al3+] [--weight-kg N] [--json]
      metal bound per dosing day by stoichiometry beside pM at pH 7.4, for the iron chelators at
      their catalogued doses; pPb of edetate, pentetate and succimer; lead against plasma calcium
  chelation-ledger binding --sweep --ligand-set <set id> [--metal Fe3+] [--from 2] [--to 12] [--step 1]
      [--metal-umol 1] [--ligand-umol 10] [--json]
      pM and log K′ of one constant set against pH
  --weight-kg: above ${weightBounds.possible.min} to ${weightBounds.possible.max} kg; outside ${weightBounds.plausible.min}–${weightBounds.plausible.max} kg the table says to check it (the case file's ranges)`;

const switches = ['--json', '--sweep', '--help'] as const;
const tableOptions = ['--metal', '--weight-kg'] as const;
const sweepOptions = ['--ligand-set', '--metal', '--from', '--to', '--step', '--metal-umol', '--ligand-umol'] as const;

/** Sets shown for lead: edetate, pentetate and succimer, each ligand's default set. */
const leadLigands = ['edta', 'dtpa', 'succimer'] as const;

/**
 * `binding`: the capacity and pM comparison, or a pH sweep of one constant set.
 * Parses its own arguments (it has a `--sweep` switch). Returns the exit code.
 */
export function bindingCommand(argv: readonly string[], io: CliIo): number {
  const args = parseArgs(argv, switches);
  if (args.switches.has('--help')) {
    io.out(bindingUsage);
    return exitCodes.ok;
  }
  if (args.positionals.length > 0) {
    io.err(`Unexpected word "${args.positionals[0]}".\n${bindingUsage}`);
    return exitCodes.usage;
  }
  const sweep = args.switches.has('--sweep');
  const known: readonly string[] = sweep ? sweepOptions : tableOptions;
  const problems: string[] = [...repeatedOptionProblems(args), ...args.missingValues.map((flag) => `${flag}: a value is missing after the flag.`)];
  for (const flag of Object.keys(args.options)) {
    if (!known.includes(flag)) problems.push(`${flag}: not an option of binding${sweep ? ' --sweep' : ''} (${known.join(', ')}, --json).`);
  }
  if (problems.length > 0) {
    io.err(`${problems.join('\n')}\n${bindingUsage}`);
    return exitCodes.usage;
  }
  return sweep ? sweepCommand(args, io) : tableCommand(args, io);
}

function numberOption(args: ParsedArgs, flag: string, fallback: number | undefined, min: number, max: number, problems: string[]): number | undefined {
  const raw = args.options[flag];
  if (raw === undefined) return fallback;
  const value = parseDecimal(raw);
  if (value === undefined || value < min || value > max) {
    problems.push(`${flag}: "${raw}" is outside the plausible range ${min}–${max}.`);
    return undefined;
  }
  return value;
}

function choiceOption<Choice extends string>(args: ParsedArgs, flag: string, choices: readonly Choice[], fallback: Choice, problems: string[]): Choice {
  const raw = args.options[flag] ?? fallback;
  if ((choices as readonly string[]).includes(raw)) return raw as Choice;
  problems.push(`${flag}: "${raw}" is not one of ${choices.join(', ')}.`);
  return fallback;
}

/** pFe, pAl, pPb… */
const pLabel = (metal: MetalId): string => `p${elementOf(metal)}`;

function setLine(setId: string): string {
  const set = findConstantSet(setId);
  return set ? describeConstantSet(set) : setId;
}

function sourceLine(ids: readonly string[]): string {
  return ids
    .map((id) => findSource(id))
    .filter((it) => it !== undefined)
    .map((it) => citeShort(it))
    .join('; ');
}

/** Columns padded to their widest cell. */
function table(rows: readonly (readonly string[])[]): string {
  const widths = rows[0]!.map((_, column) => Math.max(...rows.map((row) => row[column]!.length)));
  return rows.map((row) => row.map((cell, column) => cell.padEnd(widths[column]!)).join('  ').trimEnd()).join('\n');
}

const orDash = (value: number | null | undefined, decimals: number): string => (value === null || value === undefined ? '—' : formatNumber(value, decimals));

function pmBasisText(pm: PmComparisonRow): string {
  if (pm.basis === 'computed') return 'computed';
  if (pm.basis === 'literature') return 'literature value, not computed';
  return 'not computed';
}

/** A weight outside the plausible range, said once (the table is still computed with it). */
function weightWarning(weightKg: number | undefined): string[] {
  if (weightKg === undefined || (weightKg >= weightBounds.plausible.min && weightKg <= weightBounds.plausible.max)) return [];
  return [`Check the weight: ${formatNumber(weightKg, 1)} kg is outside the plausible ${weightBounds.plausible.min}–${weightBounds.plausible.max} kg (typed in pounds, or a digit too many?).`];
}

function tableCommand(args: ParsedArgs, io: CliIo): number {
  const problems: string[] = [];
  const metal = choiceOption<CapacityMetalId>(args, '--metal', capacityMetalIds, 'Fe3+', problems);
  // The case file's weight ranges (core/ranges): refused outside the possible range, flagged outside the plausible one.
  const weightText = args.options['--weight-kg'];
  const weightKg = weightText === undefined ? undefined : parseDecimal(weightText);
  if (weightText !== undefined && (weightKg === undefined || weightKg <= weightBounds.possible.min || weightKg > weightBounds.possible.max)) {
    problems.push(
      `--weight-kg: "${weightText}" is not a body weight; enter the weight in kg, above ${weightBounds.possible.min} and at most ${weightBounds.possible.max} (plausible ${weightBounds.plausible.min}–${weightBounds.plausible.max}).`,
    );
  }
  if (problems.length > 0) {
    io.err(problems.join('\n'));
    return exitCodes.invalidInput;
  }
  const rows = capacityComparison(metal, weightKg === undefined ? undefined : kg(weightKg));
  const lead = pmComparisonAtPhysiologicalPh('Pb2+', undefined, undefined, leadLigands.map(defaultSetOf));
  const competition = leadCalciumCompetition();
  // The default EDTA set holds Pb2+ and Ca2+ constants and the solver converges for every positive total
  // (equilibriumSolver.ts); a refusal here is a bug.
  if (!competition.ok) throw new Error(competition.issues.map((it) => it.message).join(' '));
  if (args.switches.has('--json')) {
    io.out(
      JSON.stringify(
        {
          metal,
          weightKg: weightKg ?? null,
          warnings: weightWarning(weightKg),
          convention: 'pM at pH 7.4, 1 µmol/L total metal, 10 µmol/L total ligand, no precipitation',
          rows: rows.map((row) => ({ ...row, constantSet: setLine(row.pm.setId), pmBasis: pmBasisText(row.pm) })),
          lead: lead.map((row) => ({ ...row, constantSet: setLine(row.setId), pmBasis: pmBasisText(row) })),
          calciumCompetition: { ...competition.value, constantSet: setLine(competition.value.setId) },
          caution: decisionSupportCaution,
        },
        null,
        2,
      ),
    );
    return exitCodes.ok;
  }
  io.out([...weightWarning(weightKg), ...capacityText(rows, metal, weightKg), '', ...leadText(lead), '', ...competitionText(competition.value), '', decisionSupportCaution].join('\n'));
  return exitCodes.ok;
}

function capacityText(rows: readonly CapacityComparisonRow[], metal: CapacityMetalId, weightKg: number | undefined): string[] {
  const element = elementOf(metal);
  const p = pLabel(metal);
  const header = ['chelator (as dosed)', 'mg/kg/day', 'dose mg', `mg ${element}/g`, `${element} mg/kg`, `${element} mg`, p, `${p} basis`];
  const body = rows.map((row) => [
    row.chelatorLabel,
    orDash(row.doseMgPerKgPerDay, 0),
    orDash(row.doseMg, 0),
    orDash(row.capacityMgPerG, 1),
    orDash(row.metalBoundMgPerKg, 2),
    orDash(row.metalBoundMg, 1),
    orDash(row.pm.pM, 1),
    pmBasisText(row.pm),
  ]);
  return [
    `Capacity and ${p} for ${metal}: ${element} bound per dosing day at full stoichiometry, beside ${p} at pH 7.4`,
    `(${p} = −log[${metal} free] at 1 µmol/L total metal, 10 µmol/L total ligand, no precipitation).`,
    weightKg === undefined ? 'No body weight given: metal bound per kg only (add --weight-kg for mg).' : `Body weight ${formatNumber(weightKg, 1)} kg.`,
    '',
    table([header, ...body]),
    '',
    'Doses used:',
    ...rows.map((row) => `  ${row.chelatorLabel}: ${formatNumber(row.doseMgPerKgPerDay ?? 0, 0)} mg/kg/day, ${row.doseBasis}.`),
    'Capacity:',
    ...rows.filter((row) => row.capacityNote !== '').map((row) => `  ${row.chelatorLabel}: ${row.capacityNote}`),
    `  stoichiometry and molar masses: ${sourceLine(rows[0]!.capacitySourceIds)}`,
    `Constant sets for ${p}:`,
    ...[...new Map(rows.map((row) => [row.pm.setId, row.pm])).values()].flatMap((pm) => [
      `  ${pm.ligandName}: ${pmBasisText(pm)}${pm.pM !== undefined ? ` (${p} ${formatNumber(pm.pM, 2)})` : ''}; ${pm.note}`,
      `    set ${setLine(pm.setId)}`,
      ...(pm.basis === 'literature' ? [`    value from ${sourceLine(pm.sourceIds)}`] : []),
    ]),
    'Reading: the metal bound is a ceiling (every ligand molecule bound); expected excretion is a fraction of it',
    `(calc expected-excretion). A higher ${p} means less free ${metal} left at pH 7.4; it does not say how much a dose removes.`,
  ];
}

function leadText(rows: readonly PmComparisonRow[]): string[] {
  return [
    'pPb at pH 7.4 under the same convention (1 µmol/L lead, 10 µmol/L ligand):',
    ...rows.flatMap((row) => [
      `  ${row.ligandName}: ${row.pM !== undefined ? `pPb ${formatNumber(row.pM, 2)}, ${pmBasisText(row)}` : `${pmBasisText(row)}: ${row.note}`}`,
      `    set ${setLine(row.setId)}`,
    ]),
  ];
}

function stateText(state: LeadCalciumState): string {
  return `pPb ${formatNumber(state.pPb, 2)}; share of lead not bound ${formatNumber(state.leadUnboundFraction, 2)}; edetate on lead ${formatNumber(100 * state.ligandShareLead, 1)} %, on calcium ${formatNumber(100 * state.ligandShareCalcium, 1)} %`;
}

function competitionText(competition: LeadCalciumCompetition): string[] {
  const calciumMmol = competition.calciumUmolPerL / 1000;
  const drugMmol = competition.drugEdetateUmolPerL / 1000;
  return [
    `Lead against plasma calcium for edetate (pH 7.4, lead ${formatNumber(competition.leadUmolPerL, 1)} µmol/L):`,
    `  10 µmol/L edetate, lead alone: ${stateText(competition.leadAlone)}`,
    `  the same with ionized calcium ${formatNumber(calciumMmol, 2)} mmol/L: ${stateText(competition.withPlasmaCalcium)}`,
    `  ${formatNumber(drugMmol, 1)} mmol/L edetate (illustrative, not a measured plasma level):`,
    `    as edetate disodium (no calcium in the dose): free calcium ${formatNumber(competition.edetateDisodium.freeCalciumMmolPerL, 2)} mmol/L (from ${formatNumber(calciumMmol, 2)}); ${stateText(competition.edetateDisodium)}`,
    `    as calcium disodium edetate (one calcium per edetate): free calcium ${formatNumber(competition.calciumDisodiumEdetate.freeCalciumMmolPerL, 2)} mmol/L; ${stateText(competition.calciumDisodiumEdetate)}`,
    '  Reading: calcium takes most of the edetate and lowers pPb by several units, yet lead stays almost wholly bound,',
    '  because log K(PbY) 18.0 exceeds log K(CaY) 10.7 by more than seven units. The calcium complex therefore still binds',
    '  lead while leaving plasma calcium in place; edetate disodium takes ionized calcium out of plasma, the fatal',
    '  hypocalcaemia reported when it was given in place of calcium disodium edetate.',
    `  set ${setLine(competition.setId)}`,
    `  sources: ${sourceLine(competition.sourceIds.filter((id) => !findConstantSet(competition.setId)!.sourceIds.includes(id)))}`,
  ];
}

function sweepCommand(args: ParsedArgs, io: CliIo): number {
  const problems: string[] = [];
  const setId = args.options['--ligand-set'];
  const set = setId === undefined ? undefined : findConstantSet(setId);
  if (setId === undefined) problems.push(`--ligand-set: required with --sweep; one of ${constantSetIds.join(', ')}.`);
  else if (!set) problems.push(`--ligand-set: "${setId}" is not a constant set; one of ${constantSetIds.join(', ')}.`);
  const metal = choiceOption<MetalId>(args, '--metal', metalIds, 'Fe3+', problems);
  const fromPh = numberOption(args, '--from', 2, 0, 14, problems);
  const toPh = numberOption(args, '--to', 12, 0, 14, problems);
  const stepPh = numberOption(args, '--step', 1, 0.05, 2, problems);
  const metalUmol = numberOption(args, '--metal-umol', 1, 0.000001, 100000, problems);
  const ligandUmol = numberOption(args, '--ligand-umol', 10, 0.000001, 100000, problems);
  if (fromPh !== undefined && toPh !== undefined && toPh < fromPh) problems.push(`--to: pH ${toPh} is below --from ${fromPh}; give the higher pH with --to.`);
  if (problems.length > 0 || !set || fromPh === undefined || toPh === undefined || stepPh === undefined || metalUmol === undefined || ligandUmol === undefined) {
    io.err(problems.join('\n'));
    return exitCodes.invalidInput;
  }
  const grid = phGrid(fromPh, toPh, stepPh);
  const pm = pmSweep(set, metal, molarFromMicromolar(metalUmol), molarFromMicromolar(ligandUmol), grid);
  const conditional = conditionalConstantSweep(set, metal, grid);
  const value = (point: SweepPoint): number | null => (point.ok ? point.value : null);
  // One line per kind of refusal (code and input), naming the pH values it covers and its first message.
  const refusals = new Map<string, { pHs: number[]; message: string }>();
  for (const point of [...pm, ...conditional]) {
    if (point.ok) continue;
    for (const it of point.issues) {
      const key = `${it.code} ${String(it.path[it.path.length - 1])}`;
      const entry = refusals.get(key) ?? { pHs: [], message: it.message };
      if (!entry.pHs.includes(point.pH)) entry.pHs.push(point.pH);
      refusals.set(key, entry);
    }
  }
  const reasons = [...refusals.values()].map((it) => `not computed (—) at pH ${it.pHs.sort((a, b) => a - b).join(', ')}: ${it.message}`);
  if (args.switches.has('--json')) {
    io.out(
      JSON.stringify(
        {
          constantSet: describeConstantSet(set),
          metal,
          totalMetalUmolPerL: metalUmol,
          totalLigandUmolPerL: ligandUmol,
          points: grid.map((pH, index) => ({ pH, pM: value(pm[index]!), logConditionalConstant: value(conditional[index]!) })),
          notComputed: reasons,
          caution: decisionSupportCaution,
        },
        null,
        2,
      ),
    );
    return exitCodes.ok;
  }
  const p = pLabel(metal);
  const rows = grid.map((pH, index) => [formatNumber(pH, 2), orDash(value(pm[index]!), 2), orDash(value(conditional[index]!), 2)]);
  io.out(
    [
      `${p} and log K′ against pH for ${metal}: total metal ${formatNumber(metalUmol, 2)} µmol/L, total ligand ${formatNumber(ligandUmol, 2)} µmol/L, no precipitation.`,
      `set ${describeConstantSet(set)}`,
      '',
      table([['pH', p, 'log K′'], ...rows]),
      '',
      'log K′: conditional constant of the principal complex (as in calc conditional-constant).',
      ...reasons,
      decisionSupportCaution,
    ].join('\n'),
  );
  return exitCodes.ok;
}
