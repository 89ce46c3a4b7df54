import { addMonths, compareAsc, isWithinInterval, parseISO } from 'date-fns';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { toIsoDate } from '../../../core/dates';
import {
  latestWeightOnOrBefore,
  parseCase,
  periodsActiveOn,
  resultsByKindBetween,
  resultsOfKindBetween,
  sortedByDate,
  type WeightEntry,
} from '../../../core/model';
import { eventDateSpan, eventDates } from '../../../core/model/eventDates';
import { reviewWindow, reviewYearsAfterRecord } from '../../../core/model/reviewWindow';
import { deepFreeze, readDemo } from './caseFixtures';

// Outside reference: date-fns (compareAsc, isWithinInterval on parsed dates)
// decides order and membership independently of our string comparisons; the
// worked examples are the ones in the helpers' doc comments.

const isoDate = fc
  .date({ min: new Date(Date.UTC(1990, 0, 1)), max: new Date(Date.UTC(2040, 11, 31)), noInvalidDate: true })
  .map((date) => toIsoDate(date));

const weight = (date: string, value: number): WeightEntry => ({ date, weight: { value, unit: 'kg' } });

describe('sortedByDate', () => {
  it('orders as date-fns compareAsc does, keeps ties in entry order, and leaves the input alone', () => {
    fc.assert(
      fc.property(fc.array(isoDate, { maxLength: 30 }), (dates) => {
        const entries = deepFreeze(dates.map((date, index) => ({ date, index })));
        const sorted = sortedByDate(entries);
        const reference = [...entries].sort((entry, other) => compareAsc(parseISO(entry.date), parseISO(other.date)) || entry.index - other.index);
        expect(sorted).toEqual(reference);
        expect(sorted).not.toBe(entries);
      }),
      { seed: 1, numRuns: 200 },
    );
  });

  it('matches its doc example', () => {
    expect(sortedByDate([{ date: '2026-05-01' }, { date: '2025-01-10' }]).map((it) => it.date)).toEqual(['2025-01-10', '2026-05-01']);
  });
});

describe('latestWeightOnOrBefore', () => {
  const weights = [weight('2026-04-30', 52), weight('2025-05-02', 48), weight('2025-11-18', 51)];

  it('takes the latest weighing on or before the date, whatever the order entered (doc example)', () => {
    expect(latestWeightOnOrBefore(weights, '2026-01-01')?.weight.value).toBe(51);
    expect(latestWeightOnOrBefore(weights, '2026-04-30')?.weight.value).toBe(52);
    expect(latestWeightOnOrBefore(weights, '2025-05-01')).toBeUndefined();
  });

  it('on a day with two weighings, takes the one entered last', () => {
    expect(latestWeightOnOrBefore([weight('2026-01-01', 50), weight('2026-01-01', 50.5)], '2026-06-01')?.weight.value).toBe(50.5);
  });

  it('is never after the date and no weighing lies between it and the date (date-fns)', () => {
    fc.assert(
      fc.property(fc.array(isoDate, { minLength: 1, maxLength: 20 }), isoDate, (dates, onDate) => {
        const entries = dates.map((date, index) => weight(date, 20 + index));
        const found = latestWeightOnOrBefore(entries, onDate);
        const onOrBefore = entries.filter((it) => compareAsc(parseISO(it.date), parseISO(onDate)) <= 0);
        if (onOrBefore.length === 0) {
          expect(found).toBeUndefined();
        } else {
          expect(found).toBeDefined();
          for (const other of onOrBefore) expect(compareAsc(parseISO(other.date), parseISO(found!.date))).toBeLessThanOrEqual(0);
        }
      }),
      { seed: 2, numRuns: 200 },
    );
  });
});

describe('periodsActiveOn', () => {
  it('counts the start and end days, and an open end as ongoing (doc example)', () => {
    const periods = [
      { id: 'a', startDate: '2024-01-01', endDate: '2024-06-30' },
      { id: 'b', startDate: '2024-07-01', endDate: null },
    ];
    expect(periodsActiveOn(periods, '2024-06-30').map((it) => it.id)).toEqual(['a']);
    expect(periodsActiveOn(periods, '2024-07-01').map((it) => it.id)).toEqual(['b']);
    expect(periodsActiveOn(periods, '2023-12-31')).toEqual([]);
    expect(periodsActiveOn([{ startDate: '2025-05-20', endDate: null }], '2026-11-20')).toHaveLength(1);
  });

  it('agrees with date-fns isWithinInterval', () => {
    fc.assert(
      fc.property(isoDate, isoDate, fc.boolean(), isoDate, (first, second, ongoing, onDate) => {
        const [startDate, endDate] = first <= second ? [first, second] : [second, first];
        const period = { startDate, endDate: ongoing ? null : endDate };
        const end = parseISO(ongoing ? '2100-12-31' : endDate);
        const expected = isWithinInterval(parseISO(onDate), { start: parseISO(startDate), end });
        expect(periodsActiveOn([period], onDate).length === 1).toBe(expected);
      }),
      { seed: 3, numRuns: 300 },
    );
  });
});

describe('resultsOfKindBetween', () => {
  const parsed = parseCase(readDemo('th-0093'));
  if (!parsed.ok) throw new Error('demo must parse');
  const { results } = parsed.value;

  it('gives the results of one kind inside the window, both ends included, earliest first', () => {
    // TH-0093's ferritins on 2025-05-20 … 2026-10-13 (assets/demo/th-0093.json), window ends on two of them.
    const ferritin = resultsOfKindBetween(results, 'ferritin', '2025-05-20', '2026-10-13');
    expect(ferritin.map((it) => [it.date, it.measured.value])).toEqual([
      ['2025-05-20', 1900],
      ['2025-08-12', 1750],
      ['2025-11-04', 1620],
      ['2026-01-27', 1500],
      ['2026-04-21', 1420],
      ['2026-07-14', 1330],
      ['2026-10-13', 1250],
    ]);
    expect(resultsOfKindBetween(results, 'blood-lead', '1900-01-01', '2100-12-31')).toEqual([]);
  });

  it('agrees with filtering by date-fns for every kind and window', () => {
    const kinds = [...new Set(results.map((it) => it.kind))];
    fc.assert(
      fc.property(fc.constantFrom(...kinds), isoDate, isoDate, (kind, first, second) => {
        const [fromDate, toDate] = first <= second ? [first, second] : [second, first];
        const interval = { start: parseISO(fromDate), end: parseISO(toDate) };
        const expected = results.filter((it) => it.kind === kind && isWithinInterval(parseISO(it.date), interval)).map((it) => it.id).sort();
        expect(resultsOfKindBetween(results, kind, fromDate, toDate).map((it) => it.id).sort()).toEqual(expected);
      }),
      { seed: 4, numRuns: 200 },
    );
  });

  it('grouped for many kinds (resultsByKindBetween) gives each kind what it gives, in the same order', () => {
    // The same reference: membership by date-fns isWithinInterval, order by date-fns compareAsc, ties in file order.
    const kinds = [...new Set(results.map((it) => it.kind)), 'blood-lead' as const];
    fc.assert(
      fc.property(isoDate, isoDate, (first, second) => {
        const [fromDate, toDate] = first <= second ? [first, second] : [second, first];
        const interval = { start: parseISO(fromDate), end: parseISO(toDate) };
        const lookup = resultsByKindBetween(results, fromDate, toDate);
        for (const kind of kinds) {
          const expected = results
            .map((it, index) => ({ it, index }))
            .filter(({ it }) => it.kind === kind && isWithinInterval(parseISO(it.date), interval))
            .sort((a, b) => compareAsc(parseISO(a.it.date), parseISO(b.it.date)) || a.index - b.index)
            .map(({ it }) => it);
          expect(lookup(kind)).toEqual(expected);
          expect(lookup(kind)).toEqual(resultsOfKindBetween(results, kind, fromDate, toDate));
        }
      }),
      { seed: 5, numRuns: 200 },
    );
  });
});

describe('eventDateSpan and reviewWindow', () => {
  it('take the earliest and latest event dates as date-fns orders them, on the demos with their dates drawn anew', () => {
    // Outside reference: date-fns compareAsc over every date eventDates lists (with the periods' end
    // dates for the window), and date-fns addMonths for the window's end.
    const demo = parseCase(readDemo('th-0417'));
    if (!demo.ok) throw new Error('demo did not parse');
    fc.assert(
      fc.property(fc.array(isoDate, { minLength: 4, maxLength: 4 }), fc.boolean(), ([weightDate, resultDate, transfusionDate, endDate], ended) => {
        const base = demo.value;
        const theCase = {
          ...base,
          patient: { ...base.patient, weights: [{ ...base.patient.weights[0]!, date: weightDate! }, ...base.patient.weights.slice(1)] },
          results: [{ ...base.results[0]!, date: resultDate! }, ...base.results.slice(1)],
          transfusions: [...base.transfusions.slice(1), { ...base.transfusions[0]!, date: transfusionDate! }],
          chelationPeriods: base.chelationPeriods.map((period, index) => (index === 0 ? { ...period, endDate: ended ? endDate! : null } : period)),
        };
        const events = eventDates(theCase).map((it) => it.date);
        const ordered = [...events].sort((a, b) => compareAsc(parseISO(a), parseISO(b)));
        expect(eventDateSpan(theCase)).toEqual({ earliest: ordered[0], latest: ordered.at(-1) });
        const withEnds = [...events, ...theCase.chelationPeriods.flatMap((period) => (period.endDate === null ? [] : [period.endDate]))].sort((a, b) =>
          compareAsc(parseISO(a), parseISO(b)),
        );
        expect(reviewWindow(theCase)).toEqual({ from: withEnds[0], to: toIsoDate(addMonths(parseISO(withEnds.at(-1)!), 12 * reviewYearsAfterRecord)) });
      }),
      { seed: 1605, numRuns: 200 },
    );
  });

  it('is null for a case with no dated entry', () => {
    const demo = parseCase(readDemo('th-0417'));
    if (!demo.ok) throw new Error('demo did not parse');
    const empty = { ...demo.value, patient: { ...demo.value.patient, weights: [], heights: [] }, transfusions: [], results: [], chelationPeriods: [], coMedications: [], dispensings: [], clinicalState: { hepaticImpairment: [], cardiacFailure: [], renalRiskFactors: [] } };
    expect(eventDateSpan(empty)).toBeNull();
    expect(reviewWindow(empty)).toBeNull();
  });
});
