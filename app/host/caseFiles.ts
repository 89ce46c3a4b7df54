import { parseCase } from '../../core/model/parseCase';
import type { Case } from '../../core/model/caseFile';
import { fail, issue, type Result } from '../../core/result';
import { readTextFile } from './textFiles';

/**
 * The text of a case file to JSON: a clear message naming the file when it is
 * not JSON (a file cut short, a stray character from a hand edit).
 *
 * @param name - the file as the message names it
 * @param text - the file's content
 */
export function caseJsonFromText(name: string, text: string): Result<unknown> {
  try {
    return { ok: true, value: JSON.parse(text) as unknown };
  } catch (error) {
    return fail(issue('invalid_file', [], `Case file ${name} is not valid JSON: ${(error as Error).message}.`));
  }
}

/**
 * Read and check one case file from disk. Every failure is a value: a missing
 * file, unreadable JSON, or issues from the case model. The file is never
 * rewritten here.
 */
export function readCaseFile(path: string): Result<Case> {
  const text = readTextFile(path, 'case file');
  if (!text.ok) return text;
  const json = caseJsonFromText(path, text.value);
  return json.ok ? parseCase(json.value) : json;
}
