import type { Source } from './source';

/** Sources for patient (references.md). */
export const patientSources = [] as const satisfies readonly Source[];
