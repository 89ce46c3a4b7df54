import { describe, expect, it } from 'vitest';
import { addDaysIso } from '../../../core/dates';
import { computeCase } from '../../../core/ledger/computeCase';
import { derivationsOf } from '../../../core/report/derivationIndex';
import { findFormula } from '../../../core/catalogue';
import { formulaIdsIn, type Derivation } from '../../../core/formulas/derivation';
import { runFormula } from '../../../core/formulas/run';
import { parseCase } from '../../../core/model/parseCase';
import { readDemo, withChange } from '../model/caseFixtures';

function computed(json: unknown) {
  const parsed = parseCase(json);
  if (!parsed.ok) throw new Error(parsed.issues.map((it) => it.message).join('\n'));
  const result = computeCase(parsed.value, '2026-11-20');
  if (!result.ok) throw new Error('not computed');
  return result.value;
}

function walk(derivation: Derivation, visit: (node: Derivation) => void): void {
  visit(derivation);
  for (const input of derivation.inputs) if (input.origin.kind === 'computed') walk(input.origin.derivation, visit);
}

const withOverride = withChange(readDemo('th-0417'), ['assumptionOverrides'], {
  'iron-per-ml-red-cells': { value: 1.16, reason: 'local protocol uses 1.16', by: 'Pharmacist AB', at: '2026-11-20' },
  'efficiency-deferasirox': { value: 0.22, reason: 'unit audit 2026', by: 'Pharmacist AB', at: '2026-11-20' },
});

// Half the days covered by dispensings, so the expected removal's adherence is the proportion of days covered (a nested derivation).
const withDispensings = withChange(
  readDemo('th-0417'),
  ['dispensings'],
  Array.from({ length: 12 }, (_, index) => ({ id: `disp-${index}`, date: addDaysIso('2025-11-20', index * 30), drug: 'deferasirox', quantity: { value: 15, unit: '{each}' }, daysSupplied: 15 })),
);

describe('derivations of the headline results', () => {
  for (const [name, json] of [
    ['TH-0417', readDemo('th-0417')],
    ['TH-0093', readDemo('th-0093')],
    ['TH-0417 with overrides', withOverride],
    ['TH-0417 with dispensings', withDispensings],
  ] as const) {
    it(`${name}: feeding each derivation's inputs back to its named formula reproduces its outputs`, () => {
      // The outside reference here is the formula catalogue itself, run independently of the
      // ledger: a derivation that cannot be recomputed from what it shows is not checkable.
      // Tolerance 1e-9 relative: the same arithmetic in the same order, only JSON-free copies.
      let checked = 0;
      for (const named of derivationsOf(computed(json))) {
        walk(named.derivation, (node) => {
          const formula = findFormula(node.formulaId);
          expect(formula, node.formulaId).toBeDefined();
          const raw = Object.fromEntries(node.inputs.map((input) => [input.name, input.value]));
          const rerun = runFormula(formula!, raw);
          expect(rerun.ok, `${named.id} ${node.formulaId}`).toBe(true);
          if (!rerun.ok) return;
          for (const output of node.outputs) {
            const again = rerun.value.derivation.outputs.find((it) => it.name === output.name)!.value;
            if (typeof output.value === 'number') {
              expect(Math.abs((again as number) - output.value)).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(output.value)));
            } else {
              expect(again).toBe(output.value);
            }
          }
          checked += 1;
        });
      }
      expect(checked).toBeGreaterThan(10);
    });
  }

  it('uses only formula ids that are in the catalogue, each with a source', () => {
    for (const named of derivationsOf(computed(readDemo('th-0417')))) {
      for (const id of formulaIdsIn(named.derivation)) {
        const formula = findFormula(id);
        expect(formula, id).toBeDefined();
        expect(formula!.sourceIds.length).toBeGreaterThan(0);
      }
    }
  });

  it('shows an overridden assumption as overridden, with its reason, in every derivation that used it', () => {
    const results = computed(withOverride);
    const uses = new Map<string, { overridden: boolean; reason?: string }[]>();
    for (const named of derivationsOf(results)) {
      walk(named.derivation, (node) => {
        for (const input of node.inputs) {
          const origin = input.origin;
          if (origin.kind === 'assumption') {
            uses.set(origin.assumptionId, [...(uses.get(origin.assumptionId) ?? []), { overridden: origin.overridden, ...(origin.reason ? { reason: origin.reason } : {}) }]);
          }
          if (origin.kind === 'record') {
            for (const use of origin.assumptions ?? []) {
              uses.set(use.assumptionId, [...(uses.get(use.assumptionId) ?? []), { overridden: use.overridden, ...(use.reason ? { reason: use.reason } : {}) }]);
            }
          }
        }
      });
    }
    const ironPerMl = uses.get('iron-per-ml-red-cells') ?? [];
    const efficiency = uses.get('efficiency-deferasirox') ?? [];
    expect(ironPerMl.length).toBeGreaterThan(3);
    expect(efficiency.length).toBeGreaterThan(3);
    for (const use of ironPerMl) expect(use).toEqual({ overridden: true, reason: 'local protocol uses 1.16' });
    for (const use of efficiency) expect(use).toEqual({ overridden: true, reason: 'unit audit 2026' });
    // And the override changes the numbers: 1.16 / 1.08 more iron in the trailing year.
    const plain = computed(readDemo('th-0417'));
    expect(results.intake.transfusedMg / plain.intake.transfusedMg).toBeCloseTo(1.16 / 1.08, 9);
  });

  it('agrees with the iron account: the intake derivation gives the same mg as the monthly account', () => {
    const results = computed(readDemo('th-0417'));
    const windowIron = results.intake.derivation.inputs.find((it) => it.name === 'totalIronMg')!;
    expect(windowIron.value as number).toBeCloseTo(results.intake.netMg, 6);
  });
});
