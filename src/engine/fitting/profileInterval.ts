/**
 * Profile-likelihood confidence interval for one parameter (Venzon & Moolgavkar 1988, Appl Stat
 * 37:87; Pawitan 2001, In All Likelihood, sec. 3.4): all r with
 *
 *   D(r) = 2 [ ln L(r̂) - ln L_p(r) ] <= χ²₁(0.95) = 3.841459,    ln L_p(r) = max over the other parameters,
 *
 * found on each side of r̂ by stepping out in doubling multiples of the Wald standard error until
 * the bound is passed, then a root of D(r) - χ²₁(0.95) by Brent's method (brentRoot.ts) to 1e-10
 * (absolute, or the spacing of doubles near r̂ when that is coarser). Chosen over the Wald
 * interval r̂ ± 1.96 SE because it does not assume a symmetric, quadratic log-likelihood: with few
 * cases or a short window the likelihood for r is skewed, and the profile interval is invariant
 * under the monotone maps to doubling time and R that follow.
 *
 * Each evaluation of ln L_p is a refit of the model; a side may use at most
 * PROFILE_REFITS_PER_SIDE of them (fitBudget.ts). A side whose end is not found within that, or
 * whose refits run out of work (the caller's budget), is left open (±Infinity) with a one-line
 * reason; a side whose end lies beyond ±20/day of r̂ is open (unbounded) without one.
 */
import { brentRoot } from './brentRoot.ts';
import { PROFILE_REFITS_PER_SIDE } from './fitBudget.ts';

/** χ²₁ 0.95 quantile = 1.959963984540054² (standard normal 0.975 quantile; Abramowitz & Stegun 1964, table 26.5). */
export const CHI_SQUARE_1_DF_95 = 1.959963984540054 ** 2;

/** Farthest the search goes from r̂, per day: beyond it a bound is reported as infinite. */
const SEARCH_LIMIT = 20;

/** ln L_p at a value, -Infinity where the model cannot be fitted there, or why the refit did not settle (a clause: "the refits ... ran out"). */
export type ProfileValue = number | { notSettled: string };

export interface ProfileInterval {
  /** [lower, upper]; an end not found (see `notDetermined`) or beyond ±20/day is ±Infinity. */
  interval: [number, number];
  /** Per end, null when found or unbounded, else the one-line reason it was not determined ("upper end of the 95% interval for r not found ..."). */
  notDetermined: [string | null, string | null];
  /** Refits (evaluations of `profile`) used, both sides. */
  refits: number;
}

const SIDE_NAMES = { [-1]: 'lower', [1]: 'upper' } as const;

/** How the reasons name the parameter and write a value of it ("r", "r = 0.0123 per day"). */
export interface ProfileWords {
  name: string;
  describe: (value: number) => string;
}

/**
 * The interval for a parameter with estimate `estimate`, maximum log-likelihood `maxLogLik` and
 * Wald standard error `standardError`; `profile(v, side)` returns ln L_p(v) (see ProfileValue) for v
 * on `side` of the estimate (-1 below, 1 above: each side is searched in turn, lower first).
 */
export function profileLikelihoodInterval(
  estimate: number,
  maxLogLik: number,
  standardError: number,
  profile: (value: number, side: -1 | 1) => ProfileValue,
  words: ProfileWords = { name: 'the parameter', describe: (v) => `the value ${v}` },
  refitsPerSide: number = PROFILE_REFITS_PER_SIDE,
): ProfileInterval {
  let refits = 0;
  const bound = (direction: 1 | -1): { end: number; reason: string | null } => {
    const side = `${SIDE_NAMES[direction]} end of the 95% interval for ${words.name}`;
    const open = (reason: string | null) => ({ end: direction * Infinity, reason });
    let used = 0;
    let unsettled: string | null = null;
    /** D(v) - χ², >= 0 outside the interval (also where the model cannot be fitted); null when out of refits or a refit did not settle. */
    const excess = (v: number): number | null => {
      if (used >= refitsPerSide) return null;
      used++;
      refits++;
      const p = profile(v, direction);
      if (typeof p !== 'number') {
        unsettled = `${side} not determined at ${words.describe(v)}: ${p.notSettled}`;
        return null;
      }
      const d = 2 * (maxLogLik - p) - CHI_SQUARE_1_DF_95;
      return d < 0 ? d : Number.isFinite(d) ? d : Infinity;
    };
    const tooFlat = `${side} not found within ${refitsPerSide} refits: the likelihood is too flat or too irregular there`;
    let step = Number.isFinite(standardError) && standardError > 0 ? standardError : 1e-3;
    let inner = estimate;
    let fInner = -CHI_SQUARE_1_DF_95;
    let outer = estimate + direction * step;
    if (!Number.isFinite(estimate)) return open(null);
    // Doubling steps pass SEARCH_LIMIT within 64 steps from any step above 1e-3; a side still
    // inside the interval there is open (unbounded).
    for (let k = 0; ; k++) {
      const fOuter = excess(outer);
      if (fOuter === null) return open(unsettled ?? tooFlat);
      if (fOuter >= 0) {
        const root = brentRoot(excess, inner, fInner, outer, fOuter, 1e-10, refitsPerSide);
        if (root === null) return open(unsettled ?? tooFlat);
        return root.converged ? { end: root.x, reason: null } : open(tooFlat);
      }
      if (!(Math.abs(outer - estimate) <= SEARCH_LIMIT) || k >= 64) return open(null);
      [inner, fInner] = [outer, fOuter];
      step *= 2;
      outer = estimate + direction * step;
    }
  };
  const lower = bound(-1);
  const upper = bound(1);
  return { interval: [lower.end, upper.end], notDetermined: [lower.reason, upper.reason], refits };
}
