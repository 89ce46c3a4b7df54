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
