import { describe, expect, it } from 'vitest';
import { findSource, type Source } from '../../../core/references';
import { safetyRules } from '../../../core/safety/rules';
import { labelInteractions } from '../../../core/safety/interactionCatalogue';
import { thresholdCatalogue } from '../../../core/thresholds';
import { readDemo } from '../model/caseFixtures';
import { md1102, sc0781, th0322 } from './scenarioCases';
import { findingsFor, reviewDate } from './safetyCases';

/**
 * Which published document a source record stands for, where it is a product label: the drug, the
 * jurisdiction and the revision year ('deferasirox · US · ?'). A label read at two revisions is two
 * documents. Other sources (papers, guidelines, our own choices) are one record by their id.
 * The outside reference is the labels themselves: a finding that cites the US deferasirox label for its
 * renal part and again for its monitoring part cites one document twice, which is what this test refuses.
 */
function documentOf(source: Source): string {
  if (!/marketing authorisation holder/i.test(source.authors)) return source.id;
  const text = `${source.title} ${source.publication}`;
  const drug = /deferasirox/i.test(text) ? 'deferasirox' : /deferiprone/i.test(text) ? 'deferiprone' : /deferoxamine/i.test(text) ? 'deferoxamine' : 'other';
  const us = /\bUS\b/.test(text);
  const eu = /\b(EU|UK)\b|summary of product characteristics/i.test(text);
  const jurisdiction = us && eu ? 'US and EU' : us ? 'US' : eu ? 'EU' : 'unstated';
  return `${drug} · ${jurisdiction} · ${source.year ?? '?'}`;
}

/** Every source id a finding can cite: the rules', the thresholds' and the interaction catalogue's. */
const citable = [
  ...new Set([...safetyRules.flatMap((rule) => rule.sourceIds), ...thresholdCatalogue.flatMap((it) => it.sourceIds), ...labelInteractions.flatMap((it) => it.sourceIds)]),
];

describe('one source record per document (issue 10: a finding never cites the same document twice)', () => {
  it('no label document a finding can cite has two records, and none stands for two jurisdictions at once', () => {
    const byDocument = new Map<string, string[]>();
    for (const id of citable) {
      const source = findSource(id);
      expect(source, id).toBeDefined();
      const document = documentOf(source!);
      byDocument.set(document, [...(byDocument.get(document) ?? []), id]);
    }
    const shared = [...byDocument.entries()].filter(([, ids]) => ids.length > 1);
    expect(shared).toEqual([]);
    expect([...byDocument.keys()].filter((it) => it.includes('US and EU'))).toEqual([]);
  });

  const cases: readonly (readonly [string, unknown])[] = [
    ['TH-0417 (assets/demo)', readDemo('th-0417')],
    ['TH-0093 (assets/demo)', readDemo('th-0093')],
    ['MD-1102 (scenario 2)', md1102()],
    ['TH-0322 (scenario 5)', th0322()],
    ['SC-0781', sc0781()],
  ];
  for (const [name, json] of cases) {
    it(`${name}: no finding lists one document twice`, () => {
      const findings = findingsFor(json, reviewDate);
      expect(findings.length).toBeGreaterThan(0);
      for (const finding of findings) {
        const documents = finding.sourceIds.map((id) => documentOf(findSource(id)!));
        expect(new Set(finding.sourceIds).size, `${finding.ruleId}: ${finding.sourceIds.join(', ')}`).toBe(finding.sourceIds.length);
        expect(new Set(documents).size, `${finding.ruleId}: ${documents.join(' | ')}`).toBe(documents.length);
      }
    });
  }
});
