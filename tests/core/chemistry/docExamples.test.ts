import { describe, expect, it } from 'vitest';
import { checkSetApplies, conditionalConstant, logMetalFraction } from '../../../core/chemistry/conditionalConstant';
import { describeConstantSet } from '../../../core/chemistry/formulas';
import { hydrolysisOf } from '../../../core/chemistry/hydrolysis';
import { ligandFraction, logLigandFraction } from '../../../core/chemistry/ligandFraction';
import { conditionalConstantSweep, pmSweep } from '../../../core/chemistry/phSweep';
import { defaultSetOf, findConstantSet } from '../../../core/chemistry/sets';
import { complex } from '../../../core/chemistry/sets/build';
import { elementOf, speciesName } from '../../../core/chemistry/speciesName';
import { molar, molarFromMicromolar, ph } from '../../../core/chemistry/types';

// The worked examples of the doc comments, each checked here (style.md habit 5). Where an
// example is a published value, the test that argues its tolerance is named instead.
describe('doc-comment examples of core/chemistry', () => {
  const edta = findConstantSet('edta-textbook-25c')!;

  it('logLigandFraction and ligandFraction (EDTA, 25 °C set): pH 10 → −0.524 (0.299); pH 7 → 3.76e-4', () => {
    expect(logLigandFraction(edta.protonationLogK, ph(10))).toBeCloseTo(-0.524, 3);
    expect(ligandFraction(edta.protonationLogK, ph(7))).toBeCloseTo(3.76e-4, 6);
  });

  it('logMetalFraction(Fe3+, 7.4) ≈ −9.10 (Stefánsson 2007: Fe(OH)2+ term 10^(−5.76 + 14.8) dominates)', () => {
    // Hand check: log(1 + 10^5.21 + 10^9.04 + 10^7.90 + 10^7.89) = 9.098.
    expect(logMetalFraction('Fe3+', ph(7.4))).toBeCloseTo(-9.098, 3);
  });

  it('conditionalConstant(EDTA, Ca2+, 7.4) ≈ 10.7 − 2.99 = 7.71', () => {
    const result = conditionalConstant(edta, 'Ca2+', ph(7.4));
    expect(result.ok && result.value.logConditional).toBeCloseTo(7.71, 2);
  });

  it('checkSetApplies names what a set covers', () => {
    const result = checkSetApplies(findConstantSet('deferiprone-remeasured-2019')!, 'Pb2+', ph(7.4));
    expect(!result.ok && result.issues[0]!.message).toMatch(/has no constant for Pb2\+; it covers Fe3\+\.$/);
  });

  it('pmSweep(deferoxamine)[11] is pH 7.5, pFe ≈ 26.94; conditionalConstantSweep(EDTA, Ca)[0] ≈ −2.89', () => {
    const swept = pmSweep(findConstantSet('deferoxamine-schwarzenbach-1963')!, 'Fe3+', molar(1e-6), molar(1e-5))[11]!;
    expect(swept.pH).toBe(7.5);
    expect(swept.ok && swept.value).toBeCloseTo(26.94, 2);
    const first = conditionalConstantSweep(edta, 'Ca2+')[0]!;
    expect(first.ok && first.value).toBeCloseTo(-2.89, 2);
  });

  it('small helpers: hydrolysisOf, findConstantSet, defaultSetOf, complex, elementOf, speciesName, molarFromMicromolar', () => {
    expect(hydrolysisOf('Fe3+').species[0]!.logBetaStar).toBe(-2.19);
    expect(edta.protonationLogK[0]).toBe(10.37);
    expect(defaultSetOf('deferiprone').id).toBe('deferiprone-remeasured-2019');
    expect(complex('Fe3+', { ligands: 3 }, 37.4, 'log β3 = 37.4').ligandCount).toBe(3);
    expect(elementOf('Fe3+')).toBe('Fe');
    expect([speciesName('Fe3+', 1, 3, 0), speciesName('Fe3+', 1, 1, 1), speciesName('Fe3+', 1, 1, -1), speciesName('Fe3+', 2, 0, -2), speciesName(null, 0, 1, 2)]).toEqual([
      'FeL3',
      'FeHL',
      'Fe(OH)L',
      'Fe2(OH)2',
      'H2L',
    ]);
    expect(molarFromMicromolar(1)).toBe(1e-6);
    expect(describeConstantSet(edta)).toMatch(/^edta-textbook-25c: EDTA, textbook protonation set/);
  });
});
