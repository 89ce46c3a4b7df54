import { mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { isTemporaryFileName, writeFileAtomic } from '../../../app/host/atomicWrite';
import { faultyFs as faulty, type FaultStep } from './faultyFs';

// The outside reference here is the real file system (read back with Node's
// fs) and POSIX rename(2) (IEEE Std 1003.1-2017): "If the link named by the
// new argument exists, it shall be removed and old renamed to new", atomically
// for other processes. The faults are injected because these tests run as
// root, which a chmod-ed folder does not stop.

const faultyFs = (failAt: FaultStep, code: string, steps: string[] = []) => faulty(failAt, code, { steps, isFolder: (path) => path === folder });

let folder: string;
beforeEach(() => {
  folder = mkdtempSync(join(tmpdir(), 'atomic-write-'));
});
afterEach(() => rmSync(folder, { recursive: true, force: true }));

describe('writeFileAtomic', () => {
  it('writes a new file and replaces an existing one, leaving no temporary file', async () => {
    const target = join(folder, 'case.json');
    expect((await writeFileAtomic(target, 'first')).ok).toBe(true);
    expect(readFileSync(target, 'utf8')).toBe('first');
    expect((await writeFileAtomic(target, 'second')).ok).toBe(true);
    expect(readFileSync(target, 'utf8')).toBe('second');
    expect(readdirSync(folder)).toEqual(['case.json']);
  });

  it('flushes the temporary file before the rename and the folder after it', async () => {
    const steps: string[] = [];
    const written = await writeFileAtomic(join(folder, 'case.json'), 'x', { fs: faultyFs(null, '', steps) });
    expect(written.ok).toBe(true);
    expect(steps).toEqual(['open wx', 'write', 'sync', 'close', 'rename', 'open folder', 'sync folder', 'close folder']);
  });

  it('refuses to replace an existing file when overwrite is false', async () => {
    const target = join(folder, 'case.json');
    writeFileSync(target, 'old');
    const written = await writeFileAtomic(target, 'new', { overwrite: false });
    expect(written.ok).toBe(false);
    if (!written.ok) {
      expect(written.issues[0]!.code).toBe('already_exists');
      expect(written.issues[0]!.message).toContain(target);
    }
    expect(readFileSync(target, 'utf8')).toBe('old');
  });

  const cases = [
    { failAt: 'writeFile', code: 'ENOSPC', words: 'the disk is full' },
    { failAt: 'open', code: 'EROFS', words: 'read-only' },
    { failAt: 'open', code: 'EACCES', words: 'permission denied' },
    { failAt: 'sync', code: 'EIO', words: 'input/output error' },
    { failAt: 'rename', code: 'EBUSY', words: 'locked by another program' },
    { failAt: 'rename', code: 'EPERM', words: 'locked by another program' },
  ] as const;
  for (const { failAt, code, words } of cases) {
    it(`${code} at ${failAt}: a clear message naming the file, the old file intact, no temporary file left`, async () => {
      const target = join(folder, 'case.json');
      writeFileSync(target, 'old content');
      const written = await writeFileAtomic(target, 'new content', { fs: faultyFs(failAt, code) });
      expect(written.ok).toBe(false);
      if (!written.ok) {
        expect(written.issues[0]!.code).toBe('write_failed');
        expect(written.issues[0]!.message).toContain(target);
        expect(written.issues[0]!.message).toContain(words);
        expect(written.issues[0]!.message).not.toContain('new content');
        expect(written.issues[0]!.message).not.toMatch(/\n\s+at /); // no stack trace
      }
      expect(readFileSync(target, 'utf8')).toBe('old content');
      expect(readdirSync(folder)).toEqual(['case.json']);
    });
  }

  it('a failed folder flush keeps the new file and warns that a power cut could undo it', async () => {
    const target = join(folder, 'case.json');
    const written = await writeFileAtomic(target, 'new', { fs: faultyFs('folderSync', 'EIO') });
    expect(written.ok).toBe(true);
    expect(written.ok && written.warnings?.[0]?.message).toContain('power cut');
    expect(readFileSync(target, 'utf8')).toBe('new');
  });

  it('a folder that cannot be flushed at all (EISDIR on Windows, EINVAL on some shares) is not an error', async () => {
    const written = await writeFileAtomic(join(folder, 'case.json'), 'x', { fs: faultyFs('folderSync', 'EINVAL') });
    expect(written).toEqual({ ok: true, value: undefined });
  });

  it('names its temporary files so that listings can skip them', () => {
    expect(isTemporaryFileName('.case.json.0123456789ab.tmp')).toBe(true);
    expect(isTemporaryFileName('case.json')).toBe(false);
  });
});
