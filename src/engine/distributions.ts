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
  const days = series.length;
  const last = usedLength(weights);
  const out = new Float64Array(days);
  // Day by day, summing over a ascending (the order healthcare/online.ts uses, so a trigger reads
  // the same bits): one accumulator per day instead of a store per product.
  for (let d = 0; d < days; d++) {
    let acc = 0;
    for (let a = d - last + 1 > 0 ? d - last + 1 : 0; a <= d; a++) acc += series[a] * weights[d - a];
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

/**
 * `convolve(x1, w)` and `convolve(x2, w)` in one pass over the weights, the same bits as two calls:
 * two series through the same delay (e.g. admissions of ward-only and ICU patients).
 */
export function convolveTwo(x1: Float64Array, x2: Float64Array, weights: Float64Array): [Float64Array, Float64Array] {
  const days = x1.length;
  const last = usedLength(weights);
  const out1 = new Float64Array(days);
  const out2 = new Float64Array(days);
  for (let d = 0; d < days; d++) {
    let acc1 = 0;
    let acc2 = 0;
    for (let a = d - last + 1 > 0 ? d - last + 1 : 0; a <= d; a++) {
      const w = weights[d - a];
      acc1 += x1[a] * w;
      acc2 += x2[a] * w;
    }
    out1[d] = acc1;
    out2[d] = acc2;
  }
  return [out1, out2];
}
