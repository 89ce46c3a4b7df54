import { fail, issue, ok, type Result } from '../../core/result';
import type { ExportReceipt, StoredCase, WorkspaceHost } from '../hostPort';

/** Where the in-page store keeps the workspace between reloads. */
export const memoryHostStorageKey = 'chelation-ledger.workspace';

interface KeyValueStorage {
  getItem(key: string): string | null;
  setItem(key: string, value: string): void;
}

/**
 * A workspace host that lives in the page: the cases in memory, mirrored to
 * `storage` (localStorage in a browser) so a reload reopens them. It stands in
 * for the desktop and preview hosts in tests and when the built renderer is
 * served on its own; exports are recorded, not written to disk.
 */
export function createMemoryHost(seed: readonly StoredCase[], storage?: KeyValueStorage): WorkspaceHost & { readonly exports: readonly string[] } {
  const cases = new Map<string, unknown>();
  const exports: string[] = [];
  const stored = storage?.getItem(memoryHostStorageKey);
  if (stored) {
    for (const entry of JSON.parse(stored) as StoredCase[]) cases.set(entry.id, entry.json);
  } else {
    for (const entry of seed) cases.set(entry.id, entry.json);
  }
  const persist = () => storage?.setItem(memoryHostStorageKey, JSON.stringify([...cases].map(([id, json]) => ({ id, json }))));
  persist();
  const freshId = (json: unknown): string => {
    const label = (json as { patient?: { label?: unknown } } | null)?.patient?.label;
    const base = typeof label === 'string' && label.trim() !== '' ? label.trim().toLowerCase().replace(/[^a-z0-9]+/g, '-') : 'case';
    let id = base;
    for (let count = 2; cases.has(id); count += 1) id = `${base}-${count}`;
    return id;
  };
  const record = (kind: string, id: string, asOf: string): Result<ExportReceipt> => {
    if (!cases.has(id)) return fail(issue('unknown_choice', ['id'], `No case "${id}" in this workspace.`));
    const location = `${kind}/${id}-${asOf}.${kind === 'sheet' ? 'pdf' : 'ics'}`;
    exports.push(location);
    return ok({ location, bytes: JSON.stringify(cases.get(id)).length });
  };
  return {
    kind: 'in-page store',
    exports,
    async listCases() {
      return ok([...cases].map(([id, json]) => ({ id, json })));
    },
    async saveCase(id, json) {
      cases.set(id, json);
      persist();
      return ok({ id });
    },
    async createCase(json) {
      const id = freshId(json);
      cases.set(id, json);
      persist();
      return ok({ id });
    },
    async importCase(text) {
      let json: unknown;
      try {
        json = JSON.parse(text);
      } catch {
        return fail(issue('invalid_file', ['file'], 'The file is not JSON: a case file is the JSON this program saves.'));
      }
      const id = freshId(json);
      cases.set(id, json);
      persist();
      return ok({ id });
    },
    async exportSheet(id, asOf) {
      return record('sheet', id, asOf);
    },
    async exportCalendar(id, asOf) {
      return record('calendar', id, asOf);
    },
  };
}
