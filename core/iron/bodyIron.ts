import type { Kilograms, MgPerGDry, MgPerKg, Milligrams } from '../units/quantity';

/**
 * Slope of the Angelucci relation: mg of body iron stores per kg of body
 * weight for each mg Fe/g dry liver. As printed, 10.6; Angelucci et al.,
 * Hepatic iron concentration and total body iron stores in thalassemia major,
 * N Engl J Med 2000;343:327 (non-cirrhotic thalassaemia major; reliable to
 * about 250 mg/kg of body iron). The relation has no intercept.
 */
export const angelucciSlopeMgPerKgPerMgPerGDry = 10.6;

/**
 * Body iron stores per kg from the liver iron concentration (Angelucci relation).
 *
 * body iron stores (mg/kg) = 10.6 × LIC (mg/g dry)
 *
 * Source: Angelucci et al., N Engl J Med 2000;343:327.
 *
 * @param lic - liver iron concentration, mg Fe/g dry weight (plausible 0–60; the relation was validated to about 24)
 * @returns body iron stores, mg/kg body weight
 * @example bodyIronMgPerKgFromLic(mgPerGDry(10)) === 106 mg/kg
 */
export function bodyIronMgPerKgFromLic(lic: MgPerGDry): MgPerKg {
  return (angelucciSlopeMgPerKgPerMgPerGDry * lic) as MgPerKg;
}

/**
 * Liver iron concentration from body iron stores per kg (Angelucci relation, inverted).
 *
 * LIC (mg/g dry) = body iron stores (mg/kg) ÷ 10.6
 *
 * Source: Angelucci et al., N Engl J Med 2000;343:327.
 *
 * @param bodyIron - body iron stores, mg/kg body weight (plausible 0–650)
 * @returns liver iron concentration, mg Fe/g dry weight
 * @example licFromBodyIronMgPerKg(mgPerKg(106)) === 10 mg/g dry
 */
export function licFromBodyIronMgPerKg(bodyIron: MgPerKg): MgPerGDry {
  return (bodyIron / angelucciSlopeMgPerKgPerMgPerGDry) as MgPerGDry;
}

/**
 * Total body iron stores for a body weight (Angelucci relation).
 *
 * body iron stores (mg) = 10.6 × LIC (mg/g dry) × weight (kg)
 *
 * Source: Angelucci et al., N Engl J Med 2000;343:327.
 *
 * @param lic - liver iron concentration, mg Fe/g dry weight (plausible 0–60)
 * @param weightKg - body weight, kg (plausible 1–200)
 * @returns body iron stores, mg
 * @example bodyIronMgFromLic(mgPerGDry(11.4), kg(52)) ≈ 6283.68 mg
 */
export function bodyIronMgFromLic(lic: MgPerGDry, weightKg: Kilograms): Milligrams {
  return (bodyIronMgPerKgFromLic(lic) * weightKg) as Milligrams;
}
