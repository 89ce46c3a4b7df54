import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { checkDraft, draftFromJson, draftToJson, freshEntryId } from '../../renderer/viewModels/draftCase';
import { addRows, deleteRow, pasteRows, setCell } from '../../renderer/viewModels/recordEdits';
import { isMultiCellPaste, pastedCells } from '../../renderer/viewModels/recordTables';

const demoPath = fileURLToPath(new URL('../../assets/demo/th-0417.json', import.meta.url));
const demo = JSON.parse(readFileSync(demoPath, 'utf8')) as Record<string, unknown>;

describe('the draft of a case', () => {
  it('turns the invented scenario-1 case (scenarios.md §1) into rows and back without changing a value', () => {
    const draft = draftFromJson(demo);
    expect(draft.tables.transfusions.length).toBe((demo.transfusions as unknown[]).length);
    expect(draftToJson(draft)).toEqual(demo);
    const check = checkDraft(draft);
    expect(check.caseFile?.patient.label).toBe('TH-0417');
    expect(check.cellIssues.filter((it) => it.issue.severity === 'error')).toEqual([]);
  });

  it('keeps a percentage typed as a haematocrit as typed, and puts core\'s advice beside that cell (style.md: "enter it as a fraction")', () => {
    const draft = draftFromJson(demo);
    const first = draft.tables.transfusions[0]!;
    const edited = setCell(draft, 'transfusions', first.id, 'unitHaematocrit', '60');
    expect(edited.tables.transfusions[0]!.cells.unitHaematocrit).toBe('60');
    expect(draft.tables.transfusions[0]!.cells.unitHaematocrit).toBe('0.62'); // the old draft (undo) is untouched
    const check = checkDraft(edited);
    expect(check.caseFile).toBeNull();
    const placed = check.cellIssues.find((it) => it.rowId === first.id);
    expect(placed?.column).toBe('unitHaematocrit');
    expect(placed?.issue.message).toContain('enter it as a fraction (0.60)');
  });

  it('keeps text typed into a number cell and names the field, the value and the plausible range', () => {
    const draft = draftFromJson(demo);
    const first = draft.tables.transfusions[0]!;
    const check = checkDraft(setCell(draft, 'transfusions', first.id, 'volumeMl', '55O'));
    const placed = check.cellIssues.find((it) => it.column === 'volumeMl');
    expect(placed?.issue.message).toMatch(/"55O" is not a number; expected 10–2000 mL/);
  });

  it('gives new entries ids unique in their table', () => {
    const draft = draftFromJson(demo);
    const withTwo = addRows(draft, 'transfusions', [{ date: '2026-11-24' }, { date: '2026-11-24' }], null);
    const ids = withTwo.tables.transfusions.map((row) => row.id);
    expect(new Set(ids).size).toBe(ids.length);
    expect(freshEntryId(withTwo, 'transfusions', '2026-11-24')).toBe('tx-2026-11-24-3');
    expect(deleteRow(withTwo, 'transfusions', ids[ids.length - 1]!).tables.transfusions.length).toBe(ids.length - 1);
  });
});

describe('paste from a spreadsheet', () => {
  // Spreadsheets put a copied range on the clipboard as text/plain with cells
  // separated by a tab and rows by CR LF, the last row ending in CR LF (the
  // "text/tab-separated-values" layout, IANA media type registration).
  const clipboard = '2026-11-24\tsimple\t560\t0.6\t2\r\n2026-12-15\tsimple\t555\t0.61\t2\r\n2027-01-05\tsimple\t570\t0.59\t2\r\n';

  it('reads rows and cells from the column pasted into, dropping the trailing line break', () => {
    expect(isMultiCellPaste(clipboard)).toBe(true);
    expect(isMultiCellPaste('560')).toBe(false);
    expect(pastedCells('transfusions', clipboard, 'date')).toEqual([
      { date: '2026-11-24', kind: 'simple', volumeMl: '560', unitHaematocrit: '0.6', unitCount: '2' },
      { date: '2026-12-15', kind: 'simple', volumeMl: '555', unitHaematocrit: '0.61', unitCount: '2' },
      { date: '2027-01-05', kind: 'simple', volumeMl: '570', unitHaematocrit: '0.59', unitCount: '2' },
    ]);
    expect(pastedCells('transfusions', '540\t0.6\n', 'volumeMl')).toEqual([{ volumeMl: '540', unitHaematocrit: '0.6' }]);
  });

  it('fills the row pasted into and adds the rest below it; the case accepts the three transfusions', () => {
    const draft = addRows(draftFromJson(demo), 'transfusions', [{}], null);
    const blank = draft.tables.transfusions[draft.tables.transfusions.length - 1]!;
    const pasted = pasteRows(draft, 'transfusions', blank.id, pastedCells('transfusions', clipboard, 'date'));
    const rows = pasted.tables.transfusions;
    expect(rows.length).toBe(draft.tables.transfusions.length + 2);
    expect(rows.slice(-3).map((row) => row.cells.date)).toEqual(['2026-11-24', '2026-12-15', '2027-01-05']);
    const check = checkDraft(pasted);
    expect(check.caseFile?.transfusions.length).toBe(rows.length);
  });
});
