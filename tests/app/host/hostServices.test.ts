import { execFileSync } from 'node:child_process';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import ICAL from 'ical.js';
import { describe, expect, it } from 'vitest';
import { createHostDispatch } from '../../../app/host/hostDispatch';
import { createHostServices } from '../../../app/host/hostServices';
import { insideFolder } from '../../../app/host/workspaceFiles';
import { parseCase } from '../../../core/model/parseCase';
import { readDemo } from '../../core/model/caseFixtures';
import { demoEnvironment } from './hostFixtures';

// Outside references: the demo case files themselves (read straight from assets/ and parsed
// with the case model, not through the host), ical.js 2.2.1 as the independent iCalendar
// (RFC 5545) parser of the exported calendar, and the path-traversal forms of OWASP's
// "Path Traversal" page for the workspace check.

describe('host services over a workspace of the demo cases', () => {
  it('lists one line per case with the label the file carries', async () => {
    const dispatch = createHostDispatch(createHostServices(demoEnvironment()));
    const answer = await dispatch('listCases', {});
    expect(answer.ok).toBe(true);
    if (!answer.ok) return;
    const lines = answer.value as { caseId: string; patientLabel: string; archived: boolean }[];
    expect(lines.map((it) => [it.caseId, it.patientLabel, it.archived])).toEqual([
      ['th-0093.json', (readDemo('th-0093').patient as { label: string }).label, false],
      ['th-0417.json', (readDemo('th-0417').patient as { label: string }).label, false],
    ]);
  });

  it('lists a broken file with the reason instead of skipping it', async () => {
    const environment = demoEnvironment();
    writeFileSync(join(environment.folder, 'broken.json'), '{ "format": ');
    const answer = await createHostDispatch(createHostServices(environment))('listCases', {});
    if (!answer.ok) throw new Error('list failed');
    const broken = (answer.value as { caseId: string; patientLabel: string | null; issues: { message: string }[] }[]).find((it) => it.caseId === 'broken.json');
    expect(broken?.patientLabel).toBeNull();
    expect(broken?.issues[0]?.message).toMatch(/not valid JSON/);
  });

  it('opens a case as the case model reads it, with a revision', async () => {
    const answer = await createHostDispatch(createHostServices(demoEnvironment()))('openCase', { caseId: 'th-0417.json' });
    expect(answer.ok).toBe(true);
    if (!answer.ok) return;
    const parsed = parseCase(readDemo('th-0417'));
    if (!parsed.ok) throw new Error('demo invalid');
    const opened = answer.value as { document: unknown; revision: string };
    expect(opened.document).toEqual(parsed.value);
    // The revision names the file's modification time, size and SHA-256 (FIPS 180-4, as node:crypto computes it).
    expect(opened.revision).toMatch(/^\d+(\.\d+)?\|\d+\|[0-9a-f]{64}$/);
  });

  it('refuses a missing case with its name, and a name that escapes the workspace', async () => {
    const dispatch = createHostDispatch(createHostServices(demoEnvironment()));
    const missing = await dispatch('openCase', { caseId: 'nobody.json' });
    expect(missing.ok).toBe(false);
    if (!missing.ok) expect(missing.issues[0]?.message).toContain('nobody.json');
    for (const name of ['../th-0417.json', '/etc/passwd', 'sub/../../x.json', '..\\x.json']) {
      expect(insideFolder('/work/cases', name).ok, name).toBe(false);
    }
    expect(insideFolder('/work/cases', 'th-0417.json')).toEqual({ ok: true, value: '/work/cases/th-0417.json' });
  });

  it('saves through the case store: the change reaches the file and its journal, and a stale revision is refused', async () => {
    const environment = demoEnvironment();
    const dispatch = createHostDispatch(createHostServices(environment));
    const opened = await dispatch('openCase', { caseId: 'th-0417.json' });
    if (!opened.ok) throw new Error('open failed');
    const { document, revision } = opened.value as { document: { patient: { label: string } }; revision: string };
    const changed = structuredClone(document);
    changed.patient.label = 'TH-0417-R';
    const saved = await dispatch('saveCase', { caseId: 'th-0417.json', document: changed, baseRevision: revision });
    expect(saved.ok, JSON.stringify(saved)).toBe(true);
    // Read back straight from disk with the case model, not through the host.
    const onDisk = parseCase(JSON.parse(readFileSync(join(environment.folder, 'th-0417.json'), 'utf8')));
    expect(onDisk.ok && onDisk.value.patient.label).toBe('TH-0417-R');
    // A second save from the first revision would overwrite the first save silently: refused, file kept.
    const stale = await dispatch('saveCase', { caseId: 'th-0417.json', document, baseRevision: revision });
    expect(stale.ok).toBe(false);
    const still = parseCase(JSON.parse(readFileSync(join(environment.folder, 'th-0417.json'), 'utf8')));
    expect(still.ok && still.value.patient.label).toBe('TH-0417-R');
    // A revision the host never gave is refused before anything is written.
    const forged = await dispatch('saveCase', { caseId: 'th-0417.json', document, baseRevision: 'made-up' });
    expect(forged.ok).toBe(false);
    if (!forged.ok) expect(forged.issues[0]?.path).toEqual(['baseRevision']);
    // The journal records the change, which recover shows as history.
    const recovered = await dispatch('recoverCase', { caseId: 'th-0417.json' });
    if (!recovered.ok) throw new Error(recovered.issues.map((it) => it.message).join('; '));
    expect((recovered.value as { history: { description: string }[] }).history.map((entry) => entry.description)).toContain('edited in the workspace');
  });

  it('creates, saves as, renames and archives through the case store, never deleting', async () => {
    const environment = demoEnvironment();
    const dispatch = createHostDispatch(createHostServices(environment));
    const document = parseCase(readDemo('th-0093'));
    if (!document.ok) throw new Error('demo invalid');
    const created = await dispatch('createCase', { caseId: 'new-case.json', document: document.value as unknown as Record<string, unknown> });
    expect(created.ok, JSON.stringify(created)).toBe(true);
    expect((await dispatch('createCase', { caseId: 'new-case.json', document: document.value as unknown as Record<string, unknown> })).ok).toBe(false);
    expect((await dispatch('saveCaseAs', { newCaseId: 'copy.json', document: document.value as unknown as Record<string, unknown> })).ok).toBe(true);
    const renamed = await dispatch('renameCase', { caseId: 'copy.json', newCaseId: 'renamed.json' });
    expect(renamed.ok && (renamed.value as { caseId: string }).caseId).toBe('renamed.json');
    const archived = await dispatch('archiveCase', { caseId: 'renamed.json' });
    expect(archived.ok && (archived.value as { archived: boolean }).archived).toBe(true);
    expect(existsSync(join(environment.folder, 'renamed.json'))).toBe(false);
    expect(existsSync(join(environment.folder, 'archive', 'renamed.json'))).toBe(true);
  });

  it('lists archived cases after the others, marked archived, as the contract says (the Cases screen keeps them apart)', async () => {
    const environment = demoEnvironment();
    const dispatch = createHostDispatch(createHostServices(environment));
    const before = await dispatch('listCases', {});
    if (!before.ok) throw new Error('list failed');
    const names = (before.value as { caseId: string }[]).map((it) => it.caseId);
    expect((await dispatch('archiveCase', { caseId: names[0]! })).ok).toBe(true);
    const after = await dispatch('listCases', {});
    if (!after.ok) throw new Error('list failed');
    const listed = after.value as { caseId: string; archived: boolean; patientLabel: string | null }[];
    // The same cases, none lost: the archived one last, marked, with its label read from archive/.
    expect(listed.map((it) => [it.caseId, it.archived])).toEqual([...names.slice(1).map((it) => [it, false]), [names[0], true]]);
    expect(listed.at(-1)!.patientLabel).toBe((before.value as { patientLabel: string | null }[])[0]!.patientLabel);
  });

  it('exports the review sheet as a PDF that poppler reads, with the caution on every page, never over an earlier one', async () => {
    const environment = demoEnvironment();
    const dispatch = createHostDispatch(createHostServices(environment));
    const first = await dispatch('exportSheetPdf', { caseId: 'th-0417.json', asOfDate: '2026-11-20', paper: 'a4' });
    if (!first.ok) throw new Error(first.issues.map((it) => it.message).join('; '));
    const path = (first.value as { path: string }).path;
    expect(path).toBe(join(environment.folder, 'exports', 'th-0417-sheet-2026-11-20.pdf'));
    const second = await dispatch('exportSheetPdf', { caseId: 'th-0417.json', asOfDate: '2026-11-20', paper: 'letter' });
    expect(second.ok && (second.value as { path: string }).path).toBe(join(environment.folder, 'exports', 'th-0417-sheet-2026-11-20-2.pdf'));
    // poppler-utils (pdfinfo, pdftotext) is the outside reader of the PDF.
    const pages = Number(/Pages:\s+(\d+)/.exec(execFileSync('pdfinfo', [path], { encoding: 'utf8' }))![1]);
    const text = execFileSync('pdftotext', ['-layout', path, '-'], { encoding: 'utf8' });
    expect(pages).toBeGreaterThan(0);
    expect(text.split('\f').filter((page) => page.trim() !== '').every((page) => /for review by the prescriber/i.test(page.replace(/\s+/g, ' ')))).toBe(true);
    expect(text).toContain('TH-0417');
  }, 60_000);

  it('refuses to choose a folder where there is no dialog, and uses the dialog where there is', async () => {
    const preview = await createHostDispatch(createHostServices(demoEnvironment()))('chooseWorkspace', {});
    expect(preview.ok).toBe(false);
    const environment = demoEnvironment({ chooseFolder: () => Promise.resolve('/chosen/folder') });
    const desktop = await createHostDispatch(createHostServices(environment))('chooseWorkspace', {});
    expect(desktop).toEqual({ ok: true, value: { folder: '/chosen/folder' } });
  });

  it('exports the monitoring calendar into the workspace as iCalendar that ical.js reads, never over an earlier export', async () => {
    const environment = demoEnvironment();
    const dispatch = createHostDispatch(createHostServices(environment));
    const first = await dispatch('exportCalendar', { caseId: 'th-0417.json', asOfDate: '2026-11-20' });
    const second = await dispatch('exportCalendar', { caseId: 'th-0417.json', asOfDate: '2026-11-20' });
    if (!first.ok || !second.ok) throw new Error('export failed');
    const firstPath = (first.value as { path: string }).path;
    expect(firstPath).toBe(join(environment.folder, 'exports', 'th-0417-monitoring-2026-11-20.ics'));
    expect((second.value as { path: string }).path).toBe(join(environment.folder, 'exports', 'th-0417-monitoring-2026-11-20-2.ics'));
    const parsed = new ICAL.Component(ICAL.parse(readFileSync(firstPath, 'utf8')));
    expect(parsed.getAllSubcomponents('vevent').length).toBeGreaterThan(0);
  });

  it('stores settings through the contract and reads them back; a refused value leaves the file alone', async () => {
    const environment = demoEnvironment();
    const dispatch = createHostDispatch(createHostServices(environment));
    expect(await dispatch('readSettings', {})).toEqual({ ok: true, value: { version: 1, units: 'si', paper: 'a4', localFormulary: null, assumptionDefaults: {}, thresholdDefaults: {} } });
    const written = await dispatch('writeSettings', { units: 'conventional', paper: 'letter' });
    expect(written.ok).toBe(true);
    expect(await dispatch('readSettings', {})).toEqual(written);
    const refused = await dispatch('writeSettings', { units: 'imperial' });
    expect(refused.ok).toBe(false);
    if (!refused.ok) expect(refused.issues[0]?.message).toBe('units "imperial" is not one of: si, conventional.');
    expect(await dispatch('readSettings', {})).toEqual(written);
  });

  it('reports a settings file that fails the schema instead of replacing it', async () => {
    const environment = demoEnvironment();
    const settingsPath = join(environment.folder, 'config', 'settings.json');
    const dispatch = createHostDispatch(createHostServices(environment));
    await dispatch('writeSettings', {});
    writeFileSync(settingsPath, JSON.stringify({ paper: 'A5' }));
    const read = await dispatch('readSettings', {});
    expect(read.ok).toBe(false);
    if (!read.ok) expect(read.issues[0]?.message).toBe('paper "A5" is not one of: a4, letter.');
    expect(existsSync(settingsPath) && readFileSync(settingsPath, 'utf8')).toBe('{"paper":"A5"}');
  });
});
