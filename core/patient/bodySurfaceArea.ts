import type { Centimetres, Kilograms, SquareMetres } from '../units/quantity';

/**
 * Body-surface area by Mosteller.
 *
 * BSA (m²) = √(height (cm) × weight (kg) / 3600)
 *
 * Source: Mosteller RD, Simplified calculation of body-surface area, N Engl J
 * Med 1987;317:1098 (equation as printed; 'mosteller-1987', secondary).
 *
 * @param heightCm - standing height (length in infants), cm, 25–250
 * @param weightKg - body weight, kg, 0.4–350
 * @returns body-surface area, m²
 * @example bsaMostellerM2(cm(180), kg(80)) === 2 (√(14 400 / 3600))
 */
export function bsaMostellerM2(heightCm: Centimetres, weightKg: Kilograms): SquareMetres {
  // 3600 as printed: it folds cm × kg into m² for this empirical fit.
  return Math.sqrt((heightCm * weightKg) / 3600) as SquareMetres;
}

/**
 * Body-surface area by Du Bois and Du Bois.
 *
 * BSA (m²) = 0.007184 × height (cm)^0.725 × weight (kg)^0.425
 *
 * Source: Du Bois D, Du Bois EF, A formula to estimate the approximate surface
 * area if height and weight be known, Arch Intern Med 1916;17:863 ('dubois-1916',
 * secondary). Printed as A (cm²) = W^0.425 × H^0.725 × 71.84; 71.84 cm² = 0.007184 m².
 *
 * @param heightCm - standing height, cm, 25–250
 * @param weightKg - body weight, kg, 0.4–350
 * @returns body-surface area, m²
 * @example bsaDuBoisM2(cm(170), kg(70)) ≈ 1.810
 */
export function bsaDuBoisM2(heightCm: Centimetres, weightKg: Kilograms): SquareMetres {
  return (0.007184 * heightCm ** 0.725 * weightKg ** 0.425) as SquareMetres;
}

/**
 * Body-surface area by Haycock, Schwartz and Wisotsky (validated from infancy to adulthood).
 *
 * BSA (m²) = 0.024265 × height (cm)^0.3964 × weight (kg)^0.5378
 *
 * Source: Haycock GB, Schwartz GJ, Wisotsky DH, J Pediatr 1978;93:62 ('haycock-1978',
 * secondary); constants as printed.
 *
 * @param heightCm - standing height (length in infants), cm, 25–250
 * @param weightKg - body weight, kg, 0.4–350
 * @returns body-surface area, m²
 * @example bsaHaycockM2(cm(92), kg(14)) ≈ 0.602
 */
export function bsaHaycockM2(heightCm: Centimetres, weightKg: Kilograms): SquareMetres {
  return (0.024265 * heightCm ** 0.3964 * weightKg ** 0.5378) as SquareMetres;
}
