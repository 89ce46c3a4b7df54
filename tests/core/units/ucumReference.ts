import { createRequire } from 'node:module';

/**
 * @lhncbc/ucum-lhc (the National Library of Medicine's UCUM implementation) as
 * the outside reference for unit factors, in tests only: core never imports it.
 * The package has no type declarations; it is loaded with createRequire and
 * described by the small interface below (checked against
 * node_modules/@lhncbc/ucum-lhc/source/ucumLhcUtils.js, version 7.1.10), so no
 * ambient module declaration can clash with another test's.
 */
interface UcumConversion {
  readonly status: 'succeeded' | 'failed' | 'error';
  readonly toVal: number | null;
  readonly msg: readonly string[];
}

interface UcumLhcUtils {
  convertUnitTo(
    fromUnitCode: string,
    fromValue: number,
    toUnitCode: string,
    options?: { readonly molecularWeight?: number; readonly suggest?: boolean },
  ): UcumConversion;
}

const require = createRequire(import.meta.url);
const ucumPackage = require('@lhncbc/ucum-lhc') as { UcumLhcUtils: { getInstance(): UcumLhcUtils } };
const ucum = ucumPackage.UcumLhcUtils.getInstance();

/**
 * Convert with ucum-lhc; throws when it cannot (a wrong unit code in a test is a bug).
 * @param molecularWeight - g/mol, needed between mass and substance units
 */
export function ucumConvert(fromUnit: string, value: number, toUnit: string, molecularWeight?: number): number {
  const result = ucum.convertUnitTo(fromUnit, value, toUnit, molecularWeight === undefined ? {} : { molecularWeight });
  if (result.status !== 'succeeded' || result.toVal === null) {
    throw new Error(`ucum-lhc could not convert ${value} ${fromUnit} to ${toUnit}: ${result.msg.join('; ')}`);
  }
  return result.toVal;
}
