/**
 * Multi-group final size (Ma & Earn 2006, Bull Math Biol 68:679; Andreasen 2011,
 * Bull Math Biol 73:2305): with constant measures, the fraction z_i of band i infected over the
 * whole epidemic solves
 *
 *   z_i = s0_i (1 - exp(-sum_j A_ij z_j)),   A_ij = D * M_ij * N_j = beta D u_i C_ij h_j (1 - c),
 *
 * where s0_i is the fraction susceptible at the start (the small seed neglected). A shares its
 * eigenvalues with the next-generation matrix but is not K. Solved by fixed-point iteration from
 * z = s0: the map is increasing and concave, so the iterates fall monotonically to the largest
 * solution (0 when R <= 1).
 */

/** Returns z by band (fractions 0-1). `transmission` is M (n x n, per day). */
export function finalSizeByBand(
  transmission: Float64Array,
  population: ArrayLike<number>,
  initialSusceptibleFraction: ArrayLike<number>,
  infectiousPeriodDays: number,
): Float64Array {
  const n = population.length;
  const z = Float64Array.from(initialSusceptibleFraction);
  const next = new Float64Array(n);
  for (let iter = 0; iter < 100000; iter++) {
    let change = 0;
    for (let i = 0; i < n; i++) {
      let pressure = 0;
      for (let j = 0; j < n; j++) pressure += infectiousPeriodDays * transmission[i * n + j] * population[j] * z[j];
      next[i] = initialSusceptibleFraction[i] * -Math.expm1(-pressure);
      change = Math.max(change, Math.abs(next[i] - z[i]));
    }
    z.set(next);
    if (change < 1e-14) break;
  }
  return z;
}
