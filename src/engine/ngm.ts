/**
 * Next-generation matrix and its dominant eigenvalue.
 *
 *   K_ij = D * S_i * M_ij = beta * D * u_i * C_ij * h_j * (1 - c) * S_i / N_j,
 *
 * expected new infections in band i caused by one infectious person in band j over the mean
 * infectious period D (days). R = spectral radius of K (Diekmann, Heesterbeek & Roberts 2010,
 * J R Soc Interface 7:873; van den Driessche & Watmough 2002, Math Biosci 180:29).
 * Erlang stage counts do not enter: only the mean time infectious does.
 */
import { rowTimes } from './dot.ts';
import { perronRoot } from './perronRoot.ts';

/** Writes K = D diag(S) M (row-major n x n) into `out`. */
export function nextGenerationMatrixInto(out: Float64Array, transmission: Float64Array, susceptible: ArrayLike<number>, infectiousPeriodDays: number): Float64Array {
  const n = susceptible.length;
  for (let i = 0; i < n; i++) {
    const f = infectiousPeriodDays * susceptible[i];
    for (let j = 0; j < n; j++) out[i * n + j] = f * transmission[i * n + j];
  }
  return out;
}

/**
 * Spectral radius of a non-negative matrix by power iteration, warm-started from `vector`
 * (length n, non-negative): x_{k+1} = K x_k / |K x_k|_1.
 * Stops on the Collatz-Wielandt bracket: for x > 0, min_i (Kx)_i / x_i <= rho <= max_i (Kx)_i / x_i
 * (Horn & Johnson 2013, Matrix Analysis, 2nd ed., Thm 8.1.26), once it is narrower than
 * `relativeTolerance` (default 1e-7, ample for a daily R(t)); rows with x_i = 0 and (Kx)_i = 0
 * (no susceptibles or no susceptibility) have no say, while x_i = 0 with (Kx)_i > 0 makes the
 * upper bound infinite, so a warm start with a zero entry is iterated, never taken as certified.
 * On return `vector` holds the x_k whose bracket closed (an approximate Perron vector) and, when
 * given, `product` holds M x_k without the row scale, so a caller can bracket rho for another row
 * scale at the cost of n multiplications (reproduction.ts).
 * Used for R(t) day by day, where the previous day's vector is an excellent start; there
 * K = diag(rowScale) M is applied without being formed (rowScale_i = D S_i). Falls back to
 * `perronRoot` (bounded work, perronRoot.ts) when the bracket does not close in 300 steps (a
 * periodic or reducible K, or a second eigenvalue close to the first).
 */
export function spectralRadius(
  flat: Float64Array,
  n: number,
  vector: Float64Array,
  scratch: Float64Array,
  relativeTolerance = 1e-7,
  rowScale: Float64Array | null = null,
  product: Float64Array | null = null,
): number {
  let sum = 0;
  for (let i = 0; i < n; i++) sum += vector[i];
  if (!(sum > 0)) {
    vector.fill(1 / n);
    sum = 1;
  }
  for (let i = 0; i < n; i++) vector[i] /= sum;
  for (let iter = 0; iter < 300; iter++) {
    let total = 0;
    let low = Infinity;
    let high = 0;
    for (let i = 0; i < n; i++) {
      let acc = rowTimes(flat, i * n, vector, n);
      if (product !== null) product[i] = acc;
      if (rowScale !== null) acc *= rowScale[i];
      scratch[i] = acc;
      total += acc;
      if (vector[i] > 0) {
        const ratio = acc / vector[i];
        if (ratio < low) low = ratio;
        if (ratio > high) high = ratio;
      } else if (acc > 0) {
        high = Infinity;
      }
    }
    if (total === 0) return 0;
    if (high < Infinity && high - low <= relativeTolerance * high) return 0.5 * (low + high);
    const inverse = 1 / total;
    for (let i = 0; i < n; i++) vector[i] = scratch[i] * inverse;
  }
  vector.fill(1 / n);
  if (product !== null) product.fill(0);
  if (rowScale === null) return perronRoot(flat, n);
  const scaled = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) scaled[i * n + j] = rowScale[i] * flat[i * n + j];
  return perronRoot(scaled, n);
}
