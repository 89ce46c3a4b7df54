import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { readCaseFile } from '../../../app/host/caseFiles';
import { readTextFile } from '../../../app/host/textFiles';
import { demoCase, tempDir } from '../cli/harness';
import { readFileSync } from 'node:fs';

// The byte-order mark and the UTF-8 encoding are those of the Unicode Standard (§3.9,
// §23.8): EF BB BF opens a file; C3 28 is an invalid two-byte sequence (28 is not a
// continuation byte), the standard's own kind of example of ill-formed UTF-8.
const demoText = readFileSync(demoCase('th-0417'), 'utf8');

describe('reading a text file', () => {
  it('accepts a file that starts with the UTF-8 byte-order mark', () => {
    const path = join(tempDir(), 'bom.json');
    writeFileSync(path, Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), Buffer.from(demoText)]));
    const read = readCaseFile(path);
    expect(read.ok).toBe(true);
  });

  it('refuses bytes that are not UTF-8, naming the field that holds them', () => {
    const path = join(tempDir(), 'latin.json');
    const [before, after] = demoText.split('"label": "');
    writeFileSync(path, Buffer.concat([Buffer.from(`${before}"label": "`), Buffer.from([0xc3, 0x28]), Buffer.from(after!)]));
    const read = readTextFile(path, 'case file');
    expect(read.ok).toBe(false);
    if (read.ok) return;
    expect(read.issues[0]!.message).toContain('bytes that are not UTF-8 text in patient.label');
  });

  it('says when the path is a folder', () => {
    const read = readTextFile(tempDir(), 'product catalogue', ['--catalogue']);
    expect(read.ok).toBe(false);
    if (!read.ok) expect(read.issues[0]).toMatchObject({ path: ['--catalogue'] });
    if (!read.ok) expect(read.issues[0]!.message).toContain('it is a folder, not a file');
  });
});
