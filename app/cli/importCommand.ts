import { basename, dirname } from 'node:path';
import type { Case } from '../../core/model/caseFile';
import { parseCase } from '../../core/model/parseCase';
import { formatIssues, type Issue } from '../../core/result';
import { readCsvImport, type CsvKind } from '../host/imports/csvImport';
import { readFhirImport } from '../host/imports/fhirImport';
import type { ImportPlan, ProposedEntry, Rejected } from '../host/imports/importPlan';
import type { DateOrder } from '../host/imports/importDates';
import type { ParsedArgs } from './args';
import type { StoreIo } from './editCommands';
import { exitCodes, type CliIo, type TextIo } from './io';

export const importUsage = `Usage:
  chelation-ledger import <file.csv|bundle.json> --into <case.json> [--dry-run]
      [--kind transfusions|results] [--map field=Header,...] [--date-order day-first|month-first]
Shows what would be added (counts, the first rows, every rejected row with its line and reason);
adds it only without --dry-run, through the case store (atomic save, one journal line).
CSV: transfusions (date, volume, haematocrit or product, units) or results (date, test, value, unit).
FHIR R4 Bundle (JSON): Observations by LOINC code, red-cell transfusion Procedures, Patient birth date and sex.`;

const known = ['--into', '--kind', '--map', '--date-order'];
const shownRows = 5;

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

/** An id not used in the case: 'imp-<date>', then '-2', '-3'. */
function idMaker(caseFile: Case): (date: string) => string {
  const used = new Set<string>([...caseFile.transfusions.map((it) => it.id), ...caseFile.results.map((it) => it.id)]);
  return (date) => {
    let id = `imp-${date}`;
    for (let n = 2; used.has(id); n += 1) id = `imp-${date}-${n}`;
    used.add(id);
    return id;
  };
}

/** The case with the proposed entries added (weights and heights into the patient block). */
function merged(caseFile: Case, entries: readonly ProposedEntry[]): Record<string, unknown> {
  const nextId = idMaker(caseFile);
  const add = (list: ProposedEntry['list']) => entries.filter((it) => it.list === list).map((it) => it.entry);
  return {
    ...caseFile,
    patient: { ...caseFile.patient, weights: [...caseFile.patient.weights, ...add('weights')], heights: [...caseFile.patient.heights, ...add('heights')] },
    transfusions: [...caseFile.transfusions, ...add('transfusions').map((entry) => ({ id: nextId(String(entry['date'])), ...entry }))],
    results: [...caseFile.results, ...add('results').map((entry) => ({ id: nextId(String(entry['date'])), ...entry }))],
  };
}

/** Where a merged-case issue points back to a proposed entry: its list and its index past the case's own entries. */
function entryOfIssue(caseFile: Case, entries: readonly ProposedEntry[], problem: Issue): ProposedEntry | undefined {
  const [first, second, third] = problem.path;
  const lists: Record<string, number> = { transfusions: caseFile.transfusions.length, results: caseFile.results.length };
  if (typeof first === 'string' && first in lists && typeof second === 'number') {
    return entries.filter((it) => it.list === first)[second - lists[first]!];
  }
  if (first === 'patient' && (second === 'weights' || second === 'heights') && typeof third === 'number') {
    return entries.filter((it) => it.list === second)[third - caseFile.patient[second].length];
  }
  return undefined;
}

/**
 * Check the merged case with the case model; an entry the model refuses is
 * rejected with the model's message (the same as check) and the rest checked again.
 */
function screen(caseFile: Case, plan: ImportPlan): { entries: ProposedEntry[]; rejected: Rejected[]; other: Issue[] } {
  let entries = [...plan.entries];
  const rejected: Rejected[] = [];
  for (let pass = 0; pass < 5; pass += 1) {
    const parsed = parseCase(merged(caseFile, entries));
    if (parsed.ok) return { entries, rejected, other: [] };
    const refused = new Set<ProposedEntry>();
    const other: Issue[] = [];
    for (const problem of parsed.issues) {
      const entry = entryOfIssue(caseFile, entries, problem);
      if (entry) {
        if (!refused.has(entry)) rejected.push({ where: entry.where, reason: problem.message });
        refused.add(entry);
      } else other.push(problem);
    }
    if (refused.size === 0) return { entries, rejected, other };
    entries = entries.filter((it) => !refused.has(it));
  }
  return { entries, rejected, other: [] };
}

function describeEntry(entry: ProposedEntry): string {
  const e = entry.entry as Record<string, unknown> & { measured?: { value: number; unit: string }; volume?: { value: number; unit: string }; weight?: { value: number }; height?: { value: number } };
  if (entry.list === 'transfusions') return `${String(e['date'])} transfusion ${e.volume?.value} mL, unit haematocrit ${e['unitHaematocrit'] === null ? 'not given (product default)' : String(e['unitHaematocrit'])}`;
  if (entry.list === 'results') return `${String(e['date'])} ${String(e['kind'])} ${e.measured?.value} ${e.measured?.unit}`;
  if (entry.list === 'weights') return `${String(e['date'])} weight ${e.weight?.value} kg`;
  return `${String(e['date'])} height ${e.height?.value} cm`;
}

/** `import <file> --into <case.json> [--dry-run] [--kind] [--map] [--date-order]`. */
export async function importCommand(args: ParsedArgs, io: CliIo & StoreIo & TextIo): Promise<number> {
  if (args.switches.has('--help')) {
    io.out(importUsage);
    return exitCodes.ok;
  }
  const file = args.positionals[0];
  const into = args.options['--into'];
  const problems = Object.keys(args.options)
    .filter((flag) => !known.includes(flag))
    .map((flag) => `${flag}: not an option of import (${[...known, '--dry-run'].join(', ')}).`);
  for (const flag of args.missingValues) problems.push(`${flag}: a value is missing after the flag.`);
  const kind = args.options['--kind'];
  if (kind !== undefined && kind !== 'transfusions' && kind !== 'results') problems.push(`--kind: "${kind}" is not one of: transfusions, results.`);
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
  const trimmed = text.value.trimStart();
  let plan;
  if (trimmed.startsWith('{')) {
    let json: unknown;
    try {
      json = JSON.parse(text.value);
    } catch (error) {
      io.err(`${file} is not valid JSON: ${(error as Error).message}.`);
      return exitCodes.invalidInput;
    }
    plan = readFhirImport(json, caseFile);
  } else {
    plan = readCsvImport(text.value, caseFile, {
      ...(kind === undefined ? {} : { kind: kind as CsvKind }),
      mapping: mapping as Record<string, string>,
      ...(dateOrder === undefined ? {} : { dateOrder: dateOrder as DateOrder }),
    });
  }
  if (!plan.ok) {
    io.err(`${file}: nothing was imported.`);
    io.err(formatIssues(plan.issues));
    return exitCodes.invalidInput;
  }
  const screened = screen(caseFile, plan.value);
  const rejected = [...plan.value.rejected, ...screened.rejected];
  const lines: string[] = [`Import from ${file} into ${into} (${caseFile.patient.label}):`, ...plan.value.understood.map((it) => `  ${it}`)];
  const byList = (list: ProposedEntry['list']) => screened.entries.filter((it) => it.list === list).length;
  lines.push(`${args.switches.has('--dry-run') ? 'Would add' : 'Adding'}: ${byList('transfusions')} transfusion(s), ${byList('results')} result(s), ${byList('weights')} weight(s), ${byList('heights')} height(s).`);
  for (const entry of screened.entries.slice(0, shownRows)) lines.push(`  ${entry.where}: ${describeEntry(entry)}`);
  if (screened.entries.length > shownRows) lines.push(`  … and ${screened.entries.length - shownRows} more`);
  if (rejected.length > 0) {
    lines.push(`Rejected: ${rejected.length} (not imported):`);
    for (const row of rejected) lines.push(`  ${row.where}: ${row.reason}`);
  }
  if (plan.value.unknownCodes.length > 0) {
    lines.push(`Codes not known to the import (not imported): ${plan.value.unknownCodes.length}`);
    for (const it of plan.value.unknownCodes) lines.push(`  ${it.where}: ${it.code}${it.display ? ` (${it.display})` : ''}`);
  }
  const patient = plan.value.patient;
  if (patient) {
    const age = caseFile.patient.age;
    const caseBirth = age.kind === 'birth-date' ? age.birthDate : undefined;
    if (patient.birthDate && caseBirth && patient.birthDate !== caseBirth) lines.push(`Caution: the bundle's birth date ${patient.birthDate} differs from the case's ${caseBirth}; check that this is the same patient. The case was not changed.`);
    if (patient.sexAtBirth && patient.sexAtBirth !== caseFile.patient.sexAtBirth) lines.push(`Caution: the bundle's sex ${patient.sexAtBirth} differs from the case's ${caseFile.patient.sexAtBirth}; the case was not changed.`);
  }
  if (screened.other.length > 0) {
    io.out(lines.join('\n'));
    io.err(`${into}: the case has errors of its own; nothing was imported.`);
    io.err(formatIssues(screened.other));
    return exitCodes.invalidInput;
  }
  if (args.switches.has('--dry-run') || screened.entries.length === 0) {
    lines.push(args.switches.has('--dry-run') ? 'Nothing was added (dry run); run again without --dry-run to add it.' : 'Nothing to add.');
    io.out(lines.join('\n'));
    return rejected.length > 0 && screened.entries.length === 0 ? exitCodes.invalidInput : exitCodes.ok;
  }
  const saved = await store.save(fileName, merged(caseFile, screened.entries), {
    expected: opened.value.revision,
    change: `imported ${screened.entries.length} entr${screened.entries.length === 1 ? 'y' : 'ies'} from ${basename(file)}`,
  });
  io.out(lines.join('\n'));
  if (!saved.ok) {
    io.err(`${into}: nothing was saved.`);
    io.err(formatIssues(saved.issues));
    return exitCodes.invalidInput;
  }
  io.out(`Saved ${into} with ${screened.entries.length} new entr${screened.entries.length === 1 ? 'y' : 'ies'} (one journal line).`);
  return exitCodes.ok;
}
