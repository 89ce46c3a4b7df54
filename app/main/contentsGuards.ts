import { isAppUrl } from './appProtocol';

/** The parts of Electron's WebContents the guards use (injected, so tests need no Electron). */
export interface GuardedContents {
  on(event: 'will-navigate' | 'will-redirect', listener: (event: { preventDefault(): void }, url: string) => void): unknown;
  on(event: 'will-attach-webview', listener: (event: { preventDefault(): void }) => void): unknown;
  setWindowOpenHandler(handler: (details: { url: string }) => { action: 'deny' }): void;
}

/** The parts of Electron's Session the permission guard uses. */
export interface GuardedSession {
  setPermissionRequestHandler(handler: (contents: unknown, permission: string, callback: (granted: boolean) => void) => void): void;
  setPermissionCheckHandler(handler: (contents: unknown, permission: string) => boolean): void;
}

/**
 * Guard every web contents the app creates (checklist items 13 "Disable or
 * limit navigation", 14 "Disable or limit creation of new windows", 12 "Verify
 * WebView options before creation", by refusing webviews): navigation and
 * redirects only within app://renderer, no new windows at all, no webview.
 * Links to the outside are never opened (item 15, shell.openExternal is not
 * used anywhere), so untrusted input cannot reach it.
 */
export function guardContents(contents: GuardedContents): void {
  const stayInApp = (event: { preventDefault(): void }, url: string) => {
    if (!isAppUrl(url)) event.preventDefault();
  };
  contents.on('will-navigate', stayInApp);
  contents.on('will-redirect', stayInApp);
  contents.on('will-attach-webview', (event) => event.preventDefault());
  contents.setWindowOpenHandler(() => ({ action: 'deny' }));
}

/**
 * Deny every permission request and check (checklist item 5, "Handle session
 * permission requests from remote content"): the app needs no camera,
 * microphone, location, notifications, clipboard reading or the like.
 */
export function denyAllPermissions(session: GuardedSession): void {
  session.setPermissionRequestHandler((_contents, _permission, callback) => callback(false));
  session.setPermissionCheckHandler(() => false);
}
