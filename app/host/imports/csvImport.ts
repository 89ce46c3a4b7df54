import Papa from 'papaparse';
import { ucumCodeForTypedUnit } from '../../../core/units/unitSpellings';
import type { Case } from '../../../core/model/caseFile';
import { fail, issue, ok, type Result } from '../../../core/result';
import { impliedDateOrder, readImportDate, type DateOrder } from './importDates';
import { proposedTransfusion, resultUnitsByKind, toCaseUnit, withoutConversionNoise, type ImportPlan, type ProposedEntry, type Rejected } from './importPlan';
import { loincCodes } from './loincCodes';
import { convertUcum, isUcumCode } from './ucum';

/**
 * CSV imports of transfusions (date, volume, haematocrit or product, units)
 * and of results (date, test, value, unit), parsed with papaparse (quoting,
 * separators and line breaks inside quotes are its job). Nothing is added
 * here: the plan lists what would be added, what was understood and every
 * rejected row with its line number and reason.
 */

export type CsvKind = 'transfusions' | 'results';

export const csvFieldsByKind: Readonly<Record<CsvKind, readonly string[]>> = {
  transfusions: ['date', 'volume', 'haematocrit', 'units', 'product'],
  results: ['date', 'test', 'value', 'unit'],
};

/** Header words that name each field (compared lower case, without spaces, units in brackets or punctuation); common practice. */
const headerWords: Readonly<Record<string, readonly string[]>> = {
  date: ['date', 'transfusiondate', 'dategiven', 'administered', 'collected', 'collectiondate', 'resultdate', 'sampledate', 'when'],
  volume: ['volume', 'vol', 'volumeml', 'volumegiven', 'amount'],
  haematocrit: ['haematocrit', 'hematocrit', 'hct', 'unithaematocrit', 'unithematocrit', 'unithct', 'pcv'],
  units: ['units', 'unitcount', 'numberofunits', 'bags', 'packs'],
  product: ['product', 'component', 'producttype', 'bloodproduct'],
  test: ['test', 'analyte', 'testname', 'investigation', 'code', 'loinc', 'kind'],
  value: ['value', 'result', 'resultvalue', 'measurement'],
  unit: ['unit', 'units', 'resultunit', 'uom'],
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
  /** Transfusions or results; guessed from the headers when not given. */
  readonly kind?: CsvKind;
  /** Field → header, from flags (`--map date=Given,volume=Vol`); the rest is guessed. */
  readonly mapping?: Readonly<Record<string, string>>;
  readonly dateOrder?: DateOrder;
}

function guessKind(headers: readonly string[]): CsvKind | undefined {
  const squashed = headers.map(squash);
  const has = (field: string) => squashed.some((header) => headerWords[field]!.includes(header));
  if (has('volume') || has('haematocrit')) return 'transfusions';
  if (has('test') || has('value')) return 'results';
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

/**
 * Read a CSV export into an import plan.
 *
 * @param text - the file's text
 * @param caseFile - the case it would go into (its units are used), or null
 * @param options - kind, mapping and date order; guessed where not given, and said so
 * @returns the plan, or an issue when the file cannot be mapped at all (no header row, a required column missing)
 */
export function readCsvImport(text: string, caseFile: Case | null, options: CsvOptions = {}): Result<ImportPlan> {
  const { rows, problems } = parseRows(text.replace(/^\uFEFF/, ''));
  const header = rows[0];
  if (!header) return fail(issue('invalid_file', ['line 1'], 'The file is empty; expected a header row.'));
  const headers = header.cells.map((cell) => cell.trim());
  const kind = options.kind ?? guessKind(headers);
  if (!kind) return fail(issue('invalid_file', ['kind'], `The header row (line 1: ${headers.join(', ').slice(0, 200)}) names neither transfusions (date, volume, haematocrit) nor results (date, test, value, unit); choose the kind of records and the column that holds each field.`));
  const mapping: Record<string, number> = {};
  const understood: string[] = [`kind: ${kind}${options.kind ? '' : ' (guessed from the headers)'}`];
  for (const field of csvFieldsByKind[kind]) {
    const given = options.mapping?.[field];
    const index = given !== undefined ? headers.indexOf(given) : headers.findIndex((it) => headerWords[field]!.includes(squash(it)));
    if (given !== undefined && index < 0) return fail(issue('invalid_file', ['columnMapping', field], `The column "${given.slice(0, 60)}" chosen for ${field} is not in the header row (line 1: ${headers.join(', ').slice(0, 200)}).`));
    if (index >= 0) {
      mapping[field] = index;
      understood.push(`${field} ← column "${headers[index]}"${given !== undefined ? '' : ' (guessed)'}`);
    }
  }
  const required = kind === 'transfusions' ? ['date', 'volume'] : ['date', 'test', 'value', 'unit'];
  const missing = required.filter((field) => mapping[field] === undefined);
  if (missing.length > 0) return fail(issue('invalid_file', ['columnMapping', missing[0]!], `The header row (line 1) has no column for ${missing.join(', ')}; choose the column that holds ${missing.length === 1 ? 'it' : 'each'}.`));

  const cell = (row: Row, field: string) => (mapping[field] === undefined ? '' : (row.cells[mapping[field]!] ?? '').trim());
  const body = rows.slice(1);
  const implied = impliedDateOrder(body.map((row) => cell(row, 'date')));
  let dateOrder = options.dateOrder;
  if (!dateOrder && implied === 'conflict') {
    return fail(issue('invalid_file', ['dateOrder'], 'The dates mix day-first (e.g. 25/03) and month-first (e.g. 03/25) forms; nothing was read. Choose the date order (day first or month first), or correct the file.'));
  }
  if (!dateOrder && implied !== undefined && implied !== 'conflict') {
    dateOrder = implied;
    understood.push(`dates: ${implied} (some dates can only be read that way)`);
  } else if (dateOrder) understood.push(`dates: ${dateOrder} (as given)`);

  const entries: ProposedEntry[] = [];
  const rejected: Rejected[] = [...problems];
  const volumeUnit = mapping['volume'] === undefined ? 'mL' : headerUnit(headers[mapping['volume']]!) ?? 'mL';
  const haematocritUnit = mapping['haematocrit'] !== undefined && headers[mapping['haematocrit']]!.includes('%') ? '%' : '1';
  if (kind === 'transfusions') understood.push(`volume in ${volumeUnit}, converted to mL; haematocrit ${haematocritUnit === '%' ? 'in %, converted to a fraction' : 'as a fraction of 1'}`);

  for (const row of body) {
    const where = `line ${row.line}`;
    const reject = (reason: string) => rejected.push({ where, reason });
    if (row.cells.length < headers.length) {
      reject(`${row.cells.length} of ${headers.length} columns`);
      continue;
    }
    const date = readImportDate(cell(row, 'date'), dateOrder);
    if (!date.ok) {
      rejected.push({ where, reason: `date ${date.reason}`, ...(date.ambiguous ? { choice: 'dateOrder' as const } : {}) });
      continue;
    }
    if (kind === 'transfusions') {
      const volumeText = cell(row, 'volume');
      const volume = Number(volumeText);
      if (volumeText === '' || !Number.isFinite(volume)) {
        reject(`volume "${volumeText.slice(0, 40)}" is not a number`);
        continue;
      }
      const volumeMl = convertUcum(volume, volumeUnit, 'mL', where);
      if (!volumeMl.ok) {
        reject(`volume unit "${volumeUnit}" cannot be converted to mL`);
        continue;
      }
      const hctText = cell(row, 'haematocrit');
      let unitHaematocrit: number | null = null;
      if (hctText !== '') {
        const hct = Number(hctText);
        if (!Number.isFinite(hct)) {
          reject(`haematocrit "${hctText.slice(0, 40)}" is not a number`);
          continue;
        }
        if (haematocritUnit === '1' && hct > 1) {
          reject(`haematocrit ${hct} looks like a percentage; write the column header with (%) or enter it as a fraction`);
          continue;
        }
        const fraction = convertUcum(hct, haematocritUnit, '1', where);
        if (!fraction.ok) {
          reject(`haematocrit ${hct} ${haematocritUnit} cannot be converted to a fraction (UCUM)`);
          continue;
        }
        unitHaematocrit = withoutConversionNoise(fraction.value);
      }
      const unitsText = cell(row, 'units');
      const unitCount = unitsText === '' ? 1 : Number(unitsText);
      const product = cell(row, 'product');
      const note = [product !== '' ? `product: ${product}` : '', unitsText === '' ? 'unit count not in the import (1 assumed)' : ''].filter(Boolean).join('; ');
      entries.push(proposedTransfusion(where, date.date, volumeMl.value, unitHaematocrit, Number.isFinite(unitCount) ? unitCount : unitsText, note));
      continue;
    }
    const test = cell(row, 'test');
    const resultKind = loincCodes[test]?.target.list === 'results' ? (loincCodes[test]!.target as { kind: string }).kind : testNames[squash(test)];
    if (!resultKind || resultKind === 'liver-iron') {
      reject(resultKind === 'liver-iron' ? 'liver iron needs its method (and for MRI the field strength and calibration): record it with add result' : `test "${test.slice(0, 40)}" is not one the import knows (ferritin, haemoglobin, creatinine, ALT, AST, bilirubin, neutrophils, platelets, blood lead, urinary copper, or their LOINC codes)`);
      continue;
    }
    const valueText = cell(row, 'value');
    const value = Number(valueText);
    if (valueText === '' || !Number.isFinite(value)) {
      reject(`value "${valueText.slice(0, 40)}" is not a number`);
      continue;
    }
    const typedUnit = cell(row, 'unit');
    const allowed = resultUnitsByKind[resultKind] ?? [];
    const unit = ucumCodeForTypedUnit(typedUnit, allowed) ?? (isUcumCode(typedUnit) ? typedUnit : undefined);
    if (unit === undefined) {
      reject(`unit "${typedUnit.slice(0, 40)}" is not a UCUM unit the import can convert to ${allowed.join(' or ')}`);
      continue;
    }
    const stored = toCaseUnit(caseFile, resultKind, value, unit, where);
    if (!stored.ok) {
      reject(`${value} ${typedUnit} cannot be converted to ${allowed.join(' or ')}`);
      continue;
    }
    entries.push({ list: 'results', where, entry: { date: date.date, kind: resultKind, measured: stored.value, ...(stored.value.unit !== unit || typedUnit !== unit ? { note: `imported as ${value} ${typedUnit}` } : {}) } });
  }
  return ok({ format: 'csv', understood, entries, rejected, unknownCodes: [] });
}
