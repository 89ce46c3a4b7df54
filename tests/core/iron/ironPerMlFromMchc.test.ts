import { describe, expect, it } from 'vitest';
import { ironPerGramHaemoglobinMg, ironPerMlFromMchc, ironPerMlRedCellsFromMchc } from '../../../core/iron';
import { runFormula } from '../../../core/formulas/run';
import { findAssumption } from '../../../core/assumptions';
import { gPerDl } from '../../../core/units/quantity';

describe('iron per mL of red cells from the MCHC', () => {
  it('computes 3.466 mg Fe per g Hb from CIAAW Ar(Fe) = 55.845 and the 64 458 g/mol tetramer', () => {
    // CIAAW 2021 standard atomic weight of iron 55.845(2); references.md §1 prints 3.466
    // (4 × 55.845 / 64 458). Tolerance 5e-4: the printed value has four significant figures.
    expect(ironPerGramHaemoglobinMg).toBeCloseTo((4 * 55.845 * 1000) / 64458, 12);
    expect(Math.abs(ironPerGramHaemoglobinMg - 3.466)).toBeLessThan(5e-4);
  });

  it('gives the two published values of iron per mL of red cells at their stated red-cell haemoglobin', () => {
    // references.md §1: 1.08 mg/mL goes with red-cell Hb "about 31 g/dL" (Cohen et al. 2008)
    // and 1.16 mg/mL with "about 33–34 g/dL" (guideline literature). "About" a whole g/dL
    // carries ± 0.5 g/dL, i.e. ± 0.0175 mg/mL: tolerance 0.02 mg/mL.
    expect(Math.abs(ironPerMlRedCellsFromMchc(gPerDl(31)) - 1.08)).toBeLessThan(0.02);
    expect(Math.abs(ironPerMlRedCellsFromMchc(gPerDl(33.5)) - 1.16)).toBeLessThan(0.02);
    expect(findAssumption('iron-per-ml-red-cells')?.value).toBe(1.08);
  });

  it('follows g/dL × 10 × 3.466 ÷ 1000 (worked example of the doc comment: 31 g/dL → 1.0743 mg/mL)', () => {
    // Hand arithmetic: 31 × 10 × 3.46552 / 1000 = 1.07431; tolerance 1e-4 (rounding of the example).
    expect(ironPerMlRedCellsFromMchc(gPerDl(31))).toBeCloseTo(1.0743, 4);
    const run = runFormula(ironPerMlFromMchc, { mchcGPerDl: 31 });
    expect(run.ok && run.value.outputs.ironPerMlRedCellsMg).toBeCloseTo(1.0743, 4);
    expect(run.ok && run.value.outputs.ironPerGramHaemoglobinMg).toBe(ironPerGramHaemoglobinMg);
  });

  it('is proportional to the MCHC (invariant)', () => {
    expect(ironPerMlRedCellsFromMchc(gPerDl(34)) / ironPerMlRedCellsFromMchc(gPerDl(17))).toBeCloseTo(2, 12);
  });

  it('refuses an MCHC outside 25–40 g/dL, naming the range', () => {
    const run = runFormula(ironPerMlFromMchc, { mchcGPerDl: 310 });
    expect(run.ok).toBe(false);
    if (run.ok) return;
    expect(run.issues[0]).toMatchObject({ code: 'out_of_range', path: ['mchcGPerDl'] });
    expect(run.issues[0]?.message).toContain('25–40 g/dL');
  });
});
