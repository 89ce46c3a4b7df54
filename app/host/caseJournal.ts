import { createHash } from 'node:crypto';
import { promises as nodeFs } from 'node:fs';
import { z } from 'zod';
import { fail, issue, ok, type Result } from '../../core/result';
import { describeFsError, nodeAtomicWriteFs, type AtomicWriteFs } from './atomicWrite';

/**
 * The journal of one case: an append-only file beside it (`th-0417.json` →
 * `th-0417.journal.jsonl`), one JSON line per change with the time, a short
 * description, the SHA-256 of the file's new content and that content itself.
 *
 * A save appends (and flushes) its journal line before it replaces the case
 * file, so a crash between the two leaves the journal one state ahead and the
 * new state is recovered from it. A crash during the append leaves a torn last
 * line; every append starts with a line break, so a torn line never swallows
 * the next one, and readers skip what they cannot read (and say where).
 *
 * The journal holds the same patient data as the case file, and lives and
 * moves with it (archive, rename); nothing of it goes to any log.
 */

/** The file name of a case's journal. */
export function journalNameFor(caseFileName: string): string {
  return `${caseFileName.replace(/\.json$/i, '')}.journal.jsonl`;
}

/** SHA-256 of a file's bytes, hex; the journal and the change-on-disk check compare it. */
export function contentHash(bytes: string | Uint8Array): string {
  return createHash('sha256').update(bytes).digest('hex');
}

const journalLineSchema = z.strictObject({
  /** When the change was saved: an ISO 8601 instant from the host's clock. */
  at: z.iso.datetime({ offset: true }),
  /** A short description of the change ("added transfusion on 2026-11-03"). */
  change: z.string().min(1).max(200),
  /** SHA-256 of the case file's content as written by this change. */
  sha256: z.string().regex(/^[0-9a-f]{64}$/),
  /** The case-file version written. */
  version: z.number().int().min(1),
  /** The case file as written (its JSON text, so the hash can be checked). */
  content: z.string(),
});

export type JournalLine = z.output<typeof journalLineSchema>;

/** One change as the history shows it (the content left out). */
export interface JournalEntry {
  readonly at: string;
  readonly change: string;
  readonly sha256: string;
  readonly version: number;
}

export interface JournalRead {
  readonly lines: readonly JournalLine[];
  /** 1-based line numbers that could not be read (a torn last line after a crash, an edit by hand). */
  readonly unreadableLines: readonly number[];
}

/**
 * Read a journal. A missing journal is an empty one (a case written by hand or
 * by an older tool has none).
 *
 * @returns the readable lines in order and the numbers of those that are not, or a 'write_failed'-free
 *   'invalid_file' issue naming the journal when it cannot be read at all
 */
export async function readJournal(path: string): Promise<Result<JournalRead>> {
  let text: string;
  try {
    text = await nodeFs.readFile(path, 'utf8');
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return ok({ lines: [], unreadableLines: [] });
    return fail(issue('invalid_file', [], `Cannot read the journal ${path}: ${describeFsError(error)}.`));
  }
  const lines: JournalLine[] = [];
  const unreadableLines: number[] = [];
  text.split('\n').forEach((raw, index) => {
    if (raw.trim() === '') return;
    let json: unknown;
    try {
      json = JSON.parse(raw);
    } catch {
      unreadableLines.push(index + 1);
      return;
    }
    const parsed = journalLineSchema.safeParse(json);
    // A line whose content does not match its own hash was not written whole.
    if (!parsed.success || contentHash(parsed.data.content) !== parsed.data.sha256) unreadableLines.push(index + 1);
    else lines.push(parsed.data);
  });
  return ok({ lines, unreadableLines });
}

/**
 * Append one line and flush it to disk before returning.
 *
 * @param path - the journal file (created if missing)
 * @param line - the change
 * @param fs - the file system (tests inject a full disk)
 * @returns ok, or a 'write_failed' issue naming the journal; the case file is not touched here
 */
export async function appendJournal(path: string, line: JournalLine, fs: AtomicWriteFs = nodeAtomicWriteFs): Promise<Result<void>> {
  let handle: Awaited<ReturnType<AtomicWriteFs['open']>> | undefined;
  try {
    handle = await fs.open(path, 'a', 0o644);
    // Leading line break: closes a line torn by a crash during an earlier append.
    await handle.writeFile(`\n${JSON.stringify(line)}`);
    await handle.sync();
    await handle.close();
    handle = undefined;
    return ok(undefined);
  } catch (error) {
    await handle?.close().catch(() => undefined);
    return fail(issue('write_failed', [], `Could not add to the journal ${path}: ${describeFsError(error)}. The case file was not changed.`));
  }
}

/** The history as shown: each change without its content, oldest first. */
export function journalEntries(read: JournalRead): readonly JournalEntry[] {
  return read.lines.map(({ at, change, sha256, version }) => ({ at, change, sha256, version }));
}
