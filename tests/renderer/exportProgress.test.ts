import { existsSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { createHostDispatch } from '../../app/host/hostDispatch';
import { createHostServices } from '../../app/host/hostServices';
import { createHostClient } from '../../renderer/host';
import { workspaceHostOver } from '../../renderer/hostPort';
import { createWorkspaceStore } from '../../renderer/state/store';
import { busyBar, busyText, exportOutcomeText, exportStoppingStep } from '../../renderer/viewModels/busy';
import { demoEnvironment } from '../app/host/hostFixtures';

// The Sheet screen's exports as the page runs them: the store over the real host services (the
// contract's exportSheetPdf and exportCalendar, followed with workProgress and cancelled with
// cancelWork), on a copy of the demo workspace. The exports folder is read back from disk.

function workspace() {
  const environment = demoEnvironment();
  const dispatch = createHostDispatch(createHostServices(environment));
  const client = createHostClient({ call: (name, request) => dispatch(name, request), onMenuCommand: () => () => undefined });
  const exported = () => (existsSync(join(environment.folder, 'exports')) ? readdirSync(join(environment.folder, 'exports')) : []);
  return { host: workspaceHostOver(client), exported };
}

const settle = () => new Promise((resolve) => setTimeout(resolve, 5));
async function until(check: () => boolean): Promise<void> {
  for (let step = 0; step < 2000 && !check(); step += 1) await settle();
}

describe('exports from the Sheet screen', () => {
  it('writes the review sheet and says where', async () => {
    const { host, exported } = workspace();
    const store = createWorkspaceStore();
    await store.getState().connect(host, 'in-page store');
    store.getState().openCase('th-0417.json');
    await store.getState().exportSheet('2026-11-20');
    expect(store.getState().busy).toBeNull();
    expect(exported()).toEqual(['th-0417-sheet-2026-11-20.pdf']);
    expect(store.getState().lastExport).toMatch(/^Review sheet written to .*th-0417-sheet-2026-11-20\.pdf$/);
  });

  it('stops the review sheet when Cancel is pressed while the host reports a step: no file, and the screen says so', async () => {
    const { host, exported } = workspace();
    const store = createWorkspaceStore();
    await store.getState().connect(host, 'in-page store');
    store.getState().openCase('th-0417.json');
    const exporting = store.getState().exportSheet('2026-11-20');
    // The first step the host reports (polled every 250 ms while the sheet is made).
    await until(() => store.getState().busy?.step !== undefined);
    const shown = store.getState().busy!;
    expect(busyText(shown)).toMatch(/^Writing the review sheet: .+ \(step [1-4] of 4\)$/);
    expect(busyBar(shown)).toMatchObject({ label: 'Writing the review sheet', max: 4 });
    store.getState().cancelBusy();
    expect(store.getState().busy?.step).toBe(exportStoppingStep);
    await exporting;
    expect(store.getState().busy).toBeNull();
    expect(store.getState().lastExport).toBe(exportOutcomeText('review sheet', 'stopped'));
    expect(store.getState().lastExport).toBe('Export stopped: the review sheet was not written.');
    expect(exported()).toEqual([]);
  });

  it('words a workspace being read, and an export the host can no longer stop', () => {
    expect(busyText({ label: 'Reading the workspace', done: 120, total: 1000 })).toBe('Reading the workspace: 120 of 1,000');
    expect(busyText({ label: 'Reading the workspace', done: 0, total: null })).toBe('Reading the workspace…');
    expect(busyBar({ label: 'Reading the workspace', done: 0, total: null })).toEqual({ label: 'Reading the workspace', value: null, max: null });
    expect(exportOutcomeText('monitoring calendar', { location: '/w/exports/a.ics', cancelAsked: true })).toBe('Too late to stop: the host had begun writing; monitoring calendar written to /w/exports/a.ics');
  });
});
