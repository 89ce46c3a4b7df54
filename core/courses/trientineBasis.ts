import { massInForm } from '../chelators/saltToBase';
import { substanceForm, type SubstanceFormId } from '../chelators/substanceForms';
import { fail, issue, ok, type Issue, type Result } from '../result';
import type { Milligrams } from '../units/quantity';

/**
 * Trientine products: which salt the tablet or capsule holds, and on which
 * basis its strength is printed. The US dihydrochloride capsule is labelled
 * 250 mg of the salt (US label, openFDA); the EU tetrahydrochloride tablet is
 * labelled 150 mg of trientine base (EU SmPC 2022 §2). references.md §9: confirmed.
 */
export const trientineProducts = [
  // Capsules are swallowed whole, not opened or chewed (US label as reproduced): whole units only.
  { id: 'trientine-dihydrochloride', saltFormId: 'trientine-dihydrochloride', strengthMg: 250, strengthBasis: 'salt', smallestUnit: 1, unitName: 'capsule', sourceIds: ['trientine-dihydrochloride-label'] },
  // "The tablet can be divided into equal doses" (EU SmPC §3): halves.
  { id: 'trientine-tetrahydrochloride', saltFormId: 'trientine-tetrahydrochloride', strengthMg: 150, strengthBasis: 'base', smallestUnit: 0.5, unitName: 'tablet', sourceIds: ['trientine-tetrahydrochloride-smpc'] },
] as const;
export type TrientineProductId = (typeof trientineProducts)[number]['id'];
export type StrengthBasis = 'salt' | 'base';

/** Relative tolerance when an entered strength is compared with the printed one: 1 %, wider than rounding on a label (common practice). */
const strengthTolerance = 0.01;

function product(id: TrientineProductId) {
  return trientineProducts.find((it) => it.id === id)!;
}

/** mg of trientine base in a mass of the product's salt or of base. */
function baseMg(massMg: number, basis: StrengthBasis, saltFormId: SubstanceFormId): number {
  if (basis === 'base') return massMg;
  const converted = massInForm(massMg as Milligrams, saltFormId, 'trientine-base');
  if (!converted.ok) throw new Error('trientine forms share one substance');
  return converted.value;
}

export interface StrengthCheck {
  readonly productId: TrientineProductId;
  readonly enteredMg: number;
  readonly enteredBasis: StrengthBasis;
  /** The product's strength as printed, and the same strength on the other basis. */
  readonly printedMg: number;
  readonly printedBasis: StrengthBasis;
  readonly printedSaltMg: number;
  readonly printedBaseMg: number;
  /** Base in what was entered, on the basis it was entered. */
  readonly enteredBaseMg: number;
}

/**
 * Check a trientine strength as entered (mg and basis) against the product's
 * printed strength. The classic error is a strength typed on the wrong basis
 * (150 mg "salt" for the tetrahydrochloride tablet that holds 150 mg base);
 * it is caught when the figure matches the printed strength only when read
 * on the other basis, and both figures are shown.
 *
 * @param productId - the trientine product
 * @param enteredMg - the strength as entered, mg (> 0)
 * @param enteredBasis - 'salt' or 'base'
 * @returns the check; or 'wrong_basis' (the figure is the printed strength on the other basis) or
 *   'inconsistent' (not this product's strength on either basis), path ['strength']
 * @example checkTrientineStrength('trientine-tetrahydrochloride', 150, 'salt') → fail wrong_basis: "150 mg … trientine base … 299.6 mg of trientine tetrahydrochloride … 75.1 mg base"
 */
export function checkTrientineStrength(productId: TrientineProductId, enteredMg: number, enteredBasis: StrengthBasis): Result<StrengthCheck> {
  const item = product(productId);
  const salt = substanceForm(item.saltFormId);
  const printedBaseMg = baseMg(item.strengthMg, item.strengthBasis, item.saltFormId);
  const printedSaltMg = (printedBaseMg / substanceForm('trientine-base').molarMassGPerMol) * salt.molarMassGPerMol;
  const enteredBaseMg = baseMg(enteredMg, enteredBasis, item.saltFormId);
  const check: StrengthCheck = {
    productId,
    enteredMg,
    enteredBasis,
    printedMg: item.strengthMg,
    printedBasis: item.strengthBasis,
    printedSaltMg,
    printedBaseMg,
    enteredBaseMg,
  };
  const near = (first: number, second: number) => Math.abs(first - second) <= strengthTolerance * second;
  if (near(enteredBaseMg, printedBaseMg)) return ok(check);
  const otherBasis: StrengthBasis = enteredBasis === 'salt' ? 'base' : 'salt';
  const readOther = baseMg(enteredMg, otherBasis, item.saltFormId);
  const fmt = (value: number) => value.toFixed(1);
  if (near(readOther, printedBaseMg)) {
    return fail(
      issue(
        'wrong_basis',
        ['strength'],
        `Strength ${enteredMg} mg entered as ${enteredBasis === 'salt' ? salt.label + ' (salt)' : 'trientine base'} does not match ${salt.label}: its printed strength is ${item.strengthMg} mg of ${item.strengthBasis === 'salt' ? 'the salt' : 'trientine base'} (= ${fmt(printedSaltMg)} mg of ${salt.label} = ${fmt(printedBaseMg)} mg trientine base). Read as entered, ${enteredMg} mg ${enteredBasis} would be ${fmt(enteredBaseMg)} mg base. Check the basis against the product label; for review by the prescriber.`,
      ),
    );
  }
  return fail(
    issue(
      'inconsistent',
      ['strength'],
      `Strength ${enteredMg} mg (${enteredBasis}) is not the strength of ${salt.label} on either basis: it is printed as ${item.strengthMg} mg ${item.strengthBasis} (${fmt(printedSaltMg)} mg salt, ${fmt(printedBaseMg)} mg base).`,
    ),
  );
}

export interface TrientineSwitch {
  readonly fromProductId: TrientineProductId;
  readonly toProductId: TrientineProductId;
  readonly currentDailyMg: number;
  readonly currentDailyBasis: StrengthBasis;
  /** Trientine base in today's daily dose, mg. */
  readonly currentDailyBaseMg: number;
  /** The same base expressed on the new product's dosing basis, mg/day. */
  readonly equivalentDailyMg: number;
  readonly equivalentDailyBasis: StrengthBasis;
  /** Units (tablets or capsules) a day of the new product for that figure. */
  readonly equivalentUnitsPerDay: number;
  readonly unitName: string;
  /** The product's smallest part: 1 (capsules whole), 0.5 (scored tablet). */
  readonly smallestUnit: number;
  readonly notes: readonly string[];
  readonly warnings: readonly Issue[];
}

/**
 * The base dose today and the same base on the new trientine product.
 *
 * equivalent (new basis) = base today, expressed in the new product's basis
 * (salt ↔ base by molar masses from CIAAW weights: 146.24, 219.15, 292.07 g/mol).
 *
 * @param fromProductId - the current product
 * @param currentDailyMg - today's daily dose as the current product is dosed (its printed basis), mg (> 0)
 * @param toProductId - the new product
 * @returns base today and the equivalent on the new product, with the caution that products are not interchangeable mg for mg
 * @example trientineSwitch('trientine-dihydrochloride', 1000, 'trientine-tetrahydrochloride') → base ≈ 667.3 mg/day; equivalent 667.3 mg base/day ≈ 4.45 tablets of 150 mg
 */
export function trientineSwitch(fromProductId: TrientineProductId, currentDailyMg: number, toProductId: TrientineProductId): TrientineSwitch {
  const from = product(fromProductId);
  const to = product(toProductId);
  const currentDailyBaseMg = baseMg(currentDailyMg, from.strengthBasis, from.saltFormId);
  const toSalt = substanceForm(to.saltFormId);
  const equivalentDailyMg =
    to.strengthBasis === 'base' ? currentDailyBaseMg : (currentDailyBaseMg / substanceForm('trientine-base').molarMassGPerMol) * toSalt.molarMassGPerMol;
  return {
    fromProductId,
    toProductId,
    currentDailyMg,
    currentDailyBasis: from.strengthBasis,
    currentDailyBaseMg,
    equivalentDailyMg,
    equivalentDailyBasis: to.strengthBasis,
    equivalentUnitsPerDay: equivalentDailyMg / to.strengthMg,
    unitName: to.unitName,
    smallestUnit: to.smallestUnit,
    notes: [
      'Equal trientine base is a starting figure, not an equivalence of effect: products of different salts are not interchangeable mg for mg (bioavailability differs; trientine tetrahydrochloride SmPC); the dose is then set by copper studies.',
    ],
    warnings: [],
  };
}

/**
 * The whole or half units of a trientine product on either side of a dose per
 * administration, with the dose each gives (a practical figure beside the exact one).
 * @param productId - the product
 * @param doseMg - the dose per administration on the product's printed basis, mg (> 0)
 * @returns the nearest counts below and above (equal when the dose is a whole count), with mg each
 * @example unitsAround('trientine-tetrahydrochloride', 333.6) → [{ units: 2, mg: 300 }, { units: 2.5, mg: 375 }]
 */
export function unitsAround(productId: TrientineProductId, doseMg: number): { readonly units: number; readonly mg: number }[] {
  const item = product(productId);
  const exact = doseMg / item.strengthMg / item.smallestUnit;
  // 1e-9 keeps a dose that is a whole count (300 mg = 2 tablets) from splitting into two rows by rounding noise.
  const below = Math.max(1, Math.floor(exact + 1e-9)) * item.smallestUnit;
  const above = Math.max(1, Math.ceil(exact - 1e-9)) * item.smallestUnit;
  return [...new Set([below, above])].map((units) => ({ units, mg: units * item.strengthMg }));
}
