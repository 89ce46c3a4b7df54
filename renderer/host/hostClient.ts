import {
  exposedHostGlobal,
  hostCallNames,
  hostContract,
  hostResultSchema,
  menuCommands,
  previewApiPath,
  previewTokenHeader,
  previewTokenParameter,
  type HostApi,
  type HostCallName,
  type HostResult,
  type MenuCommand,
} from '../../core/contract';
import { issuesFromZod } from '../../core/model/zodIssues';
import { issue } from '../../core/result';

/**
 * The renderer's one way to reach its host (design.md §6): a typed function
 * per call of the contract. Which transport carries the calls — the desktop
 * app's preload or the browser preview's HTTP — is picked once, at start-up,
 * from what the page finds; nothing else in the renderer knows or names it,
 * and no channel string or URL of the host appears outside this folder.
 *
 * Every call resolves to `{ ok: true, value } | { ok: false, issues }`; a
 * request that fails the contract is refused here before it leaves the page,
 * and an answer outside the contract or a host that does not answer becomes
 * one issue in words.
 */
export interface HostClient extends HostApi {
  /** Commands from the desktop menu (File ▸ Open, Save, Export sheet); returns the unsubscribe. */
  onMenuCommand(listener: (command: MenuCommand) => void): () => void;
}

/** How calls leave the page. */
export interface HostTransport {
  call(name: HostCallName, request: unknown): Promise<unknown>;
  onMenuCommand(listener: (command: string) => void): () => void;
}

/** What the preload exposes (app/preload/exposedApi.ts builds it). */
export type ExposedHost = Readonly<Record<HostCallName, (request: unknown) => Promise<unknown>>> & {
  readonly onMenuCommand?: (listener: (command: string) => void) => () => void;
};

function refused(message: string): HostResult<never> {
  return { ok: false, issues: [issue('host_failed', [], message)] };
}

/** The typed client over one transport. */
export function createHostClient(transport: HostTransport): HostClient {
  const api: Partial<Record<HostCallName, (request: unknown) => Promise<HostResult<unknown>>>> = {};
  for (const name of hostCallNames) {
    const spec = hostContract[name];
    const answerSchema = hostResultSchema(spec.response);
    api[name] = async (request: unknown) => {
      const checked = spec.request.safeParse(request ?? {}, { reportInput: true });
      if (!checked.success) {
        return { ok: false, issues: issuesFromZod(checked.error.issues, 'error', { root: `The request to ${name}`, fieldOf: `the ${name} request` }) };
      }
      let answer: unknown;
      try {
        answer = await transport.call(name, request ?? {});
      } catch {
        return refused(`The app's host did not answer ${name}; nothing was changed on disk. Try again, or reopen the app.`);
      }
      const parsed = answerSchema.safeParse(answer);
      return parsed.success ? (parsed.data as HostResult<unknown>) : refused(`The app's host answered ${name} in a form this page does not know; nothing on screen was changed.`);
    };
  }
  return {
    ...(api as unknown as HostApi),
    onMenuCommand: (listener) =>
      transport.onMenuCommand((command) => {
        if ((menuCommands as readonly string[]).includes(command)) listener(command as MenuCommand);
      }),
  };
}

/** Calls through the functions the desktop app's preload exposed. */
export function preloadTransport(exposed: ExposedHost): HostTransport {
  return {
    call: (name, request) => exposed[name](request),
    onMenuCommand: (listener) => exposed.onMenuCommand?.(listener) ?? (() => undefined),
  };
}

/** Calls as HTTP POSTs to the browser preview, each with the per-run token. */
export function previewTransport(options: { readonly origin: string; readonly token: string; readonly fetch: typeof fetch }): HostTransport {
  return {
    call: async (name, request) => {
      const response = await options.fetch(`${options.origin}${previewApiPath}${name}`, {
        method: 'POST',
        headers: { 'content-type': 'application/json', [previewTokenHeader]: options.token },
        body: JSON.stringify(request),
      });
      return response.json();
    },
    onMenuCommand: () => () => undefined,
  };
}

/** A page opened without a host: every call answers in words. */
function absentTransport(): HostTransport {
  return {
    call: () => Promise.resolve(refused('This page was opened without the app behind it: start chelation-ledger (npm start) and open the address it prints.')),
    onMenuCommand: () => () => undefined,
  };
}

function isExposedHost(value: unknown): value is ExposedHost {
  return typeof value === 'object' && value !== null && hostCallNames.every((name) => typeof (value as Record<string, unknown>)[name] === 'function');
}

/** What the page offers for picking a transport (the window, in the app). */
export interface PageEnvironment {
  readonly [exposedHostGlobal]?: unknown;
  readonly location?: { readonly origin: string; readonly search: string };
  readonly fetch?: typeof fetch;
}

/**
 * The transport the page finds: the preload's exposed calls when present,
 * else HTTP to the preview with the token from the page's URL, else none.
 */
export function pickTransport(page: PageEnvironment): HostTransport {
  const exposed = page[exposedHostGlobal];
  if (isExposedHost(exposed)) return preloadTransport(exposed);
  const token = page.location ? new URLSearchParams(page.location.search).get(previewTokenParameter) : null;
  if (page.location && token && page.fetch) return previewTransport({ origin: page.location.origin, token, fetch: page.fetch.bind(globalThis) });
  return absentTransport();
}

let shared: HostClient | undefined;

/** The page's host client, made on first use from the window's transport. */
export function host(): HostClient {
  shared ??= createHostClient(pickTransport(globalThis as unknown as PageEnvironment));
  return shared;
}
