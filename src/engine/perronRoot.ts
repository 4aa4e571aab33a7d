/**
 * Spectral radius of a non-negative square matrix with a bound on its work: what `spectralRadius`
 * (ngm.ts) falls back on when power iteration does not settle (a periodic or reducible matrix, or
 * one whose second eigenvalue is close to the first). Every loop has a fixed limit, so no input
 * can make it run forever; the answer is finite, or a `PerronRootNotSettled` error.
 *
 * 1. A reducible matrix: rho(A) is the largest rho of the diagonal blocks of A's strongly connected
 *    components (the Frobenius normal form; Horn & Johnson 2013, Matrix Analysis, 2nd ed., ch. 8,
 *    from memory). Components come from the transitive closure of A's graph (Warshall 1962,
 *    J ACM 9:11). A component of one row has rho = its diagonal entry.
 * 2. Each irreducible block of two or more rows is balanced, B -> D B D^-1 with D diagonal powers
 *    of 2 that bring each row's and column's largest entries together (Osborne 1960, J ACM 7:338;
 *    Parlett & Reinsch 1969, Numer Math 13:293, there with sums), and scaled to a largest entry of
 *    1: exact in floating point, rho unchanged, and neither the entries nor the Perron vector span
 *    hundreds of orders of magnitude when populations or contacts do.
 * 3. Then Noda's iteration (Noda 1971, Numer Math 17:382, from memory), inverse iteration shifted
 *    by the Collatz-Wielandt upper bound:
 *      lambda_k = max_i (B x_k)_i / (x_k)_i,   x_{k+1} = (lambda_k I - B)^{-1} x_k / |.|_1.
 *    lambda_k falls monotonically to rho, quadratically near it. It stops once the bracket
 *    min_i (B x)_i / x_i <= rho <= max_i (B x)_i / x_i (Horn & Johnson 2013, Thm 8.1.26) is
 *    narrower than SETTLED. For lambda > rho, lambda I - B is a non-singular M-matrix, so Gaussian
 *    elimination without pivoting has positive pivots and adds only non-negative terms off the
 *    diagonal, and (lambda I - B)^{-1} x > 0; a pivot that is not above 0 says lambda <= rho of a
 *    leading block <= rho (Berman & Plemmons 1994, Nonnegative Matrices in the Mathematical
 *    Sciences, ch. 6, from memory), so with lambda >= rho, rho = lambda to rounding.
 */
import { rowTimes } from './dot.ts';

/** Most Noda steps per irreducible block; it settles in under 30 on every matrix tried (test/engine/perronRoot.test.ts). */
export const MAX_PERRON_STEPS = 100;
/** Relative width of the Collatz-Wielandt bracket at which the root is taken as found. */
const SETTLED = 1e-13;
/** Bracket accepted when the steps run out (rounding can stop Noda's iteration short of SETTLED). */
const SETTLED_AT_LIMIT = 1e-9;
/** Most balancing sweeps (balancedBlock). */
const MAX_BALANCING_SWEEPS = 64;

/** The iteration did not narrow its bracket within MAX_PERRON_STEPS (or rounding stopped it first). */
export class PerronRootNotSettled extends Error {
  constructor(
    readonly low: number,
    readonly high: number,
  ) {
    super(`the largest eigenvalue of the next-generation matrix could not be pinned down (it lies between ${low.toPrecision(6)} and ${high.toPrecision(6)})`);
    this.name = 'PerronRootNotSettled';
  }
}

/** Work done by `perronRoot`, for step budgets in tests. */
export interface PerronWork {
  steps: number;
}

/** rho(A) for a non-negative n x n matrix A (row-major). Throws on a negative or non-finite entry. */
export function perronRoot(flat: Float64Array, n: number, work: PerronWork = { steps: 0 }): number {
  for (let k = 0; k < n * n; k++) {
    const x = flat[k];
    if (!(x >= 0 && x < Infinity)) throw new Error(`the next-generation matrix has an entry of ${x} at row ${Math.floor(k / n) + 1}, column ${(k % n) + 1}: entries must be finite and non-negative`);
  }
  // Matrices still to split into components, each with the factor its entries were divided by. A
  // block whose balanced, scaled form lost entries to underflow (below 2^-1074 of its largest) can
  // fall apart into smaller components: it goes back on the list, so sizes shrink on every round.
  const pending: { a: Float64Array; size: number; scale: number }[] = [{ a: flat, size: n, scale: 1 }];
  let best = 0;
  while (pending.length > 0) {
    const { a, size, scale } = pending.pop() as { a: Float64Array; size: number; scale: number };
    for (const members of stronglyConnectedComponents(a, size)) {
      const m = members.length;
      let root: number;
      if (m === 1) root = a[members[0] * size + members[0]] * scale;
      else {
        const { b, scale: blockScale } = balancedBlock(a, size, members);
        if (stronglyConnectedComponents(b, m).length > 1) {
          pending.push({ a: b, size: m, scale: scale * blockScale });
          continue;
        }
        root = irreducibleRoot(b, m, work) * scale * blockScale;
      }
      if (root > best) best = root;
    }
  }
  return best;
}

/** Rows of each strongly connected component of A's graph (i -> j when a_ij > 0). */
function stronglyConnectedComponents(a: Float64Array, n: number): number[][] {
  const reach = new Uint8Array(n * n);
  for (let i = 0; i < n; i++) {
    reach[i * n + i] = 1;
    for (let j = 0; j < n; j++) if (a[i * n + j] > 0) reach[i * n + j] = 1;
  }
  for (let k = 0; k < n; k++) {
    for (let i = 0; i < n; i++) {
      if (reach[i * n + k] === 0) continue;
      for (let j = 0; j < n; j++) if (reach[k * n + j] === 1) reach[i * n + j] = 1;
    }
  }
  const assigned = new Uint8Array(n);
  const components: number[][] = [];
  for (let i = 0; i < n; i++) {
    if (assigned[i] === 1) continue;
    const members: number[] = [];
    for (let j = i; j < n; j++) {
      if (assigned[j] === 0 && reach[i * n + j] === 1 && reach[j * n + i] === 1) {
        assigned[j] = 1;
        members.push(j);
      }
    }
    components.push(members);
  }
  return components;
}

/** x 2^e for any whole e, exact while the result is a normal number (steps of 2^±1000 move straight to it). */
function timesPowerOfTwo(x: number, e: number): number {
  let y = x;
  let k = e;
  for (; k > 1000; k -= 1000) y *= 2 ** 1000;
  for (; k < -1000; k += 1000) y *= 2 ** -1000;
  return y * 2 ** k;
}

/**
 * The block of `members` (rows and columns) balanced, D B D^-1 with D = diag(2^d_i), and scaled to
 * a largest entry of 1; `scale` is that entry. The exponents come from log2 of the entries (no
 * overflow whatever their range): sweep after sweep, d_i moves half the gap between the largest
 * entry of row i and of column i (off the diagonal), while the gap is 2 or more.
 */
function balancedBlock(a: Float64Array, n: number, members: readonly number[]): { b: Float64Array; scale: number } {
  const m = members.length;
  const logs = new Float64Array(m * m);
  for (let i = 0; i < m; i++) for (let j = 0; j < m; j++) logs[i * m + j] = Math.log2(a[members[i] * n + members[j]]);
  const d = new Float64Array(m);
  for (let sweep = 0; sweep < MAX_BALANCING_SWEEPS; sweep++) {
    let changed = false;
    for (let i = 0; i < m; i++) {
      let row = -Infinity;
      let column = -Infinity;
      for (let j = 0; j < m; j++) {
        if (j === i) continue;
        row = Math.max(row, logs[i * m + j] + d[i] - d[j]);
        column = Math.max(column, logs[j * m + i] + d[j] - d[i]);
      }
      const gap = column - row;
      if (!(Math.abs(gap) >= 2)) continue;
      d[i] += Math.trunc(gap / 2);
      changed = true;
    }
    if (!changed) break;
  }
  const b = new Float64Array(m * m);
  let scale = 0;
  for (let i = 0; i < m; i++) for (let j = 0; j < m; j++) scale = Math.max(scale, (b[i * m + j] = timesPowerOfTwo(a[members[i] * n + members[j]], d[i] - d[j])));
  for (let k = 0; k < m * m; k++) b[k] /= scale;
  return { b, scale };
}

/** Noda's iteration on an irreducible non-negative m x m matrix (module comment). */
function irreducibleRoot(b: Float64Array, m: number, work: PerronWork): number {
  const x = new Float64Array(m).fill(1 / m);
  const y = new Float64Array(m);
  const lu = new Float64Array(m * m);
  let low = 0;
  let high = Infinity;
  for (let step = 0; step < MAX_PERRON_STEPS; step++) {
    work.steps++;
    low = Infinity;
    high = 0;
    for (let i = 0; i < m; i++) {
      const ratio = rowTimes(b, i * m, x, m) / x[i];
      if (ratio < low) low = ratio;
      if (ratio > high) high = ratio;
    }
    if (high - low <= SETTLED * high) return 0.5 * (low + high);
    // A pivot not above 0, or y overflowing: the shift is rho to rounding (module comment).
    if (!shiftedSolve(b, m, high, x, lu, y)) return high;
    let sum = 0;
    for (let i = 0; i < m; i++) sum += y[i];
    if (!(sum < Infinity)) return high;
    let smallest = Infinity;
    for (let i = 0; i < m; i++) smallest = Math.min(smallest, (x[i] = y[i] / sum));
    // A component that underflowed to 0 leaves the bracket undefined at its row.
    if (!(smallest > 0)) break;
  }
  // Rounding can hold the bracket a little wider than SETTLED: nine digits are still far more than R is read to.
  if (high - low <= SETTLED_AT_LIMIT * high) return 0.5 * (low + high);
  throw new PerronRootNotSettled(low, high);
}

/**
 * Solves (shift I - B) y = x by Gaussian elimination without pivoting (an M-matrix: module
 * comment). False when a pivot is not above 0, i.e. rounding put the shift at or below rho.
 */
function shiftedSolve(b: Float64Array, m: number, shift: number, x: Float64Array, lu: Float64Array, y: Float64Array): boolean {
  for (let k = 0; k < m * m; k++) lu[k] = -b[k];
  for (let i = 0; i < m; i++) lu[i * m + i] += shift;
  for (let k = 0; k < m; k++) {
    const pivot = lu[k * m + k];
    if (!(pivot > 0)) return false;
    for (let i = k + 1; i < m; i++) {
      const f = lu[i * m + k] / pivot;
      lu[i * m + k] = f;
      if (f === 0) continue;
      for (let j = k + 1; j < m; j++) lu[i * m + j] -= f * lu[k * m + j];
    }
  }
  for (let i = 0; i < m; i++) {
    let acc = x[i];
    for (let j = 0; j < i; j++) acc -= lu[i * m + j] * y[j];
    y[i] = acc;
  }
  for (let i = m - 1; i >= 0; i--) {
    let acc = y[i];
    for (let j = i + 1; j < m; j++) acc -= lu[i * m + j] * y[j];
    y[i] = acc / lu[i * m + i];
  }
  return true;
}
