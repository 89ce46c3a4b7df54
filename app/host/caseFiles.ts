import { parseCase } from '../../core/model/parseCase';
import type { Case } from '../../core/model/caseFile';
import { fail, issue, type Result } from '../../core/result';
import { readTextFile } from './textFiles';

/**
 * Read and check one case file from disk. Every failure is a value: a missing
 * file, unreadable JSON, or issues from the case model. The file is never
 * rewritten here.
 */
export function readCaseFile(path: string): Result<Case> {
  const text = readTextFile(path, 'case file');
  if (!text.ok) return text;
  let json: unknown;
  try {
    json = JSON.parse(text.value);
  } catch (error) {
    return fail(issue('invalid_file', [], `Case file ${path} is not valid JSON: ${(error as Error).message}.`));
  }
  return parseCase(json);
}
