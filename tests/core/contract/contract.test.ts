import { describe, expect, it } from 'vitest';
import { caseIdSchema, defaultSettings, hostCallNames, hostContract, hostResultSchema, settingsSchema, workIdSchema } from '../../../core/contract';
import { issueCodes } from '../../../core/result';

// Outside references: the call list is the one issues 14 and 15 (progress and cancel) of this project's tracker set for the
// host contract; the path-traversal names are the classic forms listed by OWASP's "Path
// Traversal" attack page (../, absolute paths, backslashes, encoded dots) and RFC 3986 §5.2.4
// (dot-segment removal), which any file name the renderer sends must not be able to use.

describe('host contract', () => {
  it('declares exactly the calls its name list exposes, each with a request and a response schema', () => {
    expect(Object.keys(hostContract).sort()).toEqual([...hostCallNames].sort());
    for (const name of hostCallNames) {
      expect(typeof hostContract[name].summary, name).toBe('string');
      expect(typeof hostContract[name].request.safeParse, name).toBe('function');
      expect(typeof hostContract[name].response.safeParse, name).toBe('function');
    }
  });

  it('has every call the design asks for: cases, workspace, import, exports, settings, version', () => {
    for (const required of ['listCases', 'openCase', 'createCase', 'saveCase', 'saveCaseAs', 'renameCase', 'archiveCase', 'recoverCase', 'chooseWorkspace', 'importDryRun', 'importCommit', 'workProgress', 'cancelWork', 'exportSheetPdf', 'exportCalendar', 'readSettings', 'writeSettings', 'appInfo']) {
      expect(hostCallNames).toContain(required);
    }
  });

  it('answers only { ok: true, value } or { ok: false, issues } with at least one issue', () => {
    const schema = hostResultSchema(hostContract.appInfo.response);
    expect(schema.safeParse({ ok: true, value: { name: 'x', version: '1' } }).success).toBe(true);
    expect(schema.safeParse({ ok: false, issues: [] }).success).toBe(false);
    expect(schema.safeParse({ ok: false, issues: [{ code: 'not_available', path: [], message: 'm', severity: 'error' }] }).success).toBe(true);
    expect(schema.safeParse({ ok: false, issues: [{ code: 'no-such-code', path: [], message: 'm', severity: 'error' }] }).success).toBe(false);
    expect(schema.safeParse({ ok: true, value: { name: 'x' } }).success).toBe(false);
    expect(schema.safeParse({ value: { name: 'x', version: '1' } }).success).toBe(false);
    // Every issue code of core/result crosses the boundary.
    for (const code of issueCodes) {
      expect(schema.safeParse({ ok: false, issues: [{ code, path: ['a', 0], message: 'm', severity: 'warning' }] }).success, code).toBe(true);
    }
  });
});

describe('case ids', () => {
  it('accepts plain case file names', () => {
    for (const name of ['th-0417.json', 'TH 0093 (copy).json', 'case_1.v2.json']) expect(caseIdSchema.safeParse(name).success, name).toBe(true);
  });

  it('refuses every path-traversal form OWASP lists, folders, hidden files and other extensions', () => {
    for (const name of ['../th-0417.json', '..\\th-0417.json', 'sub/th-0417.json', '/etc/passwd.json', 'C:\\cases\\a.json', '%2e%2e%2fa.json', '.hidden.json', 'a..json', 'case.txt', 'case.json/..', '', 'a'.repeat(200) + '.json', 'th\u00000417.json']) {
      expect(caseIdSchema.safeParse(name).success, JSON.stringify(name)).toBe(false);
    }
  });
});

describe('work ids', () => {
  it('accepts 8 to 64 letters, digits, _ or - (the page makes 24 hex digits), and nothing else', () => {
    for (const id of ['3f9a0c1d2e4b5a6978c0d1e2', 'a'.repeat(8), 'Z'.repeat(64), 'import_run-01']) expect(workIdSchema.safeParse(id).success, id).toBe(true);
    // Each side of both bounds, and the path-traversal and separator forms the case ids refuse too.
    for (const id of ['a'.repeat(7), 'a'.repeat(65), '', '../../etc/x', 'with space 1', 'tab\there12', 'ünïcödé-id', '%2e%2e%2fabcd']) expect(workIdSchema.safeParse(id).success, JSON.stringify(id)).toBe(false);
  });

  it('is what the progress and cancel calls take, and an import may carry', () => {
    expect(hostContract.workProgress.request.safeParse({ workId: 'a'.repeat(24) }).success).toBe(true);
    expect(hostContract.cancelWork.request.safeParse({ workId: 'a'.repeat(24), more: 1 }).success).toBe(false);
    const request = { caseId: 'th-0417.json', kind: 'csv-results', sourceName: 'lab.csv', sourceText: 'date\n' };
    expect(hostContract.importDryRun.request.safeParse(request).success).toBe(true);
    expect(hostContract.importDryRun.request.safeParse({ ...request, workId: 'a'.repeat(24) }).success).toBe(true);
    expect(hostContract.importCommit.request.safeParse({ ...request, baseRevision: 'r', workId: 'short' }).success).toBe(false);
    expect(hostContract.workProgress.response.safeParse(null).success).toBe(true);
    expect(hostContract.workProgress.response.safeParse({ step: 'Reading lab.csv', done: 1, total: 4 }).success).toBe(true);
    expect(hostContract.workProgress.response.safeParse({ step: 'Reading lab.csv', done: -1, total: 4 }).success).toBe(false);
  });
});

describe('settings', () => {
  it('reads an empty object as every default', () => {
    expect(defaultSettings).toEqual({ version: 1, units: 'si', paper: 'a4', localFormulary: null, assumptionDefaults: {}, thresholdDefaults: {} });
  });

  it('refuses unknown fields and values outside the choices', () => {
    expect(settingsSchema.safeParse({ theme: 'dark' }).success).toBe(false);
    expect(settingsSchema.safeParse({ units: 'imperial' }).success).toBe(false);
    expect(settingsSchema.safeParse({ paper: 'A5' }).success).toBe(false);
  });

  it('checks local-protocol thresholds with the same rule as a case file (catalogued id, override range)', () => {
    const at = '2026-11-01';
    const good = settingsSchema.safeParse({ thresholdDefaults: { 'deferasirox-egfr-lower': { value: 45, reason: 'local renal protocol', by: 'Pharmacist AB', at } } });
    expect(good.success).toBe(true);
    const unknown = settingsSchema.safeParse({ thresholdDefaults: { 'no-such-threshold': { value: 1, reason: 'r', by: 'b', at } } });
    expect(unknown.success).toBe(false);
    expect(unknown.error?.issues[0]?.path).toEqual(['thresholdDefaults', 'no-such-threshold']);
  });
});
