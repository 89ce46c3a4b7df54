import type { Grams, Kilograms, Milligrams } from './quantity';

/** @example gramsFromMilligrams(mg(1500)) === 1.5 */
export const gramsFromMilligrams = (massMg: Milligrams): Grams => (massMg / 1000) as Grams;
/** @example milligramsFromGrams(grams(1.5)) === 1500 */
export const milligramsFromGrams = (massG: Grams): Milligrams => (massG * 1000) as Milligrams;
/** @example milligramsFromKilograms(kg(0.5)) === 500000 */
export const milligramsFromKilograms = (massKg: Kilograms): Milligrams => (massKg * 1_000_000) as Milligrams;
/** @example gramsFromKilograms(kg(2)) === 2000 */
export const gramsFromKilograms = (massKg: Kilograms): Grams => (massKg * 1000) as Grams;
