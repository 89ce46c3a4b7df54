import { mkdirSync, mkdtempSync, readdirSync, readFileSync, statSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it, vi } from 'vitest';
import { createHostDispatch } from '../../../app/host/hostDispatch';
import { createHostServices } from '../../../app/host/hostServices';
import { rendererContentSecurityPolicy } from '../../../app/host/rendererFiles';
import { appEntryUrl, appSchemePrivileges, createAppProtocolHandler, isAppUrl } from '../../../app/main/appProtocol';
import { denyAllPermissions, guardContents, type GuardedContents } from '../../../app/main/contentsGuards';
import { aboutText, applicationMenu, type MenuItemTemplate } from '../../../app/main/menu';
import { isTrustedSender, registerHostIpc, type InvokeEvent } from '../../../app/main/registerHostIpc';
import { mainWindowOptions } from '../../../app/main/windowOptions';
import { channelOf, hostCallNames } from '../../../core/contract';
import { demoEnvironment } from '../host/hostFixtures';

// The outside reference is the Electron security checklist (electronjs.org/docs/latest/
// tutorial/security, "Checklist: Security Recommendations", items numbered as on that page;
// the list was read from memory of that page, not re-fetched here). Each test names its item.
// Electron itself is never loaded: every API is a fake of the shape the main process uses.

const root = fileURLToPath(new URL('../../..', import.meta.url));
const sources = (folder: string): string[] =>
  readdirSync(join(root, folder)).flatMap((name) => {
    const path = join(folder, name);
    return statSync(join(root, path)).isDirectory() ? sources(path) : name.endsWith('.ts') ? [path] : [];
  });

describe('window options (checklist items 2, 3, 4, 6, 8, 9, 10, 11)', () => {
  const preferences = mainWindowOptions('/app/dist/preload/preload.cjs', 'chelation-ledger').webPreferences;
  it('2: no Node.js integration in the page, its workers or its frames', () => {
    expect([preferences.nodeIntegration, preferences.nodeIntegrationInWorker, preferences.nodeIntegrationInSubFrames]).toEqual([false, false, false]);
  });
  it('3: context isolation on', () => expect(preferences.contextIsolation).toBe(true));
  it('4: the renderer sandboxed, and the app enables the sandbox for every renderer', () => {
    expect(preferences.sandbox).toBe(true);
    expect(readFileSync(join(root, 'app/main/main.ts'), 'utf8')).toContain('app.enableSandbox()');
  });
  it('6: web security kept on', () => expect(preferences.webSecurity).toBe(true));
  it('8: no insecure content', () => expect(preferences.allowRunningInsecureContent).toBe(false));
  it('9: no experimental features', () => expect(preferences.experimentalFeatures).toBe(false));
  it('10: no enableBlinkFeatures', () => expect(preferences).not.toHaveProperty('enableBlinkFeatures'));
  it('11: no <webview> tag', () => expect(preferences.webviewTag).toBe(false));
  it('loads the built preload', () => expect(preferences.preload).toBe('/app/dist/preload/preload.cjs'));
});

function fakeContents() {
  const listeners = new Map<string, (event: { preventDefault(): void }, url?: string) => void>();
  let openHandler: ((details: { url: string }) => { action: string }) | undefined;
  const contents: GuardedContents = {
    on: ((event: string, listener: (event: { preventDefault(): void }, url?: string) => void) => listeners.set(event, listener)) as GuardedContents['on'],
    setWindowOpenHandler: (handler) => void (openHandler = handler),
  };
  guardContents(contents);
  const fire = (event: string, url?: string) => {
    const preventDefault = vi.fn();
    listeners.get(event)!({ preventDefault }, url);
    return preventDefault.mock.calls.length > 0;
  };
  return { fire, open: (url: string) => openHandler!({ url }) };
}

describe('navigation, windows and webviews (checklist items 12, 13, 14, 15)', () => {
  it('13: navigation and redirects stay within app://renderer', () => {
    const { fire } = fakeContents();
    expect(fire('will-navigate', 'app://renderer/index.html#case')).toBe(false);
    for (const url of ['https://example.org/', 'file:///etc/passwd', 'app://other/index.html', 'javascript:alert(1)', 'not a url']) {
      expect(fire('will-navigate', url), url).toBe(true);
      expect(fire('will-redirect', url), url).toBe(true);
    }
  });
  it('14: every new window is denied', () => {
    const { open } = fakeContents();
    for (const url of ['https://example.org/', 'app://renderer/index.html', 'about:blank']) expect(open(url)).toEqual({ action: 'deny' });
  });
  it('12: a webview is never attached', () => expect(fakeContents().fire('will-attach-webview')).toBe(true));
  it('15: shell.openExternal is not used anywhere in the app, so no untrusted input can reach it', () => {
    for (const file of [...sources('app'), ...sources('renderer')]) expect(readFileSync(join(root, file), 'utf8'), file).not.toMatch(/openExternal\s*\(|import\s*{[^}]*\bshell\b[^}]*}\s*from\s*'electron'/);
  });
});

describe('permissions (checklist item 5)', () => {
  it('5: every permission request and check is denied', () => {
    let requestHandler: ((contents: unknown, permission: string, callback: (granted: boolean) => void) => void) | undefined;
    let checkHandler: ((contents: unknown, permission: string) => boolean) | undefined;
    denyAllPermissions({ setPermissionRequestHandler: (handler) => void (requestHandler = handler), setPermissionCheckHandler: (handler) => void (checkHandler = handler) });
    for (const permission of ['media', 'geolocation', 'notifications', 'clipboard-read', 'openExternal', 'fileSystem', 'hid', 'serial']) {
      const callback = vi.fn();
      requestHandler!({}, permission, callback);
      expect(callback, permission).toHaveBeenCalledWith(false);
      expect(checkHandler!({}, permission), permission).toBe(false);
    }
  });
});

describe('the app:// protocol (checklist items 1, 7, 18)', () => {
  const base = mkdtempSync(join(tmpdir(), 'chelation-ledger-protocol-'));
  const renderer = join(base, 'renderer');
  mkdirSync(join(renderer, 'assets'), { recursive: true });
  writeFileSync(join(renderer, 'index.html'), '<!doctype html><title>app</title>');
  writeFileSync(join(base, 'secret.txt'), 'outside');
  symlinkSync(join(base, 'secret.txt'), join(renderer, 'assets', 'link.txt'));
  const handle = createAppProtocolHandler(renderer);

  it('1 and 18: the window loads our own secure custom scheme, never file:// or the network', () => {
    expect(appEntryUrl).toBe('app://renderer/index.html');
    expect(appSchemePrivileges[0].privileges).toMatchObject({ standard: true, secure: true, bypassCSP: false });
    const main = readFileSync(join(root, 'app/main/main.ts'), 'utf8');
    expect(main.match(/loadURL\(([^)]*)\)/g)).toEqual(['loadURL(appEntryUrl)']);
    expect(main).not.toMatch(/loadFile|file:\/\//);
  });

  it('7: serves the build with a strict Content-Security-Policy (no eval, no inline or outside script)', async () => {
    const response = await handle(new Request(appEntryUrl));
    expect(response.status).toBe(200);
    expect(await response.text()).toContain('<title>app</title>');
    const policy = response.headers.get('content-security-policy') ?? '';
    expect(policy).toBe(rendererContentSecurityPolicy);
    const directives = Object.fromEntries(policy.split('; ').map((it) => [it.split(' ')[0], it.split(' ').slice(1)]));
    expect(directives['script-src']).toEqual(["'self'"]);
    expect(directives['default-src']).toEqual(["'self'"]);
    expect(directives['object-src']).toEqual(["'none'"]);
    expect(policy).not.toMatch(/unsafe-eval|\*|http:|https:/);
  });

  it('18: refuses a path that leaves the build folder, another host, and a symbolic link out', async () => {
    for (const url of ['app://renderer/..%2f..%2fsecret.txt', 'app://renderer/assets/%2e%2e%2f%2e%2e%2fsecret.txt', 'app://renderer/..%5c..%5csecret.txt', 'app://renderer/assets/link.txt']) {
      const response = await handle(new Request(url));
      expect(response.status, url).toBe(403);
    }
    expect((await handle(new Request('app://other/index.html'))).status).toBe(404);
    expect((await handle(new Request('app://renderer/missing.js'))).status).toBe(404);
    expect(isAppUrl('app://renderer/x')).toBe(true);
    expect(isAppUrl('app://renderer.evil/x')).toBe(false);
  });
});

describe('IPC sender and registration (checklist item 17)', () => {
  const mainFrame = { url: 'app://renderer/index.html' };
  const event = (frame: { url: string } | null, main: unknown = mainFrame): InvokeEvent => ({ senderFrame: frame, sender: { mainFrame: main } });

  it('17: accepts only the main frame of our own page', () => {
    expect(isTrustedSender(event(mainFrame))).toBe(true);
    const iframe = { url: 'app://renderer/index.html' };
    expect(isTrustedSender(event(iframe))).toBe(false);
    for (const url of ['https://example.org/', 'file:///app/index.html', 'app://other/index.html', 'about:blank']) {
      const frame = { url };
      expect(isTrustedSender(event(frame, frame)), url).toBe(false);
    }
    expect(isTrustedSender(event(null))).toBe(false);
  });

  it('registers exactly one handler per contract call; a stranger is refused before the payload is read', async () => {
    const handlers = new Map<string, (event: InvokeEvent, payload: unknown) => Promise<unknown>>();
    const dispatch = vi.fn(createHostDispatch(createHostServices(demoEnvironment())));
    registerHostIpc({ handle: (channel, listener) => void handlers.set(channel, listener) }, dispatch);
    expect([...handlers.keys()]).toEqual(hostCallNames.map(channelOf));
    const refused = await handlers.get(channelOf('openCase'))!(event({ url: 'https://example.org/' }, null), { caseId: 'th-0417.json' });
    expect(refused).toEqual({ ok: false, issues: [expect.objectContaining({ code: 'forbidden' })] });
    expect(dispatch).not.toHaveBeenCalled();
    const answered = (await handlers.get(channelOf('openCase'))!(event(mainFrame), { caseId: 'th-0417.json' })) as { ok: boolean };
    expect(answered.ok).toBe(true);
    expect(dispatch).toHaveBeenCalledWith('openCase', { caseId: 'th-0417.json' });
  });
});

describe('the application menu', () => {
  const labels = (items: readonly MenuItemTemplate[]): string[] => items.flatMap((it) => [...(it.label ? [it.label] : it.role ? [it.role] : []), ...labels(it.submenu ?? [])]);

  it('has open, save, export sheet, print, quit and about, and sends the page its commands', () => {
    const send = vi.fn();
    const print = vi.fn();
    const about = vi.fn();
    const menu = applicationMenu({ send, print, about }, 'linux');
    expect(labels(menu)).toEqual(expect.arrayContaining(['File', 'Open…', 'Save', 'Export sheet…', 'Print…', 'Quit', 'Help', 'About chelation-ledger', 'copy', 'paste']));
    const file = menu[0]!.submenu!;
    for (const item of file) item.click?.();
    expect(send.mock.calls).toEqual([['open'], ['save'], ['export-sheet']]);
    expect(print).toHaveBeenCalledOnce();
    menu.at(-1)!.submenu![0]!.click!();
    expect(about).toHaveBeenCalledOnce();
    expect(labels(applicationMenu({ send, print, about }, 'darwin'))[0]).toBe('appMenu');
  });

  it('says in the About box that it supports, never replaces, the prescriber', () => {
    expect(aboutText('chelation-ledger', '0.1.0')).toMatch(/^chelation-ledger 0\.1\.0\n\n.*for review by the prescriber; follow local protocols/s);
  });
});
