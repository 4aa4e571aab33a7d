/**
 * Profile-likelihood confidence interval for one parameter (Venzon & Moolgavkar 1988, Appl Stat
 * 37:87; Pawitan 2001, In All Likelihood, sec. 3.4): all r with
 *
 *   2 [ ln L(r̂) - ln L_p(r) ] <= χ²₁(0.95) = 3.841459,    ln L_p(r) = max over the other parameters,
 *
 * found on each side of r̂ by stepping out in multiples of the Wald standard error until the
 * bound is passed, then bisection to 1e-10 (absolute). Chosen over the Wald interval r̂ ± 1.96 SE
 * because it does not assume a symmetric, quadratic log-likelihood: with few cases or a short
 * window the likelihood for r is skewed, and the profile interval is invariant under the monotone
 * maps to doubling time and R that follow.
 */

/** χ²₁ 0.95 quantile = 1.959963984540054² (standard normal 0.975 quantile; Abramowitz & Stegun 1964, table 26.5). */
export const CHI_SQUARE_1_DF_95 = 1.959963984540054 ** 2;

/** Farthest the search goes from r̂, per day: beyond it a bound is reported as infinite. */
const SEARCH_LIMIT = 20;

/**
 * [lower, upper] for a parameter with estimate `estimate`, maximum log-likelihood `maxLogLik` and
 * Wald standard error `standardError`; `profile(v)` must return ln L_p(v) (or -Infinity where the
 * fit fails). A side whose bound is not reached within ±20 of the estimate is ±Infinity.
 */
export function profileLikelihoodInterval(
  estimate: number,
  maxLogLik: number,
  standardError: number,
  profile: (value: number) => number,
): [number, number] {
  const outside = (v: number): boolean => !(2 * (maxLogLik - profile(v)) < CHI_SQUARE_1_DF_95);
  const bound = (direction: 1 | -1): number => {
    let step = Number.isFinite(standardError) && standardError > 0 ? standardError : 1e-3;
    let inner = estimate;
    let outer = estimate + direction * step;
    // Doubling steps pass SEARCH_LIMIT within 64 steps from any step above 1e-3; a bound never
    // found (or an estimate that is not a number) leaves that side open.
    for (let k = 0; !outside(outer); k++) {
      if (!(Math.abs(outer - estimate) <= SEARCH_LIMIT) || k >= 64) return direction * Infinity;
      inner = outer;
      step *= 2;
      outer = estimate + direction * step;
    }
    // Bisection: 100 halvings take any bracket below the spacing of doubles near the estimate.
    for (let k = 0; k < 100 && Math.abs(outer - inner) > 1e-10; k++) {
      const mid = 0.5 * (inner + outer);
      if (outside(mid)) outer = mid;
      else inner = mid;
    }
    return 0.5 * (inner + outer);
  };
  return [bound(-1), bound(1)];
}
