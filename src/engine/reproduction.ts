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
 * - Otherwise the Perron vector is extrapolated cubically from the four days before
 *   (4 x_{d-1} - 6 x_{d-2} + 4 x_{d-3} - x_{d-4}; quadratically, 3 x_{d-1} - 3 x_{d-2} + x_{d-3},
 *   on the fourth day after the measures change), much closer than yesterday's vector while S
 *   changes fast (on the demo the cubic start saves 10-17% of the products over the quadratic one;
 *   linear or quintic starts cost more). M is linear, so the same weights on the stored products
 *   give M y for the extrapolated y without a matrix-vector product: when y's bracket is already
 *   narrower than REPRODUCTION_TOLERANCE the day is certified for n multiplications; otherwise the
 *   power step diag(D S_eff) M y is free too and the iteration (ngm.ts `scaledSpectralRadius`)
 *   starts from it (from y clipped at 0 if y has a negative entry). In the first days after the
 *   measures change, it starts from yesterday's vector.
 * On the demo's options this takes a third fewer matrix-vector products than iterating from the
 * extrapolated start; R(t) differs from that by at most 4e-7 relative (both within the bracket).
 */
import { scaledSpectralRadius } from './ngm.ts';
import type { PreparedScenario } from './prepare.ts';
import { optionPath, rootOrRefusal } from './runRefusal.ts';
import type { PolicyOption } from './scenario.ts';
import type { Segment } from './segments.ts';

/** Relative width of the certified bracket around each day's R (d >= 1). */
export const REPRODUCTION_TOLERANCE = 1e-6;
/** Relative width of the bracket around R on day 0. */
export const START_TOLERANCE = 1e-12;

/**
 * The midpoint of the bracket of x for K = diag(scale) M, given p = M x (both read from `at` on),
 * when it is narrower than REPRODUCTION_TOLERANCE and x is positive wherever K x is; NaN otherwise.
 */
function bracketMidpoint(x: Float64Array, product: Float64Array, at: number, scale: Float64Array, n: number): number {
  let low = Infinity;
  let high = 0;
  for (let i = 0; i < n; i++) {
    const image = scale[i] * product[at + i];
    const xi = x[at + i];
    if (!(xi > 0)) {
      if (image > 0 || xi < 0) return NaN;
      continue;
    }
    const ratio = image / xi;
    low = Math.min(low, ratio);
    high = Math.max(high, ratio);
  }
  return high > 0 && high - low <= REPRODUCTION_TOLERANCE * high ? 0.5 * (low + high) : NaN;
}

/**
 * out[i] = the value at today extrapolated from the last `order` + 1 days held in `ring` (four
 * slots of n, yesterday's at `slot`, the day before at `slot` - 1 mod 4, ...): cubic
 * 4 a - 6 b + 4 c - e, quadratic 3 a - 3 b + c, or constant a.
 */
function extrapolate(out: Float64Array, ring: Float64Array, slot: number, order: number, n: number): void {
  const a = slot * n;
  const b = ((slot + 3) & 3) * n;
  const c = ((slot + 2) & 3) * n;
  const e = ((slot + 1) & 3) * n;
  if (order === 3) for (let i = 0; i < n; i++) out[i] = 4 * ring[a + i] - 6 * ring[b + i] + 4 * ring[c + i] - ring[e + i];
  else if (order === 2) for (let i = 0; i < n; i++) out[i] = 3 * ring[a + i] - 3 * ring[b + i] + ring[c + i];
  else for (let i = 0; i < n; i++) out[i] = ring[a + i];
}

/**
 * Days in a row whose product M x may come from extrapolating earlier products rather than from a
 * matrix-vector product. Each extrapolation adds a few units of rounding (its weights sum to 15 in
 * magnitude) and a chain of them grows like its length cubed: 16 days keep the product within
 * about 1e-11 of M x relative, far inside REPRODUCTION_TOLERANCE.
 */
const MAX_EXTRAPOLATED_DAYS = 16;

/** R(t) of `option` (whose realised segments are `segments`); a day whose R cannot be pinned down ends in a RunRefused naming the option and the day (runRefusal.ts). */
export function reproductionByDay(p: PreparedScenario, option: PolicyOption, segments: readonly Segment[], effectiveSusceptible: Float64Array): Float64Array {
  const n = p.bands.bands;
  const H = p.scenario.horizonDays;
  const D = p.periods.infectiousPeriodDays;
  const rt = new Float64Array(H + 1);
  const scale = new Float64Array(n);
  const vector = new Float64Array(n).fill(1 / n);
  const product = new Float64Array(n);
  const work = new Float64Array(5 * n);
  // The last four days' certified vectors and their products M x, in four slots of n; yesterday's in slot `slot`.
  const xs = new Float64Array(4 * n);
  const ps = new Float64Array(4 * n);
  let slot = 0;
  // The option's path for a refusal: looked up once per run, not once per day (a batch may hold thousands of options).
  const at = optionPath(p.scenario.options, option.name);
  let seg = 0;
  let measuresSince = 0;
  let extrapolatedDays = 0;
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
    const today = ((slot + 1) & 3) * n;
    let r = NaN;
    if (d > 0 && !measuresChanged) {
      r = bracketMidpoint(xs, ps, slot * n, scale, n);
      if (Number.isNaN(r)) {
        const order = d - 4 >= measuresSince ? 3 : d - 3 >= measuresSince ? 2 : 0;
        extrapolate(vector, xs, slot, order, n);
        extrapolate(product, ps, slot, order, n);
        if (order > 0 && extrapolatedDays < MAX_EXTRAPOLATED_DAYS) {
          r = bracketMidpoint(vector, product, 0, scale, n);
          if (!Number.isNaN(r)) extrapolatedDays++;
        }
        if (Number.isNaN(r)) {
          let nonNegative = true;
          for (let i = 0; i < n; i++) if (vector[i] < 0) nonNegative = false;
          // The power step from the start is free (its product is known); a start with a negative entry is clipped at 0 instead.
          if (nonNegative) for (let i = 0; i < n; i++) vector[i] = scale[i] * product[i];
          else for (let i = 0; i < n; i++) vector[i] = Math.max(0, vector[i]);
        }
      } else {
        for (let i = 0; i < n; i++) {
          vector[i] = xs[slot * n + i];
          product[i] = ps[slot * n + i];
        }
      }
    }
    if (Number.isNaN(r)) {
      const tolerance = d === 0 ? START_TOLERANCE : REPRODUCTION_TOLERANCE;
      const transmission = segments[seg].transmission;
      r = rootOrRefusal(() => scaledSpectralRadius(transmission, n, scale, vector, product, work, tolerance), at, option.name, `on day ${d}`);
      extrapolatedDays = 0;
    }
    rt[d] = r;
    for (let i = 0; i < n; i++) {
      xs[today + i] = vector[i];
      ps[today + i] = product[i];
    }
    slot = (slot + 1) & 3;
  }
  return rt;
}
