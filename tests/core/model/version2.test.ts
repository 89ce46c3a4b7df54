import { describe, expect, it } from 'vitest';
import { addDaysIso } from '../../../core/dates';
import { caseSchemas, migrateCase, parseCase } from '../../../core/model';
import { ucumCodeForTypedUnit } from '../../../core/units';
import { deepFreeze, readDemo, withChange } from './caseFixtures';
import { ucumValidation } from './ucumValidation';
import { reviewDate, smallCase } from '../safety/safetyCases';

// Case-file version 2 (issue 10): the migration from version 1, the new
// results and records, units typed as people write them, the weight screens
// and the per-administration dose warning. Outside references: UCUM (through
// ucum-lhc) for every unit code a typed spelling is read to; the labelled daily
// maxima of the chelator catalogue (deferiprone 100 mg/kg/day, EU SmPC §4.2).

/** A version 1 file as the tool wrote it before version 2: TH-0093 with its ascorbic acid as `substance`. */
function version1Demo(): Record<string, unknown> {
  const demo = readDemo('th-0093');
  const coMedications = (demo['coMedications'] as Record<string, unknown>[]).map(({ name: _name, ...rest }) => ({ ...rest, substance: 'ascorbic-acid' }));
  return { ...demo, version: 1, coMedications };
}

const warningsOf = (json: unknown) => {
  const result = parseCase(json);
  if (!result.ok) throw new Error(result.issues.map((it) => it.message).join('\n'));
  return result.warnings ?? [];
};
const errorsOf = (json: unknown) => {
  const result = parseCase(json);
  if (result.ok) throw new Error('expected the file to be refused');
  return result.issues;
};

describe('migration from version 1', () => {
  it('opens a version 1 file in memory as version 2 with the same content, never changing the input', () => {
    const older = deepFreeze(version1Demo());
    const migrated = parseCase(older);
    const current = parseCase(readDemo('th-0093'));
    expect(migrated.ok && current.ok).toBe(true);
    if (!migrated.ok || !current.ok) return;
    expect(migrated.value.version).toBe(2);
    expect(migrated.value).toEqual(current.value);
    expect(older['version']).toBe(1);
    expect((older['coMedications'] as Record<string, unknown>[])[0]).toHaveProperty('substance', 'ascorbic-acid');
  });

  it('renames the version 1 substance to a generic name and leaves the new lists to their defaults', () => {
    const migrated = migrateCase(version1Demo());
    expect(migrated.ok).toBe(true);
    const value = (migrated.ok ? migrated.value : {}) as Record<string, unknown>;
    expect((value['coMedications'] as Record<string, unknown>[])[0]).toMatchObject({ name: 'ascorbic acid' });
    expect((value['coMedications'] as Record<string, unknown>[])[0]).not.toHaveProperty('substance');
    const parsed = parseCase(value);
    expect(parsed.ok && parsed.value.dispensings).toEqual([]);
    expect(parsed.ok && parsed.value.clinicalState).toEqual({ hepaticImpairment: [], cardiacFailure: [], renalRiskFactors: [] });
  });

  it('a version 2 file passes through the migration as the same object', () => {
    const demo = readDemo('th-0417');
    const migrated = migrateCase(demo);
    expect(migrated.ok && migrated.value).toBe(demo);
  });

  it('a parsed version 2 case saved as JSON reads back to the same case (the store writes what it parsed)', () => {
    const first = parseCase(withChange(readDemo('th-0417'), ['results', 2, 'measured', 'unit'], 'µg/L')); // results[2] is a ferritin
    expect(first.ok).toBe(true);
    if (!first.ok) return;
    const again = parseCase(JSON.parse(JSON.stringify(first.value)));
    expect(again.ok && again.value).toEqual(first.value);
  });
});

describe('units typed as people write them', () => {
  const demo = readDemo('th-0417');
  const results = demo['results'] as { kind: string; method?: string }[];
  const ferritin = results.findIndex((it) => it.kind === 'ferritin');
  const creatinine = results.findIndex((it) => it.kind === 'creatinine');
  const lic = results.findIndex((it) => it.kind === 'liver-iron' && it.method === 'mri');

  it('reads µg/L, umol/l, ml and mg/g dry to their UCUM codes and keeps what was typed', () => {
    const typed = withChange(
      withChange(withChange(withChange(demo, ['results', ferritin, 'measured', 'unit'], 'µg/L'), ['results', creatinine, 'measured', 'unit'], 'umol/l'), ['transfusions', 0, 'volume', 'unit'], 'ml'),
      ['results', lic, 'measured', 'unit'],
      'mg/g dry',
    );
    // The creatinine value is in mg/dL in the demo: make it a µmol/L value so only the unit spelling is under test.
    const withValue = withChange(typed, ['results', creatinine, 'measured', 'value'], 62);
    const result = parseCase(withValue);
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.value.results[ferritin]).toMatchObject({ measured: { unit: 'ug/L', unitAsTyped: 'µg/L' } });
    expect(result.value.results[creatinine]).toMatchObject({ measured: { value: 62, unit: 'umol/L', unitAsTyped: 'umol/l' } });
    expect(result.value.results[lic]).toMatchObject({ measured: { unit: 'mg/g{dry}', unitAsTyped: 'mg/g dry' } });
    expect(result.value.transfusions[0]).toMatchObject({ volume: { unit: 'mL', unitAsTyped: 'ml' } });
    // A unit already in UCUM carries no typed copy.
    expect(result.value.results[0]).not.toHaveProperty('measured.unitAsTyped');
  });

  it('reads each spelling only to a valid UCUM code (ucum-lhc), among the units the field allows', () => {
    const cases: [string, readonly string[], string][] = [
      ['µmol/L', ['mg/dL', 'umol/L'], 'umol/L'],
      ['μmol/l', ['mg/dL', 'umol/L'], 'umol/L'], // Greek mu, not the micro sign
      ['ng/ml', ['ug/L', 'ng/mL'], 'ng/mL'],
      ['x10^9/L', ['10*9/L', '10*3/uL'], '10*9/L'],
      ['IU/L', ['U/L'], 'U/L'],
      ['mg/g dw', ['mg/g{dry}', 'umol/g{dry}', 'ug/g{dry}'], 'mg/g{dry}'],
      ['ML', ['mL'], 'mL'],
    ];
    for (const [typed, allowed, expected] of cases) {
      expect(ucumCodeForTypedUnit(typed, allowed), typed).toBe(expected);
      expect(ucumValidation(expected).status, expected).toBe('valid');
    }
    // Liver iron as plain "mg/g" is ambiguous (wet or dry weight differ about 3.3-fold, Fischer & Harmatz 2009): not read.
    expect(ucumCodeForTypedUnit('mg/g', ['mg/g{dry}', 'umol/g{dry}', 'ug/g{dry}'])).toBeUndefined();
  });

  it('refuses a spelling that is none of the field’s units, naming them', () => {
    const [found] = errorsOf(withChange(demo, ['results', lic, 'measured', 'unit'], 'mg/g'));
    expect(found).toMatchObject({ code: 'unknown_choice', path: ['results', lic, 'measured', 'unit'] });
    expect(found!.message).toBe(`results[${lic}].measured.unit "mg/g" is not one of: mg/g{dry}, umol/g{dry}, ug/g{dry}.`);
  });

  it('suggests the other unit for a creatinine whose magnitude fits it (1.5 typed as µmol/L: 1.5 mg/dL = 133 µmol/L, references.md §5)', () => {
    const changed = withChange(withChange(demo, ['results', creatinine, 'measured', 'value'], 1.5), ['results', creatinine, 'measured', 'unit'], 'umol/L');
    const found = warningsOf(changed).filter((it) => it.path.join('.') === `results.${creatinine}.measured.value`);
    expect(found.map((it) => it.message)).toEqual([
      `results[${creatinine}].measured.value 1.5 µmol/L is outside the plausible range 8–890 µmol/L; it would be plausible in mg/dL (0.1–10.0 mg/dL): check the unit.`,
    ]);
    // Both sides: 62 µmol/L is plausible and draws no warning.
    const fine = withChange(withChange(demo, ['results', creatinine, 'measured', 'value'], 62), ['results', creatinine, 'measured', 'unit'], 'umol/L');
    expect(warningsOf(fine).filter((it) => it.path.join('.') === `results.${creatinine}.measured.value`)).toEqual([]);
  });
});

describe('the new results, clinical state, co-medications and dispensings', () => {
  const day = (daysBefore: number) => addDaysIso(reviewDate, -daysBefore);
  const base = smallCase();

  it('hold platelets, AST, bilirubin, the urine protein-to-creatinine ratio and zinc with the laboratory range, and examinations by outcome', () => {
    const json = {
      ...base,
      results: [
        ...(base['results'] as unknown[]),
        { id: 'plt', date: day(3), kind: 'platelets', measured: { value: 210, unit: '10*9/L' } },
        { id: 'ast', date: day(3), kind: 'ast', measured: { value: 35, unit: 'U/L' }, referenceRange: { high: 40 } },
        { id: 'bil', date: day(3), kind: 'bilirubin', measured: { value: 18, unit: 'umol/L' }, referenceRange: { low: 0, high: 21 } },
        { id: 'upcr', date: day(3), kind: 'urine-protein-creatinine-ratio', measured: { value: 12, unit: 'mg/mmol' } },
        { id: 'zn', date: day(3), kind: 'zinc', measured: { value: 12, unit: 'umol/L' } },
        { id: 'aud', date: day(100), kind: 'audiology', outcome: 'normal' },
        { id: 'eye', date: day(100), kind: 'eye-examination', outcome: 'changed-from-baseline', note: 'lens opacity noted' },
      ],
    };
    const result = parseCase(json);
    expect(result.ok, result.ok ? '' : result.issues.map((it) => it.message).join('\n')).toBe(true);
    if (!result.ok) return;
    expect(result.value.results.map((it) => it.kind).slice(-7)).toEqual(['platelets', 'ast', 'bilirubin', 'urine-protein-creatinine-ratio', 'zinc', 'audiology', 'eye-examination']);
  });

  it('refuses a reference range whose high is not above its low, and an examination outcome it does not know', () => {
    const badRange = { ...base, results: [{ id: 'ast', date: day(3), kind: 'ast', measured: { value: 35, unit: 'U/L' }, referenceRange: { low: 40, high: 40 } }] };
    expect(errorsOf(badRange)[0]).toMatchObject({ code: 'inconsistent', path: ['results', 0, 'referenceRange', 'high'] });
    const badOutcome = { ...base, results: [{ id: 'aud', date: day(3), kind: 'audiology', outcome: 'fine' }] };
    expect(errorsOf(badOutcome)[0]).toMatchObject({ code: 'unknown_choice', path: ['results', 0, 'outcome'] });
  });

  it('holds the clinical state, any co-medication by generic name, and dispensings', () => {
    const json = smallCase({
      clinicalState: {
        hepaticImpairment: [{ id: 'cp1', date: day(30), childPughClass: 'B' }],
        cardiacFailure: [{ id: 'cf1', date: day(30), status: 'absent' }],
        renalRiskFactors: [{ id: 'rr1', date: day(30), factor: 'nephrotoxic-co-medication', status: 'present' }],
      },
      coMedications: [
        { id: 'cm1', name: 'ibuprofen', dose: { value: 400, unit: 'mg' }, timing: 'other', startDate: day(20), endDate: null },
        { id: 'cm2', name: 'Rifampicin', startDate: day(20), endDate: null },
      ],
      dispensings: [{ id: 'd1', date: day(25), drug: 'deferasirox', productId: 'deferasirox-film-coated', quantity: { value: 90, unit: '{each}' }, daysSupplied: 30 }],
    });
    const result = parseCase(json);
    expect(result.ok, result.ok ? '' : result.issues.map((it) => it.message).join('\n')).toBe(true);
    if (!result.ok) return;
    expect(result.value.coMedications.map((it) => it.name)).toEqual(['ibuprofen', 'Rifampicin']);
    expect(result.value.clinicalState.hepaticImpairment[0]?.childPughClass).toBe('B');
    expect(result.value.dispensings[0]).toMatchObject({ daysSupplied: 30, quantity: { value: 90, unit: '{each}' } });
    // An id shared between a dispensing and a result is refused like any other duplicate id.
    const duplicate = withChange(json, ['dispensings', 0, 'id'], (json['results'] as { id: string }[])[0]!.id);
    expect(errorsOf(duplicate)[0]).toMatchObject({ code: 'inconsistent', path: ['dispensings', 0, 'id'] });
  });

  it('screens ascorbic acid doses with its own range, under any spelling of its name', () => {
    const json = smallCase({ coMedications: [{ id: 'c', name: 'Vitamin C', dose: { value: 2000, unit: 'mg' }, timing: 'daily', startDate: day(20), endDate: null }] });
    const found = warningsOf(json).filter((it) => it.path[0] === 'coMedications');
    expect(found.map((it) => [it.code, it.path])).toEqual([['out_of_range', ['coMedications', 0, 'dose', 'value']]]);
    expect(found[0]!.message).toContain('25–250 mg');
  });

  it('the schema is the single source: deferasirox granules and a product id are part of a period', () => {
    const json = smallCase({ chelationPeriods: [{ id: 'g', drug: 'deferasirox', formulation: 'granules', route: 'oral', dose: { value: 14, unit: 'mg/kg' }, administrationsPerDay: 1, daysPerWeek: 7, startDate: day(100), endDate: null, productId: 'deferasirox-granules' }] });
    expect(caseSchemas.refuse.safeParse(json).success).toBe(true);
  });
});

describe('weight plausibility', () => {
  // Scenario 5 (TH-0322): a 29-year-old who weighed 61 kg; 6.1 kg typed a month later.
  const adult = (weights: [number, number][]) => ({
    ...smallCase({ ageYears: 29, weightKg: 61 }),
    patient: {
      ...(smallCase({ ageYears: 29 })['patient'] as object),
      weights: weights.map(([daysBefore, value]) => ({ date: addDaysIso(reviewDate, -daysBefore), weight: { value, unit: 'kg' } })),
    },
  });

  it('warns on 6.1 kg for a 29-year-old (adult band 28–250 kg) and on the 90 % fall from 61 kg within 90 days', () => {
    const found = warningsOf(adult([[60, 61], [30, 6.1]])).filter((it) => it.path[1] === 'weights');
    expect(found.map((it) => it.code)).toEqual(['out_of_range', 'inconsistent']);
    expect(found[0]!.message).toBe('patient.weights[1].weight.value 6.1 kg on 2026-10-21 is outside 28–250 kg, the plausible range at age 28 (18–any years); check the value and its unit.');
    expect(found[1]!.message).toBe(
      'patient.weights[1].weight.value 6.1 kg on 2026-10-21 is 90 % below the 61 kg of 2026-09-21 (30 days before): more than 20 % within 90 days; check the value.',
    );
  });

  it('on both sides of the 20 % change: 61 → 49 kg (19.7 %) passes, 61 → 48.5 kg (20.5 %) warns; beyond 90 days no change is compared', () => {
    const change = (json: unknown) => warningsOf(json).filter((it) => it.code === 'inconsistent' && it.path[1] === 'weights');
    expect(change(adult([[60, 61], [30, 49]]))).toEqual([]);
    expect(change(adult([[60, 61], [30, 48.5]]))).toHaveLength(1);
    expect(change(adult([[200, 61], [30, 48.5]]))).toEqual([]);
  });

  it('on both sides of a child’s band: at age 4 (band 1–5 years, 5–45 kg) 5 kg passes and 4.9 kg warns', () => {
    // smallCase records its one weight 800 days before the review: a 7-year-old then was 4.
    const child = (kg: number) => warningsOf(smallCase({ ageYears: 7, weightKg: kg, heightCm: 121 })).filter((it) => it.path[1] === 'weights');
    expect(child(5)).toEqual([]);
    expect(child(4.9).map((it) => it.message)).toEqual([expect.stringContaining('4.9 kg on 2024-09-11 is outside 5–45 kg, the plausible range at age 4 (1–5 years)')]);
  });
});

describe('dose per administration', () => {
  it('warns that the dose is per administration, naming the daily total, for deferiprone 75 mg/kg three times a day (225 mg/kg/day; label maximum 100)', () => {
    const json = smallCase({ ageYears: 29, weightKg: 61, chelationPeriods: [{ id: 'dfp', drug: 'deferiprone', formulation: 'tablet', route: 'oral', dose: { value: 75, unit: 'mg/kg' }, administrationsPerDay: 3, daysPerWeek: 7, startDate: addDaysIso(reviewDate, -30), endDate: null }] });
    const found = warningsOf(json).filter((it) => it.path.join('.') === 'chelationPeriods.0.dose');
    expect(found.map((it) => it.message)).toEqual([
      'chelationPeriods[0].dose 75 mg/kg is per administration: × 3 a day = 225 mg/kg/day, above the labelled daily maximum of 100 mg/kg/day for deferiprone, tablets or oral solution; check whether the daily dose was entered as the dose per administration.',
    ]);
  });

  it('is silent at the labelled daily maximum (33.3 × 3 = 100 mg/kg/day) and for 25 mg/kg three times a day, and converts a mg dose by the weight', () => {
    const at = (dose: { value: number; unit: string }) =>
      warningsOf(smallCase({ weightKg: 60, chelationPeriods: [{ id: 'dfp', drug: 'deferiprone', formulation: 'tablet', route: 'oral', dose, administrationsPerDay: 3, daysPerWeek: 7, startDate: addDaysIso(reviewDate, -30), endDate: null }] })).filter(
        (it) => it.path.join('.') === 'chelationPeriods.0.dose',
      );
    expect(at({ value: 100 / 3, unit: 'mg/kg' })).toEqual([]);
    expect(at({ value: 25, unit: 'mg/kg' })).toEqual([]);
    expect(at({ value: 2000, unit: 'mg' })).toEqual([]);
    expect(at({ value: 2100, unit: 'mg' }).map((it) => it.message)).toEqual([expect.stringContaining('2100 mg (35 mg/kg at 60 kg) is per administration: × 3 a day = 105 mg/kg/day')]);
  });
});
