/**
 * A seeded pseudo-random source for the projection band. Core never uses
 * Math.random: the seed is part of the input, so the same case, date and seed
 * give the same band to the last digit.
 *
 * Generator: mulberry32 (Tommy Ettinger, public domain; a 32-bit state
 * generator with full 2^32 period, adequate for a few thousand draws of a
 * Monte Carlo band, not for cryptography). Normal deviates by the Box–Muller
 * transform (Box & Muller, Ann Math Stat 1958;29:610).
 */
export interface RandomSource {
  /** Uniform on [0, 1). */
  readonly uniform: () => number;
  /** Standard normal deviate. */
  readonly normal: () => number;
}

/**
 * @param seed - any integer; only its low 32 bits are used
 * @example createRandom(1).uniform() returns the same number on every run
 */
export function createRandom(seed: number): RandomSource {
  let state = seed >>> 0;
  const uniform = (): number => {
    state = (state + 0x6d2b79f5) >>> 0;
    let mixed = state;
    mixed = Math.imul(mixed ^ (mixed >>> 15), mixed | 1);
    mixed ^= mixed + Math.imul(mixed ^ (mixed >>> 7), mixed | 61);
    return ((mixed ^ (mixed >>> 14)) >>> 0) / 4294967296;
  };
  const normal = (): number => {
    // 1 − u keeps the logarithm's argument in (0, 1].
    const u1 = 1 - uniform();
    const u2 = uniform();
    return Math.sqrt(-2 * Math.log(u1)) * Math.cos(2 * Math.PI * u2);
  };
  return { uniform, normal };
}
