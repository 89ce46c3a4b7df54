import { issue, ok, fail, type Result } from '../result';
import { hydrolysisOf } from './hydrolysis';
import { log10SumOfPowers, logLigandFraction } from './ligandFraction';
import { speciesName } from './speciesName';
import type { LigandConstantSet, MetalId, Ph } from './types';

export interface ConditionalConstant {
  /** The complex family the constant describes, e.g. 'FeL3' (protonated and hydroxo forms included). */
  readonly complexName: string;
  readonly ligandCount: number;
  /** log β of the plain complex M L_q as entered (or of the family's first member when there is none). */
  readonly logBeta: number;
  /** log₁₀ α_L, fraction of ligand fully deprotonated (≤ 0). */
  readonly logAlphaLigand: number;
  /** log₁₀ α_M = log₁₀([M]/[M′]), fraction of unbound metal present as the aqua ion (≤ 0). */
  readonly logAlphaMetal: number;
  /** log₁₀ of the complex's own side reactions (protonated and hydroxo forms), ≥ 0. */
  readonly logComplexSide: number;
  /** log K′ (or log β′ₙ): logBeta + q·logAlphaLigand + logAlphaMetal + logComplexSide. */
  readonly logConditional: number;
}

/**
 * log₁₀ of the fraction of unbound metal present as the free aqua ion, from
 * the metal's mononuclear hydrolysis: α_M = 1 / (1 + Σ *β_q / [H]^q).
 * Polynuclear hydroxo species depend on the metal concentration and are left to
 * the speciation solver.
 *
 * @param metal - the metal ion
 * @param pH - pH, 0–14
 * @returns log₁₀ α_M, ≤ 0
 * @example logMetalFraction('Fe3+', ph(7.4)) ≈ −9.10 (Stefánsson 2007 constants; Fe(OH)2+ dominates)
 */
export function logMetalFraction(metal: MetalId, pH: Ph): number {
  const exponents = [0];
  for (const species of hydrolysisOf(metal).species) {
    if (species.metalCount === 1) exponents.push(species.logBetaStar + species.hydroxideCount * pH);
  }
  return -log10SumOfPowers(exponents);
}

/**
 * Conditional formation constant of a ligand's principal complex with one metal
 * at a fixed pH (Ringbom's side-reaction treatment; references.md §6):
 *
 *   log K′ = log K + q·log α_L + log α_M + log α_ML
 *
 * where the principal complex is the mononuclear one with the most ligands
 * (ML for EDTA, FeL3 for deferiprone), and α_ML ≥ 1 gathers its protonated and
 * hydroxo forms. For conditional sets (transferrin) α_L = 1 at their pH.
 *
 * @param set - one named constant set (never mixed with another)
 * @param metal - the metal ion
 * @param pH - pH, 0–14 (only the set's own pH for a conditional set)
 * @returns the constant and its parts, or an issue when the set has no constant for the metal
 * @example conditionalConstant(edta 25 °C set, 'Ca2+', ph(7.4)) → logConditional ≈ 10.7 − 2.99 = 7.71
 */
export function conditionalConstant(set: LigandConstantSet, metal: MetalId, pH: Ph): Result<ConditionalConstant> {
  const applicable = checkSetApplies(set, metal, pH);
  if (!applicable.ok) return fail(...applicable.issues);
  const mononuclear = set.complexes.filter((it) => it.metal === metal && it.metalCount === 1);
  const ligandCount = Math.max(...mononuclear.map((it) => it.ligandCount));
  const family = mononuclear.filter((it) => it.ligandCount === ligandCount);
  const plain = family.find((it) => it.protonCount === 0) ?? family[0]!;
  const familyLog = log10SumOfPowers(family.map((it) => it.logBeta - it.protonCount * pH));
  const logBeta = plain.logBeta - plain.protonCount * pH;
  const logAlphaLigand = set.conditionalAtPh === undefined ? logLigandFraction(set.protonationLogK, pH) : 0;
  const logAlphaMetal = logMetalFraction(metal, pH);
  const logComplexSide = familyLog - logBeta;
  return ok({
    complexName: speciesName(metal, 1, ligandCount, plain.protonCount),
    ligandCount,
    logBeta: plain.logBeta,
    logAlphaLigand,
    logAlphaMetal,
    logComplexSide,
    logConditional: plain.logBeta - plain.protonCount * pH + ligandCount * logAlphaLigand + logAlphaMetal + logComplexSide,
  });
}

/**
 * Whether a constant set may be used for a metal at a pH: it must hold a
 * confirmed constant for the metal, and a conditional set only at its own pH.
 * Issues name the set, the metal and what the set does cover.
 *
 * @param set - the constant set
 * @param metal - the metal ion
 * @param pH - pH, 0–14
 * @returns ok(true), or a 'not_applicable' issue on 'constantSet', 'ph' or 'metal'
 * @example checkSetApplies(deferiprone set, 'Pb2+', ph(7.4)) → issue "… has no constant for Pb2+; it covers Fe3+."
 */
export function checkSetApplies(set: LigandConstantSet, metal: MetalId, pH: Ph): Result<true> {
  if (set.metalConstantsUnconfirmed) {
    const literature = set.literaturePm?.find((it) => it.metal === metal);
    const shown = literature
      ? ` The published p${metal.replace(/\d*\+$/, '')} ${literature.pM} (pH ${literature.pH}, ${literature.totalMetalUmolPerL} µM metal, ${literature.totalLigandUmolPerL} µM ligand; source ${literature.sourceId}) is shown as a literature value only.`
      : '';
    return fail(
      issue(
        'not_applicable',
        ['constantSet'],
        `Constant set ${set.id}: the ${set.ligandName} metal constants are unconfirmed, so nothing is computed from them.${shown}`,
      ),
    );
  }
  if (set.conditionalAtPh !== undefined && Math.abs(pH - set.conditionalAtPh) > 1e-9) {
    return fail(
      issue(
        'not_applicable',
        ['ph'],
        `Constant set ${set.id} holds conditional constants valid only at pH ${set.conditionalAtPh}; pH ${pH} cannot be computed with it.`,
      ),
    );
  }
  if (!set.complexes.some((it) => it.metal === metal && it.metalCount === 1)) {
    const covered = [...new Set(set.complexes.map((it) => it.metal))];
    const list = covered.length > 0 ? `it covers ${covered.join(', ')}` : 'it holds protonation constants only';
    return fail(issue('not_applicable', ['metal'], `Constant set ${set.id} has no constant for ${metal}; ${list}.`));
  }
  return ok(true);
}
