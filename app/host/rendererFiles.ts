import { realpathSync } from 'node:fs';
import { extname, isAbsolute, relative, resolve } from 'node:path';
import { fail, issue, ok, type Result } from '../../core/result';

/**
 * The built renderer's files as both hosts serve them: Electron's `app://`
 * protocol (app/main/appProtocol.ts) and the browser preview (app/preview).
 * One traversal check and one Content-Security-Policy for both.
 */

/**
 * The Content-Security-Policy of every page the hosts serve (Electron security
 * checklist item 7, "Define a Content Security Policy"; directives from the
 * W3C Content Security Policy Level 3 recommendation). Scripts, fonts, images,
 * frames and connections only from the app itself; no eval, no inline script,
 * no plug-ins, no framing. Inline styles are allowed because React and the SVG
 * charts set style attributes; that cannot run code (a modelling choice of ours).
 */
export const rendererContentSecurityPolicy = [
  "default-src 'self'",
  "script-src 'self'",
  "style-src 'self' 'unsafe-inline'",
  "img-src 'self' data:",
  "font-src 'self'",
  "connect-src 'self'",
  "object-src 'none'",
  "base-uri 'none'",
  "form-action 'none'",
  "frame-ancestors 'none'",
  "frame-src 'none'",
  "worker-src 'none'",
].join('; ');

/** Headers every served file carries beside its type. */
export const rendererSecurityHeaders: Readonly<Record<string, string>> = {
  'content-security-policy': rendererContentSecurityPolicy,
  'x-content-type-options': 'nosniff',
  // The preview's page URL carries its token: never send it on in a Referer.
  'referrer-policy': 'no-referrer',
  'cross-origin-opener-policy': 'same-origin',
  'x-frame-options': 'DENY',
};

/** Media types of the files a Vite build writes (IANA media types registry). */
const contentTypes: Readonly<Record<string, string>> = {
  '.html': 'text/html; charset=utf-8',
  '.js': 'text/javascript; charset=utf-8',
  '.mjs': 'text/javascript; charset=utf-8',
  '.css': 'text/css; charset=utf-8',
  '.json': 'application/json; charset=utf-8',
  '.svg': 'image/svg+xml',
  '.png': 'image/png',
  '.ico': 'image/vnd.microsoft.icon',
  '.woff2': 'font/woff2',
  '.woff': 'font/woff',
  '.ttf': 'font/ttf',
  '.txt': 'text/plain; charset=utf-8',
  '.map': 'application/json; charset=utf-8',
};

/** The media type of a served file by its extension; unknown ones are plain bytes. */
export function contentTypeOf(path: string): string {
  return contentTypes[extname(path).toLowerCase()] ?? 'application/octet-stream';
}

/**
 * The file a URL path names inside the renderer's build folder, or a refusal.
 * `/` is `index.html`. Refused ('forbidden'): a path that is not valid
 * percent-encoding, holds a NUL or a backslash, or resolves — after decoding,
 * dot-segment removal and following symbolic links — outside the folder.
 *
 * @param rootFolder - the build folder (dist/renderer), absolute
 * @param urlPathname - the URL's path, still percent-encoded (e.g. '/assets/index-abc.js')
 * @returns the absolute file path inside the folder (it may not exist: the caller answers 404)
 * @example rendererFilePath('/app/dist/renderer', '/%2e%2e/package.json').ok === false
 */
export function rendererFilePath(rootFolder: string, urlPathname: string): Result<string> {
  const refused = fail<string>(issue('forbidden', ['path'], 'That file is not part of the app.'));
  let decoded: string;
  try {
    decoded = decodeURIComponent(urlPathname);
  } catch {
    return refused;
  }
  if (decoded.includes('\0') || decoded.includes('\\') || !decoded.startsWith('/')) return refused;
  const root = resolve(rootFolder);
  const target = resolve(root, `.${decoded.endsWith('/') ? `${decoded}index.html` : decoded}`);
  if (!isInside(root, target)) return refused;
  // A symbolic link inside the folder must not lead out of it either.
  try {
    if (!isInside(realpathSync(root), realpathSync(target))) return refused;
  } catch {
    // A file that does not exist: the caller answers 404.
  }
  return ok(target);
}

function isInside(root: string, target: string): boolean {
  const within = relative(root, target);
  return within !== '' && !within.startsWith('..') && !isAbsolute(within);
}
