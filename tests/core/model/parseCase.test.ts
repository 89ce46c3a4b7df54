import { describe, expect, it } from 'vitest';
import { runFormula } from '../../../core/formulas/run';
import { transfusionIron } from '../../../core/iron/formulas';
import { migrateCase, parseCase } from '../../../core/model';
import type { Issue } from '../../../core/result';
import { deepFreeze, readDemo, remove, withChange } from './caseFixtures';

// These tests pin the case-file contract: the exact issue code and path for
// each way a file is refused or warned about (the closed code set in
// core/result), and the sentences the style guide gives as its model
// (../shared/style.md: "Unit haematocrit 60 is outside 0.40–0.85; enter it as a
// fraction (0.60)"). Ranges quoted are core/model/plausibleRanges.ts's.

const demo = readDemo('th-0417');

function issuesOf(json: unknown): readonly Issue[] {
  const result = parseCase(json);
  expect(result.ok, 'expected the file to be refused').toBe(false);
  return result.ok ? [] : result.issues;
}

function warningsOf(json: unknown): readonly Issue[] {
  const result = parseCase(json);
  if (!result.ok) throw new Error(`expected the file to open:\n${result.issues.map((it) => it.message).join('\n')}`);
  return result.warnings ?? [];
}

function only(issues: readonly Issue[]): Issue {
  expect(issues.map((it) => it.message)).toHaveLength(1);
  return issues[0]!;
}

describe('parseCase refuses the impossible with a code, a path and the range', () => {
  it('a unit haematocrit typed as a percentage, with the style guide sentence', () => {
    const found = only(issuesOf(withChange(demo, ['transfusions', 3, 'unitHaematocrit'], 60)));
    expect(found).toEqual({
      code: 'out_of_range',
      path: ['transfusions', 3, 'unitHaematocrit'],
      message: 'transfusions[3].unitHaematocrit 60 is outside 0.40–0.85; enter it as a fraction (0.60).',
      severity: 'error',
    });
  });

  it('a negative volume', () => {
    const found = only(issuesOf(withChange(demo, ['transfusions', 0, 'volume', 'value'], -5)));
    expect(found.code).toBe('out_of_range');
    expect(found.path).toEqual(['transfusions', 0, 'volume', 'value']);
    expect(found.message).toBe(
      'transfusions[0].volume.value -5 mL is not possible (more than 0 and at most 10000 mL); the plausible range is 10–2000 mL.',
    );
  });

  it('a haematocrit above 1 that is not a percentage either', () => {
    const found = only(issuesOf(withChange(demo, ['transfusions', 0, 'unitHaematocrit'], 160)));
    expect([found.code, found.path]).toEqual(['out_of_range', ['transfusions', 0, 'unitHaematocrit']]);
    expect(found.message).toContain('the plausible range is 0.40–0.85');
  });

  it('a weight of 0 kg and one of 450 kg (possible range more than 0, at most 400 kg)', () => {
    for (const weightKg of [0, 450]) {
      const found = only(issuesOf(withChange(demo, ['patient', 'weights', 0, 'weight', 'value'], weightKg)));
      expect([found.code, found.path]).toEqual(['out_of_range', ['patient', 'weights', 0, 'weight', 'value']]);
      expect(found.message).toContain('the plausible range is 2–200 kg');
    }
  });

  it('an adherence typed as a percentage', () => {
    const found = only(issuesOf(withChange(demo, ['chelationPeriods', 0, 'adherence'], 80)));
    expect(found.message).toBe('chelationPeriods[0].adherence 80 is outside 0.20–1.00; enter it as a fraction (0.80).');
  });

  it('a date that is not on the calendar, and a year that is a typing error', () => {
    for (const date of ['2023-02-29', '0219-05-01', '2026-13-01', '20-11-2026']) {
      const found = only(issuesOf(withChange(demo, ['results', 0, 'date'], date)));
      expect([found.code, found.path]).toEqual(['invalid_date', ['results', 0, 'date']]);
      expect(found.message).toBe(
        `results[0].date "${date}" is not a calendar date; enter it as YYYY-MM-DD between 1900-01-01 and 2100-12-31.`,
      );
    }
  });

  it('a missing field', () => {
    const found = only(issuesOf(withChange(demo, ['transfusions', 2, 'volume'], remove)));
    expect(found).toMatchObject({ code: 'required', path: ['transfusions', 2, 'volume'] });
    const missingNumber = only(issuesOf(withChange(demo, ['transfusions', 2, 'unitCount'], remove)));
    expect(missingNumber).toMatchObject({ code: 'required', path: ['transfusions', 2, 'unitCount'] });
    expect(missingNumber.message).toBe('transfusions[2].unitCount is missing; expected a number, plausible 1–6.');
    const missingDate = only(issuesOf(withChange(demo, ['transfusions', 2, 'date'], remove)));
    expect(missingDate).toMatchObject({ code: 'required', path: ['transfusions', 2, 'date'] });
  });

  it('a number typed as text, and a count that is not whole', () => {
    const text = only(issuesOf(withChange(demo, ['transfusions', 1, 'volume', 'value'], '560')));
    expect(text).toEqual({
      code: 'not_a_number',
      path: ['transfusions', 1, 'volume', 'value'],
      message: 'transfusions[1].volume.value "560" is not a number; expected 10–2000 mL.',
      severity: 'error',
    });
    const fractional = only(issuesOf(withChange(demo, ['transfusions', 1, 'unitCount'], 2.5)));
    expect([fractional.code, fractional.path]).toEqual(['not_an_integer', ['transfusions', 1, 'unitCount']]);
  });

  it('a unit the field does not take', () => {
    const found = only(issuesOf(withChange(demo, ['patient', 'weights', 0, 'weight', 'unit'], 'lb')));
    expect(found).toEqual({
      code: 'unknown_choice',
      path: ['patient', 'weights', 0, 'weight', 'unit'],
      message: 'patient.weights[0].weight.unit "lb" is not one of: kg.',
      severity: 'error',
    });
    const creatinine = demo['results'] as { kind: string }[];
    const index = creatinine.findIndex((it) => it.kind === 'creatinine');
    const wrongUnit = only(issuesOf(withChange(demo, ['results', index, 'measured', 'unit'], 'mmol/L')));
    expect(wrongUnit.message).toBe(`results[${index}].measured.unit "mmol/L" is not one of: mg/dL, umol/L.`);
  });

  it('an unknown result kind, liver iron method or transfusion kind', () => {
    const kind = only(issuesOf(withChange(demo, ['results', 0, 'kind'], 'troponin')));
    expect([kind.code, kind.path]).toEqual(['unknown_choice', ['results', 0, 'kind']]);
    expect(kind.message).toContain('"troponin" is not one of: ferritin, liver-iron, cardiac-t2star');
    const results = demo['results'] as { kind: string }[];
    const lic = results.findIndex((it) => it.kind === 'liver-iron');
    const method = only(issuesOf(withChange(demo, ['results', lic, 'method'], 'ultrasound')));
    expect([method.code, method.path]).toEqual(['unknown_choice', ['results', lic, 'method']]);
    const missingKind = only(issuesOf(withChange(demo, ['transfusions', 0, 'kind'], remove)));
    expect([missingKind.code, missingKind.path]).toEqual(['required', ['transfusions', 0, 'kind']]);
  });

  it('a route or formulation the drug does not have', () => {
    const route = only(issuesOf(withChange(demo, ['chelationPeriods', 1, 'route'], 'subcutaneous')));
    expect(route).toMatchObject({ code: 'unknown_choice', path: ['chelationPeriods', 1, 'route'] });
    const formulation = only(issuesOf(withChange(demo, ['chelationPeriods', 1, 'formulation'], 'vial')));
    expect(formulation.message).toBe('chelationPeriods[1].formulation "vial" is not one of: dispersible-tablet, film-coated-tablet, granules.');
  });

  it('a misspelt field', () => {
    const changed = withChange(demo, ['transfusions', 0, 'unitHaematocritt'], 0.6);
    const found = only(issuesOf(changed));
    expect(found).toMatchObject({ code: 'unknown_option', path: ['transfusions', 0, 'unitHaematocritt'] });
  });

  it('a field-strength that is neither 1.5 nor 3 T', () => {
    const results = demo['results'] as { kind: string }[];
    const lic = results.findIndex((it) => it.kind === 'liver-iron');
    const found = only(issuesOf(withChange(demo, ['results', lic, 'fieldStrengthT'], 7)));
    expect(found.message).toBe(`results[${lic}].fieldStrengthT 7 is not one of: 1.5, 3.`);
  });

  it('more than three proposed regimens', () => {
    const proposals = demo['proposedRegimens'] as { id: string }[];
    const four = [0, 1, 2, 3].map((n) => ({ ...proposals[0]!, id: `p${n}` }));
    const found = only(issuesOf(withChange(demo, ['proposedRegimens'], four)));
    expect(found).toMatchObject({ code: 'out_of_range', path: ['proposedRegimens'], message: 'proposedRegimens has 4 entries; at most 3 entries.' });
  });
});

describe('parseCase refuses entries that contradict each other', () => {
  it('a period that ends before it starts', () => {
    const found = only(issuesOf(withChange(demo, ['chelationPeriods', 0, 'endDate'], '2020-01-01')));
    expect(found).toEqual({
      code: 'inconsistent',
      path: ['chelationPeriods', 0, 'endDate'],
      message: 'chelationPeriods[0].endDate 2020-01-01 is before its start date 2021-09-01.',
      severity: 'error',
    });
  });

  it('two entries with one id', () => {
    const transfusions = demo['transfusions'] as { id: string }[];
    const found = only(issuesOf(withChange(demo, ['transfusions', 5, 'id'], transfusions[4]!.id)));
    expect(found).toMatchObject({ code: 'inconsistent', path: ['transfusions', 5, 'id'] });
    expect(found.message).toContain('is already used by transfusions[4]');
  });

  it('an event before the birth date', () => {
    const found = only(issuesOf(withChange(demo, ['transfusions', 0, 'date'], '2010-01-05')));
    expect(found).toMatchObject({ code: 'inconsistent', path: ['transfusions', 0, 'date'] });
    expect(found.message).toBe('transfusions[0].date 2010-01-05 is before the birth date 2011-06-14.');
  });
});

describe('assumption overrides', () => {
  const override = { value: 1.16, reason: 'local protocol uses 1.16 mg/mL', by: 'AB', at: '2026-11-20' };

  it('are kept, and have the shape runFormula takes as overrides', () => {
    const result = parseCase(withChange(demo, ['assumptionOverrides'], { 'iron-per-ml-red-cells': override }));
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.value.assumptionOverrides).toEqual({ 'iron-per-ml-red-cells': override });
    // 280 mL × 0.60 × 1.16 mg/mL = 194.88 mg (hand arithmetic, as in tests/core/iron/transfusionIron.test.ts).
    const iron = runFormula(transfusionIron, { volumeMl: 280, unitHaematocrit: 0.6 }, { overrides: result.value.assumptionOverrides });
    expect(iron.ok && iron.value.outputs['ironMg']).toBeCloseTo(194.88, 9);
  });

  it('refuse an id the catalogue does not know', () => {
    const found = only(issuesOf(withChange(demo, ['assumptionOverrides'], { 'iron-per-ml': override })));
    expect(found).toMatchObject({ code: 'unknown_choice', path: ['assumptionOverrides', 'iron-per-ml'], severity: 'error' });
    expect(found.message).toContain('assumptionOverrides.iron-per-ml is not an assumption this version knows; known: iron-per-ml-red-cells,');
  });

  it('refuse "__proto__" as an id rather than dropping it silently', () => {
    const json = JSON.parse(`{"__proto__": ${JSON.stringify(override)}}`) as unknown;
    const found = only(issuesOf(withChange(demo, ['assumptionOverrides'], json)));
    expect(found).toMatchObject({ code: 'unknown_choice', path: ['assumptionOverrides', '__proto__'] });
  });

  it('refuse a value outside the range the catalogue allows (0.9–1.25 mg/mL for iron per mL of red cells)', () => {
    const found = only(issuesOf(withChange(demo, ['assumptionOverrides'], { 'iron-per-ml-red-cells': { ...override, value: 11.6 } })));
    expect(found).toEqual({
      code: 'out_of_range',
      path: ['assumptionOverrides', 'iron-per-ml-red-cells', 'value'],
      message: 'assumptionOverrides.iron-per-ml-red-cells.value 11.6 mg/mL is outside 0.9–1.25 mg/mL, the range allowed for iron per mL of pure red cells.',
      severity: 'error',
    });
  });

  it('refuse an override without a reason', () => {
    const found = only(issuesOf(withChange(demo, ['assumptionOverrides'], { 'iron-per-ml-red-cells': { ...override, reason: '' } })));
    expect(found).toMatchObject({ code: 'required', path: ['assumptionOverrides', 'iron-per-ml-red-cells', 'reason'] });
  });
});

describe('parseCase keeps the implausible-but-possible with a warning that states the range', () => {
  it('a weight of 250 kg', () => {
    const [found, ...others] = warningsOf(withChange(demo, ['patient', 'weights', 0, 'weight', 'value'], 250));
    // TH-0417 was about 13 then: the weight-for-age screen (10–15 years, at most 150 kg) names the same field.
    expect(others.map((it) => [it.code, it.path])).toEqual([['out_of_range', ['patient', 'weights', 0, 'weight', 'value']]]);
    expect(found).toEqual({
      code: 'out_of_range',
      path: ['patient', 'weights', 0, 'weight', 'value'],
      message: 'patient.weights[0].weight.value 250 kg is outside the plausible range 2–200 kg; check the value and its unit.',
      severity: 'warning',
    });
  });

  it('a ferritin above 20 000 µg/L, and a creatinine of 12 mg/dL (possible in renal failure, far more often a typing error)', () => {
    const results = demo['results'] as { kind: string }[];
    const ferritin = results.findIndex((it) => it.kind === 'ferritin');
    const creatinine = results.findIndex((it) => it.kind === 'creatinine');
    const changed = withChange(withChange(demo, ['results', ferritin, 'measured', 'value'], 25000), ['results', creatinine, 'measured', 'value'], 12);
    const warnings = warningsOf(changed);
    expect(warnings.map((it) => [it.code, it.path, it.severity])).toEqual([
      ['out_of_range', ['results', ferritin, 'measured', 'value'], 'warning'],
      ['out_of_range', ['results', creatinine, 'measured', 'value'], 'warning'],
    ]);
    expect(warnings[0]!.message).toContain('25000 µg/L is outside the plausible range 1–20000 µg/L');
    expect(warnings[1]!.message).toContain('12 mg/dL is outside the plausible range 0.1–10.0 mg/dL');
  });

  it('an event after the review date', () => {
    const found = only(warningsOf(withChange(demo, ['results', 0, 'date'], '2027-01-05')));
    expect(found).toMatchObject({ code: 'inconsistent', path: ['results', 0, 'date'], severity: 'warning' });
  });

  it('a label that looks like a name, but not initials or a code', () => {
    for (const label of ['Jane Smith', 'Smith, J', 'Smith']) {
      const found = only(warningsOf(withChange(demo, ['patient', 'label'], label)));
      expect(found).toMatchObject({ code: 'inconsistent', path: ['patient', 'label'] });
    }
    for (const label of ['JS', 'TH-0417', 'MRN 4471']) expect(warningsOf(withChange(demo, ['patient', 'label'], label))).toEqual([]);
  });

  it('a raw R2* with a calibration of another field strength, or an unknown calibration', () => {
    const results = demo['results'] as { method?: string }[];
    const raw = results.findIndex((it) => it.method === 'mri-r2star');
    const mismatch = only(warningsOf(withChange(demo, ['results', raw, 'fieldStrengthT'], 3)));
    expect(mismatch).toMatchObject({ code: 'field_strength_mismatch', path: ['results', raw, 'calibrationId'], severity: 'warning' });
    expect(mismatch.message).toContain('was derived at 1.5 T but the result was measured at 3 T');
    const unknown = only(warningsOf(withChange(demo, ['results', raw, 'calibrationId'], 'scanner-default')));
    expect(unknown).toMatchObject({ code: 'unknown_choice', path: ['results', raw, 'calibrationId'], severity: 'warning' });
  });

  it('two periods of one drug that overlap', () => {
    const periods = demo['chelationPeriods'] as Record<string, unknown>[];
    const doubled = [...periods, { ...periods[1]!, id: 'chel-dfx-typed-twice', startDate: '2026-01-01' }];
    const found = only(warningsOf(withChange(demo, ['chelationPeriods'], doubled)));
    expect(found).toMatchObject({ code: 'inconsistent', path: ['chelationPeriods', 2], severity: 'warning' });
    expect(found.message).toContain('overlaps chelationPeriods[1] of the same drug');
  });
});

describe('case files round-trip and are never changed', () => {
  it('parse → JSON → parse gives the same case (both demos and a file that relies on defaults)', () => {
    const minimal = {
      format: 'chelation-ledger.case',
      version: 1,
      patient: {
        label: 'SC-0781',
        age: { kind: 'years-on-date', years: 26, onDate: '2026-11-20' },
        sexAtBirth: 'male',
        diagnosisGroup: 'sickle-cell-disease',
        pregnancy: { status: 'not-pregnant', recordedOn: null },
        weights: [{ date: '2026-11-20', weight: { value: 74, unit: 'kg' } }],
      },
    };
    for (const json of [readDemo('th-0417'), readDemo('th-0093'), minimal]) {
      const first = parseCase(json);
      if (!first.ok) throw new Error(first.issues.map((it) => it.message).join('\n'));
      const second = parseCase(JSON.parse(JSON.stringify(first.value)));
      expect(second).toEqual(first);
    }
  });

  it('does not change a deep-frozen input, valid or not', () => {
    const valid = deepFreeze(readDemo('th-0417'));
    const before = structuredClone(valid);
    expect(parseCase(valid).ok).toBe(true);
    expect(valid).toEqual(before);
    const invalid = deepFreeze(withChange(readDemo('th-0093'), ['transfusions', 0, 'unitHaematocrit'], 60));
    expect(parseCase(invalid).ok).toBe(false);
    expect(migrateCase(valid)).toEqual({ ok: true, value: valid });
  });

  it('fills defaults in a new object: adherence 1 when not given, empty lists', () => {
    const withoutAdherence = withChange(demo, ['chelationPeriods', 1, 'adherence'], remove);
    const result = parseCase(withoutAdherence);
    expect(result.ok && result.value.chelationPeriods[1]?.adherence).toBe(1);
    expect((withoutAdherence['chelationPeriods'] as Record<string, unknown>[])[1]).not.toHaveProperty('adherence');
  });
});

describe('versions and formats', () => {
  it('refuses a future version with unsupported_version', () => {
    expect(only(issuesOf({ ...demo, version: 3 }))).toEqual({
      code: 'unsupported_version',
      path: ['version'],
      message: 'version 3 is newer than this tool reads (1 to 2); open the file with a newer version of chelation-ledger.',
      severity: 'error',
    });
  });

  it('refuses a missing or other format, and a version that is not a whole number from 1, with invalid_file', () => {
    const { format: _format, ...withoutFormat } = demo;
    expect(only(issuesOf(withoutFormat))).toMatchObject({ code: 'invalid_file', path: ['format'] });
    expect(only(issuesOf({ ...demo, format: 'another-tool.case' }))).toMatchObject({ code: 'invalid_file', path: ['format'] });
    for (const version of ['1', 0, 1.5, null]) expect(only(issuesOf({ ...demo, version }))).toMatchObject({ code: 'invalid_file', path: ['version'] });
    for (const notAnObject of [null, [], 'case', 42]) expect(only(issuesOf(notAnObject))).toMatchObject({ code: 'invalid_file', path: [] });
  });

  it('passes a current file through migration as the same object', () => {
    const json = readDemo('th-0093');
    const migrated = migrateCase(json);
    expect(migrated.ok && migrated.value).toBe(json);
  });
});
