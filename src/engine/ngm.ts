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
  normalizeStart(vector, n);
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
  return rowScale === null ? perronRoot(flat, n) : scaledPerronRoot(flat, n, rowScale);
}

/** Largest |r| for which `scaledSpectralRadius` extrapolates: 1 / (1 - r) amplifies rounding at most 20-fold. */
const MAX_EXTRAPOLATION_RATIO = 0.95;

/**
 * `spectralRadius` of K = diag(rowScale) M for R(t) day by day (reproduction.ts), where it runs
 * hundreds of times per option, accelerated: any combination y = sum c_k x_k of the iterates has
 * the product M y = sum c_k (M x_k) without a matrix-vector product, so its Collatz-Wielandt
 * bracket costs O(n). From the third iterate on, when the bracket of x_k has not closed, it tries
 * the iterate with the slowest error component removed (Aitken's delta-squared process applied to
 * the vectors; Aitken 1926, Proc R Soc Edinburgh 46:289; Wilkinson 1965, The Algebraic Eigenvalue
 * Problem, ch. 9, from memory): if x_k ~ v + c r^k w, then (x_k - r x_{k-1}) / (1 - r) = v, with
 * r estimated as <x_k - x_{k-1}, x_{k-1} - x_{k-2}> / |x_{k-1} - x_{k-2}|^2. The extrapolated y
 * is accepted only when its own bracket, from M y = (M x_k - r M x_{k-1}) / (1 - r), is narrower
 * than `relativeTolerance`, so the result is certified as before; otherwise the iteration goes on
 * unchanged. `work` holds 5n numbers. On return `vector` and `product` hold the certified x and
 * M x (the latter to rounding when x was extrapolated). Same stop rule and fallback as
 * `spectralRadius`; products use rowTimes' order of additions.
 */
export function scaledSpectralRadius(
  flat: Float64Array,
  n: number,
  rowScale: Float64Array,
  vector: Float64Array,
  product: Float64Array,
  work: Float64Array,
  relativeTolerance: number,
): number {
  // work: [scratch | x_{k-1} | M x_{k-1} | x_{k-2} | M x_{k-2}], n each.
  const x1 = n;
  const p1 = 2 * n;
  const x2 = 3 * n;
  const p2 = 4 * n;
  normalizeStart(vector, n);
  for (let iter = 0; iter < 300; iter++) {
    let total = 0;
    let low = Infinity;
    let high = 0;
    for (let i = 0; i < n; i++) {
      const acc = rowTimes(flat, i * n, vector, n);
      product[i] = acc;
      const image = acc * rowScale[i];
      work[i] = image;
      total += image;
      const x = vector[i];
      if (x > 0) {
        const ratio = image / x;
        low = Math.min(low, ratio);
        high = Math.max(high, ratio);
      } else if (image > 0) {
        high = Infinity;
      }
    }
    if (total === 0) return 0;
    if (high < Infinity && high - low <= relativeTolerance * high) return 0.5 * (low + high);
    if (iter >= 2) {
      const r = extrapolated(vector, product, work, n, rowScale, relativeTolerance);
      if (!Number.isNaN(r)) return r;
    }
    const inverse = 1 / total;
    for (let i = 0; i < n; i++) {
      work[x2 + i] = work[x1 + i];
      work[p2 + i] = work[p1 + i];
      work[x1 + i] = vector[i];
      work[p1 + i] = product[i];
      vector[i] = work[i] * inverse;
    }
  }
  vector.fill(1 / n);
  product.fill(0);
  return scaledPerronRoot(flat, n, rowScale);
}

/** Scales `vector` to sum 1, or sets it uniform when it has no positive sum: the start of a power iteration. */
function normalizeStart(vector: Float64Array, n: number): void {
  let sum = 0;
  for (let i = 0; i < n; i++) sum += vector[i];
  if (!(sum > 0)) {
    vector.fill(1 / n);
    sum = 1;
  }
  for (let i = 0; i < n; i++) vector[i] /= sum;
}

/** The bounded Perron root (perronRoot.ts) of diag(rowScale) M: where power iteration does not settle. */
function scaledPerronRoot(flat: Float64Array, n: number, rowScale: Float64Array): number {
  const scaled = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) scaled[i * n + j] = rowScale[i] * flat[i * n + j];
  return perronRoot(scaled, n);
}

/**
 * The Aitken step of `scaledSpectralRadius` from x_k (`vector`, `product`) and the two iterates
 * before it in `work`: the midpoint of the extrapolated vector's bracket when it is narrower than
 * `relativeTolerance` (then `vector` and `product` receive y and M y); NaN otherwise, nothing
 * changed. Uses work[0..n) as scratch only after reading nothing from it.
 */
function extrapolated(vector: Float64Array, product: Float64Array, work: Float64Array, n: number, rowScale: Float64Array, relativeTolerance: number): number {
  const x1 = n;
  const p1 = 2 * n;
  const x2 = 3 * n;
  let cross = 0;
  let square = 0;
  for (let i = 0; i < n; i++) {
    const before = work[x1 + i] - work[x2 + i];
    cross += (vector[i] - work[x1 + i]) * before;
    square += before * before;
  }
  const r = cross / square;
  if (!(Math.abs(r) <= MAX_EXTRAPOLATION_RATIO) || r === 0) return NaN;
  const gain = 1 / (1 - r);
  let low = Infinity;
  let high = 0;
  for (let i = 0; i < n; i++) {
    const y = (vector[i] - r * work[x1 + i]) * gain;
    const image = rowScale[i] * ((product[i] - r * work[p1 + i]) * gain);
    if (!(y > 0)) {
      if (image > 0 || y < 0) return NaN;
      continue;
    }
    const ratio = image / y;
    low = Math.min(low, ratio);
    high = Math.max(high, ratio);
  }
  if (!(high > 0 && high - low <= relativeTolerance * high)) return NaN;
  for (let i = 0; i < n; i++) {
    vector[i] = (vector[i] - r * work[x1 + i]) * gain;
    product[i] = (product[i] - r * work[p1 + i]) * gain;
  }
  return 0.5 * (low + high);
}
