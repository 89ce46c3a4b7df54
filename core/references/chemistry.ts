import type { Source } from './source';

/** Sources for chemistry (references.md). */
export const chemistrySources = [] as const satisfies readonly Source[];
