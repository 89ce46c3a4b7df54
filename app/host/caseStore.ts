import { promises as nodeFs } from 'node:fs';
import { join } from 'node:path';
import { caseFileFormat, currentCaseFileVersion, type Case } from '../../core/model/caseFile';
import { parseCase } from '../../core/model/parseCase';
import { fail, issue, ok, type Issue, type Result } from '../../core/result';
import { describeFsError, isTemporaryFileName, nodeAtomicWriteFs, sweepTemporaryFiles, syncFolder, writeFileAtomic, type AtomicWriteFs } from './atomicWrite';
import { boundedMap } from './boundedMap';
import { caseJsonFromText } from './caseFiles';
import { decodeTextBytes } from './textFiles';
import { appendJournal, contentHash, journalEntries, journalNameFor, readJournal, type JournalEntry, type JournalLine } from './caseJournal';
import { exportsFolderName } from './workspaceFiles';

/**
 * What a case file looked like on disk when it was read or written: the
 * change-on-disk check before a save compares it with the file as it is now.
 * `sha256` is '' for a file that did not exist (a recovery of a lost file).
 */
export interface DiskRevision {
  readonly mtimeMs: number;
  readonly size: number;
  readonly sha256: string;
}

/** A case as opened: validated, migrated in memory, with what is needed to save it safely. */
export interface OpenedCase {
  /** The file name inside the workspace folder, e.g. 'th-0417.json'. */
  readonly fileName: string;
  readonly caseFile: Case;
  /** Range and consistency warnings from the case model (the same as `check`). */
  readonly warnings: readonly Issue[];
  /** The version on disk when older than the current one: migrated in memory, written in the current version only by a save. */
  readonly migratedFromVersion: number | null;
  /** The file as read or written; pass it to save(). */
  readonly revision: DiskRevision;
  /**
   * The journal holds a state the file does not: 'interrupted-save' when a
   * save was cut off between the journal and the file; 'changed-outside' when
   * the file was changed by another program after the journal's last line.
   * recover() returns the journal's state; the file is kept as it is until a save.
   */
  readonly recoverable: { readonly reason: 'interrupted-save' | 'changed-outside'; readonly at: string; readonly change: string } | null;
}

/** One line of the workspace listing. A file that cannot be opened is listed with why, never skipped. */
export type CaseSummary =
  | {
      readonly fileName: string;
      readonly status: 'ok';
      readonly label: string;
      readonly diagnosisGroup: string;
      readonly version: number;
      readonly migratedFromVersion: number | null;
      readonly transfusionCount: number;
      readonly resultCount: number;
      readonly chelationPeriodCount: number;
      /** The latest date of any dated entry, or null. */
      readonly latestEntryDate: string | null;
      readonly recoverable: OpenedCase['recoverable'];
      readonly modifiedAtMs: number;
    }
  | { readonly fileName: string; readonly status: 'unreadable'; readonly issues: readonly Issue[] };

export interface CaseHistory {
  readonly entries: readonly JournalEntry[];
  /** Journal lines that could not be read (1-based), e.g. a line torn by a crash. */
  readonly unreadableLines: readonly number[];
}

/**
 * The case store: one workspace folder of case files, chosen by the user
 * (local disk or a network share). The CLI, the preview server and the
 * desktop host call this interface; every method returns a Result and never
 * throws for an expected failure. Messages name the file and the cause (disk
 * full, read-only folder, locked file, not JSON, changed on disk) and never
 * contain patient data beyond the file name; nothing is logged.
 *
 * File names are plain names inside the folder ending in `.json`
 * ('th-0417.json'); a name with a folder part is refused.
 *
 * Guarantees:
 * - every write is atomic (atomicWrite.ts): after a crash the file is the old
 *   state or the new one, and a failed write leaves the old file untouched;
 * - every change appends a journal line (caseJournal.ts) before the file is
 *   replaced, so the latest state survives a crash between the two (recover);
 * - save() refuses when the file changed on disk since `expected` (another
 *   window or machine): 'changed_on_disk', nothing written; saveAs() to a new
 *   name keeps the work;
 * - a file of a newer version than this tool knows is refused on open and is
 *   never overwritten; an older one is migrated in memory and written in the
 *   current version only when saved;
 * - nothing is ever deleted: archive() moves a case and its journal to
 *   `archive/`; create(), saveAs() and rename() never replace an existing file.
 *
 * The caller keeps its in-memory case on every failure: the store never
 * changes what it is handed.
 */
export interface CaseStore {
  /** The workspace folder. */
  readonly folder: string;
  /**
   * One summary per `.json` file in the folder (not `archive/`), sorted by file
   * name. Listing (like openAll) first sweeps the store's own temporary files
   * older than ten minutes, left by a save that was cut off (atomicWrite.ts).
   */
  list(): Promise<Result<readonly CaseSummary[]>>;
  /** The cases moved to `archive/`, opened as openAll opens them (file names are those inside `archive/`); none when there is no archive. */
  openArchived(): Promise<Result<readonly { readonly fileName: string; readonly opened: Result<OpenedCase> }[]>>;
  /** Read, migrate in memory and validate one case. */
  open(fileName: string): Promise<Result<OpenedCase>>;
  /** Every case of the folder opened once (the files list() summarises, in the same order), for a review of the whole workspace. */
  openAll(): Promise<Result<readonly { readonly fileName: string; readonly opened: Result<OpenedCase> }[]>>;
  /** The names of the case files openAll opens, sorted (after the same sweep of old temporary files); nothing is opened. */
  caseFileNames(): Promise<Result<readonly string[]>>;
  /** Write a new case file; refused with 'already_exists' if the name is taken. */
  create(fileName: string, caseFile: unknown, change: string): Promise<Result<OpenedCase>>;
  /** Replace a case with a new state; refused if the file changed since `expected`, or if the state has errors. */
  save(fileName: string, caseFile: unknown, options: { readonly expected: DiskRevision; readonly change: string }): Promise<Result<OpenedCase>>;
  /** Write the state under a new name (never replacing a file); its journal starts with this change. */
  saveAs(newFileName: string, caseFile: unknown, change: string): Promise<Result<OpenedCase>>;
  /** Rename a case and its journal; refused if the new name is taken or the file changed since `expected`. */
  rename(fileName: string, newFileName: string, options?: { readonly expected?: DiskRevision }): Promise<Result<OpenedCase>>;
  /** Move a case and its journal to `archive/` (a numbered name if one is there already). Never deletes. */
  archive(fileName: string): Promise<Result<{ readonly archivedAs: string }>>;
  /** The change history from the journal, oldest first. */
  history(fileName: string): Promise<Result<CaseHistory>>;
  /**
   * The journal's latest state as an opened case, with the revision of the file
   * as it is now (or an absent one), so that a save() writes it back. Nothing is
   * written by recover itself.
   */
  recover(fileName: string): Promise<Result<OpenedCase>>;
}

export interface CaseStoreOptions {
  /** The host's clock for journal times (core never reads a clock). */
  readonly now?: () => Date;
  /** File-system writes; tests inject a full disk or a read-only folder. */
  readonly fs?: AtomicWriteFs;
}

/** How many case files are read at once when the whole folder is opened (a modelling choice of ours: enough to keep a disk or a share busy, few enough for any file-handle limit). */
export const openAheadFiles = 8;

const absentRevision: DiskRevision = { mtimeMs: 0, size: 0, sha256: '' };

/** The bytes a case is saved as: two-space JSON in the schema's key order, with a final newline. */
export function serializeCase(caseFile: Case): string {
  return `${JSON.stringify(caseFile, null, 2)}\n`;
}

function checkFileName(fileName: string): Result<string> {
  if (!/^[^/\\\0]+\.json$/i.test(fileName) || fileName.startsWith('.') || fileName.length > 200) {
    return fail(
      issue('invalid_file', [], `"${fileName.slice(0, 80)}" is not a case file name here: expected a plain name ending in .json (no folder part, not starting with a dot).`),
    );
  }
  return ok(fileName);
}

function rawVersion(json: unknown): number | null {
  if (typeof json !== 'object' || json === null) return null;
  const version = (json as Record<string, unknown>)['version'];
  return typeof version === 'number' ? version : null;
}

interface DiskFile {
  readonly text: string;
  readonly revision: DiskRevision;
}

/** Latest dated entry of a case, for the listing. */
function latestEntryDate(caseFile: Case): string | null {
  const dates = [
    ...caseFile.transfusions.map((it) => it.date),
    ...caseFile.results.map((it) => it.date),
    ...caseFile.chelationPeriods.map((it) => it.endDate ?? it.startDate),
  ].sort();
  return dates.at(-1) ?? null;
}

/** An opened case from the JSON read and its parse: the version it was migrated from, the revision and what recover could bring back. */
function openedFrom(
  fileName: string,
  json: unknown,
  parsed: Result<Case> & { readonly ok: true },
  revision: DiskRevision,
  recoverable: OpenedCase['recoverable'],
): Result<OpenedCase> {
  const version = rawVersion(json);
  return ok(
    {
      fileName,
      caseFile: parsed.value,
      warnings: parsed.warnings ?? [],
      migratedFromVersion: version !== null && version < currentCaseFileVersion ? version : null,
      revision,
      recoverable,
    },
    parsed.warnings,
  );
}

/**
 * Open a workspace folder as a case store. The folder must exist; nothing is
 * written until a method that writes is called.
 *
 * @param folder - absolute or relative path of the workspace
 * @param options - the clock for journal times, and the file system for writes
 */
export function openCaseStore(folder: string, options: CaseStoreOptions = {}): CaseStore {
  const now = options.now ?? (() => new Date());
  const fs = options.fs ?? nodeAtomicWriteFs;
  const pathOf = (fileName: string) => join(folder, fileName);
  const journalOf = (fileName: string) => join(folder, journalNameFor(fileName));

  async function readDisk(fileName: string): Promise<Result<DiskFile | null>> {
    const path = pathOf(fileName);
    try {
      const bytes = await nodeFs.readFile(path);
      const stat = await nodeFs.stat(path);
      const text = decodeTextBytes(bytes, path, 'case file');
      if (!text.ok) return text;
      return ok({ text: text.value, revision: { mtimeMs: stat.mtimeMs, size: stat.size, sha256: contentHash(bytes) } });
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code === 'ENOENT') return ok(null);
      return fail(issue('invalid_file', [], `Cannot read case file ${path}: ${describeFsError(error)}.`));
    }
  }

  async function exists(path: string): Promise<boolean> {
    try {
      await nodeFs.lstat(path);
      return true;
    } catch {
      return false;
    }
  }

  function recoverableFrom(lines: readonly JournalLine[], sha256: string): OpenedCase['recoverable'] {
    const last = lines.at(-1);
    if (!last || last.sha256 === sha256) return null;
    const earlier = lines.some((line) => line.sha256 === sha256);
    return { reason: earlier ? 'interrupted-save' : 'changed-outside', at: last.at, change: last.change };
  }

  function validate(fileName: string, caseFile: unknown): Result<{ readonly caseFile: Case; readonly text: string; readonly warnings: readonly Issue[] }> {
    const parsed = parseCase(caseFile);
    if (!parsed.ok) {
      return fail(issue('invalid_file', [], `The case for ${fileName} has errors; nothing was written.`), ...parsed.issues);
    }
    return ok({ caseFile: parsed.value, text: serializeCase(parsed.value), warnings: parsed.warnings ?? [] });
  }

  /** Journal first, then the file: the order that makes a crash between them recoverable. */
  async function writeCase(
    fileName: string,
    prepared: { readonly caseFile: Case; readonly text: string; readonly warnings: readonly Issue[] },
    change: string,
    overwrite: boolean,
  ): Promise<Result<OpenedCase>> {
    const line: JournalLine = {
      at: now().toISOString(),
      change: change.slice(0, 200) || 'saved',
      sha256: contentHash(prepared.text),
      version: prepared.caseFile.version,
      content: prepared.text,
    };
    const journaled = await appendJournal(journalOf(fileName), line, fs);
    if (!journaled.ok) return journaled;
    const written = await writeFileAtomic(pathOf(fileName), prepared.text, { overwrite, fs });
    if (!written.ok) return written;
    const stat = await nodeFs.stat(pathOf(fileName));
    return ok(
      {
        fileName,
        caseFile: prepared.caseFile,
        warnings: prepared.warnings,
        migratedFromVersion: null,
        revision: { mtimeMs: stat.mtimeMs, size: stat.size, sha256: line.sha256 },
        recoverable: null,
      },
      written.warnings,
    );
  }

  async function open(fileName: string): Promise<Result<OpenedCase>> {
    const name = checkFileName(fileName);
    if (!name.ok) return name;
    const disk = await readDisk(fileName);
    if (!disk.ok) return disk;
    const journal = await readJournal(journalOf(fileName));
    const lines = journal.ok ? journal.value.lines : [];
    const hint =
      lines.length > 0
        ? [issue('invalid_file', [], `The journal ${journalNameFor(fileName)} holds the state saved at ${lines.at(-1)!.at} ("${lines.at(-1)!.change}"); recover brings it back.`, 'warning')]
        : [];
    if (disk.value === null) return fail(issue('invalid_file', [], `Cannot read case file ${pathOf(fileName)}: no such file.`), ...hint);
    const json = caseJsonFromText(pathOf(fileName), disk.value.text);
    if (!json.ok) return fail(...json.issues, ...hint);
    const parsed = parseCase(json.value);
    if (!parsed.ok) return fail(...parsed.issues, ...hint);
    return openedFrom(fileName, json.value, parsed, disk.value.revision, recoverableFrom(lines, disk.value.revision.sha256));
  }

  /** The file as it is now must be what the caller opened, and must not be of a newer version. */
  async function checkUnchanged(fileName: string, expected: DiskRevision): Promise<Result<void>> {
    const disk = await readDisk(fileName);
    if (!disk.ok) return disk;
    const path = pathOf(fileName);
    if (disk.value === null) {
      if (expected.sha256 === '') return ok(undefined);
      return fail(issue('changed_on_disk', [], `${path} was moved or deleted since it was opened; nothing was written. Save as a new file to keep your changes.`));
    }
    const json = caseJsonFromText(path, disk.value.text);
    const version = json.ok ? rawVersion(json.value) : null;
    if (version !== null && version > currentCaseFileVersion) {
      return fail(issue('unsupported_version', ['version'], `${path} is now a version ${version} case file, newer than this tool writes (${currentCaseFileVersion}); it is not overwritten. Save as a new file to keep your changes.`));
    }
    if (disk.value.revision.sha256 !== expected.sha256) {
      const when = new Date(disk.value.revision.mtimeMs).toISOString();
      return fail(
        issue('changed_on_disk', [], `${path} changed on disk since it was opened (modified ${when}, by another window, program or machine); nothing was written over it. Save as a new file to keep your changes, then compare the two.`),
      );
    }
    return ok(undefined);
  }

  async function moveWithJournal(fromName: string, toFolder: string, toName: string): Promise<Result<void>> {
    try {
      await fs.rename(pathOf(fromName), join(toFolder, toName));
    } catch (error) {
      return fail(issue('write_failed', [], `Could not move ${pathOf(fromName)} to ${join(toFolder, toName)}: ${describeFsError(error)}. The file is where it was.`));
    }
    if (await exists(journalOf(fromName))) {
      try {
        await fs.rename(journalOf(fromName), join(toFolder, journalNameFor(toName)));
      } catch (error) {
        return fail(issue('write_failed', [], `${toName} was moved, but its journal ${journalNameFor(fromName)} could not follow: ${describeFsError(error)}. Move it by hand beside the case.`));
      }
    }
    await syncFolder(folder, fs).catch(() => undefined);
    if (toFolder !== folder) await syncFolder(toFolder, fs).catch(() => undefined);
    return ok(undefined);
  }

  async function create(fileName: string, caseFile: unknown, change: string): Promise<Result<OpenedCase>> {
    const name = checkFileName(fileName);
    if (!name.ok) return name;
    // A journal without its file (a first save that failed) is kept and continued, never replaced.
    if (await exists(pathOf(fileName))) {
      return fail(issue('already_exists', [], `${pathOf(fileName)} exists already; it was not replaced. Choose another name.`));
    }
    const prepared = validate(fileName, caseFile);
    if (!prepared.ok) return prepared;
    return writeCase(fileName, prepared.value, change, false);
  }


  async function caseFileNames(): Promise<Result<readonly string[]>> {
    let names: string[];
    try {
      await sweepTemporaryFiles(folder, now().getTime(), fs);
      // An export cut off as it was written leaves its temporary file in the exports folder (exportCalls.ts).
      await sweepTemporaryFiles(join(folder, exportsFolderName), now().getTime(), fs);
      names = await nodeFs.readdir(folder);
    } catch (error) {
      return fail(issue('invalid_file', [], `Cannot list the workspace folder ${folder}: ${describeFsError(error)}.`));
    }
    return ok(names.filter((name) => /\.json$/i.test(name) && !name.startsWith('.') && !isTemporaryFileName(name)).sort());
  }

  async function openAll(): Promise<Result<readonly { readonly fileName: string; readonly opened: Result<OpenedCase> }[]>> {
    const names = await caseFileNames();
    if (!names.ok) return names;
    // A few files read at once, so the disk (or the network share) works while the files already read are validated.
    return ok(await boundedMap(names.value, openAheadFiles, async (fileName) => ({ fileName, opened: await open(fileName) })));
  }

  return {
    folder,

    async list() {
      const every = await openAll();
      if (!every.ok) return every;
      return ok(
        every.value.map(({ fileName, opened }): CaseSummary => {
          if (!opened.ok) return { fileName, status: 'unreadable', issues: opened.issues.filter((it) => it.severity === 'error') };
          const { caseFile } = opened.value;
          return {
            fileName,
            status: 'ok',
            label: caseFile.patient.label,
            diagnosisGroup: caseFile.patient.diagnosisGroup,
            version: caseFile.version,
            migratedFromVersion: opened.value.migratedFromVersion,
            transfusionCount: caseFile.transfusions.length,
            resultCount: caseFile.results.length,
            chelationPeriodCount: caseFile.chelationPeriods.length,
            latestEntryDate: latestEntryDate(caseFile),
            recoverable: opened.value.recoverable,
            modifiedAtMs: opened.value.revision.mtimeMs,
          };
        }),
      );
    },

    openAll,

    caseFileNames,

    async openArchived() {
      const archiveFolder = join(folder, 'archive');
      if (!(await exists(archiveFolder))) return ok([]);
      return openCaseStore(archiveFolder, options).openAll();
    },

    open,

    create,

    async save(fileName, caseFile, { expected, change }) {
      const name = checkFileName(fileName);
      if (!name.ok) return name;
      const prepared = validate(fileName, caseFile);
      if (!prepared.ok) return prepared;
      const unchanged = await checkUnchanged(fileName, expected);
      if (!unchanged.ok) return unchanged;
      return writeCase(fileName, prepared.value, change, true);
    },

    saveAs: create,

    async rename(fileName, newFileName, renameOptions = {}) {
      for (const name of [fileName, newFileName]) {
        const checked = checkFileName(name);
        if (!checked.ok) return checked;
      }
      const opened = await open(fileName);
      if (!opened.ok) return opened;
      if (renameOptions.expected && renameOptions.expected.sha256 !== opened.value.revision.sha256) {
        return fail(issue('changed_on_disk', [], `${pathOf(fileName)} changed on disk since it was opened; it was not renamed.`));
      }
      if ((await exists(pathOf(newFileName))) || (await exists(journalOf(newFileName)))) {
        return fail(issue('already_exists', [], `${pathOf(newFileName)} (or its journal) exists already; ${fileName} was not renamed.`));
      }
      const moved = await moveWithJournal(fileName, folder, newFileName);
      if (!moved.ok) return moved;
      const renamed = await open(newFileName);
      if (!renamed.ok) return renamed;
      // The history records the rename; the file itself is unchanged, so its hash stays the journal's last.
      const disk = await readDisk(newFileName);
      if (disk.ok && disk.value) {
        await appendJournal(
          journalOf(newFileName),
          {
            at: now().toISOString(),
            change: `renamed from ${fileName}`.slice(0, 200),
            sha256: disk.value.revision.sha256,
            version: renamed.value.caseFile.version,
            content: disk.value.text,
          },
          fs,
        );
      }
      return renamed;
    },

    async archive(fileName) {
      const name = checkFileName(fileName);
      if (!name.ok) return name;
      if (!(await exists(pathOf(fileName)))) return fail(issue('invalid_file', [], `Cannot archive ${pathOf(fileName)}: no such file.`));
      const archiveFolder = join(folder, 'archive');
      try {
        await nodeFs.mkdir(archiveFolder, { recursive: true });
      } catch (error) {
        return fail(issue('write_failed', [], `Could not make the archive folder ${archiveFolder}: ${describeFsError(error)}. ${fileName} is where it was.`));
      }
      const stem = fileName.replace(/\.json$/i, '');
      let archivedAs = fileName;
      for (let n = 2; (await exists(join(archiveFolder, archivedAs))) || (await exists(join(archiveFolder, journalNameFor(archivedAs)))); n += 1) {
        archivedAs = `${stem}-${n}.json`;
      }
      const moved = await moveWithJournal(fileName, archiveFolder, archivedAs);
      if (!moved.ok) return moved;
      return ok({ archivedAs: join('archive', archivedAs) });
    },

    async history(fileName) {
      const name = checkFileName(fileName);
      if (!name.ok) return name;
      const journal = await readJournal(journalOf(fileName));
      if (!journal.ok) return journal;
      return ok({ entries: journalEntries(journal.value), unreadableLines: journal.value.unreadableLines });
    },

    async recover(fileName) {
      const name = checkFileName(fileName);
      if (!name.ok) return name;
      const journal = await readJournal(journalOf(fileName));
      if (!journal.ok) return journal;
      const last = journal.value.lines.at(-1);
      if (!last) return fail(issue('invalid_file', [], `${journalNameFor(fileName)} holds no readable change; there is nothing to recover for ${fileName}.`));
      const json = caseJsonFromText(journalNameFor(fileName), last.content);
      if (!json.ok) return json;
      const parsed = parseCase(json.value);
      if (!parsed.ok) return fail(issue('invalid_file', [], `The journal's latest state of ${fileName} (${last.at}) has errors.`), ...parsed.issues);
      const disk = await readDisk(fileName);
      const revision = disk.ok && disk.value ? disk.value.revision : absentRevision;
      return openedFrom(fileName, json.value, parsed, revision, null);
    },
  };
}

/** The `format` a case store writes, re-exported for hosts that build new cases. */
export { caseFileFormat };
