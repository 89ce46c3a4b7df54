import { currentCaseFileVersion, caseFileFormat } from '../../core/model/caseFile';
import { parseCase } from '../../core/model/parseCase';
import { fail, ok, type Result } from '../../core/result';

export interface NewCaseFields {
  readonly label: string;
  readonly birthDate: string;
  readonly sexAtBirth: string;
  readonly diagnosisGroup: string;
  readonly weightKg: string;
  readonly weightDate: string;
}

/**
 * A new case file from the New case form, checked by core/model: the case
 * JSON, or the issues in the trade's words (the form keeps what was typed).
 */
export function newCaseJson(fields: NewCaseFields): Result<Record<string, unknown>> {
  const weight = fields.weightKg.trim() === '' ? undefined : Number(fields.weightKg.trim());
  const json = {
    format: caseFileFormat,
    version: currentCaseFileVersion,
    patient: {
      label: fields.label.trim(),
      age: { kind: 'birth-date', birthDate: fields.birthDate.trim() || undefined },
      sexAtBirth: fields.sexAtBirth,
      diagnosisGroup: fields.diagnosisGroup,
      pregnancy: { status: 'not-pregnant', recordedOn: null },
      weights: [{ date: fields.weightDate.trim() || undefined, weight: { value: Number.isFinite(weight) ? weight : fields.weightKg.trim(), unit: 'kg' } }],
      heights: [],
    },
  };
  const parsed = parseCase(json);
  if (!parsed.ok) return fail(...parsed.issues);
  return ok(JSON.parse(JSON.stringify(json)) as Record<string, unknown>);
}
