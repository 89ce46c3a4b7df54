import { EventEmitter } from 'node:events';
import { copyFileSync, mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it, vi } from 'vitest';
import { createHostServices } from '../../../app/host/hostServices';
import { caseFileArgument, caseFileRequest, createOpenRequests } from '../../../app/host/openRequests';
import { listenForCaseFiles, type CaseFileSource } from '../../../app/main/caseFileEvents';
import { demoEnvironment } from './hostFixtures';

// Outside reference: Electron's API documentation for `app` (from memory of that page, not
// re-fetched here): the `open-file` event (macOS; "you should call event.preventDefault() if you
// want to handle this event"; it can fire before `ready`) and `second-instance` (argv and
// workingDirectory of the second start; "argv may include additional Chromium switches"), and
// Node's path.resolve for relative paths. Argument lists below are of the shapes those pages and
// the operating systems give: Windows and Linux pass the file as an argument, unpackaged runs
// (`electron .`) carry the app folder, macOS Finder adds `-psn_…`.

function workspaceWithCase(name = 'ab-0001.json') {
  const folder = mkdtempSync(join(tmpdir(), 'cl-open-'));
  const path = join(folder, name);
  copyFileSync(new URL('../../../assets/demo/th-0093.json', import.meta.url), path);
  return { folder, path };
}

describe('caseFileArgument: the case file on a command line', () => {
  it('finds the file after the executable on Windows and Linux, skipping switches Chromium adds', () => {
    expect(caseFileArgument(['C:\\Apps\\chelation-ledger.exe', '--allow-file-access-from-files', 'D:\\cases\\th-0417.json'], 'C:\\')).toMatch(/th-0417\.json$/);
    expect(caseFileArgument(['/opt/chelation-ledger/chelation-ledger', '--no-sandbox', '/srv/cases/th-0417.json'], '/home/pharm')).toBe('/srv/cases/th-0417.json');
  });
  it('reads a relative path against the directory the (second) start ran in, not this process’s', () => {
    expect(caseFileArgument(['/usr/bin/chelation-ledger', 'clinic/th-0417.json'], '/srv')).toBe('/srv/clinic/th-0417.json');
  });
  it('passes over the app folder of an unpackaged run and macOS’s -psn switch; no .json means no file', () => {
    expect(caseFileArgument(['/usr/lib/electron/electron', '.'], '/work/app')).toBeNull();
    expect(caseFileArgument(['/Applications/chelation-ledger.app/Contents/MacOS/chelation-ledger', '-psn_0_12345'], '/')).toBeNull();
    expect(caseFileArgument(['/usr/lib/electron/electron', '.', 'TH-0417.JSON'], '/srv')).toBe('/srv/TH-0417.JSON');
  });
  it('never takes the executable itself', () => expect(caseFileArgument(['/tmp/odd.json'], '/')).toBeNull());
});

describe('caseFileRequest: what may be opened', () => {
  it('an existing case file: its folder and its name as a case id', () => {
    const { folder, path } = workspaceWithCase();
    expect(caseFileRequest(path)).toEqual({ ok: true, value: { folder, caseId: 'ab-0001.json' } });
  });
  it('refuses a missing file, a folder and a name the workspace cannot hold, naming the path', () => {
    const { folder } = workspaceWithCase();
    const missing = caseFileRequest(join(folder, 'gone.json'));
    expect(missing.ok || missing.issues[0]!.message).toBe(`${join(folder, 'gone.json')} was asked to open, but there is no such file (moved or deleted?).`);
    mkdirSync(join(folder, 'box.json'));
    const box = caseFileRequest(join(folder, 'box.json'));
    expect(box.ok || box.issues[0]!.message).toContain('is a folder, not a case file');
    writeFileSync(join(folder, 'ab#1.json'), '{}');
    const oddName = caseFileRequest(join(folder, 'ab#1.json'));
    expect(oddName.ok || oddName.issues[0]!.message).toContain('rename the file and open it again');
  });
});

describe('the pending request', () => {
  it('keeps the newest, hands it out once, and a refused path leaves the earlier request waiting', () => {
    const first = workspaceWithCase('first.json');
    const second = workspaceWithCase('second.json');
    const requests = createOpenRequests();
    expect(requests.take()).toBeNull();
    requests.offer(first.path);
    requests.offer(second.path);
    expect(requests.offer(join(second.folder, 'missing.json')).ok).toBe(false);
    expect(requests.take()).toEqual({ folder: second.folder, caseId: 'second.json' });
    expect(requests.take()).toBeNull();
  });

  it('takeOpenRequest (the contract call) makes the file’s folder the workspace, so the case opens there', async () => {
    const other = workspaceWithCase('ab-0001.json');
    const requests = createOpenRequests();
    const environment = demoEnvironment({ openRequests: requests });
    const services = createHostServices(environment);
    expect(await services.takeOpenRequest({})).toEqual({ ok: true, value: null });
    expect(environment.workspace.get()).toBe(environment.folder);
    requests.offer(other.path);
    expect(await services.takeOpenRequest({})).toEqual({ ok: true, value: { caseId: 'ab-0001.json', workspaceFolder: other.folder } });
    expect(environment.workspace.get()).toBe(other.folder);
    const opened = await services.openCase({ caseId: 'ab-0001.json' });
    expect(opened.ok && (opened.value.document as { patient: { label: string } }).patient.label).toBe('TH-0093');
    expect(await services.takeOpenRequest({})).toEqual({ ok: true, value: null });
  });
});

describe('listenForCaseFiles: the main process’s three ways in', () => {
  function fakeApp() {
    const emitter = new EventEmitter();
    return { source: emitter as unknown as CaseFileSource, emit: (event: string, ...args: unknown[]) => emitter.emit(event, ...args) };
  }
  it('the first start’s arguments, macOS open-file (default prevented) and a second start’s arguments (window focused)', () => {
    const one = workspaceWithCase('one.json');
    const two = workspaceWithCase('two.json');
    const three = workspaceWithCase('three.json');
    const requests = createOpenRequests();
    const requested = vi.fn();
    const focus = vi.fn();
    const { source, emit } = fakeApp();
    listenForCaseFiles(source, requests, ['/opt/app/chelation-ledger', one.path], '/', { requested, focus });
    expect(requested).toHaveBeenLastCalledWith({ ok: true, value: { folder: one.folder, caseId: 'one.json' } });

    const preventDefault = vi.fn();
    emit('open-file', { preventDefault }, two.path);
    expect(preventDefault).toHaveBeenCalled();
    expect(requested).toHaveBeenLastCalledWith({ ok: true, value: { folder: two.folder, caseId: 'two.json' } });

    emit('second-instance', {}, ['/opt/app/chelation-ledger', '--flag-from-chromium', 'three.json'], three.folder);
    expect(focus).toHaveBeenCalledTimes(1);
    expect(requested).toHaveBeenLastCalledWith({ ok: true, value: { folder: three.folder, caseId: 'three.json' } });
    expect(requests.take()).toEqual({ folder: three.folder, caseId: 'three.json' });

    // A second start with no file only brings the window forward; a missing file is reported, not queued.
    emit('second-instance', {}, ['/opt/app/chelation-ledger'], '/');
    expect(focus).toHaveBeenCalledTimes(2);
    emit('open-file', { preventDefault }, join(three.folder, 'gone.json'));
    expect(requested.mock.lastCall?.[0]).toMatchObject({ ok: false });
    expect(requests.take()).toBeNull();
  });
});
