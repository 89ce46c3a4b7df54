import { assumptionUseOf } from '../assumptions/origin';
import { forEachDerivation, type AssumptionUse, type Derivation } from '../formulas/derivation';
import { findFormula } from '../catalogue';
import { findSource, type Source } from '../references';

export interface AppendixFormula {
  readonly formulaId: string;
  readonly title: string;
  readonly expression: string;
  readonly notes: readonly string[];
  readonly sources: readonly Source[];
  /** Ids of the results (as given to the builder) whose derivation used this formula. */
  readonly usedBy: readonly string[];
}

export interface AppendixAssumption extends AssumptionUse {
  readonly usedBy: readonly string[];
}

export interface MethodAppendix {
  readonly formulas: readonly AppendixFormula[];
  readonly assumptions: readonly AppendixAssumption[];
}

/**
 * The method appendix of a review: exactly the formulas and published
 * assumptions that the given derivations used, each formula with its
 * expression and full sources, each assumption with its value and whether it
 * was overridden (with the reason). Built from the derivations themselves, so
 * it lists what was used and nothing else.
 *
 * @param derivations - the results shown (id and derivation), e.g. from derivationsOf(results)
 * @returns formulas in first-use order; assumptions sorted by id
 */
export function methodAppendix(derivations: readonly { readonly id: string; readonly derivation: Derivation }[]): MethodAppendix {
  const formulas = new Map<string, { usedBy: Set<string> }>();
  const assumptions = new Map<string, { use: AssumptionUse; usedBy: Set<string> }>();
  const noteAssumption = (use: AssumptionUse, resultId: string) => {
    const key = `${use.assumptionId}|${use.value}|${use.overridden}`;
    const entry = assumptions.get(key) ?? { use, usedBy: new Set<string>() };
    entry.usedBy.add(resultId);
    assumptions.set(key, entry);
  };
  const note = (node: Derivation, resultId: string): void => {
    const entry = formulas.get(node.formulaId) ?? { usedBy: new Set<string>() };
    entry.usedBy.add(resultId);
    formulas.set(node.formulaId, entry);
    for (const input of node.inputs) {
      const origin = input.origin;
      if (origin.kind === 'assumption') noteAssumption(assumptionUseOf(origin, input.value as number), resultId);
      else if (origin.kind === 'record') for (const use of origin.assumptions ?? []) noteAssumption(use, resultId);
    }
  };
  for (const { id, derivation } of derivations) forEachDerivation(derivation, (node) => note(node, id));
  return {
    formulas: [...formulas.entries()].map(([formulaId, { usedBy }]) => {
      const formula = findFormula(formulaId);
      if (!formula) throw new Error(`Derivation uses uncatalogued formula ${formulaId}`);
      return {
        formulaId,
        title: formula.title,
        expression: formula.expression,
        notes: formula.notes ?? [],
        sources: formula.sourceIds.map((sourceId) => {
          const source = findSource(sourceId);
          if (!source) throw new Error(`Formula ${formulaId} cites unknown source ${sourceId}`);
          return source;
        }),
        usedBy: [...usedBy],
      };
    }),
    assumptions: [...assumptions.values()]
      .map(({ use, usedBy }) => ({ ...use, usedBy: [...usedBy] }))
      .sort((a, b) => a.assumptionId.localeCompare(b.assumptionId)),
  };
}
