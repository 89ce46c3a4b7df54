import { isAbsolute, relative, resolve } from 'node:path';
import { caseIdSchema } from '../../core/contract';
import { fail, issue, ok, type Result } from '../../core/result';

/**
 * The path of a file named by the renderer inside a folder the host chose,
 * or a refusal: the name must pass the contract's case-id schema and the
 * resolved path must stay inside the folder (no "..", no absolute path, no
 * drive letter).
 *
 * @param folder - the workspace (or its exports) folder, absolute
 * @param fileName - a case id from a request
 * @returns the absolute path inside `folder`
 * @example insideFolder('/work/cases', '../etc/passwd.json').ok === false
 */
export function insideFolder(folder: string, fileName: string): Result<string> {
  const named = caseIdSchema.safeParse(fileName);
  const target = resolve(folder, fileName);
  const within = relative(resolve(folder), target);
  if (!named.success || within === '' || within.startsWith('..') || isAbsolute(within) || within.includes('/') || within.includes('\\')) {
    return fail(issue('forbidden', ['caseId'], `"${fileName.slice(0, 80)}" is not a case file name inside the workspace.`));
  }
  return ok(target);
}

/** The folder inside a workspace that exports (review sheets, monitoring calendars) are written to. */
export const exportsFolderName = 'exports';
