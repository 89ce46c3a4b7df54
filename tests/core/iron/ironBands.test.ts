import { describe, expect, it } from 'vitest';
import { cardiacT2StarBand, ferritinBand, ironBands, licBand } from '../../../core/iron';
import { runFormula } from '../../../core/formulas/run';
import { formulaCatalogue } from '../../../core/catalogue';
import { findSource } from '../../../core/references';
import { mgPerGDry, msec, ugPerL } from '../../../core/units/quantity';

describe('LIC bands (Olivieri & Brittenham, Blood 1997;89:739; Brittenham, N Engl J Med 2011;364:146, Table 2)', () => {
  it('puts values on both sides of each boundary in the published bands', () => {
    // Normal up to about 1.8; 3–7 target (ends included); > 7 raised risk; ≥ 15 high cardiac risk.
    const cases: [number, string][] = [
      [0.5, 'normal'],
      [1.8, 'normal'],
      [1.81, 'above-normal'],
      [2.99, 'above-normal'],
      [3, 'target-range'],
      [7, 'target-range'],
      [7.01, 'raised-risk'],
      [14.99, 'raised-risk'],
      [15, 'high-cardiac-risk'],
      [40, 'high-cardiac-risk'],
    ];
    for (const [lic, id] of cases) expect(licBand(mgPerGDry(lic)).id, `${lic}`).toBe(id);
  });

  it('places the LICs of the scenarios (TH-0417 9.8 → 11.4; TH-0322 18)', () => {
    expect(licBand(mgPerGDry(11.4)).id).toBe('raised-risk');
    expect(licBand(mgPerGDry(18)).id).toBe('high-cardiac-risk');
  });
});

describe('cardiac T2* bands (Anderson, Eur Heart J 2001;22:2171; Kirk, Circulation 2009;120:1961)', () => {
  it('puts values on both sides of each boundary in the published bands', () => {
    // > 20 no significant iron; 10–20 mild to moderate (ends included); < 10 severe; < 6 very high risk.
    const cases: [number, string, string][] = [
      [35, 'no-significant-iron', 'anderson-2001'],
      [20.01, 'no-significant-iron', 'anderson-2001'],
      [20, 'mild-to-moderate', 'anderson-2001'],
      [10, 'mild-to-moderate', 'anderson-2001'],
      [9.99, 'severe', 'kirk-2009'],
      [6, 'severe', 'kirk-2009'],
      [5.99, 'very-severe', 'kirk-2009'],
      [3, 'very-severe', 'kirk-2009'],
    ];
    for (const [t2Star, id, sourceId] of cases) {
      const band = cardiacT2StarBand(msec(t2Star));
      expect(band.id, `${t2Star}`).toBe(id);
      expect(band.sourceId).toBe(sourceId);
    }
  });

  it('places scenario TH-0322 (cardiac T2* 8 ms) below 10 ms', () => {
    expect(cardiacT2StarBand(msec(8)).label).toContain('below 10 ms');
  });
});

describe('ferritin bands (guideline literature, secondary)', () => {
  it('puts values on both sides of 500 and 1000 µg/L in the bands', () => {
    const cases: [number, string][] = [
      [499, 'below-500'],
      [500, 'from-500-to-1000'],
      [1000, 'from-500-to-1000'],
      [1001, 'above-1000'],
    ];
    for (const [ferritin, id] of cases) expect(ferritinBand(ugPerL(ferritin), { sickleCellDisease: false }).id, `${ferritin}`).toBe(id);
  });

  it('always calls ferritin a surrogate, and a poor marker in sickle cell disease (scenario SC-0781)', () => {
    const usual = ferritinBand(ugPerL(2900), { sickleCellDisease: false });
    expect(usual.caution).toContain('surrogate');
    expect(usual.caution).not.toContain('sickle');
    const sickle = ferritinBand(ugPerL(750), { sickleCellDisease: true });
    expect(sickle.caution).toContain('poor marker');
    expect(sickle.caution).toContain('sickle cell disease');
  });
});

describe('every band cites a known source', () => {
  it('has sources in the catalogue', () => {
    const bands = [
      ...[1, 2, 5, 10, 20].map((lic) => licBand(mgPerGDry(lic))),
      ...[3, 8, 15, 30].map((t2Star) => cardiacT2StarBand(msec(t2Star))),
      ferritinBand(ugPerL(800), { sickleCellDisease: false }),
    ];
    for (const band of bands) expect(findSource(band.sourceId), band.id).toBeDefined();
  });
});

describe('iron-bands calculator', () => {
  it('bands scenario SC-0781: LIC 4.1, ferritin 750 in sickle cell disease', () => {
    const run = runFormula(ironBands, { licMgPerGDry: 4.1, ferritinUgPerL: 750, diagnosisGroup: 'sickle-cell-disease' });
    expect(run.ok).toBe(true);
    if (!run.ok) return;
    expect(run.value.outputs.licBand).toBe('usual target range (3–7 mg/g dry)');
    expect(run.value.outputs.ferritinBand).toContain('poor marker');
    expect(run.value.outputs.intakeBand).toBe('not given');
    expect(run.value.outputs.cardiacT2StarBand).toBe('not given');
  });

  it('bands scenario TH-0322: cardiac T2* 8 ms, LIC 18, intake 0.45', () => {
    const run = runFormula(ironBands, { cardiacT2StarMs: 8, licMgPerGDry: 18, intakeMgPerKgPerDay: 0.45 });
    expect(run.ok).toBe(true);
    if (!run.ok) return;
    expect(run.value.outputs.cardiacT2StarBand).toContain('below 10 ms');
    expect(run.value.outputs.licBand).toContain('15 mg/g dry or more');
    expect(run.value.outputs.intakeBand).toBe('intermediate intake (0.3–0.5 mg/kg/day)');
  });

  it('refuses a call with nothing to band', () => {
    const run = runFormula(ironBands, {});
    expect(run.ok).toBe(false);
    if (!run.ok) expect(run.issues[0]?.code).toBe('required');
  });
});

describe('the formulas state the bands and the Angelucci slope from the constants the code computes with', () => {
  // As printed: Brittenham 2011 Table 2 (intake < 0.3, 0.3–0.5, > 0.5 mg/kg/day); Olivieri & Brittenham 1997 and
  // Brittenham 2011 (LIC 1.8, 3, 7, 15 mg/g dry); Anderson 2001 and Kirk 2009 (T2* 20, 10, 6 ms); Angelucci 2000 (10.6).
  it('iron-bands, iron-intake-rate and body-iron read as the publications print them', () => {
    const expression = (id: string) => formulaCatalogue.find((it) => it.id === id)!.expression;
    expect(expression('iron-bands')).toBe(
      'intake < 0.3 | 0.3–0.5 | > 0.5 mg/kg/day; LIC ≤ 1.8 | < 3 | 3–7 | < 15 | ≥ 15 mg/g dry; cardiac T2* > 20 | 10–20 | 6–10 | < 6 ms; ferritin < 500 | 500–1000 | > 1000 µg/L',
    );
    expect(expression('iron-intake-rate')).toContain('band < 0.3, 0.3–0.5, > 0.5');
    expect(expression('body-iron')).toContain('= 10.6 × LIC (mg/g dry)');
  });
});
