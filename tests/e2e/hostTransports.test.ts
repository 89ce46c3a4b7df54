import { copyFileSync, mkdirSync, mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium, type Browser, type Frame, type Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
// @ts-expect-error the build script is plain JavaScript
import { buildDesktop } from '../../app/build/build-desktop.mjs';
import { createHostDispatch, type HostDispatch } from '../../app/host/hostDispatch';
import { createHostServices } from '../../app/host/hostServices';
import { createOpenRequests, type OpenRequests } from '../../app/host/openRequests';
import { createSettingsStore } from '../../app/host/settingsStore';
import { registerHostIpc, type InvokeEvent } from '../../app/main/registerHostIpc';
import { startPreviewServer, type PreviewServer } from '../../app/preview/previewServer';
import { menuChannel, previewTokenHeader } from '../../core/contract';
import { artifactsDir, buildRenderer, repoRoot } from './browser';

// The desktop app's two transports end to end in Debian's Chromium (the closest these machines
// get to Electron, stack-notes.md): (1) the built renderer with the built preload, run in the
// page beside a fake `electron` module whose ipcRenderer reaches the real IPC registration
// (app/main/registerHostIpc.ts) and host services in Node; (2) the same renderer through the
// preview server with its token. The outside references are the Electron security checklist
// (item 17, sender validation; item 20, no Electron API in the page) and RFC 9110 §15.5.2/§15.5.4
// (401 and 403). Screenshots are kept in tests/e2e/artifacts (git-ignored).

const chromiumFlags = ['--headless', '--no-sandbox', '--disable-gpu', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'];

function demoWorkspace(): { folder: string; config: string } {
  const folder = mkdtempSync(join(tmpdir(), 'chelation-ledger-e2e-host-'));
  for (const name of ['th-0417.json', 'th-0093.json']) copyFileSync(join(repoRoot, 'assets', 'demo', name), join(folder, name));
  return { folder, config: join(folder, '.config') };
}

function dispatchOver(folder: string, config: string, openRequests?: OpenRequests): HostDispatch {
  let workspace: string | null = folder;
  return createHostDispatch(
    createHostServices({
      appName: 'chelation-ledger',
      appVersion: '0.0.0-e2e',
      workspace: { get: () => workspace, set: (next) => (workspace = next) },
      settings: createSettingsStore(join(config, 'settings.json')),
      now: () => new Date(Date.UTC(2026, 10, 20, 9, 0, 0)),
      ...(openRequests ? { openRequests } : {}),
    }),
  );
}

let browser: Browser;
let preloadSource: string;
let rendererFolder: string;

beforeAll(async () => {
  rendererFolder = buildRenderer();
  const desktop = await buildDesktop(mkdtempSync(join(tmpdir(), 'chelation-ledger-e2e-build-')));
  preloadSource = readFileSync(desktop.preload, 'utf8');
  mkdirSync(artifactsDir, { recursive: true });
  browser = await chromium.launch({ executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium', args: chromiumFlags });
}, 120_000);

afterAll(async () => {
  await browser?.close();
});

/**
 * The page as Electron would run it: the built preload evaluated before the page's scripts
 * with a fake `electron` whose contextBridge sets the window global and whose ipcRenderer
 * sends through a Playwright binding to the real registration loop in Node.
 */
async function desktopPage(dispatch: HostDispatch, server: PreviewServer): Promise<{ page: Page; refusedFrames: string[] }> {
  const handlers = new Map<string, (event: InvokeEvent, payload: unknown) => Promise<unknown>>();
  registerHostIpc({ handle: (channel, listener) => void handlers.set(channel, listener) }, dispatch);
  const context = await browser.newContext({ viewport: { width: 1400, height: 900 } });
  const page = await context.newPage();
  // What Electron reports for each frame: our pages come from app://renderer (served here over loopback).
  const fakeFrames = new Map<Frame, { url: string }>();
  const fakeFrame = (frame: Frame) => {
    if (!fakeFrames.has(frame)) fakeFrames.set(frame, { url: frame.url().replace(`http://127.0.0.1:${server.port}`, 'app://renderer') });
    return fakeFrames.get(frame)!;
  };
  const refusedFrames: string[] = [];
  await page.exposeBinding('__electronIpcInvoke', async (source, channel: string, payload: unknown) => {
    const handler = handlers.get(channel);
    if (!handler) return { ok: false, issues: [{ code: 'not_available', path: [], message: `no handler for ${channel}`, severity: 'error' }] };
    const answer = (await handler({ senderFrame: fakeFrame(source.frame), sender: { mainFrame: fakeFrame(page.mainFrame()) } }, payload)) as { ok: boolean; issues?: { code: string }[] };
    if (!answer.ok && answer.issues?.[0]?.code === 'forbidden') refusedFrames.push(source.frame.url());
    return answer;
  });
  await page.addInitScript(`(() => {
    const electron = {
      contextBridge: { exposeInMainWorld: (key, api) => Object.defineProperty(window, key, { value: api, enumerable: true }) },
      ipcRenderer: {
        invoke: (channel, payload) => window.__electronIpcInvoke(channel, payload),
        // Listeners kept so a test can send what the main process sends (webContents.send).
        on: (channel, listener) => void (window.__ipcListeners = [...(window.__ipcListeners || []), [channel, listener]]),
        removeListener: () => undefined,
      },
    };
    const module = { exports: {} };
    new Function('require', 'module', 'exports', ${JSON.stringify(preloadSource)})((name) => { if (name !== 'electron') throw new Error('sandboxed preload required ' + name); return electron; }, module, module.exports);
  })();`);
  return { page, refusedFrames };
}

type Answer = { ok: boolean; value?: unknown; issues?: { code: string; message: string; path: unknown[] }[] };

describe('the desktop transport: built preload, fake electron, real IPC registration and host services', { retry: 2 }, () => {
  it('runs the workspace through the preload, opens the demo case, exports the sheet, and refuses an iframe', async () => {
    const { folder, config } = demoWorkspace();
    const dispatch = dispatchOver(folder, config);
    // The static half of the preview server stands in for app://renderer (same build folder, same CSP).
    const server = await startPreviewServer({ rendererRoot: rendererFolder, dispatch: async () => ({ ok: false, issues: [] as never }), port: 0 });
    const { page, refusedFrames } = await desktopPage(dispatch, server);
    const errors: string[] = [];
    page.on('pageerror', (error) => errors.push(error.message));
    try {
      await page.goto(`http://127.0.0.1:${server.port}/`);
      await page.locator('button[aria-label="Open TH-0417"]').waitFor();
      await page.screenshot({ path: join(artifactsDir, 'desktop-transport-cases.png') });
      await page.locator('button[aria-label="Open TH-0417"]').click();
      await page.click('nav button:has-text("Iron course")');
      expect(await page.locator('.summary').textContent()).toContain('11.4 mg/g dry weight on 2026-11-17');
      await page.screenshot({ path: join(artifactsDir, 'desktop-transport-iron-course.png') });
      await page.click('button:has-text("About")');
      expect(await page.locator('dialog').textContent()).toContain('desktop app or preview server');

      // Host-client level: the exposed calls only, each answering the contract's envelope.
      const exposed = await page.evaluate(() => Object.keys((window as unknown as Record<string, object>)['chelationLedgerHost']!).sort());
      expect(exposed).toContain('openCase');
      expect(exposed).not.toContain('invoke');
      const call = (name: string, request: unknown) =>
        page.evaluate(([callName, payload]) => (window as unknown as Record<string, Record<string, (request: unknown) => Promise<unknown>>>)['chelationLedgerHost']![callName as string]!(payload), [name, request] as const) as Promise<Answer>;
      const opened = await call('openCase', { caseId: 'th-0417.json' });
      expect(opened.ok).toBe(true);
      const exported = await call('exportSheetPdf', { caseId: 'th-0417.json', asOfDate: '2026-11-20', paper: 'a4' });
      expect(exported).toEqual({ ok: true, value: { path: join(folder, 'exports', 'th-0417-sheet-2026-11-20.pdf') } });
      const traversal = await call('openCase', { caseId: '../../etc/passwd.json' });
      expect(traversal.ok).toBe(false);
      expect(traversal.issues?.[0]?.path).toEqual(['caseId']);

      // An iframe of the same page gets the preload too, and every call from it is refused.
      await page.evaluate(() => {
        const frame = document.createElement('iframe');
        frame.src = '/index.html?frame';
        document.body.append(frame);
        return new Promise((resolve) => frame.addEventListener('load', resolve));
      });
      const child = page.frames().find((frame) => frame !== page.mainFrame())!;
      const fromFrame = (await child.evaluate(() => (window as unknown as Record<string, Record<string, (request: unknown) => Promise<unknown>>>)['chelationLedgerHost']!['listCases']!({}))) as Answer;
      expect(fromFrame.ok).toBe(false);
      expect(fromFrame.issues?.[0]?.code).toBe('forbidden');
      expect(refusedFrames.length).toBeGreaterThan(0);
      expect(errors).toEqual([]);
    } finally {
      await page.context().close();
      await server.close();
    }
  }, 120_000);
});

describe('the preview transport: the same renderer over HTTP with the token', { retry: 2 }, () => {
  it('opens the demo case in the page, refuses calls without or with a wrong token, and answers exactly as IPC does', async () => {
    const { folder, config } = demoWorkspace();
    const dispatch = dispatchOver(folder, config);
    const server = await startPreviewServer({ rendererRoot: rendererFolder, dispatch, port: 0 });
    const context = await browser.newContext({ viewport: { width: 1400, height: 900 } });
    const page = await context.newPage();
    const errors: string[] = [];
    page.on('pageerror', (error) => errors.push(error.message));
    try {
      await page.goto(server.url);
      await page.locator('button[aria-label="Open TH-0417"]').click();
      await page.click('nav button:has-text("Record")');
      await page.screenshot({ path: join(artifactsDir, 'preview-transport-record.png'), fullPage: true });

      const post = (name: string, body: unknown, token: string | null) =>
        page.evaluate(
          async ([callName, payload, header, value]) => {
            const response = await fetch(`/api/${callName}`, { method: 'POST', headers: { 'content-type': 'application/json', ...(value ? { [header as string]: value as string } : {}) }, body: JSON.stringify(payload) });
            return { status: response.status, answer: (await response.json()) as unknown };
          },
          [name, body, previewTokenHeader, token] as const,
        );
      expect((await post('listCases', {}, null)).status).toBe(401);
      expect((await post('listCases', {}, 'not-the-token')).status).toBe(403);

      // Open, change a value, save, reopen, export: at the contract's level, as the workspace does it.
      const opened = (await post('openCase', { caseId: 'th-0417.json' }, server.token)).answer as { ok: true; value: { document: Record<string, unknown>; revision: string } };
      expect(opened.ok).toBe(true);
      const changed = structuredClone(opened.value.document) as { patient: { label: string } };
      changed.patient.label = 'TH-0417-R';
      const saved = (await post('saveCase', { caseId: 'th-0417.json', document: changed, baseRevision: opened.value.revision }, server.token)).answer as Answer;
      const reopened = (await post('openCase', { caseId: 'th-0417.json' }, server.token)).answer as { ok: true; value: { document: { patient: { label: string } } } };
      expect(reopened.ok).toBe(true);
      // The save goes through the case store: the reopened case carries the change.
      expect(saved.ok, JSON.stringify(saved)).toBe(true);
      expect(reopened.value.document.patient.label).toBe('TH-0417-R');
      const sheet = (await post('exportSheetPdf', { caseId: 'th-0417.json', asOfDate: '2026-11-20', paper: 'letter' }, server.token)).answer;
      expect(sheet).toEqual({ ok: true, value: { path: join(folder, 'exports', 'th-0417-sheet-2026-11-20.pdf') } });

      // The same payloads through the IPC registration give the same answers (one registration function).
      const handlers = new Map<string, (event: InvokeEvent, payload: unknown) => Promise<unknown>>();
      registerHostIpc({ handle: (channel, listener) => void handlers.set(channel, listener) }, dispatch);
      const mainFrame = { url: 'app://renderer/index.html' };
      for (const [name, payload] of [
        ['openCase', { caseId: '../secret.json' }],
        ['openCase', { caseId: 'th-0417.json', more: true }],
        ['writeSettings', { paper: 'A5' }],
        ['exportCalendar', { caseId: 'th-0093.json', asOfDate: '2026-13-01' }],
      ] as const) {
        const overHttp = (await post(name, payload, server.token)).answer;
        const overIpc = await handlers.get(`host:${name}`)!({ senderFrame: mainFrame, sender: { mainFrame } }, payload);
        expect(overHttp, name).toEqual(JSON.parse(JSON.stringify(overIpc)));
      }
      expect(errors).toEqual([]);
    } finally {
      await context.close();
      await server.close();
    }
  }, 120_000);
});

describe('a case file the operating system asks the desktop app to open (file association)', { retry: 2 }, () => {
  it('opens the file the app was started with, then one asked for while it runs, from another folder', async () => {
    const { folder, config } = demoWorkspace();
    const elsewhere = mkdtempSync(join(tmpdir(), 'chelation-ledger-e2e-elsewhere-'));
    copyFileSync(join(repoRoot, 'assets', 'demo', 'th-0093.json'), join(elsewhere, 'ab-0001.json'));
    const openRequests = createOpenRequests();
    // As main.ts does with process.argv at start-up (listenForCaseFiles, tested in Node).
    expect(openRequests.offer(join(folder, 'th-0417.json')).ok).toBe(true);
    const dispatch = dispatchOver(folder, config, openRequests);
    const server = await startPreviewServer({ rendererRoot: rendererFolder, dispatch: async () => ({ ok: false, issues: [] as never }), port: 0 });
    const { page } = await desktopPage(dispatch, server);
    const errors: string[] = [];
    page.on('pageerror', (error) => errors.push(error.message));
    try {
      await page.goto(`http://127.0.0.1:${server.port}/`);
      // No click: the page took the request at start and shows the case's record.
      await page.locator('.case-label', { hasText: 'TH-0417' }).waitFor();
      expect(await page.locator('main h1').textContent()).toBe('Record');

      // While it runs: main offers the file (open-file or second-instance) and sends 'open-requested'.
      expect(openRequests.offer(join(elsewhere, 'ab-0001.json')).ok).toBe(true);
      await page.evaluate((channel) => {
        for (const [name, listener] of (window as unknown as { __ipcListeners: [string, (event: unknown, command: string) => void][] }).__ipcListeners) {
          if (name === channel) listener({}, 'open-requested');
        }
      }, menuChannel);
      await page.locator('.case-label', { hasText: 'TH-0093' }).waitFor();
      expect(await dispatch('currentWorkspace', {})).toEqual({ ok: true, value: { folder: elsewhere } });
      await page.click('nav button:has-text("Cases")');
      // The Cases screen now lists the other folder's one case, and names the folder.
      expect(await page.locator('button[aria-label^="Open "]').count()).toBe(1);
      expect(await page.locator('main p[aria-live]').textContent()).toBe(`1 case in ${elsewhere}`);
      await page.screenshot({ path: join(artifactsDir, 'desktop-open-file-cases.png') });
      expect(errors).toEqual([]);
    } finally {
      await page.context().close();
      await server.close();
    }
  }, 120_000);
});
