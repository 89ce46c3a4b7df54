import { randomBytes } from 'node:crypto';
import { promises as nodeFs } from 'node:fs';
import { basename, dirname, join } from 'node:path';
import { fail, issue, ok, type Result } from '../../core/result';

/**
 * Atomic file writes: a reader (or a crash) sees the old file or the new one,
 * never a part of either.
 *
 * The steps, in order:
 * 1. write the bytes to a temporary file in the same folder (a rename is only
 *    atomic within one file system), named `.<name>.<random>.tmp` so folder
 *    listings skip it;
 * 2. fsync the temporary file (its bytes reach the disk before its name does);
 * 3. rename it over the target (POSIX rename replaces atomically; on Windows
 *    Node's rename uses MoveFileEx with replace-existing);
 * 4. fsync the folder, so the rename itself survives a power cut. Windows and
 *    some network file systems cannot open or fsync a folder; there the step is
 *    skipped (NTFS journals the rename itself).
 * On any failure the temporary file is removed and the target is untouched.
 *
 * Written by hand rather than with write-file-atomic 8.0.0: that package
 * flushes the temporary file and renames it but never flushes the folder, and
 * it declares Node ≥ 22.22 while this project runs on Node 20.
 *
 * Failures are values whose message names the file and the cause in plain
 * words (disk full, read-only, locked); never a stack trace, never the content.
 */

/** The few file operations the write needs; tests pass a faulty one to simulate a full disk or a read-only folder. */
export interface AtomicWriteFs {
  readonly open: (path: string, flags: string, mode?: number) => Promise<WritableHandle>;
  readonly rename: (from: string, to: string) => Promise<void>;
  readonly unlink: (path: string) => Promise<void>;
  readonly stat: (path: string) => Promise<{ readonly mtimeMs: number; readonly size: number }>;
}

export interface WritableHandle {
  readonly writeFile: (data: string | Uint8Array) => Promise<void>;
  readonly sync: () => Promise<void>;
  readonly close: () => Promise<void>;
}

/** Node's own file system. */
export const nodeAtomicWriteFs: AtomicWriteFs = {
  open: (path, flags, mode) => nodeFs.open(path, flags, mode),
  rename: (from, to) => nodeFs.rename(from, to),
  unlink: (path) => nodeFs.unlink(path),
  stat: (path) => nodeFs.stat(path),
};

export interface AtomicWriteOptions {
  /** Replace an existing file (default true). When false an existing file is refused with 'already_exists'. */
  readonly overwrite?: boolean;
  /** File mode of a new file (default 0o644; 0o600 is advisable for case files on shared machines). */
  readonly mode?: number;
  readonly fs?: AtomicWriteFs;
}

/** Error codes of Node's file system, in the words a user reads. */
export function describeFsError(error: unknown): string {
  const code = (error as NodeJS.ErrnoException | undefined)?.code;
  switch (code) {
    case 'ENOSPC':
    case 'EDQUOT':
      return 'the disk is full (or the quota is used up)';
    case 'EROFS':
      return 'the folder is on a read-only disk';
    case 'EACCES':
    case 'EPERM':
      return 'permission denied (a read-only folder or file, or a file locked by another program)';
    case 'EBUSY':
    case 'ETXTBSY':
      return 'the file is locked by another program';
    case 'ENOENT':
      return 'no such file or folder';
    case 'ENOTDIR':
      return 'a part of the path is not a folder';
    case 'EISDIR':
      return 'it is a folder, not a file';
    case 'EEXIST':
      return 'a file of that name exists already';
    case 'EMFILE':
    case 'ENFILE':
      return 'too many files are open';
    case 'EIO':
      return 'the disk reported an input/output error';
    default:
      return code ? `the system refused (${code})` : 'an unexpected file-system error';
  }
}

function temporaryPathFor(path: string): string {
  return join(dirname(path), `.${basename(path)}.${randomBytes(6).toString('hex')}.tmp`);
}

/** True for names this module uses for its temporary files (listings skip them). */
export function isTemporaryFileName(name: string): boolean {
  return /^\..+\.[0-9a-f]{12}\.tmp$/.test(name);
}

/**
 * How old a temporary file of ours must be before a sweep removes it: a save
 * holds its temporary file for milliseconds (seconds on a slow network share),
 * so one older than ten minutes was left by a save that was cut off (a crash, a
 * power cut). A modelling choice of ours, with a wide margin.
 */
export const temporaryFileMaxAgeMs = 10 * 60 * 1000;

/**
 * Remove the temporary files this module left in a folder (by its naming
 * pattern only, see isTemporaryFileName) that are older than
 * temporaryFileMaxAgeMs. Anything else is never touched; a file that cannot be
 * removed (a read-only share) is left, silently, for a later sweep.
 *
 * @param folder - the folder to sweep (not its subfolders)
 * @param nowMs - the host's clock, milliseconds since the epoch
 * @param fs - the file system (tests inject faults)
 * @returns the names removed
 */
export async function sweepTemporaryFiles(folder: string, nowMs: number, fs: AtomicWriteFs = nodeAtomicWriteFs): Promise<readonly string[]> {
  let names: string[];
  try {
    names = await nodeFs.readdir(folder);
  } catch {
    return [];
  }
  const removed: string[] = [];
  for (const name of names.filter(isTemporaryFileName)) {
    const path = join(folder, name);
    try {
      const stat = await fs.stat(path);
      if (nowMs - stat.mtimeMs <= temporaryFileMaxAgeMs) continue;
      await fs.unlink(path);
      removed.push(name);
    } catch {
      // Gone already (another window swept it) or not removable here: left as it is.
    }
  }
  return removed;
}

async function exists(fs: AtomicWriteFs, path: string): Promise<boolean> {
  try {
    await fs.stat(path);
    return true;
  } catch {
    return false;
  }
}

/**
 * Flush a folder's entries (the rename) to disk. Skipped where the platform
 * cannot open or fsync a folder (Windows, some network shares).
 */
export async function syncFolder(folder: string, fs: AtomicWriteFs = nodeAtomicWriteFs): Promise<void> {
  let handle: WritableHandle | undefined;
  try {
    handle = await fs.open(folder, 'r');
    await handle.sync();
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    if (!['EISDIR', 'EPERM', 'EACCES', 'EINVAL', 'ENOTSUP', 'EBADF'].includes(code ?? '')) throw error;
  } finally {
    await handle?.close().catch(() => undefined);
  }
}

/**
 * Write a whole file atomically (see the module comment for the steps).
 *
 * @param path - the target file; its folder must exist
 * @param data - the complete new content
 * @param options - overwrite (default true), mode, and the file system (tests inject faults)
 * @returns ok (with a warning if only the folder flush failed), or one 'write_failed' / 'already_exists' issue
 *   naming the file and the cause; the old file is then untouched
 * @example await writeFileAtomic('/cases/th-0417.json', text) → { ok: true, value: undefined }
 */
export async function writeFileAtomic(path: string, data: string | Uint8Array, options: AtomicWriteOptions = {}): Promise<Result<void>> {
  const fs = options.fs ?? nodeAtomicWriteFs;
  if (options.overwrite === false && (await exists(fs, path))) {
    return fail(issue('already_exists', [], `${path} exists already; it was not replaced. Choose another name, or allow replacing it.`));
  }
  const temporary = temporaryPathFor(path);
  let handle: WritableHandle | undefined;
  let stage = 'write';
  try {
    handle = await fs.open(temporary, 'wx', options.mode ?? 0o644);
    await handle.writeFile(data);
    stage = 'flush';
    await handle.sync();
    await handle.close();
    handle = undefined;
    stage = 'replace';
    await fs.rename(temporary, path);
  } catch (error) {
    await handle?.close().catch(() => undefined);
    await fs.unlink(temporary).catch(() => undefined);
    const verb = stage === 'replace' ? 'replace' : 'write';
    return fail(issue('write_failed', [], `Could not ${verb} ${path}: ${describeFsError(error)}. Nothing was written over the existing file.`));
  }
  try {
    await syncFolder(dirname(path), fs);
  } catch (error) {
    // The new file is in place; only the folder flush failed, so say so plainly.
    return ok(undefined, [
      issue(
        'write_failed',
        [],
        `${path} was written, but its folder could not be flushed to disk (${describeFsError(error)}); a power cut now could bring back the previous version.`,
        'warning',
      ),
    ]);
  }
  return ok(undefined);
}
