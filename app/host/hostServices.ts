import { join } from 'node:path';
import type { HostHandlers, HostValue } from '../../core/contract';
import { fail, issue, ok, type Result } from '../../core/result';
import { openCaseStore, type CaseStore, type OpenedCase } from './caseStore';
import { exportCalendar, exportSheetPdf } from './exportCalls';
import { importCommit, importDryRun } from './imports/importCalls';
import { revisionFromToken, revisionToken } from './revisionToken';
import { toolVersion } from './toolVersion';
import type { SettingsStore } from './settingsStore';
import { insideFolder } from './workspaceFiles';
import type { OpenRequests } from './openRequests';
import { createWorkInProgress } from './workInProgress';

/**
 * What the host services need from the process that runs them; each host
 * (Electron's main, the preview server, tests) hands in its own.
 */
export interface HostEnvironment {
  readonly appName: string;
  readonly appVersion: string;
  /** The workspace folder in use (absolute), or null before one is chosen. */
  readonly workspace: { get(): string | null; set(folder: string): void };
  /** A folder dialog; absent where the host cannot show one (the browser preview). */
  readonly chooseFolder?: () => Promise<string | null>;
  readonly settings: SettingsStore;
  /** The host's clock, for file-system timestamps in exports only; core never reads it. */
  readonly now: () => Date;
  /** Case files the operating system or the command line asked to open (app/host/openRequests.ts); absent: none ever are. */
  readonly openRequests?: OpenRequests;
}

type Summary = HostValue<'listCases'>[number];

const noWorkspace = (): Result<never> => fail(issue('required', ['workspace'], 'No workspace folder is chosen yet; choose the folder that holds the case files.'));

/** One line of the case list from the store's reading of the file (the same reading as openCase). */
function summaryOf(caseId: string, opened: Result<OpenedCase>): Summary {
  if (!opened.ok) return { caseId, patientLabel: null, archived: false, modifiedAt: null, issues: [...opened.issues] };
  const { caseFile, warnings, revision } = opened.value;
  return { caseId, patientLabel: caseFile.patient.label, archived: false, modifiedAt: new Date(revision.mtimeMs).toISOString(), issues: [...warnings] };
}

/** One line of the case list for a case just renamed or archived (read through the store). */
async function summaryFromStore(caseStore: CaseStore, caseId: string): Promise<Summary> {
  return summaryOf(caseId, await caseStore.open(caseId));
}

const savedValue = (opened: OpenedCase) => ok({ caseId: opened.fileName, revision: revisionToken(opened.revision), warnings: [...opened.warnings] });

/**
 * The host's services behind the contract, wired to what exists: case writes go
 * through app/host/caseStore.ts (atomic, journalled, refusing a silent overwrite), and so do
 * listing and opening (one reading path); imports use the command line's own
 * import (app/host/imports/importCase.ts, via importCalls.ts); the monitoring calendar is
 * written with app/host/icalendar.ts, the review sheet with app/host/sheetPdf.ts
 * (both into the workspace's exports folder, never over an earlier export),
 * settings with settingsStore.ts. Imports and exports (exportCalls.ts) run as steps under the
 * page's work id (app/host/workInProgress.ts), which workProgress and cancelWork answer about.
 */
export function createHostServices(environment: HostEnvironment): HostHandlers {
  const work = createWorkInProgress();
  const store = async <T>(run: (caseStore: CaseStore) => Promise<Result<T>>): Promise<Result<T>> => {
    const folder = environment.workspace.get();
    return folder === null ? noWorkspace() : run(openCaseStore(folder, { now: environment.now }));
  };
  return {
    appInfo: () => ok({ name: environment.appName, version: environment.appVersion }),
    currentWorkspace: () => ok({ folder: environment.workspace.get() }),
    chooseWorkspace: async () => {
      if (!environment.chooseFolder) {
        return fail(issue('not_available', ['workspace'], 'This window cannot show a folder dialog; the browser preview uses the folder given with --workspace.'));
      }
      const folder = await environment.chooseFolder();
      if (folder !== null) environment.workspace.set(folder);
      return ok({ folder: environment.workspace.get() });
    },
    listCases: () =>
      store(async (caseStore) => {
        const every = await caseStore.openAll();
        if (!every.ok) return every;
        const names = every.value.filter(({ fileName }) => insideFolder(caseStore.folder, fileName).ok);
        // Archived cases follow, marked archived (the Cases screen keeps them apart); their caseId is the name inside archive/.
        const archived = await caseStore.openArchived();
        if (!archived.ok) return archived;
        return ok([
          ...names.map(({ fileName, opened }) => summaryOf(fileName, opened)),
          ...archived.value.filter(({ fileName }) => insideFolder(join(caseStore.folder, 'archive'), fileName).ok).map(({ fileName, opened }) => ({ ...summaryOf(fileName, opened), archived: true })),
        ]);
      }),
    openCase: ({ caseId }) =>
      store(async (caseStore) => {
        const opened = await caseStore.open(caseId);
        if (!opened.ok) return opened;
        return ok({ caseId, document: opened.value.caseFile as unknown as Record<string, unknown>, revision: revisionToken(opened.value.revision), warnings: [...opened.value.warnings] });
      }),
    createCase: ({ caseId, document }) =>
      store(async (caseStore) => {
        const created = await caseStore.create(caseId, document, 'case created');
        return created.ok ? savedValue(created.value) : created;
      }),
    saveCase: ({ caseId, document, baseRevision }) =>
      store(async (caseStore) => {
        const expected = revisionFromToken(baseRevision);
        if (!expected.ok) return expected;
        const saved = await caseStore.save(caseId, document, { expected: expected.value, change: 'edited in the workspace' });
        return saved.ok ? savedValue(saved.value) : saved;
      }),
    saveCaseAs: ({ newCaseId, document }) =>
      store(async (caseStore) => {
        const saved = await caseStore.saveAs(newCaseId, document, 'saved under a new name');
        return saved.ok ? savedValue(saved.value) : saved;
      }),
    renameCase: ({ caseId, newCaseId }) =>
      store(async (caseStore) => {
        const renamed = await caseStore.rename(caseId, newCaseId);
        if (!renamed.ok) return renamed;
        return ok(summaryOf(renamed.value.fileName, renamed));
      }),
    archiveCase: ({ caseId }) =>
      store(async (caseStore) => {
        const summary = await summaryFromStore(caseStore, caseId);
        const archived = await caseStore.archive(caseId);
        if (!archived.ok) return archived;
        return ok({ ...summary, archived: true });
      }),
    recoverCase: ({ caseId }) =>
      store(async (caseStore) => {
        const recovered = await caseStore.recover(caseId);
        if (!recovered.ok) return recovered;
        const history = await caseStore.history(caseId);
        if (!history.ok) return history;
        return ok({
          caseId,
          document: recovered.value.caseFile as unknown as Record<string, unknown>,
          revision: revisionToken(recovered.value.revision),
          history: history.value.entries.map((entry) => ({ at: entry.at, description: entry.change })),
        });
      }),
    importDryRun: (request) => store((caseStore) => work.run(request.workId, (ticket) => importDryRun(caseStore, request, ticket))),
    importCommit: (request) => store((caseStore) => work.run(request.workId, (ticket) => importCommit(caseStore, request, ticket))),
    workProgress: ({ workId }) => ok(work.progress(workId)),
    cancelWork: ({ workId }) => ok(work.cancel(workId)),
    exportSheetPdf: (request) => store((caseStore) => work.run(request.workId, (ticket) => exportSheetPdf(caseStore, request, ticket, toolVersion))),
    exportCalendar: (request) => store((caseStore) => work.run(request.workId, (ticket) => exportCalendar(caseStore, request, ticket, environment.now()))),
    readSettings: () => environment.settings.read(),
    writeSettings: (settings) => environment.settings.write(settings),
    takeOpenRequest: () => {
      const request = environment.openRequests?.take() ?? null;
      if (request === null) return ok(null);
      // The file's folder becomes the workspace, so every later call (save, export) names the case inside it.
      environment.workspace.set(request.folder);
      return ok({ caseId: request.caseId, workspaceFolder: request.folder });
    },
  };
}
