import { mkdirSync, mkdtempSync, symlinkSync, writeFileSync } from 'node:fs';
import { request as httpRequest } from 'node:http';
import { connect } from 'node:net';
import { networkInterfaces, tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createHostDispatch } from '../../../app/host/hostDispatch';
import { createHostServices } from '../../../app/host/hostServices';
import { rendererContentSecurityPolicy, rendererFilePath } from '../../../app/host/rendererFiles';
import { startPreviewServer, type PreviewServer } from '../../../app/preview/previewServer';
import { previewTokenHeader } from '../../../core/contract';
import { demoEnvironment } from '../host/hostFixtures';

// Outside references: RFC 9110 §15.5.2 (401: no credentials) and §15.5.4 (403: credentials
// refused); OWASP "Path Traversal" for the request forms (raw and percent-encoded "..",
// backslashes, symbolic links); the WHATWG URL standard's dot-segment handling, which is why
// some forms arrive as a harmless in-folder path (404) and others are refused (403); and the
// DNS-rebinding defence of checking the Host header (RFC 9110 §7.2).

interface Answer {
  readonly status: number;
  readonly headers: Record<string, string | string[] | undefined>;
  readonly body: string;
}

function raw(port: number, options: { method?: string; path: string; headers?: Record<string, string>; body?: string }): Promise<Answer> {
  return new Promise((resolvePromise, reject) => {
    const request = httpRequest({ host: '127.0.0.1', port, method: options.method ?? 'GET', path: options.path, headers: options.headers }, (response) => {
      const chunks: Buffer[] = [];
      response.on('data', (chunk: Buffer) => chunks.push(chunk));
      response.on('end', () => resolvePromise({ status: response.statusCode ?? 0, headers: response.headers, body: Buffer.concat(chunks).toString('utf8') }));
    });
    request.on('error', reject);
    request.end(options.body);
  });
}

const secret = 'outside the build folder';
let server: PreviewServer;
let root: string;
let dispatch: ReturnType<typeof createHostDispatch>;

beforeAll(async () => {
  const base = mkdtempSync(join(tmpdir(), 'chelation-ledger-preview-'));
  root = join(base, 'renderer');
  mkdirSync(join(root, 'assets'), { recursive: true });
  writeFileSync(join(root, 'index.html'), '<!doctype html><title>ledger</title>');
  writeFileSync(join(root, 'assets', 'app.js'), 'console.log(1)');
  writeFileSync(join(base, 'secret.txt'), secret);
  symlinkSync(join(base, 'secret.txt'), join(root, 'assets', 'link.txt'));
  dispatch = createHostDispatch(createHostServices(demoEnvironment()));
  server = await startPreviewServer({ rendererRoot: root, dispatch, port: 0 });
});

afterAll(() => server.close());

const call = (name: string, body: unknown, headers: Record<string, string> = {}) =>
  raw(server.port, { method: 'POST', path: `/api/${name}`, headers: { 'content-type': 'application/json', ...headers }, body: JSON.stringify(body) });

describe('the browser preview server', () => {
  it('prints a loopback URL with a fresh token of 32 random bytes', async () => {
    expect(server.url).toBe(`http://127.0.0.1:${server.port}/?token=${server.token}`);
    expect(Buffer.from(server.token, 'base64url')).toHaveLength(32);
    const other = await startPreviewServer({ rendererRoot: root, dispatch, port: 0 });
    expect(other.token).not.toBe(server.token);
    await other.close();
  });

  it('listens on 127.0.0.1 only: no other interface of this machine answers', async () => {
    const addresses = Object.values(networkInterfaces()).flat().filter((it) => it && !it.internal).map((it) => it!.address);
    for (const address of addresses) {
      const outcome = await new Promise<string>((resolvePromise) => {
        const socket = connect({ host: address, port: server.port }, () => (socket.destroy(), resolvePromise('connected')));
        socket.on('error', (error: NodeJS.ErrnoException) => resolvePromise(error.code ?? 'error'));
      });
      expect(outcome, address).not.toBe('connected');
    }
    const loopback = await raw(server.port, { path: '/' });
    expect(loopback.status).toBe(200);
  });

  it('refuses a call without the token (401) and with a wrong one (403), and answers with it', async () => {
    const without = await call('listCases', {});
    expect(without.status).toBe(401);
    expect(JSON.parse(without.body)).toEqual({ ok: false, issues: [expect.objectContaining({ code: 'forbidden' })] });
    const wrong = await call('listCases', {}, { [previewTokenHeader]: `${server.token.slice(0, -1)}x` });
    expect(wrong.status).toBe(403);
    const shorter = await call('listCases', {}, { [previewTokenHeader]: 'abc' });
    expect(shorter.status).toBe(403);
    const right = await call('listCases', {}, { [previewTokenHeader]: server.token });
    expect(right.status).toBe(200);
    expect(JSON.parse(right.body).ok).toBe(true);
  });

  it('does not take the token from the query string, a cookie, or a GET', async () => {
    const inQuery = await raw(server.port, { method: 'POST', path: `/api/listCases?token=${server.token}`, headers: { 'content-type': 'application/json' }, body: '{}' });
    expect(inQuery.status).toBe(401);
    const inCookie = await call('listCases', {}, { cookie: `token=${server.token}` });
    expect(inCookie.status).toBe(401);
    const get = await raw(server.port, { path: '/api/listCases', headers: { [previewTokenHeader]: server.token } });
    expect(get.status).toBe(405);
  });

  it('refuses another site: a foreign Host (DNS rebinding) or Origin, and a form post', async () => {
    const rebound = await raw(server.port, { path: '/', headers: { host: `attacker.example:${server.port}` } });
    expect(rebound.status).toBe(403);
    const foreign = await call('listCases', {}, { [previewTokenHeader]: server.token, origin: 'https://attacker.example' });
    expect(foreign.status).toBe(403);
    const form = await raw(server.port, { method: 'POST', path: '/api/listCases', headers: { [previewTokenHeader]: server.token, 'content-type': 'text/plain' }, body: '{}' });
    expect(form.status).toBe(415);
    expect(foreign.headers['access-control-allow-origin']).toBeUndefined();
  });

  it('checks payloads with the same registration function as the desktop app: answers equal a direct dispatch', async () => {
    const payloads: [string, unknown][] = [
      ['openCase', { caseId: '../../etc/passwd.json' }],
      ['openCase', { caseId: 'th-0417.json', extra: 1 }],
      ['openCase', { caseId: 'th-0417.json' }],
      ['writeSettings', { units: 'imperial' }],
      ['exportSheetPdf', { caseId: 'th-0417.json', asOfDate: '2026-02-30', paper: 'a4' }],
      ['noSuchCall', {}],
    ];
    for (const [name, payload] of payloads) {
      const overHttp = await call(name, payload, { [previewTokenHeader]: server.token });
      const revisionless = (answer: unknown) => JSON.parse(JSON.stringify(answer));
      expect(JSON.parse(overHttp.body), name).toEqual(revisionless(await dispatch(name, payload)));
    }
    const notJson = await raw(server.port, { method: 'POST', path: '/api/listCases', headers: { [previewTokenHeader]: server.token, 'content-type': 'application/json' }, body: '{' });
    expect(notJson.status).toBe(400);
  });

  it('serves the build folder with the Content-Security-Policy and never a file outside it', async () => {
    const page = await raw(server.port, { path: '/' });
    expect(page.body).toContain('<title>ledger</title>');
    expect(page.headers['content-security-policy']).toBe(rendererContentSecurityPolicy);
    expect(page.headers['referrer-policy']).toBe('no-referrer');
    const script = await raw(server.port, { path: '/assets/app.js' });
    expect(script.headers['content-type']).toBe('text/javascript; charset=utf-8');
    for (const path of ['/../secret.txt', '/%2e%2e/secret.txt', '/assets/..%2f..%2fsecret.txt', '/assets/%2e%2e%2f%2e%2e%2fsecret.txt', '/..%5csecret.txt', '/assets/link.txt', '/%00index.html', '/%E0%A4%A']) {
      const answer = await raw(server.port, { path });
      expect([403, 404], path).toContain(answer.status);
      expect(answer.body, path).not.toContain(secret);
    }
    expect((await raw(server.port, { path: '/assets/..%2f..%2fsecret.txt' })).status).toBe(403);
    expect((await raw(server.port, { path: '/assets/link.txt' })).status).toBe(403);
    expect(rendererFilePath(root, '/assets/../../secret.txt').ok).toBe(false);
  });
});
