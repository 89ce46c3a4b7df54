import fc from 'fast-check';
import { quantile as referenceQuantile } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { quantileOfSorted, quantilesOfUnsorted } from '../../../core/ledger/quantile';

// The projection band reads its quantiles without sorting (quantilesOfUnsorted). The old path
// sorted each month's draws and read quantileOfSorted; the new one must give the same numbers
// to the last bit (Object.is: -0 and NaN included), since the sheet, the screens and the saved
// reviews print them. Checked here against that old path on drawn samples, including the
// awkward ones: repeated values, one value, a constant sample, NaN and infinities, and samples
// squeezed into a spread of a few units in the last place.
const oldPath = (values: readonly number[], probabilities: readonly number[]) => {
  const sorted = Float64Array.from(values).sort();
  return probabilities.map((probability) => quantileOfSorted(sorted, probability));
};

const bandProbabilities = [0.1, 0.5, 0.9];

describe('band quantiles without a sort', () => {
  // Up to 800 values: both the small samples sorted whole (up to 256) and the bucketed path.
  it('equal the sorted path bit for bit on drawn samples', () => {
    const value = fc.oneof(
      fc.double({ noNaN: true, noDefaultInfinity: true, min: -1e6, max: 1e6 }),
      fc.integer({ min: -3, max: 3 }).map((it) => it / 2),
      fc.constantFrom(0, -0, 1e-300, 5e-324, Number.MAX_VALUE, -Number.MAX_VALUE),
    );
    const probabilities = fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 1, maxLength: 6 });
    fc.assert(
      fc.property(fc.array(value, { minLength: 1, maxLength: 800 }), probabilities, (values, ps) => {
        const before = [...values];
        const found = quantilesOfUnsorted(Float64Array.from(values), ps);
        const expected = oldPath(values, ps);
        found.forEach((it, index) => expect(Object.is(it, expected[index]) || it === expected[index]).toBe(true));
        expect(values).toEqual(before);
      }),
      { numRuns: 1500, seed: 16 },
    );
  });

  it('equal the sorted path on projection-like draws of 2,000 (log-normal, with ties)', () => {
    // A seeded stream (fast-check's own) of log-normal draws like a month of a band, some rounded to make ties.
    fc.assert(
      fc.property(fc.array(fc.double({ min: -3, max: 3, noNaN: true }), { minLength: 2000, maxLength: 2000 }), fc.boolean(), (normals, rounded) => {
        const values = normals.map((z) => (rounded ? Math.round(12 * Math.exp(0.35 * z) * 10) / 10 : 12 * Math.exp(0.35 * z)));
        expect(quantilesOfUnsorted(Float64Array.from(values), bandProbabilities)).toEqual(oldPath(values, bandProbabilities));
      }),
      { numRuns: 60, seed: 17 },
    );
  });

  it('keep the sort’s order where NaN or infinities are present, and a constant sample gives its value', () => {
    const awkward = [3, Number.NaN, 1, Number.POSITIVE_INFINITY, 2, Number.NEGATIVE_INFINITY, 2];
    expect(quantilesOfUnsorted(Float64Array.from(awkward), [0, 0.3, 0.5, 1])).toEqual(oldPath(awkward, [0, 0.3, 0.5, 1]));
    expect(quantilesOfUnsorted(Float64Array.of(4.2, 4.2, 4.2), bandProbabilities)).toEqual([4.2, 4.2, 4.2]);
    expect(quantilesOfUnsorted(Float64Array.of(7), bandProbabilities)).toEqual([7, 7, 7]);
    expect(() => quantilesOfUnsorted(new Float64Array(0), [0.5])).toThrow(/at least one value/);
    expect(() => quantilesOfUnsorted(Float64Array.of(1, 2), [1.5])).toThrow(/outside 0–1/);
  });

  it('agree with simple-statistics where both interpolate (definition 7)', () => {
    // simple-statistics (registry package) is the outside reference; its quantile uses another rule
    // at exact order statistics, so the check is at points where (n − 1)p is not whole.
    const values = [10, 1, 8, 3, 15, 4];
    expect(quantilesOfUnsorted(Float64Array.from(values), [0.5])[0]).toBeCloseTo(referenceQuantile(values, 0.5), 12);
  });
});
