/**
 * The brand behind every quantity: a number that carries its unit in the type
 * (style.md habit 3). The named units and their constructors are in
 * core/units/quantity.ts; this leaf exists so that core/elements (atomic weights in
 * g/mol) can use the brand without importing core/units, which imports elements for
 * its molar conversions.
 */
declare const unitBrand: unique symbol;

export type Quantity<Unit extends string> = number & { readonly [unitBrand]: Unit };
