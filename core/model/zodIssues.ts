import type { z } from 'zod';
import { issue, issueCodes, type Issue, type IssueCode } from '../result';
import { currentCaseFileVersion } from './caseFile';

/**
 * Turn zod's issues into ours: a code from our closed set, a path into the
 * case file, and a sentence that starts with the field
 * ("transfusions[3].unitHaematocrit 60 is outside 0.40–0.85; …").
 *
 * Our own checks (numbers, dates, assumption ids) raise zod 'custom' issues
 * whose params carry our code and whose message is the sentence after the
 * field's name; every other zod issue is structural and worded here.
 */

type Path = readonly (string | number)[];

/**
 * A path into the case file as a reader writes it; every message starts with it.
 *
 * @param path - keys and list indexes from the root
 * @returns e.g. "transfusions[3].unitHaematocrit"; "The case file" for the root
 * @example pathText(['transfusions', 3, 'unitHaematocrit']) === 'transfusions[3].unitHaematocrit'
 */
export function pathText(path: Path): string {
  if (path.length === 0) return 'The case file';
  return path.map((part, index) => (typeof part === 'number' ? `[${part}]` : index === 0 ? part : `.${part}`)).join('');
}

/**
 * A value as a message shows it: text quoted and cut at 40 characters, containers by kind.
 *
 * @example describeValue('60%') === '"60%"'; describeValue([1]) === 'a list'
 */
export function describeValue(value: unknown): string {
  if (value === undefined) return 'missing';
  if (value === null) return 'null';
  if (Array.isArray(value)) return 'a list';
  if (typeof value === 'object') return 'an object';
  if (typeof value === 'string') return JSON.stringify(value.length > 40 ? `${value.slice(0, 40)}…` : value);
  return String(value);
}

const expectedWords: Readonly<Record<string, string>> = {
  string: 'text',
  number: 'a number',
  int: 'a whole number',
  boolean: 'true or false',
  array: 'a list',
  object: 'an object',
  record: 'an object',
  null: 'null',
};

function choices(values: readonly unknown[]): string {
  return values.map((value) => (typeof value === 'string' ? value : String(value))).join(', ');
}

function isIssueCode(value: unknown): value is IssueCode {
  return typeof value === 'string' && (issueCodes as readonly string[]).includes(value);
}

function toPath(path: readonly PropertyKey[]): (string | number)[] {
  return path.map((part) => (typeof part === 'symbol' ? String(part) : part));
}

/** What the messages call the document checked: a case file unless a caller (the host contract) says otherwise. */
export interface DocumentWords {
  /** Subject of a message about the whole document, e.g. "The case file". */
  readonly root: string;
  /** What an unknown field is not a field of, e.g. "a version 1 case file". */
  readonly fieldOf: string;
}

const caseFileWords: DocumentWords = { root: 'The case file', fieldOf: `a version ${currentCaseFileVersion} case file` };

function sentence(path: Path, rest: string, words: DocumentWords): string {
  return `${path.length === 0 ? words.root : pathText(path)} ${rest}`;
}

function convertOne(zodIssue: z.core.$ZodIssue, severity: Issue['severity'], words: DocumentWords): Issue[] {
  const path = toPath(zodIssue.path);
  const make = (code: IssueCode, where: Path, rest: string) => issue(code, where, sentence(where, rest, words), severity);
  const missing = !('input' in zodIssue) || zodIssue.input === undefined;
  switch (zodIssue.code) {
    case 'custom': {
      const code = isIssueCode(zodIssue.params?.['code']) ? zodIssue.params['code'] : 'invalid_file';
      return [make(missing ? 'required' : code, path, zodIssue.message)];
    }
    case 'invalid_type': {
      const expected = expectedWords[zodIssue.expected] ?? zodIssue.expected;
      if (missing) return [make('required', path, `is missing; expected ${expected}.`)];
      const code = zodIssue.expected === 'number' ? 'not_a_number' : 'invalid_file';
      return [make(code, path, `is ${describeValue(zodIssue.input)}; expected ${expected}.`)];
    }
    case 'invalid_value':
      return [make('unknown_choice', path, `${describeValue(zodIssue.input)} is not one of: ${choices(zodIssue.values)}.`)];
    case 'invalid_union': {
      const { discriminator } = zodIssue;
      if (discriminator !== undefined && 'options' in zodIssue && zodIssue.options) {
        // zod puts the discriminator's name at the end of the path already.
        const given = typeof zodIssue.input === 'object' && zodIssue.input !== null ? (zodIssue.input as Record<string, unknown>)[discriminator] : undefined;
        if (given === undefined) return [make('required', path, `is missing; expected one of: ${choices(zodIssue.options)}.`)];
        return [make('unknown_choice', path, `${describeValue(given)} is not one of: ${choices(zodIssue.options)}.`)];
      }
      return [make('invalid_file', path, 'matches none of the forms this field can take.')];
    }
    case 'unrecognized_keys':
      return zodIssue.keys.map((key) =>
        make('unknown_option', [...path, key], `is not a field of ${words.fieldOf} here; check its spelling.`),
      );
    case 'too_small':
      if (zodIssue.origin === 'string') return [make('required', path, 'is empty; enter some text.')];
      return [make('out_of_range', path, `has too few entries; expected at least ${String(zodIssue.minimum)}.`)];
    case 'too_big': {
      const length = Array.isArray(zodIssue.input) || typeof zodIssue.input === 'string' ? zodIssue.input.length : undefined;
      const what = zodIssue.origin === 'string' ? 'characters' : 'entries';
      const has = length === undefined ? 'is too long' : `has ${length} ${what}`;
      return [make('out_of_range', path, `${has}; at most ${String(zodIssue.maximum)} ${what}.`)];
    }
    case 'invalid_key':
    case 'invalid_element':
      return zodIssue.issues.flatMap((inner) => convertOne({ ...inner, path: [...zodIssue.path, ...inner.path] }, severity, words));
    default:
      return [make('invalid_file', path, `is not valid (${zodIssue.message}).`)];
  }
}

/**
 * Convert zod issues to ours.
 *
 * @param zodIssues - from `safeParse(input, { reportInput: true })` (the input is needed for the messages)
 * @param severity - 'error' for the refusing schema, 'warning' for the plausibility schema
 * @param words - what the messages call the document; a case file unless given
 * @returns one Issue per problem (an unknown-keys issue becomes one per key)
 * @example issuesFromZod([{ code: 'invalid_value', values: ['kg'], path: ['patient', 'weights', 0, 'weight', 'unit'], input: 'lb', message: '' }], 'error')[0].message
 *   === 'patient.weights[0].weight.unit "lb" is not one of: kg.'
 */
export function issuesFromZod(zodIssues: readonly z.core.$ZodIssue[], severity: Issue['severity'], words: DocumentWords = caseFileWords): Issue[] {
  return zodIssues.flatMap((zodIssue) => convertOne(zodIssue, severity, words));
}
