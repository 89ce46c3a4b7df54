import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parseCase } from '../../core/model/parseCase';
import { findingGroups, triggerText } from '../../renderer/viewModels/findings';
import { reviewOf } from '../../renderer/viewModels/review';

// The Findings screen's value lines, from core's findings on the invented demo
// cases (assets/demo): each date is written once. The dates checked are the
// entries' own dates in the case files, read here independently of core.
const demo = (name: string) => {
  const json = JSON.parse(readFileSync(new URL(`../../assets/demo/${name}.json`, import.meta.url), 'utf8')) as { results: { kind: string; date: string }[]; review: { reviewDate: string } };
  const parsed = parseCase(json);
  if (!parsed.ok) throw new Error(`${name} does not parse`);
  const review = reviewOf(parsed.value, json.review.reviewDate as never, 50);
  if (!review.ok) throw new Error(`${name} has no review`);
  return { json, lines: findingGroups(review.review.findings).flatMap((group) => group.cards.flatMap((card) => card.values)) };
};
const occurrences = (text: string, part: string) => text.split(part).length - 1;

describe('the values behind a finding', () => {
  it('a value that is a date (the last monitoring test) shows that date once', () => {
    const { json, lines } = demo('th-0417');
    // TH-0417's latest creatinine in the case file, before its review date.
    const lastCreatinine = json.results.filter((it) => it.kind === 'creatinine' && it.date <= json.review.reviewDate).map((it) => it.date).sort().at(-1)!;
    const line = lines.find((text) => text.startsWith('last serum creatinine'));
    expect(line).toBe(`last serum creatinine: ${lastCreatinine}`);
  });

  it('a measured value keeps its date, and the entry it comes from is named without repeating the date', () => {
    const { json, lines } = demo('th-0093');
    const lastFerritin = json.results.filter((it) => it.kind === 'ferritin' && it.date <= json.review.reviewDate).map((it) => it.date).sort().at(-1)!;
    const line = lines.find((text) => text.startsWith('ferritin:'))!;
    expect(line).toContain(`(${lastFerritin})`);
    expect(line).toMatch(/— results\[\d+\]$/);
    for (const text of lines) {
      for (const date of text.match(/\d{4}-\d{2}-\d{2}/g) ?? []) expect(occurrences(text, date), text).toBe(1);
    }
  });

  it('a reference that does not carry the date is kept whole', () => {
    expect(triggerText({ name: 'age', value: 7.3, unit: 'a', date: '2026-11-20' as never, ref: 'patient.age' })).toBe('age: 7.30 years (2026-11-20) — patient.age');
  });
});
