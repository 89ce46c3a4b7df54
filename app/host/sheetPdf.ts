/**
 * The review sheet's PDF writer: the only module that imports pdfmake.
 *
 * `writeSheetPdf(sheet, { paper }) → Promise<Buffer>` lays out a sheet built by
 * core/report buildSheet: A4 or Letter, the header and the caution on every
 * page, "page N of M" with the case file's hash in the footer, charts from the
 * core's SVG, tables, the method appendix and the sign-off block. Roboto (shipped
 * inside pdfmake) is embedded, so ≥, µ, ⁹ and ₃ print. The PDF's creation date is
 * the review date at 00:00 UTC, never the clock, so the same sheet gives the
 * same bytes. pdfmake may read only the four Roboto files and no URL.
 *
 * pdfmake measures, lays out and draws a wrapping text word by word; text that surely fits
 * its line (measured here with fontkit as pdfkit measures it) is handed over as one
 * unbroken piece, and the caution as its lines, so the 15 headers and footers and the
 * one-line captions cost a piece a line. The pages look the same to the pixel.
 */
import { openSync, type Font } from 'fontkit';
import pdfmake from 'pdfmake';
import robotoFonts from 'pdfmake/fonts/Roboto.js';
import type { Content, TableCell, TDocumentDefinitions } from 'pdfmake/interfaces';
import type { Sheet, SheetBlock, SheetPaper, SheetSection } from '../../core/report/sheet';

export interface SheetPdfOptions {
  readonly paper: SheetPaper;
}

const fontFiles = new Set(Object.values(robotoFonts.Roboto));
let configured = false;
function configurePdfmake(): void {
  if (configured) return;
  pdfmake.setFonts(robotoFonts);
  pdfmake.setUrlAccessPolicy(() => false);
  pdfmake.setLocalAccessPolicy((path) => fontFiles.has(path));
  configured = true;
}

let embeddedCodePoints: ReadonlySet<number> | undefined;
/**
 * Text as the embedded font can print it. A character Roboto has no glyph for (an arrow
 * typed in a note) would print as an empty box; it is shown as its code point instead,
 * "[U+2192]", so nothing the user typed disappears from the paper unseen.
 */
export function printable(text: string): string {
  // Printable ASCII is in every font: most strings take this path.
  if (/^[\x20-\x7e\n]*$/.test(text)) return text;
  embeddedCodePoints ??= new Set((openSync(robotoFonts.Roboto.normal) as Font).characterSet);
  if (![...text].some((character) => character.codePointAt(0)! >= 0x20 && !embeddedCodePoints!.has(character.codePointAt(0)!))) return text;
  let shown = '';
  for (const character of text) {
    const codePoint = character.codePointAt(0)!;
    shown += codePoint < 0x20 || embeddedCodePoints.has(codePoint) ? character : `[U+${codePoint.toString(16).toUpperCase().padStart(4, '0')}]`;
  }
  return shown;
}

/** A face of the embedded Roboto, as pdfmake names them. */
type Face = 'normal' | 'bold' | 'italics';
const faces = new Map<Face, Font>();
const faceFont = (face: Face): Font => faces.get(face) ?? faces.set(face, openSync(robotoFonts.Roboto[face]) as Font).get(face)!;
/** Widths already measured, in ems, by face and text (the same words recur on every page and sheet). */
const emWidths = new Map<string, number>();

/**
 * The width of `text` in points as pdfkit measures it for pdfmake: the text cut after each
 * space, each piece shaped on its own by fontkit (kerning included), the advances summed.
 */
function textWidthPt(text: string, face: Face, sizePt: number): number {
  const key = `${face}\u0000${text}`;
  let ems = emWidths.get(key);
  if (ems === undefined) {
    const font = faceFont(face);
    ems = 0;
    for (const piece of text.split(/(?<=[ \t])/)) ems += font.layout(piece).advanceWidth / font.unitsPerEm;
    if (emWidths.size > 20_000) emWidths.clear();
    emWidths.set(key, ems);
  }
  return ems * sizePt;
}

/**
 * The width pdfmake gives a line of `text`: its words' widths (each with its trailing
 * spaces, as pdfmake cuts them) less the trailing spaces of the last.
 */
function lineWidthPt(text: string, face: Face, sizePt: number): number {
  const trailing = /[ \t]+$/.exec(text)?.[0];
  return textWidthPt(text, face, sizePt) - (trailing ? textWidthPt(trailing, face, sizePt) : 0);
}

/**
 * How far inside or outside the line a measured width must be before this module decides
 * for pdfmake where a line ends, pt. A modelling choice of ours: the widths are pdfmake's
 * own arithmetic on the same fontkit advances, so they differ from its only by rounding
 * (far below this); a text closer to the edge than this is left for pdfmake to break.
 */
const lineDecisionMarginPt = 0.05;

/**
 * A text that surely fits on one line of `widthPt` as one unbroken piece. pdfmake measures,
 * lays out and draws every word of a wrapping text on its own (a PDF text object each);
 * a text it need not wrap is the same line drawn in one, with every glyph where it was.
 * A text that might wrap stays as it is.
 */
function oneLine(text: string, face: Face, sizePt: number, widthPt: number): { text: string; noWrap?: true } {
  return !text.includes('\n') && lineWidthPt(text, face, sizePt) <= widthPt - lineDecisionMarginPt ? { text, noWrap: true } : { text };
}

/**
 * The lines pdfmake would break `text` into at `widthPt`, each as one unbroken piece (see
 * `oneLine`), or the text as it is where a line end is within the decision margin or the
 * text could break anywhere but after a space (pdfmake follows the Unicode line-breaking
 * rules; for letters, digits and . , ; : only a space is a break).
 */
function brokenLines(text: string, face: Face, sizePt: number, widthPt: number): { text: string } | { stack: Content[] } {
  if (!/^[A-Za-z0-9 .,;:]+$/.test(text)) return { text };
  const words = text.split(/(?<= )(?=[^ ])/);
  const lines: string[] = [];
  let line = '';
  for (const word of words) {
    if (line !== '') {
      const width = lineWidthPt(`${line}${word}`, face, sizePt);
      if (Math.abs(width - widthPt) <= lineDecisionMarginPt) return { text };
      if (width < widthPt) {
        line += word;
        continue;
      }
      lines.push(line);
    }
    // A word wider than the line pdfmake would cut inside the word.
    if (lineWidthPt(word, face, sizePt) > widthPt - lineDecisionMarginPt) return { text };
    line = word;
  }
  lines.push(line);
  return { stack: lines.map((part) => ({ text: part, noWrap: true })) };
}

/** The footer's "page N of M" column, pt (a layout choice of ours). */
const pageNumberWidthPt = 70;
/** Page widths, pt: pdfmake's standard sizes (ISO 216 A4, 210 mm; US Letter, 8.5 in). */
const pageWidthPt: Record<SheetPaper, number> = { a4: 595.28, letter: 612 };
/** Left and right page margins, pt (a layout choice of ours, as the top and bottom ones). */
const sideMarginPt = 40;

const ink = '#000000';
const grey = '#e6e6e6';

function paragraph(block: Extract<SheetBlock, { kind: 'paragraph' }>, widthPt: number): Content {
  const text = printable(block.text);
  switch (block.style) {
    case 'caution':
      return { ...oneLine(text, 'bold', 8.5, widthPt), bold: true, margin: [0, 2, 0, 4] };
    case 'note':
      return { ...oneLine(text, 'italics', 7.5, widthPt), fontSize: 7.5, italics: true, margin: [0, 2, 0, 6] };
    case 'small':
      return { ...oneLine(text, 'normal', 7, widthPt - 8), fontSize: 7, color: '#333333', margin: [8, 0, 0, 5] };
    case 'body':
      return { ...oneLine(text, 'normal', 8.5, widthPt), margin: [0, 2, 0, 3] };
  }
}

function table(block: Extract<SheetBlock, { kind: 'table' }>, widthPt: number): Content[] {
  const caption: Content = { ...oneLine(printable(block.caption), 'bold', 8.5, widthPt), bold: true, fontSize: 8.5, margin: [0, 6, 0, 3] };
  if (block.rows.length === 0) return [{ stack: [caption, { text: printable(block.emptyText), italics: true, fontSize: 7.5, margin: [0, 0, 0, 6] }], unbreakable: true }];
  const headerRow: TableCell[] = block.columns.map((column) => ({ text: printable(column.title), bold: true, alignment: column.align, fillColor: grey }));
  const cell = (text: string, index: number, bold = false): TableCell => ({ text: printable(text), alignment: block.columns[index]?.align ?? 'left', bold, noWrap: block.columns[index]?.noWrap ?? false });
  const body: TableCell[][] = [headerRow, ...block.rows.map((row) => row.map((text, index) => cell(text, index)))];
  if (block.totals) body.push(block.totals.map((text, index) => cell(text, index, true)));
  const widths = block.columns.some((column) => column.width === '*')
    ? block.columns.map((column) => (column.width === '*' ? '*' : 'auto'))
    : block.columns.map(() => '*');
  // Caption, table and note side by side in the section rather than in a stack of their own
  // (the block's 6 pt below on its last part): the same layout, with one level fewer for
  // pdfmake's style look-ups of every cell to walk.
  return [
    caption,
    { table: { headerRows: 1, widths, body }, layout: 'lightHorizontalLines', fontSize: 7.5, margin: [0, 0, 0, block.note ? 0 : 6] },
    ...(block.note ? [{ ...oneLine(printable(block.note), 'italics', 7, widthPt), fontSize: 7, italics: true, margin: [0, 2, 0, 6] } as Content] : []),
  ];
}

function findings(block: Extract<SheetBlock, { kind: 'findings' }>): Content[] {
  if (block.items.length === 0) return [{ text: printable(block.emptyText), italics: true, margin: [0, 0, 0, 6] }];
  // Each finding in the section itself (the block's 6 pt below on the last one), as for tables.
  return block.items.map(
    (item, index): Content => ({
      table: {
        widths: [62, '*'],
        body: [
          [
            { text: item.severity, bold: true, fontSize: 8 },
            {
              stack: [
                { text: printable(item.text) },
                { text: printable(`Sources: ${item.sources.join('; ')}${item.sourceUncertain ? ' — includes a value from memory or an unsure source' : ''}`), fontSize: 7, color: '#333333', margin: [0, 1, 0, 0] },
              ],
            },
          ],
        ],
      },
      layout: { hLineWidth: () => 0.5, vLineWidth: (index: number) => (index === 0 ? (item.severity === 'URGENT' ? 3 : 1) : 0), hLineColor: () => ink, vLineColor: () => ink, paddingLeft: () => 4 },
      margin: [0, 0, 0, index === block.items.length - 1 ? 3 + 6 : 3],
      unbreakable: true,
    }),
  );
}

/** Facts' labels take this width, pt (a layout choice of ours); the values the rest. */
const factLabelWidthPt = 150;
/** Padding between the columns of a borderless table: pdfmake's 'noBorders' layout, 4 pt right of the first and left of the second. */
const noBordersGapPt = 8;

function block(item: SheetBlock, widthPt: number): Content[] {
  switch (item.kind) {
    case 'paragraph':
      return [paragraph(item, widthPt)];
    case 'facts':
      return [{
        table: {
          widths: [factLabelWidthPt, '*'],
          body: item.rows.map((row) => [
            { ...oneLine(printable(row.label), 'bold', 8.5, factLabelWidthPt), bold: true },
            oneLine(printable(row.value), 'normal', 8.5, widthPt - factLabelWidthPt - noBordersGapPt),
          ]),
        },
        layout: 'noBorders',
        margin: [0, 4, 0, 4],
      }];
    case 'table':
      return table(item, widthPt);
    case 'chart':
      return [{ stack: [{ svg: printable(item.chart.svg), width: item.chart.width }, { ...oneLine(printable(item.caption), 'italics', 7.5, widthPt), fontSize: 7.5, italics: true, margin: [0, 2, 0, 10] }], unbreakable: true }];
    case 'findings':
      return findings(item);
  }
}

/** A section's title and blocks, straight into the content (no stack of its own, as for tables). */
function section(part: SheetSection, index: number, widthPt: number): Content[] {
  return [
    { ...oneLine(part.title, 'bold', 12, widthPt), fontSize: 12, bold: true, margin: [0, index === 0 ? 0 : 6, 0, 4], ...(part.startsOnNewPage ? { pageBreak: 'before' as const } : {}) },
    ...part.blocks.flatMap((item) => block(item, widthPt)),
  ];
}

function signOff(sheet: Sheet): Content {
  const line = (label: string, value: string | null): TableCell[] => [{ text: label, bold: true }, { text: value === null ? ' ' : printable(value), margin: [0, value ? 0 : 10, 0, 0] }];
  const { signOff: block } = sheet;
  return {
    stack: [
      { text: 'Review and sign-off', fontSize: 12, bold: true, margin: [0, 10, 0, 4] },
      ...(block.notes.length > 0 ? [{ text: 'Review notes', bold: true, margin: [0, 0, 0, 2] } as Content, ...block.notes.map((note) => ({ text: printable(note), margin: [0, 0, 0, 2] }) as Content)] : []),
      {
        table: {
          widths: [120, '*'],
          body: [
            line('Reviewed by', block.reviewedBy),
            line('Date', block.date),
            line('Comments', block.comments),
            ...block.prescriberFields.map((field) => line(field, null)),
          ],
        },
        layout: { hLineWidth: () => 0.5, vLineWidth: () => 0, hLineColor: () => ink, paddingTop: () => 6, paddingBottom: () => 6 },
      },
    ],
    unbreakable: true,
  };
}

/**
 * The pdfmake document for a sheet (exported for tests of the layout as data).
 *
 * @param sheet - from core/report buildSheet
 * @param options - paper size
 */
export function sheetDocument(sheet: Sheet, options: SheetPdfOptions): TDocumentDefinitions {
  const { header } = sheet;
  const [year, month, day] = header.reviewDate.split('-').map(Number) as [number, number, number];
  const widthPt = pageWidthPt[options.paper] - 2 * sideMarginPt;
  // Written once for all pages: each page's header and footer are these, in one piece per line where they surely fit.
  const title = oneLine(printable(`${header.title} — ${header.caseLabel}`), 'bold', 10, widthPt / 2);
  const dateLine = oneLine(printable(`${(header.dateLabel ?? 'Review date').toLowerCase()} ${header.reviewDate} · prepared by ${header.preparedBy ?? 'not stated'}`), 'normal', 8, widthPt / 2);
  // Inside the caution's box: its 1.2 pt borders and pdfmake's default 4 pt padding either side.
  const caution = brokenLines(sheet.caution, 'bold', 7.5, widthPt - 2 * (1.2 + 4));
  const hashLine = oneLine(`${header.toolVersion} · ${header.hashLabel ?? 'case file SHA-256'} ${header.caseFileSha256}`, 'normal', 6.5, widthPt - pageNumberWidthPt);
  return {
    pageSize: options.paper === 'a4' ? 'A4' : 'LETTER',
    pageMargins: [40, 74, 40, 44],
    info: {
      title: `${header.title}: ${header.caseLabel}, ${header.reviewDate}`,
      author: header.preparedBy ?? header.toolVersion,
      subject: 'Decision support for review by the prescriber',
      creator: header.toolVersion,
      producer: header.toolVersion,
      // Never the clock: the review date fixes the bytes.
      creationDate: new Date(Date.UTC(year, month - 1, day)),
    },
    defaultStyle: { font: 'Roboto', fontSize: 8.5, lineHeight: 1.1 },
    header: () => ({
      margin: [40, 18, 40, 0],
      stack: [
        {
          columns: [
            { ...title, bold: true, fontSize: 10 },
            { ...dateLine, alignment: 'right', fontSize: 8 },
          ],
        },
        {
          table: { widths: ['*'], body: [[{ ...caution, bold: true, fontSize: 7.5 }]] },
          layout: { hLineWidth: () => 1.2, vLineWidth: () => 1.2, hLineColor: () => ink, vLineColor: () => ink, paddingTop: () => 3, paddingBottom: () => 3 },
          margin: [0, 4, 0, 0],
        },
      ],
    }),
    footer: (currentPage, pageCount) => ({
      margin: [40, 14, 40, 0],
      columns: [
        { ...hashLine, fontSize: 6.5, color: '#333333' },
        { ...oneLine(`page ${currentPage} of ${pageCount}`, 'normal', 8, pageNumberWidthPt), alignment: 'right', fontSize: 8, width: pageNumberWidthPt },
      ],
    }),
    content: [
      {
        table: {
          widths: [90, '*'],
          body: [
            [{ text: 'Patient', bold: true }, printable(header.patientLine)],
            [{ text: header.dateLabel ?? 'Review date', bold: true }, header.reviewDate],
            [{ text: 'Prepared by', bold: true }, printable(header.preparedBy ?? 'not stated')],
            [{ text: 'Tool', bold: true }, header.toolVersion],
            [{ text: header.hashLabel ? header.hashLabel.charAt(0).toUpperCase() + header.hashLabel.slice(1) : 'Case file SHA-256', bold: true }, { text: header.caseFileSha256, fontSize: 7.5 }],
          ],
        },
        layout: 'noBorders',
        margin: [0, 0, 0, 6],
      },
      ...sheet.sections.flatMap((part, index) => section(part, index, widthPt)),
      signOff(sheet),
    ],
  };
}

/**
 * Render a review sheet to PDF bytes.
 *
 * @param sheet - from core/report buildSheet
 * @param options - paper: 'a4' or 'letter'
 * @returns the PDF; the same sheet and paper give the same bytes
 * @example const pdf = await writeSheetPdf(buildSheet(input), { paper: 'a4' }) // Buffer starting '%PDF-'
 */
export async function writeSheetPdf(sheet: Sheet, options: SheetPdfOptions): Promise<Buffer> {
  configurePdfmake();
  return pdfmake.createPdf(sheetDocument(sheet, options)).getBuffer();
}
