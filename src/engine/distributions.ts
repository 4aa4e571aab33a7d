/**
 * Delay distributions: gamma CDF and its daily discretisation.
 *
 * Gamma with mean mu (days) and shape k: rate k/mu, CDF F(x) = P(k, k x / mu), where P is the
 * regularised lower incomplete gamma function, computed by its series for x < a + 1 and its
 * continued fraction otherwise (Press, Teukolsky, Vetterling & Flannery 2007, Numerical Recipes,
 * 3rd ed., section 6.2). ln Gamma by the Lanczos approximation (g = 7, n = 9 coefficients;
 * Lanczos 1964, SIAM J Numer Anal B 1:86; coefficients as commonly tabulated, from memory,
 * checked against Gamma(n) = (n-1)! in test/engine/distributions.test.ts).
 */
import { pairedConvolution } from './pairedConvolution.ts';

const LANCZOS = [
  0.99999999999980993, 676.5203681218851, -1259.1392167224028, 771.32342877765313, -176.61502916214059,
  12.507343278686905, -0.13857109526572012, 9.9843695780195716e-6, 1.5056327351493116e-7,
];

/** ln Gamma(x) for x > 0. */
export function logGamma(x: number): number {
  if (x < 0.5) return Math.log(Math.PI / Math.sin(Math.PI * x)) - logGamma(1 - x);
  const z = x - 1;
  let a = LANCZOS[0];
  const t = z + 7.5;
  for (let i = 1; i < 9; i++) a += LANCZOS[i] / (z + i);
  return 0.5 * Math.log(2 * Math.PI) + (z + 0.5) * Math.log(t) - t + Math.log(a);
}

/** Regularised lower incomplete gamma P(a, x) = gamma(a, x) / Gamma(a), a > 0, x >= 0. */
export function regularizedLowerGamma(a: number, x: number): number {
  if (x <= 0) return 0;
  const lnPrefix = a * Math.log(x) - x - logGamma(a);
  // Past the range of double precision (a shape near 1e300) the gamma is a point mass at its mean.
  if (!Number.isFinite(lnPrefix)) return x < a ? 0 : 1;
  if (x < a + 1) {
    let term = 1 / a;
    let sum = term;
    for (let n = 1; n < 1000; n++) {
      term *= x / (a + n);
      sum += term;
      if (Math.abs(term) < Math.abs(sum) * 1e-16) break;
    }
    return Math.min(1, sum * Math.exp(lnPrefix));
  }
  // Lentz's continued fraction for Q(a, x).
  const tiny = 1e-300;
  let b = x + 1 - a;
  let c = 1 / tiny;
  let d = 1 / b;
  let h = d;
  for (let i = 1; i < 1000; i++) {
    const an = -i * (i - a);
    b += 2;
    d = an * d + b;
    if (Math.abs(d) < tiny) d = tiny;
    c = b + an / c;
    if (Math.abs(c) < tiny) c = tiny;
    d = 1 / d;
    const delta = d * c;
    h *= delta;
    if (Math.abs(delta - 1) < 1e-16) break;
  }
  return Math.max(0, 1 - Math.exp(lnPrefix) * h);
}

/**
 * CDF of a gamma delay with mean `meanDays` and `shape` at x days. A mean below 1e-9 days (about
 * 0.1 ms) is treated as a point mass at 0, which also keeps shape x / mean from overflowing.
 */
export function gammaCdf(x: number, meanDays: number, shape: number): number {
  if (meanDays < 1e-9) return x >= 0 ? 1 : 0;
  return regularizedLowerGamma(shape, (shape * x) / meanDays);
}

/**
 * Daily weights w_k = P(delay falls on day k after the day of the event), k = 0..length-1,
 * with events taken at mid-day: w_0 = F(0.5), w_k = F(k + 0.5) - F(k - 0.5).
 * The weights sum to F(length - 0.5) <= 1; the rest falls beyond the horizon.
 */
export function dailyDelayWeights(meanDays: number, shape: number, length: number): Float64Array {
  const w = new Float64Array(length);
  let previous = 0;
  for (let k = 0; k < length; k++) {
    const f = gammaCdf(k + 0.5, meanDays, shape);
    w[k] = Math.max(0, f - previous);
    previous = f;
  }
  return w;
}

/**
 * Discrete convolution of a daily series with delay weights: out[d] = sum_{a <= d} x[a] w[d - a].
 * Weights below 1e-16 at the tail are skipped.
 */
export function convolve(series: Float64Array, weights: Float64Array): Float64Array {
  return convolveInto(new Float64Array(series.length), series, weights);
}

/**
 * `convolve` written into `out` (length of `series`), which it returns.
 *
 * Each day's sum runs over a ascending from max(0, d - K + 1) to d (K the used kernel length),
 * with one accumulator per day: the order healthcare/online.ts uses, so a trigger reads the same
 * bits. Four consecutive days are summed together (register blocking, common practice): each
 * x[a] and each weight is loaded once for four products and the four accumulators are
 * independent, so the floating-point adds overlap (about three times the day-by-day loop's
 * speed); every day keeps its own sum in its own order, so the result equals the day-by-day loop
 * bit for bit (test/engine/postprocessing.test.ts). Where WebAssembly's two-double lanes are
 * available (pairedConvolution.ts), a series of finite values goes through them instead, with the
 * same sums in the same order, at about twice the speed again.
 */
export function convolveInto(out: Float64Array, series: Float64Array, weights: Float64Array): Float64Array {
  const days = series.length;
  const K = usedLength(weights);
  const lanes = days >= LANE_MINIMUM_DAYS && K >= 4 ? pairedConvolution() : null;
  if (lanes !== null && lanes(out, series, weights, K)) return out;
  return scalarConvolveInto(out, series, weights, K);
}

/** Series shorter than this are convolved by the scalar loop (the lanes' copying is not worth it). */
const LANE_MINIMUM_DAYS = 16;

/** `convolveInto` without the lanes, over the first K weights: the reference the lanes must equal. */
export function scalarConvolveInto(out: Float64Array, series: Float64Array, weights: Float64Array, K = usedLength(weights)): Float64Array {
  const days = series.length;
  let d = 0;
  if (K >= 4) {
    for (; d + 3 < days; d += 4) {
      let s0 = 0;
      let s1 = 0;
      let s2 = 0;
      let s3 = 0;
      // Day d + j sums a from d + j - K + 1: before d + 3 - K + 1 only days d .. d + 2 have terms.
      const first = d - K + 1;
      let a = first > 0 ? first : 0;
      const allFour = first + 3 > 0 ? first + 3 : 0;
      for (; a < allFour; a++) {
        const x = series[a];
        const k = d - a;
        s0 += x * weights[k];
        if (k + 1 < K) s1 += x * weights[k + 1];
        if (k + 2 < K) s2 += x * weights[k + 2];
      }
      if (a <= d) {
        // Walking a up walks k = d - a down: each weight serves four days in turn, held in
        // registers (w1..w3) instead of loaded four times.
        let k = d - a;
        let w1 = weights[k + 1];
        let w2 = weights[k + 2];
        let w3 = weights[k + 3];
        for (; a <= d; a++, k--) {
          const x = series[a];
          const w0 = weights[k];
          s0 += x * w0;
          s1 += x * w1;
          s2 += x * w2;
          s3 += x * w3;
          w3 = w2;
          w2 = w1;
          w1 = w0;
        }
      }
      const x1 = series[d + 1];
      const x2 = series[d + 2];
      s1 += x1 * weights[0];
      s2 += x1 * weights[1];
      s3 += x1 * weights[2];
      s2 += x2 * weights[0];
      s3 += x2 * weights[1];
      s3 += series[d + 3] * weights[0];
      out[d] = s0;
      out[d + 1] = s1;
      out[d + 2] = s2;
      out[d + 3] = s3;
    }
  }
  for (; d < days; d++) {
    let acc = 0;
    for (let a = d - K + 1 > 0 ? d - K + 1 : 0; a <= d; a++) acc += series[a] * weights[d - a];
    out[d] = acc;
  }
  return out;
}

/** Index past the last weight of at least 1e-16 (the tail `convolve` skips). */
function usedLength(weights: Float64Array): number {
  let last = weights.length;
  while (last > 0 && weights[last - 1] < 1e-16) last--;
  return last;
}
