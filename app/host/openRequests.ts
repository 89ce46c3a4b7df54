import { statSync } from 'node:fs';
import { basename, dirname, resolve } from 'node:path';
import { caseIdSchema } from '../../core/contract';
import { fail, issue, ok, type Result } from '../../core/result';

/**
 * A case file the operating system (or the command line) asked the app to
 * open: double-clicking a case file with the app as its handler, dropping one
 * on the app's icon, or `chelation-ledger preview <case file>`. The host keeps
 * the latest request until the page takes it through the contract's
 * `takeOpenRequest` call; the page takes it only when it has no unsaved
 * changes, so opening a file never loses work. Plain Node: Electron's main
 * process and the preview both use it, and tests run it without Electron.
 */
export interface CaseFileRequest {
  /** The folder holding the file (absolute): it becomes the workspace when the page takes the request. */
  readonly folder: string;
  /** The file's name inside the folder, a case id of the contract ('th-0417.json'). */
  readonly caseId: string;
}

/**
 * The case file named on a command line, or null. Electron's first instance
 * sees `process.argv`, a second instance's arguments arrive in the
 * `second-instance` event; either may carry the executable, the app folder
 * (when run unpackaged, `electron .`), switches added by Chromium or by
 * macOS (`--allow-file-access-from-files`, `-psn_0_12345`) and the file. The
 * file is the last argument that is not a switch and ends in `.json`;
 * relative paths are read against the directory the command ran in.
 *
 * @param argv - the whole argument list, executable first
 * @param workingDirectory - where the command ran (the second instance's, not this process's)
 */
export function caseFileArgument(argv: readonly string[], workingDirectory: string): string | null {
  for (let index = argv.length - 1; index >= 1; index -= 1) {
    const argument = argv[index]!;
    if (argument.startsWith('-')) continue;
    if (argument.toLowerCase().endsWith('.json')) return resolve(workingDirectory, argument);
  }
  return null;
}

/**
 * Check that a path names a case file the workspace can open: an existing
 * regular file whose name is a case id of the contract.
 */
export function caseFileRequest(path: string): Result<CaseFileRequest> {
  const absolute = resolve(path);
  const name = basename(absolute);
  if (!caseIdSchema.safeParse(name).success) {
    return fail(
      issue('invalid_file', ['file'], `${absolute} cannot be opened as a case: a case file's name ends in .json and holds letters, digits, spaces and . _ - ( ) only; rename the file and open it again.`),
    );
  }
  let isFile = false;
  try {
    isFile = statSync(absolute).isFile();
  } catch {
    return fail(issue('invalid_file', ['file'], `${absolute} was asked to open, but there is no such file (moved or deleted?).`));
  }
  if (!isFile) return fail(issue('invalid_file', ['file'], `${absolute} is a folder, not a case file.`));
  return ok({ folder: dirname(absolute), caseId: name });
}

/** The host's one pending request (the newest wins: the app shows one case at a time). */
export interface OpenRequests {
  /** Check a path and keep it as the pending request; a refused path leaves an earlier request in place. */
  offer(path: string): Result<CaseFileRequest>;
  /** The pending request, removed; null when there is none. */
  take(): CaseFileRequest | null;
}

export function createOpenRequests(): OpenRequests {
  let pending: CaseFileRequest | null = null;
  return {
    offer(path) {
      const request = caseFileRequest(path);
      if (request.ok) pending = request.value;
      return request;
    },
    take() {
      const taken = pending;
      pending = null;
      return taken;
    },
  };
}
