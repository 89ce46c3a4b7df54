import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import type { HostApi } from '../../core/contract';
import { createMemoryHost } from '../../renderer/fakeHost/memoryHost';
import { workspaceHostOver } from '../../renderer/hostPort';
import { createWorkspaceStore } from '../../renderer/state/store';
import { setCell } from '../../renderer/viewModels/recordEdits';

// A case file the operating system asks the app to open (app/host/openRequests.ts on the host):
// the page takes the request only when nothing typed would be lost. The host here is the
// in-page one with a request waiting, as the host services answer `takeOpenRequest`
// (tests/app/host/openRequests.test.ts checks that side against the real services).

const read = (name: string) => JSON.parse(readFileSync(fileURLToPath(new URL(`../../assets/demo/${name}`, import.meta.url)), 'utf8')) as Record<string, unknown>;
const settle = () => new Promise((resolve) => setTimeout(resolve, 0));

function hostWithRequest(caseId: string): { api: HostApi; taken: () => number } {
  const memory = createMemoryHost({ 'th-0417.json': read('th-0417.json'), 'th-0093.json': read('th-0093.json') });
  let waiting = true;
  let takes = 0;
  const api: HostApi = {
    ...memory,
    takeOpenRequest: async () => {
      takes += 1;
      const value = waiting ? { caseId, workspaceFolder: '/srv/clinic' } : null;
      waiting = false;
      return { ok: true, value };
    },
  };
  return { api, taken: () => takes };
}

describe('opening a case file the operating system asked for', () => {
  it('opens it on its Record screen when nothing is unsaved', async () => {
    const { api } = hostWithRequest('th-0093.json');
    const store = createWorkspaceStore();
    await store.getState().connect(workspaceHostOver(api), 'desktop app or preview server');
    await store.getState().openRequested();
    expect(store.getState()).toMatchObject({ openId: 'th-0093.json', screen: 'record', openWaiting: false, workspaceFolder: '/srv/clinic' });
    expect(store.getState().accepted?.patient.label).toBe('TH-0093');
  });

  it('waits while the open case has entries to correct, then opens once they are undone', async () => {
    const { api, taken } = hostWithRequest('th-0093.json');
    const store = createWorkspaceStore();
    await store.getState().connect(workspaceHostOver(api), 'desktop app or preview server');
    store.getState().openCase('th-0417.json');
    const rowId = store.getState().draft!.tables.transfusions[0]!.id;
    // A haematocrit of 60 (a percentage typed where a fraction belongs) is refused by core: unsaved.
    store.getState().edit((draft) => setCell(draft, 'transfusions', rowId, 'unitHaematocrit', '60'));
    await settle();
    expect(store.getState().saveState).toBe('unsaved-errors');

    store.getState().hostCommand('open-requested');
    await settle();
    expect(store.getState()).toMatchObject({ openId: 'th-0417.json', openWaiting: true });
    expect(store.getState().message).toContain('it opens when the changes to th-0417.json are saved');
    expect(store.getState().draft!.tables.transfusions[0]!.cells.unitHaematocrit).toBe('60');
    expect(taken()).toBe(0);

    store.getState().undo();
    await settle();
    await settle();
    expect(store.getState()).toMatchObject({ openId: 'th-0093.json', openWaiting: false, screen: 'record' });
    expect(taken()).toBe(1);
  });

  it('nothing waiting: nothing changes; the menu’s Open and Export sheet go to their screens', async () => {
    const { api } = hostWithRequest('th-0093.json');
    const store = createWorkspaceStore();
    await store.getState().connect(workspaceHostOver({ ...api, takeOpenRequest: async () => ({ ok: true, value: null }) }), 'desktop app or preview server');
    store.getState().openCase('th-0417.json');
    await store.getState().openRequested();
    expect(store.getState().openId).toBe('th-0417.json');
    store.getState().hostCommand('export-sheet');
    expect(store.getState().screen).toBe('sheet');
    store.getState().hostCommand('open');
    expect(store.getState().screen).toBe('cases');
  });

  it('a file the host lists no case for is named in a message, and the list is shown', async () => {
    const { api } = hostWithRequest('missing.json');
    const store = createWorkspaceStore();
    await store.getState().connect(workspaceHostOver(api), 'desktop app or preview server');
    await store.getState().openRequested();
    expect(store.getState()).toMatchObject({ openId: null, screen: 'cases' });
    expect(store.getState().message).toBe('missing.json was not found in /srv/clinic; the cases of that folder are listed.');
  });
});
