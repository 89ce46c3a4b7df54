import { hostContract, hostResultSchema, isHostCallName, type HostCallName, type HostHandlers, type HostIssue, type HostResult } from '../../core/contract';
import { issuesFromZod } from '../../core/model/zodIssues';
import { issue } from '../../core/result';

/** Answer one call by name with its raw payload. Never throws, never rejects. */
export type HostDispatch = (name: string, payload: unknown) => Promise<HostResult<unknown>>;

export interface HostDispatchOptions {
  /**
   * Told of a service that threw or answered outside the contract (a bug), for
   * the host's own log. The renderer only ever gets a one-line issue.
   */
  readonly onUnexpected?: (name: HostCallName, problem: unknown) => void;
}

function refused(code: HostIssue['code'], message: string): HostResult<never> {
  return { ok: false, issues: [issue(code, [], message)] };
}

/**
 * The one registration function over the host contract, used by both
 * transports (Electron's IPC in app/main, HTTP in app/preview) so a payload is
 * checked the same way whichever carries it:
 * 1. the name must be a call of the contract;
 * 2. the payload must match the call's request schema (issues name the field);
 * 3. the service runs on the parsed request;
 * 4. its answer must match `{ ok: true, value } | { ok: false, issues }` with
 *    the call's response schema, else the caller gets a 'host_failed' issue.
 * A service that throws gives a 'host_failed' issue naming the call; no stack
 * trace crosses the boundary.
 *
 * @param handlers - one service per call (app/host/hostServices.ts wires them)
 * @returns a dispatcher; the transports hand it the call's name and payload
 * @example await createHostDispatch(handlers)('appInfo', {}) // { ok: true, value: { name, version } }
 */
export function createHostDispatch(handlers: HostHandlers, options: HostDispatchOptions = {}): HostDispatch {
  const responseSchemas = new Map<HostCallName, ReturnType<typeof hostResultSchema>>();
  for (const name of Object.keys(hostContract) as HostCallName[]) {
    responseSchemas.set(name, hostResultSchema(hostContract[name].response));
  }

  return async (name, payload) => {
    if (!isHostCallName(name)) return refused('not_available', `There is no host call named ${JSON.stringify(String(name).slice(0, 60))}.`);
    const spec = hostContract[name];
    const request = spec.request.safeParse(payload ?? {}, { reportInput: true });
    if (!request.success) {
      return { ok: false, issues: issuesFromZod(request.error.issues, 'error', { root: `The request to ${name}`, fieldOf: `the ${name} request` }) };
    }
    let answer: unknown;
    try {
      // Each handler takes its own call's request; the map is indexed by the same name.
      answer = await (handlers[name] as (request: unknown) => unknown)(request.data);
    } catch (error) {
      options.onUnexpected?.(name, error);
      return refused('host_failed', `The host could not complete ${name}: an unexpected error; the work on screen is kept.`);
    }
    const checked = responseSchemas.get(name)!.safeParse(answer);
    if (!checked.success) {
      options.onUnexpected?.(name, checked.error);
      return refused('host_failed', `The host answered ${name} outside the contract; the work on screen is kept.`);
    }
    return checked.data as HostResult<unknown>;
  };
}
