import { execFileSync } from 'node:child_process';
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { tempDir } from '../cli/harness';

// Poppler's command-line tools (Debian poppler-utils; .ci/run installs them when missing):
// an independent reader of the PDFs we write.

/** Save bytes to a temporary .pdf and return its path. */
export function savePdf(bytes: Uint8Array, name = 'sheet.pdf'): string {
  const path = join(tempDir('cl-pdf-'), name);
  writeFileSync(path, bytes);
  return path;
}

/** pdfinfo's fields ("Pages", "Page size", "Title", …). */
export function pdfInfo(path: string): Record<string, string> {
  const text = execFileSync('pdfinfo', [path], { encoding: 'utf8' });
  return Object.fromEntries(text.split('\n').filter((line) => line.includes(':')).map((line) => [line.slice(0, line.indexOf(':')).trim(), line.slice(line.indexOf(':') + 1).trim()]));
}

/** The text of one page (or all with page 0), whitespace runs collapsed to one space. */
export function pdfText(path: string, page = 0): string {
  const range = page === 0 ? [] : ['-f', String(page), '-l', String(page)];
  return execFileSync('pdftotext', [...range, path, '-'], { encoding: 'utf8' }).replace(/\s+/g, ' ');
}

/** pdffonts' table rows: name, type, encoding, embedded. */
export function pdfFonts(path: string): { name: string; embedded: boolean }[] {
  const lines = execFileSync('pdffonts', [path], { encoding: 'utf8' }).split('\n').slice(2).filter((line) => line.trim() !== '');
  return lines.map((line) => {
    const columns = line.trim().split(/\s+/);
    return { name: columns[0]!, embedded: columns[columns.length - 5] === 'yes' };
  });
}
