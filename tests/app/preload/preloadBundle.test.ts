import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runInNewContext } from 'node:vm';
import { beforeAll, describe, expect, it, vi } from 'vitest';
import { channelOf, exposedHostGlobal, hostCallNames, menuChannel } from '../../../core/contract';
// @ts-expect-error the build script is plain JavaScript
import { buildDesktop } from '../../../app/build/build-desktop.mjs';

// The outside reference is the Electron security checklist item 20 ("Do not expose Electron
// APIs to untrusted web content", electronjs.org/docs/latest/tutorial/security) and the
// sandbox rule of Electron's "Process Sandboxing" page that a sandboxed preload may require
// only a few built-in modules, so it must be one file. The built bundle is run in a fresh
// V8 context with a fake `electron`, never the real module.

let bundle: string;
let built: { main: string; preload: string };

beforeAll(async () => {
  built = await buildDesktop(mkdtempSync(join(tmpdir(), 'chelation-ledger-build-')));
  bundle = readFileSync(built.preload, 'utf8');
});

function runPreload() {
  const exposed: Record<string, unknown> = {};
  const ipcRenderer = { invoke: vi.fn(async () => ({ ok: true, value: 1 })), on: vi.fn(), removeListener: vi.fn(), send: vi.fn(), sendSync: vi.fn() };
  const contextBridge = { exposeInMainWorld: vi.fn((key: string, api: unknown) => (exposed[key] = api)) };
  const required: string[] = [];
  const module = { exports: {} };
  runInNewContext(bundle, {
    module,
    exports: module.exports,
    require: (name: string) => {
      required.push(name);
      if (name === 'electron') return { contextBridge, ipcRenderer };
      throw new Error(`a sandboxed preload cannot require ${name}`);
    },
  });
  return { exposed, ipcRenderer, contextBridge, required };
}

describe('the built preload', () => {
  it('is one small CommonJS file that requires only electron (no zod, no case model)', () => {
    expect(bundle.length).toBeLessThan(4000);
    expect(bundle).not.toMatch(/zod|caseSchema|safeParse/);
    expect(runPreload().required).toEqual(['electron']);
  });

  it('20: exposes exactly the contract\'s calls and the menu listener, under one name, and nothing of Electron', () => {
    const { exposed, contextBridge } = runPreload();
    expect(contextBridge.exposeInMainWorld).toHaveBeenCalledOnce();
    const api = exposed[exposedHostGlobal] as Record<string, unknown>;
    expect(Object.keys(api).sort()).toEqual([...hostCallNames, 'onMenuCommand'].sort());
    for (const value of Object.values(api)) expect(typeof value).toBe('function');
    expect(api).not.toHaveProperty('send');
    expect(api).not.toHaveProperty('invoke');
    expect(Object.isFrozen(api)).toBe(true);
  });

  it('sends each call on its own channel with the payload only', async () => {
    const { exposed, ipcRenderer } = runPreload();
    const api = exposed[exposedHostGlobal] as Record<string, (request: unknown) => Promise<unknown>>;
    await api['openCase']!({ caseId: 'th-0417.json' });
    expect(ipcRenderer.invoke).toHaveBeenCalledWith(channelOf('openCase'), { caseId: 'th-0417.json' });
    expect(ipcRenderer.send).not.toHaveBeenCalled();
  });

  it('hands a menu listener the command only, never the IPC event (whose sender is ipcRenderer)', () => {
    const { exposed, ipcRenderer } = runPreload();
    const api = exposed[exposedHostGlobal] as { onMenuCommand: (listener: (...args: unknown[]) => void) => () => void };
    const listener = vi.fn();
    const unsubscribe = api.onMenuCommand(listener);
    const [channel, relay] = ipcRenderer.on.mock.calls[0] as unknown as [string, (event: unknown, command: unknown) => void];
    expect(channel).toBe(menuChannel);
    relay({ sender: ipcRenderer }, 'save');
    relay({ sender: ipcRenderer }, { not: 'a command' });
    expect(listener.mock.calls).toEqual([['save']]);
    unsubscribe();
    expect(ipcRenderer.removeListener).toHaveBeenCalledWith(menuChannel, relay);
  });

  it('leaves electron out of the main process bundle (loaded by Electron at run time)', () => {
    const main = readFileSync(built.main, 'utf8');
    expect(main).toContain('require("electron")');
    expect(main).not.toMatch(/function BrowserWindow/);
  });
});
