import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

// House rule (style.md, habit 12): each third-party library has one owning module.
const root = fileURLToPath(new URL('../../..', import.meta.url));
function sourceFiles(folder: string): string[] {
  return readdirSync(join(root, folder)).flatMap((name) => {
    const path = join(folder, name);
    return statSync(join(root, path)).isDirectory() ? sourceFiles(path) : /\.tsx?$/.test(name) ? [path] : [];
  });
}
const importers = (pattern: RegExp) =>
  ['core', 'app', 'renderer'].flatMap(sourceFiles).filter((path) => pattern.test(readFileSync(join(root, path), 'utf8'))).map((path) => relative(root, join(root, path)));

describe('owning modules of the chart and PDF libraries', () => {
  it('imports d3 only in core/report/chartPrimitives.ts', () => {
    expect(importers(/from ['"]d3-/)).toEqual(['core/report/chartPrimitives.ts']);
  });
});

describe('owning module of the PDF library', () => {
  it('imports pdfmake and fontkit only in app/host/sheetPdf.ts', () => {
    expect(importers(/from ['"]pdfmake/)).toEqual(['app/host/sheetPdf.ts']);
    expect(importers(/from ['"]fontkit/)).toEqual(['app/host/sheetPdf.ts']);
  });
});
