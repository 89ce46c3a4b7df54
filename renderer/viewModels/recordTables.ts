import {
  altBounds,
  astBounds,
  bilirubinBounds,
  bloodLeadBounds,
  cardiacT2StarBounds,
  chelatorDrugs,
  coMedicationDoseBounds,
  coMedicationTimings,
  creatinineBounds,
  deferasiroxFormulations,
  deferiproneFormulations,
  deferoxamineFormulations,
  deferoxamineRoutes,
  exchangeMethods,
  ferritinBounds,
  fieldStrengthsT,
  haemoglobinBounds,
  liverIronBounds,
  liverIronMethods,
  liverR2Bounds,
  liverR2StarBounds,
  liverT2StarBounds,
  neutrophilBounds,
  plateletBounds,
  urinaryCopperBounds,
  urineProteinCreatinineRatioBounds,
  zincBounds,
} from '../../core/model';
import { examinationOutcomes } from '../../core/model/resultEntry';
import { displayUnit } from '../../core/units/displayUnit';
import { choiceWords } from '../../core/words';

/**
 * The four record tables as rows of cells. A cell keeps exactly what the user
 * typed (nothing is rewritten); `rowToEntry` turns a row into the case-file
 * entry that core/model then checks, so every message comes from core's
 * schema in the trade's words.
 */
export const recordTableIds = ['transfusions', 'results', 'chelationPeriods', 'coMedications'] as const;
export type RecordTableId = (typeof recordTableIds)[number];

export type Cells = Readonly<Record<string, string>>;
export interface Row {
  /** The entry id in the case file (stable across edits). */
  readonly id: string;
  readonly cells: Cells;
  /** Fields of the entry that no column shows (a laboratory reference range, a product id): kept as they were. */
  readonly extra?: Readonly<Record<string, unknown>>;
}

export interface ColumnSpec {
  readonly key: string;
  readonly label: string;
  /** Choices for a select; the first is the default of a new row. */
  readonly choices?: (cells: Cells) => readonly string[];
  /** Unit shown in the header (display form). */
  readonly unit?: string;
  readonly width: 'date' | 'narrow' | 'medium' | 'wide';
  /** Path of the case-file field the cell fills, relative to the entry, for matching core's issues. */
  readonly fieldPaths: readonly (readonly string[])[];
}

export const resultKinds = [
  'liver-iron',
  'ferritin',
  'cardiac-t2star',
  'creatinine',
  'alt',
  'neutrophils',
  'haemoglobin',
  'blood-lead',
  'urinary-copper',
  'platelets',
  'ast',
  'bilirubin',
  'urine-protein-creatinine-ratio',
  'zinc',
  'audiology',
  'eye-examination',
] as const;
/** Results recorded by outcome rather than by a number. */
const examinationKinds: readonly string[] = ['audiology', 'eye-examination'];
type ResultKindName = (typeof resultKinds)[number];

const liverUnitsByMethod: Readonly<Record<string, readonly string[]>> = {
  biopsy: Object.keys(liverIronBounds),
  mri: Object.keys(liverIronBounds),
  'mri-r2star': Object.keys(liverR2StarBounds),
  'mri-t2star': Object.keys(liverT2StarBounds),
  'mri-r2': Object.keys(liverR2Bounds),
};
const unitsByKind: Readonly<Record<ResultKindName, readonly string[]>> = {
  'liver-iron': Object.keys(liverIronBounds),
  ferritin: Object.keys(ferritinBounds),
  'cardiac-t2star': Object.keys(cardiacT2StarBounds),
  creatinine: Object.keys(creatinineBounds),
  alt: Object.keys(altBounds),
  neutrophils: Object.keys(neutrophilBounds),
  haemoglobin: Object.keys(haemoglobinBounds),
  'blood-lead': Object.keys(bloodLeadBounds),
  'urinary-copper': Object.keys(urinaryCopperBounds),
  platelets: Object.keys(plateletBounds),
  ast: Object.keys(astBounds),
  bilirubin: Object.keys(bilirubinBounds),
  'urine-protein-creatinine-ratio': Object.keys(urineProteinCreatinineRatioBounds),
  zinc: Object.keys(zincBounds),
  audiology: [''],
  'eye-examination': [''],
};

/** Units a result of this kind (and liver-iron method) may be entered in, UCUM codes. */
export function unitsForResult(cells: Cells): readonly string[] {
  const kind = cells.kind as ResultKindName;
  if (kind === 'liver-iron') return liverUnitsByMethod[cells.method ?? 'mri'] ?? [];
  return unitsByKind[kind] ?? [];
}

const formulationsByDrug: Readonly<Record<string, readonly string[]>> = {
  deferoxamine: deferoxamineFormulations,
  deferiprone: deferiproneFormulations,
  deferasirox: deferasiroxFormulations,
};
const routesByDrug: Readonly<Record<string, readonly string[]>> = {
  deferoxamine: deferoxamineRoutes,
  deferiprone: ['oral'],
  deferasirox: ['oral'],
};

const fixed = (choices: readonly string[]) => () => choices;

export const tableColumns: Readonly<Record<RecordTableId, readonly ColumnSpec[]>> = {
  transfusions: [
    { key: 'date', label: 'Date', width: 'date', fieldPaths: [['date']] },
    { key: 'kind', label: 'Kind', width: 'medium', choices: fixed(['simple', 'exchange', 'venesection']), fieldPaths: [['kind']] },
    { key: 'volumeMl', label: 'Volume in', unit: 'mL', width: 'narrow', fieldPaths: [['volume'], ['volumeIn']] },
    { key: 'unitHaematocrit', label: 'Unit haematocrit', unit: 'fraction', width: 'narrow', fieldPaths: [['unitHaematocrit']] },
    { key: 'unitCount', label: 'Units', width: 'narrow', fieldPaths: [['unitCount']] },
    { key: 'volumeRemovedMl', label: 'Volume removed', unit: 'mL', width: 'narrow', fieldPaths: [['volumeRemoved']] },
    { key: 'patientHaematocrit', label: 'Patient haematocrit', unit: 'fraction', width: 'narrow', fieldPaths: [['patientHaematocrit']] },
    { key: 'method', label: 'Exchange method', width: 'medium', choices: (cells) => (cells.kind === 'exchange' ? exchangeMethods : ['']), fieldPaths: [['method']] },
    { key: 'note', label: 'Note', width: 'wide', fieldPaths: [['note']] },
  ],
  results: [
    { key: 'date', label: 'Date', width: 'date', fieldPaths: [['date']] },
    { key: 'kind', label: 'Result', width: 'medium', choices: fixed(resultKinds), fieldPaths: [['kind']] },
    { key: 'method', label: 'Liver iron method', width: 'medium', choices: (cells) => (cells.kind === 'liver-iron' ? liverIronMethods : ['']), fieldPaths: [['method']] },
    { key: 'value', label: 'Value', width: 'narrow', fieldPaths: [['measured', 'value'], ['measured']] },
    { key: 'unit', label: 'Unit', width: 'medium', choices: unitsForResult, fieldPaths: [['measured', 'unit']] },
    {
      key: 'fieldStrengthT',
      label: 'Field strength',
      unit: 'T',
      width: 'narrow',
      choices: (cells) => (cells.kind === 'cardiac-t2star' || (cells.kind === 'liver-iron' && cells.method !== 'biopsy') ? fieldStrengthsT.map(String) : ['']),
      fieldPaths: [['fieldStrengthT']],
    },
    { key: 'calibrationId', label: 'Calibration', width: 'medium', fieldPaths: [['calibrationId']] },
    { key: 'outcome', label: 'Outcome', width: 'medium', choices: (cells) => (examinationKinds.includes(cells.kind ?? '') ? examinationOutcomes : ['']), fieldPaths: [['outcome']] },
    { key: 'note', label: 'Note', width: 'wide', fieldPaths: [['note']] },
  ],
  chelationPeriods: [
    { key: 'drug', label: 'Drug', width: 'medium', choices: fixed(chelatorDrugs), fieldPaths: [['drug']] },
    { key: 'formulation', label: 'Formulation', width: 'medium', choices: (cells) => formulationsByDrug[cells.drug ?? ''] ?? [''], fieldPaths: [['formulation']] },
    { key: 'route', label: 'Route', width: 'medium', choices: (cells) => routesByDrug[cells.drug ?? ''] ?? [''], fieldPaths: [['route']] },
    { key: 'dose', label: 'Dose per administration', width: 'narrow', fieldPaths: [['dose', 'value'], ['dose']] },
    { key: 'doseUnit', label: 'Dose unit', width: 'narrow', choices: fixed(['mg/kg', 'mg']), fieldPaths: [['dose', 'unit']] },
    { key: 'administrationsPerDay', label: 'Per day', width: 'narrow', fieldPaths: [['administrationsPerDay']] },
    { key: 'daysPerWeek', label: 'Days a week', width: 'narrow', fieldPaths: [['daysPerWeek']] },
    { key: 'infusionHours', label: 'Infusion hours', unit: 'h', width: 'narrow', fieldPaths: [['infusionHours']] },
    { key: 'startDate', label: 'Start', width: 'date', fieldPaths: [['startDate']] },
    { key: 'endDate', label: 'End (blank while ongoing)', width: 'date', fieldPaths: [['endDate']] },
    { key: 'adherence', label: 'Estimated adherence', unit: 'fraction', width: 'narrow', fieldPaths: [['adherence']] },
    { key: 'note', label: 'Note', width: 'wide', fieldPaths: [['note'], ['adherenceNote']] },
  ],
  coMedications: [
    { key: 'name', label: 'Generic name', width: 'wide', fieldPaths: [['name']] },
    { key: 'dose', label: 'Dose', width: 'narrow', fieldPaths: [['dose', 'value'], ['dose']] },
    { key: 'doseUnit', label: 'Dose unit', width: 'narrow', choices: fixed(Object.keys(coMedicationDoseBounds)), fieldPaths: [['dose', 'unit']] },
    { key: 'timing', label: 'Timing', width: 'wide', choices: fixed(['', ...coMedicationTimings]), fieldPaths: [['timing']] },
    { key: 'startDate', label: 'Start', width: 'date', fieldPaths: [['startDate']] },
    { key: 'endDate', label: 'End (blank while ongoing)', width: 'date', fieldPaths: [['endDate']] },
    { key: 'note', label: 'Note', width: 'wide', fieldPaths: [['note']] },
  ],
};

export const tableTitles: Readonly<Record<RecordTableId, string>> = {
  transfusions: 'Transfusions and blood removed',
  results: 'Results',
  chelationPeriods: 'Chelation periods',
  coMedications: 'Co-medications',
};

/** A header's unit as shown ('mL', 'µg/L'). */
export function columnUnitText(column: ColumnSpec): string {
  return column.unit ? displayUnit(column.unit) : '';
}

/** What a choice looks like in a select ('mg/g{dry}' → 'mg/g dry weight', 'film-coated-tablet' → 'film-coated tablets'; core/words). */
export function choiceText(column: ColumnSpec, choice: string): string {
  if (column.key === 'unit') return displayUnit(choice);
  return choiceWords(choice);
}

// A number cell: blank is missing, a number is a number, anything else is kept
// as typed so that core's schema names the field and the value.
const numberOf = (text: string | undefined): unknown => {
  const trimmed = (text ?? '').trim();
  if (trimmed === '') return undefined;
  const value = Number(trimmed);
  return Number.isFinite(value) ? value : trimmed;
};
const textOf = (text: string | undefined): string | undefined => ((text ?? '').trim() === '' ? undefined : (text ?? '').trim());
const dateOrNull = (text: string | undefined): unknown => textOf(text) ?? null;
const withoutUndefined = (entry: Record<string, unknown>): Record<string, unknown> =>
  Object.fromEntries(Object.entries(entry).filter(([, value]) => value !== undefined));

/** The case-file entry a row stands for (unchecked: core/model checks it). */
export function rowToEntry(table: RecordTableId, row: Row): Record<string, unknown> {
  const c = row.cells;
  switch (table) {
    case 'transfusions': {
      const haematocrit = textOf(c.unitHaematocrit) === undefined ? null : numberOf(c.unitHaematocrit);
      if (c.kind === 'exchange') {
        return withoutUndefined({
          ...row.extra, id: row.id, date: textOf(c.date), kind: 'exchange', method: textOf(c.method) ?? 'automated',
          volumeIn: { value: numberOf(c.volumeMl), unit: 'mL' }, unitHaematocrit: haematocrit, unitCount: numberOf(c.unitCount),
          volumeRemoved: { value: numberOf(c.volumeRemovedMl), unit: 'mL' }, patientHaematocrit: numberOf(c.patientHaematocrit), note: textOf(c.note),
        });
      }
      if (c.kind === 'venesection') {
        return withoutUndefined({
          ...row.extra, id: row.id, date: textOf(c.date), kind: 'venesection',
          volumeRemoved: { value: numberOf(c.volumeRemovedMl), unit: 'mL' }, patientHaematocrit: numberOf(c.patientHaematocrit), note: textOf(c.note),
        });
      }
      return withoutUndefined({
        ...row.extra, id: row.id, date: textOf(c.date), kind: 'simple', volume: { value: numberOf(c.volumeMl), unit: 'mL' },
        unitHaematocrit: haematocrit, unitCount: numberOf(c.unitCount), note: textOf(c.note),
      });
    }
    case 'results': {
      const measured = { value: numberOf(c.value), unit: textOf(c.unit) };
      if (examinationKinds.includes(c.kind ?? '')) {
        return withoutUndefined({ ...row.extra, id: row.id, date: textOf(c.date), kind: textOf(c.kind), outcome: textOf(c.outcome), note: textOf(c.note) });
      }
      const base = { ...row.extra, id: row.id, date: textOf(c.date), kind: textOf(c.kind), measured, note: textOf(c.note) };
      if (c.kind === 'liver-iron') {
        const method = textOf(c.method) ?? 'mri';
        if (method === 'biopsy') return withoutUndefined({ ...base, method });
        return withoutUndefined({ ...base, method, fieldStrengthT: numberOf(c.fieldStrengthT), calibrationId: textOf(c.calibrationId) });
      }
      if (c.kind === 'cardiac-t2star') return withoutUndefined({ ...base, fieldStrengthT: numberOf(c.fieldStrengthT) });
      return withoutUndefined(base);
    }
    case 'chelationPeriods':
      return withoutUndefined({
        ...row.extra, id: row.id, drug: textOf(c.drug), formulation: textOf(c.formulation), route: textOf(c.route),
        dose: { value: numberOf(c.dose), unit: textOf(c.doseUnit) ?? 'mg/kg' },
        administrationsPerDay: numberOf(c.administrationsPerDay), daysPerWeek: numberOf(c.daysPerWeek),
        infusionHours: c.drug === 'deferoxamine' ? numberOf(c.infusionHours) : undefined,
        startDate: textOf(c.startDate), endDate: dateOrNull(c.endDate), adherence: numberOf(c.adherence) ?? 1,
        adherenceNote: textOf(c.adherenceNote), note: textOf(c.note),
      });
    case 'coMedications':
      return withoutUndefined({
        ...row.extra, id: row.id, name: textOf(c.name),
        dose: textOf(c.dose) === undefined ? undefined : { value: numberOf(c.dose), unit: textOf(c.doseUnit) ?? 'mg' },
        timing: textOf(c.timing), startDate: textOf(c.startDate), endDate: dateOrNull(c.endDate), note: textOf(c.note),
      });
  }
}

const text = (value: unknown): string => (value === undefined || value === null ? '' : String(value));
const valueOf = (quantity: unknown): string => text((quantity as { value?: unknown } | undefined)?.value);
const unitOf = (quantity: unknown): string => text((quantity as { unit?: unknown } | undefined)?.unit);

/** Entry fields each table's columns show; anything else rides along in `Row.extra`. */
const shownFields: Readonly<Record<RecordTableId, readonly string[]>> = {
  transfusions: ['id', 'date', 'kind', 'method', 'volume', 'volumeIn', 'unitHaematocrit', 'unitCount', 'volumeRemoved', 'patientHaematocrit', 'note'],
  results: ['id', 'date', 'kind', 'method', 'measured', 'outcome', 'fieldStrengthT', 'calibrationId', 'note'],
  chelationPeriods: ['id', 'drug', 'formulation', 'route', 'dose', 'administrationsPerDay', 'daysPerWeek', 'infusionHours', 'startDate', 'endDate', 'adherence', 'adherenceNote', 'note'],
  coMedications: ['id', 'name', 'dose', 'timing', 'startDate', 'endDate', 'note'],
};

/** The row showing a case-file entry: every field as text, exactly as stored; fields without a column kept aside. */
export function entryToRow(table: RecordTableId, entry: Readonly<Record<string, unknown>>): Row {
  const row = cellsOfEntry(table, entry);
  const extra = Object.fromEntries(Object.entries(entry).filter(([key]) => !shownFields[table].includes(key)));
  return Object.keys(extra).length > 0 ? { ...row, extra } : row;
}

function cellsOfEntry(table: RecordTableId, entry: Readonly<Record<string, unknown>>): Row {
  const id = text(entry.id);
  switch (table) {
    case 'transfusions':
      return {
        id,
        cells: {
          date: text(entry.date), kind: text(entry.kind), volumeMl: valueOf(entry.volume ?? entry.volumeIn),
          unitHaematocrit: text(entry.unitHaematocrit), unitCount: text(entry.unitCount), volumeRemovedMl: valueOf(entry.volumeRemoved),
          patientHaematocrit: text(entry.patientHaematocrit), method: text(entry.method), note: text(entry.note),
        },
      };
    case 'results':
      return {
        id,
        cells: {
          date: text(entry.date), kind: text(entry.kind), method: text(entry.method), value: valueOf(entry.measured), unit: unitOf(entry.measured), outcome: text(entry.outcome),
          fieldStrengthT: text(entry.fieldStrengthT), calibrationId: text(entry.calibrationId), note: text(entry.note),
        },
      };
    case 'chelationPeriods':
      return {
        id,
        cells: {
          drug: text(entry.drug), formulation: text(entry.formulation), route: text(entry.route), dose: valueOf(entry.dose), doseUnit: unitOf(entry.dose),
          administrationsPerDay: text(entry.administrationsPerDay), daysPerWeek: text(entry.daysPerWeek), infusionHours: text(entry.infusionHours),
          startDate: text(entry.startDate), endDate: text(entry.endDate), adherence: text(entry.adherence), adherenceNote: text(entry.adherenceNote), note: text(entry.note),
        },
      };
    case 'coMedications':
      return {
        id,
        cells: {
          name: text(entry.name), dose: valueOf(entry.dose), doseUnit: unitOf(entry.dose), timing: text(entry.timing),
          startDate: text(entry.startDate), endDate: text(entry.endDate), note: text(entry.note),
        },
      };
  }
}

/**
 * A new row's cells: the first choice of each select (after the cells given),
 * the unit of the chosen unit system for a result, blank elsewhere.
 */
export function newRowCells(table: RecordTableId, given: Cells = {}, preferredUnit?: (kind: string) => string | undefined): Cells {
  const cells: Record<string, string> = { ...given };
  for (const column of tableColumns[table]) {
    if (cells[column.key] !== undefined) continue;
    if (column.key === 'unit' && preferredUnit) {
      const preferred = preferredUnit(cells.kind ?? '');
      const allowed = unitsForResult(cells);
      if (preferred && allowed.includes(preferred)) {
        cells.unit = preferred;
        continue;
      }
    }
    cells[column.key] = column.choices ? (column.choices(cells)[0] ?? '') : '';
  }
  if (table === 'transfusions' && given.unitCount === undefined) cells.unitCount = '';
  if (table === 'chelationPeriods') {
    // Once a day, every day, fully taken: the form's starting values (common practice for a new period), never a dose.
    if (given.adherence === undefined) cells.adherence = '1';
    if (given.administrationsPerDay === undefined) cells.administrationsPerDay = '1';
    if (given.daysPerWeek === undefined) cells.daysPerWeek = '7';
  }
  return cells;
}

/**
 * The choice a pasted or typed text stands for in a select: the code itself,
 * or the words the select shows ('liver iron' → 'liver-iron', 'mg/g dry
 * weight' → 'mg/g{dry}'), compared without case. Other text is kept as typed.
 */
export function choiceFromText(table: RecordTableId, cells: Cells, key: string, text: string): string {
  const column = tableColumns[table].find((it) => it.key === key);
  const choices = column?.choices?.(cells);
  if (!column || !choices) return text;
  // Compared without case, and with hyphens and spaces alike, so a spreadsheet's "film coated tablet" finds its choice too.
  const loose = (typed: string) => typed.trim().toLowerCase().replace(/[-\s]+/g, ' ');
  const wanted = loose(text);
  return choices.find((choice) => loose(choice) === wanted || loose(choiceText(column, choice)) === wanted) ?? text;
}

/**
 * A changed cell: the new text, and any select whose choices no longer hold
 * the old value reset to its first choice (a deferasirox period cannot keep a
 * subcutaneous route). Typed text is never changed.
 */
export function withCell(table: RecordTableId, cells: Cells, key: string, value: string): Cells {
  const next: Record<string, string> = { ...cells, [key]: value };
  for (const column of tableColumns[table]) {
    if (!column.choices || column.key === key) continue;
    const choices = column.choices(next);
    if (!choices.includes(next[column.key] ?? '')) next[column.key] = choices[0] ?? '';
  }
  return next;
}

/**
 * Rows pasted from a spreadsheet (tab-separated, one line per row), laid
 * over the columns from `fromColumn` on. Empty trailing lines are dropped;
 * extra cells beyond the last column are ignored.
 */
export function pastedCells(table: RecordTableId, text: string, fromColumn: string): Cells[] {
  const columns = tableColumns[table];
  const start = Math.max(0, columns.findIndex((column) => column.key === fromColumn));
  const lines = text.replace(/\r\n?/g, '\n').split('\n');
  while (lines.length > 0 && lines[lines.length - 1]!.trim() === '') lines.pop();
  return lines.map((line) => {
    const given: Record<string, string> = {};
    line.split('\t').forEach((value, offset) => {
      const column = columns[start + offset];
      if (column) given[column.key] = value.trim();
    });
    return given;
  });
}

/** True when a paste holds more than one cell (a tab or a line break). */
export function isMultiCellPaste(text: string): boolean {
  return /[\t\n]/.test(text.replace(/\r?\n$/, ''));
}

/** Rows a table shows by default: the latest ones, where a review adds and checks entries. */
export const latestRowsShown = 15;

/**
 * The rows a table shows with their positions: every row when asked, or
 * when an earlier row carries a message (nothing with a problem is hidden);
 * otherwise the latest {@link latestRowsShown}.
 */
export function visibleRows(rows: readonly Row[], rowIdsWithIssues: readonly string[], showAll: boolean): { readonly rows: readonly { readonly row: Row; readonly rowIndex: number }[]; readonly hiddenCount: number } {
  const indexed = rows.map((row, rowIndex) => ({ row, rowIndex }));
  const firstShown = Math.max(0, rows.length - latestRowsShown);
  const earlierIssue = indexed.slice(0, firstShown).some(({ row }) => rowIdsWithIssues.includes(row.id));
  if (showAll || earlierIssue) return { rows: indexed, hiddenCount: 0 };
  return { rows: indexed.slice(firstShown), hiddenCount: firstShown };
}
