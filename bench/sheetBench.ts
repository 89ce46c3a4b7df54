/**
 * Sheet figures: the demo's review sheet through our writer (app/host/sheetPdf,
 * the one module of the product that imports pdfmake) against bare pdfmake
 * rendering the same charts and the same words as plain paragraphs (no tables,
 * styles, header or footer), padded to the same page count, so the ratio is what
 * our layout adds to the library's own cost for the same content. The benchmark
 * imports pdfmake itself only to build that baseline.
 */
import { readFileSync } from 'node:fs';
import pdfmake from 'pdfmake';
import robotoFonts from 'pdfmake/fonts/Roboto.js';
import type { Content } from 'pdfmake/interfaces';
import { writeSheetPdf } from '../app/host/sheetPdf';
import { computeCase } from '../core/ledger/computeCase';
import { parseCase } from '../core/model/parseCase';
import { buildSheet } from '../core/report/buildSheet';
import type { Sheet } from '../core/report/sheet';
import { evaluateFindings } from '../core/safety';

/** The demo TH-0417's sheet on its review date, as the sheet command builds it. */
export function demoSheet(root: string): Sheet {
  const parsed = parseCase(JSON.parse(readFileSync(`${root}assets/demo/th-0417.json`, 'utf8')));
  if (!parsed.ok) throw new Error('demo does not parse');
  const asOf = parsed.value.review.reviewDate ?? '2026-11-20';
  const computed = computeCase(parsed.value, asOf);
  if (!computed.ok) throw new Error('demo does not compute');
  const findings = evaluateFindings(parsed.value, computed.value, asOf, parsed.value.thresholdOverrides);
  if (!findings.ok) throw new Error('demo findings do not evaluate');
  return buildSheet({
    caseFile: parsed.value,
    results: computed.value,
    findings: findings.value,
    caseFileSha256: '0'.repeat(64),
    toolVersion: 'chelation-ledger bench',
    preparedBy: null,
  });
}

/** Pages of a PDF: its page objects. */
export function pdfPageCount(pdf: Buffer): number {
  return (pdf.toString('latin1').match(/\/Type\s*\/Page(?![s\w])/g) ?? []).length;
}

export function chartSvgsOf(sheet: Sheet): string[] {
  return sheet.sections.flatMap((section) => section.blocks.flatMap((block) => (block.kind === 'chart' ? [block.chart.svg] : [])));
}

/** Every word the sheet prints, one plain line per paragraph, fact, table row or finding. */
export function plainLinesOf(sheet: Sheet): string[] {
  const lines: string[] = [sheet.caution];
  for (const section of sheet.sections) {
    lines.push(section.title);
    for (const block of section.blocks) {
      if (block.kind === 'paragraph') lines.push(block.text);
      else if (block.kind === 'facts') lines.push(...block.rows.map((entry) => `${entry.label}: ${entry.value}`));
      else if (block.kind === 'table') lines.push(block.caption, block.columns.map((column) => column.title).join('  '), ...block.rows.map((cells) => cells.join('  ')));
      else if (block.kind === 'findings') lines.push(...block.items.map((item) => `${item.severity} ${item.title}: ${item.text} ${item.sources.join('; ')}`));
      else lines.push(block.caption);
    }
  }
  return lines;
}

/** Bare pdfmake: the same charts and lines, then `paddingPages` short paragraphs each on a new page (to match the page count). */
export function barePdf(svgs: readonly string[], lines: readonly string[], paddingPages: number, creationDate: Date): Promise<Buffer> {
  const fontFiles = new Set(Object.values(robotoFonts.Roboto));
  pdfmake.setFonts(robotoFonts);
  pdfmake.setUrlAccessPolicy(() => false);
  pdfmake.setLocalAccessPolicy((path: string) => fontFiles.has(path));
  const content: Content[] = [...svgs.map((svg): Content => ({ svg, width: 500 })), ...lines.map((text): Content => ({ text }))];
  for (let page = 0; page < paddingPages; page += 1) content.push({ text: 'A page of the baseline document.', pageBreak: 'before' });
  return pdfmake.createPdf({ content, pageSize: 'A4', info: { creationDate }, defaultStyle: { font: 'Roboto' } }).getBuffer();
}

export { writeSheetPdf };
