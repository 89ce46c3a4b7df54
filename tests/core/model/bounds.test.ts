import { isValid, parseISO } from 'date-fns';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { toIsoDate } from '../../../core/dates';
import { boundedNumber, checkBounds, displayUnit, measuredQuantity, plausibleRangeText } from '../../../core/model/bounds';
import { isCaseDate } from '../../../core/model/caseDate';
import { daysPerWeekBounds, unitHaematocritBounds, weightBounds } from '../../../core/ranges/plausibleRanges';
import { describeValue, issuesFromZod, pathText } from '../../../core/model/zodIssues';

// The worked examples of the doc comments in core/model (style.md habit 5),
// with date-fns as the outside reference for what a calendar date is.

describe('doc examples of core/model', () => {
  it('displayUnit and plausibleRangeText', () => {
    expect(displayUnit('10*9/L')).toBe('×10⁹/L');
    expect(displayUnit('1')).toBe('');
    expect(plausibleRangeText(weightBounds)).toBe('2–200 kg');
    expect(plausibleRangeText(unitHaematocritBounds)).toBe('0.40–0.85');
  });

  it('checkBounds: the style guide sentence, a pass, and a warning', () => {
    expect(checkBounds(60, unitHaematocritBounds, 'refuse')).toEqual({
      code: 'out_of_range',
      message: '60 is outside 0.40–0.85; enter it as a fraction (0.60).',
    });
    expect(checkBounds(0.6, unitHaematocritBounds, 'refuse')).toBeUndefined();
    expect(checkBounds(0.9, unitHaematocritBounds, 'refuse')).toBeUndefined();
    expect(checkBounds(0.9, unitHaematocritBounds, 'warn')?.message).toBe(
      '0.9 is outside the plausible range 0.40–0.85; check the value and its unit.',
    );
  });

  it('boundedNumber and measuredQuantity', () => {
    expect(boundedNumber(daysPerWeekBounds, 'refuse').safeParse(8).success).toBe(false);
    expect(boundedNumber(daysPerWeekBounds, 'refuse').safeParse(5).success).toBe(true);
    expect(measuredQuantity({ kg: weightBounds }, 'refuse').safeParse({ value: 52, unit: 'kg' }).success).toBe(true);
    expect(measuredQuantity({ kg: weightBounds }, 'refuse').safeParse({ value: 52, unit: 'lb' }).success).toBe(false);
  });

  it('pathText, describeValue and issuesFromZod', () => {
    expect(pathText(['transfusions', 3, 'unitHaematocrit'])).toBe('transfusions[3].unitHaematocrit');
    expect(pathText([])).toBe('The case file');
    expect(describeValue('60%')).toBe('"60%"');
    expect(describeValue([1])).toBe('a list');
    const [converted] = issuesFromZod(
      [{ code: 'invalid_value', values: ['kg'], path: ['patient', 'weights', 0, 'weight', 'unit'], input: 'lb', message: '' }],
      'error',
    );
    expect(converted?.message).toBe('patient.weights[0].weight.unit "lb" is not one of: kg.');
  });

  it('isCaseDate: leap years, the 1900–2100 window, and agreement with date-fns inside it', () => {
    expect(isCaseDate('2024-02-29')).toBe(true);
    expect(isCaseDate('2023-02-29')).toBe(false);
    expect(isCaseDate('0219-05-01')).toBe(false);
    expect(isCaseDate('1900-01-01') && isCaseDate('2100-12-31')).toBe(true);
    expect(isCaseDate('1899-12-31') || isCaseDate('2101-01-01')).toBe(false);
    fc.assert(
      fc.property(fc.integer({ min: 1900, max: 2100 }), fc.integer({ min: 1, max: 12 }), fc.integer({ min: 1, max: 31 }), (year, month, day) => {
        const text = `${year}-${String(month).padStart(2, '0')}-${String(day).padStart(2, '0')}`;
        // date-fns parseISO rolls nothing over: an impossible day gives an invalid date.
        const real = isValid(parseISO(text)) && toIsoDate(parseISO(`${text}T00:00:00Z`)) === text;
        expect(isCaseDate(text)).toBe(real);
      }),
      { seed: 5, numRuns: 500 },
    );
  });
});
