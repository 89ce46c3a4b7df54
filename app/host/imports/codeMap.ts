import { z } from 'zod';
import { cardiacT2StarBounds, liverIronBounds, liverR2Bounds, liverR2StarBounds, liverT2StarBounds } from '../../../core/ranges/plausibleRanges';
import { fieldStrengthsT, liverIronMethods } from '../../../core/model/resultEntry';
import { fail, issue, ok, type Issue, type Result } from '../../../core/result';
import { resultUnitsByKind } from './importPlan';

/**
 * A local code map: codes that LOINC has no code for, or that a site uses in
 * place of LOINC (MRI liver iron, liver R2* or T2*, cardiac T2*), mapped to a
 * result kind of the case file and the unit the value is expected in. A file
 * format of our own (a modelling choice of ours), JSON:
 *
 * ```json
 * { "format": "chelation-ledger-code-map", "version": 1,
 *   "codes": [
 *     { "system": "http://radiology.example.org/codes", "code": "LIVER-R2S",
 *       "display": "Liver R2*, 1.5 T",
 *       "result": { "kind": "liver-iron", "method": "mri-r2star", "fieldStrengthT": 1.5, "calibrationId": "hernando-1.5t" },
 *       "unit": "s-1" } ] }
 * ```
 *
 * `system` and `code` are matched exactly against an Observation's
 * code.coding (FHIR R4 Coding.system and Coding.code); the built-in LOINC
 * codes (loincCodes.ts) are looked up first. `unit` is a UCUM code the case
 * file accepts for that kind (and method); an Observation's valueQuantity is
 * converted to it through UCUM or rejected. A liver-iron MRI result needs the
 * scanner's field strength and the calibration the case model names, and a
 * cardiac T2* the field strength: the map carries them, since a FHIR
 * Observation does not. Codes that neither LOINC nor the map knows are still
 * listed as unknown.
 */

export const codeMapFormat = 'chelation-ledger-code-map';

const fieldStrengthT = z.literal(fieldStrengthsT);
const mriMethods = liverIronMethods.filter((it) => it !== 'biopsy') as [Exclude<(typeof liverIronMethods)[number], 'biopsy'>, ...Exclude<(typeof liverIronMethods)[number], 'biopsy'>[]];
/** Kinds recorded as a plain number and unit (the ones the imports read; resultUnitsByKind), liver iron apart. */
const simpleKinds = Object.keys(resultUnitsByKind).filter((it) => it !== 'liver-iron') as [string, ...string[]];

const resultSchema = z.union([
  z.strictObject({ kind: z.literal('liver-iron'), method: z.literal('biopsy') }),
  z.strictObject({ kind: z.literal('liver-iron'), method: z.enum(mriMethods), fieldStrengthT, calibrationId: z.string().min(1).max(64) }),
  z.strictObject({ kind: z.literal('cardiac-t2star'), fieldStrengthT }),
  z.strictObject({ kind: z.enum(simpleKinds) }),
]);

const entrySchema = z.strictObject({
  system: z.string().min(1).max(300),
  code: z.string().min(1).max(100),
  /** For people reading the map; not matched. */
  display: z.string().max(200).optional(),
  result: resultSchema,
  unit: z.string().min(1).max(40),
});

const codeMapSchema = z.strictObject({
  format: z.literal(codeMapFormat),
  version: z.literal(1),
  codes: z.array(entrySchema).min(1).max(1000),
});

export type CodeMapResult = z.output<typeof resultSchema>;

/** One mapped code: what it becomes in the case file. */
export interface CodeMapEntry {
  readonly system: string;
  readonly code: string;
  readonly result: CodeMapResult;
  readonly unit: string;
}

/** A read code map, keyed by `system|code`. */
export interface CodeMap {
  /** The file, as messages and notes name it. */
  readonly name: string;
  readonly entries: ReadonlyMap<string, CodeMapEntry>;
}

/** The key a coding is looked up by. */
export const codingKey = (system: string, code: string): string => `${system}|${code}`;

/** The units the case model accepts for a mapped result (core/ranges: one table per fact). */
export function unitsForMappedResult(result: CodeMapResult): readonly string[] {
  if (result.kind === 'cardiac-t2star') return Object.keys(cardiacT2StarBounds);
  if ('method' in result) {
    switch (result.method) {
      case 'mri-r2star':
        return Object.keys(liverR2StarBounds);
      case 'mri-r2':
        return Object.keys(liverR2Bounds);
      case 'mri-t2star':
        return Object.keys(liverT2StarBounds);
      default:
        return Object.keys(liverIronBounds);
    }
  }
  return resultUnitsByKind[result.kind] ?? [];
}

const pathOf = (path: readonly PropertyKey[]) =>
  path.map((part, index) => (typeof part === 'number' ? `[${part}]` : index === 0 ? String(part) : `.${String(part)}`)).join('') || 'the file';

/**
 * Read a code map's text. Every problem names the file and where in it:
 * not JSON, a field missing or of the wrong kind, a unit the case file does
 * not accept for the kind, a code listed twice.
 *
 * @param name - the file as messages name it (`--code-map FILE`, or the chosen file's name)
 * @param text - the file's content
 * @returns the map, or issues on the path ['codeMap', …]
 * @example readCodeMap('map.json', '{"format":"chelation-ledger-code-map","version":1,"codes":[]}') → refused: codes must hold at least one code
 */
export function readCodeMap(name: string, text: string): Result<CodeMap> {
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch (error) {
    return fail(issue('invalid_file', ['codeMap'], `Code map ${name} is not valid JSON: ${(error as Error).message}.`));
  }
  const parsed = codeMapSchema.safeParse(json);
  if (!parsed.success) {
    const issues: Issue[] = parsed.error.issues.slice(0, 10).map((found) => {
      const hint =
        found.path.length === 0 || found.path[0] === 'format' || found.path[0] === 'version'
          ? ` (a code map starts with "format": "${codeMapFormat}", "version": 1)`
          : found.path.includes('result')
            ? ' (result is { "kind": … } with, for liver-iron, "method" and for MRI "fieldStrengthT" and "calibrationId"; for cardiac-t2star "fieldStrengthT")'
            : '';
      return issue('invalid_file', ['codeMap', ...found.path.map((it) => (typeof it === 'number' ? it : String(it)))], `Code map ${name}, ${pathOf(found.path)}: ${found.message}${hint}.`);
    });
    return fail(...issues);
  }
  const entries = new Map<string, CodeMapEntry>();
  const problems: Issue[] = [];
  parsed.data.codes.forEach((entry, index) => {
    const key = codingKey(entry.system, entry.code);
    const units = unitsForMappedResult(entry.result);
    if (!units.includes(entry.unit)) {
      problems.push(issue('invalid_file', ['codeMap', 'codes', index, 'unit'], `Code map ${name}, codes[${index}].unit: "${entry.unit}" is not a unit the case file records ${entry.result.kind}${'method' in entry.result ? ` (${entry.result.method})` : ''} in; use ${units.join(' or ')}.`));
    }
    if (entries.has(key)) {
      problems.push(issue('invalid_file', ['codeMap', 'codes', index], `Code map ${name}, codes[${index}]: ${key} is listed twice; keep one.`));
    }
    entries.set(key, { system: entry.system, code: entry.code, result: entry.result, unit: entry.unit });
  });
  return problems.length > 0 ? fail(...problems) : ok({ name, entries });
}
