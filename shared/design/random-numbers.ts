/**
 * Seeded random numbers for the Monte Carlo analysis: xoshiro128** (Blackman & Vigna 2018,
 * "Scrambled linear pseudorandom number generators", 32-bit variant) seeded through splitmix32,
 * and standard normal deviates by the Box–Muller transform (Box & Muller 1958). Pure and
 * reproducible: the same seed gives the same sequence on every platform (32-bit integer
 * arithmetic only, via Math.imul and >>> 0).
 */

/** A source of uniform numbers in [0, 1). */
export type UniformSource = () => number;

/** splitmix32: spreads a 32-bit seed over the generator's state words. */
function splitmix32(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (s + 0x9e3779b9) >>> 0;
    let z = s;
    z = Math.imul(z ^ (z >>> 16), 0x85ebca6b) >>> 0;
    z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35) >>> 0;
    return (z ^ (z >>> 16)) >>> 0;
  };
}

const rotl = (x: number, k: number) => ((x << k) | (x >>> (32 - k))) >>> 0;

/** xoshiro128**: uniform numbers in [0, 1) with 32 bits each, from a 32-bit seed. */
export function createUniformSource(seed: number): UniformSource {
  const init = splitmix32(seed);
  let a = init();
  let b = init();
  let c = init();
  let d = init();
  if ((a | b | c | d) === 0) a = 1;
  return () => {
    const result = Math.imul(rotl(Math.imul(b, 5) >>> 0, 7), 9) >>> 0;
    const t = (b << 9) >>> 0;
    c ^= a;
    d ^= b;
    b ^= c;
    a ^= d;
    c ^= t;
    d = rotl(d, 11);
    a >>>= 0;
    b >>>= 0;
    c >>>= 0;
    return result / 4294967296;
  };
}

/** Standard normal deviates (mean 0, sd 1) by Box–Muller, both of each pair used. */
export function createNormalSource(uniform: UniformSource): () => number {
  let spare: number | null = null;
  return () => {
    if (spare !== null) {
      const z = spare;
      spare = null;
      return z;
    }
    // 1 − u keeps the logarithm's argument in (0, 1].
    const radius = Math.sqrt(-2 * Math.log(1 - uniform()));
    const angle = 2 * Math.PI * uniform();
    spare = radius * Math.sin(angle);
    return radius * Math.cos(angle);
  };
}
