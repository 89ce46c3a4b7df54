import { channelOf, hostCallNames } from '../../core/contract/callNames';
import { issue, type Result } from '../../core/result';
import type { HostDispatch } from '../host/hostDispatch';
import { isAppUrl } from './appProtocol';

/** What an IPC invoke event says about its sender (Electron's IpcMainInvokeEvent, reduced). */
export interface InvokeEvent {
  readonly senderFrame: { readonly url: string } | null;
  readonly sender: { readonly mainFrame: unknown };
}

/** The part of Electron's ipcMain the registration uses. */
export interface IpcMainLike {
  handle(channel: string, listener: (event: InvokeEvent, payload: unknown) => Promise<unknown>): void;
}

/**
 * True when a message comes from our own page's main frame (checklist item
 * 17, "Validate the sender of all IPC messages"): the frame's URL has the
 * app:// protocol and the renderer host (origin is "null" under a custom
 * scheme, so protocol and host are compared), and the frame is the window's
 * main frame, not an iframe.
 */
export function isTrustedSender(event: InvokeEvent): boolean {
  const frame = event.senderFrame;
  return frame !== null && isAppUrl(frame.url) && frame === event.sender.mainFrame;
}

/**
 * The one registration loop over the contract: a handler per call name, each
 * checking the sender before the shared dispatcher validates the payload,
 * runs the service and validates the answer. No other channel is handled.
 */
export function registerHostIpc(ipcMain: IpcMainLike, dispatch: HostDispatch): void {
  for (const name of hostCallNames) {
    ipcMain.handle(channelOf(name), async (event, payload): Promise<Result<unknown>> => {
      if (!isTrustedSender(event)) return { ok: false, issues: [issue('forbidden', [], `${name} was refused: the message did not come from the app's own page.`)] };
      return dispatch(name, payload);
    });
  }
}
