/**
 * SplitMix64 (Steele, Lea & Flood 2014, "Fast splittable pseudorandom number generators",
 * OOPSLA '14; the finaliser is Stafford's "Mix13" variant of the MurmurHash3 64-bit mixer):
 *
 *   state_n  = seed + n * GAMMA (mod 2^64),  GAMMA = 0x9E3779B97F4A7C15 (odd; 2^64 / golden ratio)
 *   output_n = mix(state_{n+1})
 *   mix(z)   = z ^= z >>> 30; z *= 0xBF58476D1CE4E5B9; z ^= z >>> 27; z *= 0x94D049BB133111EB; z ^ (z >>> 31)
 *
 * Because the state is a Weyl sequence, output n is computed directly from (seed, n) without the
 * n - 1 outputs before it: the generator is counter-based, which is what makes draw i the same
 * however the draws are split over processes or machines.
 *
 * Streams: stream k under a seed is the SplitMix64 sequence whose seed is output k of the
 * SplitMix64 sequence seeded with `seed`. Values are BigInt (exact 64-bit arithmetic).
 */
const MASK64 = (1n << 64n) - 1n;
const GAMMA = 0x9e3779b97f4a7c15n;

/** The 64-bit finaliser. */
export function mix64(z: bigint): bigint {
  z = ((z ^ (z >> 30n)) * 0xbf58476d1ce4e5b9n) & MASK64;
  z = ((z ^ (z >> 27n)) * 0x94d049bb133111ebn) & MASK64;
  return z ^ (z >> 31n);
}

/** Output n (0-based) of SplitMix64 seeded with `seed` (an unsigned 64-bit value). */
export function splitMix64At(seed: bigint, n: number): bigint {
  return mix64((seed + BigInt(n + 1) * GAMMA) & MASK64);
}

/** The seed of stream `stream` under the scenario's `seed` (a whole number 0 .. 2^53 - 1). */
export function streamSeed(seed: number, stream: number): bigint {
  return splitMix64At(BigInt(seed), stream);
}

const TWO_POW_53 = 2 ** 53;

/**
 * Output n of a stream as a number strictly between 0 and 1: the top 53 bits b give (b + 1/2) / 2^53,
 * so neither 0 nor 1 ever occurs (quantile functions are infinite there).
 */
export function uniformAt(streamSeedValue: bigint, n: number): number {
  const top53 = Number(splitMix64At(streamSeedValue, n) >> 11n);
  return (top53 + 0.5) / TWO_POW_53;
}
