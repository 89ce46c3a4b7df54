import { describe, expect, it } from 'vitest';
import { scalingExponent } from '../../bench/harness';
import { generatedCaseJson, generatedReviewDate } from '../../bench/generatedCase';
import { parseCase } from '../../core/model/parseCase';
import { computeCase } from '../../core/ledger/computeCase';

// The benchmark's own arithmetic and inputs (no timing here: figures live in `npm run bench`).
describe('scalingExponent', () => {
  // A power law t = c·nᵏ has slope k on log–log axes (definition); least squares recovers it exactly
  // for exact power-law points, so the tolerance is floating-point rounding only.
  it('recovers the exponent of exact power laws', () => {
    const sizes = [1, 4, 16];
    expect(scalingExponent(sizes.map((size) => ({ size, ms: 3 * size })))).toBeCloseTo(1, 12);
    expect(scalingExponent(sizes.map((size) => ({ size, ms: 0.5 * size ** 2 })))).toBeCloseTo(2, 12);
    expect(scalingExponent(sizes.map((size) => ({ size, ms: 7 })))).toBeCloseTo(0, 12);
  });
});

describe('generated benchmark case', () => {
  it('is a valid case at every density the benchmark uses, with the record counts it claims', () => {
    for (const density of [1, 4, 16]) {
      const parsed = parseCase(generatedCaseJson(density));
      expect(parsed.ok, `density ${density}`).toBe(true);
      if (!parsed.ok) continue;
      // 20 years every 21/density days: 365 × 20 / 21 ≈ 347.6 → 348 transfusions × density (± density for the last interval).
      expect(Math.abs(parsed.value.transfusions.length - 348 * density)).toBeLessThanOrEqual(density);
      expect(parsed.value.results).toHaveLength(100 * density);
      expect(parsed.value.chelationPeriods).toHaveLength(10 * density);
      expect(parsed.value.proposedRegimens).toHaveLength(3);
    }
  });

  it('brings in about the same iron at every density (so only the record length grows)', () => {
    const totalRedCellMl = (density: number) => {
      const parsed = parseCase(generatedCaseJson(density));
      if (!parsed.ok) throw new Error('does not parse');
      return parsed.value.transfusions.reduce((sum, entry) => sum + ('volume' in entry ? entry.volume.value * (entry.unitHaematocrit ?? 0) : 0), 0);
    };
    // Volumes are rounded to whole mL (35 mL at ×16, from 35.0): the rounding stays under 2 %.
    expect(Math.abs(totalRedCellMl(16) / totalRedCellMl(1) - 1)).toBeLessThan(0.02);
  });

  it('computes on its review date with four projected scenarios', () => {
    const parsed = parseCase(generatedCaseJson(1));
    if (!parsed.ok) throw new Error('does not parse');
    const result = computeCase(parsed.value, generatedReviewDate, { samples: 50 });
    expect(result.ok).toBe(true);
    if (result.ok) expect(result.value.projection?.scenarios.length).toBe(4);
  });
});
