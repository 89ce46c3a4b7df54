import { findSource } from '../../core/references';
import { choiceWords } from '../../core/words';

export interface SourceLine {
  readonly id: string;
  readonly text: string;
  /** The source's status in words ('confirmed', 'common practice'). */
  readonly status: string;
}

/** A cited source as a reader sees it: authors, title, publication, year, locator, and its status. */
export function sourceLine(id: string): SourceLine {
  const source = findSource(id);
  if (!source) return { id, text: `source ${id} (not in the catalogue)`, status: 'unknown' };
  const parts = [source.authors === '—' ? null : source.authors, source.title, source.publication, source.year === null ? null : String(source.year), source.locator ?? null];
  const kept = parts.filter((part): part is string => part !== null && part !== '');
  return { id, text: kept.map((part, index) => (index < kept.length - 1 && !part.endsWith('.') ? `${part}.` : part)).join(' '), status: choiceWords(source.status) };
}
