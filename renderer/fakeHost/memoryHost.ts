import { defaultSettings, settingsSchema, type HostApi, type HostValue, type Settings } from '../../core/contract';
import { parseCase } from '../../core/model/parseCase';
import { fail, issue, ok, type Result } from '../../core/result';

/** Where the in-page host keeps the workspace between reloads. */
export const memoryHostStorageKey = 'chelation-ledger.in-page-workspace';

interface KeyValueStorage {
  getItem(key: string): string | null;
  setItem(key: string, value: string): void;
}

interface StoredEntry {
  readonly document: Record<string, unknown>;
  readonly revision: number;
  readonly archived: boolean;
}

interface Persisted {
  readonly cases: Readonly<Record<string, StoredEntry>>;
  readonly settings: Settings;
  readonly exports: readonly string[];
}

/** What the in-page host records beyond the contract, for tests. */
export interface MemoryHostRecord {
  readonly exports: () => readonly string[];
}

const refusedHere = (what: string) =>
  fail(issue('host_failed', [], `${what} needs the desktop app or the preview server; this page keeps its cases in the browser only.`));

/**
 * The host contract (core/contract) answered inside the page: cases in
 * memory, mirrored to `storage` (localStorage in a browser) so a reload
 * reopens them; exports are recorded by name, not written. It stands in for
 * the desktop and preview hosts in tests and when the built renderer is
 * served on its own, and keeps their rules that the workspace relies on: a
 * taken name is refused, a save must name the revision it started from.
 */
export function createMemoryHost(seed: Readonly<Record<string, unknown>>, storage?: KeyValueStorage, version = '0.0.0'): HostApi & MemoryHostRecord {
  const stored = storage?.getItem(memoryHostStorageKey);
  let state: Persisted = stored
    ? (JSON.parse(stored) as Persisted)
    : {
        cases: Object.fromEntries(Object.entries(seed).map(([caseId, document]) => [caseId, { document: document as Record<string, unknown>, revision: 1, archived: false }])),
        settings: defaultSettings,
        exports: [],
      };
  const persist = () => storage?.setItem(memoryHostStorageKey, JSON.stringify(state));
  persist();
  const put = (caseId: string, entry: StoredEntry) => {
    state = { ...state, cases: { ...state.cases, [caseId]: entry } };
    persist();
  };
  const missing = (caseId: string) => fail(issue('invalid_file', ['caseId'], `No case "${caseId}" in this workspace.`));
  const warningsOf = (document: unknown) => {
    const parsed = parseCase(document);
    return parsed.ok ? [...(parsed.warnings ?? [])] : [];
  };
  const saved = (caseId: string): Result<HostValue<'saveCase'>> => ok({ caseId, revision: String(state.cases[caseId]!.revision), warnings: warningsOf(state.cases[caseId]!.document) });
  const summary = (caseId: string): HostValue<'listCases'>[number] => {
    const entry = state.cases[caseId]!;
    const parsed = parseCase(entry.document);
    const label = (entry.document.patient as { label?: unknown } | undefined)?.label;
    return { caseId, patientLabel: typeof label === 'string' ? label : null, archived: entry.archived, modifiedAt: null, issues: parsed.ok ? [...(parsed.warnings ?? [])] : [...parsed.issues] };
  };
  const exportOf = (kind: string, caseId: string, asOfDate: string): Result<HostValue<'exportCalendar'>> => {
    if (!state.cases[caseId]) return missing(caseId);
    const path = `in-page/${caseId.replace(/\.json$/, '')}-${asOfDate}.${kind}`;
    state = { ...state, exports: [...state.exports, path] };
    persist();
    return ok({ path });
  };
  return {
    exports: () => state.exports,
    appInfo: async () => ok({ name: 'chelation-ledger', version }),
    currentWorkspace: async () => ok({ folder: null }),
    chooseWorkspace: async () => ok({ folder: null }),
    listCases: async () => ok(Object.keys(state.cases).sort().map(summary)),
    openCase: async ({ caseId }) => {
      const entry = state.cases[caseId];
      if (!entry) return missing(caseId);
      return ok({ caseId, document: entry.document, revision: String(entry.revision), warnings: warningsOf(entry.document) });
    },
    createCase: async ({ caseId, document }) => {
      if (state.cases[caseId]) return fail(issue('inconsistent', ['caseId'], `A case named "${caseId}" already exists; choose another name.`));
      put(caseId, { document, revision: 1, archived: false });
      return saved(caseId);
    },
    saveCase: async ({ caseId, document, baseRevision }) => {
      const entry = state.cases[caseId];
      if (!entry) return missing(caseId);
      if (String(entry.revision) !== baseRevision) {
        return fail(issue('inconsistent', ['baseRevision'], `"${caseId}" changed since it was opened; reopen it to see the other change.`));
      }
      put(caseId, { ...entry, document, revision: entry.revision + 1 });
      return saved(caseId);
    },
    saveCaseAs: async ({ newCaseId, document }) => {
      if (state.cases[newCaseId]) return fail(issue('inconsistent', ['newCaseId'], `A case named "${newCaseId}" already exists; choose another name.`));
      put(newCaseId, { document, revision: 1, archived: false });
      return saved(newCaseId);
    },
    renameCase: async ({ caseId, newCaseId }) => {
      const entry = state.cases[caseId];
      if (!entry) return missing(caseId);
      if (state.cases[newCaseId]) return fail(issue('inconsistent', ['newCaseId'], `A case named "${newCaseId}" already exists.`));
      const { [caseId]: _moved, ...rest } = state.cases;
      state = { ...state, cases: { ...rest, [newCaseId]: entry } };
      persist();
      return ok(summary(newCaseId));
    },
    archiveCase: async ({ caseId }) => {
      const entry = state.cases[caseId];
      if (!entry) return missing(caseId);
      put(caseId, { ...entry, archived: true });
      return ok(summary(caseId));
    },
    recoverCase: async ({ caseId }) => {
      const entry = state.cases[caseId];
      if (!entry) return missing(caseId);
      return ok({ caseId, document: entry.document, revision: String(entry.revision), history: [] });
    },
    importDryRun: async () => refusedHere('Importing CSV or FHIR records'),
    importCommit: async () => refusedHere('Importing CSV or FHIR records'),
    // No long work runs here (imports are refused), so there is never progress to report or work to stop.
    workProgress: async () => ok(null),
    cancelWork: async () => ok({ stopping: false }),
    exportSheetPdf: async ({ caseId, asOfDate }) => exportOf('pdf', caseId, asOfDate),
    exportCalendar: async ({ caseId, asOfDate }) => exportOf('ics', caseId, asOfDate),
    readSettings: async () => ok(state.settings),
    writeSettings: async (settings) => {
      const checked = settingsSchema.safeParse(settings);
      if (!checked.success) return fail(issue('invalid_file', ['settings'], 'The settings were refused.'));
      state = { ...state, settings: checked.data };
      persist();
      return ok(state.settings);
    },
    // A page on its own has no operating system to ask it to open a file.
    takeOpenRequest: async () => ok(null),
  };
}
