/**
 * Multi-group final size (Ma & Earn 2006, Bull Math Biol 68:679; Andreasen 2011,
 * Bull Math Biol 73:2305): with constant measures, the fraction z_i of band i infected over the
 * whole epidemic solves
 *
 *   z_i = g_i(z) = s0_i (1 - exp(-sum_j A_ij z_j)),   A_ij = D * M_ij * N_j = beta D u_i C_ij h_j (1 - c),
 *
 * where s0_i is the fraction susceptible at the start (the small seed neglected). A shares its
 * eigenvalues with the next-generation matrix but is not K.
 *
 * Solved by Newton's method on F(z) = z - g(z) from z = s0. g is increasing and concave, so F is
 * convex in the order sense, and at any z above the largest solution z* the Jacobian
 * J = I - diag(s0_i exp(-(A z)_i)) A is a non-singular M-matrix (its off-diagonal part is <= the
 * one at z*, where the spectral radius of g' is below 1). Newton's iterates from a point above z*
 * then fall monotonically to z* (Ortega & Rheinboldt 1970, Iterative Solution of Nonlinear
 * Equations in Several Variables, section 13.3, from memory), quadratically near a simple root.
 * Gaussian elimination without pivoting suits an M-matrix (positive pivots); a pivot that is not
 * positive (J singular to rounding: R = 1 with z* = 0) gives way to one plain fixed-point step
 * z = g(z). The plain iteration alone needs hundreds of steps at R = 1.5 and tens of thousands
 * near R = 1, where uncertainty draws often land.
 */

/** More than enough Newton steps (about six at R = 2, about fifty at R = 1 exactly, where the root is double). */
const MAX_STEPS = 500;

/** Returns z by band (fractions 0-1). `transmission` is M (n x n, per day). */
export function finalSizeByBand(
  transmission: Float64Array,
  population: ArrayLike<number>,
  initialSusceptibleFraction: ArrayLike<number>,
  infectiousPeriodDays: number,
): Float64Array {
  const n = population.length;
  const s0 = initialSusceptibleFraction;
  const a = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) a[i * n + j] = infectiousPeriodDays * transmission[i * n + j] * population[j];
  const z = Float64Array.from(s0);
  const g = new Float64Array(n);
  const slope = new Float64Array(n);
  const jacobian = new Float64Array(n * n);
  const step = new Float64Array(n);
  for (let iter = 0; iter < MAX_STEPS; iter++) {
    for (let i = 0; i < n; i++) {
      let pressure = 0;
      for (let j = 0; j < n; j++) pressure += a[i * n + j] * z[j];
      g[i] = s0[i] * -Math.expm1(-pressure);
      slope[i] = s0[i] * Math.exp(-pressure);
      step[i] = z[i] - g[i];
    }
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < n; j++) jacobian[i * n + j] = -slope[i] * a[i * n + j];
      jacobian[i * n + i] += 1;
    }
    const newton = solveMMatrix(jacobian, n, step);
    let change = 0;
    for (let i = 0; i < n; i++) {
      // Newton: z - J^{-1} F(z); else the fixed-point step g(z). Kept within [0, s0_i].
      const next = Math.min(s0[i], Math.max(0, newton ? z[i] - step[i] : g[i]));
      change = Math.max(change, Math.abs(next - z[i]));
      z[i] = next;
    }
    if (change < 1e-14) break;
  }
  return z;
}

/**
 * Solves J x = b in place (b becomes x) by Gaussian elimination without pivoting; J is
 * overwritten. False, with b unusable, when a pivot is not positive or x is not finite.
 */
function solveMMatrix(j: Float64Array, n: number, b: Float64Array): boolean {
  for (let k = 0; k < n; k++) {
    const pivot = j[k * n + k];
    if (!(pivot > 0)) return false;
    for (let i = k + 1; i < n; i++) {
      const f = j[i * n + k] / pivot;
      if (f === 0) continue;
      for (let c = k + 1; c < n; c++) j[i * n + c] -= f * j[k * n + c];
      b[i] -= f * b[k];
    }
  }
  for (let i = n - 1; i >= 0; i--) {
    let acc = b[i];
    for (let c = i + 1; c < n; c++) acc -= j[i * n + c] * b[c];
    b[i] = acc / j[i * n + i];
    if (!Number.isFinite(b[i])) return false;
  }
  return true;
}
