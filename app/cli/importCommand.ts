import { basename, dirname } from 'node:path';
import { formatIssues, type Issue } from '../../core/result';
import { readCodeMap, type CodeMap } from '../host/imports/codeMap';
import { csvKinds, type CsvKind } from '../host/imports/csvImport';
import type { DateOrder } from '../host/imports/importDates';
import { commitImport, describeEntry, entriesWord, previewImport, previewRowsShown } from '../host/imports/importCase';
import { choiceOf, type ImportChoice } from '../host/imports/importPlan';
import type { ParsedArgs } from './args';
import type { StoreIo } from './editCommands';
import { exitCodes, type CliIo, type TextIo } from './io';

export const importUsage = `Usage:
  chelation-ledger import <file.csv|bundle.json> --into <case.json> [--dry-run]
      [--kind transfusions|exchanges|venesections|results] [--map field=Header,...] [--date-order day-first|month-first] [--code-map codes.json]
Shows what would be added (counts, the first rows, every rejected row with its line, column and reason);
adds it only without --dry-run, through the case store (atomic save, one journal line).
CSV, one kind of record per file; the kind and the column of each field are guessed from the headers and shown:
  transfusions  date, volume, haematocrit (units'), units, product
  exchanges     date, method (manual|automated), volumeIn, haematocrit (units'), units, volumeRemoved, patientHaematocrit, product
  venesections  date, volumeRemoved, patientHaematocrit
  results       date, test, value, unit
  A unit in a header is converted through UCUM: "Volume (L)" to mL, "Hct (%)" to a fraction.
  --map names a column for a field where the guess is wrong: --map volumeIn="Vol in",patientHaematocrit=PreHct
FHIR R4 Bundle (JSON): Observations by LOINC code, red-cell transfusion Procedures, Patient birth date and sex.
--code-map: a JSON file of local codes (system, code → result kind and unit) for Observations
LOINC has no code for (MRI liver iron, liver R2* or T2*, cardiac T2*); codes known to neither are listed.`;

const known = ['--into', '--kind', '--map', '--date-order', '--code-map'];

/** The flag that makes each choice of an import (the host's messages name the choice in words, the command line adds its flag). */
const choiceFlags: Readonly<Record<ImportChoice, (field: string | undefined) => string>> = {
  kind: () => `--kind ${csvKinds.join('|')}`,
  columnMapping: (field) => `--map ${field ?? 'field'}=<header>`,
  dateOrder: () => '--date-order day-first or --date-order month-first',
};

/** One line per choice asked for: how to make it on the command line. */
function flagHints(asked: readonly { readonly choice: ImportChoice | undefined; readonly field?: string | undefined }[]): string[] {
  const hints = asked.filter((it) => it.choice !== undefined).map((it) => `On the command line: ${choiceFlags[it.choice!](it.field)}.`);
  return [...new Set(hints)];
}

/** An import's refusal: an issue that asks for a choice is shown with the flag that makes it instead of the choice's name in the host's terms. */
function importIssues(issues: readonly Issue[]): string {
  return issues
    .map((found) => {
      const choice = choiceOf(found);
      if (choice === undefined) return formatIssues([found]);
      const field = typeof found.path[1] === 'string' ? found.path[1] : undefined;
      return [found.message, ...flagHints([{ choice, field }])].join('\n');
    })
    .join('\n');
}

/** `--map date=Given on,volume=Vol (mL)` → { date: 'Given on', volume: 'Vol (mL)' }. */
function parseMapping(text: string | undefined): Record<string, string> | string {
  if (text === undefined) return {};
  const mapping: Record<string, string> = {};
  for (const pair of text.split(',')) {
    const equals = pair.indexOf('=');
    if (equals <= 0) return `--map: "${pair}" is not field=Header`;
    mapping[pair.slice(0, equals).trim()] = pair.slice(equals + 1).trim();
  }
  return mapping;
}

/** `import <file> --into <case.json> [--dry-run] [--kind] [--map] [--date-order] [--code-map]`: the shared import (app/host/imports/importCase.ts) with its preview in words. */
export async function importCommand(args: ParsedArgs, io: CliIo & StoreIo & TextIo): Promise<number> {
  if (args.switches.has('--help')) {
    io.out(importUsage);
    return exitCodes.ok;
  }
  const file = args.positionals[0];
  const into = args.options['--into'];
  const codeMapPath = args.options['--code-map'];
  const problems = Object.keys(args.options)
    .filter((flag) => !known.includes(flag))
    .map((flag) => `${flag}: not an option of import (${[...known, '--dry-run'].join(', ')}).`);
  for (const flag of args.missingValues) problems.push(`${flag}: a value is missing after the flag.`);
  const kind = args.options['--kind'];
  if (kind !== undefined && !(csvKinds as readonly string[]).includes(kind)) problems.push(`--kind: "${kind}" is not one of: ${csvKinds.join(', ')}.`);
  const dateOrder = args.options['--date-order'];
  if (dateOrder !== undefined && dateOrder !== 'day-first' && dateOrder !== 'month-first') problems.push(`--date-order: "${dateOrder}" is not one of: day-first, month-first.`);
  const mapping = parseMapping(args.options['--map']);
  if (typeof mapping === 'string') problems.push(mapping);
  if (file === undefined || into === undefined || args.positionals.length > 1 || problems.length > 0) {
    if (problems.length > 0) io.err(problems.join('\n'));
    io.err(importUsage);
    return exitCodes.usage;
  }
  const text = io.readText(file, 'import file');
  if (!text.ok) {
    io.err(formatIssues(text.issues));
    return exitCodes.invalidInput;
  }
  const store = io.openStore(dirname(into));
  const fileName = basename(into);
  const opened = await store.open(fileName);
  if (!opened.ok) {
    io.err(`${into}: the case cannot be opened; nothing was imported.`);
    io.err(formatIssues(opened.issues));
    return exitCodes.invalidInput;
  }
  const caseFile = opened.value.caseFile;
  let codeMap: CodeMap | undefined;
  if (codeMapPath !== undefined) {
    const mapText = io.readText(codeMapPath, 'code map', ['--code-map']);
    const read = mapText.ok ? readCodeMap(codeMapPath, mapText.value) : mapText;
    if (!read.ok) {
      io.err(`${codeMapPath}: the code map cannot be used; nothing was imported.`);
      io.err(formatIssues(read.issues));
      return exitCodes.invalidInput;
    }
    codeMap = read.value;
  }
  const previewed = previewImport({ name: file, text: text.value }, caseFile, {
    ...(kind === undefined ? {} : { csvKind: kind as CsvKind }),
    mapping: mapping as Record<string, string>,
    ...(dateOrder === undefined ? {} : { dateOrder: dateOrder as DateOrder }),
    ...(codeMap === undefined ? {} : { codeMap }),
  });
  if (!previewed.ok) {
    if (!previewed.issues[0]?.message.startsWith(file)) io.err(`${file}: nothing was imported.`);
    io.err(importIssues(previewed.issues));
    return exitCodes.invalidInput;
  }
  const preview = previewed.value;
  const { rejected, entries } = preview;
  const lines: string[] = [`Import from ${file} into ${into} (${caseFile.patient.label}):`, ...preview.understood.map((it) => `  ${it}`)];
  const { counts } = preview;
  // Red-cell exchanges and venesections named only when the file holds some (they share the transfusion list).
  const bloodRemoved = [...(counts.exchanges > 0 ? [`${counts.exchanges} red-cell exchange(s)`] : []), ...(counts.venesections > 0 ? [`${counts.venesections} venesection(s)`] : [])];
  lines.push(`${args.switches.has('--dry-run') ? 'Would add' : 'Adding'}: ${[`${counts.transfusions} transfusion(s)`, ...bloodRemoved, `${counts.results} result(s)`, `${counts.weights} weight(s)`, `${counts.heights} height(s)`].join(', ')}.`);
  for (const entry of entries.slice(0, previewRowsShown)) lines.push(`  ${entry.where}: ${describeEntry(entry)}`);
  if (entries.length > previewRowsShown) lines.push(`  … and ${entries.length - previewRowsShown} more`);
  if (rejected.length > 0) {
    lines.push(`Rejected: ${rejected.length} (not imported):`);
    for (const row of rejected) lines.push(`  ${row.where}: ${row.reason}`);
    lines.push(...flagHints(rejected.map((row) => ({ choice: row.choice }))));
  }
  if (preview.unknownCodes.length > 0) {
    lines.push(`Codes not known to the import (not imported): ${preview.unknownCodes.length}`);
    for (const it of preview.unknownCodes) lines.push(`  ${it.where}: ${it.code}${it.display ? ` (${it.display})` : ''}`);
  }
  lines.push(...preview.cautions);
  if (preview.caseProblems.length > 0) {
    io.out(lines.join('\n'));
    io.err(`${into}: the case has errors of its own; nothing was imported.`);
    io.err(formatIssues(preview.caseProblems));
    return exitCodes.invalidInput;
  }
  if (args.switches.has('--dry-run') || entries.length === 0) {
    lines.push(args.switches.has('--dry-run') ? 'Nothing was added (dry run); run again without --dry-run to add it.' : 'Nothing to add.');
    io.out(lines.join('\n'));
    return rejected.length > 0 && entries.length === 0 ? exitCodes.invalidInput : exitCodes.ok;
  }
  const saved = await commitImport(store, opened.value, preview, file);
  io.out(lines.join('\n'));
  if (!saved.ok) {
    io.err(`${into}: nothing was saved.`);
    io.err(formatIssues(saved.issues));
    return exitCodes.invalidInput;
  }
  io.out(`Saved ${into} with ${entriesWord(entries.length)} new (one journal line).`);
  return exitCodes.ok;
}
