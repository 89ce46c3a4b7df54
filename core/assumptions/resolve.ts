import { assumptionOrigin, type AssumptionOrigin } from './origin';
import { findAssumption, type AssumptionOverrides } from './catalogue';

export interface ResolvedAssumption {
  readonly id: string;
  readonly label: string;
  readonly unit: string;
  readonly value: number;
  readonly origin: AssumptionOrigin;
}

/**
 * The value of a published assumption for a case: the user's override when
 * there is one (with its reason), the published default otherwise.
 *
 * @param id - an assumption id from the catalogue (a developer's constant: unknown ids throw)
 * @param overrides - the case's overrides by assumption id
 * @example resolveAssumption('iron-per-ml-red-cells', {}).value === 1.08
 */
export function resolveAssumption(id: string, overrides: AssumptionOverrides): ResolvedAssumption {
  const assumption = findAssumption(id);
  if (!assumption) throw new Error(`Unknown assumption ${id}`);
  const override = overrides[id];
  return { id, label: assumption.label, unit: assumption.unit, value: override ? override.value : assumption.value, origin: assumptionOrigin(id, override) };
}
