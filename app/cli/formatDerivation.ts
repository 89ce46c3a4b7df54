import type { Derivation, Origin } from '../../core/formulas/derivation';
import { citeShort, findSource } from '../../core/references';
import { formatPlain, formatReadable, withUnit } from './format';

function originText(origin: Origin): string {
  switch (origin.kind) {
    case 'entered':
      return origin.ref ? `entered (${origin.ref})` : 'entered';
    case 'default':
      return 'default of the formula';
    case 'assumption':
      return origin.overridden
        ? `assumption ${origin.assumptionId}, OVERRIDDEN${origin.by ? ` by ${origin.by}` : ''}${origin.at ? ` on ${origin.at}` : ''}: ${origin.reason ?? 'no reason given'}`
        : `assumption ${origin.assumptionId}, published default`;
    case 'record': {
      const uses = (origin.assumptions ?? []).map(
        (use) => `${use.assumptionId} ${formatPlain(use.value)}${use.overridden ? ` OVERRIDDEN: ${use.reason ?? 'no reason given'}` : ''}`,
      );
      const refs = origin.refs.length > 0 ? `; ${origin.refs.length} entr${origin.refs.length === 1 ? 'y' : 'ies'}` : '';
      return `from the record: ${origin.description}${refs}${uses.length > 0 ? `; using ${uses.join(', ')}` : ''}`;
    }
    case 'computed':
      return `computed (${origin.derivation.formulaId}, below)`;
  }
}

/**
 * A derivation tree as indented text: formula, expression, inputs with units
 * and origins, outputs, sources; computed inputs are expanded beneath.
 */
export function formatDerivation(derivation: Derivation, depth = 0): string {
  const pad = '  '.repeat(depth);
  const value = (entry: { value: number | string; unit: string }) =>
    withUnit(typeof entry.value === 'number' ? formatReadable(entry.value) : entry.value, entry.unit);
  const lines = [
    `${pad}${derivation.title} [${derivation.formulaId}]`,
    `${pad}  formula: ${derivation.expression}`,
    ...derivation.inputs.map((input) => `${pad}  input  ${input.label} = ${value(input)} — ${originText(input.origin)}`),
    ...derivation.outputs.map((output) => `${pad}  result ${output.label} = ${value(output)}`),
    ...derivation.sourceIds.map((id) => {
      const source = findSource(id);
      return `${pad}  source ${source ? citeShort(source) : id}`;
    }),
  ];
  for (const input of derivation.inputs) {
    if (input.origin.kind === 'computed') lines.push(formatDerivation(input.origin.derivation, depth + 2));
  }
  return lines.join('\n');
}
