// The part of @lhncbc/ucum-lhc 7.1.10 the imports call (it ships no type
// declarations); checked against node_modules/@lhncbc/ucum-lhc/source-cjs/ucumLhcUtils.js.
declare module '@lhncbc/ucum-lhc' {
  export const UcumLhcUtils: {
    getInstance(): {
      convertUnitTo(fromUnit: string, value: number, toUnit: string, options?: { molecularWeight?: number }): { status: string; toVal: number | null; msg?: readonly string[] };
      validateUnitString(unit: string): { status: string; ucumCode: string | null };
    };
  };
}
