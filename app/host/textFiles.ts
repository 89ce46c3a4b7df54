import { readFileSync } from 'node:fs';
import { fail, issue, ok, type Result } from '../../core/result';

/**
 * Read one text file from disk for a command (a case file, a product catalogue).
 * Every failure is a value naming the file and what it is: a missing file, a
 * folder, or a read error. `field` is the path the issue carries (the flag the
 * user typed, or none for a command's main file).
 */
export function readTextFile(path: string, what: string, field: readonly (string | number)[] = []): Result<string> {
  try {
    return ok(readFileSync(path, 'utf8'));
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    const reason = code === 'ENOENT' ? 'no such file' : code === 'EISDIR' ? 'it is a folder, not a file' : (error as Error).message;
    return fail(issue('invalid_file', field, `Cannot read ${what} ${path}: ${reason}.`));
  }
}
