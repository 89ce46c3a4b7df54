/**
 * pdfmake's line and column rules, restated so the sheet's writer can hand pdfmake text
 * already cut into its lines (app/host/sheetPdf.ts): pdfmake measures, lays out and draws
 * every word of a wrapping text on its own (a PDF text object each), a line given as one
 * unbroken piece once, with every glyph where it was.
 *
 * The rules are those of pdfmake 0.3 (LayoutBuilder.buildNextLine, Line.hasEnoughSpaceForInline,
 * TextInlines.buildInlines, columnCalculator.buildColumnWidths), worked on the same widths.
 * Where a decision is closer to call than `lineDecisionMarginPt`, or pdfmake would do what is
 * not restated here (cut inside a word, shrink a table below its words), the answer is null
 * and the writer leaves that text or table to pdfmake.
 */

/** A piece of text between two break opportunities, measured as pdfmake measures it. */
export interface Piece {
  readonly text: string;
  /** pt, trailing and leading spaces included */
  readonly widthPt: number;
  readonly leadingCutPt: number;
  readonly trailingCutPt: number;
  /** A line must end after this piece (a newline). */
  readonly lineEnd: boolean;
}

/**
 * How far inside or outside the room a measured width must be before a line end or a
 * column width is decided here, pt. A modelling choice of ours: the widths are pdfmake's own
 * arithmetic on the same fontkit advances (whole font units), so they differ from its only
 * by floating-point rounding, some 10⁻¹² pt; a thousandth of a point is far above that and
 * far below anything visible.
 */
export const lineDecisionMarginPt = 0.001;

/**
 * The lines pdfmake makes of `pieces` in `widthPt` (greedy: a piece joins the line when the
 * line without its trailing spaces still fits), or null when a decision is too close to call
 * or pdfmake would cut a piece (a word wider than the room left). `piecesFit`: the room is at
 * least as wide as any piece without spaces at its ends, by construction (an auto column is
 * never narrower than its widest such piece), so such a piece starting a line is never cut.
 * `measure`: a text's width as pdfmake measures it, for the one cut restated (a word whose
 * trailing space alone overhangs the line).
 */
export function wrapPieces(pieces: readonly Piece[], widthPt: number, piecesFit = false, measure?: (text: string) => number): string[] | null {
  const lines: string[] = [];
  let text = '';
  let inlineWidths = 0;
  let leadingCut = 0;
  let lastTrailingCut = 0;
  let open = false;
  for (const piece of pieces) {
    if (open) {
      const fitting = inlineWidths + piece.widthPt - leadingCut - piece.trailingCutPt;
      if (Math.abs(fitting - widthPt) <= lineDecisionMarginPt) return null;
      if (fitting < widthPt) {
        // pdfmake cuts a piece wider than the room left, trailing spaces counted.
        const room = widthPt - (inlineWidths - leadingCut - lastTrailingCut);
        let addedWidth = piece.widthPt;
        if (piece.widthPt >= room - lineDecisionMarginPt && piece.text.length > 1) {
          // Only its one trailing space overhangs (after a piece without one, as "mg/" then "g "):
          // pdfmake cuts the space off, then puts it back on the same line as a piece of its own.
          const word = piece.text.slice(0, -1);
          const wordWidth = measure && / $/.test(piece.text) && !/\s/.test(word) && piece.leadingCutPt === 0 ? measure(word) : Number.NaN;
          if (!(wordWidth <= room - lineDecisionMarginPt && piece.widthPt > room + lineDecisionMarginPt && inlineWidths + wordWidth - leadingCut <= widthPt - lineDecisionMarginPt)) return null;
          addedWidth = wordWidth + piece.trailingCutPt;
        }
        text += piece.text;
        inlineWidths += addedWidth;
        lastTrailingCut = piece.trailingCutPt;
        if (piece.lineEnd) {
          lines.push(text);
          open = false;
        }
        continue;
      }
      lines.push(text);
    }
    const fitsByConstruction = piecesFit && piece.leadingCutPt === 0 && piece.trailingCutPt === 0;
    if (!fitsByConstruction && piece.widthPt >= widthPt - lineDecisionMarginPt && piece.text.length > 1) return null;
    text = piece.text;
    inlineWidths = piece.widthPt;
    leadingCut = piece.leadingCutPt;
    lastTrailingCut = piece.trailingCutPt;
    open = !piece.lineEnd;
    if (piece.lineEnd) lines.push(text);
  }
  if (open) lines.push(text);
  return lines;
}

/** The narrowest and widest a text can be laid out, as pdfmake's buildInlines reckons them, pt. */
export function widthRange(pieces: readonly Piece[], noWrap: boolean): { readonly minPt: number; readonly maxPt: number } {
  let minPt = 0;
  let maxPt = 0;
  let line: { width: number; leadingCut: number; trailingCut: number } | null = null;
  for (const piece of pieces) {
    minPt = Math.max(minPt, Math.max(0, piece.widthPt - piece.leadingCutPt - piece.trailingCutPt));
    line ??= { width: 0, leadingCut: piece.leadingCutPt, trailingCut: 0 };
    line.width += piece.widthPt;
    line.trailingCut = piece.trailingCutPt;
    maxPt = Math.max(maxPt, Math.max(0, line.width - line.leadingCut - line.trailingCut));
    if (piece.lineEnd) line = null;
  }
  return { minPt: noWrap ? maxPt : minPt, maxPt };
}

/** A table column: pdfmake's 'auto' or '*' with its cells' width range, or a fixed width. */
export type ColumnSizing =
  | { readonly kind: 'auto' | 'star'; readonly minPt: number; readonly maxPt: number }
  | { readonly kind: 'fixed'; readonly widthPt: number };

/**
 * The widths pdfmake gives a table's columns in `availablePt` (the room less the table's
 * paddings and rules), or null where the table cannot fit its words (pdfmake then sets every
 * column to its narrowest) or a case is too close to call. `widest` marks the auto columns
 * set to their widest text: every text in one of those is unbroken in pdfmake by construction
 * (its column is at least as wide as the text, to the last bit), with no margin to call.
 */
export function columnWidths(columns: readonly ColumnSizing[], availablePt: number): { readonly widthsPt: number[]; readonly widest: boolean[]; readonly auto: boolean[] } | null {
  let available = availablePt;
  let autoMin = 0;
  let autoMax = 0;
  let starMaxMin = 0;
  let starMaxMax = 0;
  let stars = 0;
  for (const column of columns) {
    if (column.kind === 'fixed') available -= column.widthPt;
    else if (column.kind === 'auto') {
      autoMin += column.minPt;
      autoMax += column.maxPt;
    } else {
      starMaxMin = Math.max(starMaxMin, column.minPt);
      starMaxMax = Math.max(starMaxMax, column.maxPt);
      stars += 1;
    }
  }
  const minW = autoMin + starMaxMin * stars;
  const maxW = autoMax + starMaxMax * stars;
  if (minW >= available - lineDecisionMarginPt) return null;
  if (Math.abs(maxW - available) <= lineDecisionMarginPt) return null;
  const autosAtWidest = maxW < available;
  const widths = columns.map((column) => (column.kind === 'fixed' ? column.widthPt : 0));
  columns.forEach((column, index) => {
    if (column.kind !== 'auto') return;
    widths[index] = autosAtWidest ? column.maxPt : column.minPt + ((column.maxPt - column.minPt) * (available - minW)) / (maxW - minW);
  });
  // pdfmake takes each auto column off the room in turn, then shares the rest among the stars.
  for (const [index, column] of columns.entries()) if (column.kind === 'auto') available -= widths[index]!;
  columns.forEach((column, index) => {
    if (column.kind === 'star') widths[index] = available / stars;
  });
  return { widthsPt: widths, widest: columns.map((column) => column.kind === 'auto' && autosAtWidest), auto: columns.map((column) => column.kind === 'auto') };
}

/**
 * The lines of a text pdfmake does not wrap (it ends lines at newlines only), or null where
 * a line ends in spaces (pdfmake may then carry the spaces to the next line).
 */
export function unwrappedLines(pieces: readonly Piece[]): string[] | null {
  const lines: string[] = [];
  let text = '';
  for (const [index, piece] of pieces.entries()) {
    text += piece.text;
    const lineEnds = piece.lineEnd || index === pieces.length - 1;
    if (lineEnds && piece.trailingCutPt > 0) return null;
    if (piece.lineEnd) {
      lines.push(text);
      text = '';
    }
  }
  if (pieces.length > 0 && !pieces[pieces.length - 1]!.lineEnd) lines.push(text);
  return lines;
}
