import { describe, expect, it } from 'vitest';
import { convertedText, preferredUnit } from '../../renderer/viewModels/unitSystems';
import { ucumConvert } from '../core/units/ucumReference';

// Outside reference: UCUM through the National Library of Medicine's
// ucum-lhc. The screen rounds (0 or 1–2 decimals), so the check compares the
// shown text with ucum-lhc's value rounded the same way: agreement to the
// last shown digit is what a reader sees.
const shown = (value: number, decimals: number) => value.toLocaleString('en-GB', { minimumFractionDigits: decimals, maximumFractionDigits: decimals });

describe('SI and conventional units beside a result', () => {
  it('creatinine 1.1 mg/dL reads in µmol/L as UCUM converts it (molar mass of creatinine C4H7N3O, 113.12 g/mol, CIAAW weights)', () => {
    const expected = ucumConvert('mg/dL', 1.1, 'umol/L', 113.12);
    expect(convertedText('si', { kind: 'creatinine', value: '1.1', unit: 'mg/dL' })).toBe(`${shown(expected, 0)} µmol/L`);
  });

  it('creatinine 97 µmol/L reads in mg/dL as UCUM converts it', () => {
    const expected = ucumConvert('umol/L', 97, 'mg/dL', 113.12);
    expect(convertedText('conventional', { kind: 'creatinine', value: '97', unit: 'umol/L' })).toBe(`${shown(expected, 2)} mg/dL`);
  });

  it('haemoglobin 9.7 g/dL reads as g/L by UCUM', () => {
    expect(convertedText('si', { kind: 'haemoglobin', value: '9.7', unit: 'g/dL' })).toBe(`${shown(ucumConvert('g/dL', 9.7, 'g/L'), 0)} g/L`);
  });

  it('blood lead 45 µg/dL reads in µmol/L by UCUM (lead 207.2 g/mol, CIAAW conventional value)', () => {
    expect(convertedText('si', { kind: 'blood-lead', value: '45', unit: 'ug/dL' })).toBe(`${shown(ucumConvert('ug/dL', 45, 'umol/L', 207.2), 2)} µmol/L`);
  });

  it('liver iron 11.4 mg/g dry reads in µmol/g dry by UCUM (iron 55.845 g/mol, CIAAW 2021)', () => {
    const expected = ucumConvert('mg/g', 11.4, 'umol/g', 55.845);
    expect(convertedText('si', { kind: 'liver-iron', method: 'mri', value: '11.4', unit: 'mg/g{dry}' })).toBe(`${shown(expected, 0)} µmol/g dry weight`);
  });

  it('shows nothing when the result is already in the chosen system, has no pair, or is not a number', () => {
    expect(convertedText('conventional', { kind: 'creatinine', value: '1.1', unit: 'mg/dL' })).toBe('');
    expect(convertedText('si', { kind: 'alt', value: '19', unit: 'U/L' })).toBe('');
    expect(convertedText('si', { kind: 'creatinine', value: 'high', unit: 'mg/dL' })).toBe('');
    expect(convertedText('si', { kind: 'liver-iron', method: 'mri-r2star', value: '200', unit: 's-1' })).toBe('');
  });

  it('starts a new result in the chosen system\'s unit', () => {
    expect(preferredUnit('si', 'creatinine')).toBe('umol/L');
    expect(preferredUnit('conventional', 'creatinine')).toBe('mg/dL');
    expect(preferredUnit('si', 'alt')).toBeUndefined();
  });
});
