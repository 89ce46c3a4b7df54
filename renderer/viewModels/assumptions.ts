import { assumptionCatalogue } from '../../core/assumptions';
import type { Case } from '../../core/model/caseFile';
import { formatValue } from './format';
import { sourceLine, type SourceLine } from './sources';

export interface AssumptionRow {
  readonly id: string;
  readonly label: string;
  readonly defaultText: string;
  readonly range: string;
  readonly sources: readonly SourceLine[];
  readonly alternatives: readonly string[];
  readonly override: string | null;
  readonly note: string;
}

/** Every published default with its source and status, and the case's override beside it. */
export function assumptionRows(caseFile: Case | null): AssumptionRow[] {
  const overrides = caseFile?.assumptionOverrides ?? {};
  return assumptionCatalogue.map((assumption) => {
    const override = (overrides as Readonly<Record<string, { value: number; reason: string; by?: string; at?: string }>>)[assumption.id];
    return {
      id: assumption.id,
      label: assumption.label,
      defaultText: formatValue(assumption.value, assumption.unit),
      range: `${formatValue(assumption.min, assumption.unit)} to ${formatValue(assumption.max, assumption.unit)}`,
      sources: assumption.sourceIds.map(sourceLine),
      alternatives: assumption.alternatives.map((alternative) => `${alternative.label}: ${formatValue(alternative.value, assumption.unit)}`),
      override: override ? `${formatValue(override.value, assumption.unit)} — ${override.reason}${override.by ? ` (${override.by}${override.at ? `, ${override.at}` : ''})` : ''}` : null,
      note: 'note' in assumption && typeof assumption.note === 'string' ? assumption.note : '',
    };
  });
}
