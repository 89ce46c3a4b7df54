import type { Derivation } from '../../core/formulas/derivation';
import { formatValue } from '../viewModels/format';
import { sourceLine } from '../viewModels/sources';

/** How a number was computed: core's derivation, formula by formula, inputs with their origins. */
export function DerivationTree({ derivation }: { readonly derivation: Derivation }) {
  return (
    <div className="derivation">
      <p className="derivation-title">{derivation.title}</p>
      <p className="derivation-expression"><code>{derivation.expression}</code></p>
      <ul>
        {derivation.inputs.map((input) => (
          <li key={input.name}>
            {input.label}: <strong>{formatValue(input.value, input.unit)}</strong> <span className="origin">({originText(input.origin)})</span>
            {input.origin.kind === 'computed' ? <DerivationTree derivation={input.origin.derivation} /> : null}
          </li>
        ))}
      </ul>
      <p className="derivation-outputs">
        gives {derivation.outputs.map((output) => `${output.label} ${formatValue(output.value, output.unit)}`).join('; ')}
      </p>
      {derivation.sourceIds.length > 0 ? <p className="sources">Sources: {derivation.sourceIds.map((id) => sourceLine(id).text).join(' · ')}</p> : null}
    </div>
  );
}

function originText(origin: Derivation['inputs'][number]['origin']): string {
  switch (origin.kind) {
    case 'entered':
      return `entered${origin.ref ? `, ${origin.ref}` : ''}`;
    case 'default':
      return 'default of the formula';
    case 'assumption':
      return origin.overridden ? `assumption ${origin.assumptionId}, overridden: ${origin.reason ?? ''}` : `published assumption ${origin.assumptionId}`;
    case 'record':
      return origin.description;
    case 'computed':
      return 'computed';
  }
}
