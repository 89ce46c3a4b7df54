import { copyFileSync, mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { HostDispatch } from '../../../app/host/hostDispatch';
import type { HostEnvironment } from '../../../app/host/hostServices';
import { createSettingsStore } from '../../../app/host/settingsStore';

const demoFolder = fileURLToPath(new URL('../../../assets/demo/', import.meta.url));

/** A temporary workspace holding copies of the two demo cases, and a settings file beside it. */
export function demoWorkspace(): { readonly folder: string; readonly settingsPath: string } {
  const root = mkdtempSync(join(tmpdir(), 'chelation-ledger-host-'));
  for (const name of ['th-0417.json', 'th-0093.json']) copyFileSync(join(demoFolder, name), join(root, name));
  return { folder: root, settingsPath: join(root, 'config', 'settings.json') };
}

/** A host environment over a demo workspace, with a fixed clock. */
export function demoEnvironment(overrides: Partial<HostEnvironment> = {}): HostEnvironment & { readonly folder: string } {
  const { folder, settingsPath } = demoWorkspace();
  let workspace: string | null = folder;
  return {
    folder,
    appName: 'chelation-ledger',
    appVersion: '0.1.0',
    workspace: { get: () => workspace, set: (next) => (workspace = next) },
    settings: createSettingsStore(settingsPath),
    now: () => new Date(Date.UTC(2026, 10, 20, 9, 0, 0)),
    ...overrides,
  };
}

export type Progress = { step: string; done: number; total: number } | null;

/** Every distinct progress the host answered while `call` ran, asked for between the host's turns (setImmediate). */
export async function watch(dispatch: HostDispatch, workId: string, call: Promise<unknown>, onProgress?: (seen: Progress) => void): Promise<{ answer: unknown; seen: Progress[] }> {
  let finished = false;
  const answer = call.finally(() => (finished = true));
  const seen: Progress[] = [];
  while (!finished) {
    await new Promise((resolve) => setImmediate(resolve));
    const polled = await dispatch('workProgress', { workId });
    if (!polled.ok) throw new Error(JSON.stringify(polled));
    const progress = polled.value as Progress;
    if (progress && JSON.stringify(progress) !== JSON.stringify(seen[seen.length - 1])) {
      seen.push(progress);
      onProgress?.(progress);
    }
  }
  return { answer: await answer, seen };
}
