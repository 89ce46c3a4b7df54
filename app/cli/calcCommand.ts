import { formulaCatalogue, formulaInputAliases, findFormula } from '../../core/catalogue';
import { describeFormula, flagForInput, type FormulaDescription } from '../../core/formulas/describe';
import type { Derivation, Origin } from '../../core/formulas/derivation';
import { runFormula } from '../../core/formulas/run';
import type { AnyFormula } from '../../core/formulas/types';
import { citeShort, findSource } from '../../core/references';
import type { Issue } from '../../core/result';
import type { ParsedArgs } from './args';
import { decisionSupportCaution, formatPlain, withUnit } from './format';
import { exitCodes, type CliIo } from './io';

export const calcUsage = `Usage:
  chelation-ledger calc --list [--json]
  chelation-ledger calc <calculator> --<input> <value> ... [--json]
Run "chelation-ledger calc --list" to see every calculator with its inputs, units, ranges and sources.`;

/** `calc`: list the calculators, or run one. Returns the exit code. */
export function calcCommand(args: ParsedArgs, io: CliIo): number {
  const json = args.switches.has('--json');
  if (args.switches.has('--list')) {
    const descriptions = formulaCatalogue.map(describeFormula);
    io.out(json ? JSON.stringify(descriptions, null, 2) : descriptions.map(formatDescription).join('\n\n'));
    return exitCodes.ok;
  }
  const name = args.positionals[0];
  if (name === undefined) {
    io.err(calcUsage);
    return exitCodes.usage;
  }
  const formula = findFormula(name);
  if (!formula) {
    io.err(`Unknown calculator "${name}". Known calculators: ${formulaCatalogue.map((it) => it.id).join(', ')}.`);
    return exitCodes.usage;
  }
  if (args.positionals.length > 1) {
    io.err(`Unexpected word "${args.positionals[1]}": inputs are given as --<input> <value>.\n${formatDescription(describeFormula(formula))}`);
    return exitCodes.usage;
  }
  const flagToName = new Map(Object.keys(formula.inputs).map((input) => [flagForInput(input), input]));
  const formerFlags = new Map(
    Object.entries(formulaInputAliases[formula.id] ?? {}).map(([former, current]) => [flagForInput(former), current]),
  );
  const problems: string[] = [];
  for (const flag of args.missingValues) problems.push(`${flag}: a value is missing after the flag.`);
  const raw: Record<string, string> = {};
  for (const [flag, value] of Object.entries(args.options)) {
    const input = flagToName.get(flag) ?? formerFlags.get(flag);
    if (input === undefined) {
      problems.push(`${flag}: not an input of ${formula.id}. Its inputs: ${[...flagToName.keys()].join(', ')}.`);
    } else if (Object.hasOwn(raw, input)) {
      problems.push(`${flag}: ${flagForInput(input)} is given as well; give it once.`);
    } else {
      raw[input] = value;
    }
  }
  if (problems.length > 0) {
    io.err(problems.join('\n'));
    return exitCodes.invalidInput;
  }
  const result = runFormula(formula, raw);
  if (!result.ok) {
    io.err(formatInputIssues(formula, result.issues));
    return exitCodes.invalidInput;
  }
  const { derivation } = result.value;
  if (json) {
    io.out(JSON.stringify(calcJson(formula, derivation), null, 2));
  } else {
    io.out(formatRun(formula, derivation));
  }
  return exitCodes.ok;
}

/** Issues about inputs, each prefixed with the flag the user typed. */
export function formatInputIssues(formula: AnyFormula, issues: readonly Issue[]): string {
  return issues
    .map((it) => {
      const input = it.path[0];
      const prefix = typeof input === 'string' && input in formula.inputs ? `${flagForInput(input)}: ` : '';
      return `${it.severity === 'warning' ? 'warning: ' : ''}${prefix}${it.message}`;
    })
    .join('\n');
}

function originText(origin: Origin): string {
  switch (origin.kind) {
    case 'entered':
      return 'entered';
    case 'default':
      return 'default';
    case 'assumption':
      return origin.overridden
        ? `assumption ${origin.assumptionId}, overridden${origin.reason ? `: ${origin.reason}` : ''}`
        : `assumption ${origin.assumptionId}, published default`;
    case 'record':
      return `from the record: ${origin.description}`;
    case 'computed':
      return `computed by ${origin.derivation.formulaId}`;
  }
}

function formatRun(formula: AnyFormula, derivation: Derivation): string {
  const outputs = derivation.outputs
    .map((it) => `${it.label} ${withUnit(it.value, it.unit, formula.outputs[it.name]?.decimals)}`)
    .join('; ');
  const inputs = derivation.inputs
    .map((it) => `${it.label} ${withUnit(typeof it.value === 'number' ? formatPlain(it.value) : it.value, it.unit)}${it.origin.kind === 'entered' ? '' : ` (${originText(it.origin)})`}`)
    .join('; ');
  const sources = derivation.sourceIds.map((id) => findSource(id)).filter((it) => it !== undefined);
  return [
    `${formula.id}: ${outputs}`,
    `  from ${inputs}`,
    `  formula: ${formula.expression}`,
    ...sources.map((it) => `  source: ${citeShort(it)}`),
    ...(formula.notes ?? []).map((it) => `  note: ${it}`),
    `  ${decisionSupportCaution}`,
  ].join('\n');
}

function calcJson(formula: AnyFormula, derivation: Derivation): unknown {
  return {
    calculator: formula.id,
    outputs: Object.fromEntries(derivation.outputs.map((it) => [it.name, { value: it.value, unit: it.unit, label: it.label }])),
    derivation,
    sources: derivation.sourceIds.map((id) => findSource(id)),
    caution: decisionSupportCaution,
  };
}

function formatDescription(description: FormulaDescription): string {
  const inputs = description.inputs.map((input) => {
    // The ranges the calculator checks (core/formulas/describe.ts reads them from the same specs):
    // per unit for a number entered with a chosen unit, with excluded ends and whole numbers marked.
    const unitName = input.unit === '1' ? (input.integer ? 'count' : 'fraction') : input.unit;
    const domain =
      input.kind === 'choice'
        ? `one of ${input.choices!.join(' | ')}`
        : input.rangesByUnit
          ? Object.entries(input.rangesByUnit).map(([unit, range]) => `${unit} ${formatPlain(range.min)}–${formatPlain(range.max)}`).join(' or ')
          : `${unitName}, ${formatPlain(input.min!)}–${formatPlain(input.max!)}${input.range!.includes('(') ? ` ${input.range!.slice(input.range!.indexOf('('))}` : ''}${input.integer ? ', whole number' : ''}`;
    const fallback =
      input.default !== undefined ? `; default ${input.default}${input.defaultFrom ? ` (${input.defaultFrom})` : ''}` : '';
    const needed = input.usedWhen ? `; used only with ${input.usedWhen}` : input.required ? '' : input.default === undefined ? '; optional' : '';
    return `    ${input.flag} <${domain}>  ${input.meaning}${fallback}${needed}`;
  });
  const outputs = description.outputs.map((it) => `    ${it.name} (${it.unit === '' ? 'text' : it.unit})  ${it.meaning}`);
  return [
    `${description.id} — ${description.title}`,
    `  ${description.expression}`,
    '  inputs:',
    ...inputs,
    '  outputs:',
    ...outputs,
    ...description.sources.map((it) => `  source: ${citeShort(it)}`),
  ].join('\n');
}
