import { issue, type Issue } from '../result';

/**
 * Check that exactly one of several optional inputs was given (a calculator
 * that accepts a value in any one of its units, e.g. R2* or T2*).
 *
 * @param values - the validated inputs (absent ones undefined)
 * @param labels - input name → label in the trade's words, in the order to list them
 * @returns undefined when exactly one is given; otherwise a 'required' issue (none given) or an 'inconsistent' issue (several)
 * @example exactlyOneInput({ r2StarPerS: 300, t2StarMs: undefined }, { r2StarPerS: 'R2*', t2StarMs: 'T2*' }) === undefined
 */
export function exactlyOneInput(
  values: Readonly<Record<string, unknown>>,
  labels: Readonly<Record<string, string>>,
): Issue | undefined {
  const names = Object.keys(labels);
  const given = names.filter((name) => values[name] !== undefined);
  const listed = names.map((name) => labels[name]).join(', ');
  if (given.length === 0) return issue('required', [names[0]!], `Give one of: ${listed}.`);
  if (given.length > 1) {
    return issue('inconsistent', [given[1]!], `Give only one of: ${listed}; ${given.map((name) => labels[name]).join(' and ')} were both given.`);
  }
  return undefined;
}
