import { readFileSync } from 'node:fs';
import { fail, issue, ok, type Result } from '../../core/result';
import { describeFsError } from './atomicWrite';

/** The UTF-8 byte-order mark some editors write at the start of a file. */
const byteOrderMark = [0xef, 0xbb, 0xbf];

/** Paths of the strings of a JSON text that hold U+FFFD (where undecodable bytes were), e.g. "patient.label". */
function fieldsWithReplacement(text: string): string[] {
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch {
    return [];
  }
  const found: string[] = [];
  const walk = (value: unknown, path: string) => {
    if (typeof value === 'string') {
      if (value.includes('\ufffd')) found.push(path || '(the whole file)');
    } else if (Array.isArray(value)) {
      value.forEach((it, index) => walk(it, `${path}[${index}]`));
    } else if (value !== null && typeof value === 'object') {
      for (const [key, it] of Object.entries(value)) {
        if (key.includes('\ufffd')) found.push(`${path ? `${path}.` : ''}${key} (the key)`);
        walk(it, path ? `${path}.${key}` : key);
      }
    }
  };
  walk(json, '');
  return found;
}

/**
 * Read one text file from disk for a command (a case file, a product catalogue).
 * Every failure is a value naming the file and what it is: a missing file, a
 * folder, a read error, or bytes that are not UTF-8 (refused, naming the JSON
 * fields that hold them, rather than silently replaced). A UTF-8 byte-order mark
 * at the start is accepted and dropped. `field` is the path the issue carries
 * (the flag the user typed, or none for a command's main file).
 */
export function readTextFile(path: string, what: string, field: readonly (string | number)[] = []): Result<string> {
  let bytes: Buffer;
  try {
    bytes = readFileSync(path);
  } catch (error) {
    return fail(issue('invalid_file', field, `Cannot read ${what} ${path}: ${describeFsError(error)}.`));
  }
  return decodeTextBytes(bytes, path, what, field);
}

/**
 * The text of a file's bytes: a UTF-8 byte-order mark dropped, bytes that are
 * not UTF-8 refused naming the JSON fields that hold them (never replaced).
 * Shared by readTextFile and the case store.
 *
 * @param bytes - the file's content
 * @param path - the file, as messages name it
 * @param what - what the file is ("case file")
 * @param field - the path the issue carries
 */
export function decodeTextBytes(bytes: Uint8Array, path: string, what: string, field: readonly (string | number)[] = []): Result<string> {
  const body = byteOrderMark.every((byte, index) => bytes[index] === byte) ? bytes.subarray(byteOrderMark.length) : bytes;
  try {
    return ok(new TextDecoder('utf-8', { fatal: true }).decode(body));
  } catch {
    const fields = fieldsWithReplacement(new TextDecoder('utf-8').decode(body));
    const where = fields.length > 0 ? ` in ${fields.slice(0, 5).join(', ')}` : '';
    return fail(issue('invalid_file', field, `Cannot read ${what} ${path}: it holds bytes that are not UTF-8 text${where}; save it as UTF-8 and open it again. Nothing was read.`));
  }
}
