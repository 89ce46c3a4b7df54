import { describe, expect, it } from 'vitest';
import { sourceCatalogue } from '../../core/references';
import { sourceLine } from '../../renderer/viewModels/sources';
import { choiceFromText, choiceText, tableColumns } from '../../renderer/viewModels/recordTables';

// The screens read choice ids as core/words reads them (one table for the
// command line, the findings, the sheet and the screens). The expected words
// are the trade's: a label lists "film-coated tablets"; the source statuses are
// the ones DEVELOPERS.md names.
describe('choice ids on screen', () => {
  const formulation = tableColumns.chelationPeriods.find((it) => it.key === 'formulation')!;

  it('a select shows core\'s words for a choice', () => {
    expect(choiceText(formulation, 'film-coated-tablet')).toBe('film-coated tablets');
    expect(choiceText(formulation, 'dispersible-tablet')).toBe('dispersible tablets');
  });

  it('a pasted spelling finds its choice: the words shown, the id, or the id with spaces', () => {
    const cells = { drug: 'deferasirox' };
    for (const typed of ['film-coated tablets', 'Film coated tablet', 'film-coated-tablet']) {
      expect(choiceFromText('chelationPeriods', cells, 'formulation', typed)).toBe('film-coated-tablet');
    }
    expect(choiceFromText('chelationPeriods', cells, 'formulation', 'capsules')).toBe('capsules');
  });

  it('a source\'s status reads as words', () => {
    const commonPractice = sourceCatalogue.find((it) => it.status === 'common-practice');
    expect(commonPractice).toBeDefined();
    expect(sourceLine(commonPractice!.id).status).toBe('common practice');
  });
});
