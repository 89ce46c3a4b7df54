import { maxProposedRegimens } from '../../core/model/caseFile';
import { entryToRow, newRowCells, rowToEntry, withCell, type Cells } from './recordTables';

/**
 * A what-if regimen as the Regimens form holds it: a name and up to two
 * periods written as chelation-period cells (the same columns as the
 * record), starting on the review date. core/model checks it with the case.
 */
export interface WhatIfForm {
  readonly periods: readonly Cells[];
}

/** A form that starts from the current regimen's periods (their cells), or a blank deferasirox period. */
export function whatIfFromCurrent(currentPeriods: readonly Readonly<Record<string, unknown>>[]): WhatIfForm {
  const periods = currentPeriods.map((period) => entryToRow('chelationPeriods', period).cells);
  return { periods: periods.length > 0 ? periods : [newRowCells('chelationPeriods')] };
}

export function withPeriodCell(form: WhatIfForm, index: number, key: string, value: string): WhatIfForm {
  return { periods: form.periods.map((cells, at) => (at === index ? withCell('chelationPeriods', cells, key, value) : cells)) };
}

export function withAddedPeriod(form: WhatIfForm, drug: string): WhatIfForm {
  return { periods: [...form.periods, newRowCells('chelationPeriods', { drug, adherence: '1' })] };
}

export function withoutPeriod(form: WhatIfForm, index: number): WhatIfForm {
  return { periods: form.periods.filter((_, at) => at !== index) };
}

/** The name core shows for a what-if: its periods in words. */
export function whatIfName(form: WhatIfForm): string {
  return form.periods
    .map((cells) => `${cells.drug ?? ''} ${cells.dose ?? ''} ${cells.doseUnit ?? ''}${cells.daysPerWeek && cells.daysPerWeek !== '7' ? ` on ${cells.daysPerWeek} days a week` : ''}`.replace(/\s+/g, ' ').trim())
    .join(' with ')
    .slice(0, 80);
}

/** The proposed regimens list with this what-if added (ids unique; periods start on the review date, ongoing). */
export function withWhatIf(existing: readonly Readonly<Record<string, unknown>>[], form: WhatIfForm, reviewDate: string): Readonly<Record<string, unknown>>[] {
  if (existing.length >= maxProposedRegimens) return [...existing];
  const taken = new Set(existing.map((regimen) => String(regimen.id)));
  let number = existing.length + 1;
  while (taken.has(`what-if-${number}`)) number += 1;
  const id = `what-if-${number}`;
  const periods = form.periods.map((cells, index) =>
    rowToEntry('chelationPeriods', { id: `${id}-p${index + 1}`, cells: { ...cells, startDate: reviewDate, endDate: '' } }),
  );
  return [...existing, { id, name: whatIfName(form) || id, periods }];
}
