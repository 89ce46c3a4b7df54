import { z } from 'zod';
import { caseFileFormat, caseSchemas, currentCaseFileVersion } from '../../core/model/caseFile';

/**
 * The case-file format for people and for editors, generated from the zod
 * schema so that it cannot drift: `docs/case-file.schema.json` (zod's own
 * JSON Schema export, draft 2020-12) and `docs/case-file.md` (every field with
 * its type, unit, range and choices, and one example per record kind from the
 * invented demo cases). `node scripts/case-file-docs.mjs` writes both;
 * tests/app/build/caseFileDocs.test.ts fails when they are out of date.
 */

/** Where the JSON Schema lives; an editor can point a case file's "$schema" at it. */
export const caseFileSchemaPath = 'docs/case-file.schema.json';
export const caseFileDocPath = 'docs/case-file.md';

type Node = {
  readonly type?: string | readonly string[];
  readonly const?: unknown;
  readonly enum?: readonly unknown[];
  readonly description?: string;
  readonly properties?: Readonly<Record<string, Node>>;
  readonly required?: readonly string[];
  readonly items?: Node;
  readonly oneOf?: readonly Node[];
  readonly anyOf?: readonly Node[];
  readonly additionalProperties?: Node | boolean;
  readonly minLength?: number;
  readonly maxLength?: number;
  readonly minItems?: number;
  readonly maxItems?: number;
  readonly format?: string;
  readonly default?: unknown;
};

/** The JSON Schema of the case file (what a file may contain as typed: defaults are optional). */
export function caseFileJsonSchema(): Record<string, unknown> {
  const generated = z.toJSONSchema(caseSchemas.refuse, { io: 'input', unrepresentable: 'any', target: 'draft-2020-12' }) as Record<string, unknown>;
  return {
    ...generated,
    $id: `https://chelation-ledger.invalid/${caseFileSchemaPath}`,
    title: `chelation-ledger case file, version ${currentCaseFileVersion}`,
    description: `One patient's case file (format "${caseFileFormat}"). Generated from the zod schema in core/model; do not edit by hand.`,
  };
}

const code = (value: unknown) => `\`${typeof value === 'string' ? value : JSON.stringify(value)}\``;
const escapeCell = (text: string) => text.replace(/\|/g, '\\|').replace(/\n/g, ' ');

/** A variant's name: its discriminating constants ("kind simple", "kind liver-iron, method mri"). */
function variantName(node: Node): string {
  const constants = Object.entries(node.properties ?? {}).filter(([, child]) => child.const !== undefined);
  return constants.map(([key, child]) => `${key} ${code(child.const)}`).join(', ') || 'form';
}

/** The variants of a node: the options of a oneOf, nested oneOfs flattened (results by kind, then liver iron by method). */
function variantsOf(node: Node): readonly Node[] {
  return (node.oneOf ?? []).flatMap((option) => (option.oneOf ? variantsOf(option) : [option]));
}

function typeText(node: Node): string {
  // Our own fields (numbers with ranges, dates) describe themselves.
  if (node.description && !node.properties && node.type !== 'array') return node.description;
  if (node.const !== undefined) return `always ${code(node.const)}`;
  if (node.enum) return `one of ${node.enum.map(code).join(', ')}`;
  const options = node.anyOf ?? node.oneOf;
  if (options) {
    const nonNull = options.filter((option) => option.type !== 'null');
    const nullable = nonNull.length < options.length ? ' or `null`' : '';
    // A unit: the UCUM codes, or the unit as people type it (read as UCUM on open).
    if (nonNull.length === 2 && nonNull[0]!.enum && nonNull[1]!.type === 'string') return `one of ${nonNull[0]!.enum.map(code).join(', ')} (other spellings are read as these UCUM codes)${nullable}`;
    return `${nonNull.map(typeText).join(' or ')}${nullable}`;
  }
  if (node.type === 'array') return `a list${node.maxItems !== undefined ? ` (at most ${node.maxItems})` : ''}${node.items && node.items.type !== 'object' && !node.items.oneOf ? ` of ${typeText(node.items)}` : ''}`;
  if (node.type === 'object') return node.properties ? 'an object' : 'an object keyed by id';
  if (node.type === 'string') {
    if (node.format === 'date') return 'a date YYYY-MM-DD';
    const length = node.maxLength !== undefined ? ` (${node.minLength ? `${node.minLength}–` : 'up to '}${node.maxLength} characters)` : '';
    return `text${length}`;
  }
  if (node.type === 'number' || node.type === 'integer') return node.type === 'integer' ? 'a whole number' : 'a number';
  if (node.type === 'boolean') return '`true` or `false`';
  return 'any value';
}

interface Row {
  readonly field: string;
  readonly required: boolean;
  readonly text: string;
}

/** Rows for an object's fields; nested objects are flattened with dotted names, quantities kept whole. */
function rows(node: Node, prefix = ''): Row[] {
  const required = new Set(node.required ?? []);
  return Object.entries(node.properties ?? {}).flatMap(([key, child]): Row[] => {
    const field = `${prefix}${key}`;
    const isQuantity = child.description?.startsWith('a quantity') ?? false;
    const description = child.description && (child.properties || child.type === 'array') ? ` — ${child.description}` : '';
    if (child.type === 'object' && child.properties && !isQuantity && !child.oneOf) {
      return [{ field, required: required.has(key), text: 'an object' }, ...rows(child, `${field}.`)];
    }
    if (isQuantity) {
      const unit = child.properties?.['unit'];
      return [{ field, required: required.has(key), text: `${child.description}; \`unit\` ${unit ? typeText(unit) : ''}` }];
    }
    return [{ field, required: required.has(key), text: `${typeText(child)}${description}` }];
  });
}

function table(tableRows: readonly Row[]): string[] {
  return ['| field | required | what it holds |', '| --- | --- | --- |', ...tableRows.map((row) => `| \`${row.field}\` | ${row.required ? 'yes' : 'no'} | ${escapeCell(row.text)} |`)];
}

function exampleBlock(example: unknown): string[] {
  return ['', 'Example (invented patient):', '', '```json', JSON.stringify(example, null, 2), '```'];
}

/** First entry of a list matching a variant's constants. */
function exampleFor(list: readonly unknown[], variant: Node): unknown {
  const constants = Object.entries(variant.properties ?? {}).filter(([, child]) => child.const !== undefined);
  return list.find((entry) => constants.every(([key, child]) => (entry as Record<string, unknown>)[key] === child.const));
}

/**
 * The case-file page as Markdown.
 *
 * @param schema - caseFileJsonSchema()
 * @param examples - parsed demo case files (invented patients), searched for one example per record kind
 */
export function caseFileMarkdown(schema: Record<string, unknown>, examples: readonly Record<string, unknown>[]): string {
  const root = schema as Node;
  const lines: string[] = [
    '# The case file',
    '',
    '<!-- Generated by scripts/case-file-docs.mjs from the zod schema in core/model; do not edit by hand. -->',
    '',
    `One JSON file per patient, \`"format": "${caseFileFormat}"\` and \`"version": ${currentCaseFileVersion}\` at the top. Older versions are migrated when the file is opened and written in version ${currentCaseFileVersion} only when it is saved; a newer version than the tool knows is refused and never overwritten.`,
    '',
    `The same format as a JSON Schema (draft 2020-12) is [\`${caseFileSchemaPath.replace('docs/', '')}\`](${caseFileSchemaPath.replace('docs/', '')}): point an editor at it to complete and check a case file as you type (\`"$schema": "./case-file.schema.json"\` is not part of the format; configure the editor instead).`,
    '',
    'Every number carries its unit as a UCUM code (`mL`, `kg`, `ug/L`, `mg/g{dry}`). Two ranges are checked: outside the **plausible** range a value is kept with a warning; outside the **possible** range it is refused (see `check`). The patient label is a code (TH-0417), never a name. Dates are calendar dates `YYYY-MM-DD`. Lists may be left out and mean empty.',
    '',
    'Decision support only: every number computed from this file is for review by the prescriber; follow local protocols.',
    '',
    '## Top level',
    '',
    ...table(rows({ ...root, properties: Object.fromEntries(Object.entries(root.properties ?? {}).map(([key, child]) => [key, child.type === 'object' && child.properties ? { type: 'object', properties: {} } : child])) })),
  ];
  for (const [key, child] of Object.entries(root.properties ?? {})) {
    const listed = child.type === 'array' ? child.items : child;
    if (!listed || (listed.type !== 'object' && !listed.oneOf)) continue;
    lines.push('', `## \`${key}\``, '');
    if (child.type === 'array') lines.push(`A list${child.maxItems !== undefined ? ` of at most ${child.maxItems}` : ''}; each entry takes one of the forms below.`, '');
    const values = examples.flatMap((example) => {
      const value = example[key];
      return Array.isArray(value) ? value : value === undefined ? [] : [value];
    });
    const variants = listed.oneOf ? variantsOf(listed) : [listed];
    for (const variant of variants) {
      if (listed.oneOf) lines.push(`### \`${key}\`: ${variantName(variant)}`, '');
      lines.push(...table(rows(variant)));
      // Nested forms inside one object (the patient's age) get their own tables.
      for (const [innerKey, inner] of Object.entries(variant.properties ?? {})) {
        if (!inner.oneOf) continue;
        for (const innerVariant of variantsOf(inner)) lines.push('', `\`${innerKey}\` as ${variantName(innerVariant)}:`, '', ...table(rows(innerVariant)));
      }
      const example = listed.oneOf ? exampleFor(values, variant) : values[0];
      if (example !== undefined) lines.push(...exampleBlock(example));
      lines.push('');
    }
  }
  return `${lines.join('\n').replace(/\n{3,}/g, '\n\n').trimEnd()}\n`;
}
