import { nodeAtomicWriteFs, type AtomicWriteFs } from '../../../app/host/atomicWrite';

/** Where a simulated fault strikes. */
export type FaultStep = 'open' | 'writeFile' | 'sync' | 'rename' | 'folderSync' | null;

const fault = (code: string) => Object.assign(new Error(`simulated ${code}`), { code });

/**
 * Node's fs with one step failing with an errno code (ENOSPC for a full disk,
 * EROFS for a read-only folder, EBUSY for a locked file), and a record of the
 * steps in order. Faults are injected because these tests run as root, which a
 * chmod-ed folder does not stop. `only` limits the fault to some paths.
 */
export function faultyFs(
  failAt: FaultStep,
  code: string,
  options: { readonly steps?: string[]; readonly only?: (path: string) => boolean; readonly isFolder?: (path: string) => boolean } = {},
): AtomicWriteFs {
  const steps = options.steps ?? [];
  const applies = options.only ?? (() => true);
  const isFolder = options.isFolder ?? ((path: string) => !/\.[a-z]+$/i.test(path));
  return {
    open: async (path, flags, mode) => {
      const folder = isFolder(path);
      const hit = applies(path);
      steps.push(folder ? 'open folder' : `open ${flags}`);
      if (failAt === 'open' && !folder && hit) throw fault(code);
      const handle = await nodeAtomicWriteFs.open(path, flags, mode);
      return {
        writeFile: async (data) => {
          steps.push('write');
          if (failAt === 'writeFile' && hit) {
            await handle.writeFile(data.slice(0, 5)); // a part reached the disk before it filled
            throw fault(code);
          }
          await handle.writeFile(data);
        },
        sync: async () => {
          steps.push(folder ? 'sync folder' : 'sync');
          if (hit && ((failAt === 'sync' && !folder) || (failAt === 'folderSync' && folder))) throw fault(code);
          await handle.sync();
        },
        close: async () => {
          steps.push(folder ? 'close folder' : 'close');
          await handle.close();
        },
      };
    },
    rename: async (from, to) => {
      steps.push('rename');
      if (failAt === 'rename' && applies(to)) throw fault(code);
      await nodeAtomicWriteFs.rename(from, to);
    },
    unlink: async (path) => {
      steps.push('unlink');
      await nodeAtomicWriteFs.unlink(path);
    },
    stat: nodeAtomicWriteFs.stat,
  };
}
