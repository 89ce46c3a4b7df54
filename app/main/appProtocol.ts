import { readFile } from 'node:fs/promises';
import { contentTypeOf, rendererFilePath, rendererSecurityHeaders } from '../host/rendererFiles';

/**
 * The renderer is served from `app://renderer/…`, not `file://` (Electron
 * security checklist item 18, "Use a custom protocol instead of file://"): a
 * page can then reach only the build folder, never the rest of the disk.
 */
export const appScheme = 'app';
export const appHost = 'renderer';
export const appEntryUrl = `${appScheme}://${appHost}/index.html`;

/**
 * Privileges of the scheme, registered before the app is ready: a standard,
 * secure scheme (so 'self' in the CSP and fetch work), never bypassing CSP.
 */
export const appSchemePrivileges = [
  { scheme: appScheme, privileges: { standard: true, secure: true, supportFetchAPI: true, corsEnabled: false, bypassCSP: false, stream: false } },
] as const;

/**
 * True for a URL of our own pages. Under a custom scheme `new URL(url).origin`
 * is "null", so the protocol and host are compared instead (stack-notes.md).
 *
 * @example isAppUrl('app://renderer/index.html') === true; isAppUrl('https://renderer/') === false
 */
export function isAppUrl(url: string): boolean {
  try {
    const parsed = new URL(url);
    return parsed.protocol === `${appScheme}:` && parsed.host === appHost;
  } catch {
    return false;
  }
}

/**
 * The `protocol.handle('app', …)` handler: the file the URL names inside the
 * build folder with its type and the security headers, 403 for a path that
 * leaves the folder, 404 for another host or a missing file. Uses the Fetch
 * API's Request and Response, which Node has too, so it is tested in Node.
 *
 * @param rendererRoot - the build folder (dist/renderer), absolute
 * @param read - reads a file (tests may pass a fake)
 */
export function createAppProtocolHandler(rendererRoot: string, read: (path: string) => Promise<Uint8Array> = readFile): (request: Request) => Promise<Response> {
  return async (request) => {
    let url: URL;
    try {
      url = new URL(request.url);
    } catch {
      return new Response('Bad request.', { status: 400 });
    }
    if (url.protocol !== `${appScheme}:` || url.host !== appHost || request.method !== 'GET') return new Response('Not found.', { status: 404 });
    const path = rendererFilePath(rendererRoot, url.pathname);
    if (!path.ok) return new Response('That file is not part of the app.', { status: 403 });
    try {
      const content = await read(path.value);
      return new Response(content as BodyInit, { status: 200, headers: { ...rendererSecurityHeaders, 'content-type': contentTypeOf(path.value) } });
    } catch {
      return new Response('Not found.', { status: 404 });
    }
  };
}
