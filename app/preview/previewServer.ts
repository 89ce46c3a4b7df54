import { randomBytes, timingSafeEqual } from 'node:crypto';
import { readFile } from 'node:fs/promises';
import { createServer, type IncomingMessage, type Server, type ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';
import { previewApiPath, previewTokenHeader, previewTokenParameter } from '../../core/contract';
import { issue, type Issue } from '../../core/result';
import type { HostDispatch } from '../host/hostDispatch';
import { contentTypeOf, rendererFilePath, rendererSecurityHeaders } from '../host/rendererFiles';

/**
 * The browser preview: the built renderer and the host contract over HTTP,
 * on the loopback interface only, so the whole app runs in a browser where
 * Electron cannot (design.md §2). Node's own http module serves it; the
 * surface is two routes and small enough not to need a framework.
 *
 * - Binds 127.0.0.1 and nothing else; refuses a Host header that is not the
 *   loopback address and port (a DNS-rebinding page names another host).
 * - Every call needs the per-run token (32 random bytes) in a header: none is
 *   401, a wrong one 403 (RFC 9110 §15.5.2 and §15.5.4). A header, not a
 *   cookie, so another site's page in the same browser cannot send it; calls
 *   are POSTs of JSON only, and no CORS headers are ever sent.
 * - Payloads go through the same registration function as Electron's IPC
 *   (app/host/hostDispatch.ts), so they are checked exactly the same way.
 * - Static files come only from the renderer's build folder (rendererFiles.ts).
 */
export const loopbackHost = '127.0.0.1';

/** The largest call body read: the contract's largest request (an import of 5 MB of text) with room for JSON escaping. */
const maxBodyBytes = 12_000_000;

export interface PreviewServerOptions {
  /** The renderer's build folder (dist/renderer), absolute. */
  readonly rendererRoot: string;
  readonly dispatch: HostDispatch;
  /** 0 picks a free port. */
  readonly port?: number;
  /** Tests may fix the token; the command line never does. */
  readonly token?: string;
}

export interface PreviewServer {
  /** The page's address with its token: what the command prints. */
  readonly url: string;
  readonly port: number;
  readonly token: string;
  close(): Promise<void>;
}

function send(response: ServerResponse, status: number, body: string | Buffer, headers: Record<string, string>): void {
  response.writeHead(status, { ...rendererSecurityHeaders, 'cache-control': 'no-store', ...headers });
  response.end(body);
}

function sendIssues(response: ServerResponse, status: number, issues: readonly Issue[]): void {
  send(response, status, JSON.stringify({ ok: false, issues }), { 'content-type': 'application/json; charset=utf-8' });
}

function sameSecret(given: string, expected: string): boolean {
  const givenBytes = Buffer.from(given);
  const expectedBytes = Buffer.from(expected);
  return givenBytes.length === expectedBytes.length && timingSafeEqual(givenBytes, expectedBytes);
}

function readBody(request: IncomingMessage): Promise<Buffer | 'too-large'> {
  return new Promise((resolvePromise, reject) => {
    const chunks: Buffer[] = [];
    let size = 0;
    request.on('data', (chunk: Buffer) => {
      size += chunk.length;
      if (size > maxBodyBytes) {
        resolvePromise('too-large');
        request.destroy();
        return;
      }
      chunks.push(chunk);
    });
    request.on('end', () => resolvePromise(Buffer.concat(chunks)));
    request.on('error', reject);
  });
}

/**
 * Start the preview server.
 *
 * @param options - the build folder, the dispatcher over the host services, the port (0 = any free one)
 * @returns the running server with its URL (`http://127.0.0.1:PORT/?token=…`), or rejects if the port is taken
 */
export async function startPreviewServer(options: PreviewServerOptions): Promise<PreviewServer> {
  const token = options.token ?? randomBytes(32).toString('base64url');
  let port = 0;
  const allowedHosts = () => [`${loopbackHost}:${port}`, `localhost:${port}`];

  async function answerCall(request: IncomingMessage, response: ServerResponse, name: string): Promise<void> {
    if (request.method !== 'POST') {
      sendIssues(response, 405, [issue('forbidden', [], 'Host calls are POST requests.')]);
      return;
    }
    const given = request.headers[previewTokenHeader];
    if (typeof given !== 'string' || given === '') {
      sendIssues(response, 401, [issue('forbidden', [], 'This call carries no token; open the address the preview printed.')]);
      return;
    }
    if (!sameSecret(given, token)) {
      sendIssues(response, 403, [issue('forbidden', [], 'This call carries a wrong token; open the address the preview printed.')]);
      return;
    }
    const origin = request.headers.origin;
    if (origin !== undefined && !allowedHosts().some((host) => origin === `http://${host}`)) {
      sendIssues(response, 403, [issue('forbidden', [], 'Calls from another site are refused.')]);
      return;
    }
    if (!(request.headers['content-type'] ?? '').startsWith('application/json')) {
      sendIssues(response, 415, [issue('forbidden', [], 'Host calls carry JSON (content-type application/json).')]);
      return;
    }
    const body = await readBody(request);
    if (body === 'too-large') {
      sendIssues(response, 413, [issue('out_of_range', [], `The request is larger than ${maxBodyBytes / 1_000_000} MB.`)]);
      return;
    }
    let payload: unknown;
    try {
      payload = body.length === 0 ? {} : JSON.parse(body.toString('utf8'));
    } catch {
      sendIssues(response, 400, [issue('invalid_file', [], `The request to ${name} is not valid JSON.`)]);
      return;
    }
    const answer = await options.dispatch(name, payload);
    send(response, 200, JSON.stringify(answer), { 'content-type': 'application/json; charset=utf-8' });
  }

  async function answerFile(request: IncomingMessage, response: ServerResponse, pathname: string): Promise<void> {
    if (request.method !== 'GET' && request.method !== 'HEAD') {
      send(response, 405, 'Method not allowed.', { 'content-type': 'text/plain; charset=utf-8', allow: 'GET, HEAD' });
      return;
    }
    const path = rendererFilePath(options.rendererRoot, pathname);
    if (!path.ok) {
      send(response, 403, 'That file is not part of the app.', { 'content-type': 'text/plain; charset=utf-8' });
      return;
    }
    try {
      const content = await readFile(path.value);
      send(response, 200, request.method === 'HEAD' ? Buffer.alloc(0) : content, { 'content-type': contentTypeOf(path.value) });
    } catch {
      const message = pathname === '/' || pathname === '/index.html' ? 'The screens are not built yet: run "npm run build:renderer", then reload.' : 'No such file in the app.';
      send(response, 404, message, { 'content-type': 'text/plain; charset=utf-8' });
    }
  }

  const server: Server = createServer((request, response) => {
    void (async () => {
      if (!allowedHosts().includes(request.headers.host ?? '')) {
        send(response, 403, 'This server answers only on its loopback address.', { 'content-type': 'text/plain; charset=utf-8' });
        return;
      }
      let pathname: string;
      try {
        pathname = new URL(request.url ?? '/', `http://${loopbackHost}`).pathname;
      } catch {
        send(response, 400, 'Bad request.', { 'content-type': 'text/plain; charset=utf-8' });
        return;
      }
      if (pathname.startsWith(previewApiPath)) await answerCall(request, response, pathname.slice(previewApiPath.length));
      else await answerFile(request, response, pathname);
    })().catch(() => {
      // A fault of ours: one line, never a trace, and the server keeps running.
      if (!response.headersSent) sendIssues(response, 500, [issue('host_failed', [], 'The preview server failed on this request; the work on screen is kept.')]);
      else response.destroy();
    });
  });

  await new Promise<void>((resolvePromise, reject) => {
    server.once('error', reject);
    server.listen(options.port ?? 0, loopbackHost, () => {
      server.off('error', reject);
      resolvePromise();
    });
  });
  port = (server.address() as AddressInfo).port;
  return {
    url: `http://${loopbackHost}:${port}/?${previewTokenParameter}=${token}`,
    port,
    token,
    close: () =>
      new Promise<void>((resolvePromise) => {
        server.closeAllConnections();
        server.close(() => resolvePromise());
      }),
  };
}
