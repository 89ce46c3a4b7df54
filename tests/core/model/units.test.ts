import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { caseSchemas, type Bounds } from '../../../core/model';
import * as ranges from '../../../core/ranges/plausibleRanges';
import { ucumConvert } from '../units/ucumReference';
import { ucumValidation } from './ucumValidation';

// Outside reference: UCUM (unitsofmeasure.org), through the National Library
// of Medicine's ucum-lhc package. Every unit a case file may carry must be a
// valid UCUM code, and a range stated in a second unit must be the first
// unit's range converted.

function isBounds(value: unknown): value is Bounds {
  return typeof value === 'object' && value !== null && 'possible' in value && 'plausible' in value;
}

/** Every Bounds in core/model/plausibleRanges.ts, by export name and unit key. */
const everyBounds: { name: string; bounds: Bounds }[] = Object.entries(ranges).flatMap(([name, value]) => {
  if (isBounds(value)) return [{ name, bounds: value }];
  if (typeof value === 'object' && value !== null && !Array.isArray(value)) {
    return Object.entries(value as Record<string, unknown>).flatMap(([key, inner]) => {
      if (!isBounds(inner)) return [];
      // A quantity's unit key and the unit its bounds are in must agree.
      expect(inner.unit, `${name}.${key}`).toBe(key);
      return [{ name: `${name}.${key}`, bounds: inner }];
    });
  }
  return [];
});

/** Every unit code the schema allows in a `unit` field, read from the schema itself (zod's JSON Schema export). */
function unitCodesInSchema(): Set<string> {
  const found = new Set<string>();
  const walk = (node: unknown): void => {
    if (Array.isArray(node)) return node.forEach(walk);
    if (typeof node !== 'object' || node === null) return;
    type UnitNode = { enum?: unknown[]; const?: unknown; anyOf?: UnitNode[] };
    const properties = (node as { properties?: Record<string, UnitNode> }).properties;
    const unit = properties?.['unit'];
    // A unit field lists its UCUM codes, beside the free spellings a person may type (read to those codes).
    for (const option of unit ? [unit, ...(unit.anyOf ?? [])] : []) {
      for (const code of option.enum ?? (option.const === undefined ? [] : [option.const])) found.add(String(code));
    }
    Object.values(node).forEach(walk);
  };
  walk(z.toJSONSchema(caseSchemas.refuse, { unrepresentable: 'any', io: 'input' }));
  return found;
}

describe('units of the case file', () => {
  const schemaUnits = unitCodesInSchema();

  it('finds the units the brief lists in the schema', () => {
    for (const code of ['ug/L', 'ng/mL', 'mg/dL', 'umol/L', 'g/dL', 'g/L', 'mmol/L', '10*9/L', 'mL', 'kg', 'cm', 'ms', 's-1', 'U/L', 'ug/dL']) {
      expect(schemaUnits, code).toContain(code);
    }
  });

  it('allows only valid UCUM codes in unit fields', () => {
    for (const code of schemaUnits) {
      const verdict = ucumValidation(code);
      expect(verdict.status, `${code}: ${verdict.msg.join('; ')}`).toBe('valid');
      expect(verdict.ucumCode).toBe(code);
    }
  });

  it('states every range in a valid UCUM unit, with the plausible range inside the possible one', () => {
    expect(everyBounds.length).toBeGreaterThan(30);
    for (const { name, bounds } of everyBounds) {
      expect(ucumValidation(bounds.unit).status, `${name}: ${bounds.unit}`).toBe('valid');
      expect(bounds.possible.min, name).toBeLessThanOrEqual(bounds.plausible.min);
      expect(bounds.plausible.min, name).toBeLessThan(bounds.plausible.max);
      expect(bounds.plausible.max, name).toBeLessThanOrEqual(bounds.possible.max);
    }
  });

  // Molar masses for the mass ↔ substance conversions, g/mol: creatinine C4H7N3O from CIAAW
  // atomic weights (113.12); Fe 55.845, Pb 207.2, Cu 63.546 (CIAAW 2021 abridged / conventional);
  // haemoglobin per haem 16 114.5 (the monomer convention of SI haemoglobin reports).
  const sameQuantity: { name: string; byUnit: Readonly<Record<string, Bounds>>; molarMassGPerMol?: number }[] = [
    { name: 'ferritin', byUnit: ranges.ferritinBounds },
    { name: 'liver iron', byUnit: ranges.liverIronBounds, molarMassGPerMol: 55.845 },
    { name: 'creatinine', byUnit: ranges.creatinineBounds, molarMassGPerMol: 113.12 },
    { name: 'neutrophils', byUnit: ranges.neutrophilBounds },
    { name: 'haemoglobin', byUnit: ranges.haemoglobinBounds, molarMassGPerMol: 16114.5 },
    { name: 'blood lead', byUnit: ranges.bloodLeadBounds, molarMassGPerMol: 207.2 },
    { name: 'urinary copper', byUnit: ranges.urinaryCopperBounds, molarMassGPerMol: 63.546 },
    // Version 2 results: bilirubin C33H36N4O6 584.66 and Zn 65.38 (CIAAW); the ratio's denominator is creatinine (113.12).
    { name: 'platelets', byUnit: ranges.plateletBounds },
    { name: 'bilirubin', byUnit: ranges.bilirubinBounds, molarMassGPerMol: 584.66 },
    { name: 'zinc', byUnit: ranges.zincBounds, molarMassGPerMol: 65.38 },
    { name: 'urine protein-to-creatinine ratio', byUnit: ranges.urineProteinCreatinineRatioBounds, molarMassGPerMol: 113.12 },
  ];

  // Tolerance: a range in a second unit is the first unit's range converted and
  // rounded OUTWARD to two or three significant figures, so it may be wider by
  // up to 10 % but never narrower (a narrower range would warn on a value that
  // is plausible in the first unit). Zero converts to zero exactly.
  function expectRoundedOutward(stated: number, converted: number, side: 'min' | 'max', label: string): void {
    if (converted === 0) {
      expect(stated, label).toBe(0);
    } else if (side === 'min') {
      expect(stated, label).toBeLessThanOrEqual(converted * (1 + 1e-9));
      expect(stated, label).toBeGreaterThanOrEqual(converted * 0.9);
    } else {
      expect(stated, label).toBeGreaterThanOrEqual(converted * (1 - 1e-9));
      expect(stated, label).toBeLessThanOrEqual(converted * 1.1);
    }
  }

  for (const { name, byUnit, molarMassGPerMol } of sameQuantity) {
    it(`states the ${name} ranges consistently in every unit (ucum-lhc conversion)`, () => {
      const [first, ...others] = Object.values(byUnit);
      for (const other of others) {
        const convert = (value: number) => ucumConvert(first!.unit, value, other.unit, molarMassGPerMol);
        expectRoundedOutward(other.plausible.min, convert(first!.plausible.min), 'min', `${name} plausible min in ${other.unit}`);
        expectRoundedOutward(other.plausible.max, convert(first!.plausible.max), 'max', `${name} plausible max in ${other.unit}`);
        expectRoundedOutward(other.possible.max, convert(first!.possible.max), 'max', `${name} possible max in ${other.unit}`);
      }
    });
  }
});
