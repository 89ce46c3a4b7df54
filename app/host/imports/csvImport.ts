import Papa from 'papaparse';
import { ucumCodeForTypedUnit } from '../../../core/units/unitSpellings';
import type { Case } from '../../../core/model/caseFile';
import { fail, issue, ok, type Result } from '../../../core/result';
import { impliedDateOrder, readImportDate, type DateOrder } from './importDates';
import { proposedTransfusion, resultUnitsByKind, toCaseUnit, withoutConversionNoise, type ImportPlan, type ProposedEntry, type Rejected } from './importPlan';
import { loincCodes } from './loincCodes';
import { convertUcum, isUcumCode } from './ucum';

/**
 * CSV imports of every record kind the case keeps in its transfusion and
 * result lists: simple transfusions (date, volume, haematocrit or product,
 * units), red-cell exchanges (date, method, volume in, units' haematocrit,
 * units, volume removed, the patient's haematocrit), venesections (date,
 * volume removed, the patient's haematocrit) and results (date, test, value,
 * unit). Parsed with papaparse (quoting, separators and line breaks inside
 * quotes are its job). Nothing is added here: the plan lists what would be
 * added, what was understood (the kind, the column of each field, the units)
 * and every rejected row with its line, the column and the reason.
 */

export const csvKinds = ['transfusions', 'exchanges', 'venesections', 'results'] as const;
export type CsvKind = (typeof csvKinds)[number];

/** One field of a CSV kind: the header words that name it (compared squashed, see `squash`) and whether a file must have it. */
interface CsvField {
  readonly words: readonly string[];
  readonly required: boolean;
}

// Header words are common practice (the names exports and spreadsheets use); a header is compared lower
// case without spaces, punctuation or a unit in brackets, so "Vol. removed (mL)" is "volremoved".
const dateWords = ['date', 'transfusiondate', 'dategiven', 'administered', 'collected', 'collectiondate', 'resultdate', 'sampledate', 'when', 'proceduredate', 'exchangedate', 'venesectiondate', 'phlebotomydate'];
const unitCountWords = ['units', 'unitcount', 'numberofunits', 'bags', 'packs'];
const productWords = ['product', 'component', 'producttype', 'bloodproduct'];
const volumeRemovedWords = ['volumeremoved', 'removed', 'removedvolume', 'volremoved', 'volumeout', 'volout', 'bloodremoved', 'withdrawn', 'volumewithdrawn', 'venesectionvolume', 'phlebotomyvolume'];
const patientHaematocritWords = ['patienthaematocrit', 'patienthematocrit', 'patienthct', 'prehct', 'prehaematocrit', 'prehematocrit', 'preprocedurehct', 'preprocedurehaematocrit', 'preprocedurehematocrit', 'hctbefore', 'haematocritbefore', 'hematocritbefore'];
const unitHaematocritWords = ['unithaematocrit', 'unithematocrit', 'unithct', 'donorhct', 'donorhaematocrit', 'donorhematocrit', 'producthct'];
/** A haematocrit header that names no blood: the units' in a transfusion, the patient's in a venesection, either in an exchange (so not guessed there). */
const plainHaematocritWords = ['haematocrit', 'hematocrit', 'hct', 'pcv'];

const csvFields: Readonly<Record<CsvKind, Readonly<Record<string, CsvField>>>> = {
  transfusions: {
    date: { words: dateWords, required: true },
    volume: { words: ['volume', 'vol', 'volumeml', 'volumegiven', 'amount'], required: true },
    haematocrit: { words: [...plainHaematocritWords, ...unitHaematocritWords], required: false },
    units: { words: unitCountWords, required: false },
    product: { words: productWords, required: false },
  },
  exchanges: {
    date: { words: dateWords, required: true },
    method: { words: ['method', 'exchangemethod', 'technique', 'mode', 'exchangetype'], required: true },
    volumeIn: { words: ['volumein', 'volin', 'volumeinfused', 'infused', 'volumegiven', 'replacementvolume', 'donorvolume'], required: true },
    haematocrit: { words: unitHaematocritWords, required: false },
    units: { words: unitCountWords, required: true },
    volumeRemoved: { words: volumeRemovedWords, required: true },
    patientHaematocrit: { words: patientHaematocritWords, required: true },
    product: { words: productWords, required: false },
  },
  venesections: {
    date: { words: dateWords, required: true },
    volumeRemoved: { words: [...volumeRemovedWords, 'volume', 'vol', 'volumeml'], required: true },
    patientHaematocrit: { words: [...patientHaematocritWords, ...plainHaematocritWords], required: true },
  },
  results: {
    date: { words: dateWords, required: true },
    test: { words: ['test', 'analyte', 'testname', 'investigation', 'code', 'loinc', 'kind'], required: true },
    value: { words: ['value', 'result', 'resultvalue', 'measurement'], required: true },
    unit: { words: ['unit', 'units', 'resultunit', 'uom'], required: true },
  },
};

/** The fields of each kind, in the order the mapping is shown (the host contract's column mapping names them). */
export const csvFieldsByKind: Readonly<Record<CsvKind, readonly string[]>> = {
  transfusions: Object.keys(csvFields.transfusions),
  exchanges: Object.keys(csvFields.exchanges),
  venesections: Object.keys(csvFields.venesections),
  results: Object.keys(csvFields.results),
};

/** Exchange methods as exports write them, to the case model's two (common practice: apheresis exchanges are automated). */
const methodWords: Readonly<Record<string, 'manual' | 'automated'>> = {
  manual: 'manual', manualexchange: 'manual',
  automated: 'automated', automatic: 'automated', automatedexchange: 'automated', apheresis: 'automated', erythrocytapheresis: 'automated',
};

/** Test names seen on laboratory exports, mapped to result kinds (common practice; LOINC codes are also accepted). */
const testNames: Readonly<Record<string, string>> = {
  ferritin: 'ferritin', serumferritin: 'ferritin', ferr: 'ferritin',
  haemoglobin: 'haemoglobin', hemoglobin: 'haemoglobin', hb: 'haemoglobin', hgb: 'haemoglobin',
  creatinine: 'creatinine', serumcreatinine: 'creatinine', creat: 'creatinine', cr: 'creatinine',
  alt: 'alt', alaninetransaminase: 'alt', alanineaminotransferase: 'alt', sgpt: 'alt',
  ast: 'ast', aspartatetransaminase: 'ast', aspartateaminotransferase: 'ast', sgot: 'ast',
  bilirubin: 'bilirubin', totalbilirubin: 'bilirubin', bili: 'bilirubin',
  neutrophils: 'neutrophils', anc: 'neutrophils', absoluteneutrophilcount: 'neutrophils', neut: 'neutrophils',
  platelets: 'platelets', plt: 'platelets', plateletcount: 'platelets',
  bloodlead: 'blood-lead', lead: 'blood-lead',
  urinarycopper: 'urinary-copper', urinecopper: 'urinary-copper',
};

const squash = (text: string) => text.toLowerCase().replace(/\(.*?\)|\[.*?\]/g, '').replace(/[^a-z0-9]/g, '');
/** A unit written in a header: "Volume (mL)", "Hct [%]". */
const headerUnit = (header: string) => /[([]\s*([^)\]]+?)\s*[)\]]/.exec(header)?.[1];

export interface CsvOptions {
  /** The kind of records; guessed from the headers when not given. */
  readonly kind?: CsvKind;
  /** Field → header, from flags (`--map date=Given,volume=Vol`) or the app's mapping; the rest is guessed. */
  readonly mapping?: Readonly<Record<string, string>>;
  readonly dateOrder?: DateOrder;
}

function guessKind(headers: readonly string[]): CsvKind | undefined {
  const squashed = headers.map(squash);
  const has = (kind: CsvKind, field: string) => squashed.some((header) => csvFields[kind][field]!.words.includes(header));
  if (has('exchanges', 'volumeRemoved')) return has('exchanges', 'volumeIn') || has('exchanges', 'method') ? 'exchanges' : 'venesections';
  if (has('transfusions', 'volume') || has('transfusions', 'haematocrit')) return 'transfusions';
  if (has('results', 'test') || has('results', 'value')) return 'results';
  return undefined;
}

interface Row {
  readonly line: number;
  readonly cells: readonly string[];
}

/** Rows with their 1-based line numbers in the file (a quoted line break keeps the row's first line). */
function parseRows(text: string): { rows: Row[]; problems: Rejected[] } {
  const rows: Row[] = [];
  const problems: Rejected[] = [];
  let line = 1;
  let consumed = 0;
  Papa.parse<string[]>(text, {
    header: false,
    skipEmptyLines: false,
    step: (step) => {
      const rowStart = line;
      const cursor = step.meta.cursor;
      for (let index = consumed; index < cursor && index < text.length; index += 1) if (text[index] === '\n') line += 1;
      consumed = cursor;
      for (const error of step.errors) problems.push({ where: `line ${rowStart}`, reason: `the CSV cannot be read here (${error.message})` });
      const cells = step.data;
      if (cells.length === 1 && cells[0]!.trim() === '') return;
      rows.push({ line: rowStart, cells });
    },
  });
  return { rows, problems };
}

/** A cell read into a value, or the reason it cannot be (naming the column and the field). */
type Read<T> = { readonly ok: true; readonly value: T } | { readonly ok: false; readonly reason: string };
const refused = (reason: string): Read<never> => ({ ok: false, reason });

/** Field names as a user reads them in a reason ("volume removed", "patient haematocrit"). */
const fieldWords = (field: string) => field.replace(/[A-Z]/g, (letter) => ` ${letter.toLowerCase()}`);

/** The reader of one file's cells: each field's column, its unit from the header, and the readers of a row's values. */
function cellReader(headers: readonly string[], mapping: Readonly<Record<string, number>>) {
  const header = (field: string) => headers[mapping[field]!] ?? field;
  const text = (row: Row, field: string) => (mapping[field] === undefined ? '' : (row.cells[mapping[field]!] ?? '').trim());
  const inColumn = (field: string, problem: string) => `column "${header(field).slice(0, 60)}": ${problem}`;
  /** The unit of a volume column from its header ("Volume (L)"), millilitres when it names none. */
  const volumeUnit = (field: string) => (mapping[field] === undefined ? 'mL' : headerUnit(header(field)) ?? 'mL');
  /** A haematocrit column in % when its header says so, else a fraction of 1. */
  const fractionUnit = (field: string) => (mapping[field] !== undefined && header(field).includes('%') ? '%' : '1');
  const number = (row: Row, field: string): Read<number> => {
    const raw = text(row, field);
    const value = Number(raw);
    return raw !== '' && Number.isFinite(value) ? { ok: true, value } : refused(inColumn(field, `${fieldWords(field)} "${raw.slice(0, 40)}" is not a number`));
  };
  return {
    header,
    text,
    inColumn,
    /** Entry key → the header of its column, for the fields the file has (the case model's refusals name the column). */
    columns: (keys: Readonly<Record<string, string>>): Record<string, string> =>
      Object.fromEntries(Object.entries(keys).filter(([, field]) => mapping[field] !== undefined).map(([key, field]) => [key, header(field)])),
    volumeUnit,
    fractionUnit,
    number,
    /** A volume converted through UCUM from the column's unit to mL. */
    volumeMl(row: Row, field: string): Read<number> {
      const read = number(row, field);
      if (!read.ok) return read;
      const unit = volumeUnit(field);
      const converted = convertUcum(read.value, unit, 'mL', `line ${row.line}`);
      return converted.ok ? { ok: true, value: withoutConversionNoise(converted.value) } : refused(inColumn(field, `unit "${unit.slice(0, 20)}" cannot be converted to mL (UCUM)`));
    },
    /** A haematocrit as a fraction of 1 (from % through UCUM); null when the column is absent or the cell empty and `optional`. */
    fraction(row: Row, field: string, optional: boolean): Read<number | null> {
      if (optional && text(row, field) === '') return { ok: true, value: null };
      const read = number(row, field);
      if (!read.ok) return read;
      const unit = fractionUnit(field);
      if (unit === '1' && read.value > 1) {
        return refused(inColumn(field, `${fieldWords(field)} ${read.value} looks like a percentage; write the column header with (%) or enter it as a fraction`));
      }
      const converted = convertUcum(read.value, unit, '1', `line ${row.line}`);
      return converted.ok ? { ok: true, value: withoutConversionNoise(converted.value) } : refused(inColumn(field, `${fieldWords(field)} ${read.value} ${unit} cannot be converted to a fraction (UCUM)`));
    },
    /** The exchange method, from the words exports use. */
    method(row: Row): Read<'manual' | 'automated'> {
      const raw = text(row, 'method');
      const method = methodWords[squash(raw)];
      return method ? { ok: true, value: method } : refused(inColumn('method', `method "${raw.slice(0, 40)}" is neither manual nor automated (apheresis)`));
    },
  };
}
type CellReader = ReturnType<typeof cellReader>;

/** What a row of each kind proposes: the entry, and which column each of its keys came from (for the case model's refusals). */
type RowEntry = Read<{ readonly entry: Record<string, unknown>; readonly columns: Record<string, string> }>;

function transfusionRow(read: CellReader, row: Row, date: string): RowEntry {
  const volumeMl = read.volumeMl(row, 'volume');
  if (!volumeMl.ok) return volumeMl;
  const unitHaematocrit = read.fraction(row, 'haematocrit', true);
  if (!unitHaematocrit.ok) return unitHaematocrit;
  const unitsText = read.text(row, 'units');
  const unitCount = unitsText === '' ? 1 : Number(unitsText);
  const product = read.text(row, 'product');
  const note = [product !== '' ? `product: ${product}` : '', unitsText === '' ? 'unit count not in the import (1 assumed)' : ''].filter(Boolean).join('; ');
  const { entry } = proposedTransfusion(`line ${row.line}`, date, volumeMl.value, unitHaematocrit.value, Number.isFinite(unitCount) ? unitCount : unitsText, note);
  return { ok: true, value: { entry: { ...entry }, columns: read.columns({ date: 'date', volume: 'volume', unitHaematocrit: 'haematocrit', unitCount: 'units' }) } };
}

function exchangeRow(read: CellReader, row: Row, date: string): RowEntry {
  const method = read.method(row);
  if (!method.ok) return method;
  const volumeInMl = read.volumeMl(row, 'volumeIn');
  if (!volumeInMl.ok) return volumeInMl;
  const unitHaematocrit = read.fraction(row, 'haematocrit', true);
  if (!unitHaematocrit.ok) return unitHaematocrit;
  const unitCount = read.number(row, 'units');
  if (!unitCount.ok) return unitCount;
  const volumeRemovedMl = read.volumeMl(row, 'volumeRemoved');
  if (!volumeRemovedMl.ok) return volumeRemovedMl;
  const patientHaematocrit = read.fraction(row, 'patientHaematocrit', false);
  if (!patientHaematocrit.ok) return patientHaematocrit;
  const product = read.text(row, 'product');
  return {
    ok: true,
    value: {
      entry: {
        date,
        kind: 'exchange',
        method: method.value,
        volumeIn: { value: volumeInMl.value, unit: 'mL' },
        unitHaematocrit: unitHaematocrit.value,
        unitCount: unitCount.value,
        volumeRemoved: { value: volumeRemovedMl.value, unit: 'mL' },
        patientHaematocrit: patientHaematocrit.value,
        ...(product !== '' ? { note: `product: ${product}` } : {}),
      },
      columns: read.columns({ date: 'date', method: 'method', volumeIn: 'volumeIn', unitHaematocrit: 'haematocrit', unitCount: 'units', volumeRemoved: 'volumeRemoved', patientHaematocrit: 'patientHaematocrit' }),
    },
  };
}

function venesectionRow(read: CellReader, row: Row, date: string): RowEntry {
  const volumeRemovedMl = read.volumeMl(row, 'volumeRemoved');
  if (!volumeRemovedMl.ok) return volumeRemovedMl;
  const patientHaematocrit = read.fraction(row, 'patientHaematocrit', false);
  if (!patientHaematocrit.ok) return patientHaematocrit;
  return {
    ok: true,
    value: {
      entry: { date, kind: 'venesection', volumeRemoved: { value: volumeRemovedMl.value, unit: 'mL' }, patientHaematocrit: patientHaematocrit.value },
      columns: read.columns({ date: 'date', volumeRemoved: 'volumeRemoved', patientHaematocrit: 'patientHaematocrit' }),
    },
  };
}

function resultRow(read: CellReader, row: Row, date: string, caseFile: Case | null): RowEntry {
  const test = read.text(row, 'test');
  const resultKind = loincCodes[test]?.target.list === 'results' ? (loincCodes[test]!.target as { kind: string }).kind : testNames[squash(test)];
  if (!resultKind || resultKind === 'liver-iron') {
    return refused(
      read.inColumn(
        'test',
        resultKind === 'liver-iron'
          ? 'liver iron needs its method (and for MRI the field strength and calibration): record it with add result'
          : `test "${test.slice(0, 40)}" is not one the import knows (ferritin, haemoglobin, creatinine, ALT, AST, bilirubin, neutrophils, platelets, blood lead, urinary copper, or their LOINC codes)`,
      ),
    );
  }
  const value = read.number(row, 'value');
  if (!value.ok) return value;
  const typedUnit = read.text(row, 'unit');
  const allowed = resultUnitsByKind[resultKind] ?? [];
  const unit = ucumCodeForTypedUnit(typedUnit, allowed) ?? (isUcumCode(typedUnit) ? typedUnit : undefined);
  if (unit === undefined) return refused(read.inColumn('unit', `unit "${typedUnit.slice(0, 40)}" is not a UCUM unit the import can convert to ${allowed.join(' or ')}`));
  const stored = toCaseUnit(caseFile, resultKind, value.value, unit, `line ${row.line}`);
  if (!stored.ok) return refused(read.inColumn('unit', `${value.value} ${typedUnit} cannot be converted to ${allowed.join(' or ')}`));
  return {
    ok: true,
    value: {
      entry: { date, kind: resultKind, measured: stored.value, ...(stored.value.unit !== unit || typedUnit !== unit ? { note: `imported as ${value.value} ${typedUnit}` } : {}) },
      columns: read.columns({ date: 'date', measured: 'value' }),
    },
  };
}

/** What the import says it understood about the units of each kind's columns. */
function unitsUnderstood(kind: CsvKind, read: CellReader, mapping: Readonly<Record<string, number>>): string[] {
  const volumes = { transfusions: ['volume'], exchanges: ['volumeIn', 'volumeRemoved'], venesections: ['volumeRemoved'], results: [] }[kind];
  const fractions = { transfusions: ['haematocrit'], exchanges: ['haematocrit', 'patientHaematocrit'], venesections: ['patientHaematocrit'], results: [] }[kind];
  return [
    ...volumes.filter((field) => mapping[field] !== undefined).map((field) => `${field} in ${read.volumeUnit(field)}${read.volumeUnit(field) === 'mL' ? '' : ', converted to mL'}`),
    ...fractions
      .filter((field) => mapping[field] !== undefined)
      .map((field) => `${field} ${read.fractionUnit(field) === '%' ? 'in %, converted to a fraction' : 'as a fraction of 1'}`),
  ];
}

/** A CSV file's columns, each with the field it is read as (null: not read), as the app's import screen shows them for correcting. */
export interface CsvColumnMapping {
  readonly columns: readonly { readonly column: string; readonly field: string | null }[];
  readonly fields: readonly string[];
  readonly required: readonly string[];
}

/**
 * The header row of a CSV and the field each column is read as: the given
 * mapping, the rest guessed from the header words as readCsvImport guesses them.
 *
 * @returns the columns, or null when the file has no header row or names a column it does not have
 */
export function csvColumnMapping(text: string, kind: CsvKind, given?: Readonly<Record<string, string>>): CsvColumnMapping | null {
  const first = Papa.parse<string[]>(text.replace(/^\uFEFF/, ''), { header: false, preview: 1 }).data[0];
  if (!first || (first.length === 1 && first[0]!.trim() === '')) return null;
  const headers = first.map((cell) => cell.trim());
  const fields = csvFields[kind];
  const fieldAt = new Map<number, string>();
  for (const [field, spec] of Object.entries(fields)) {
    const named = given?.[field];
    const index = named !== undefined ? headers.indexOf(named) : headers.findIndex((it, at) => spec.words.includes(squash(it)) && !fieldAt.has(at) && !Object.values(given ?? {}).includes(it));
    if (named !== undefined && index < 0) return null;
    if (index >= 0) fieldAt.set(index, field);
  }
  return {
    columns: headers.map((column, index) => ({ column, field: fieldAt.get(index) ?? null })),
    fields: Object.keys(fields),
    required: Object.keys(fields).filter((field) => fields[field]!.required),
  };
}

/**
 * Read a CSV export into an import plan.
 *
 * @param text - the file's text
 * @param caseFile - the case it would go into (its units are used), or null
 * @param options - kind, mapping and date order; guessed where not given, and said so
 * @returns the plan, or an issue when the file cannot be mapped at all (no header row, a required column missing),
 *   whose path names the choice that would settle it ('kind', ['columnMapping', field], 'dateOrder')
 */
export function readCsvImport(text: string, caseFile: Case | null, options: CsvOptions = {}): Result<ImportPlan> {
  const { rows, problems } = parseRows(text.replace(/^\uFEFF/, ''));
  const header = rows[0];
  if (!header) return fail(issue('invalid_file', ['line 1'], 'The file is empty; expected a header row.'));
  const headers = header.cells.map((cell) => cell.trim());
  const kind = options.kind ?? guessKind(headers);
  if (!kind) {
    return fail(
      issue(
        'invalid_file',
        ['kind'],
        `The header row (line 1: ${headers.join(', ').slice(0, 200)}) names none of the kinds the import reads (transfusions: date, volume; exchanges: date, method, volume in, volume removed, patient haematocrit; venesections: date, volume removed, patient haematocrit; results: date, test, value, unit); choose the kind of records and the column that holds each field.`,
      ),
    );
  }
  const fields = csvFields[kind];
  const mapping: Record<string, number> = {};
  const understood: string[] = [`kind: ${kind}${options.kind ? '' : ' (guessed from the headers)'}`];
  for (const [field, spec] of Object.entries(fields)) {
    const given = options.mapping?.[field];
    const index = given !== undefined ? headers.indexOf(given) : headers.findIndex((it) => spec.words.includes(squash(it)));
    if (given !== undefined && index < 0) return fail(issue('invalid_file', ['columnMapping', field], `The column "${given.slice(0, 60)}" chosen for ${fieldWords(field)} is not in the header row (line 1: ${headers.join(', ').slice(0, 200)}).`));
    if (index >= 0) {
      mapping[field] = index;
      understood.push(`${field} ← column "${headers[index]}"${given !== undefined ? '' : ' (guessed)'}`);
    }
  }
  const missing = Object.keys(fields).filter((field) => fields[field]!.required && mapping[field] === undefined);
  if (missing.length > 0) {
    const plain = kind === 'exchanges' ? headers.filter((it) => plainHaematocritWords.includes(squash(it))) : [];
    const why = plain.length > 0 ? ` (the column "${plain[0]!.slice(0, 60)}" could hold the units' or the patient's haematocrit, so it is not guessed)` : '';
    return fail(issue('invalid_file', ['columnMapping', missing[0]!], `The header row (line 1) has no column for ${missing.map(fieldWords).join(', ')}${why}; choose the column that holds ${missing.length === 1 ? 'it' : 'each'}.`));
  }
  // A plain haematocrit column left over in an exchange would be dropped silently: ask which blood it is.
  const mappedColumns = new Set(Object.values(mapping));
  const leftOver = kind === 'exchanges' ? headers.findIndex((it, index) => plainHaematocritWords.includes(squash(it)) && !mappedColumns.has(index)) : -1;
  if (leftOver >= 0) {
    return fail(
      issue(
        'invalid_file',
        ['columnMapping', 'haematocrit'],
        `The column "${headers[leftOver]!.slice(0, 60)}" could hold the units' or the patient's haematocrit, so it is not guessed; choose the field it holds (haematocrit for the units', patientHaematocrit for the patient's before the exchange).`,
      ),
    );
  }

  const read = cellReader(headers, mapping);
  const body = rows.slice(1);
  const implied = impliedDateOrder(body.map((row) => read.text(row, 'date')));
  let dateOrder = options.dateOrder;
  if (!dateOrder && implied === 'conflict') {
    return fail(issue('invalid_file', ['dateOrder'], 'The dates mix day-first (e.g. 25/03) and month-first (e.g. 03/25) forms; nothing was read. Choose the date order (day first or month first), or correct the file.'));
  }
  if (!dateOrder && implied !== undefined && implied !== 'conflict') {
    dateOrder = implied;
    understood.push(`dates: ${implied} (some dates can only be read that way)`);
  } else if (dateOrder) understood.push(`dates: ${dateOrder} (as given)`);
  understood.push(...unitsUnderstood(kind, read, mapping));

  const entries: ProposedEntry[] = [];
  const rejected: Rejected[] = [...problems];
  for (const row of body) {
    const where = `line ${row.line}`;
    if (row.cells.length < headers.length) {
      const empty = headers.slice(row.cells.length).map((it) => `"${it.slice(0, 40)}"`);
      rejected.push({ where, reason: `the row has ${row.cells.length} of ${headers.length} columns (nothing under ${empty.join(', ').slice(0, 200)})` });
      continue;
    }
    const date = readImportDate(read.text(row, 'date'), dateOrder);
    if (!date.ok) {
      rejected.push({ where, reason: read.inColumn('date', `date ${date.reason}`), ...(date.ambiguous ? { choice: 'dateOrder' as const } : {}) });
      continue;
    }
    const proposed =
      kind === 'transfusions'
        ? transfusionRow(read, row, date.date)
        : kind === 'exchanges'
          ? exchangeRow(read, row, date.date)
          : kind === 'venesections'
            ? venesectionRow(read, row, date.date)
            : resultRow(read, row, date.date, caseFile);
    if (!proposed.ok) rejected.push({ where, reason: proposed.reason });
    else entries.push({ list: kind === 'results' ? 'results' : 'transfusions', where, entry: proposed.value.entry, columns: proposed.value.columns });
  }
  return ok({ format: 'csv', understood, entries, rejected, unknownCodes: [] });
}
