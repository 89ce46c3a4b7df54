import { describe, expect, it, vi } from 'vitest';
import { createHostDispatch } from '../../../app/host/hostDispatch';
import { createHostServices } from '../../../app/host/hostServices';
import { exposedHostGlobal, hostCallNames, previewTokenHeader } from '../../../core/contract';
import { createHostClient, pickTransport, type HostTransport } from '../../../renderer/host/hostClient';
import { demoEnvironment } from '../../app/host/hostFixtures';

// The client is checked against the contract's rules (design.md §6, style.md habit 9: one
// contract checked at both ends) and, for the preview path, against the Fetch standard's
// Request shape (method, headers, body) that a browser's fetch receives.

function exposedOver(dispatch: ReturnType<typeof createHostDispatch>) {
  return Object.fromEntries(hostCallNames.map((name) => [name, (request: unknown) => dispatch(name, structuredClone(request))]));
}

describe('the renderer host client', () => {
  it('uses the preload\'s exposed calls when the page has them, and gets the host\'s answers', async () => {
    const dispatch = createHostDispatch(createHostServices(demoEnvironment()));
    const fetch = vi.fn();
    const client = createHostClient(pickTransport({ [exposedHostGlobal]: exposedOver(dispatch), location: { origin: 'http://127.0.0.1:1', search: '?token=abc' }, fetch }));
    const info = await client.appInfo({});
    expect(info).toEqual({ ok: true, value: { name: 'chelation-ledger', version: '0.1.0' } });
    const opened = await client.openCase({ caseId: 'th-0417.json' });
    expect(opened.ok && opened.value.caseId).toBe('th-0417.json');
    expect(fetch).not.toHaveBeenCalled();
  });

  it('falls back to HTTP with the token from the page URL, in a header on every call', async () => {
    const dispatch = createHostDispatch(createHostServices(demoEnvironment()));
    const fetch = vi.fn(async (url: string, init: RequestInit) => {
      const name = url.replace('http://127.0.0.1:5173/api/', '');
      return new Response(JSON.stringify(await dispatch(name, JSON.parse(String(init.body)))));
    });
    const client = createHostClient(pickTransport({ location: { origin: 'http://127.0.0.1:5173', search: '?token=s3cret&x=1' }, fetch: fetch as unknown as typeof globalThis.fetch }));
    const listed = await client.listCases({});
    expect(listed.ok && listed.value.length).toBe(2);
    expect(fetch).toHaveBeenCalledWith('http://127.0.0.1:5173/api/listCases', expect.objectContaining({ method: 'POST', headers: expect.objectContaining({ [previewTokenHeader]: 's3cret' }) }));
  });

  it('answers in words when the page has no host at all', async () => {
    const client = createHostClient(pickTransport({ location: { origin: 'http://127.0.0.1:1', search: '' } }));
    const answer = await client.listCases({});
    expect(answer.ok).toBe(false);
    if (!answer.ok) expect(answer.issues[0]?.message).toMatch(/opened without the app behind it/);
  });

  it('refuses a request outside the contract before it leaves the page', async () => {
    const call = vi.fn();
    const client = createHostClient({ call, onMenuCommand: () => () => undefined });
    const answer = await client.openCase({ caseId: '../secret.json' });
    expect(answer.ok).toBe(false);
    if (!answer.ok) expect(answer.issues[0]?.path).toEqual(['caseId']);
    expect(call).not.toHaveBeenCalled();
  });

  it('turns a transport that fails or answers outside the contract into one issue, never a throw', async () => {
    const failing: HostTransport = { call: () => Promise.reject(new Error('socket hang up')), onMenuCommand: () => () => undefined };
    const odd: HostTransport = { call: () => Promise.resolve({ ok: 'yes' }), onMenuCommand: () => () => undefined };
    const failed = await createHostClient(failing).appInfo({});
    const oddAnswer = await createHostClient(odd).appInfo({});
    expect(failed.ok || failed.issues[0]?.code).toBe('host_failed');
    expect(oddAnswer.ok || oddAnswer.issues[0]?.code).toBe('host_failed');
    if (!failed.ok) expect(failed.issues[0]?.message).not.toMatch(/socket/);
  });

  it('passes only the menu commands it knows to its listeners', () => {
    let send: (command: string) => void = () => undefined;
    const client = createHostClient({ call: vi.fn(), onMenuCommand: (listener) => ((send = listener), () => undefined) });
    const heard: string[] = [];
    client.onMenuCommand((command) => heard.push(command));
    send('save');
    send('rm -rf');
    send('export-sheet');
    expect(heard).toEqual(['save', 'export-sheet']);
  });
});
