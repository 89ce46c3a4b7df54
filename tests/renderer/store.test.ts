import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { createMemoryHost } from '../../renderer/fakeHost/memoryHost';
import { workspaceHostOver } from '../../renderer/hostPort';
import { createWorkspaceStore } from '../../renderer/state/store';
import { setCell } from '../../renderer/viewModels/recordEdits';

const demo = JSON.parse(readFileSync(fileURLToPath(new URL('../../assets/demo/th-0417.json', import.meta.url)), 'utf8')) as Record<string, unknown>;

/** A storage that survives a "reload" (a second host on the same map), like localStorage. */
function mapStorage() {
  const values = new Map<string, string>();
  return { getItem: (key: string) => values.get(key) ?? null, setItem: (key: string, value: string) => void values.set(key, value) };
}

const settle = () => new Promise((resolve) => setTimeout(resolve, 0));

describe('the workspace store', () => {
  it('saves an accepted edit through the host, keeps a refused one unsaved, and undo and redo walk the edits', async () => {
    const storage = mapStorage();
    const host = workspaceHostOver(createMemoryHost({ 'th-0417.json': demo }, storage));
    const store = createWorkspaceStore();
    await store.getState().connect(host, 'in-page store');
    store.getState().openCase('th-0417.json');
    const rowId = store.getState().draft!.tables.transfusions[0]!.id;

    store.getState().edit((draft) => setCell(draft, 'transfusions', rowId, 'volumeMl', '590'));
    await settle();
    expect(store.getState().saveState).toBe('saved');
    const reopened = await createMemoryHost({}, storage).openCase({ caseId: 'th-0417.json' });
    const savedCase = reopened.ok ? (reopened.value.document as { transfusions: { volume: { value: number } }[] }) : null;
    expect(savedCase?.transfusions[0]!.volume.value).toBe(590);

    store.getState().edit((draft) => setCell(draft, 'transfusions', rowId, 'unitHaematocrit', '60'));
    await settle();
    expect(store.getState().saveState).toBe('unsaved-errors');
    expect(store.getState().draft!.tables.transfusions[0]!.cells.unitHaematocrit).toBe('60');
    const stillStored = await createMemoryHost({}, storage).openCase({ caseId: 'th-0417.json' });
    expect(stillStored.ok && (stillStored.value.document as { transfusions: { unitHaematocrit: number }[] }).transfusions[0]!.unitHaematocrit).toBe(0.62);
    // The screens keep the last accepted case while the record has errors.
    expect(store.getState().accepted?.transfusions[0]).toMatchObject({ unitHaematocrit: 0.62 });

    store.getState().undo();
    await settle();
    expect(store.getState().draft!.tables.transfusions[0]!.cells.unitHaematocrit).toBe('0.62');
    expect(store.getState().saveState).toBe('saved');
    store.getState().undo();
    await settle();
    expect(store.getState().draft!.tables.transfusions[0]!.cells.volumeMl).toBe(String((demo.transfusions as { volume: { value: number } }[])[0]!.volume.value));
    store.getState().redo();
    await settle();
    expect(store.getState().draft!.tables.transfusions[0]!.cells.volumeMl).toBe('590');
  });

  it('refuses a save that does not start from the stored revision (another window changed the file)', async () => {
    const api = createMemoryHost({ 'th-0417.json': demo });
    const host = workspaceHostOver(api);
    await host.listCases();
    const opened = await api.openCase({ caseId: 'th-0417.json' });
    if (!opened.ok) throw new Error('the seeded case did not open');
    await api.saveCase({ caseId: 'th-0417.json', document: opened.value.document, baseRevision: opened.value.revision });
    const refused = await host.saveCase('th-0417.json', demo);
    expect(refused.ok).toBe(false);
    expect(refused.ok ? '' : refused.issues[0]!.message).toMatch(/changed since it was opened/);
  });

  it('reads a workspace with progress, a few cases asked for at once, in the listing order', async () => {
    const names = ['a', 'b', 'c', 'd', 'e', 'f', 'g', 'h', 'i', 'j'].map((it) => `${it}.json`);
    const host = workspaceHostOver(createMemoryHost(Object.fromEntries(names.map((name) => [name, demo]))));
    const reports: string[] = [];
    const listed = await host.listCases({ report: (done, total) => reports.push(`${done}/${total}`), cancelled: () => false });
    expect(reports).toEqual(Array.from({ length: 11 }, (_, done) => `${done}/10`));
    expect(listed.ok && listed.value.map((it) => it.id)).toEqual(names);
  });

  it('starts no new case once cancelled, and keeps those it read, in order', async () => {
    const names = ['a', 'b', 'c', 'd', 'e', 'f', 'g', 'h', 'i', 'j'].map((it) => `${it}.json`);
    const host = workspaceHostOver(createMemoryHost(Object.fromEntries(names.map((name) => [name, demo]))));
    let stop = false;
    const listed = await host.listCases({ report: (done) => (stop = done >= 2), cancelled: () => stop });
    if (!listed.ok) throw new Error('the workspace did not list');
    const ids = listed.value.map((it) => it.id);
    // The cases under way when Cancel came are kept; none after them is read.
    expect(ids.length).toBeGreaterThanOrEqual(2);
    expect(ids.length).toBeLessThan(names.length);
    expect(ids).toEqual(names.slice(0, ids.length));
  });

  it('refuses an import that is not JSON with a message, and lists an imported case', async () => {
    const store = createWorkspaceStore();
    await store.getState().connect(workspaceHostOver(createMemoryHost({})), 'in-page store');
    await store.getState().importCase('{ not json');
    expect(store.getState().message).toMatch(/not JSON/);
    await store.getState().importCase(JSON.stringify(demo));
    expect(store.getState().cases.map((entry) => entry.id)).toEqual(['th-0417.json']);
  });
});
