import { createStore, type StoreApi } from 'zustand/vanilla';
import { useStore } from 'zustand';
import type { MenuCommand } from '../../core/contract/callNames';
import type { Case } from '../../core/model/caseFile';
import { formatIssues } from '../../core/result';
import type { StoredCase, WorkspaceHost } from '../hostPort';
import { checkDraft, draftFromJson, draftToJson, type Draft, type DraftCheck } from '../viewModels/draftCase';

/**
 * The one module that owns the workspace's state (zustand is used here and
 * nowhere else). Views read it through `useWorkspace` and change it only
 * through the intents below; each intent is a small function of the state.
 */
export const screens = ['cases', 'record', 'iron', 'regimens', 'findings', 'sheet', 'assumptions'] as const;
export type Screen = (typeof screens)[number];
export type UnitSystem = 'si' | 'conventional';
export type SaveState = 'saved' | 'saving' | 'unsaved-errors' | 'failed';

const historyLimit = 200;

export interface WorkspaceState {
  readonly host: WorkspaceHost | null;
  /** Which host answers, in words ('desktop or preview', 'in-page store'), for the about box. */
  readonly hostKind: string;
  readonly version: string;
  readonly screen: Screen;
  readonly cases: readonly StoredCase[];
  readonly openId: string | null;
  readonly draft: Draft | null;
  readonly check: DraftCheck | null;
  /** The last draft core accepted: the screens keep showing it while the record has errors. */
  readonly accepted: Case | null;
  readonly past: readonly Draft[];
  readonly future: readonly Draft[];
  readonly saveState: SaveState;
  readonly message: string | null;
  readonly unitSystem: UnitSystem;
  readonly lastExport: string | null;
  readonly aboutOpen: boolean;
  /** Long work under way (reading a workspace, writing an export), with how far it got; null when idle. */
  readonly busy: { readonly label: string; readonly done: number; readonly total: number | null } | null;
  /** A case file the operating system asked to open while this case had unsaved changes: it opens once they are saved or undone. */
  readonly openWaiting: boolean;
  /** The workspace folder the host reads, where it has one (null for the in-page store). */
  readonly workspaceFolder: string | null;
}

export interface WorkspaceIntents {
  connect(host: WorkspaceHost, hostKind: string): Promise<void>;
  showScreen(screen: Screen): void;
  openCase(id: string): void;
  closeCase(): void;
  createCase(json: unknown): Promise<void>;
  importCase(text: string): Promise<void>;
  /** Change the draft; recorded for undo and saved when core accepts it. */
  edit(change: (draft: Draft) => Draft): void;
  undo(): void;
  redo(): void;
  setUnitSystem(system: UnitSystem): void;
  exportSheet(asOf: string): Promise<void>;
  exportCalendar(asOf: string): Promise<void>;
  setAboutOpen(open: boolean): void;
  dismissMessage(): void;
  /** Stop the long work under way: reading stops at the next case; an export already sent to the host is no longer waited for. */
  cancelBusy(): void;
  /** Open the case file the operating system asked for (a double-click on a case file), unless unsaved changes would be lost. */
  openRequested(): Promise<void>;
  /** A command from the desktop menu or the main process. */
  hostCommand(command: MenuCommand): void;
}

export type Workspace = WorkspaceState & WorkspaceIntents;

const initial: WorkspaceState = {
  host: null,
  hostKind: 'none',
  version: '',
  screen: 'cases',
  cases: [],
  openId: null,
  draft: null,
  check: null,
  accepted: null,
  past: [],
  future: [],
  saveState: 'saved',
  message: null,
  unitSystem: 'si',
  lastExport: null,
  aboutOpen: false,
  busy: null,
  openWaiting: false,
  workspaceFolder: null,
};

/** A new workspace store (one per page; tests make their own). */
export function createWorkspaceStore(): StoreApi<Workspace> {
  return createStore<Workspace>()((set, get) => {
    let cancelled = false;
    const begin = (label: string) => {
      cancelled = false;
      set({ busy: { label, done: 0, total: null } });
    };
    const refresh = async () => {
      const host = get().host;
      if (!host) return;
      begin('Reading the workspace');
      const listed = await host.listCases({ report: (done, total) => set({ busy: { label: 'Reading the workspace', done, total } }), cancelled: () => cancelled });
      set({ busy: null });
      if (listed.ok) set({ cases: listed.value, ...(cancelled ? { message: `Reading stopped: ${listed.value.length} case(s) listed; the rest are not shown.` } : {}) });
      else set({ message: `The case list could not be read: ${formatIssues(listed.issues)}` });
    };
    /** Check the draft with core and save it when it is accepted. */
    const settle = async (draft: Draft) => {
      const check = checkDraft(draft);
      set({ check, accepted: check.caseFile ?? get().accepted });
      const { host, openId } = get();
      if (!host || !openId) return;
      if (!check.caseFile) {
        set({ saveState: 'unsaved-errors' });
        return;
      }
      set({ saveState: 'saving' });
      const json = draftToJson(draft);
      const saved = await host.saveCase(openId, json);
      if (get().draft !== draft) return; // a later edit saves itself
      if (saved.ok) {
        set({ saveState: 'saved', cases: get().cases.map((entry) => (entry.id === openId ? { id: openId, json } : entry)) });
        if (get().openWaiting) void get().openRequested();
      } else {
        set({ saveState: 'failed', message: `Not saved: ${formatIssues(saved.issues)} What you typed is still here.` });
      }
    };
    const open = (id: string) => {
      const stored = get().cases.find((entry) => entry.id === id);
      if (!stored) return;
      const draft = draftFromJson(stored.json);
      const check = checkDraft(draft);
      set({ openId: id, draft, check, accepted: check.caseFile, past: [], future: [], saveState: 'saved', screen: 'record', lastExport: null });
    };
    const exportWith = async (kind: 'sheet' | 'calendar', asOf: string) => {
      const { host, openId } = get();
      if (!host || !openId) return;
      begin(kind === 'sheet' ? 'Writing the review sheet' : 'Writing the monitoring calendar');
      const written = kind === 'sheet' ? await host.exportSheet(openId, asOf) : await host.exportCalendar(openId, asOf);
      const wasCancelled = cancelled;
      set({ busy: null });
      if (wasCancelled) set({ message: `No longer waiting for the ${kind}; the host may still write it${written.ok ? ` (it reported ${written.value.location})` : ''}.` });
      else if (written.ok) set({ lastExport: `${kind === 'sheet' ? 'Review sheet' : 'Monitoring calendar'} written to ${written.value.location}` });
      else set({ message: `The ${kind} was not written: ${formatIssues(written.issues)}` });
    };
    return {
      ...initial,
      async connect(host, hostKind) {
        set({ host, hostKind });
        const [unitSystem, version, workspaceFolder] = await Promise.all([host.readUnitSystem(), host.appVersion(), host.workspaceFolder()]);
        set({ unitSystem, version, workspaceFolder });
        await refresh();
      },
      showScreen(screen) {
        set({ screen });
      },
      openCase: open,
      closeCase() {
        set({ openId: null, draft: null, check: null, accepted: null, past: [], future: [], screen: 'cases' });
        if (get().openWaiting) void get().openRequested();
      },
      async createCase(json) {
        const host = get().host;
        if (!host) return;
        const created = await host.createCase(json);
        if (!created.ok) {
          set({ message: `The case was not created: ${formatIssues(created.issues)}` });
          return;
        }
        await refresh();
        open(created.value.id);
      },
      async importCase(text) {
        const host = get().host;
        if (!host) return;
        const imported = await host.importCase(text);
        if (!imported.ok) {
          set({ message: `The file was not imported: ${formatIssues(imported.issues)}` });
          return;
        }
        await refresh();
        set({ message: `Imported as ${imported.value.id}.` });
      },
      edit(change) {
        const draft = get().draft;
        if (!draft) return;
        const next = change(draft);
        if (next === draft) return;
        set({ draft: next, past: [...get().past, draft].slice(-historyLimit), future: [] });
        void settle(next);
      },
      undo() {
        const { past, draft, future } = get();
        const previous = past[past.length - 1];
        if (!previous || !draft) return;
        set({ draft: previous, past: past.slice(0, -1), future: [draft, ...future] });
        void settle(previous);
      },
      redo() {
        const { past, draft, future } = get();
        const [next, ...rest] = future;
        if (!next || !draft) return;
        set({ draft: next, past: [...past, draft], future: rest });
        void settle(next);
      },
      setUnitSystem(unitSystem) {
        set({ unitSystem });
        void get().host?.writeUnitSystem(unitSystem);
      },
      exportSheet: (asOf) => exportWith('sheet', asOf),
      exportCalendar: (asOf) => exportWith('calendar', asOf),
      setAboutOpen(aboutOpen) {
        set({ aboutOpen });
      },
      dismissMessage() {
        set({ message: null });
      },
      cancelBusy() {
        cancelled = true;
      },
      async openRequested() {
        const { host, openId, saveState } = get();
        if (!host) return;
        if (openId !== null && saveState !== 'saved') {
          // The request stays with the host until this case's changes are saved or undone: nothing typed is lost.
          set({ openWaiting: true, message: `A case file was asked to open; it opens when the changes to ${openId} are saved (or undone, or the case is closed).` });
          return;
        }
        set({ openWaiting: false });
        const taken = await host.takeOpenRequest();
        if (!taken.ok) {
          set({ message: `The case file could not be opened: ${formatIssues(taken.issues)}` });
          return;
        }
        if (taken.value === null) return;
        const { id, folder } = taken.value;
        // The host's workspace is now the file's folder: the open case (saved) belonged to the old one.
        set({ openId: null, draft: null, check: null, accepted: null, past: [], future: [], screen: 'cases', workspaceFolder: folder });
        await refresh();
        if (get().cases.some((entry) => entry.id === id)) open(id);
        else set({ message: `${id} was not found in ${folder}; the cases of that folder are listed.` });
      },
      hostCommand(command) {
        if (command === 'open-requested') void get().openRequested();
        else if (command === 'open') set({ screen: 'cases' });
        else if (command === 'export-sheet') set({ screen: get().openId === null ? 'cases' : 'sheet' });
        else {
          // Save: every accepted edit is saved as it is made; a save asked for again retries a failed one.
          const { draft, saveState } = get();
          if (draft && saveState === 'unsaved-errors') set({ message: 'Not saved: the record has entries to correct, each marked beside its field; what you typed is kept.' });
          else if (draft && saveState === 'failed') void settle(draft);
        }
      },
    };
  });
}

/** The page's store. */
export const workspaceStore = createWorkspaceStore();

/** Read a slice of the workspace in a component. */
export function useWorkspace<Slice>(select: (state: Workspace) => Slice): Slice {
  return useStore(workspaceStore, select);
}
