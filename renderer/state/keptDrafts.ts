/**
 * Entries the user typed and that are not saved yet (a new case being filled
 * in, a record whose rows core does not accept yet or whose save failed, an
 * import's choices), kept in the browser's storage so that a reload, a crash
 * of the page or a refused save loses nothing. One module owns the keys and
 * the storage; the store and the hooks keep, read and discard through it.
 * What is kept is what was typed, as JSON; the reader checks its shape.
 */

/** The part of the Web Storage API the drafts use (localStorage in a page; a map in tests). */
export interface DraftStorage {
  getItem(key: string): string | null;
  setItem(key: string, value: string): void;
  removeItem(key: string): void;
}

/** What a kept draft holds: the value and when it was kept (ISO time, for the notice). */
export interface KeptDraft<Value> {
  readonly value: Value;
  readonly keptAt: string;
}

/** The drafts a page keeps: the new-case form, one per open record, the import's choices. */
export type DraftKey = 'new-case' | 'import' | `record:${string}`;

export interface KeptDrafts {
  keep(key: DraftKey, value: unknown): void;
  /** The kept draft under `key` when `accept` takes its value, else null (a draft of another shape is dropped). */
  read<Value>(key: DraftKey, accept: (value: unknown) => value is Value): KeptDraft<Value> | null;
  discard(key: DraftKey): void;
}

const prefix = 'chelation-ledger.kept-draft.';

/**
 * Drafts over a storage. A storage that refuses a write (full, or disabled by
 * the browser) leaves the draft in memory only: the page keeps working, and
 * the entry is still on screen.
 *
 * @param storage - localStorage in the page; null keeps drafts in memory (a page without storage)
 * @param now - the clock for `keptAt` (the renderer may read the clock; core never does)
 */
export function createKeptDrafts(storage: DraftStorage | null, now: () => Date = () => new Date()): KeptDrafts {
  const inMemory = new Map<string, string>();
  const write = (key: string, text: string) => {
    try {
      if (storage) storage.setItem(key, text);
      else inMemory.set(key, text);
    } catch {
      inMemory.set(key, text);
    }
  };
  const readText = (key: string): string | null => {
    try {
      return inMemory.get(key) ?? storage?.getItem(key) ?? null;
    } catch {
      return null;
    }
  };
  return {
    keep(key, value) {
      write(prefix + key, JSON.stringify({ value, keptAt: now().toISOString() }));
    },
    read<Value>(key: DraftKey, accept: (value: unknown) => value is Value): KeptDraft<Value> | null {
      const text = readText(prefix + key);
      if (text === null) return null;
      try {
        const kept = JSON.parse(text) as { value?: unknown; keptAt?: unknown };
        if (typeof kept.keptAt === 'string' && accept(kept.value)) return { value: kept.value, keptAt: kept.keptAt };
      } catch {
        // Not JSON: dropped below, as a draft of another shape is.
      }
      this.discard(key);
      return null;
    },
    discard(key) {
      inMemory.delete(prefix + key);
      try {
        storage?.removeItem(prefix + key);
      } catch {
        // A storage that refuses: the in-memory copy is gone, which is what the page reads first.
      }
    },
  };
}

let shared: KeptDrafts | undefined;

/** The page's drafts (one for the page): localStorage when the page has it. */
export function pageKeptDrafts(): KeptDrafts {
  if (shared) return shared;
  let storage: DraftStorage | null = null;
  try {
    storage = typeof localStorage === 'undefined' ? null : localStorage;
  } catch {
    storage = null;
  }
  shared = createKeptDrafts(storage);
  return shared;
}

/** "Unsaved entry restored (typed 2026-11-20 14:05 UTC)": when a draft was kept, in words. */
export function keptAtText(keptAt: string): string {
  return `${keptAt.slice(0, 10)} ${keptAt.slice(11, 16)} UTC`;
}
