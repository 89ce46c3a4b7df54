/**
 * Where a value came from when it is a published assumption: its id, and whether the
 * user overrode it (with the reason, who and when). Declared here, below the formulas,
 * so that core/formulas' derivations use it without core/assumptions importing them.
 */
export interface AssumptionOrigin {
  readonly kind: 'assumption';
  readonly assumptionId: string;
  readonly overridden: boolean;
  readonly reason?: string;
  readonly by?: string;
  readonly at?: string;
}

/** An assumption as used inside a record total or a derivation: its value and whether it was overridden. */
export interface AssumptionUse {
  readonly assumptionId: string;
  readonly value: number;
  readonly overridden: boolean;
  readonly reason?: string;
  readonly by?: string;
}

/**
 * The origin of an assumption's value: the published one, or a user's override with its reason, who and when.
 * The one builder of an assumption origin (formula inputs and resolved assumptions both use it).
 *
 * @example assumptionOrigin('iron-per-ml-red-cells') → { kind: 'assumption', assumptionId: 'iron-per-ml-red-cells', overridden: false }
 */
export function assumptionOrigin(assumptionId: string, override?: { readonly reason: string; readonly by?: string; readonly at?: string }): AssumptionOrigin {
  if (!override) return { kind: 'assumption', assumptionId, overridden: false };
  return {
    kind: 'assumption',
    assumptionId,
    overridden: true,
    reason: override.reason,
    ...(override.by !== undefined ? { by: override.by } : {}),
    ...(override.at !== undefined ? { at: override.at } : {}),
  };
}

/**
 * An assumption's origin and value as a derivation records its use (the one builder: the review context,
 * the method appendix and the record totals all use it).
 *
 * @example assumptionUseOf(assumptionOrigin('iron-per-ml-red-cells'), 1.08) → { assumptionId: 'iron-per-ml-red-cells', value: 1.08, overridden: false }
 */
export function assumptionUseOf(origin: AssumptionOrigin, value: number): AssumptionUse {
  return {
    assumptionId: origin.assumptionId,
    value,
    overridden: origin.overridden,
    ...(origin.reason !== undefined ? { reason: origin.reason } : {}),
    ...(origin.by !== undefined ? { by: origin.by } : {}),
  };
}
