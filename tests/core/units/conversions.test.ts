import { describe, expect, it } from 'vitest';
import {
  daysFromYears,
  gramsFromKilograms,
  gramsFromMilligrams,
  kg,
  licMgPerGDryFromMgPerGWet,
  licMgPerGDryFromUmolPerGDry,
  licMgPerGWetFromMgPerGDry,
  licUmolPerGDryFromMgPerGDry,
  litresFromMillilitres,
  mg,
  mgPerGDry,
  milligramsFromGrams,
  milligramsFromKilograms,
  millilitresFromLitres,
  ml,
  yearsFromDays,
  years,
  days,
  grams,
  type Kilograms,
  type Litres,
  type Milligrams,
  type UmolPerGDry,
} from '../../../core/units';
import { atomicWeight } from '../../../core/elements';
import { ucumConvert } from './ucumReference';

// Outside reference for every factor: @lhncbc/ucum-lhc (UCUM, Regenstrief). Tolerance
// 1e-12 relative: decimal factors of powers of ten are exact up to binary rounding.
const close = (actual: number, expected: number) => expect(Math.abs(actual - expected)).toBeLessThanOrEqual(1e-12 * Math.max(1, Math.abs(expected)));

describe('mass and volume conversions agree with UCUM', () => {
  it('mg, g, kg', () => {
    close(gramsFromMilligrams(mg(1500)), ucumConvert('mg', 1500, 'g'));
    close(milligramsFromGrams(grams(1.5)), ucumConvert('g', 1.5, 'mg'));
    close(milligramsFromKilograms(kg(0.052)), ucumConvert('kg', 0.052, 'mg'));
    close(gramsFromKilograms(kg(52)), ucumConvert('kg', 52, 'g'));
  });

  it('mL, L', () => {
    close(litresFromMillilitres(ml(280)), ucumConvert('mL', 280, 'L'));
    close(millilitresFromLitres(0.28 as Litres), ucumConvert('L', 0.28, 'mL'));
  });

  it('days and years (mean Gregorian year, 365.2425 days; UCUM a_g)', () => {
    close(daysFromYears(years(2)), ucumConvert('a_g', 2, 'd'));
    close(yearsFromDays(days(730.485)), ucumConvert('d', 730.485, 'a_g'));
  });
});

describe('liver iron units', () => {
  it('mg/g dry to µmol/g dry is × 1000 / Ar(Fe) = 17.907 (CIAAW Ar(Fe) 55.845), as UCUM computes it', () => {
    close(licUmolPerGDryFromMgPerGDry(mgPerGDry(1)), ucumConvert('mg/g', 1, 'umol/g', atomicWeight('Fe')));
    expect(licUmolPerGDryFromMgPerGDry(mgPerGDry(1))).toBeCloseTo(17.907, 3);
    close(licMgPerGDryFromUmolPerGDry(licUmolPerGDryFromMgPerGDry(mgPerGDry(11.4)) as UmolPerGDry), 11.4);
  });

  it('dry to wet divides by the dry-to-wet factor (3.33; Fischer & Harmatz 2009) and back', () => {
    expect(licMgPerGWetFromMgPerGDry(mgPerGDry(3.33), 3.33)).toBe(1);
    close(licMgPerGDryFromMgPerGWet(licMgPerGWetFromMgPerGDry(mgPerGDry(9.8), 3.33), 3.33), 9.8);
  });
});

describe('branded quantities', () => {
  it('do not mix: passing milligrams where kilograms are expected does not compile', () => {
    const doseMg: Milligrams = mg(500);
    const takesKilograms = (weight: Kilograms) => weight;
    // @ts-expect-error — Milligrams is not Kilograms (style.md habit 3); tsc fails if this compiles.
    const wrong = takesKilograms(doseMg);
    // At run time a brand is only a number: the guard is the type check above.
    expect(wrong).toBe(500);
  });
});
