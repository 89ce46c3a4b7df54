import { execFileSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { buildSheet } from '../../../core/report/buildSheet';
import { formatNumber } from '../../../core/numbers/formatNumber';
import { sheetCaution } from '../../../core/report/sheet';
import { printable, writeSheetPdf } from '../../../app/host/sheetPdf';
import { cli, demoCase, tempDir } from '../cli/harness';
import { demoSheetInput } from '../../core/report/sheetFixtures';
import { pdfFonts, pdfInfo, pdfText, savePdf } from './pdfTools';

// The PDF is read back with poppler (pdfinfo, pdftotext, pdffonts), a reader independent of
// pdfmake; the numbers are compared with what `compute --json` prints for the same file.

const folder = tempDir('cl-sheet-');
const a4Path = join(folder, 'review-a4.pdf');
const a4Again = join(folder, 'review-a4-again.pdf');
const letterPath = join(folder, 'review-letter.pdf');
const demo = demoCase('th-0417');
const made = [
  await cli('sheet', demo, '-o', a4Path, '--prepared-by', 'Pharmacist AB'),
  await cli('sheet', demo, '-o', a4Again, '--prepared-by', 'Pharmacist AB'),
  await cli('sheet', demo, '-o', letterPath, '--paper', 'letter', '--prepared-by', 'Pharmacist AB'),
];
const computed = JSON.parse((await cli('compute', demo, '--json')).out);
const info = pdfInfo(a4Path);
const pageCount = Number(info.Pages);
const pages = Array.from({ length: pageCount }, (_, index) => pdfText(a4Path, index + 1));
const text = pages.join(' ');
const fmt = (value: number, decimals: number) => formatNumber(value, decimals);
const normalisedCaution = sheetCaution.replace(/\s+/g, ' ');

/** Every word of a PDF with where poppler puts it (pdftotext -bbox), and each page's start. */
const wordBoxes = (bytes: Buffer) =>
  [...execFileSync('pdftotext', ['-bbox', savePdf(bytes), '-'], { encoding: 'utf8' }).matchAll(/<(page|word)[^>]*?(?:xMin="([\d.]+)" yMin="([\d.]+)")?[^>]*>([^<]*)/g)].map(
    (match) => (match[1] === 'page' ? 'page' : `${match[4]} ${Number(match[2]).toFixed(2)} ${Number(match[3]).toFixed(2)}`),
  );

describe('review sheet PDF (app/host/sheetPdf via the sheet command)', () => {
  it('is written by the command on A4 and Letter, with its metadata', () => {
    for (const run of made) expect(run.code, run.err).toBe(0);
    expect(info['Page size']).toMatch(/^595\.\d* x 841\.\d* pts \(A4\)$/);
    expect(pdfInfo(letterPath)['Page size']).toBe('612 x 792 pts (letter)');
    expect(info.Title).toBe('Chelation review sheet: TH-0417, 2026-11-20');
    expect(info.Author).toBe('Pharmacist AB');
    expect(info.Creator).toBe('chelation-ledger 0.1.0');
    // The creation date is the review date, never the clock.
    expect(info.CreationDate).toMatch(/Nov 20 00:00:00 2026/);
    expect(pageCount).toBeGreaterThanOrEqual(5);
  });

  it('is byte-identical for the same case and review date', () => {
    expect(readFileSync(a4Again).equals(readFileSync(a4Path))).toBe(true);
  });

  it('prints the caution, the header and "page N of M" on every page', () => {
    pages.forEach((page, index) => {
      expect(page).toContain(normalisedCaution);
      expect(page).toContain(`page ${index + 1} of ${pageCount}`);
      expect(page).toContain('Chelation review sheet — TH-0417');
      expect(page).toContain('review date 2026-11-20');
    });
    const letterPages = Number(pdfInfo(letterPath).Pages);
    for (let page = 1; page <= letterPages; page += 1) expect(pdfText(letterPath, page)).toContain(normalisedCaution);
  });

  it('breaks the caution in its box where the words run out of room, as pdfmake wraps a paragraph', () => {
    // The writer hands pdfmake the caution already cut into lines; poppler's word boxes show the cut
    // is the greedy one: the first line fits inside the box, and the next word would not have.
    for (const path of [a4Path, letterPath]) {
      const pageWidthPt = Number(/^([\d.]+) x/.exec(pdfInfo(path)['Page size']!)![1]);
      // Page margins 40 pt, the box's borders 1.2 pt and padding 4 pt on each side (sheetPdf's layout).
      const innerWidthPt = pageWidthPt - 2 * (40 + 1.2 + 4);
      const xml = execFileSync('pdftotext', ['-bbox-layout', '-f', '1', '-l', '1', path, '-'], { encoding: 'utf8' });
      const lines = [...xml.matchAll(/<line[^>]*>([\s\S]*?)<\/line>/g)].map((line) =>
        [...line[1]!.matchAll(/<word xMin="([\d.]+)"[^>]*xMax="([\d.]+)"[^>]*>([^<]*)<\/word>/g)].map((word) => ({ xMin: Number(word[1]), xMax: Number(word[2]), text: word[3]! })),
      );
      const first = lines.findIndex((words) => words[0]?.text === 'Decision');
      const [top, bottom] = [lines[first]!, lines[first + 1]!];
      expect([...top, ...bottom].map((word) => word.text).join(' ')).toBe(normalisedCaution);
      const topWidth = top[top.length - 1]!.xMax - top[0]!.xMin;
      const spaceWidth = top[1]!.xMin - top[0]!.xMax;
      expect(topWidth).toBeLessThanOrEqual(innerWidthPt);
      expect(topWidth + spaceWidth + (bottom[0]!.xMax - bottom[0]!.xMin)).toBeGreaterThan(innerWidthPt);
    }
  });

  it('puts every word where pdfmake puts it when it finds every line itself', async () => {
    // The writer hands pdfmake most lines already cut (app/host/sheetLines restates pdfmake's
    // rules); poppler's word boxes of the same sheet with every line left to pdfmake are the reference.
    for (const name of ['th-0417', 'th-0093'] as const) {
      const sheet = buildSheet(demoSheetInput(name));
      for (const paper of ['a4', 'letter'] as const) {
        const [cut, found] = [await writeSheetPdf(sheet, { paper }), await writeSheetPdf(sheet, { paper, cutLines: false })];
        expect(cut.equals(found), `${name} ${paper}: the lines are cut`).toBe(false);
        const [cutWords, foundWords] = [wordBoxes(cut), wordBoxes(found)];
        expect(cutWords.length, `${name} ${paper}`).toBeGreaterThan(1000);
        expect(cutWords, `${name} ${paper}`).toEqual(foundWords);
      }
    }
  }, 120_000);

  it('puts every word where pdfmake puts it on sheets of drawn text: kerning pairs, slashes, hyphens, long words, symbols', async () => {
    // As the test above, on the demo's sheet with its texts replaced by words drawn (seeded) from a
    // list chosen to stress the line cutting: kerning pairs within and across hyphens and slashes
    // (AV, To, T-V, W/A), units as the sheets write them, words longer than any column (pdfmake cuts
    // them), runs of spaces, and symbols the embedded font has (µ, ≥, ×, ⁹, —). Six sheets here; 30 passed
    // when this was written.
    const words = ['AV', 'To', 'T-V', 'W/A', 'LTA', 'Wa', 'mg/kg/d', 'µmol/L', '≥', '×10⁹/L', '—', 'semi-automatic', 'deferasirox', 'deferoxamine', 'deferiprone',
      'ferritin', '2,900', '11.4', '0.05', '(US label §5.2)', 'haematocrit', 'supercalifragilisticexpialidociousandthensomemoreletters', 'a', 'I', 'of', 'the', 'LIC', 'T2*', 'mg/g{dry}', 'x'];
    let seed = 20261203;
    const draw = (count: number) => {
      const parts: string[] = [];
      for (let k = 0; k < count; k += 1) {
        seed = (seed * 1103515245 + 12345) % 2147483648;
        parts.push(words[seed % words.length]!);
        if (seed % 11 === 0) parts.push('');
      }
      return parts.join(' ');
    };
    const demoSheet = buildSheet(demoSheetInput('th-0417'));
    for (let sample = 0; sample < 6; sample += 1) {
      const drawn: typeof demoSheet = {
        ...demoSheet,
        sections: demoSheet.sections.map((section) => ({
          ...section,
          blocks: section.blocks.map((block) => {
            switch (block.kind) {
              case 'paragraph':
                return { ...block, text: draw(3 + (seed % 40)) };
              case 'facts':
                return { ...block, rows: block.rows.map((row) => ({ label: draw(1 + (seed % 3)), value: draw(1 + (seed % 25)) })) };
              case 'table':
                return { ...block, rows: block.rows.map((cells) => cells.map(() => draw(1 + (seed % 6)))) };
              case 'findings':
                return { ...block, items: block.items.map((item) => ({ ...item, text: draw(5 + (seed % 50)) })) };
              default:
                return block;
            }
          }),
        })),
      };
      const paper = sample % 2 === 0 ? 'a4' : 'letter';
      const [cut, found] = [await writeSheetPdf(drawn, { paper }), await writeSheetPdf(drawn, { paper, cutLines: false })];
      expect(cut.equals(found), `sample ${sample}: the lines are cut`).toBe(false);
      const [cutWords, foundWords] = [wordBoxes(cut), wordBoxes(found)];
      expect(cutWords.length, `sample ${sample}`).toBeGreaterThan(1000);
      expect(cutWords, `sample ${sample} (${paper})`).toEqual(foundWords);
    }
  }, 180_000);

  it('prints the SHA-256 of the case file it was made from (as sha256sum would)', () => {
    const digest = createHash('sha256').update(readFileSync(demo)).digest('hex');
    expect(text).toContain(digest);
  });

  it('embeds Roboto only, so µ, ×, ≥ and superscripts print', () => {
    const fonts = pdfFonts(a4Path);
    expect(fonts.length).toBeGreaterThan(0);
    for (const font of fonts) {
      expect(font.name).toMatch(/\+Roboto-/);
      expect(font.embedded).toBe(true);
    }
    expect(text).toContain('µg/L');
    expect(text).toContain('× 1/day');
  });

  it('prints every headline number exactly as compute --json gives it', () => {
    const { results } = computed;
    const expected = [
      `${fmt(results.intake.mgPerKgPerDay, 2)} mg/kg/day — ${results.intake.band}`,
      `in ${fmt(results.intake.transfusedMg, 0)} mg`,
      `net ${fmt(results.intake.netMg, 0)} mg`,
      `${fmt(results.intake.cumulativeNetMg / 1000, 1)} g`,
      `${fmt(results.bodyIron.lastMeasured.licMgPerGDry, 1)} mg/g dry on ${results.bodyIron.lastMeasured.date}`,
      `${fmt(results.bodyIron.licMgPerGDry, 1)} mg/g dry —`,
      `body iron stores ${fmt(results.bodyIron.bodyIronMg / 1000, 2)} g`,
      `latest ${fmt(results.ferritin.latest.valueUgPerL, 0)} µg/L`,
      `future intake ${fmt(results.projection.intakeMgPerDay, 1)} mg/day`,
      ...results.currentRegimens.map((regimen: { doseMgPerKgPerDay: number; expectedRemovalMgPerDay: number; expectedRemovalMgPerKgPerDay: number }) => `${fmt(regimen.doseMgPerKgPerDay, 1)} ${fmt(regimen.expectedRemovalMgPerDay, 1)} ${fmt(regimen.expectedRemovalMgPerKgPerDay, 2)}`),
      ...results.responses.flatMap((response: { measuredChelationMgPerKgPerDay: number; expectedChelationMgPerKgPerDay: number; measuredToExpectedRatio: number }) => [
        `${fmt(response.measuredChelationMgPerKgPerDay, 2)} ${fmt(response.expectedChelationMgPerKgPerDay, 2)} ${fmt(response.measuredToExpectedRatio * 100, 0)} %`,
      ]),
      ...results.projection.scenarios.flatMap((scenario: { netMgPerKgPerDay: number; months: { licMgPerGDry: number; licP10: number; licP90: number }[] }) => [
        fmt(scenario.netMgPerKgPerDay, 2),
        ...[6, 12, 24].map((months) => {
          const month = scenario.months[months]!;
          return `${fmt(month.licMgPerGDry, 1)} (${fmt(month.licP10, 1)}–${fmt(month.licP90, 1)})`;
        }),
      ]),
    ];
    for (const phrase of expected) expect(text.includes(phrase), phrase).toBe(true);
  });

  it('prints every finding compute returns, and the formulas and sources of the method appendix', () => {
    for (const finding of computed.findings) expect(text.includes(finding.text.replace(/\s+/g, ' ').slice(0, 60)), finding.text).toBe(true);
    const input = demoSheetInput();
    const appendixFormulas = buildSheet(input).sections.find((section) => section.id === 'method-appendix')!;
    expect(appendixFormulas.blocks.length).toBeGreaterThan(3);
    for (const formulaId of ['iron-intake-rate', 'net-transfusional-iron', 'body-iron-carried-forward', 'projected-lic', 'expected-excretion', 'measured-chelation']) {
      expect(text.includes(`[${formulaId}]`), formulaId).toBe(true);
    }
    for (const source of ['Angelucci E, Brittenham GM, McLaren CE', 'Brittenham GM, N Engl J Med 2011;364:146-156', 'Cohen AR, Glimm E, Porter JB']) expect(text.includes(source), source).toBe(true);
    expect(text).toContain('published default');
  });

  it('leaves the sign-off lines for the prescriber on the last page', () => {
    const last = pages[pages.length - 1]!;
    for (const field of ['Review and sign-off', 'Reviewed by', 'Prescriber (name)', 'Signature', 'Decision and comments']) expect(last).toContain(field);
  });

  it('renders the same sheet to the same bytes in-process too, and shows characters the font lacks by code point', async () => {
    const sheet = buildSheet(demoSheetInput());
    const [first, second] = [await writeSheetPdf(sheet, { paper: 'letter' }), await writeSheetPdf(sheet, { paper: 'letter' })];
    expect(first.subarray(0, 5).toString()).toBe('%PDF-');
    expect(first.equals(second)).toBe(true);
    // Roboto has no arrows: the demo's review note "9.8 → 11.4" keeps its arrow as a visible code point.
    expect(printable('9.8 → 11.4 µg ≥ 3')).toBe('9.8 [U+2192] 11.4 µg ≥ 3');
    expect(pdfText(savePdf(first))).toContain('Liver iron 9.8 [U+2192] 11.4 mg/g dry');
  }, 60_000);
});
