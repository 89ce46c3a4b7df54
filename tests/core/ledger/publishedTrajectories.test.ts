import { describe, expect, it } from 'vitest';
import { resolveAssumption } from '../../../core/assumptions';
import { projectScenarios, type ProjectionInput } from '../../../core/ledger/projection';

// The projection model started from published baselines and checked against published
// multi-year LIC trajectories; the constant-rate model is shown beside it for comparison.
// Chelator capacities (mg Fe per mg): deferasirox 55.845 ⁄ (2 × 373.37), deferiprone
// 55.845 ⁄ (3 × 139.15), deferoxamine mesylate 55.845 ⁄ 656.79 (Poggiali et al., Blood Transfus
// 2012;10:411, Table I; CIAAW atomic weights). Efficiencies are the catalogued assumptions.
const capacity = { deferasirox: 55.845 / (2 * 373.37), deferiprone: 55.845 / (3 * 139.15), deferoxamine: 55.845 / 656.79 };
const efficiency = (drug: 'deferasirox' | 'deferiprone' | 'deferoxamine') => resolveAssumption(`efficiency-${drug}`, {}).value;
const removalPerKgPerDay = (drug: 'deferasirox' | 'deferiprone' | 'deferoxamine', doseMgPerKgPerDay: number, daysPerWeek = 7) =>
  doseMgPerKgPerDay * capacity[drug] * efficiency(drug) * (daysPerWeek / 7);

/** LIC change after `months` for a cohort mean, under a model. Weight 50 kg (from memory, a typical trial adult; LIC change barely depends on it). */
function lic(startLic: number, removalMgPerKgPerDay: number, intakeMgPerKgPerDay: number, months: number, model: 'burden-dependent' | 'constant-rate') {
  const weightKg = 50;
  const input: ProjectionInput = {
    asOf: '2026-01-01',
    startBodyIronMg: 10.6 * startLic * weightKg,
    weightKg,
    intakeMgPerDay: intakeMgPerKgPerDay * weightKg,
    basalLossMgPerDay: 1,
    horizonMonths: months,
    seed: 1,
    samples: 50,
    model,
    scenarios: [{ id: 'trial', name: 'trial', removalMgPerDay: (kg) => removalMgPerKgPerDay * kg, efficiencyBasis: 'published', efficiencyScale: 1 }],
  };
  return projectScenarios(input)[0]!.months[months]!.licMgPerGDry;
}

describe('published multi-year LIC trajectories', () => {
  // THALASSA (Taher et al., Blood 2012;120:970, abstract; extension Taher et al., Ann Hematol
  // 2013;92:1485, abstract): non-transfusion-dependent thalassaemia, deferasirox (dispersible).
  // Baselines 13.11 ± 7.29 (5 mg/kg/day start, actual 5.7) and 14.56 ± 7.92 (10 mg/kg/day start,
  // actual 11.5); 1-year change −2.33 ± 0.7 and −4.18 ± 0.69 against placebo (LSM ± SEM), placebo
  // +0.38, so the absolute changes are about −1.95 and −3.80. Over 2 years of deferasirox
  // (mean dose 9.8 mg/kg/day) the mean change was −7.14. Intake: no regular transfusions; the
  // placebo's +0.38 mg/g dry a year is the net absorption (0.38 × 10.6 ⁄ 365 mg/kg/day) plus basal loss.
  // Tolerance: the published spread of a patient's change. The abstract gives SEMs of 0.7 on
  // arms of about 55 patients (166 randomised 2:1:2:1), an SD of about 0.7 × √55 ≈ 5.2 mg/g dry;
  // the model (a cohort mean started from the mean baseline) must land within one SD.
  const absorbedPerKgPerDay = (0.38 * 10.6) / 365 + 1 / 50;
  const spread = 0.7 * Math.sqrt(55);
  const thalassa = [
    { label: '10 mg/kg/day arm at 12 months', start: 14.56, dose: 11.5, months: 12, published: -4.18 + 0.38 },
    { label: '5 mg/kg/day arm at 12 months', start: 13.11, dose: 5.7, months: 12, published: -2.33 + 0.38 },
    { label: 'both arms at 24 months', start: (13.11 + 14.56) / 2, dose: 9.8, months: 24, published: -7.14 },
  ];
  for (const check of thalassa) {
    it(`THALASSA ${check.label}: the default model lands within one SD of the published mean change (${check.published.toFixed(2)})`, () => {
      const removal = removalPerKgPerDay('deferasirox', check.dose);
      const burden = lic(check.start, removal, absorbedPerKgPerDay, check.months, 'burden-dependent') - check.start;
      const constant = lic(check.start, removal, absorbedPerKgPerDay, check.months, 'constant-rate') - check.start;
      expect(Math.abs(burden - check.published)).toBeLessThan(spread);
      // Shown for comparison: the constant-rate model falls faster and lands further from the mean.
      expect(Math.abs(burden - check.published)).toBeLessThan(Math.abs(constant - check.published));
    });
  }

  // Deferasirox 5-year study in thalassaemia major (Cappellini et al., Blood 2011;118:884,
  // abstract): deferasirox cohort with ≥ 4 years of exposure, mean LIC change −7.8 ± 11.2 mg/g dw
  // (SD, n = 103). Dose: about 23 mg/kg/day (mean 21.8–25.4 at month 42 by core dose group;
  // Porter et al., Blood 2007;110:abstract 2777). Intake: 0.4 mg/kg/day, the middle of the
  // 0.3–0.5 that 20 mg/kg/day offset (Nisbet-Brown et al., Lancet 2003;361:1597) and of
  // Hoffbrand 2012's 0.3–0.6 for 2–4 units a month. The baseline LIC is not in the abstract:
  // the check runs over core-trial baselines 7–20 mg/g dry (the trial assigned 20 and 30 mg/kg/day
  // at LIC above 7; from memory). Tolerance: within the published SD of the change.
  it('5-year deferasirox study: the default model at 48 months lies within −7.8 ± 11.2 for baselines 7–20', () => {
    for (const start of [7, 10, 14, 20]) {
      const burden = lic(start, removalPerKgPerDay('deferasirox', 23), 0.4, 48, 'burden-dependent') - start;
      expect(burden).toBeGreaterThan(-7.8 - 11.2);
      expect(burden).toBeLessThan(-7.8 + 11.2);
      // The constant-rate model is shown, not asserted against: at these figures it also lies in the spread.
      const constant = lic(start, removalPerKgPerDay('deferasirox', 23), 0.4, 48, 'constant-rate') - start;
      expect(constant).toBeLessThanOrEqual(burden + 1e-9);
    }
  });
});

describe('catalogued efficiencies against published excretion at stated doses', () => {
  // Nisbet-Brown et al., Lancet 2003;361:1597 (abstract; references.md §3): deferasirox 20 mg/kg/day
  // (dispersible) offset 0.3–0.5 mg iron/kg/day. The catalogue's 27 % must give a figure inside it.
  it('deferasirox 20 mg/kg/day: 0.3–0.5 mg/kg/day', () => {
    const removal = removalPerKgPerDay('deferasirox', 20);
    expect(removal).toBeGreaterThanOrEqual(0.3);
    expect(removal).toBeLessThanOrEqual(0.5);
  });
  // Hoffbrand et al., Blood 1998;91:295 (abstract): deferiprone 75 mg/kg/day, mean urine iron
  // 31.2 mg/24 h at stable stores in adults. At 50–60 kg (from memory; the abstract gives no weight)
  // that is 0.52–0.62 mg/kg/day; deferiprone's iron leaves almost wholly in urine (from memory).
  // The old 7 % (0.70 mg/kg/day) fell outside; the catalogue now holds 5.5 %.
  it('deferiprone 75 mg/kg/day: 31.2 mg/day ÷ 50–60 kg', () => {
    const removal = removalPerKgPerDay('deferiprone', 75);
    expect(removal).toBeGreaterThanOrEqual(31.2 / 60);
    expect(removal).toBeLessThanOrEqual(31.2 / 50);
    expect(75 * capacity.deferiprone * 0.07).toBeGreaterThan(31.2 / 50);
  });
});

describe('scenario 5 (TH-0322, 29 years, LIC 18, deferiprone 75 mg/kg/day + deferoxamine 40 mg/kg on 5 nights)', () => {
  // Published combination range: Tanner et al., J Cardiovasc Magn Reson 2008;10:12 (abstract):
  // deferoxamine 38 mg/kg on 5.3 days/week with deferiprone 73.9 mg/kg/day for 12 months, liver
  // T2* 3.7 → 10.8 ms. Through R2* = 1000 ⁄ T2* and the 1.5 T calibration LIC = −0.16 + 0.02603 × R2*
  // (Hernando et al., Radiology 2023) that is about 6.9 → 2.25 mg/g dry: a fall of about
  // 4.6 mg/g dry in the year, or 90 % of the excess above the 1.8 mg/g dry floor. From LIC 18
  // the first-year fall therefore lies between the absolute reading (4.6 mg/g dry) and the
  // relative one (90 % of 16.2 ≈ 14.6 mg/g dry). Intake: 0.4 mg/kg/day (as above).
  const hernando = (t2StarMs: number) => -0.16 + 0.02603 * (1000 / t2StarMs);
  const fallAbsolute = hernando(3.7) - hernando(10.8);
  const fallRelative = (hernando(3.7) - hernando(10.8)) / (hernando(3.7) - 1.8);
  const removal = removalPerKgPerDay('deferiprone', 75) + removalPerKgPerDay('deferoxamine', 40, 5);
  it('falls in its first year at a rate inside the published combination range', () => {
    const fall = 18 - lic(18, removal, 0.4, 12, 'burden-dependent');
    expect(fall).toBeGreaterThan(fallAbsolute);
    expect(fall).toBeLessThan(fallRelative * (18 - 1.8));
  });
  it('the constant-rate model, shown for comparison, falls faster than the published range allows', () => {
    const fall = 18 - lic(18, removal, 0.4, 12, 'constant-rate');
    expect(fall).toBeGreaterThan(fallRelative * (18 - 1.8));
  });
});
