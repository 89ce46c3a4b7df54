import { createRequire } from 'node:module';

/**
 * ucum-lhc's validator (National Library of Medicine's UCUM implementation,
 * version 7.1.10) as the outside reference for unit codes, in tests only.
 * Described by the small interface below, checked against
 * node_modules/@lhncbc/ucum-lhc/source-cjs/ucumLhcUtils.js (validateUnitString).
 */
interface UcumValidation {
  readonly status: 'valid' | 'invalid' | 'error';
  readonly ucumCode: string | null;
  readonly msg: readonly string[];
}

const require = createRequire(import.meta.url);
const ucum = (require('@lhncbc/ucum-lhc') as { UcumLhcUtils: { getInstance(): { validateUnitString(code: string): UcumValidation } } })
  .UcumLhcUtils.getInstance();

/** ucum-lhc's verdict on one unit code. */
export function ucumValidation(code: string): UcumValidation {
  return ucum.validateUnitString(code);
}
