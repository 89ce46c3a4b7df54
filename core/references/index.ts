import { chelatorsSources } from './chelators';
import { chemistrySources } from './chemistry';
import { coursesSources } from './courses';
import { dosingSources } from './dosing';
import { ironSources } from './iron';
import { ledgerSources } from './ledger';
import { patientSources } from './patient';
import { safetySources } from './safety';
import type { Source } from './source';
import { standardSources } from './standards';

export * from './source';

/** Every source the core cites. Each area owns its list; add a source there. */
export const sourceCatalogue: readonly Source[] = [
  ...standardSources,
  ...ironSources,
  ...chelatorsSources,
  ...patientSources,
  ...chemistrySources,
  ...dosingSources,
  ...safetySources,
  ...coursesSources,
  ...ledgerSources,
];

const byId = new Map<string, Source>();
for (const source of sourceCatalogue) {
  if (byId.has(source.id)) throw new Error(`Duplicate source id ${source.id}`);
  byId.set(source.id, source);
}

export function findSource(id: string): Source | undefined {
  return byId.get(id);
}
