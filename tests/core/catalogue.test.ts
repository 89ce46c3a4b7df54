import { describe, expect, it } from 'vitest';
import { assumptionCatalogue, findAssumption } from '../../core/assumptions';
import { formulaCatalogue } from '../../core/catalogue';
import { findSource } from '../../core/references';

// Invariants of the catalogue itself: every formula and assumption names sources
// that exist, ids are stable kebab-case, ranges are sane. No outside reference
// is needed here: these are the project's own bookkeeping rules (style.md habit 4).
describe('formula catalogue', () => {
  it('has formulas', () => {
    expect(formulaCatalogue.length).toBeGreaterThan(0);
  });

  for (const formula of formulaCatalogue) {
    describe(formula.id, () => {
      it('has a kebab-case id, a title, an expression and at least one known source', () => {
        expect(formula.id).toMatch(/^[a-z0-9]+(-[a-z0-9]+)*$/);
        expect(formula.title.length).toBeGreaterThan(3);
        expect(formula.expression.length).toBeGreaterThan(3);
        expect(formula.sourceIds.length).toBeGreaterThan(0);
        for (const sourceId of formula.sourceIds) expect(findSource(sourceId), `source ${sourceId}`).toBeDefined();
      });

      it('has sane input specs', () => {
        for (const [name, spec] of Object.entries(formula.inputs)) {
          expect(name).toMatch(/^[a-z][A-Za-z0-9]*$/);
          if (spec.kind === 'number') {
            expect(spec.min, name).toBeLessThanOrEqual(spec.max);
            if (spec.assumption) {
              const assumption = findAssumption(spec.assumption);
              expect(assumption, spec.assumption).toBeDefined();
              expect(assumption!.value).toBeGreaterThanOrEqual(spec.min);
              expect(assumption!.value).toBeLessThanOrEqual(spec.max);
            }
            if (spec.default !== undefined) {
              expect(spec.default).toBeGreaterThanOrEqual(spec.min);
              expect(spec.default).toBeLessThanOrEqual(spec.max);
            }
          } else {
            expect(spec.choices.length).toBeGreaterThan(0);
            if (spec.default !== undefined) expect(spec.choices).toContain(spec.default);
          }
        }
        expect(Object.keys(formula.outputs).length).toBeGreaterThan(0);
      });
    });
  }
});

describe('assumption catalogue', () => {
  for (const assumption of assumptionCatalogue) {
    it(`${assumption.id} cites known sources and sits inside its own range`, () => {
      expect(assumption.value).toBeGreaterThanOrEqual(assumption.min);
      expect(assumption.value).toBeLessThanOrEqual(assumption.max);
      for (const sourceId of [...assumption.sourceIds, ...assumption.alternatives.flatMap((it) => it.sourceIds)]) {
        expect(findSource(sourceId), sourceId).toBeDefined();
      }
    });
  }
});
