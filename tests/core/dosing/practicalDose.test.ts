import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { runFormula } from '../../../core/formulas/run';
import { practicalDose } from '../../../core/dosing/formulas';
import { proposePracticalDose, type PracticalDoseRequest } from '../../../core/dosing/practicalDose';
import { defaultProductCatalogue, type Product, type TabletProduct } from '../../../core/dosing/productCatalogue';
import { kg } from '../../../core/units/quantity';

const product = (id: string): Product => defaultProductCatalogue.find((it) => it.id === id)!;
const perDay = (mgPerKgPerDay: number) => ({ kind: 'per-kg-per-day', mgPerKgPerDay }) as const;

function propose(request: PracticalDoseRequest) {
  const result = proposePracticalDose(request);
  if (!result.ok) throw new Error(result.issues.map((it) => it.message).join('; '));
  return result.value;
}

describe('practical dose against hand arithmetic', () => {
  // Hand arithmetic throughout: products and quotients of small decimals, so the
  // tolerance is floating-point error only (1e-9), or the printed rounding where stated.
  it('TH-0417, 21 mg/kg/day of deferasirox film-coated at 52 kg: 1,080 mg as 3 × 360 mg (scenarios.md §1)', () => {
    // 21 × 52 = 1,092 mg. The film-coated strengths 90/180/360 make every multiple of 90:
    // 1,080 (12 below) and 1,170 (78 above); 1,080 = 3 × 360 is the fewest tablets.
    // 1,080 / 52 = 20.769 mg/kg/day; −12 / 1,092 = −1.0989 %.
    const proposal = propose({ product: product('deferasirox-film-coated'), target: perDay(21), weightKg: kg(52), administrationsPerDay: 1 });
    expect(proposal.intendedMgPerAdministration).toBeCloseTo(1092, 9);
    expect(proposal.proposedMgPerAdministration).toBe(1080);
    expect(proposal.form).toEqual({ kind: 'tablets', tablets: [{ strengthMg: 360, tablets: 3 }], pieceCount: 3 });
    expect(proposal.proposedMgPerKgPerDay).toBeCloseTo(1080 / 52, 9);
    expect(proposal.differenceMgPerDay).toBeCloseTo(-12, 9);
    expect(proposal.differencePercent).toBeCloseTo((-12 / 1092) * 100, 9);
    expect(proposal.description).toBe(
      'A combination that gives 1,080 mg per administration is 3 × 360 mg: 20.8 mg/kg/day at 52 kg, 12 mg a day (1.1 %) below the intended 21 mg/kg/day (1,092 mg per administration). For review by the prescriber; follow local protocols.',
    );
  });

  it('TH-0417, 28 mg/kg/day at 52 kg: 1,440 mg as 4 × 360 mg, 27.69 mg/kg/day (scenarios.md §1)', () => {
    // 28 × 52 = 1,456 mg; 1,440 (16 below) beats 1,530 (74 above). 1,440 / 52 = 27.692.
    const proposal = propose({ product: product('deferasirox-film-coated'), target: perDay(28), weightKg: kg(52), administrationsPerDay: 1 });
    expect(proposal.proposedMgPerAdministration).toBe(1440);
    expect(proposal.combinationText).toBe('4 × 360 mg');
    expect(proposal.proposedMgPerKgPerDay).toBeCloseTo(27.6923077, 6);
    expect(proposal.differenceMgPerDay).toBeCloseTo(-16, 9);
  });

  it('TH-0093, deferoxamine 40 mg/kg at 23 kg: two 500 mg vials, 80 mg left over (scenarios.md §3)', () => {
    // 40 × 23 = 920 mg per infusion. Openings that cover it: 2 × 500 = 1,000 (80 left),
    // 1 × 2,000 (1,080 left), 500 + 2,000 (1,580 left): the least waste is 2 × 500.
    const proposal = propose({
      product: product('deferoxamine-vials'),
      target: { kind: 'per-kg-per-administration', mgPerKgPerAdministration: 40 },
      weightKg: kg(23),
      administrationsPerDay: 1,
    });
    expect(proposal.form).toEqual({ kind: 'vials', vials: [{ strengthMg: 500, vials: 2 }], openedMg: 1000, wasteMg: 80 });
    expect(proposal.proposedMgPerAdministration).toBeCloseTo(920, 9);
    expect(proposal.differencePercent).toBeCloseTo(0, 9);
    expect(proposal.description).toContain('2 × 500 mg vials would be opened (1,000 mg, 80 mg left over)');
  });

  it('a large deferoxamine dose prefers one 2 g vial to four 500 mg vials at equal waste', () => {
    // 50 mg/kg × 38 kg = 1,900 mg: 2,000 mg either way (100 left); one vial is fewer.
    const proposal = propose({ product: product('deferoxamine-vials'), target: perDay(50), weightKg: kg(38), administrationsPerDay: 1 });
    expect(proposal.form).toMatchObject({ vials: [{ strengthMg: 2000, vials: 1 }], wasteMg: 100 });
  });

  it('deferiprone 75 mg/kg/day in three administrations at 61 kg: 1 × 1,000 + 1 × 500 mg (scenarios.md §5)', () => {
    // 75 × 61 / 3 = 1,525 mg; steps of 500 (500 tablet or a half 1,000): 1,500 (25 below).
    // Two tablets either as 1,000 + 500 or as 1½ × 1,000; whole tablets are preferred.
    const proposal = propose({ product: product('deferiprone-tablets'), target: perDay(75), weightKg: kg(61), administrationsPerDay: 3 });
    expect(proposal.proposedMgPerAdministration).toBe(1500);
    expect(proposal.combinationText).toBe('1 × 1,000 mg + 1 × 500 mg');
    expect(proposal.differenceMgPerDay).toBeCloseTo(-75, 9);
    expect(proposal.proposedMgPerKgPerDay).toBeCloseTo(4500 / 61, 9);
  });

  describe('EU deferiprone film-coated tablets: scored and breakable in half (SmPC §3), the dose to the nearest half tablet (§4.2)', () => {
    // 25 mg/kg three times a day (SmPC §4.2); with 500 mg halves the amounts step by 250 mg. Worked by hand.
    const perAdministration = (weightKg: number) => propose({ product: product('deferiprone-tablets'), target: perDay(75), weightKg: kg(weightKg), administrationsPerDay: 3 });

    it('30 kg: 750 mg is 1½ tablets of 500 mg, exactly', () => {
      const proposal = perAdministration(30);
      expect(proposal.proposedMgPerAdministration).toBe(750);
      expect(proposal.combinationText).toBe('1.5 × 500 mg');
      expect(proposal.differencePercent).toBeCloseTo(0, 9);
    });

    it('47 kg: 1,175 mg rounds to 1,250 (2½ tablets, 75 above) rather than 1,000 (175 below); 41 kg: 1,025 mg to 1,000', () => {
      expect(perAdministration(47).proposedMgPerAdministration).toBe(1250);
      expect(perAdministration(41).proposedMgPerAdministration).toBe(1000);
    });

    it('55 kg: 1,375 mg lies halfway between 1,250 and 1,500; the lower is shown', () => {
      expect(perAdministration(55).proposedMgPerAdministration).toBe(1250);
    });

    it('halves only for the deferiprone tablets the labels describe as scored; deferasirox and the twice-daily tablet stay whole', () => {
      const halvable = defaultProductCatalogue.filter((item) => item.kind === 'tablets' && item.strengths.some((it) => it.halvable)).map((item) => item.id);
      expect(halvable).toEqual(['deferiprone-tablets', 'deferiprone-tablets-1000-three-times-daily']);
      // 25 mg/kg × 30 kg = 750 mg with the twice-daily 1,000 mg tablet, whole only: 1,000 (250 above) over nothing smaller.
      const twiceDaily = propose({ product: product('deferiprone-tablets-1000-twice-daily'), target: perDay(50), weightKg: kg(30), administrationsPerDay: 2 });
      expect(twiceDaily.combinationText).toBe('1 × 1,000 mg');
    });
  });

  it('deferasirox oral granules: whole sachets of 90, 180 and 360 mg (US national drug code records), 14 mg/kg/day at 33 kg', () => {
    // 14 × 33 = 462 mg; sums of 90/180/360 mg sachets step by 90: 450 (12 below) beats 540 (78 above); fewest sachets: 360 + 90.
    const proposal = propose({ product: product('deferasirox-granules'), target: perDay(14), weightKg: kg(33), administrationsPerDay: 1 });
    expect(proposal.proposedMgPerAdministration).toBe(450);
    expect(proposal.combinationText).toBe('1 × 360 mg + 1 × 90 mg');
    expect(proposal.description).not.toMatch(/tablet/);
  });

  it('offers half tablets only where the catalogue marks them breakable', () => {
    const only1000 = (halvable: boolean): TabletProduct => ({
      id: 'local-deferiprone',
      drug: 'deferiprone',
      kind: 'tablets',
      name: 'deferiprone 1000 mg',
      strengths: [{ strengthMg: 1000, halvable }],
      sourceIds: ['local'],
    });
    // 1,450 mg: with halves 1,500 (1½ tablets, 50 above); without, 1,000 (450 below) beats 2,000 (550 above).
    const withHalves = propose({ product: only1000(true), target: perDay(145), weightKg: kg(10), administrationsPerDay: 1 });
    expect(withHalves.form).toMatchObject({ tablets: [{ strengthMg: 1000, tablets: 1.5 }] });
    expect(withHalves.combinationText).toBe('1.5 × 1,000 mg');
    const wholeOnly = propose({ product: only1000(false), target: perDay(145), weightKg: kg(10), administrationsPerDay: 1 });
    expect(wholeOnly.form).toMatchObject({ tablets: [{ strengthMg: 1000, tablets: 1 }] });
  });

  it('rounds a solution volume to the measurable step, the lower one on a tie', () => {
    // 75 × 23 / 3 = 575 mg of 100 mg/mL = 5.75 mL: exactly between 5.7 and 5.8 → 5.7 (570 mg).
    const tie = propose({ product: product('deferiprone-oral-solution'), target: perDay(75), weightKg: kg(23), administrationsPerDay: 3 });
    expect(tie.form).toMatchObject({ kind: 'oral-solution', volumeMl: 5.7 });
    expect(tie.proposedMgPerAdministration).toBeCloseTo(570, 9);
    // 75 × 24 / 3 = 600 mg → 6 mL exactly.
    const exact = propose({ product: product('deferiprone-oral-solution'), target: perDay(75), weightKg: kg(24), administrationsPerDay: 3 });
    expect(exact.form).toMatchObject({ volumeMl: 6 });
    expect(exact.differencePercent).toBeCloseTo(0, 9);
    // A 0.5 mL step: 5.75 mL lies between 5.5 and 6.0; 5.5 is 0.25 away, 6.0 is 0.25 away → 5.5.
    const coarse = propose({ product: product('deferiprone-oral-solution'), target: perDay(75), weightKg: kg(23), administrationsPerDay: 3, measurableStepMl: 0.5 });
    expect(coarse.form).toMatchObject({ volumeMl: 5.5 });
  });

  it('gives the lower of two equally close amounts', () => {
    // 67.5 mg/kg/day × 2 kg = 135 mg with 90 mg tablets: 90 and 180 are both 45 away → 90.
    const proposal = propose({ product: product('deferasirox-film-coated'), target: perDay(67.5), weightKg: kg(2), administrationsPerDay: 1 });
    expect(proposal.proposedMgPerAdministration).toBe(90);
  });

  it('names the field, the value and the plausible range of bad input', () => {
    const result = proposePracticalDose({ product: product('deferasirox-film-coated'), target: perDay(28), weightKg: kg(520), administrationsPerDay: 1.5 });
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.issues.map((it) => [it.code, it.path[0]])).toEqual([
      ['out_of_range', 'weightKg'],
      ['not_an_integer', 'administrationsPerDay'],
    ]);
    expect(result.issues[0]!.message).toBe('Body weight (kg) 520 is outside the plausible range 2–200.');
  });

  it('refuses a deferoxamine dose that needs more vials than allowed, saying how to widen the search', () => {
    const result = proposePracticalDose({ product: product('deferoxamine-vials'), target: perDay(60), weightKg: kg(100), administrationsPerDay: 1, maxPiecesPerAdministration: 2 });
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.issues[0]!.message).toContain('needs more than 2 vials');
  });

  it('does not change its request', () => {
    const request = Object.freeze({ product: Object.freeze(product('deferiprone-tablets')), target: Object.freeze(perDay(75)), weightKg: kg(61), administrationsPerDay: 3 });
    const before = JSON.stringify(request);
    propose(request);
    expect(JSON.stringify(request)).toBe(before);
  });

  it('never words the proposal as an instruction', () => {
    // House rule (style and helper rules): descriptive only; no imperative dosing words.
    for (const item of defaultProductCatalogue) {
      const proposal = propose({ product: item, target: perDay(30), weightKg: kg(40), administrationsPerDay: 1 });
      expect(proposal.description).not.toMatch(/\b(give|administer|take|increase|reduce|start|stop)\b/i);
      expect(proposal.description).toContain('For review by the prescriber; follow local protocols.');
    }
  });
});

describe('the practical-dose calculator', () => {
  it('runs through runFormula with the shipped catalogue and records the defaults', () => {
    const result = runFormula(practicalDose, { product: 'deferasirox-film-coated', targetMgPerKgPerDay: '28', weightKg: '52' });
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.value.outputs).toMatchObject({ proposedMgPerAdministration: 1440, combination: '4 × 360 mg', leftOver: 'not applicable' });
    // The measurable step is read only for the solution (usedWhen), so it is not in this derivation.
    expect(result.value.derivation.inputs.map((it) => it.name)).toEqual(['product', 'targetMgPerKgPerDay', 'weightKg', 'administrationsPerDay']);
  });

  it('shows the vials left over for deferoxamine', () => {
    const result = runFormula(practicalDose, { product: 'deferoxamine-vials', targetMgPerKgPerDay: 40, weightKg: 23 });
    expect(result.ok && result.value.outputs.leftOver).toBe('80 mg');
  });
});

// ---- Properties against an independent brute-force enumeration --------------

/** Every total reachable with at most `maxPieces` pieces, by plain enumeration (independent of the search). */
function bruteForceTotals(pieceSizesMg: readonly number[], maxPieces: number): number[] {
  const totals: number[] = [];
  const walk = (index: number, piecesLeft: number, total: number) => {
    if (index === pieceSizesMg.length) {
      if (total > 0) totals.push(total);
      return;
    }
    for (let count = 0; count <= piecesLeft; count += 1) walk(index + 1, piecesLeft - count, total + count * pieceSizesMg[index]!);
  };
  walk(0, maxPieces, 0);
  return totals;
}

const shelf = fc.uniqueArray(fc.record({ strengthMg: fc.integer({ min: 10, max: 1000 }), halvable: fc.boolean() }), {
  minLength: 1,
  maxLength: 3,
  selector: (it) => it.strengthMg,
});

describe('practical dose properties (fast-check)', () => {
  it('proposes the amount closest to the intended dose among every combination the shelf makes', () => {
    fc.assert(
      fc.property(shelf, fc.double({ min: 50, max: 3000, noNaN: true }), fc.integer({ min: 1, max: 5 }), (strengths, targetMg, maxPieces) => {
        const item: TabletProduct = { id: 'shelf', drug: 'deferasirox', kind: 'tablets', name: 'shelf', strengths, sourceIds: ['test'] };
        const proposal = propose({ product: item, target: perDay(targetMg / 20), weightKg: kg(20), administrationsPerDay: 1, maxPiecesPerAdministration: maxPieces });
        const sizes = [...strengths.map((it) => it.strengthMg), ...strengths.filter((it) => it.halvable).map((it) => it.strengthMg / 2)];
        const totals = bruteForceTotals(sizes, maxPieces);
        const bestDistance = Math.min(...totals.map((total) => Math.abs(total - targetMg)));
        expect(Math.abs(proposal.proposedMgPerAdministration - targetMg)).toBeCloseTo(bestDistance, 9);
        expect(totals).toContain(proposal.proposedMgPerAdministration);
        if (proposal.form.kind !== 'tablets') throw new Error('tablets expected');
        expect(proposal.form.pieceCount).toBeLessThanOrEqual(maxPieces);
        const sum = proposal.form.tablets.reduce((total, it) => total + it.tablets * it.strengthMg, 0);
        expect(sum).toBeCloseTo(proposal.proposedMgPerAdministration, 9);
      }),
      { numRuns: 300, seed: 417 },
    );
  });

  it('never deviates by more than half the smallest piece when the tablet count does not bind', () => {
    // Stated bound: with enough tablets allowed, the achievable amounts are spaced at most one
    // smallest piece apart from it upwards, so the closest is within half of it; below one piece
    // the smallest piece itself is proposed (zero is never a regimen).
    fc.assert(
      fc.property(shelf, fc.double({ min: 10, max: 3000, noNaN: true }), (strengths, targetMg) => {
        const item: TabletProduct = { id: 'shelf', drug: 'deferasirox', kind: 'tablets', name: 'shelf', strengths, sourceIds: ['test'] };
        const smallest = Math.min(...strengths.map((it) => (it.halvable ? it.strengthMg / 2 : it.strengthMg)));
        const proposal = propose({ product: item, target: perDay(targetMg / 20), weightKg: kg(20), administrationsPerDay: 1, maxPiecesPerAdministration: 40 });
        if (Math.ceil(targetMg / smallest) + 1 > 40) return; // the cap binds: outside the stated bound's premise
        const bound = Math.max(smallest / 2, smallest - targetMg) + 1e-9;
        expect(Math.abs(proposal.proposedMgPerAdministration - targetMg)).toBeLessThanOrEqual(bound);
      }),
      { numRuns: 300, seed: 93 },
    );
  });

  it('opens the vials with the least waste, always less than the smallest vial', () => {
    fc.assert(
      fc.property(fc.uniqueArray(fc.integer({ min: 100, max: 3000 }), { minLength: 1, maxLength: 3 }), fc.double({ min: 50, max: 6000, noNaN: true }), (vialSizes, doseMg) => {
        const item: Product = { id: 'vials', drug: 'deferoxamine', kind: 'vials', name: 'vials', vialStrengthsMg: vialSizes, sourceIds: ['test'] };
        const result = proposePracticalDose({ product: item, target: perDay(doseMg / 40), weightKg: kg(40), administrationsPerDay: 1, maxPiecesPerAdministration: 40 });
        if (!result.ok) {
          // Refused only when even 40 of the largest vial cannot cover the dose.
          expect(doseMg / Math.max(...vialSizes)).toBeGreaterThan(40 - 1e-9);
          return;
        }
        if (result.value.form.kind !== 'vials') throw new Error('vials expected');
        const smallest = Math.min(...vialSizes);
        const covering = bruteForceTotals(vialSizes, Math.ceil(doseMg / smallest)).filter((total) => total >= doseMg - 1e-9);
        expect(result.value.form.openedMg).toBe(Math.min(...covering));
        expect(result.value.form.wasteMg).toBeLessThan(smallest);
        expect(result.value.form.wasteMg).toBeGreaterThanOrEqual(-1e-9);
      }),
      { numRuns: 200, seed: 2 },
    );
  });

  it('rounds a solution volume to within half a step of the intended volume', () => {
    fc.assert(
      fc.property(fc.double({ min: 20, max: 3000, noNaN: true }), fc.constantFrom(0.1, 0.2, 0.5, 1), (doseMg, stepMl) => {
        const proposal = propose({ product: product('deferiprone-oral-solution'), target: perDay(doseMg / 40), weightKg: kg(40), administrationsPerDay: 1, measurableStepMl: stepMl });
        if (proposal.form.kind !== 'oral-solution') throw new Error('solution expected');
        const mgPerStep = 100 * stepMl;
        const bound = Math.max(mgPerStep / 2, mgPerStep - doseMg) + 1e-6;
        expect(Math.abs(proposal.proposedMgPerAdministration - doseMg)).toBeLessThanOrEqual(bound);
        // The volume is a whole number of steps (to printing precision).
        expect(Math.abs(proposal.form.volumeMl / stepMl - Math.round(proposal.form.volumeMl / stepMl))).toBeLessThan(1e-6);
      }),
      { numRuns: 300, seed: 5 },
    );
  });
});
