import { importKinds } from '../../core/contract';
import type { RecordImportPreview, WorkProgress } from '../hostPort';
import { hostStepText } from './busy';
import { formatNumber } from './format';

/**
 * The Import screen's words and choices: which kinds of file, how the
 * preview the host answered (importDryRun) reads on screen, and how a
 * correction of one column's field becomes the mapping sent back. Every
 * count and row comes from the host's import (the same code as the command
 * line's `import`); nothing here reads the file.
 */
export type ImportKind = (typeof importKinds)[number];
export type DateOrder = 'day-first' | 'month-first';

export const importKindLabels: Readonly<Record<ImportKind, string>> = {
  'csv-transfusions': 'CSV of transfusions',
  'csv-exchanges': 'CSV of red-cell exchanges',
  'csv-venesections': 'CSV of venesections',
  'csv-results': 'CSV of laboratory results',
  'fhir-bundle': 'HL7 FHIR R4 Bundle (JSON)',
};
export const importKindChoices: readonly ImportKind[] = importKinds;

/** The date-order control: as the file implies (ISO dates, or a day above 12), or read day first or month first. */
export const dateOrderChoices = [
  { id: null, label: 'as the file shows them (ISO dates, or a day above 12 settles it)' },
  { id: 'day-first', label: 'day first (25/03/2026 is 25 March)' },
  { id: 'month-first', label: 'month first (03/25/2026 is 25 March)' },
] as const satisfies readonly { id: DateOrder | null; label: string }[];

/** A field of a CSV import in words (the host names the fields; these are the ones it has today). */
const fieldWords: Readonly<Record<string, string>> = {
  date: 'date',
  volume: 'volume',
  haematocrit: 'unit haematocrit',
  units: 'number of units',
  product: 'blood product',
  method: 'exchange method',
  volumeIn: 'volume in',
  volumeRemoved: 'volume removed',
  patientHaematocrit: 'patient haematocrit',
  test: 'test',
  value: 'value',
  unit: 'unit',
};
export const fieldText = (field: string): string => fieldWords[field] ?? field;

/** The kind a chosen file most likely holds: a .json file is a FHIR Bundle; otherwise the CSV kind chosen so far. */
export function kindForFile(fileName: string, current: ImportKind): ImportKind {
  if (/\.json$/i.test(fileName)) return 'fhir-bundle';
  return current === 'fhir-bundle' ? 'csv-transfusions' : current;
}

type CsvMapping = NonNullable<RecordImportPreview['csvMapping']>;

/**
 * The mapping to send (column → field) after the user set one column's
 * field: every column keeps the field it is read as now, the chosen field
 * leaves any other column that had it (one column per field), and a column
 * set to "not read" is left out.
 */
export function withColumnField(mapping: CsvMapping, column: string, field: string | null): Record<string, string> {
  const next: Record<string, string> = {};
  for (const entry of mapping.columns) {
    const chosen = entry.column === column ? field : entry.field === field ? null : entry.field;
    if (chosen !== null) next[entry.column] = chosen;
  }
  return next;
}

/** "1 transfusion", "60,000 transfusions" (grouped as the screens write numbers). */
const plural = (count: number, one: string, many: string) => `${formatNumber(count, 0)} ${count === 1 ? one : many}`;
const listWords: Readonly<Record<string, readonly [string, string]>> = {
  transfusions: ['transfusion', 'transfusions'],
  exchanges: ['red-cell exchange', 'red-cell exchanges'],
  venesections: ['venesection', 'venesections'],
  results: ['result', 'results'],
  weights: ['weight', 'weights'],
  heights: ['height', 'heights'],
};

export interface ImportPreviewView {
  /** "Would add 3 transfusions." or "Nothing would be added." */
  readonly addsText: string;
  readonly canCommit: boolean;
  readonly firstRows: readonly string[];
  readonly rejected: readonly { readonly where: string; readonly reason: string }[];
  readonly rejectedText: string;
  readonly understood: readonly string[];
  /** The mapping's columns with their field in words, and the fields a column may take. */
  readonly columns: readonly { readonly column: string; readonly field: string | null }[];
  readonly fieldChoices: readonly { readonly id: string; readonly label: string }[];
  /** Required fields no column is read as ("test, value, unit"), or null. */
  readonly missingText: string | null;
  readonly warnings: readonly string[];
}

/** The host's preview as the Import screen shows it. */
export function importPreviewView(preview: RecordImportPreview, warnings: readonly string[] = []): ImportPreviewView {
  const added = Object.entries(preview.counts).filter(([, count]) => count > 0);
  const mapping = preview.csvMapping;
  const missing = mapping ? mapping.required.filter((field) => !mapping.columns.some((it) => it.field === field)) : [];
  return {
    addsText: added.length === 0 ? 'Nothing would be added.' : `Would add ${added.map(([list, count]) => plural(count, ...(listWords[list] ?? [list, list]))).join(', ')}.`,
    canCommit: added.length > 0,
    firstRows: preview.firstRows,
    rejected: preview.rejected.map((it) => ({ where: it.line === null ? 'whole file' : `line ${it.line}`, reason: it.reason })),
    rejectedText: preview.rejected.length === 0 ? 'No row is refused.' : `${plural(preview.rejected.length, 'row or entry is', 'rows or entries are')} refused and would not be added:`,
    understood: preview.understood ?? [],
    columns: mapping?.columns ?? [],
    fieldChoices: mapping ? mapping.fields.map((field) => ({ id: field, label: `${fieldText(field)}${mapping.required.includes(field) ? ' (needed)' : ''}` })) : [],
    missingText: missing.length > 0 ? missing.map(fieldText).join(', ') : null,
    warnings,
  };
}

/** After a commit: "Added 3 transfusions from tx.csv to TH-0417." */
export function importedText(counts: Readonly<Record<string, number>>, sourceName: string, caseLabel: string): string {
  const added = Object.entries(counts).filter(([, count]) => count > 0);
  if (added.length === 0) return `Nothing was added from ${sourceName}; ${caseLabel} is unchanged.`;
  return `Added ${added.map(([list, count]) => plural(count, ...(listWords[list] ?? [list, list]))).join(', ')} from ${sourceName} to ${caseLabel}.`;
}

/** The cases an import may go into, by label (the file name when a case cannot be read). */
export function importCaseChoices(cases: readonly { readonly id: string; readonly json: unknown }[]): readonly { readonly id: string; readonly label: string }[] {
  return cases.map((entry) => {
    const label = (entry.json as { patient?: { label?: unknown } } | null)?.patient?.label;
    return { id: entry.id, label: typeof label === 'string' && label !== '' ? label : entry.id };
  });
}

/** An import call under way, as the screen needs it (the store's pending import). */
interface PendingImport {
  readonly what: 'preview' | 'commit';
  readonly label: string;
  readonly progress: WorkProgress | null;
}

/**
 * What the screen says while an import runs: the host's step, with how many of the steps
 * foreseen it is ("Checking 60,000 rows against the case (step 3 of 4)"; the host groups
 * its counts, and so does this with the same formatter), or the call's own label until the host reports.
 */
export function importStepText(pending: PendingImport): string {
  const { progress } = pending;
  if (!progress) return `${pending.label}…`;
  return hostStepText(progress);
}

/** The progress bar of an import under way: its accessible name, and steps done of those foreseen (none yet: an indeterminate bar). */
export function importProgressBar(pending: PendingImport): { readonly label: string; readonly value: number | null; readonly max: number | null } {
  const label = pending.what === 'commit' ? 'Progress of adding the import' : 'Progress of reading the file';
  return pending.progress ? { label, value: pending.progress.done, max: pending.progress.total } : { label, value: null, max: null };
}

/** Said as soon as Cancel is pressed during a commit, until the host answers. */
export function importStoppingText(): string {
  return 'Stopping: the host was asked to stop before it saves anything. The case is read again when it answers.';
}

/** Said when the host answered a Cancel that it could no longer stop (the save had begun, or was done). */
export function importTooLateText(): string {
  return 'Too late to stop: the host had already begun saving the import, and a save is never cut off halfway. The case is read again when it answers, and the screens show what was saved.';
}

/** After a commit the host stopped: "Import stopped: nothing from tx.csv was added to TH-0417; the case is as it was." */
export function importCancelledText(sourceName: string, caseLabel: string): string {
  return `Import stopped: nothing from ${sourceName} was added to ${caseLabel}; the case is as it was.`;
}
