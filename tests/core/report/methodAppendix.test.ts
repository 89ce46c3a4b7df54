import { describe, expect, it } from 'vitest';
import { computeCase } from '../../../core/ledger/computeCase';
import { derivationsOf } from '../../../core/report/derivationIndex';
import { formulaIdsIn } from '../../../core/formulas/derivation';
import { parseCase } from '../../../core/model/parseCase';
import { methodAppendix } from '../../../core/report/methodAppendix';
import { readDemo, withChange } from '../model/caseFixtures';

function derivations(json: unknown) {
  const parsed = parseCase(json);
  if (!parsed.ok) throw new Error('invalid');
  const results = computeCase(parsed.value, '2026-11-20');
  if (!results.ok) throw new Error('not computed');
  return derivationsOf(results.value);
}

// The appendix's rule (issue 6): it lists exactly what the shown numbers used.
describe('method appendix', () => {
  it('lists exactly the formulas of the derivations shown, each with sources', () => {
    const shown = derivations(readDemo('th-0417'));
    const appendix = methodAppendix(shown);
    const expected = new Set(shown.flatMap((it) => formulaIdsIn(it.derivation)));
    expect(new Set(appendix.formulas.map((it) => it.formulaId))).toEqual(expected);
    for (const formula of appendix.formulas) expect(formula.sources.length).toBeGreaterThan(0);
    // Showing only the intake leaves out the projection formula.
    const intakeOnly = methodAppendix(shown.filter((it) => it.id === 'intake'));
    expect(intakeOnly.formulas.map((it) => it.formulaId)).toEqual(['iron-intake-rate', 'net-transfusional-iron']);
  });

  it('lists each assumption once per value, with overrides and their reasons', () => {
    const json = withChange(readDemo('th-0417'), ['assumptionOverrides'], {
      'basal-iron-loss-mg-per-day': { value: 1.2, reason: 'local protocol', by: 'AB', at: '2026-11-20' },
    });
    const appendix = methodAppendix(derivations(json));
    const basal = appendix.assumptions.filter((it) => it.assumptionId === 'basal-iron-loss-mg-per-day');
    expect(basal).toHaveLength(1);
    expect(basal[0]).toMatchObject({ value: 1.2, overridden: true, reason: 'local protocol' });
    const ironPerMl = appendix.assumptions.find((it) => it.assumptionId === 'iron-per-ml-red-cells');
    expect(ironPerMl).toMatchObject({ value: 1.08, overridden: false });
  });
});
