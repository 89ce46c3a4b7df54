import type { HostApi, HostRequest, HostValue } from '../core/contract';
import { caseIdSchema } from '../core/contract';
import { fail, issue, ok, type Result } from '../core/result';

/**
 * What the workspace store asks of its host, built on the host contract
 * (core/contract's HostApi, which renderer/host's client and the in-page
 * host both implement): cases with their documents, saves that carry the
 * revision they started from, exports, and the unit-system setting.
 */
export interface StoredCase {
  /** The case's file name in the workspace ('th-0417.json'). */
  readonly id: string;
  /** The case file as stored (the renderer parses it with core/model). */
  readonly json: unknown;
}

/** How a long piece of work reports itself and learns that the user cancelled it. */
export interface Progress {
  readonly report: (done: number, total: number) => void;
  readonly cancelled: () => boolean;
}

/** Cases the page asks the host for at once while reading a workspace (a modelling choice of ours: enough to keep both sides busy). */
const casesAskedAtOnce = 4;

/** How far a piece of the host's work got (workProgress): the step under way in words, steps done of those foreseen. */
export type WorkProgress = NonNullable<HostValue<'workProgress'>>;

/** A call followed while it runs: the work id it carries, and who is told how far the host got. */
export interface FollowedWork {
  readonly workId: string;
  readonly onProgress: (progress: WorkProgress) => void;
}

/**
 * How often the page asks the host how far a followed call got, in milliseconds: a modelling
 * choice of ours (four times a second reads as live on screen and costs the host a few tiny calls).
 */
export const progressPollMs = 250;

/**
 * A new work id: 24 hex digits (96 bits) from crypto.getRandomValues, so that two pieces of
 * work, even from two windows, do not share an id by chance (the contract takes 8–64 characters).
 *
 * @returns e.g. '3f9a0c1d2e4b5a6978c0d1e2'
 */
export function newWorkId(): string {
  const bytes = globalThis.crypto.getRandomValues(new Uint8Array(12));
  return Array.from(bytes, (byte) => byte.toString(16).padStart(2, '0')).join('');
}

/**
 * Run a host call that carries `followed.workId`, asking the host how far that work got every
 * `progressPollMs` while the call runs and telling `followed.onProgress` (a poll the host cannot
 * answer is skipped: the screen keeps the step it showed). Polling stops when the call answers.
 *
 * @param api - the host's workProgress call
 * @param followed - the work id and who is told
 * @param call - the call itself (it must send the same work id)
 * @returns the call's answer
 */
export async function followWork<T>(api: Pick<HostApi, 'workProgress'>, followed: FollowedWork, call: () => Promise<T>): Promise<T> {
  let running = true;
  let timer: ReturnType<typeof setTimeout> | undefined;
  const poll = async () => {
    if (!running) return;
    const answer = await api.workProgress({ workId: followed.workId });
    if (running && answer.ok && answer.value !== null) followed.onProgress(answer.value);
    if (running) timer = setTimeout(() => void poll(), progressPollMs);
  };
  timer = setTimeout(() => void poll(), progressPollMs);
  try {
    return await call();
  } finally {
    running = false;
    clearTimeout(timer);
  }
}

/** An import of records from a file into one case, as the contract's importDryRun takes it (the file's text read in the page). */
export type RecordImportRequest = HostRequest<'importDryRun'>;
/** What an import would add: counts, first rows, every rejected row, the column mapping of a CSV. */
export type RecordImportPreview = HostValue<'importDryRun'>;

export interface WorkspaceHost {
  /** Every case with its document; stops early (returning what it has read) when `progress` says cancelled. */
  listCases(progress?: Progress): Promise<Result<readonly StoredCase[]>>;
  saveCase(id: string, json: unknown): Promise<Result<{ readonly id: string }>>;
  createCase(json: unknown): Promise<Result<{ readonly id: string }>>;
  /** A whole case file, as text, added to the workspace under a name from its label. */
  importCase(text: string): Promise<Result<{ readonly id: string }>>;
  /** What an import would add to a case; nothing is written. With `followed`, the host's steps are reported while it reads. */
  previewRecordImport(request: RecordImportRequest, followed?: FollowedWork): Promise<Result<RecordImportPreview>>;
  /** Add an import to a case as it was last opened or saved here; refused when the file changed on disk since, or when cancelled before the host saved. */
  commitRecordImport(request: RecordImportRequest, followed?: FollowedWork): Promise<Result<{ readonly counts: Readonly<Record<string, number>> }>>;
  /** Ask the host to stop the followed work of that id at its next step; false when it will not (finished, or a save under way, or no answer). */
  cancelWork(workId: string): Promise<{ readonly stopping: boolean }>;
  /** Write the review sheet of the saved case; with `followed`, the host's steps are reported and it can be cancelled before the file is written. */
  exportSheet(id: string, asOf: string, followed?: FollowedWork): Promise<Result<{ readonly location: string }>>;
  /** Write the monitoring calendar of the saved case; `followed` as for exportSheet. */
  exportCalendar(id: string, asOf: string, followed?: FollowedWork): Promise<Result<{ readonly location: string }>>;
  readUnitSystem(): Promise<'si' | 'conventional'>;
  writeUnitSystem(system: 'si' | 'conventional'): Promise<void>;
  appVersion(): Promise<string>;
  /** The folder the host reads the cases from, or null (none chosen, or cases kept in the page). */
  workspaceFolder(): Promise<string | null>;
  /** The case file the operating system asked the app to open, taken from the host (its folder is now the workspace), or null. */
  takeOpenRequest(): Promise<Result<{ readonly id: string; readonly folder: string } | null>>;
}

/** A case file name from a label: 'TH-0417' → 'th-0417.json', then 'th-0417 (2).json' when taken. */
export function caseIdFor(label: unknown, taken: ReadonlySet<string>): string {
  const base = (typeof label === 'string' ? label : '').trim().toLowerCase().replace(/[^a-z0-9._-]+/g, '-').replace(/^[^a-z0-9]+/, '').slice(0, 100) || 'case';
  let id = `${base}.json`;
  for (let count = 2; taken.has(id) || !caseIdSchema.safeParse(id).success; count += 1) id = `${base} (${count}).json`;
  return id;
}

const labelOf = (json: unknown) => (json as { patient?: { label?: unknown } } | null)?.patient?.label;

/** The workspace's view of a host that speaks the contract. */
export function workspaceHostOver(api: HostApi): WorkspaceHost {
  /** A host call that takes a work id: followed (the id sent, its progress polled) when the caller follows it, else plain. */
  const maybeFollowed = <R extends object, T>(followed: FollowedWork | undefined, request: R, call: (request: R & { workId?: string }) => Promise<T>): Promise<T> =>
    followed ? followWork(api, followed, () => call({ ...request, workId: followed.workId })) : call(request);
  const revisions = new Map<string, string>();
  const create = async (json: unknown): Promise<Result<{ readonly id: string }>> => {
    if (typeof json !== 'object' || json === null || Array.isArray(json)) return fail(issue('invalid_file', ['file'], 'A case file is a JSON object; this one is not.'));
    const listed = await api.listCases({});
    const taken = new Set(listed.ok ? listed.value.map((it) => it.caseId) : []);
    const caseId = caseIdFor(labelOf(json), taken);
    const created = await api.createCase({ caseId, document: json as Record<string, unknown> });
    if (!created.ok) return created;
    revisions.set(caseId, created.value.revision);
    return ok({ id: caseId });
  };
  return {
    async listCases(progress) {
      const listed = await api.listCases({});
      if (!listed.ok) return listed;
      const active = listed.value.filter((it) => !it.archived);
      // A few cases asked for at once, so the host reads one while the page takes in another;
      // kept in the listing's order. A cancel starts no new one; those under way are kept.
      const read = new Array<StoredCase | undefined>(active.length);
      let started = 0;
      let done = 0;
      progress?.report(0, active.length);
      const lane = async () => {
        while (started < active.length && !progress?.cancelled()) {
          const { caseId } = active[started]!;
          const index = started++;
          const opened = await api.openCase({ caseId });
          if (opened.ok) revisions.set(caseId, opened.value.revision);
          read[index] = { id: caseId, json: opened.ok ? opened.value.document : null };
          done += 1;
          progress?.report(done, active.length);
        }
      };
      await Promise.all(Array.from({ length: Math.min(casesAskedAtOnce, active.length) }, lane));
      return ok(read.filter((entry): entry is StoredCase => entry !== undefined));
    },
    async saveCase(id, json) {
      const baseRevision = revisions.get(id);
      if (baseRevision === undefined) return fail(issue('host_failed', ['caseId'], `"${id}" was not opened from this workspace; reopen it.`));
      const saved = await api.saveCase({ caseId: id, document: json as Record<string, unknown>, baseRevision });
      if (!saved.ok) return saved;
      revisions.set(id, saved.value.revision);
      return ok({ id });
    },
    createCase: create,
    async importCase(text) {
      let json: unknown;
      try {
        json = JSON.parse(text);
      } catch {
        return fail(issue('invalid_file', ['file'], 'The file is not JSON: a case file is the JSON this program saves.'));
      }
      return create(json);
    },
    previewRecordImport: (request, followed) => maybeFollowed(followed, request, (sent) => api.importDryRun(sent)),
    async commitRecordImport(request, followed) {
      const baseRevision = revisions.get(request.caseId);
      if (baseRevision === undefined) return fail(issue('host_failed', ['caseId'], `"${request.caseId}" was not opened from this workspace; reopen it.`));
      const committed = await maybeFollowed(followed, { ...request, baseRevision }, (sent) => api.importCommit(sent));
      if (!committed.ok) return committed;
      revisions.set(request.caseId, committed.value.revision);
      return ok({ counts: committed.value.counts });
    },
    async cancelWork(workId) {
      const answer = await api.cancelWork({ workId });
      return { stopping: answer.ok && answer.value.stopping };
    },
    async exportSheet(id, asOf, followed) {
      const listedSettings = await api.readSettings({});
      const request = { caseId: id, asOfDate: asOf, paper: listedSettings.ok ? listedSettings.value.paper : ('a4' as const) };
      const written = await maybeFollowed(followed, request, (sent) => api.exportSheetPdf(sent));
      return written.ok ? ok({ location: written.value.path }) : written;
    },
    async exportCalendar(id, asOf, followed) {
      const written = await maybeFollowed(followed, { caseId: id, asOfDate: asOf }, (sent) => api.exportCalendar(sent));
      return written.ok ? ok({ location: written.value.path }) : written;
    },
    async readUnitSystem() {
      const settings = await api.readSettings({});
      return settings.ok ? settings.value.units : 'si';
    },
    async writeUnitSystem(units) {
      const settings = await api.readSettings({});
      if (settings.ok) await api.writeSettings({ ...settings.value, units });
    },
    async appVersion() {
      const info = await api.appInfo({});
      return info.ok ? info.value.version : 'unknown';
    },
    async workspaceFolder() {
      const current = await api.currentWorkspace({});
      return current.ok ? current.value.folder : null;
    },
    async takeOpenRequest() {
      const taken = await api.takeOpenRequest({});
      if (!taken.ok) return taken;
      return ok(taken.value === null ? null : { id: taken.value.caseId, folder: taken.value.workspaceFolder });
    },
  };
}
