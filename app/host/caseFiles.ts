import { readFileSync } from 'node:fs';
import { parseCase } from '../../core/model/parseCase';
import type { Case } from '../../core/model/caseFile';
import { fail, issue, type Result } from '../../core/result';

/**
 * Read and check one case file from disk. Every failure is a value: a missing
 * file, unreadable JSON, or issues from the case model. The file is never
 * rewritten here.
 */
export function readCaseFile(path: string): Result<Case> {
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch (error) {
    const reason = (error as NodeJS.ErrnoException).code === 'ENOENT' ? 'no such file' : (error as Error).message;
    return fail(issue('invalid_file', [], `Cannot read case file ${path}: ${reason}.`));
  }
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch (error) {
    return fail(issue('invalid_file', [], `Case file ${path} is not valid JSON: ${(error as Error).message}.`));
  }
  return parseCase(json);
}
