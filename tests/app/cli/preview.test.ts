import { copyFileSync, mkdtempSync } from 'node:fs';
import { request } from 'node:http';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { runPreview } from '../../../app/preview/runPreview';
import { previewTokenHeader } from '../../../core/contract';
import { runWith, tempDir } from './harness';

// Outside references: RFC 6335 §6 (ports 0–1023 are system ports, which an unprivileged user
// cannot open), and the preview's printed address is fetched with Node's own HTTP client.

const appFolder = fileURLToPath(new URL('../../..', import.meta.url));

describe('chelation-ledger preview', () => {
  it('answers --help with its usage and exit 0', async () => {
    const run = await runWith(['preview', '--help']);
    expect(run.code).toBe(0);
    expect(run.out).toMatch(/^Usage: chelation-ledger preview \[<case\.json>\] \[--port N\] \[--workspace DIR\]/);
  });

  it('refuses a system port or a non-number with the accepted range, and unknown options', async () => {
    for (const port of ['80', '70000', 'abc', '1.5']) {
      const run = await runWith(['preview', '--port', port], { startPreview: () => Promise.reject(new Error('must not start')) });
      expect(run.code, port).toBe(2);
      expect(run.err, port).toContain(`--port: "${port}" is not a port this program may open; enter a whole number 1024–65535`);
    }
    const unknown = await runWith(['preview', '--host', '0.0.0.0']);
    expect(unknown.err).toContain('--host: not an option of preview (--port, --workspace).');
  });

  it('prints the address of a server that answers the contract with the token', async () => {
    let stop: (() => Promise<void>) | undefined;
    const run = await runWith(['preview', '--workspace', join(appFolder, 'assets', 'demo')], {
      startPreview: async (options) => {
        const started = await runPreview({ appName: 'chelation-ledger', appVersion: '0.1.0', appFolder, configFolder: mkdtempSync(join(tmpdir(), 'cl-config-')), ...options });
        if (started.ok) stop = started.value.close;
        return started;
      },
    });
    try {
      expect(run.code).toBe(0);
      const url = new URL(/open (\S+)/.exec(run.out)![1]!);
      expect(url.hostname).toBe('127.0.0.1');
      const token = url.searchParams.get('token')!;
      const body = await new Promise<string>((resolvePromise, reject) => {
        const call = request({ host: '127.0.0.1', port: url.port, method: 'POST', path: '/api/appInfo', headers: { 'content-type': 'application/json', [previewTokenHeader]: token } }, (response) => {
          let text = '';
          response.on('data', (chunk) => (text += chunk));
          response.on('end', () => resolvePromise(text));
        });
        call.on('error', reject);
        call.end('{}');
      });
      expect(JSON.parse(body)).toEqual({ ok: true, value: { name: 'chelation-ledger', version: '0.1.0' } });
      expect(run.out).toContain('for review by the prescriber');
    } finally {
      await stop?.();
    }
  });

  it('refuses a workspace that is not a folder, naming it', async () => {
    const missing = join(tempDir(), 'no-such-folder');
    const run = await runWith(['preview', '--workspace', missing], {
      startPreview: (options) => runPreview({ appName: 'chelation-ledger', appVersion: '0.1.0', appFolder, configFolder: tempDir(), ...options }),
    });
    expect(run.code).toBe(1);
    expect(run.err).toBe(`--workspace: ${missing} is not a folder; give the folder that holds the case files.`);
  });

  it('opens a case file given instead of a workspace: its folder becomes the workspace and the page takes it first', async () => {
    const folder = tempDir();
    copyFileSync(join(appFolder, 'assets', 'demo', 'th-0093.json'), join(folder, 'mine.json'));
    let stop: (() => Promise<void>) | undefined;
    const run = await runWith(['preview', join(folder, 'mine.json')], {
      startPreview: async (options) => {
        const started = await runPreview({ appName: 'chelation-ledger', appVersion: '0.1.0', appFolder, configFolder: tempDir(), ...options });
        if (started.ok) stop = started.value.close;
        return started;
      },
    });
    try {
      expect(run.code, run.err).toBe(0);
      const url = new URL(/open (\S+)/.exec(run.out)![1]!);
      const call = (name: string) =>
        new Promise<unknown>((resolvePromise, reject) => {
          const sent = request({ host: '127.0.0.1', port: url.port, method: 'POST', path: `/api/${name}`, headers: { 'content-type': 'application/json', [previewTokenHeader]: url.searchParams.get('token')! } }, (response) => {
            let text = '';
            response.on('data', (chunk) => (text += chunk));
            response.on('end', () => resolvePromise(JSON.parse(text)));
          });
          sent.on('error', reject);
          sent.end('{}');
        });
      expect(await call('currentWorkspace')).toEqual({ ok: true, value: { folder } });
      expect(await call('takeOpenRequest')).toEqual({ ok: true, value: { caseId: 'mine.json', workspaceFolder: folder } });
      expect(await call('takeOpenRequest')).toEqual({ ok: true, value: null });
    } finally {
      await stop?.();
    }
  });

  it('refuses two case files, a file that is not .json, a file with --workspace, and a missing file, naming each', async () => {
    const never = { startPreview: () => Promise.reject(new Error('must not start')) };
    expect((await runWith(['preview', 'a.json', 'b.json'], never)).err).toContain('preview opens one case file; 2 were given (a.json, b.json).');
    expect((await runWith(['preview', 'cases'], never)).err).toContain('cases: preview opens a case file (.json); give a folder of case files as --workspace cases.');
    expect((await runWith(['preview', 'a.json', '--workspace', 'cases'], never)).err).toContain('give a case file or --workspace, not both');
    const missing = join(tempDir(), 'gone.json');
    const run = await runWith(['preview', missing], { startPreview: (options) => runPreview({ appName: 'chelation-ledger', appVersion: '0.1.0', appFolder, configFolder: tempDir(), ...options }) });
    expect(run.code).toBe(1);
    expect(run.err).toBe(`file: ${missing} was asked to open, but there is no such file (moved or deleted?).`);
  });
});
