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

/** The New case form before anything is typed: weighed today, the first choices. */
export const emptyNewCaseFields = (today: string): NewCaseFields => ({ label: '', birthDate: '', sexAtBirth: 'female', diagnosisGroup: 'thalassaemia-major', weightKg: '', weightDate: today });

const newCaseFieldKeys = ['label', 'birthDate', 'sexAtBirth', 'diagnosisGroup', 'weightKg', 'weightDate'] as const satisfies readonly (keyof NewCaseFields)[];

/** True when a value has the form's fields, each text (a kept draft read back). */
export function isNewCaseFields(value: unknown): value is NewCaseFields {
  return typeof value === 'object' && value !== null && newCaseFieldKeys.every((key) => typeof (value as Record<string, unknown>)[key] === 'string');
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
