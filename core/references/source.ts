import { choiceWords } from '../words';
/**
 * A published source for a formula, a constant or a rule.
 *
 * `status` follows ../shared/references.md:
 * - confirmed: seen in the primary source or its abstract;
 * - secondary: seen only where another page reproduces the source;
 * - memory: not seen, recalled; verify before relying on it;
 * - standard: an international standard (CIAAW, UCUM, LOINC);
 * - derived: follows by arithmetic from other sources named in `note`;
 * - definition: true by definition (R2* = 1/T2*);
 * - common-practice: a fact of the trade with no single published source.
 */
export type SourceStatus =
  | 'confirmed'
  | 'secondary'
  | 'memory'
  | 'standard'
  | 'derived'
  | 'definition'
  | 'common-practice';

export interface Source {
  /** Stable id, e.g. 'angelucci-2000'. */
  readonly id: string;
  /** Authors as printed (first author et al. is fine), or the issuing body. */
  readonly authors: string;
  readonly title: string;
  /** Journal, volume and pages, or publisher. */
  readonly publication: string;
  readonly year: number | null;
  /** Table, equation, section or page inside the source. */
  readonly locator?: string;
  readonly status: SourceStatus;
  readonly note?: string;
}

/** Short human citation: "Angelucci et al., N Engl J Med 2000;343:327 (confirmed)". */
export function citeShort(source: Source): string {
  // Common practice and definitions have no authors or publication: their title says what they are.
  if (source.authors === '—') return `${source.title} [${choiceWords(source.status)}]`;
  const where = source.locator ? `, ${source.locator}` : '';
  return `${source.authors}, ${source.publication}${where} [${choiceWords(source.status)}]`;
}
