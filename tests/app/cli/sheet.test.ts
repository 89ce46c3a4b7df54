import { spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
// @ts-expect-error plain ESM build script without type declarations
import { buildCli, cliBundleFile } from '../../../app/build/build-cli.mjs';
import { cli, demoCase, runWith, tempDir } from './harness';

const demo = demoCase('th-0417');
// Rendering a PDF takes seconds on a shared two-core machine: a generous ceiling, not a speed check (that is npm run bench).
const renderCeilingMs = 60_000;

describe('sheet command', () => {
  it('writes the PDF and says where, with the case hash and the caution', async () => {
    const path = join(tempDir(), 'review.pdf');
    const run = await cli('sheet', demo, '-o', path);
    expect(run.code, run.err).toBe(0);
    expect(readFileSync(path).subarray(0, 5).toString()).toBe('%PDF-');
    expect(run.out).toContain(`to ${path}`);
    expect(run.out).toMatch(/Case file SHA-256 [0-9a-f]{64}\./);
    expect(run.out).toContain('for review by the prescriber');
  }, renderCeilingMs);

  it('leaves an existing file alone without --force, and replaces it with --force', async () => {
    const path = join(tempDir(), 'review.pdf');
    writeFileSync(path, 'the previous sheet');
    const refused = await cli('sheet', demo, '-o', path);
    expect(refused.code).toBe(1);
    expect(refused.err).toContain('exists already');
    expect(readFileSync(path, 'utf8')).toBe('the previous sheet');
    const forced = await cli('sheet', demo, '-o', path, '--force');
    expect(forced.code, forced.err).toBe(0);
    expect(readFileSync(path).subarray(0, 5).toString()).toBe('%PDF-');
  }, renderCeilingMs);

  it('refuses a wrong paper size, a missing output and a bad review date, naming the flag and the value', async () => {
    const path = join(tempDir(), 'review.pdf');
    const paper = await cli('sheet', demo, '-o', path, '--paper', 'a5');
    expect(paper.code).toBe(1);
    expect(paper.err).toContain('--paper: "a5" is not a paper size of the sheet (a4 or letter)');
    const noOutput = await cli('sheet', demo);
    expect(noOutput.code).toBe(2);
    expect(noOutput.err).toContain('Usage:');
    const date = await cli('sheet', demo, '-o', path, '--as-of', '2026-13-01');
    expect(date.code).toBe(1);
    expect(date.err).toContain('--as-of: "2026-13-01"');
    const notPdf = await cli('sheet', demo, '-o', join(tempDir(), 'review.txt'));
    expect(notPdf.err).toContain('does not end in .pdf');
  });

  it('passes the paper, review date and author to the writer (fake host)', async () => {
    const seen: { paper?: string; reviewDate?: string; preparedBy?: string | null; path?: string; overwrite?: boolean } = {};
    const run = await runWith(['sheet', demo, '-o', 'x.pdf', '--paper', 'letter', '--as-of', '2026-06-01', '--prepared-by', 'Pharmacist CD'], {
      hashCaseFile: () => ({ ok: true, value: 'b'.repeat(64) }),
      renderSheet: async (sheet, options) => {
        seen.paper = options.paper;
        seen.reviewDate = sheet.header.reviewDate;
        seen.preparedBy = sheet.header.preparedBy;
        return Buffer.from('%PDF-fake');
      },
      writeSheet: async (path, _bytes, options) => {
        seen.path = path;
        seen.overwrite = options.overwrite;
        return { ok: true, value: undefined };
      },
    });
    expect(run.code, run.err).toBe(0);
    expect(seen).toEqual({ paper: 'letter', reviewDate: '2026-06-01', preparedBy: 'Pharmacist CD', path: 'x.pdf', overwrite: false });
  });

  it('keeps pdfmake out of the command-line bundle, and the built command writes a sheet with it at run time', async () => {
    // Stack notes: pdfkit reads its font metric files from disk, so pdfmake stays an installed runtime dependency.
    const projectRoot = fileURLToPath(new URL('../../..', import.meta.url));
    mkdirSync(join(projectRoot, 'dist'), { recursive: true });
    const outfile = join(mkdtempSync(join(projectRoot, 'dist', 'test-cli-')), 'cli.cjs');
    await buildCli(outfile);
    const bundle = readFileSync(join(dirname(outfile), cliBundleFile), 'utf8');
    expect(bundle).toContain('require("pdfmake")');
    expect(bundle).not.toContain('class LayoutBuilder');
    const path = join(tempDir(), 'built.pdf');
    const run = spawnSync(process.execPath, [outfile, 'sheet', demo, '-o', path], { encoding: 'utf8' });
    expect(run.status, run.stderr).toBe(0);
    expect(readFileSync(path).subarray(0, 5).toString()).toBe('%PDF-');
  }, renderCeilingMs);
});
