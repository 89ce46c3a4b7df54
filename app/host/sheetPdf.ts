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
 * pdfmake measures, lays out and draws a wrapping text word by word (a PDF text object
 * each). This module cuts the text into the lines pdfmake would make (pdfmake's own word
 * breaker, fontkit widths as pdfkit measures them, pdfmake's line and column rules restated
 * in app/host/sheetLines) and hands each line over as one unbroken piece, and a table its
 * column widths as pdfmake would size them; where a decision is too close to call the text
 * or table is left to pdfmake. The pages are the same to the pixel, at a fraction of the work.
 */
import { openSync, type Font } from 'fontkit';
import pdfmake from 'pdfmake';
import robotoFonts from 'pdfmake/fonts/Roboto.js';
import type { Content, TableCell, TDocumentDefinitions } from 'pdfmake/interfaces';
import * as textBreakerModule from 'pdfmake/js/TextBreaker.js';
import type { Sheet, SheetBlock, SheetPaper, SheetSection } from '../../core/report/sheet';
import { columnWidths, unwrappedLines, wrapPieces, widthRange, type ColumnSizing, type Piece } from './sheetLines';

export interface SheetPdfOptions {
  readonly paper: SheetPaper;
  /** false: every line left to pdfmake to find (the tests compare the two; the pages are the same). */
  readonly cutLines?: boolean;
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
/** Widths already measured, in ems, by face and space-ended chunk (the same words recur on every page and sheet). */
const emWidths = new Map<string, number>();

/**
 * The width of `text` in ems as pdfkit measures it for pdfmake: the text cut after each
 * space, each chunk shaped on its own by fontkit (kerning included), the advances summed.
 */
function textEms(text: string, face: Face): number {
  let ems = 0;
  for (const chunk of text.split(/(?<=[ \t])/)) {
    const key = `${face}\u0000${chunk}`;
    let chunkEms = emWidths.get(key);
    if (chunkEms === undefined) {
      const font = faceFont(face);
      chunkEms = font.layout(chunk).advanceWidth / font.unitsPerEm;
      if (emWidths.size > 50_000) emWidths.clear();
      emWidths.set(key, chunkEms);
    }
    ems += chunkEms;
  }
  return ems;
}

const textWidthPt = (text: string, face: Face, sizePt: number): number => textEms(text, face) * sizePt;

type Breaks = { readonly text: string; readonly lineEnd?: boolean }[];
/** pdfmake's own word breaker (Unicode line breaking), so the pieces are the ones it would measure. */
type TextBreakerClass = new () => { getBreaks(text: string, styles: null): Breaks };
// A CommonJS module: Node hands over its exports object, a bundler may hand over the class.
const textBreakerExport = (textBreakerModule as { default: TextBreakerClass | { default: TextBreakerClass } }).default;
const textBreaker = new (typeof textBreakerExport === 'function' ? textBreakerExport : textBreakerExport.default)();

/** Pieces already cut, by face and text, with their widths in ems. */
const emPieces = new Map<string, { text: string; ems: number; leadingEms: number; trailingEms: number; lineEnd: boolean }[]>();

/**
 * A text's pieces between break opportunities (a no-wrap text is one piece), measured as
 * pdfmake measures them (TextInlines.measure).
 */
function piecesOf(text: string, face: Face, sizePt: number, noWrap = false): Piece[] {
  const key = `${face}\u0000${noWrap ? 'n' : 'w'}${text}`;
  let pieces = emPieces.get(key);
  if (pieces === undefined) {
    pieces = (noWrap ? [{ text }] : textBreaker.getBreaks(text, null)).map((piece) => {
      const leading = /^\s+/.exec(piece.text)?.[0];
      const trailing = /\s+$/.exec(piece.text)?.[0];
      return { text: piece.text, ems: textEms(piece.text, face), leadingEms: leading ? textEms(leading, face) : 0, trailingEms: trailing ? textEms(trailing, face) : 0, lineEnd: piece.lineEnd === true };
    });
    if (emPieces.size > 20_000) emPieces.clear();
    emPieces.set(key, pieces);
  }
  return pieces.map((piece) => ({ text: piece.text, widthPt: piece.ems * sizePt, leadingCutPt: piece.leadingEms * sizePt, trailingCutPt: piece.trailingEms * sizePt, lineEnd: piece.lineEnd }));
}

/** Whether the document being built has its lines cut here (SheetPdfOptions.cutLines), set for the length of sheetDocument. */
let cutting = true;

type Fitted = { text: string; noWrap?: true } | { stack: { text: string; noWrap: true }[] };
const asLines = (lines: readonly string[]): Fitted =>
  lines.length === 1 ? { text: lines[0]!, noWrap: true } : { stack: lines.map((line) => ({ text: line, noWrap: true as const })) };

/**
 * Whether each line, drawn as one piece, is as wide as its pieces drawn one by one: pdfkit
 * shapes a line between spaces only, so a kerning pair across a break that is not a space
 * ("T-" and "V", say) would move the glyphs after it; such a text is left to pdfmake.
 */
function sameAsPieces(lines: readonly string[], face: Face): boolean {
  return lines.every((line) => {
    const key = `${face}\u0000${line}`;
    let same = linesSameAsPieces.get(key);
    if (same === undefined) {
      const pieces = textBreaker.getBreaks(line, null);
      same = pieces.every((piece, index) => /[ \t]$/.test(piece.text) || index === pieces.length - 1) || Math.abs(textEms(line, face) - pieces.reduce((sum, piece) => sum + textEms(piece.text, face), 0)) < 1e-9;
      if (linesSameAsPieces.size > 20_000) linesSameAsPieces.clear();
      linesSameAsPieces.set(key, same);
    }
    return same;
  });
}
const linesSameAsPieces = new Map<string, boolean>();

/**
 * A text as the lines pdfmake would break it into at `widthPt`, each one unbroken piece (one
 * line: the text itself, unbroken), or the text as it is where app/host/sheetLines leaves the
 * decision to pdfmake. The page looks the same either way.
 */
function fitted(text: string, face: Face, sizePt: number, widthPt: number): Fitted {
  if (!cutting) return { text };
  const lines = wrapPieces(piecesOf(text, face, sizePt), widthPt, false, (part) => textWidthPt(part, face, sizePt));
  return lines === null || lines.includes('') || !sameAsPieces(lines, face) ? { text } : asLines(lines);
}

interface CellText {
  readonly text: string;
  readonly face: Face;
  readonly sizePt: number;
  readonly noWrap: boolean;
}

/**
 * A table's column widths as pdfmake would size them and its cells cut into lines at those
 * widths (a no-wrap cell stays one piece), or null to leave the table to pdfmake.
 *
 * @param widths - pdfmake's column widths: 'auto', '*' or points
 * @param offsetsPt - the table's paddings and vertical rules across, as pdfmake adds them
 * @param roomPt - the width the table is laid out in
 */
function fittedTable(widths: readonly ('auto' | '*' | number)[], cells: readonly (readonly CellText[])[], offsetsPt: number, roomPt: number): { widths: number[]; cells: Fitted[][] } | null {
  if (!cutting) return null;
  const pieces = cells.map((row) => row.map((cell) => piecesOf(cell.text, cell.face, cell.sizePt, cell.noWrap)));
  const sizing = widths.map((width, column): ColumnSizing => {
    if (typeof width === 'number') return { kind: 'fixed', widthPt: width };
    const ranges = cells.map((row, index) => widthRange(pieces[index]![column]!, row[column]!.noWrap));
    return { kind: width === '*' ? 'star' : 'auto', minPt: Math.max(0, ...ranges.map((range) => range.minPt)), maxPt: Math.max(0, ...ranges.map((range) => range.maxPt)) };
  });
  const sized = columnWidths(sizing, roomPt - offsetsPt);
  if (sized === null) return null;
  const fittedCells: Fitted[][] = [];
  for (const [rowIndex, row] of cells.entries()) {
    const fittedRow: Fitted[] = [];
    for (const [column, cell] of row.entries()) {
      if (cell.noWrap) fittedRow.push({ text: cell.text, noWrap: true });
      else {
        const lines = sized.widest[column] ? unwrappedLines(pieces[rowIndex]![column]!) : wrapPieces(pieces[rowIndex]![column]!, sized.widthsPt[column]!, sized.auto[column], (text) => textWidthPt(text, cell.face, cell.sizePt));
        if (lines === null || lines.includes('') || !sameAsPieces(lines, cell.face)) return null;
        fittedRow.push(asLines(lines));
      }
    }
    fittedCells.push(fittedRow);
  }
  return { widths: sized.widthsPt, cells: fittedCells };
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
      return { ...fitted(text, 'bold', 8.5, widthPt), bold: true, margin: [0, 2, 0, 4] };
    case 'note':
      return { ...fitted(text, 'italics', 7.5, widthPt), fontSize: 7.5, italics: true, margin: [0, 2, 0, 6] };
    case 'small':
      return { ...fitted(text, 'normal', 7, widthPt - 8), fontSize: 7, color: '#333333', margin: [8, 0, 0, 5] };
    case 'body':
      return { ...fitted(text, 'normal', 8.5, widthPt), margin: [0, 2, 0, 3] };
  }
}

function table(block: Extract<SheetBlock, { kind: 'table' }>, widthPt: number): Content[] {
  const caption: Content = { ...fitted(printable(block.caption), 'bold', 8.5, widthPt), bold: true, fontSize: 8.5, margin: [0, 6, 0, 3] };
  if (block.rows.length === 0) return [{ stack: [caption, { text: printable(block.emptyText), italics: true, fontSize: 7.5, margin: [0, 0, 0, 6] }], unbreakable: true }];
  const texts: CellText[][] = [
    block.columns.map((column) => ({ text: printable(column.title), face: 'bold', sizePt: 7.5, noWrap: false })),
    ...[...block.rows, ...(block.totals ? [block.totals] : [])].map((row, rowIndex) =>
      row.map((text, index): CellText => ({ text: printable(text), face: rowIndex === block.rows.length ? 'bold' : 'normal', sizePt: 7.5, noWrap: block.columns[index]?.noWrap ?? false })),
    ),
  ];
  const specWidths = block.columns.some((column) => column.width === '*')
    ? block.columns.map((column) => (column.width === '*' ? ('*' as const) : ('auto' as const)))
    : block.columns.map(() => '*' as const);
  // Sized and cut here where pdfmake's sizing is restated exactly (app/host/sheetLines); pdfmake's
  // 'lightHorizontalLines' puts 8 pt of padding either side of each inner column boundary.
  const sized = fittedTable(specWidths, texts, 16 * (block.columns.length - 1), widthPt);
  const body: TableCell[][] = texts.map((row, rowIndex) =>
    row.map((cell, index) => ({
      alignment: block.columns[index]?.align ?? 'left',
      bold: cell.face === 'bold',
      ...(rowIndex === 0 ? { fillColor: grey } : {}),
      ...(sized ? sized.cells[rowIndex]![index]! : { text: cell.text, noWrap: cell.noWrap }),
    })),
  );
  const widths = sized?.widths ?? specWidths;
  // Caption, table and note side by side in the section rather than in a stack of their own
  // (the block's 6 pt below on its last part): the same layout, with one level fewer for
  // pdfmake's style look-ups of every cell to walk.
  return [
    caption,
    { table: { headerRows: 1, widths, body }, layout: 'lightHorizontalLines', fontSize: 7.5, margin: [0, 0, 0, block.note ? 0 : 6] },
    ...(block.note ? [{ ...fitted(printable(block.note), 'italics', 7, widthPt), fontSize: 7, italics: true, margin: [0, 2, 0, 6] } as Content] : []),
  ];
}

/** The findings' severity column, pt (a layout choice of ours). */
const severityWidthPt = 62;

function findings(block: Extract<SheetBlock, { kind: 'findings' }>, widthPt: number): Content[] {
  if (block.items.length === 0) return [{ text: printable(block.emptyText), italics: true, margin: [0, 0, 0, 6] }];
  // The text column: the room less the severity column, the left rule (3 pt for URGENT, else 1) and 4 pt of padding at each side of both cells.
  const textWidthFor = (severity: string) => widthPt - severityWidthPt - (severity === 'URGENT' ? 3 : 1) - 16;
  // Each finding in the section itself (the block's 6 pt below on the last one), as for tables.
  return block.items.map(
    (item, index): Content => ({
      table: {
        widths: [severityWidthPt, '*'],
        body: [
          [
            { text: item.severity, bold: true, fontSize: 8 },
            {
              stack: [
                fitted(printable(item.text), 'normal', 8.5, textWidthFor(item.severity)),
                { ...fitted(printable(`Sources: ${item.sources.join('; ')}${item.sourceUncertain ? ' — includes a value from memory or an unsure source' : ''}`), 'normal', 7, textWidthFor(item.severity)), fontSize: 7, color: '#333333', margin: [0, 1, 0, 0] },
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
            { ...fitted(printable(row.label), 'bold', 8.5, factLabelWidthPt), bold: true },
            fitted(printable(row.value), 'normal', 8.5, widthPt - factLabelWidthPt - noBordersGapPt),
          ]),
        },
        layout: 'noBorders',
        margin: [0, 4, 0, 4],
      }];
    case 'table':
      return table(item, widthPt);
    case 'chart':
      return [{ stack: [{ svg: printable(item.chart.svg), width: item.chart.width }, { ...fitted(printable(item.caption), 'italics', 7.5, widthPt), fontSize: 7.5, italics: true, margin: [0, 2, 0, 10] }], unbreakable: true }];
    case 'findings':
      return findings(item, widthPt);
  }
}

/** A section's title and blocks, straight into the content (no stack of its own, as for tables). */
function section(part: SheetSection, index: number, widthPt: number): Content[] {
  return [
    { ...fitted(part.title, 'bold', 12, widthPt), fontSize: 12, bold: true, margin: [0, index === 0 ? 0 : 6, 0, 4], ...(part.startsOnNewPage ? { pageBreak: 'before' as const } : {}) },
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
  cutting = options.cutLines ?? true;
  try {
    return documentOf(sheet, options);
  } finally {
    cutting = true;
  }
}

function documentOf(sheet: Sheet, options: SheetPdfOptions): TDocumentDefinitions {
  const { header } = sheet;
  const cut = cutting;
  const [year, month, day] = header.reviewDate.split('-').map(Number) as [number, number, number];
  const widthPt = pageWidthPt[options.paper] - 2 * sideMarginPt;
  // Written once for all pages: each page's header and footer are these, in one piece per line where they surely fit.
  const title = fitted(printable(`${header.title} — ${header.caseLabel}`), 'bold', 10, widthPt / 2);
  const dateLine = fitted(printable(`${(header.dateLabel ?? 'Review date').toLowerCase()} ${header.reviewDate} · prepared by ${header.preparedBy ?? 'not stated'}`), 'normal', 8, widthPt / 2);
  // Inside the caution's box: its 1.2 pt borders and pdfmake's default 4 pt padding either side.
  const caution = fitted(sheet.caution, 'bold', 7.5, widthPt - 2 * (1.2 + 4));
  const hashLine = fitted(`${header.toolVersion} · ${header.hashLabel ?? 'case file SHA-256'} ${header.caseFileSha256}`, 'normal', 6.5, widthPt - pageNumberWidthPt);
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
        { ...(cut ? fitted(`page ${currentPage} of ${pageCount}`, 'normal', 8, pageNumberWidthPt) : { text: `page ${currentPage} of ${pageCount}` }), alignment: 'right', fontSize: 8, width: pageNumberWidthPt },
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
