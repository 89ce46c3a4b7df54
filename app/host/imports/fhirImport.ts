import { basename } from 'node:path';
import { z } from 'zod';
import { ucumCodeForTypedUnit } from '../../../core/units/unitSpellings';
import type { Case } from '../../../core/model/caseFile';
import { fail, issue, ok, type Result } from '../../../core/result';
import { codingKey, type CodeMap } from './codeMap';
import { readImportDate } from './importDates';
import { proposedTransfusion, resultUnitsByKind, toCaseUnit, withoutConversionNoise, type ImportPlan, type ProposedEntry, type Rejected } from './importPlan';
import { loincCodes, loincSystem, redCellTransfusionSnomed, ucumSystem } from './loincCodes';
import { convertUcum, isUcumCode } from './ucum';

/**
 * HL7 FHIR R4 Bundle (JSON) imports: Observations coded with LOINC
 * (loincCodes.ts), Procedures coded as a red-cell transfusion with the volume
 * in an extension's valueQuantity, and the Patient's birth date and sex only
 * (names, identifiers, addresses are never read). zod schemas describe only
 * the parts read (FHIR R4: Bundle.entry.resource; Observation.status, code,
 * effective[x], issued, valueQuantity; Procedure.status, code, performed[x],
 * extension; Patient.birthDate, gender); everything else is ignored.
 */

const coding = z.object({ system: z.string().optional(), code: z.string().optional(), display: z.string().optional() });
const codeableConcept = z.object({ coding: z.array(coding).optional(), text: z.string().optional() });
const quantity = z.object({ value: z.number(), unit: z.string().optional(), system: z.string().optional(), code: z.string().optional() });
const bundleSchema = z.object({ resourceType: z.literal('Bundle'), entry: z.array(z.object({ resource: z.unknown().optional() })).optional() });
const resourceHead = z.object({ resourceType: z.string(), id: z.string().optional() });
const observationSchema = z.object({
  resourceType: z.literal('Observation'),
  status: z.string().optional(),
  code: codeableConcept,
  effectiveDateTime: z.string().optional(),
  effectivePeriod: z.object({ start: z.string().optional() }).optional(),
  issued: z.string().optional(),
  valueQuantity: quantity.optional(),
});
const procedureSchema = z.object({
  resourceType: z.literal('Procedure'),
  status: z.string().optional(),
  code: codeableConcept.optional(),
  performedDateTime: z.string().optional(),
  performedPeriod: z.object({ start: z.string().optional() }).optional(),
  extension: z.array(z.object({ url: z.string().optional(), valueQuantity: quantity.optional() })).optional(),
});
const patientSchema = z.object({ resourceType: z.literal('Patient'), birthDate: z.string().optional(), gender: z.string().optional() });

/** Observation and Procedure statuses whose values are taken (FHIR R4 value sets observation-status and event-status). */
const acceptedObservationStatuses = ['final', 'amended', 'corrected'];
const acceptedProcedureStatuses = ['completed'];

const firstIssue = (error: z.ZodError) => {
  const first = error.issues[0];
  return first ? `${first.path.join('.') || 'the resource'}: ${first.message}` : 'not readable';
};

/** The UCUM code of a FHIR Quantity: its code when the system is UCUM, else its unit text read against the allowed codes. */
function quantityUnit(value: z.output<typeof quantity>, allowed: readonly string[]): string | undefined {
  if (value.system === ucumSystem && value.code) return ucumCodeForTypedUnit(value.code, allowed) ?? value.code;
  const typed = value.code ?? value.unit ?? '';
  return ucumCodeForTypedUnit(typed, allowed) ?? (isUcumCode(typed) ? typed : undefined);
}

/**
 * Read a FHIR R4 Bundle into an import plan.
 *
 * @param json - the parsed bundle
 * @param caseFile - the case it would go into (its units are used), or null
 * @param codeMap - local codes for Observations LOINC has no code for (codeMap.ts); looked up after the built-in LOINC codes
 * @returns the plan (entries, rejected resources with where and why, unknown codes, the patient's birth date and sex),
 *   or an issue when the input is not a Bundle
 */
export function readFhirImport(json: unknown, caseFile: Case | null, codeMap?: CodeMap): Result<ImportPlan> {
  const bundle = bundleSchema.safeParse(json);
  if (!bundle.success) return fail(issue('invalid_file', ['resourceType'], `The file is not a FHIR Bundle (${firstIssue(bundle.error)}).`));
  const entries: ProposedEntry[] = [];
  const rejected: Rejected[] = [];
  const unknownCodes: { where: string; code: string; display: string }[] = [];
  let patient: ImportPlan['patient'];
  const counts: Record<string, number> = {};

  (bundle.data.entry ?? []).forEach((bundleEntry, index) => {
    const head = resourceHead.safeParse(bundleEntry.resource);
    const where = head.success ? `entry[${index}] ${head.data.resourceType}/${head.data.id ?? '(no id)'}` : `entry[${index}]`;
    const reject = (reason: string) => rejected.push({ where, reason });
    if (!head.success) {
      reject('no resource with a resourceType');
      return;
    }
    counts[head.data.resourceType] = (counts[head.data.resourceType] ?? 0) + 1;
    switch (head.data.resourceType) {
      case 'Patient': {
        const read = patientSchema.safeParse(bundleEntry.resource);
        if (!read.success) return reject(firstIssue(read.error));
        const birth = read.data.birthDate ? readImportDate(read.data.birthDate, undefined) : undefined;
        patient = {
          ...(birth?.ok ? { birthDate: birth.date } : {}),
          ...(read.data.gender === 'female' || read.data.gender === 'male' ? { sexAtBirth: read.data.gender } : {}),
        };
        if (read.data.gender !== undefined && read.data.gender !== 'female' && read.data.gender !== 'male') {
          reject(`gender "${read.data.gender}" is administrative gender, not sex at birth; the case's sex at birth is not taken from it`);
        }
        return;
      }
      case 'Observation': {
        const read = observationSchema.safeParse(bundleEntry.resource);
        if (!read.success) return reject(firstIssue(read.error));
        const observation = read.data;
        const codings = observation.code.coding ?? [];
        const known = codings.find((it) => it.system === loincSystem && it.code !== undefined && loincCodes[it.code] !== undefined);
        const mapped = known ? undefined : codings.map((it) => (it.system && it.code ? codeMap?.entries.get(codingKey(it.system, it.code)) : undefined)).find((it) => it !== undefined);
        if (!known && !mapped) {
          for (const it of codings.length > 0 ? codings : [{ system: '', code: '(no coding)', display: observation.code.text ?? '' }]) {
            unknownCodes.push({ where, code: `${it.system ?? ''}|${it.code ?? ''}`, display: it.display ?? observation.code.text ?? '' });
          }
          return;
        }
        if (observation.status !== undefined && !acceptedObservationStatuses.includes(observation.status)) return reject(`status "${observation.status}" (only final, amended or corrected results are imported)`);
        const dateText = observation.effectiveDateTime ?? observation.effectivePeriod?.start ?? observation.issued;
        const date = dateText ? readImportDate(dateText, undefined) : undefined;
        if (!date?.ok) return reject(date ? `date ${date.reason}` : 'no effective date or issued time');
        if (!observation.valueQuantity) return reject('no valueQuantity');
        if (mapped) {
          // A local code (codeMap.ts): the value converted to the map's unit, the map's method, field strength and calibration.
          const typed = observation.valueQuantity.code ?? observation.valueQuantity.unit ?? '';
          const unit = quantityUnit(observation.valueQuantity, [mapped.unit]);
          const converted = unit === undefined ? undefined : convertUcum(observation.valueQuantity.value, unit, mapped.unit, where);
          if (!converted?.ok) return reject(`${observation.valueQuantity.value} ${typed} cannot be converted to ${mapped.unit}, the unit code map ${codeMap!.name} gives for ${codingKey(mapped.system, mapped.code)}`);
          entries.push({
            list: 'results',
            where,
            entry: {
              date: date.date,
              ...mapped.result,
              measured: { value: withoutConversionNoise(converted.value), unit: mapped.unit },
              note: `imported from FHIR ${where.split(' ')[1]} (local code ${codingKey(mapped.system, mapped.code)}, code map ${basename(codeMap!.name)})`,
            },
          });
          return;
        }
        const target = loincCodes[known!.code!]!.target;
        if (target.list === 'weights' || target.list === 'heights') {
          const toUnit = target.list === 'weights' ? 'kg' : 'cm';
          const unit = quantityUnit(observation.valueQuantity, [toUnit]);
          const converted = unit === undefined ? undefined : convertUcum(observation.valueQuantity.value, unit, toUnit, where);
          if (!converted?.ok) return reject(`${observation.valueQuantity.value} ${observation.valueQuantity.code ?? observation.valueQuantity.unit ?? ''} cannot be converted to ${toUnit}`);
          const value = withoutConversionNoise(converted.value);
          entries.push({ list: target.list, where, entry: target.list === 'weights' ? { date: date.date, weight: { value, unit: 'kg' } } : { date: date.date, height: { value, unit: 'cm' } } });
          return;
        }
        const allowed = resultUnitsByKind[target.kind] ?? [];
        const unit = quantityUnit(observation.valueQuantity, allowed);
        if (unit === undefined) return reject(`unit "${observation.valueQuantity.code ?? observation.valueQuantity.unit ?? ''}" is not a UCUM unit the import can convert to ${allowed.join(' or ')}`);
        const stored = toCaseUnit(caseFile, target.kind, observation.valueQuantity.value, unit, where);
        if (!stored.ok) return reject(`${observation.valueQuantity.value} ${unit} cannot be converted to ${allowed.join(' or ')}`);
        entries.push({
          list: 'results',
          where,
          entry: { date: date.date, kind: target.kind, ...(target.method ? { method: target.method } : {}), measured: stored.value, note: `imported from FHIR ${where.split(' ')[1]} (LOINC ${known!.code})` },
        });
        return;
      }
      case 'Procedure': {
        const read = procedureSchema.safeParse(bundleEntry.resource);
        if (!read.success) return reject(firstIssue(read.error));
        const procedure = read.data;
        const isTransfusion = (procedure.code?.coding ?? []).some((it) => it.system === redCellTransfusionSnomed.system && it.code === redCellTransfusionSnomed.code);
        if (!isTransfusion) {
          for (const it of procedure.code?.coding ?? [{ system: '', code: '(no coding)' }]) unknownCodes.push({ where, code: `${it.system ?? ''}|${it.code ?? ''}`, display: ('display' in it ? it.display : undefined) ?? procedure.code?.text ?? '' });
          return;
        }
        if (procedure.status !== undefined && !acceptedProcedureStatuses.includes(procedure.status)) return reject(`status "${procedure.status}" (only completed transfusions are imported)`);
        const dateText = procedure.performedDateTime ?? procedure.performedPeriod?.start;
        const date = dateText ? readImportDate(dateText, undefined) : undefined;
        if (!date?.ok) return reject(date ? `date ${date.reason}` : 'no performed date');
        const volumes = (procedure.extension ?? []).flatMap((it) => {
          if (!it.valueQuantity) return [];
          const unit = quantityUnit(it.valueQuantity, ['mL']);
          const converted = unit === undefined ? undefined : convertUcum(it.valueQuantity.value, unit, 'mL', where);
          return converted?.ok ? [converted.value] : [];
        });
        if (volumes.length !== 1) return reject(volumes.length === 0 ? 'no volume (an extension with a valueQuantity in a volume unit) in the record' : 'more than one volume in the record');
        entries.push(
          proposedTransfusion(where, date.date, volumes[0]!, null, 1, `imported from FHIR ${where.split(' ')[1]}; unit haematocrit and unit count not in the record (product default and 1 assumed)`),
        );
        return;
      }
      default:
        // Other resources (Encounter, Practitioner, …) hold nothing the case file records.
        return;
    }
  });
  const understood = [`FHIR R4 Bundle: ${Object.entries(counts).map(([type, count]) => `${count} ${type}`).join(', ') || 'no resources'}`];
  if (patient) understood.push('Patient: birth date and sex only (names and identifiers are not read)');
  if (codeMap) understood.push(`local codes: ${codeMap.entries.size} from code map ${codeMap.name}`);
  return ok({ format: 'fhir', understood, entries, rejected, unknownCodes, ...(patient ? { patient } : {}) });
}
