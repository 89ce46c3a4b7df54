import { UcumLhcUtils } from '@lhncbc/ucum-lhc';
import { fail, issue, ok, type Result } from '../../../core/result';

/**
 * The one owner of @lhncbc/ucum-lhc (NLM's implementation of UCUM, the
 * Unified Code for Units of Measure) on the host side: imports convert every
 * quantity through it to the units of the case file. It ships no type
 * declarations; the little we call is declared in ucumLhc.d.ts.
 */
type UcumUtils = ReturnType<typeof UcumLhcUtils.getInstance>;
let instance: UcumUtils | undefined;
/** The converter, made when first used: it reads its unit tables then, not at every start of the command line. */
const ucumUtils = (): UcumUtils => (instance ??= UcumLhcUtils.getInstance());

/**
 * Convert a value between UCUM units; mass and substance amounts convert only
 * with the molecular weight given (creatinine mg/dL ↔ µmol/L).
 *
 * @param value - the number as recorded
 * @param fromUnit - its UCUM code ('[lb_av]', 'mg/dL', '%')
 * @param toUnit - the case file's UCUM code ('kg', 'umol/L', '1')
 * @param where - where the value came from, for the message ("line 4", "Observation/f001")
 * @param molecularWeightGPerMol - for conversions between mass and moles
 * @returns the converted number, or an 'invalid_file' issue naming where and both units
 * @example convertUcum(185, '[lb_av]', 'kg', 'Observation/example') → ok(83.91…)
 */
export function convertUcum(value: number, fromUnit: string, toUnit: string, where: string, molecularWeightGPerMol?: number): Result<number> {
  if (fromUnit === toUnit) return ok(value);
  let converted: ReturnType<UcumUtils['convertUnitTo']>;
  try {
    converted = ucumUtils().convertUnitTo(fromUnit, value, toUnit, molecularWeightGPerMol === undefined ? {} : { molecularWeight: molecularWeightGPerMol });
  } catch {
    converted = { status: 'error', toVal: null };
  }
  if (converted.status !== 'succeeded' || converted.toVal === null || !Number.isFinite(converted.toVal)) {
    return fail(issue('invalid_file', [where], `${where}: ${value} ${fromUnit} cannot be converted to ${toUnit} (UCUM); the row was not imported.`));
  }
  return ok(converted.toVal);
}

/** Whether a text is a valid UCUM code as written. */
export function isUcumCode(unit: string): boolean {
  try {
    return ucumUtils().validateUnitString(unit).status === 'valid';
  } catch {
    return false;
  }
}
