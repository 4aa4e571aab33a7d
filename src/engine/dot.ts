/**
 * Row times vector, the innermost loop of the right-hand side and of R(t).
 */

/**
 * sum_j flat[row + j] v[j] for j = 0..n-1, in four partial sums (independent chains keep the
 * processor's multipliers busy; the order of additions is fixed, so results are deterministic).
 */
export function rowTimes(flat: Float64Array, row: number, v: Float64Array, n: number): number {
  let a0 = 0;
  let a1 = 0;
  let a2 = 0;
  let a3 = 0;
  let j = 0;
  for (; j + 3 < n; j += 4) {
    a0 += flat[row + j] * v[j];
    a1 += flat[row + j + 1] * v[j + 1];
    a2 += flat[row + j + 2] * v[j + 2];
    a3 += flat[row + j + 3] * v[j + 3];
  }
  for (; j < n; j++) a0 += flat[row + j] * v[j];
  return a0 + a1 + (a2 + a3);
}
