/**
 * Seeded pseudo-random numbers shared by the engine: the invented-weather generator
 * (climate/synthetic.ts) and the Monte Carlo (economics/montecarlo.ts). Both promise "same seed, same
 * output", so they must draw from this one generator; changing it changes the committed weather fixtures.
 */

/**
 * mulberry32: a small 32-bit PRNG with a full 2^32 period, returning uniforms in [0, 1).
 * Source: Tommy Ettinger's public-domain mulberry32 (widely reproduced); good enough for sampling,
 * not for cryptography. Unitless.
 */
export function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}
