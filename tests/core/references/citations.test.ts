import { describe, expect, it } from 'vitest';
import { sourceCatalogue } from '../../../core/references';

// House rule: anything a user reads cites the publication, never one of the project's own files.
// Every text field of every source record reaches users (findings, calc --list, the sheet's method
// appendix, the about box), so none may name a project file or folder.
describe('source records', () => {
  it('never point a reader at a project file', () => {
    const projectFile = /\b[\w-]+\.md\b|shared\/|\bDEVELOPERS\b/;
    const offenders = sourceCatalogue.flatMap((source) =>
      Object.entries(source)
        .filter(([, value]) => typeof value === 'string' && projectFile.test(value))
        .map(([field, value]) => `${source.id}.${field}: ${String(value).slice(0, 80)}`),
    );
    expect(offenders).toEqual([]);
  });
});
