import { fail, issue, ok, type Result } from '../../core/result';
import type { DiskRevision } from './caseStore';

/**
 * The contract's revision token (core/contract revisionSchema) for a file's
 * state on disk: modification time, size and content hash. The renderer
 * treats it as opaque and hands it back with a save or an import.
 */
export function revisionToken(revision: DiskRevision): string {
  return `${revision.mtimeMs}|${revision.size}|${revision.sha256 || 'absent'}`;
}

/** The disk revision a token names, or an issue when the token is not one this host gave. */
export function revisionFromToken(token: string): Result<DiskRevision> {
  const [mtime, size, sha256] = token.split('|');
  const mtimeMs = Number(mtime);
  const bytes = Number(size);
  if (!Number.isFinite(mtimeMs) || !Number.isInteger(bytes) || bytes < 0 || sha256 === undefined || !/^([0-9a-f]{64}|absent)$/.test(sha256)) {
    return fail(issue('invalid_file', ['baseRevision'], 'The case was not opened through this window (its revision is not one this host gave); open it again before saving.'));
  }
  return ok({ mtimeMs, size: bytes, sha256: sha256 === 'absent' ? '' : sha256 });
}
