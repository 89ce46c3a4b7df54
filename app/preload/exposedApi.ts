import { channelOf, hostCallNames, menuChannel, type HostCallName } from '../../core/contract/callNames';

/** The part of Electron's ipcRenderer the preload uses (injected, so tests need no Electron). */
export interface IpcRendererLike {
  invoke(channel: string, payload: unknown): Promise<unknown>;
  on(channel: string, listener: (event: unknown, ...args: unknown[]) => void): unknown;
  removeListener(channel: string, listener: (event: unknown, ...args: unknown[]) => void): unknown;
}

/** What the page sees under window[exposedHostGlobal]. */
export type ExposedApi = Readonly<Record<HostCallName, (request: unknown) => Promise<unknown>>> & {
  readonly onMenuCommand: (listener: (command: string) => void) => () => void;
};

/**
 * The calls the preload exposes through contextBridge: exactly one function
 * per call of the contract, each sending one payload on its own channel, and
 * a listener for menu commands that hands the page the command only — never
 * the IPC event, whose `sender` would be the raw ipcRenderer (checklist item
 * 20, "Do not expose Electron APIs to untrusted web content"). No generic
 * send, no channel chosen by the page.
 */
export function buildExposedApi(ipcRenderer: IpcRendererLike): ExposedApi {
  const calls = Object.fromEntries(
    hostCallNames.map((name) => [name, (request: unknown) => ipcRenderer.invoke(channelOf(name), request)] as const),
  ) as Record<HostCallName, (request: unknown) => Promise<unknown>>;
  return Object.freeze({
    ...calls,
    onMenuCommand: (listener: (command: string) => void) => {
      const relay = (_event: unknown, command: unknown) => {
        if (typeof command === 'string') listener(command);
      };
      ipcRenderer.on(menuChannel, relay);
      return () => void ipcRenderer.removeListener(menuChannel, relay);
    },
  });
}
