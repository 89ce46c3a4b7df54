import { describe, expect, it } from 'vitest';
import { formatAmount, formatGrouped, formatNumber, formatPlain, formatReadable, formatTrimmed } from '../../../core/numbers/formatNumber';

// The doc-comment examples of the one number formatter, checked as written, and the workspace's
// grouped form against the ECMA-402 reference (Intl.NumberFormat 'en-GB', the formatter the
// screens used before they read this module): the same text for the values a screen shows.
describe('core/numbers/formatNumber', () => {
  it('keeps each doc example', () => {
    expect(formatNumber(181.44, 1)).toBe('181.4');
    expect(formatNumber(0.01234, 2)).toBe('0.0123');
    expect(formatPlain(0.1 + 0.2)).toBe('0.3');
    expect(formatReadable(-97.49891528)).toBe('-97.4989');
    expect([formatTrimmed(37.04, 0), formatTrimmed(0.02286, 4), formatTrimmed(1.3, 2)]).toEqual(['37', '0.0229', '1.3']);
    expect([formatAmount(1080), formatAmount(20.769, 1), formatAmount(1.5)]).toEqual(['1,080', '20.8', '1.5']);
    expect([formatGrouped(2900, 0), formatGrouped(11.4, 2)]).toEqual(['2,900', '11.40']);
  });

  it('groups as Intl.NumberFormat en-GB does for screen values (fixed decimals)', () => {
    const reference = (value: number, decimals: number) => value.toLocaleString('en-GB', { minimumFractionDigits: decimals, maximumFractionDigits: decimals });
    for (const value of [0, 0.5, 1.25, 9.99, 52, 181.44, 1080, 2900, 12345.678, 1234567.5, -3.5, -1080, 0.004]) {
      for (const decimals of [0, 1, 2, 3]) expect(formatGrouped(value, decimals), `${value}, ${decimals}`).toBe(reference(value, decimals));
    }
  });
});
