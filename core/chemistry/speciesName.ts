import type { MetalId } from './types';

/**
 * The element symbol of a metal id.
 * @param metal - the metal ion
 * @returns its element symbol
 * @example elementOf('Fe3+') === 'Fe'
 */
export function elementOf(metal: MetalId): string {
  return metal.replace(/\d*[+-]$/, '');
}

/**
 * A readable formula for M_p H_r L_q (r < 0 written as hydroxide), e.g. FeL3,
 * FeHL, Fe(OH)L, Fe2L, Fe2(OH)2, H2L.
 *
 * @param metal - the metal, or null for a ligand-only species
 * @param metalCount - p, 0–3
 * @param ligandCount - q, 0–3
 * @param protonCount - r (negative for hydroxide), −4 to 8
 * @returns the formula as text
 * @example speciesName('Fe3+', 1, 3, 0) === 'FeL3'
 */
export function speciesName(metal: MetalId | null, metalCount: number, ligandCount: number, protonCount: number): string {
  const count = (n: number): string => (n > 1 ? `${n}` : '');
  let name = metal && metalCount > 0 ? `${elementOf(metal)}${count(metalCount)}` : '';
  if (protonCount > 0) name += `H${count(protonCount)}`;
  if (ligandCount > 0) {
    const hydroxide = protonCount < 0 ? `(OH)${count(-protonCount)}` : '';
    name += `${hydroxide}L${count(ligandCount)}`;
  } else if (protonCount < 0) {
    name += `(OH)${count(-protonCount)}`;
  }
  return name;
}
