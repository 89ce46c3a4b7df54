import type { Origin } from '../formulas/derivation';
import { formatPlain } from '../numbers/formatNumber';

/**
 * Where a derivation input came from, in one line a reader can check: typed in,
 * the formula's default, a published assumption (flagged when overridden, with
 * who and why), a total over the record, or another formula's result. Shared by
 * `explain` and the review sheet's method appendix.
 *
 * @example describeOrigin({ kind: 'default' }) === 'default of the formula'
 */
export function describeOrigin(origin: Origin): string {
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
