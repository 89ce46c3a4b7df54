import type { Fraction } from '../units/quantity';
import type { Ph } from './types';

/**
 * Decimal logarithm of the fraction of a ligand present as the fully
 * deprotonated form L at a fixed pH:
 *
 *   α_L = [L] / [L′] = 1 / (1 + Σₙ 10^(Σᵢ≤ₙ log Kᵢᴴ − n·pH))
 *
 * (references.md §6; the standard expression of analytical chemistry textbooks).
 * The sum is taken in log space (log-sum-exp), so α far below 1e-300 is still exact
 * as a logarithm.
 *
 * @param protonationLogK - stepwise protonation constants log K₁ᴴ, log K₂ᴴ, … (most basic first), each about −2 to 14
 * @param pH - pH of the solution, 0–14
 * @returns log₁₀ α_L, dimensionless, ≤ 0
 * @example logLigandFraction([10.37, 6.13, 2.69, 2.0, 1.5, 0.0], ph(10)) ≈ −0.524 (α = 0.299)
 */
export function logLigandFraction(protonationLogK: readonly number[], pH: Ph): number {
  const exponents: number[] = [0];
  let cumulative = 0;
  protonationLogK.forEach((logK, index) => {
    cumulative += logK;
    exponents.push(cumulative - (index + 1) * pH);
  });
  return -log10SumOfPowers(exponents);
}

/**
 * Fraction of a ligand present as the fully deprotonated form L at a fixed pH
 * (see {@link logLigandFraction}).
 *
 * @param protonationLogK - stepwise protonation constants, most basic first
 * @param pH - pH, 0–14
 * @returns α_L as a fraction, 0–1
 * @example ligandFraction([10.37, 6.13, 2.69, 2.0, 1.5, 0.0], ph(7)) ≈ 3.76e-4
 */
export function ligandFraction(protonationLogK: readonly number[], pH: Ph): Fraction {
  return 10 ** logLigandFraction(protonationLogK, pH) as Fraction;
}

/**
 * log₁₀ Σ 10^xᵢ without overflow or underflow (largest term factored out).
 * @example log10SumOfPowers([0, 0]) ≈ 0.30103
 */
export function log10SumOfPowers(exponents: readonly number[]): number {
  const largest = Math.max(...exponents);
  let sum = 0;
  for (const exponent of exponents) sum += 10 ** (exponent - largest);
  return largest + Math.log10(sum);
}
