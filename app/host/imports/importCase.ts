import { basename } from 'node:path';
import type { Case } from '../../../core/model/caseFile';
import { parseCase } from '../../../core/model/parseCase';
import { formatAmount } from '../../../core/numbers/formatNumber';
import { fail, issue, ok, type Issue, type Result } from '../../../core/result';
import type { CaseStore, DiskRevision, OpenedCase } from '../caseStore';
import type { CodeMap } from './codeMap';
import { readCsvImport, type CsvKind } from './csvImport';
import type { DateOrder } from './importDates';
import { readFhirImport } from './fhirImport';
import type { ImportPlan, ProposedEntry, Rejected } from './importPlan';

/**
 * One import into one case, shared by the command line (`import`) and the
 * host contract (importDryRun, importCommit), so both read, screen and save
 * an import the same way:
 * 1. the source is read as a FHIR R4 Bundle or as CSV (csvImport.ts, fhirImport.ts);
 * 2. the proposed entries are merged into the case and the merge is checked by
 *    the case model; an entry it refuses is rejected with the model's message
 *    (the same as `check`), with where it came from, and the rest checked again;
 * 3. the preview says what would be added (counts, the first rows in words),
 *    every rejected row, every code not known, and cautions (a Patient whose
 *    birth date or sex differs from the case);
 * 4. a commit saves the merged case through the case store (atomic, one
 *    journal line, refused if the file changed since it was opened).
 * Nothing is written before step 4, and step 4 writes exactly the previewed entries.
 * Steps 1 and 2 run as `previewSteps`, a generator that names each step before
 * its work, so the host can report progress and stop between steps.
 */

/** The source of an import: a name for messages and its text. */
export interface ImportSource {
  /** The file as messages name it (a path on the command line, the chosen file's name in the app). */
  readonly name: string;
  readonly text: string;
}

export interface ImportChoices {
  /** 'fhir' or 'csv'; detected from the text when not given (a JSON object is a Bundle). */
  readonly format?: 'csv' | 'fhir';
  /** For CSV: transfusions or results, guessed from the headers when not given. */
  readonly csvKind?: CsvKind;
  /** For CSV: field → header, where the user named the column; the rest is guessed. */
  readonly mapping?: Readonly<Record<string, string>>;
  readonly dateOrder?: DateOrder;
  /** For FHIR: the local code map for Observations LOINC has no code for (codeMap.ts). */
  readonly codeMap?: CodeMap;
}

/**
 * What an import would add, by record kind: the transfusion list's entries by their kind (simple
 * transfusions, red-cell exchanges, venesections: the record keeps all three in one list, but a reader
 * counts them apart), the other lists whole.
 */
export type ImportCounts = Readonly<Record<'transfusions' | 'exchanges' | 'venesections' | Exclude<ProposedEntry['list'], 'transfusions'>, number>>;

/** The count an entry adds to: its list, or for the transfusion list its kind. */
function countedAs(entry: ProposedEntry): keyof ImportCounts {
  if (entry.list !== 'transfusions') return entry.list;
  return entry.entry['kind'] === 'exchange' ? 'exchanges' : entry.entry['kind'] === 'venesection' ? 'venesections' : 'transfusions';
}

/** Every kind's count, none left out (a kind not in the import counts 0). */
export function importCounts(entries: readonly ProposedEntry[]): ImportCounts {
  const counts = { transfusions: 0, exchanges: 0, venesections: 0, results: 0, weights: 0, heights: 0 };
  for (const entry of entries) counts[countedAs(entry)] += 1;
  return counts;
}

/** What an import would add to a case, before anything is written. */
export interface ImportPreview {
  readonly format: ImportPlan['format'];
  /** What the import understood: the column mapping, the date order, the resources read. */
  readonly understood: readonly string[];
  /** The entries that would be added, after the case model's check. */
  readonly entries: readonly ProposedEntry[];
  readonly counts: ImportCounts;
  /** Rows or resources not imported: the reader's and the case model's refusals, with where and why. */
  readonly rejected: readonly Rejected[];
  /** Codes the import does not know (listed, never dropped silently). */
  readonly unknownCodes: ImportPlan['unknownCodes'];
  /** Differences between the source's Patient and the case; the case is never changed by them. */
  readonly cautions: readonly string[];
  /** Errors of the merged case that no proposed entry explains (the case's own); nothing can be imported while they stand. */
  readonly caseProblems: readonly Issue[];
  /** The case with the entries added, as it would be saved. */
  readonly merged: Readonly<Record<string, unknown>>;
}

/** An id not used in the case: 'imp-<date>', then '-2', '-3'. */
function idMaker(caseFile: Case): (date: string) => string {
  const used = new Set<string>([...caseFile.transfusions.map((it) => it.id), ...caseFile.results.map((it) => it.id)]);
  // The next suffix to try per date: every id below it is taken (used only grows), so an
  // import of many rows on one date does not test the same taken ids again for each row.
  const nextSuffix = new Map<string, number>();
  return (date) => {
    let suffix = nextSuffix.get(date) ?? 1;
    let id = suffix === 1 ? `imp-${date}` : `imp-${date}-${suffix}`;
    while (used.has(id)) {
      suffix += 1;
      id = `imp-${date}-${suffix}`;
    }
    used.add(id);
    nextSuffix.set(date, suffix + 1);
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

/**
 * Where a merged-case issue points back to a proposed entry: its list and its index past the
 * case's own entries. The proposed entries are split by list once, not once per issue.
 */
function entryFinder(caseFile: Case, entries: readonly ProposedEntry[]): (problem: Issue) => ProposedEntry | undefined {
  const byList = new Map<ProposedEntry['list'], ProposedEntry[]>();
  for (const entry of entries) {
    const list = byList.get(entry.list);
    if (list) list.push(entry);
    else byList.set(entry.list, [entry]);
  }
  const own: Record<string, number> = { transfusions: caseFile.transfusions.length, results: caseFile.results.length };
  return (problem) => {
    const [first, second, third] = problem.path;
    if ((first === 'transfusions' || first === 'results') && typeof second === 'number') return byList.get(first)?.[second - own[first]!];
    if (first === 'patient' && (second === 'weights' || second === 'heights') && typeof third === 'number') return byList.get(second)?.[third - caseFile.patient[second].length];
    return undefined;
  };
}

/** One step of an import as it begins, in words, for the progress the app shows. */
export interface ImportStep {
  /** "Reading tx.csv", "Checking 60,000 rows against the case". */
  readonly step: string;
  /** True for a step that repeats an earlier one (a check again without the rows refused), which no caller foresaw. */
  readonly repeated: boolean;
}

/** "1 row", "60,000 rows" (grouped with the project's number formatter). */
const counted = (count: number, one: string, many: string) => `${formatAmount(count, 0)} ${count === 1 ? one : many}`;

/**
 * Check the merged case with the case model; an entry the model refuses is
 * rejected with the model's message (the same as check) and the rest checked again.
 * Yields a step before each pass.
 */
function* screenSteps(caseFile: Case, plan: ImportPlan): Generator<ImportStep, { entries: ProposedEntry[]; rejected: Rejected[]; other: Issue[] }, void> {
  let entries = [...plan.entries];
  const rejected: Rejected[] = [];
  const [one, many] = plan.format === 'csv' ? ['row', 'rows'] : ['entry', 'entries'];
  for (let pass = 0; pass < 5; pass += 1) {
    yield pass === 0
      ? { step: `Checking ${counted(entries.length, one, many)} against the case`, repeated: false }
      : { step: `Checking ${counted(entries.length, one, many)} against the case again (pass ${pass + 1}, without the ${counted(rejected.length, one, many)} refused)`, repeated: true };
    const parsed = parseCase(merged(caseFile, entries));
    if (parsed.ok) return { entries, rejected, other: [] };
    const refused = new Set<ProposedEntry>();
    const other: Issue[] = [];
    const entryOfIssue = entryFinder(caseFile, entries);
    for (const problem of parsed.issues) {
      const entry = entryOfIssue(problem);
      if (entry) {
        const column = typeof problem.path[2] === 'string' ? entry.columns?.[problem.path[2]] : undefined;
        if (!refused.has(entry)) rejected.push({ where: entry.where, reason: column === undefined ? problem.message : `column "${column.slice(0, 60)}": ${problem.message}` });
        refused.add(entry);
      } else other.push(problem);
    }
    if (refused.size === 0) return { entries, rejected, other };
    entries = entries.filter((it) => !refused.has(it));
  }
  return { entries, rejected, other: [] };
}

/** The cautions of a source's Patient against the case: birth date and sex only, never written over the case. */
function patientCautions(caseFile: Case, patient: ImportPlan['patient']): string[] {
  if (!patient) return [];
  const cautions: string[] = [];
  const age = caseFile.patient.age;
  const caseBirth = age.kind === 'birth-date' ? age.birthDate : undefined;
  if (patient.birthDate && caseBirth && patient.birthDate !== caseBirth) {
    cautions.push(`Caution: the bundle's birth date ${patient.birthDate} differs from the case's ${caseBirth}; check that this is the same patient. The case was not changed.`);
  }
  if (patient.sexAtBirth && patient.sexAtBirth !== caseFile.patient.sexAtBirth) {
    cautions.push(`Caution: the bundle's sex ${patient.sexAtBirth} differs from the case's ${caseFile.patient.sexAtBirth}; the case was not changed.`);
  }
  return cautions;
}

/** The source read as a plan of entries (FHIR or CSV, as chosen or detected). */
function readPlan(source: ImportSource, caseFile: Case, choices: ImportChoices): Result<ImportPlan> {
  const format = choices.format ?? (source.text.trimStart().startsWith('{') ? 'fhir' : 'csv');
  if (format === 'fhir') {
    let json: unknown;
    try {
      json = JSON.parse(source.text);
    } catch (error) {
      return fail(issue('invalid_file', [], `${source.name} is not valid JSON: ${(error as Error).message}.`));
    }
    return readFhirImport(json, caseFile, choices.codeMap);
  }
  return readCsvImport(source.text, caseFile, {
    ...(choices.csvKind === undefined ? {} : { kind: choices.csvKind }),
    ...(choices.mapping === undefined ? {} : { mapping: choices.mapping }),
    ...(choices.dateOrder === undefined ? {} : { dateOrder: choices.dateOrder }),
  });
}

/**
 * The preview of an import as steps: each step is yielded, in words, before its work is done
 * (reading the source; checking the merged case, again for each pass without the entries the
 * case model refused), and the preview is the generator's return value. `previewImport` runs it
 * through; `previewImportStepwise` lets a caller report each step and stop between them.
 *
 * @param source - the file's name (for messages) and text
 * @param caseFile - the case as opened
 * @param choices - as for previewImport
 * @returns a generator of steps whose return value is previewImport's answer
 * @example [...previewSteps({ name: 'tx.csv', text }, caseFile)] → [{ step: 'Reading tx.csv', repeated: false }, { step: 'Checking 2 rows against the case', repeated: false }]
 */
export function* previewSteps(source: ImportSource, caseFile: Case, choices: ImportChoices = {}): Generator<ImportStep, Result<ImportPreview>, void> {
  yield { step: `Reading ${source.name}`, repeated: false };
  const plan = readPlan(source, caseFile, choices);
  if (!plan.ok) return plan;
  const screened = yield* screenSteps(caseFile, plan.value);
  return ok({
    format: plan.value.format,
    understood: plan.value.understood,
    entries: screened.entries,
    counts: importCounts(screened.entries),
    rejected: [...plan.value.rejected, ...screened.rejected],
    unknownCodes: plan.value.unknownCodes,
    cautions: patientCautions(caseFile, plan.value.patient),
    caseProblems: screened.other,
    merged: merged(caseFile, screened.entries),
  });
}

/**
 * Read a source and say what it would add to a case. Nothing is written.
 *
 * @param source - the file's name (for messages) and text
 * @param caseFile - the case as opened (its units are used; its entries keep their ids)
 * @param choices - format, CSV kind, column mapping, date order, code map; detected or guessed where not given, and said so
 * @returns the preview, or issues when the source cannot be read at all (not JSON, not a Bundle, no header row, a required column missing)
 */
export function previewImport(source: ImportSource, caseFile: Case, choices: ImportChoices = {}): Result<ImportPreview> {
  const steps = previewSteps(source, caseFile, choices);
  for (;;) {
    const next = steps.next();
    if (next.done) return next.value;
  }
}

/**
 * previewImport one step at a time: `beforeStep` is awaited before each step's work and may
 * stop the preview there (it answers false), so that a host can report progress, answer the
 * page between steps and honour a cancel.
 *
 * @param source - as for previewImport
 * @param caseFile - as for previewImport
 * @param choices - as for previewImport
 * @param beforeStep - told each step as it begins; true to go on, false to stop
 * @returns previewImport's answer, or 'stopped' when `beforeStep` stopped it (nothing is written either way)
 */
export async function previewImportStepwise(
  source: ImportSource,
  caseFile: Case,
  choices: ImportChoices,
  beforeStep: (step: ImportStep) => Promise<boolean>,
): Promise<Result<ImportPreview> | 'stopped'> {
  const steps = previewSteps(source, caseFile, choices);
  for (;;) {
    const next = steps.next();
    if (next.done) return next.value;
    if (!(await beforeStep(next.value))) return 'stopped';
  }
}

/** How many proposed entries a preview shows in words (the counts cover all): the command line and the app alike. */
export const previewRowsShown = 5;

/** One proposed entry in words, for the preview. */
export function describeEntry(entry: ProposedEntry): string {
  const e = entry.entry as Record<string, unknown> & {
    measured?: { value: number; unit: string };
    volume?: { value: number; unit: string };
    volumeIn?: { value: number; unit: string };
    volumeRemoved?: { value: number; unit: string };
    weight?: { value: number };
    height?: { value: number };
  };
  if (entry.list === 'transfusions') {
    const hct = e['unitHaematocrit'] === null ? 'not given, the product default applies' : String(e['unitHaematocrit']);
    if (e['kind'] === 'exchange') {
      return `${String(e['date'])} ${String(e['method'])} exchange ${e.volumeIn?.value} mL in (unit haematocrit ${hct}), ${e.volumeRemoved?.value} mL out, patient haematocrit ${String(e['patientHaematocrit'])}`;
    }
    if (e['kind'] === 'venesection') return `${String(e['date'])} venesection ${e.volumeRemoved?.value} mL, patient haematocrit ${String(e['patientHaematocrit'])}`;
    return `${String(e['date'])} transfusion ${e.volume?.value} mL, unit haematocrit ${hct}`;
  }
  if (entry.list === 'results') return `${String(e['date'])} ${String(e['kind'])} ${e.measured?.value} ${e.measured?.unit}`;
  if (entry.list === 'weights') return `${String(e['date'])} weight ${e.weight?.value} kg`;
  return `${String(e['date'])} height ${e.height?.value} cm`;
}

/** "1 entry", "3 entries". */
export const entriesWord = (count: number): string => `${count} entr${count === 1 ? 'y' : 'ies'}`;

/**
 * Save a previewed import through the case store: exactly the preview's
 * entries, atomically, with one journal line naming the source; refused if
 * the file changed on disk since `expected` (nothing written).
 *
 * @param store - the workspace's case store
 * @param opened - the case the preview was made from
 * @param preview - previewImport's answer for that case
 * @param sourceName - the source as the journal names it (its base name)
 * @param expected - the revision the caller saw; defaults to the opened one
 */
export function commitImport(store: CaseStore, opened: OpenedCase, preview: ImportPreview, sourceName: string, expected?: DiskRevision): Promise<Result<OpenedCase>> {
  return store.save(opened.fileName, preview.merged, {
    expected: expected ?? opened.revision,
    change: `imported ${entriesWord(preview.entries.length)} from ${basename(sourceName)}`,
  });
}
