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
import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import { rowTimes } from './dot.ts';

/** Writes K = D diag(S) M (row-major n x n) into `out`. */
export function nextGenerationMatrixInto(out: Float64Array, transmission: Float64Array, susceptible: ArrayLike<number>, infectiousPeriodDays: number): Float64Array {
  const n = susceptible.length;
  for (let i = 0; i < n; i++) {
    const f = infectiousPeriodDays * susceptible[i];
    for (let j = 0; j < n; j++) out[i * n + j] = f * transmission[i * n + j];
  }
  return out;
}

/** Entries of K below this fraction of its largest entry are dropped before the eigen decomposition. */
const NEGLIGIBLE_ENTRY = 1e-14;

/**
 * Dominant eigenvalue (largest real part) of a square matrix, with ml-matrix's
 * EigenvalueDecomposition. For a non-negative K this is its spectral radius (Perron-Frobenius).
 */
export function dominantEigenvalue(flat: Float64Array, n: number): number {
  // A non-finite entry would make the QR iteration run forever; validated scenarios never give one.
  let largest = 0;
  for (let k = 0; k < flat.length; k++) {
    if (!Number.isFinite(flat[k])) throw new Error('next-generation matrix has a non-finite entry');
    largest = Math.max(largest, Math.abs(flat[k]));
  }
  if (largest === 0) return 0;
  // Scaled to a largest entry of 1, with entries below NEGLIGIBLE_ENTRY of it set to 0. For a
  // non-negative K, dropping entries E changes rho by at most ||E||, i.e. n * 1e-14 of the
  // largest entry; without the cut, entries spanning hundreds of orders of magnitude (one contact
  // of 1e200 among ordinary ones) make products underflow and the QR iteration, which has no
  // iteration limit of its own, never converge.
  const rows = Array.from({ length: n }, (_, i) =>
    Array.from(flat.subarray(i * n, (i + 1) * n), (x) => (Math.abs(x) < NEGLIGIBLE_ENTRY * largest ? 0 : x / largest)),
  );
  const eig = new EigenvalueDecomposition(new Matrix(rows), { assumeSymmetric: false });
  let best = -Infinity;
  for (const v of eig.realEigenvalues) if (v > best) best = v;
  return Math.max(0, best) * largest;
}

/**
 * Spectral radius of a non-negative matrix by power iteration, warm-started from `vector`
 * (length n, non-negative): x_{k+1} = K x_k / |K x_k|_1.
 * Stops on the Collatz-Wielandt bracket: for x > 0, min_i (Kx)_i / x_i <= rho <= max_i (Kx)_i / x_i
 * (Horn & Johnson 2013, Matrix Analysis, 2nd ed., Thm 8.1.26), once it is narrower than
 * `relativeTolerance` (default 1e-7, ample for a daily R(t)); rows with x_i = 0 (no susceptibles
 * or no susceptibility) have no say. On return `vector` holds the x_k whose bracket closed (an
 * approximate Perron vector) and, when given, `product` holds M x_k without the row scale, so a
 * caller can bracket rho for another row scale at the cost of n multiplications (reproduction.ts).
 * Used for R(t) day by day, where the previous day's vector is an excellent start; there
 * K = diag(rowScale) M is applied without being formed (rowScale_i = D S_i). Falls back to
 * `dominantEigenvalue` (ml-matrix) when the bracket does not close (a periodic or reducible K).
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
      }
    }
    if (total === 0) return 0;
    if (high - low <= relativeTolerance * high) return 0.5 * (low + high);
    const inverse = 1 / total;
    for (let i = 0; i < n; i++) vector[i] = scratch[i] * inverse;
  }
  vector.fill(1 / n);
  if (product !== null) product.fill(0);
  if (rowScale === null) return dominantEigenvalue(flat, n);
  const scaled = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) scaled[i * n + j] = rowScale[i] * flat[i * n + j];
  return dominantEigenvalue(scaled, n);
}
