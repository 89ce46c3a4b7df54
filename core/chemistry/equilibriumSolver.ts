import { fail, issue, ok, type Result } from '../result';
import type { Ph } from './types';

/** One component whose free concentration is unknown: a metal ion or a fully deprotonated ligand. */
export interface Component {
  readonly name: string;
  /** Total (analytical) concentration, mol/L, > 0. */
  readonly totalMolar: number;
}

/**
 * One species: Π componentᵢ^νᵢ · H^r with overall log β. The free components
 * themselves must be listed too (ν = unit vector, log β = 0).
 */
export interface SpeciesDefinition {
  readonly name: string;
  /** ν per component (same order as the components), whole numbers ≥ 0. */
  readonly stoichiometry: readonly number[];
  /** r: protons gained (negative for hydroxide). */
  readonly protonCount: number;
  readonly logBeta: number;
}

export interface EquilibriumSystem {
  readonly components: readonly Component[];
  readonly species: readonly SpeciesDefinition[];
}

export interface SolveOptions {
  /** Iteration limit, default 200. */
  readonly maxIterations?: number;
  /** Starting log₁₀ free concentrations (a warm start from a neighbouring pH). */
  readonly initialLogFree?: readonly number[];
}

export interface SpeciesConcentration {
  readonly name: string;
  readonly molar: number;
  readonly log10Molar: number;
}

export interface EquilibriumSolution {
  /** log₁₀ free concentration of each component, mol/L. */
  readonly logFree: readonly number[];
  readonly species: readonly SpeciesConcentration[];
  readonly iterations: number;
  /** max over components of |Σ νc − total| / total at the returned point; < 1e-10. */
  readonly maxRelativeResidual: number;
}

/** The convergence test: every mass balance closes to this fraction of its total. */
export const relativeResidualTolerance = 1e-10;

/** A Newton step never moves a log₁₀ concentration by more than this (damping). */
const maxLogStep = 2;

/**
 * Solve the mass balances of a fixed-pH equilibrium system for the free
 * concentration of every component, by damped Newton iteration in log space.
 *
 * Method. With uₖ = log₁₀[component k] and cₛ = 10^(log βₛ + Σ νₛₖuₖ − rₛ·pH), the
 * function G(u) = Σₛ cₛ / ln 10 − Σₖ Tₖuₖ has gradient equal to the mass-balance
 * residual (Σₛ νₛₖcₛ − Tₖ) and Hessian ln 10 · Σₛ cₛ νₛνₛᵀ, which is positive
 * definite because every free component is itself a species. G is therefore
 * strictly convex, and coercive when every total is > 0, so it has exactly one
 * minimum — the equilibrium — and Newton's method with a backtracking (Armijo)
 * line search converges to it from any start (Boyd & Vandenberghe, Convex
 * Optimization, 2004, §9.5). Steps are also capped at 2 log units. The solution
 * is accepted only when every mass balance closes to 1e-10 of its total;
 * otherwise (iteration limit, overflow) the result is an issue, never a number.
 *
 * @param system - components (totals in mol/L, each > 0) and species (free components included)
 * @param pH - fixed pH, 0–14
 * @param options - iteration limit and warm start
 * @returns free concentrations and every species, or a 'not_converged' / 'out_of_range' issue
 * @example 1:1 complex, log K 6, 1 µM metal, 10 µM ligand, no side reactions:
 *   free metal = 2·Tm / (b + √(b² + 4K·Tm)), b = K(Tl − Tm) + 1 = 10 → 9.902e-8 mol/L
 */
export function solveEquilibrium(
  system: EquilibriumSystem,
  pH: Ph,
  options: SolveOptions = {},
): Result<EquilibriumSolution> {
  const componentCount = system.components.length;
  for (const [index, component] of system.components.entries()) {
    if (!(component.totalMolar > 0) || !Number.isFinite(component.totalMolar)) {
      return fail(
        issue(
          'out_of_range',
          ['components', index, 'totalMolar'],
          `Total ${component.name} ${component.totalMolar} mol/L must be a finite concentration above 0.`,
        ),
      );
    }
  }
  for (const species of system.species) {
    if (species.stoichiometry.length !== componentCount || !Number.isFinite(species.logBeta)) {
      throw new Error(`Species ${species.name} is malformed for ${componentCount} components`);
    }
  }
  for (let k = 0; k < componentCount; k += 1) {
    if (!system.species.some((it) => it.logBeta === 0 && it.protonCount === 0 && isUnit(it.stoichiometry, k))) {
      throw new Error(`Component ${system.components[k]!.name} has no free species`);
    }
  }
  const maxIterations = options.maxIterations ?? 200;
  let u = options.initialLogFree ? [...options.initialLogFree] : boundedStart(system, pH);
  let state = evaluate(system, pH, u);
  if (!state && options.initialLogFree) {
    // A warm start that overflows is discarded for the bounded start, which never overflows.
    u = boundedStart(system, pH);
    state = evaluate(system, pH, u);
  }
  if (!state) return overflow();
  let iterations = 0;
  let polishing = 0;
  while (iterations < maxIterations) {
    const converged = state.maxRelativeResidual < relativeResidualTolerance;
    // Once converged, up to two more full Newton steps polish the answer (kept only if better).
    if (converged && polishing >= 2) break;
    iterations += 1;
    const step = newtonStep(state.hessian, state.residual);
    if (!step) break;
    const largest = Math.max(...step.map(Math.abs));
    const scale = largest > maxLogStep ? maxLogStep / largest : 1;
    const slope = state.residual.reduce((sum, r, k) => sum + r * step[k]! * scale, 0);
    let t = 1;
    let next: State | undefined;
    for (let halvings = 0; halvings < 40; halvings += 1) {
      const trial = u.map((value, k) => value + t * scale * step[k]!);
      const candidate = evaluate(system, pH, trial);
      if (
        candidate &&
        (candidate.objective <= state.objective + 1e-4 * t * slope ||
          candidate.maxRelativeResidual < state.maxRelativeResidual)
      ) {
        next = candidate;
        u = trial;
        break;
      }
      t /= 2;
    }
    if (!next) break;
    if (converged) {
      polishing += 1;
      if (next.maxRelativeResidual >= state.maxRelativeResidual) break;
    }
    state = next;
  }
  // `u` may hold a rejected polishing step; `state` holds the best accepted point.
  if (state.maxRelativeResidual >= relativeResidualTolerance) {
    return fail(
      issue(
        'not_converged',
        ['speciation'],
        `The speciation did not converge in ${iterations} iterations: a mass balance is still off by ${state.maxRelativeResidual.toExponential(2)} of its total (the test is below ${relativeResidualTolerance}). No result is shown rather than a wrong one.`,
      ),
    );
  }
  return ok({
    logFree: state.u,
    species: system.species.map((it, index) => ({
      name: it.name,
      molar: state.concentrations[index]!,
      log10Molar: state.logConcentrations[index]!,
    })),
    iterations,
    maxRelativeResidual: state.maxRelativeResidual,
  });
}

interface State {
  readonly u: readonly number[];
  readonly logConcentrations: readonly number[];
  readonly concentrations: readonly number[];
  readonly residual: readonly number[];
  readonly hessian: readonly (readonly number[])[];
  readonly objective: number;
  readonly maxRelativeResidual: number;
}

function evaluate(system: EquilibriumSystem, pH: number, u: readonly number[]): State | undefined {
  const n = system.components.length;
  const logConcentrations: number[] = [];
  const concentrations: number[] = [];
  const residual = system.components.map((it) => -it.totalMolar);
  const hessian = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  let objective = 0;
  for (const species of system.species) {
    let logC = species.logBeta - species.protonCount * pH;
    for (let k = 0; k < n; k += 1) logC += species.stoichiometry[k]! * u[k]!;
    // Above 1e300 mol/L the arithmetic is meaningless: report overflow instead of a number.
    if (!Number.isFinite(logC) || logC > 300) return undefined;
    const c = 10 ** logC;
    logConcentrations.push(logC);
    concentrations.push(c);
    objective += c / Math.LN10;
    for (let k = 0; k < n; k += 1) {
      const nuK = species.stoichiometry[k]!;
      if (nuK === 0) continue;
      residual[k]! += nuK * c;
      for (let l = 0; l < n; l += 1) hessian[k]![l]! += Math.LN10 * nuK * species.stoichiometry[l]! * c;
    }
  }
  system.components.forEach((it, k) => {
    objective -= it.totalMolar * u[k]!;
  });
  const maxRelativeResidual = Math.max(...residual.map((r, k) => Math.abs(r) / system.components[k]!.totalMolar));
  if (!Number.isFinite(objective) || !Number.isFinite(maxRelativeResidual)) return undefined;
  return { u: [...u], logConcentrations, concentrations, residual, hessian, objective, maxRelativeResidual };
}

/**
 * Solve H·d = −r with symmetric diagonal scaling (H is positive definite but its
 * entries span many decades) and Gaussian elimination with partial pivoting.
 * When one complex holds nearly all of two components, H is singular to working
 * precision; a tiny ridge (1e-10 on the unit diagonal) then keeps a descent
 * direction, and the step cap and line search keep the iteration safe.
 */
function newtonStep(hessian: readonly (readonly number[])[], residual: readonly number[]): number[] | undefined {
  return solveScaled(hessian, residual, 0) ?? solveScaled(hessian, residual, 1e-10);
}

function solveScaled(hessian: readonly (readonly number[])[], residual: readonly number[], ridge: number): number[] | undefined {
  const n = residual.length;
  const scale = hessian.map((row, k) => 1 / Math.sqrt(row[k]!));
  const a = hessian.map((row, k) => row.map((value, l) => value * scale[k]! * scale[l]! + (k === l ? ridge : 0)));
  const b = residual.map((r, k) => -r * scale[k]!);
  for (let col = 0; col < n; col += 1) {
    let pivot = col;
    for (let row = col + 1; row < n; row += 1) if (Math.abs(a[row]![col]!) > Math.abs(a[pivot]![col]!)) pivot = row;
    // The scaled matrix has a unit diagonal: a pivot below 1e-13 means singular to working precision.
    if (!(Math.abs(a[pivot]![col]!) > 1e-13)) return undefined;
    [a[col], a[pivot]] = [a[pivot]!, a[col]!];
    [b[col], b[pivot]] = [b[pivot]!, b[col]!];
    for (let row = col + 1; row < n; row += 1) {
      const factor = a[row]![col]! / a[col]![col]!;
      for (let l = col; l < n; l += 1) a[row]![l]! -= factor * a[col]![l]!;
      b[row]! -= factor * b[col]!;
    }
  }
  const y = new Array<number>(n).fill(0);
  for (let row = n - 1; row >= 0; row -= 1) {
    let sum = b[row]!;
    for (let l = row + 1; l < n; l += 1) sum -= a[row]![l]! * y[l]!;
    y[row] = sum / a[row]![row]!;
  }
  const step = y.map((value, k) => value * scale[k]!);
  return step.every(Number.isFinite) ? step : undefined;
}

/**
 * A start where no species exceeds the smallest total it draws on: free = total,
 * then, for each species that would exceed that total, the limiting component
 * (the one with the smallest total, as in a titration's limiting reagent) is
 * lowered until the species fits. No species can overflow at this start.
 */
function boundedStart(system: EquilibriumSystem, pH: number): number[] {
  const logTotals = system.components.map((it) => Math.log10(it.totalMolar));
  const u = [...logTotals];
  for (let pass = 0; pass < 3; pass += 1) {
    for (const species of system.species) {
      let logC = species.logBeta - species.protonCount * pH;
      let limiting = -1;
      species.stoichiometry.forEach((nu, k) => {
        logC += nu * u[k]!;
        if (nu > 0 && (limiting < 0 || logTotals[k]! < logTotals[limiting]!)) limiting = k;
      });
      if (limiting < 0) continue;
      const excess = logC - logTotals[limiting]!;
      if (excess > 0) u[limiting]! -= excess / species.stoichiometry[limiting]!;
    }
  }
  return u;
}

function isUnit(stoichiometry: readonly number[], k: number): boolean {
  return stoichiometry.every((nu, l) => (l === k ? nu === 1 : nu === 0));
}

function overflow<T>(): Result<T> {
  return fail(
    issue(
      'not_converged',
      ['speciation'],
      'The speciation overflowed (a species above 1e300 mol/L): the constants or totals are outside what can be computed. No result is shown.',
    ),
  );
}
