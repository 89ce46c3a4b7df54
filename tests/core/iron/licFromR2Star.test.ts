import { describe, expect, it } from 'vitest';
import {
  licFromR2Star,
  licFromR2StarFormula,
  r2StarCalibration,
  r2StarCalibrations,
  r2StarPerSFromT2StarMs,
  r2StarT2Star,
  t2StarMsFromR2StarPerS,
} from '../../../core/iron';
import { runFormula } from '../../../core/formulas/run';
import { findSource } from '../../../core/references';
import { msec, perSecond, tesla } from '../../../core/units/quantity';

describe('R2* and T2* (definition: R2* s⁻¹ = 1000 / T2* ms)', () => {
  it('converts the doc examples: 2 ms ↔ 500 s⁻¹', () => {
    expect(r2StarPerSFromT2StarMs(msec(2))).toBe(500);
    expect(t2StarMsFromR2StarPerS(perSecond(500))).toBe(2);
  });

  it('round-trips over the clinical range', () => {
    for (const t2Star of [0.5, 1.1, 2.7, 6, 10, 20, 33.3, 100]) {
      expect(t2StarMsFromR2StarPerS(r2StarPerSFromT2StarMs(msec(t2Star)))).toBeCloseTo(t2Star, 12);
    }
  });

  it('is strictly decreasing: a shorter T2* is a faster R2* (more iron)', () => {
    const rates = [1, 2, 5, 10, 20, 40].map((t2Star) => r2StarPerSFromT2StarMs(msec(t2Star)));
    for (let index = 1; index < rates.length; index += 1) expect(rates[index]!).toBeLessThan(rates[index - 1]!);
  });

  it('runs as r2star-t2star from either side, and refuses none or both', () => {
    const fromT2Star = runFormula(r2StarT2Star, { t2StarMs: 8 });
    expect(fromT2Star.ok && fromT2Star.value.outputs.r2StarPerS).toBe(125);
    const fromR2Star = runFormula(r2StarT2Star, { r2StarPerS: 125 });
    expect(fromR2Star.ok && fromR2Star.value.outputs.t2StarMs).toBe(8);
    const none = runFormula(r2StarT2Star, {});
    expect(!none.ok && none.issues[0]?.code).toBe('required');
    const both = runFormula(r2StarT2Star, { t2StarMs: 8, r2StarPerS: 125 });
    expect(!both.ok && both.issues[0]?.code).toBe('inconsistent');
  });
});

describe('R2* → LIC through named calibrations', () => {
  it('reproduces the Hernando 1.5 T equation as printed (Radiology 2022, doi 10.1148/radiol.213256)', () => {
    // Abstract: "for 1.5 T, LIC (mg/g dry) = −0.16 + 2.603 × 10−2 R2* (s−1)". Points computed by hand
    // from the printed coefficients; tolerance 1e-9 (floating point only).
    const hernando = r2StarCalibration('hernando-1.5t');
    const points: [number, number][] = [
      [100, -0.16 + 2.603],
      [300, -0.16 + 7.809],
      [500, -0.16 + 13.015],
      [1000, -0.16 + 26.03],
    ];
    for (const [r2Star, expected] of points) {
      const lic = licFromR2Star(perSecond(r2Star), tesla(1.5), hernando);
      expect(lic.ok && lic.value, `R2* ${r2Star}`).toBeCloseTo(expected, 9);
    }
  });

  it('puts healthy livers in the normal LIC band with every 1.5 T calibration', () => {
    // Obrzut et al., Sci Rep 2020;10:17887: 100 healthy volunteers at 1.5 T, liver R2* 23.67–37.77 s⁻¹
    // (mean 28.72). A normal liver holds up to about 1.8 mg/g dry (Olivieri & Brittenham 1997), so
    // every 1.5 T calibration must map that whole range inside 0–1.8.
    for (const calibration of r2StarCalibrations) {
      for (const r2Star of [23.67, 28.72, 37.77]) {
        const lic = licFromR2Star(perSecond(r2Star), tesla(1.5), calibration);
        expect(lic.ok, calibration.id).toBe(true);
        if (!lic.ok) return;
        expect(lic.value, `${calibration.id} at ${r2Star}`).toBeGreaterThan(0);
        expect(lic.value, `${calibration.id} at ${r2Star}`).toBeLessThanOrEqual(1.8);
      }
    }
  });

  it('each calibration is strictly increasing in R2* and cites a known source', () => {
    for (const calibration of r2StarCalibrations) {
      expect(findSource(calibration.sourceId), calibration.id).toBeDefined();
      let previous = Number.NEGATIVE_INFINITY;
      for (const r2Star of [10, 50, 100, 300, 700, 1500, 2000]) {
        const lic = licFromR2Star(perSecond(r2Star), calibration.fieldStrengthTesla, calibration);
        if (!lic.ok) throw new Error('matching field strength refused');
        expect(lic.value).toBeGreaterThan(previous);
        previous = lic.value;
      }
    }
  });

  it('flags the Henninger calibration whose field strength is not confirmed', () => {
    const henninger = r2StarCalibration('henninger');
    expect(henninger.fieldStrengthConfirmed).toBe(false);
    // Henninger et al., RöFo 2015, abstract: slope 0.024 s·mg/g, intercept 0.277 mg/g.
    expect([henninger.slopeMgPerGDryPerPerS, henninger.interceptMgPerGDry]).toEqual([0.024, 0.277]);
    const run = runFormula(licFromR2StarFormula, { r2StarPerS: 300, scanFieldStrengthTesla: '1.5', calibration: 'henninger' });
    expect(run.ok).toBe(true);
    if (!run.ok) return;
    expect(run.value.outputs.licMgPerGDry).toBeCloseTo(0.277 + 0.024 * 300, 9);
    expect(run.value.outputs.calibrationUsed).toContain('not confirmed');
  });

  it('refuses a 1.5 T calibration for a 3 T result (scenario SC-0781) and asks for a matching one', () => {
    // references.md §2 (Hernando; common practice): a 1.5 T calibration must never be applied to 3 T.
    for (const calibration of ['hernando-1.5t', 'wood-1.5t', 'henninger'] as const) {
      const run = runFormula(licFromR2StarFormula, { r2StarPerS: 200, scanFieldStrengthTesla: '3', calibration });
      expect(run.ok, calibration).toBe(false);
      if (run.ok) return;
      expect(run.issues).toHaveLength(1);
      expect(run.issues[0]).toMatchObject({ code: 'field_strength_mismatch', path: ['calibration'], severity: 'error' });
      expect(run.issues[0]?.message).toMatch(/was derived at 1\.5 T|is taken as a 1\.5 T calibration \(its field strength is not confirmed\)/);
      expect(run.issues[0]?.message).toContain('Choose a calibration derived at 3 T');
    }
    // The pure function refuses too, and treats 2.89 T as the 3 T class.
    const pure = licFromR2Star(perSecond(200), tesla(2.89), r2StarCalibration('hernando-1.5t'));
    expect(!pure.ok && pure.issues[0]?.code).toBe('field_strength_mismatch');
  });

  it('runs from a liver T2* through the same calibration, with the LIC band', () => {
    // T2* 2.5 ms → R2* 400 s⁻¹ → Hernando 1.5 T: −0.16 + 0.02603 × 400 = 10.252 mg/g dry, above 7.
    const run = runFormula(licFromR2StarFormula, { t2StarMs: 2.5, scanFieldStrengthTesla: '1.5', calibration: 'hernando-1.5t' });
    expect(run.ok).toBe(true);
    if (!run.ok) return;
    expect(run.value.outputs.r2StarPerS).toBe(400);
    expect(run.value.outputs.licMgPerGDry).toBeCloseTo(10.252, 9);
    expect(run.value.outputs.licBand).toBe('raised risk of complications (above 7 mg/g dry)');
    expect(run.value.outputs.calibrationUsed).toContain('Hernando et al. 2022, 1.5 T');
  });

  it('asks for the field strength and the calibration instead of assuming them', () => {
    const run = runFormula(licFromR2StarFormula, { r2StarPerS: 300 });
    expect(run.ok).toBe(false);
    if (run.ok) return;
    expect(run.issues.map((it) => [it.code, it.path[0]])).toEqual([
      ['required', 'scanFieldStrengthTesla'],
      ['required', 'calibration'],
    ]);
  });
});
