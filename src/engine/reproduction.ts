/**
 * R(t) for days 0..H: spectral radius of K(d) = D diag(S_eff(d)) M(d) (applied, not formed), with
 * S_eff the susceptibles weighted by their risk (vaccine protection included) and M the measures
 * in force, by power iteration stopped on the Collatz-Wielandt bracket (ngm.ts).
 *
 * Day 0 is certified to START_TOLERANCE from a uniform vector (the same R as `rStart`,
 * reproductionNumber.ts). Later days:
 * - Yesterday's certified vector x and its product p = M x give today's bracket for free:
 *   K(d) x = diag(D S_eff(d)) p, so min_i (K x)_i / x_i <= R(d) <= max_i (K x)_i / x_i costs n
 *   multiplications. Before and after the wave, where S hardly moves, it is already narrower than
 *   REPRODUCTION_TOLERANCE and the day costs no matrix-vector product.
 * - Otherwise power iteration starts from the Perron vector extrapolated cubically from the four
 *   days before (4 x_{d-1} - 6 x_{d-2} + 4 x_{d-3} - x_{d-4}, clipped at 0; quadratically,
 *   3 x_{d-1} - 3 x_{d-2} + x_{d-3}, on the fourth day after the measures change), much closer
 *   than yesterday's vector while S changes fast (on the demo the cubic start saves 10-17% of the
 *   products over the quadratic one; linear or quintic starts cost more); in the first days after
 *   the measures change, from yesterday's.
 */
import { spectralRadius } from './ngm.ts';
import type { PreparedScenario } from './prepare.ts';
import { optionPath, rootOrRefusal } from './runRefusal.ts';
import type { PolicyOption } from './scenario.ts';
import type { Segment } from './segments.ts';

/** Relative width of the certified bracket around each day's R (d >= 1). */
export const REPRODUCTION_TOLERANCE = 1e-6;
/** Relative width of the bracket around R on day 0. */
export const START_TOLERANCE = 1e-12;

/**
 * The midpoint of the bracket of x for K = diag(scale) M, given p = M x, when it is narrower than
 * REPRODUCTION_TOLERANCE; NaN otherwise.
 */
function bracketMidpoint(x: Float64Array, product: Float64Array, scale: Float64Array, n: number): number {
  let low = Infinity;
  let high = 0;
  for (let i = 0; i < n; i++) {
    if (!(x[i] > 0)) continue;
    const ratio = (scale[i] * product[i]) / x[i];
    if (ratio < low) low = ratio;
    if (ratio > high) high = ratio;
  }
  return high > 0 && high - low <= REPRODUCTION_TOLERANCE * high ? 0.5 * (low + high) : NaN;
}

/** R(t) of `option` (whose realised segments are `segments`); a day whose R cannot be pinned down ends in a RunRefused naming the option and the day (runRefusal.ts). */
export function reproductionByDay(p: PreparedScenario, option: PolicyOption, segments: readonly Segment[], effectiveSusceptible: Float64Array): Float64Array {
  const n = p.bands.bands;
  const H = p.scenario.horizonDays;
  const D = p.periods.infectiousPeriodDays;
  const rt = new Float64Array(H + 1);
  const scale = new Float64Array(n);
  const vector = new Float64Array(n).fill(1 / n);
  const product = new Float64Array(n);
  const scratch = new Float64Array(n);
  const x1 = new Float64Array(n);
  const x2 = new Float64Array(n);
  const x3 = new Float64Array(n);
  const x4 = new Float64Array(n);
  // The option's path for a refusal: looked up once per run, not once per day (a batch may hold thousands of options).
  const at = optionPath(p.scenario.options, option.name);
  let seg = 0;
  let measuresSince = 0;
  for (let d = 0; d <= H; d++) {
    let measuresChanged = false;
    while (seg + 1 < segments.length && d >= segments[seg].toDay) {
      seg++;
      if (segments[seg].measuresChange) {
        measuresSince = segments[seg].fromDay;
        measuresChanged = true;
      }
    }
    for (let i = 0; i < n; i++) scale[i] = D * effectiveSusceptible[d * n + i];
    rt[d] = d === 0 || measuresChanged ? NaN : bracketMidpoint(x1, product, scale, n);
    if (Number.isNaN(rt[d])) {
      if (d - 4 >= measuresSince) for (let i = 0; i < n; i++) vector[i] = Math.max(0, 4 * x1[i] - 6 * x2[i] + 4 * x3[i] - x4[i]);
      else if (d - 3 >= measuresSince) for (let i = 0; i < n; i++) vector[i] = Math.max(0, 3 * x1[i] - 3 * x2[i] + x3[i]);
      else if (d > 0) vector.set(x1);
      const transmission = segments[seg].transmission;
      const tolerance = d === 0 ? START_TOLERANCE : REPRODUCTION_TOLERANCE;
      rt[d] = rootOrRefusal(() => spectralRadius(transmission, n, vector, scratch, tolerance, scale, product), at, option.name, `on day ${d}`);
    } else {
      vector.set(x1);
    }
    x4.set(x3);
    x3.set(x2);
    x2.set(x1);
    x1.set(vector);
  }
  return rt;
}
