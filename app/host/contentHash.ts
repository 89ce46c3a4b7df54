import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { describeFsError } from './atomicWrite';
import { fail, issue, ok, type Result } from '../../core/result';

/**
 * SHA-256 of a file's bytes as hex: printed on the review sheet so a paper copy
 * can be matched to the case file it was made from (`sha256sum case.json` gives
 * the same text).
 *
 * @example sha256OfFile('assets/demo/th-0417.json') → { ok: true, value: '3f…' } (64 hex digits)
 */
export function sha256OfFile(path: string): Result<string> {
  try {
    return ok(createHash('sha256').update(readFileSync(path)).digest('hex'));
  } catch (error) {
    return fail(issue('invalid_file', [], `Cannot read case file ${path}: ${describeFsError(error)}.`));
  }
}
