import { createStore, type StoreApi } from 'zustand/vanilla';
import { useStore } from 'zustand';
import type { MenuCommand } from '../../core/contract/callNames';
import { importKinds } from '../../core/contract';
import type { Case } from '../../core/model/caseFile';
import { formatIssues } from '../../core/result';
import { newWorkId, type RecordImportPreview, type RecordImportRequest, type StoredCase, type WorkProgress, type WorkspaceHost } from '../hostPort';
import { checkDraft, draftFromJson, draftToJson, isDraft, type Draft, type DraftCheck } from '../viewModels/draftCase';
import { importCancelledText, importedText, importStoppingText, importTooLateText, kindForFile, type DateOrder, type ImportKind } from '../viewModels/recordImport';
import { exportBusy, exportOutcomeText, exportStoppingStep, type BusyWork } from '../viewModels/busy';
import { createKeptDrafts, pageKeptDrafts, type KeptDrafts } from './keptDrafts';

/**
 * The one module that owns the workspace's state (zustand is used here and
 * nowhere else). Views read it through `useWorkspace` and change it only
 * through the intents below; each intent is a small function of the state.
 */
export const screens = ['cases', 'record', 'import', 'iron', 'regimens', 'findings', 'sheet', 'assumptions'] as const;
export type Screen = (typeof screens)[number];
export type UnitSystem = 'si' | 'conventional';
export type SaveState = 'saved' | 'saving' | 'unsaved-errors' | 'failed' | 'unsaved-restored';

/** An import of records from a file into a case: the user's choices, the host's preview, and the work under way. */
export interface ImportSession {
  readonly caseId: string | null;
  readonly kind: ImportKind;
  readonly fileName: string | null;
  /** The chosen file's text, read in the page; null before a file is chosen (or when a restored draft was too large to keep it). */
  readonly fileText: string | null;
  /** The user's corrections of the column mapping (column → field); null: the host's guesses. */
  readonly columnMapping: Readonly<Record<string, string>> | null;
  readonly dateOrder: DateOrder | null;
  readonly preview: RecordImportPreview | null;
  readonly previewWarnings: readonly string[];
  /** Why the host refused the dry run or the commit, in its words. */
  readonly refusal: string | null;
  /** What became of a Cancel (stopping, stopped, too late to stop), in words; not a refusal. */
  readonly notice: string | null;
  /** A dry run or a commit waiting for the host, with the step the host last reported; Cancel asks the host to stop it and stops waiting. */
  readonly pending: ImportPending | null;
}

/** An import call under way: what it is, its label until the host reports a step, its work id, and the host's last step. */
export interface ImportPending {
  readonly what: 'preview' | 'commit';
  readonly label: string;
  /** The id the call carries, with which the page asks for its progress and cancels it. */
  readonly workId: string;
  readonly progress: WorkProgress | null;
}

/** A kept entry put back on screen (a reload or a failed save came between), with a way to discard it. */
export interface RestoredNotice {
  readonly what: 'record' | 'import';
  readonly keptAt: string;
  /** The stored case changed after the entry was typed: it is not saved over it until the user edits. */
  readonly storedChanged: boolean;
}

/** The largest file text an import draft keeps in the browser's storage (about 1 MB of 5 MB per origin; a modelling choice of ours). */
const keptImportTextLimit = 1_000_000;

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
  readonly busy: BusyWork | null;
  /** A case file the operating system asked to open while this case had unsaved changes: it opens once they are saved or undone. */
  readonly openWaiting: boolean;
  /** The workspace folder the host reads, where it has one (null for the in-page store). */
  readonly workspaceFolder: string | null;
  readonly importSession: ImportSession | null;
  readonly restored: RestoredNotice | null;
}

export interface WorkspaceIntents {
  connect(host: WorkspaceHost, hostKind: string): Promise<void>;
  showScreen(screen: Screen): void;
  openCase(id: string): void;
  closeCase(): void;
  /** True when the case was created (and opened). */
  createCase(json: unknown): Promise<boolean>;
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
  /** The Import screen, for the given case (else the open one, else the first). */
  openImport(caseId?: string): void;
  chooseImportFile(fileName: string, fileText: string): void;
  setImportChoices(change: Partial<Pick<ImportSession, 'caseId' | 'kind' | 'columnMapping' | 'dateOrder'>>): void;
  commitImport(): Promise<void>;
  /**
   * Ask the host to stop the dry run or commit under way (cancelWork, with the call's work id) and stop
   * waiting for it. The host stops at its next step and saves nothing; a commit whose save had already
   * begun is written, and the screen says so when the host answers (the case is read again then).
   */
  cancelImport(): Promise<void>;
  /** Start the import over: the file and choices are dropped (and their kept draft). */
  clearImport(): void;
  /** Drop the restored entry: the record goes back to the stored case (undo brings the entry back), an import starts over. */
  discardRestored(): void;
  dismissRestored(): void;
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
  importSession: null,
  restored: null,
};

/** The workspace with no case open (closing a case; another folder's case asked for). */
const noCaseOpen = { openId: null, draft: null, check: null, accepted: null, past: [], future: [], screen: 'cases', restored: null } as const satisfies Partial<WorkspaceState>;

const emptyImport = (caseId: string | null): ImportSession => ({
  caseId,
  kind: 'csv-transfusions',
  fileName: null,
  fileText: null,
  columnMapping: null,
  dateOrder: null,
  preview: null,
  previewWarnings: [],
  refusal: null,
  notice: null,
  pending: null,
});

interface KeptRecord {
  readonly draft: Draft;
  /** The stored case the entry started from, as JSON text: a restore over a changed file is not saved over it unasked. */
  readonly startedFrom: string;
}
const isKeptRecord = (value: unknown): value is KeptRecord =>
  typeof value === 'object' && value !== null && isDraft((value as KeptRecord).draft) && typeof (value as KeptRecord).startedFrom === 'string';

type KeptImport = Pick<ImportSession, 'caseId' | 'kind' | 'fileName' | 'fileText' | 'columnMapping' | 'dateOrder'>;
const isKeptImport = (value: unknown): value is KeptImport => {
  const kept = value as KeptImport;
  return (
    typeof value === 'object' && value !== null &&
    (kept.caseId === null || typeof kept.caseId === 'string') &&
    (importKinds as readonly string[]).includes(kept.kind) &&
    (kept.fileName === null || typeof kept.fileName === 'string') &&
    (kept.fileText === null || typeof kept.fileText === 'string') &&
    (kept.columnMapping === null || (typeof kept.columnMapping === 'object' && Object.values(kept.columnMapping).every((it) => typeof it === 'string'))) &&
    (kept.dateOrder === null || kept.dateOrder === 'day-first' || kept.dateOrder === 'month-first')
  );
};

/** A new workspace store (one per page; tests make their own, with drafts in memory unless given). */
export function createWorkspaceStore(drafts: KeptDrafts = createKeptDrafts(null)): StoreApi<Workspace> {
  return createStore<Workspace>()((set, get) => {
    let cancelled = false;
    /** Which import request's answer is awaited; a newer request or a Cancel makes an older answer stale. */
    let importTicket = 0;
    /** The stored case's draft a restored entry replaced: what "Discard it" goes back to. */
    let beforeRestore: Draft | null = null;
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
        drafts.discard(`record:${openId}`);
        set({ saveState: 'saved', cases: get().cases.map((entry) => (entry.id === openId ? { id: openId, json } : entry)) });
        if (get().openWaiting) void get().openRequested();
      } else {
        set({ saveState: 'failed', message: `Not saved: ${formatIssues(saved.issues)} What you typed is still here.` });
      }
    };
    /** Keep the open record's draft until a save of it succeeds. */
    const keepRecord = (draft: Draft) => {
      const { openId, cases } = get();
      if (!openId) return;
      const stored = cases.find((entry) => entry.id === openId);
      const existing = drafts.read(`record:${openId}`, isKeptRecord);
      drafts.keep(`record:${openId}`, { draft, startedFrom: existing?.value.startedFrom ?? JSON.stringify(stored?.json ?? null) } satisfies KeptRecord);
    };
    const changeDraft = (next: Draft, history: Pick<WorkspaceState, 'past' | 'future'>) => {
      set({ draft: next, ...history });
      keepRecord(next);
      void settle(next);
    };
    const open = (id: string) => {
      const stored = get().cases.find((entry) => entry.id === id);
      if (!stored) return;
      const draft = draftFromJson(stored.json);
      const storedText = JSON.stringify(stored.json);
      const kept = drafts.read(`record:${id}`, isKeptRecord);
      const check = checkDraft(draft);
      set({ openId: id, draft, check, accepted: check.caseFile, past: [], future: [], saveState: 'saved', screen: 'record', lastExport: null, restored: null });
      if (!kept) return;
      if (JSON.stringify(draftToJson(kept.value.draft)) === storedText) {
        drafts.discard(`record:${id}`);
        return;
      }
      // The entry typed before a reload or a failed save: back on screen, the stored case one undo away.
      const storedChanged = kept.value.startedFrom !== storedText;
      const restoredCheck = checkDraft(kept.value.draft);
      beforeRestore = draft;
      set({ draft: kept.value.draft, check: restoredCheck, accepted: restoredCheck.caseFile ?? check.caseFile, past: [draft], restored: { what: 'record', keptAt: kept.keptAt, storedChanged } });
      if (storedChanged) set({ saveState: 'unsaved-restored' });
      else void settle(kept.value.draft);
    };
    const keepImport = () => {
      const session = get().importSession;
      if (!session) return;
      const { caseId, kind, fileName, fileText, columnMapping, dateOrder } = session;
      drafts.keep('import', { caseId, kind, fileName, fileText: fileText !== null && fileText.length <= keptImportTextLimit ? fileText : null, columnMapping, dateOrder } satisfies KeptImport);
    };
    const importRequest = (session: ImportSession): RecordImportRequest | null => {
      if (!session.caseId || session.fileName === null || session.fileText === null) return null;
      return {
        caseId: session.caseId,
        kind: session.kind,
        sourceName: session.fileName,
        sourceText: session.fileText,
        ...(session.columnMapping && session.kind !== 'fhir-bundle' ? { columnMapping: { ...session.columnMapping } } : {}),
        ...(session.dateOrder && session.kind !== 'fhir-bundle' ? { dateOrder: session.dateOrder } : {}),
      };
    };
    const setSession = (change: Partial<ImportSession>) => {
      const session = get().importSession;
      if (session) set({ importSession: { ...session, ...change } });
    };
    /** The host's step for the call under way, if it is still the one awaited. */
    const showProgress = (workId: string, progress: WorkProgress) => {
      const pending = get().importSession?.pending;
      if (pending?.workId === workId) setSession({ pending: { ...pending, progress } });
    };
    /** Ask the host what the import would add, for the choices as they stand now. */
    const runPreview = async () => {
      const { host, importSession } = get();
      const request = importSession && importRequest(importSession);
      if (!host || !request) return;
      // A dry run of older choices is of no use any more: the host is asked to stop it.
      const older = importSession.pending;
      if (older?.what === 'preview') void host.cancelWork(older.workId);
      const ticket = (importTicket += 1);
      const workId = newWorkId();
      setSession({ pending: { what: 'preview', label: `Reading ${request.sourceName}`, workId, progress: null }, refusal: null, notice: null });
      const previewed = await host.previewRecordImport(request, { workId, onProgress: (progress) => showProgress(workId, progress) });
      if (ticket !== importTicket) return;
      if (previewed.ok) setSession({ pending: null, preview: previewed.value, previewWarnings: (previewed.warnings ?? []).map((it) => it.message), refusal: null });
      else setSession({ pending: null, preview: null, previewWarnings: [], refusal: formatIssues(previewed.issues) });
    };
    const changeImport = (change: Partial<ImportSession>) => {
      setSession({ ...change, preview: null, refusal: null, notice: null });
      keepImport();
      void runPreview();
    };
    /** An export followed on the host (its steps on the busy line); Cancel asks the host to stop before the file is written. */
    const exportWith = async (kind: 'sheet' | 'calendar', asOf: string) => {
      const { host, openId } = get();
      if (!host || !openId) return;
      const what = kind === 'sheet' ? 'review sheet' : 'monitoring calendar';
      const label = `Writing the ${what}`;
      const workId = newWorkId();
      cancelled = false;
      set({ busy: { label, done: 0, total: null, workId } });
      const followed = {
        workId,
        // A step reported after Cancel was pressed does not hide "Stopping".
        onProgress: (progress: WorkProgress) => {
          if (get().busy?.workId === workId && !cancelled) set({ busy: exportBusy(label, workId, progress) });
        },
      };
      const written = kind === 'sheet' ? await host.exportSheet(openId, asOf, followed) : await host.exportCalendar(openId, asOf, followed);
      set({ busy: null });
      if (written.ok) set({ lastExport: exportOutcomeText(what, { location: written.value.location, cancelAsked: cancelled }) });
      else if (written.issues.some((it) => it.code === 'cancelled')) set({ lastExport: exportOutcomeText(what, 'stopped') });
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
        set(noCaseOpen);
        if (get().openWaiting) void get().openRequested();
      },
      async createCase(json) {
        const host = get().host;
        if (!host) return false;
        const created = await host.createCase(json);
        if (!created.ok) {
          set({ message: `The case was not created: ${formatIssues(created.issues)} What you typed is still in the form.` });
          return false;
        }
        await refresh();
        open(created.value.id);
        return true;
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
        changeDraft(next, { past: [...get().past, draft].slice(-historyLimit), future: [] });
      },
      undo() {
        const { past, draft, future } = get();
        const previous = past[past.length - 1];
        if (!previous || !draft) return;
        changeDraft(previous, { past: past.slice(0, -1), future: [draft, ...future] });
      },
      redo() {
        const { past, draft, future } = get();
        const [next, ...rest] = future;
        if (!next || !draft) return;
        changeDraft(next, { past: [...past, draft], future: rest });
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
        const { host, busy } = get();
        // Work the host follows (an export) is asked to stop; the answer it then gives says whether it did.
        if (host && busy?.workId !== undefined) {
          set({ busy: { ...busy, step: exportStoppingStep } });
          void host.cancelWork(busy.workId);
        }
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
        set({ ...noCaseOpen, workspaceFolder: folder });
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
      openImport(caseId) {
        const { importSession, openId, cases } = get();
        const target = caseId ?? openId ?? importSession?.caseId ?? cases[0]?.id ?? null;
        if (importSession) {
          set({ screen: 'import' });
          if (caseId && caseId !== importSession.caseId) changeImport({ caseId });
          return;
        }
        const kept = drafts.read('import', isKeptImport);
        if (kept && (kept.value.fileName !== null || kept.value.columnMapping !== null)) {
          const keptCase = kept.value.caseId !== null && cases.some((entry) => entry.id === kept.value.caseId) ? kept.value.caseId : target;
          set({ screen: 'import', importSession: { ...emptyImport(caseId ?? keptCase), ...kept.value, caseId: caseId ?? keptCase }, restored: { what: 'import', keptAt: kept.keptAt, storedChanged: false } });
          void runPreview();
          return;
        }
        set({ screen: 'import', importSession: emptyImport(target) });
      },
      chooseImportFile(fileName, fileText) {
        const session = get().importSession ?? emptyImport(get().openId);
        set({ importSession: session });
        changeImport({ fileName, fileText, kind: kindForFile(fileName, session.kind), columnMapping: null });
      },
      setImportChoices(change) {
        // A new kind reads other fields: the corrections of the old mapping no longer apply.
        changeImport(change.kind !== undefined && change.kind !== get().importSession?.kind ? { ...change, columnMapping: null } : change);
      },
      async commitImport() {
        const { host, importSession, openId, saveState, cases } = get();
        const request = importSession && importRequest(importSession);
        if (!host || !importSession || !request) return;
        if (request.caseId === openId && saveState !== 'saved') {
          setSession({ refusal: 'The open record has entries that are not saved yet; correct or undo them in Record first, so that the import does not set them aside.' });
          return;
        }
        const ticket = (importTicket += 1);
        const label = (cases.find((entry) => entry.id === request.caseId)?.json as { patient?: { label?: string } } | null)?.patient?.label ?? request.caseId;
        const workId = newWorkId();
        setSession({ pending: { what: 'commit', label: `Adding the import from ${request.sourceName} to ${label}`, workId, progress: null }, refusal: null, notice: null });
        const committed = await host.commitRecordImport(request, { workId, onProgress: (progress) => showProgress(workId, progress) });
        const abandoned = ticket !== importTicket;
        const cancelled = !committed.ok && committed.issues.some((it) => it.code === 'cancelled');
        // Whatever was shown, the workspace is read again so that the screens show what is on disk.
        await refresh();
        if (committed.ok && request.caseId === get().openId) open(request.caseId);
        if (abandoned) {
          if (committed.ok) set({ message: `The import you stopped was added before it could be stopped: ${importedText(committed.value.counts, request.sourceName, label)}` });
          // The host's answer to the Cancel (or why it failed anyway), unless another dry run or commit has begun since.
          else if (!get().importSession?.pending) setSession(cancelled ? { notice: importCancelledText(request.sourceName, label) } : { notice: null, refusal: formatIssues(committed.issues) });
          return;
        }
        if (!committed.ok) {
          setSession(cancelled ? { pending: null, notice: importCancelledText(request.sourceName, label) } : { pending: null, refusal: formatIssues(committed.issues) });
          return;
        }
        drafts.discard('import');
        set({ importSession: null, restored: null, message: importedText(committed.value.counts, request.sourceName, label) });
        if (get().openId !== request.caseId) open(request.caseId);
        set({ screen: 'record' });
      },
      async cancelImport() {
        const { host, importSession } = get();
        const pending = importSession?.pending;
        if (!host || !pending) return;
        importTicket += 1;
        setSession({ pending: null, notice: pending.what === 'commit' ? importStoppingText() : null });
        const { stopping } = await host.cancelWork(pending.workId);
        // Too late for the commit: its save had begun (or it had finished) when the host was asked.
        if (pending.what === 'commit' && !stopping && get().importSession?.notice === importStoppingText()) setSession({ notice: importTooLateText() });
      },
      clearImport() {
        importTicket += 1;
        drafts.discard('import');
        set({ importSession: emptyImport(get().importSession?.caseId ?? get().openId), restored: get().restored?.what === 'import' ? null : get().restored });
      },
      discardRestored() {
        const restored = get().restored;
        if (!restored) return;
        if (restored.what === 'import') {
          get().clearImport();
          return;
        }
        const { draft, past } = get();
        set({ restored: null });
        if (!beforeRestore || !draft) return;
        const back = beforeRestore;
        beforeRestore = null;
        changeDraft(back, { past: [...past, draft].slice(-historyLimit), future: [] });
      },
      dismissRestored() {
        set({ restored: null });
      },
    };
  });
}

/** The page's store. */
export const workspaceStore = createWorkspaceStore(pageKeptDrafts());

/** Read a slice of the workspace in a component. */
export function useWorkspace<Slice>(select: (state: Workspace) => Slice): Slice {
  return useStore(workspaceStore, select);
}
