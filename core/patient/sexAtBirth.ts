/**
 * Sex recorded at birth, as the renal equations use it (their coefficients
 * were fitted by sex). Kept as its own closed set so a case file, a form and
 * the command line offer the same two values.
 */
export const sexesAtBirth = ['female', 'male'] as const;

export type SexAtBirth = (typeof sexesAtBirth)[number];
