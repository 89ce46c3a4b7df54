/**
 * A derivation says how a number came to be: the formula, its inputs with
 * units and origins, the sources, and the derivations of inputs that were
 * themselves computed. Formulas build it while they compute (core/formulas/run),
 * never in a second pass.
 */

import type { AssumptionOrigin, AssumptionUse } from '../assumptions/origin';

export type { AssumptionUse } from '../assumptions/origin';

export type Origin =
  /** Typed by the user; `ref` points at the case entry, e.g. 'transfusions[3] 2026-01-04'. */
  | { readonly kind: 'entered'; readonly ref?: string }
  /** The formula's own fixed default. */
  | { readonly kind: 'default' }
  /** A published assumption, at its default or overridden by the user. */
  | AssumptionOrigin
  /**
   * A total or a pick from the case record (e.g. the sum of the transfusions in a window),
   * with the entries it used and the published assumptions that went into it.
   */
  | {
      readonly kind: 'record';
      readonly description: string;
      readonly refs: readonly string[];
      readonly assumptions?: readonly AssumptionUse[];
    }
  /** The output of another formula. */
  | { readonly kind: 'computed'; readonly derivation: Derivation };


export interface DerivedValue {
  readonly name: string;
  readonly label: string;
  readonly value: number | string;
  readonly unit: string;
}

export interface DerivedInput extends DerivedValue {
  readonly origin: Origin;
}

export interface Derivation {
  readonly formulaId: string;
  readonly title: string;
  readonly expression: string;
  readonly inputs: readonly DerivedInput[];
  readonly outputs: readonly DerivedValue[];
  readonly sourceIds: readonly string[];
}

/**
 * Visit every node of a derivation tree, depth first, the root first: the one walk over
 * nested derivations (the method appendix and formulaIdsIn use it).
 */
export function forEachDerivation(derivation: Derivation, visit: (node: Derivation) => void): void {
  visit(derivation);
  for (const input of derivation.inputs) if (input.origin.kind === 'computed') forEachDerivation(input.origin.derivation, visit);
}

/** Every formula id used in a derivation tree, depth first, each once. */
export function formulaIdsIn(derivation: Derivation): string[] {
  const seen = new Set<string>();
  forEachDerivation(derivation, (node) => seen.add(node.formulaId));
  return [...seen];
}
