import {
  defaultProductCatalogue,
  findProduct,
  parseProductCatalogue,
  proposePracticalDose,
  type DoseTarget,
  type PracticalDoseProposal,
  type Product,
  type ProductCatalogue,
} from '../../core/dosing';
import { parseDecimal } from '../../core/numbers/parseDecimal';
import { citeShort, findSource } from '../../core/references';
import { fail, formatIssues, issue, ok, type Result } from '../../core/result';
import { kg } from '../../core/units/quantity';
import type { ParsedArgs } from './args';
import type { CliIo, TextIo } from './io';
import { decisionSupportCaution } from './format';
import { exitCodes } from './io';

export const doseUsage = `Usage:
  chelation-ledger dose --list [--catalogue local.json] [--json]
  chelation-ledger dose --product <id> (--target-mg-per-kg-per-day N | --target-mg-per-kg-per-administration N)
                        --weight-kg N [--administrations-per-day N] [--measurable-step-ml 0.1]
                        [--max-pieces-per-administration 12] [--catalogue local.json] [--json]
The nearest practical regimen with the available strengths (tablets, oral solution, vials), its mg/kg/day
and the difference from the intended dose. --catalogue replaces the shipped strengths with the local formulary's.`;

/** Reading the local catalogue goes through the io handed in: tests pass a fake, the binary reads the file. */
export type DoseIo = CliIo & TextIo;

function loadCatalogue(path: string | undefined, io: DoseIo): Result<ProductCatalogue> {
  if (path === undefined) return ok(defaultProductCatalogue);
  const text = io.readText(path, 'product catalogue', ['--catalogue']);
  if (!text.ok) return text;
  let json: unknown;
  try {
    json = JSON.parse(text.value);
  } catch (error) {
    return fail(issue('invalid_file', ['--catalogue'], `Product catalogue ${path} is not valid JSON: ${(error as Error).message}.`));
  }
  return parseProductCatalogue(json);
}

function strengthsText(product: Product): string {
  switch (product.kind) {
    case 'tablets':
      return product.strengths.map((it) => `${it.strengthMg} mg${it.halvable ? ' (halves allowed)' : ''}`).join(', ');
    case 'oral-solution':
      return `${product.concentrationMgPerMl} mg/mL`;
    case 'vials':
      return product.vialStrengthsMg.map((it) => `${it} mg`).join(', ');
  }
}

function sourcesText(sourceIds: readonly string[]): string[] {
  return sourceIds.map((id) => {
    const source = findSource(id);
    return `  source: ${source ? `${source.title} (${citeShort(source)})` : `${id} (local catalogue)`}`;
  });
}

function formatProposal(proposal: PracticalDoseProposal): string {
  return [
    `${proposal.productName}: ${proposal.combinationText} per administration`,
    `  ${proposal.description}`,
    ...proposal.assumptions.map((it) => `  assumption: ${it}`),
    ...sourcesText(proposal.sourceIds),
    `  ${decisionSupportCaution}`,
  ].join('\n');
}

function numberOption(args: ParsedArgs, flag: string, problems: string[]): number | undefined {
  const raw = args.options[flag];
  if (raw === undefined) return undefined;
  const value = parseDecimal(raw);
  if (value === undefined) {
    problems.push(`${flag}: "${raw}" is not a number.`);
    return undefined;
  }
  return value;
}

const flagOfField: Readonly<Record<string, string>> = {
  weightKg: '--weight-kg',
  targetMgPerKgPerDay: '--target-mg-per-kg-per-day',
  targetMgPerKgPerAdministration: '--target-mg-per-kg-per-administration',
  administrationsPerDay: '--administrations-per-day',
  measurableStepMl: '--measurable-step-ml',
  maxPiecesPerAdministration: '--max-pieces-per-administration',
  product: '--product',
};

const known = new Set(['--catalogue', ...Object.values(flagOfField)]);

/** `dose`: list the products, or propose the nearest practical regimen for one. */
export function doseCommand(args: ParsedArgs, io: DoseIo): number {
  const json = args.switches.has('--json');
  const problems: string[] = [];
  for (const flag of Object.keys(args.options)) if (!known.has(flag)) problems.push(`${flag}: not an option of dose.\n${doseUsage}`);
  for (const flag of args.missingValues) problems.push(`${flag}: a value is missing after the flag.`);
  if (args.positionals.length > 0) problems.push(`Unexpected word "${args.positionals[0]}": options are given as --<option> <value>.`);
  const catalogue = loadCatalogue(args.options['--catalogue'], io);
  if (!catalogue.ok) {
    io.err(formatIssues(catalogue.issues));
    return exitCodes.invalidInput;
  }
  if (args.switches.has('--list')) {
    io.out(
      json
        ? JSON.stringify(catalogue.value, null, 2)
        : catalogue.value.map((it) => [`${it.id} — ${it.name}: ${strengthsText(it)}`, ...(it.note ? [`  note: ${it.note}`] : []), ...sourcesText(it.sourceIds)].join('\n')).join('\n'),
    );
    return exitCodes.ok;
  }
  const productId = args.options['--product'];
  if (productId === undefined) {
    io.err(doseUsage);
    return exitCodes.usage;
  }
  const perDay = numberOption(args, '--target-mg-per-kg-per-day', problems);
  const perAdministration = numberOption(args, '--target-mg-per-kg-per-administration', problems);
  const weight = numberOption(args, '--weight-kg', problems);
  const administrations = numberOption(args, '--administrations-per-day', problems);
  const step = numberOption(args, '--measurable-step-ml', problems);
  const maxPieces = numberOption(args, '--max-pieces-per-administration', problems);
  if ((perDay === undefined) === (perAdministration === undefined)) {
    problems.push('Give exactly one of --target-mg-per-kg-per-day and --target-mg-per-kg-per-administration.');
  }
  if (weight === undefined && args.options['--weight-kg'] === undefined) problems.push('--weight-kg: the body weight is required.');
  const product = findProduct(catalogue.value, productId);
  if (!product.ok) problems.push(`--product: ${product.issues[0]!.message}`);
  if (problems.length > 0 || !product.ok || weight === undefined) {
    io.err(problems.join('\n'));
    return exitCodes.invalidInput;
  }
  const target: DoseTarget =
    perDay !== undefined ? { kind: 'per-kg-per-day', mgPerKgPerDay: perDay } : { kind: 'per-kg-per-administration', mgPerKgPerAdministration: perAdministration! };
  const proposed = proposePracticalDose({
    product: product.value,
    target,
    weightKg: kg(weight),
    administrationsPerDay: administrations ?? 1,
    ...(step !== undefined ? { measurableStepMl: step } : {}),
    ...(maxPieces !== undefined ? { maxPiecesPerAdministration: maxPieces } : {}),
  });
  if (!proposed.ok) {
    io.err(proposed.issues.map((it) => `${flagOfField[String(it.path[0])] ?? String(it.path[0])}: ${it.message}`).join('\n'));
    return exitCodes.invalidInput;
  }
  io.out(json ? JSON.stringify({ ...proposed.value, caution: decisionSupportCaution }, null, 2) : formatProposal(proposed.value));
  return exitCodes.ok;
}
