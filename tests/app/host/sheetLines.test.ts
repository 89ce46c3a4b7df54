import { createRequire } from 'node:module';
import { describe, expect, it } from 'vitest';
import { columnWidths, type ColumnSizing } from '../../../app/host/sheetLines';

// pdfmake's own column sizing (pdfmake/js/columnCalculator.js) is the reference for the restated rule.
const { buildColumnWidths } = createRequire(import.meta.url)('pdfmake/js/columnCalculator.js').default as {
  buildColumnWidths(columns: { width: string | number; _minWidth: number; _maxWidth: number; _calcWidth?: number }[], availableWidth: number): void;
};

/** A small seeded generator (Park–Miller), so the tables are the same on every run. */
function seeded(seed: number): () => number {
  let state = seed;
  return () => {
    state = (state * 48_271) % 2_147_483_647;
    return state / 2_147_483_647;
  };
}

describe('columnWidths (pdfmake column sizing restated)', () => {
  it('gives the widths pdfmake gives, or leaves the table to pdfmake when it cannot fit its words', () => {
    const random = seeded(20_261_120);
    let sized = 0;
    let left = 0;
    for (let table = 0; table < 2000; table += 1) {
      const columns: ColumnSizing[] = Array.from({ length: 1 + Math.floor(random() * 6) }, () => {
        const kind = random();
        if (kind < 0.15) return { kind: 'fixed', widthPt: 20 + random() * 100 };
        const minPt = random() * 80;
        return { kind: kind < 0.7 ? 'auto' : 'star', minPt, maxPt: minPt + random() * 300 };
      });
      const availablePt = 100 + random() * 450;
      const ours = columnWidths(columns, availablePt);
      const theirs = columns.map((column): { width: string | number; _minWidth: number; _maxWidth: number; _calcWidth?: number } =>
        column.kind === 'fixed' ? { width: column.widthPt, _minWidth: 0, _maxWidth: 0 } : { width: column.kind === 'auto' ? 'auto' : '*', _minWidth: column.minPt, _maxWidth: column.maxPt },
      );
      buildColumnWidths(theirs, availablePt);
      const fixed = columns.reduce((sum, column) => sum + (column.kind === 'fixed' ? column.widthPt : 0), 0);
      const stars = columns.filter((column) => column.kind === 'star') as { minPt: number }[];
      const autos = columns.filter((column) => column.kind === 'auto') as { minPt: number }[];
      const minW = autos.reduce((sum, column) => sum + column.minPt, 0) + stars.length * Math.max(0, ...stars.map((column) => column.minPt));
      if (ours === null) {
        left += 1;
        // Only a table that cannot fit its narrowest words (pdfmake's first case) is left, bar a hair's breadth.
        expect(minW).toBeGreaterThanOrEqual(availablePt - fixed - 0.01);
        continue;
      }
      sized += 1;
      ours.widthsPt.forEach((width, index) => expect(width).toBeCloseTo(theirs[index]!._calcWidth!, 9));
    }
    expect(sized).toBeGreaterThan(500);
    expect(left).toBeGreaterThan(100);
  });
});
