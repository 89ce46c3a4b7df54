import { fail, issue, ok, type Result } from '../result';
import type { Quantity } from '../quantity';

/** Molar mass and atomic weight, g/mol (the same brand as core/units' GramsPerMole). */
type GramsPerMole = Quantity<'g/mol'>;
import { atomicWeight, isElementSymbol, type ElementSymbol } from './atomicWeights';

/** Element counts of a molecular formula, e.g. { C: 7, H: 9, N: 1, O: 2 }. */
export type ElementCounts = Readonly<Partial<Record<ElementSymbol, number>>>;

/**
 * Parse a molecular formula into element counts.
 *
 * Accepts element symbols with counts, parentheses with a count, and adducts
 * or salts joined by '·', '*' or '.' with an optional leading multiplier:
 * 'C25H48N6O8·CH4O3S' (deferoxamine mesylate), 'C6H18N4·2HCl' (trientine
 * dihydrochloride), 'Ca(OH)2'.
 *
 * @param formula - molecular formula with elements from the atomic-weight table
 * @returns element counts, or an issue naming the part that could not be read
 * @example parseFormula('C7H9NO2') → ok({ C: 7, H: 9, N: 1, O: 2 })
 */
export function parseFormula(formula: string): Result<ElementCounts> {
  const counts: Partial<Record<ElementSymbol, number>> = {};
  const parts = formula.split(/[·*.]/);
  for (const rawPart of parts) {
    const part = rawPart.trim();
    if (part === '') return fail(issue('inconsistent', ['formula'], `Formula "${formula}" has an empty part.`));
    const multiplierMatch = /^(\d+)(?=[A-Z(])/.exec(part);
    const multiplier = multiplierMatch ? Number(multiplierMatch[1]) : 1;
    const body = multiplierMatch ? part.slice(multiplierMatch[0].length) : part;
    const parsed = parseGroup(body, formula);
    if (!parsed.ok) return parsed;
    for (const [symbol, count] of Object.entries(parsed.value) as [ElementSymbol, number][]) {
      counts[symbol] = (counts[symbol] ?? 0) + count * multiplier;
    }
  }
  return ok(counts);
}

function parseGroup(body: string, whole: string): Result<ElementCounts> {
  const stack: Partial<Record<ElementSymbol, number>>[] = [{}];
  const tokenPattern = /([A-Z][a-z]?)(\d*)|(\()|(\))(\d*)/y;
  let position = 0;
  while (position < body.length) {
    tokenPattern.lastIndex = position;
    const match = tokenPattern.exec(body);
    if (!match) {
      return fail(issue('inconsistent', ['formula'], `Formula "${whole}": cannot read "${body.slice(position)}".`));
    }
    position = tokenPattern.lastIndex;
    const top = stack[stack.length - 1]!;
    if (match[1] !== undefined) {
      const symbol = match[1];
      if (!isElementSymbol(symbol)) {
        return fail(issue('inconsistent', ['formula'], `Formula "${whole}": element "${symbol}" is not in the atomic-weight table.`));
      }
      top[symbol] = (top[symbol] ?? 0) + (match[2] ? Number(match[2]) : 1);
    } else if (match[3] !== undefined) {
      stack.push({});
    } else {
      if (stack.length < 2) return fail(issue('inconsistent', ['formula'], `Formula "${whole}": unmatched ")".`));
      const group = stack.pop()!;
      const times = match[5] ? Number(match[5]) : 1;
      const outer = stack[stack.length - 1]!;
      for (const [symbol, count] of Object.entries(group) as [ElementSymbol, number][]) {
        outer[symbol] = (outer[symbol] ?? 0) + count * times;
      }
    }
  }
  if (stack.length !== 1) return fail(issue('inconsistent', ['formula'], `Formula "${whole}": unmatched "(".`));
  return ok(stack[0]!);
}

/**
 * Molar mass from element counts and the CIAAW standard atomic weights.
 *
 * @returns g/mol
 * @example molarMassOfCounts({ C: 7, H: 9, N: 1, O: 2 }) ≈ 139.15 (deferiprone)
 */
export function molarMassOfCounts(counts: ElementCounts): GramsPerMole {
  let total = 0;
  for (const [symbol, count] of Object.entries(counts) as [ElementSymbol, number][]) {
    total += atomicWeight(symbol) * count;
  }
  return total as GramsPerMole;
}

/**
 * Molar mass of a molecular formula. Throws on a formula that does not parse:
 * formulas are typed by developers into the catalogue, so a bad one is a bug.
 *
 * @example molarMass('C21H15N3O4') ≈ 373.37 (deferasirox)
 */
export function molarMass(formula: string): GramsPerMole {
  const parsed = parseFormula(formula);
  if (!parsed.ok) throw new Error(parsed.issues.map((it) => it.message).join('; '));
  return molarMassOfCounts(parsed.value);
}
