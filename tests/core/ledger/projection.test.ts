import { describe, expect, it } from 'vitest';
import { projectScenarios, type ProjectionInput } from '../../../core/ledger/projection';

const input: ProjectionInput = {
  asOf: '2026-11-20',
  startBodyIronMg: 10.6 * 11.4 * 52, // LIC 11.4 at 52 kg (scenario TH-0417)
  weightKg: 52,
  intakeMgPerDay: 0.45 * 52, // 0.45 mg/kg/day, inside Hoffbrand 2012's 0.3–0.6 for 2–4 units/month
  basalLossMgPerDay: 1,
  horizonMonths: 24,
  seed: 1,
  samples: 400,
  scenarios: [
    { id: 'none', name: 'no chelation', removalMgPerDay: () => 0, efficiencyBasis: 'published', efficiencyScale: 1 },
    { id: 'low', name: 'low dose', removalMgPerDay: (kg) => 0.3 * kg, efficiencyBasis: 'published', efficiencyScale: 1 },
    { id: 'high', name: 'high dose', removalMgPerDay: (kg) => 0.6 * kg, efficiencyBasis: 'published', efficiencyScale: 1 },
  ],
};

describe('projections', () => {
  it('with no chelation, rises by intake minus basal loss (hand arithmetic with the Angelucci relation)', () => {
    // Angelucci (N Engl J Med 2000;343:327): ΔLIC = Δstores / (10.6 × weight).
    // 12 months ahead of 2026-11-20 is 365 days: (0.45 × 52 − 1) × 365 / (10.6 × 52).
    const [none] = projectScenarios(input);
    const month12 = none!.months[12]!;
    expect(month12.date).toBe('2027-11-20');
    expect(month12.licMgPerGDry).toBeCloseTo(11.4 + ((0.45 * 52 - 1) * 365) / (10.6 * 52), 9);
  });

  it('never projects a higher LIC for a higher dose, and never a lower LIC for more transfusion', () => {
    const [none, low, high] = projectScenarios(input);
    for (let month = 0; month <= 24; month += 1) {
      expect(low!.months[month]!.licMgPerGDry).toBeLessThanOrEqual(none!.months[month]!.licMgPerGDry);
      expect(high!.months[month]!.licMgPerGDry).toBeLessThanOrEqual(low!.months[month]!.licMgPerGDry);
      expect(high!.months[month]!.licP90).toBeLessThanOrEqual(low!.months[month]!.licP90 + 1e-12);
    }
    const [, moreTransfusion] = projectScenarios({ ...input, intakeMgPerDay: input.intakeMgPerDay * 1.5 });
    for (let month = 1; month <= 24; month += 1) {
      expect(moreTransfusion!.months[month]!.licMgPerGDry).toBeGreaterThan(low!.months[month]!.licMgPerGDry);
    }
  });

  it('gives the same band for the same seed, a band that contains the central path, and widens with time', () => {
    const first = projectScenarios(input);
    const second = projectScenarios(input);
    expect(second).toEqual(first);
    const [, low] = first;
    for (const month of low!.months.slice(1)) {
      expect(month.licP10).toBeLessThanOrEqual(month.licMgPerGDry);
      expect(month.licP90).toBeGreaterThanOrEqual(month.licMgPerGDry);
    }
    expect(low!.months[24]!.licP90 - low!.months[24]!.licP10).toBeGreaterThan(low!.months[6]!.licP90 - low!.months[6]!.licP10);
    const otherSeed = projectScenarios({ ...input, seed: 2 });
    expect(otherSeed[1]!.months[24]!.licP90).not.toBe(low!.months[24]!.licP90);
  });

  it('reports the month the central projection crosses 7 mg/g dry (constant-rate model: hand arithmetic)', () => {
    const [, , high] = projectScenarios({ ...input, model: 'constant-rate' });
    // net = (0.45 − 0.6) × 52 − 1 = −8.8 mg/day; from 11.4 to 7 needs 4.4 × 551.2 / 8.8 = 275.6 days → month 10.
    const seven = high!.crossings.find((it) => it.thresholdMgPerGDry === 7)!;
    expect(seven.direction).toBe('falls below');
    expect(seven.monthsAhead).toBe(10);
    expect(seven.bandEarliestMonths!).toBeLessThanOrEqual(10);
    expect(seven.bandLatestMonths === null || seven.bandLatestMonths >= 10).toBe(true);
    const fifteen = high!.crossings.find((it) => it.thresholdMgPerGDry === 15)!;
    expect(fifteen.direction).toBe('rises above');
    expect(fifteen.monthsAhead).toBeNull();
  });
});
