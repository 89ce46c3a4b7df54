import type { Derivation } from '../../core/formulas/derivation';
import { describeOrigin } from '../../core/report/describeOrigin';
import { citeShort, findSource } from '../../core/references';
import { formatReadable, withUnit } from './format';

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
    ...derivation.inputs.map((input) => `${pad}  input  ${input.label} = ${value(input)} — ${describeOrigin(input.origin)}`),
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
