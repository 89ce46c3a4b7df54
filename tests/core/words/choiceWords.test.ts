import { describe, expect, it } from 'vitest';
import { deferasiroxFormulations, deferiproneFormulations, deferoxamineFormulations, diagnosisGroups } from '../../../core/model';
import { choiceWords } from '../../../core/words';
import { cli, demoCase } from '../../app/cli/harness';

// Outside references for the words: the presentations as product labels name them
// ("film-coated tablets", "dispersible tablets", "oral solution"), and the disease names as
// the clinical literature writes them ("thalassaemia major", "sickle cell disease",
// "Diamond–Blackfan anaemia").

describe('choice ids in words', () => {
  it('reads formulations and diagnosis groups as the trade writes them', () => {
    expect(choiceWords('film-coated-tablet')).toBe('film-coated tablets');
    expect(choiceWords('dispersible-tablet')).toBe('dispersible tablets');
    expect(choiceWords('oral-solution')).toBe('oral solution');
    expect(choiceWords('thalassaemia-major')).toBe('thalassaemia major');
    expect(choiceWords('sickle-cell-disease')).toBe('sickle cell disease');
    expect(choiceWords('diamond-blackfan')).toBe('Diamond–Blackfan anaemia');
    expect(choiceWords('common-practice')).toBe('common practice');
  });

  it('leaves no id of the case model looking like an id', () => {
    for (const id of [...deferasiroxFormulations, ...deferiproneFormulations, ...deferoxamineFormulations, ...diagnosisGroups]) {
      // Hyphens left are those of compound adjectives, as the trade writes them.
      const text = ['non-transfusion-dependent', 'transfusion-dependent', 'film-coated'].reduce((rest, compound) => rest.replace(compound, ''), choiceWords(id));
      expect(text, id).not.toContain('-');
    }
  });

  it('prints words in the readable review and keeps ids in --json', async () => {
    const readable = await cli('compute', demoCase('th-0417'));
    expect(readable.out).toContain('thalassaemia major');
    expect(readable.out).toContain('deferasirox film-coated tablets 21 mg/kg');
    expect(readable.out).not.toMatch(/thalassaemia-major|film-coated-tablet|\[common-practice\]/);
    const json = JSON.parse((await cli('compute', demoCase('th-0417'), '--json')).out);
    expect(JSON.stringify(json)).toContain('"thalassaemia-major"');
  });
});
