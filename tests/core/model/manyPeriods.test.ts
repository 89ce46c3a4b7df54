import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { addDaysIso } from '../../../core/dates';
import { continuousRunStart } from '../../../core/model/continuousRunStart';
import type { ChelationPeriod } from '../../../core/model/caseFile';
import { parseCase } from '../../../core/model/parseCase';
import { period, reviewDate, smallCase } from '../safety/safetyCases';

// Issue 17's scale item: a review grew quadratically with the number of chelation periods
// (the unbroken-run search and the same-drug overlap check compared every period with every
// other). Both now sweep the periods in date order. The references here are the definitions
// themselves, written the slow, obvious way: the run walked back one day at a time while some
// period of the drug covers the day before, and the overlap check over every pair. The answers
// must be the same on drawn period lists crowded into a few months, so that gaps of one day,
// adjacency, duplicates, nesting and open ends all occur.

const drugs = ['deferasirox', 'deferiprone'] as const;

const drawnPeriods = fc.array(
  fc.record({ drug: fc.constantFrom(...drugs), startOffset: fc.integer({ min: 0, max: 120 }), length: fc.option(fc.integer({ min: 0, max: 40 }), { nil: null }) }),
  { minLength: 1, maxLength: 30 },
);

const origin = '2026-06-01';

function periodsOf(drawn: readonly { drug: (typeof drugs)[number]; startOffset: number; length: number | null }[]): ChelationPeriod[] {
  return drawn.map(({ drug, startOffset, length }, index) => {
    const startDate = addDaysIso(origin, startOffset);
    return { ...period(drug, 20), id: `p${index}`, startDate, endDate: length === null ? null : addDaysIso(startDate, length), adherence: 1 } as unknown as ChelationPeriod;
  });
}

/** The definition: from the earliest start of a period running on asOf, step back a day while some period of the drug covers the day before. */
function runStartByDays(periods: readonly ChelationPeriod[], drug: ChelationPeriod['drug'], asOf: string): string | null {
  const ofDrug = periods.filter((it) => it.drug === drug);
  const covers = (it: ChelationPeriod, day: string) => it.startDate <= day && (it.endDate === null || day <= it.endDate);
  const running = ofDrug.filter((it) => covers(it, asOf));
  if (running.length === 0) return null;
  let start = running.map((it) => it.startDate).sort()[0]!;
  while (ofDrug.some((it) => covers(it, addDaysIso(start, -1)))) start = addDaysIso(start, -1);
  return start;
}

describe('many chelation periods', () => {
  it('finds the same unbroken run as walking back day by day', () => {
    fc.assert(
      fc.property(drawnPeriods, fc.integer({ min: 0, max: 170 }), (drawn, asOfOffset) => {
        const periods = periodsOf(drawn);
        const asOf = addDaysIso(origin, asOfOffset);
        for (const drug of drugs) expect(continuousRunStart(periods, drug, asOf)).toBe(runStartByDays(periods, drug, asOf));
      }),
      { numRuns: 1500, seed: 1617 },
    );
  });

  it('warns of the same overlapping pairs, in the same order, as comparing every pair', () => {
    fc.assert(
      fc.property(drawnPeriods, (drawn) => {
        const periods = periodsOf(drawn);
        const parsed = parseCase({ ...smallCase(), chelationPeriods: periods });
        expect(parsed.ok).toBe(true);
        if (!parsed.ok) return;
        const warned = (parsed.warnings ?? [])
          .filter((it) => it.code === 'inconsistent' && it.path[0] === 'chelationPeriods' && / overlaps chelationPeriods\[/.test(it.message))
          .map((it) => `${String(it.path[1])}~${/overlaps chelationPeriods\[(\d+)\]/.exec(it.message)![1]}`);
        const expected: string[] = [];
        periods.forEach((later, laterIndex) =>
          periods.forEach((earlier, earlierIndex) => {
            if (earlierIndex >= laterIndex || earlier.drug !== later.drug) return;
            const sharesDay = later.startDate <= (earlier.endDate ?? '9999-12-31') && earlier.startDate <= (later.endDate ?? '9999-12-31');
            if (sharesDay) expected.push(`${laterIndex}~${earlierIndex}`);
          }),
        );
        expect(warned).toEqual(expected);
      }),
      { numRuns: 300, seed: 1618 },
    );
  });

  it('reads a run of 2,667 weekly dose changes back to its first week', () => {
    // The size of the slow case; a test times nothing, so this checks only the answer.
    const first = addDaysIso(reviewDate, -7 * 2667);
    const periods = Array.from({ length: 2667 }, (_, index) => ({
      ...period('deferasirox', 20 + (index % 5)),
      id: `w${index}`,
      startDate: addDaysIso(first, 7 * index),
      endDate: index === 2666 ? null : addDaysIso(first, 7 * index + 6),
      adherence: 1,
    })) as unknown as ChelationPeriod[];
    expect(continuousRunStart(periods, 'deferasirox', reviewDate)).toBe(first);
    expect(continuousRunStart(periods.slice(0, 1000).concat(periods.slice(1001)), 'deferasirox', reviewDate)).toBe(periods[1001]!.startDate);
  });
});
