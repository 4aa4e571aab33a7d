/**
 * Latin hypercube sampling (McKay, Beckman & Conover 1979, Technometrics 21:239): with N draws,
 * each parameter's range (0, 1) is cut into N strata of equal probability and every stratum is
 * sampled exactly once. Draw i of parameter k sits in stratum pi_k(i), at a uniform point inside it:
 *
 *   u_k(i) = (pi_k(i) + v_k(i)) / N,   v_k(i) in (0, 1)
 *
 * pi_k is a random permutation of 0..N-1 (Fisher-Yates as given by Durstenfeld 1964, CACM 7:420),
 * driven by SplitMix64 stream 2k; v_k(i) is output i of stream 2k + 1 (splitmix64.ts). The
 * permutation depends only on (seed, k, N), so any process can rebuild it (O(N) per parameter) and
 * compute any slice of draws alone: draw i is the same however the draws are split.
 */
import { streamSeed, uniformAt } from './splitmix64.ts';

export interface LatinHypercube {
  draws: number;
  /** pi_k for each parameter k: the stratum of every draw. */
  strata: Uint32Array[];
  /** Seeds of the within-stratum streams, by parameter. */
  jitterSeeds: bigint[];
}

/** A permutation of 0..n-1 from stream `stream` under `seed`. */
export function seededPermutation(seed: number, stream: number, n: number): Uint32Array {
  const order = new Uint32Array(n);
  for (let i = 0; i < n; i++) order[i] = i;
  const key = streamSeed(seed, stream);
  for (let i = n - 1, step = 0; i > 0; i--, step++) {
    const j = Math.floor(uniformAt(key, step) * (i + 1));
    const t = order[i];
    order[i] = order[j];
    order[j] = t;
  }
  return order;
}

export function latinHypercube(seed: number, parameterCount: number, draws: number): LatinHypercube {
  return {
    draws,
    strata: Array.from({ length: parameterCount }, (_, k) => seededPermutation(seed, 2 * k, draws)),
    jitterSeeds: Array.from({ length: parameterCount }, (_, k) => streamSeed(seed, 2 * k + 1)),
  };
}

/** u_k(i) for every parameter k: the point of draw i in the unit hypercube (each coordinate in (0, 1)). */
export function hypercubePoint(h: LatinHypercube, draw: number): number[] {
  return h.strata.map((strata, k) => (strata[draw] + uniformAt(h.jitterSeeds[k], draw)) / h.draws);
}
