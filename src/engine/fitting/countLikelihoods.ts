/**
 * Log-likelihoods and variance functions of the two count models, with mean mu > 0:
 *
 *  Poisson:  ln L = sum_i [ y_i ln mu_i - mu_i - ln y_i! ],                    Var(y) = mu.
 *  NB2:      ln L = sum_i [ ln Γ(y_i + θ) - ln Γ(θ) - ln y_i! - θ ln(1 + mu_i/θ)
 *                         + y_i ln(mu_i / (θ + mu_i)) ],  θ = 1/α,               Var(y) = mu + α mu².
 * (Cameron & Trivedi 2013, Regression Analysis of Count Data, 2nd ed., sec. 3.3; "NB2" is their
 * name for the quadratic-variance form.) α = 0 is the Poisson limit.
 *
 * The terms that depend on y alone are the same at every evaluation of a fit: a `CountTable`
 * holds ln y_i! per day once, and the distinct counts, so that ln Γ(y + θ) - ln Γ(θ) - ln y! is
 * computed once per distinct count and evaluation (a long daily series repeats its counts) instead
 * of once per day. The sum still runs day by day in the same order as without the table: with
 * counts near 10⁶ each day's terms are near 10⁷ and cancel to a few units, so summing the parts
 * separately would lose the digits the fit's convergence test needs.
 */
import { logGamma } from '../distributions.ts';

/**
 * ln Γ(θ + y) - ln Γ(θ) for θ > 0 and whole y >= 0, accurate also for huge θ (α near 0), where
 * the plain difference of two large ln Γ values would cancel. For θ >= 10 it uses Stirling's series
 * ln Γ(x) = (x - 1/2) ln x - x + ln √(2π) + 1/(12x) - 1/(360x³) + 1/(1260x⁵) - ... written as a
 * difference with log1p (Abramowitz & Stegun 1964, Handbook of Mathematical Functions, 6.1.41);
 * truncation error below 1e-10.
 */
export function logRisingFactorial(theta: number, y: number): number {
  if (y === 0) return 0;
  if (theta < 10) return logGamma(theta + y) - logGamma(theta);
  const x = theta + y;
  return (theta - 0.5) * Math.log1p(y / theta) + y * Math.log(x) - y + stirlingTail(x) - stirlingTail(theta);
}

/** 1/(12z) - 1/(360z³) + 1/(1260z⁵): the tail of Stirling's series for ln Γ(z). */
function stirlingTail(z: number): number {
  const z2 = z * z;
  return 1 / (12 * z) - 1 / (360 * z * z2) + 1 / (1260 * z * z2 * z2);
}

/** ln y! for whole y >= 0. */
export function logFactorial(y: number): number {
  return y < 2 ? 0 : logGamma(y + 1);
}

/** The parts of the log-likelihood that depend on the counts y alone (see the module comment). */
export interface CountTable {
  /** The counts this table was made from (the same array, not a copy). */
  y: readonly number[];
  /** ln y_i! for each day. */
  logFactorials: Float64Array;
  /** The distinct counts, and for each day the index of its count among them. */
  values: number[];
  valueIndex: Int32Array;
}

export function countTable(y: readonly number[]): CountTable {
  const indexOf = new Map<number, number>();
  const values: number[] = [];
  const valueIndex = new Int32Array(y.length);
  const logFactorials = new Float64Array(y.length);
  for (let i = 0; i < y.length; i++) {
    let k = indexOf.get(y[i]);
    if (k === undefined) {
      k = values.length;
      indexOf.set(y[i], k);
      values.push(y[i]);
    }
    valueIndex[i] = k;
    logFactorials[i] = logFactorial(y[i]);
  }
  return { y, logFactorials, values, valueIndex };
}

let evaluations = 0;

/**
 * Log-likelihood evaluations (one per call of a family's `logLikelihood` or of
 * `alphaScore`, whatever the number of counts) by every fit so far in this realm: a deterministic
 * measure of the fit's work, for work budgets in tests (never timings).
 */
export function likelihoodEvaluationsSoFar(): number {
  return evaluations;
}

/** A count model's variance function and log-likelihood (α = 0: Poisson). */
export interface CountFamily {
  /** NB2 dispersion α >= 0 (per case); 0 means Poisson. */
  alpha: number;
  variance(mu: number): number;
  logLikelihood(y: readonly number[], mu: readonly number[]): number;
}

/**
 * Poisson (α = 0) or NB2 with dispersion α > 0. With `table` (made from the same y array that is
 * later passed in) the y-only terms come from the table; any other y is summed term by term.
 */
export function countFamily(alpha: number, table?: CountTable): CountFamily {
  const tableFor = (y: readonly number[]): CountTable | null => (table !== undefined && table.y === y ? table : null);
  if (alpha === 0) {
    return {
      alpha,
      variance: (mu) => mu,
      logLikelihood(y, mu) {
        evaluations++;
        const t = tableFor(y);
        let ll = 0;
        for (let i = 0; i < y.length; i++) ll += (y[i] === 0 ? 0 : y[i] * Math.log(mu[i])) - mu[i] - (t === null ? logFactorial(y[i]) : t.logFactorials[i]);
        return ll;
      },
    };
  }
  const theta = 1 / alpha;
  return {
    alpha,
    variance: (mu) => mu + alpha * mu * mu,
    logLikelihood(y, mu) {
      evaluations++;
      const t = tableFor(y);
      // ln Γ(v + θ) - ln Γ(θ) - ln v! once per distinct count v.
      const perValue = t === null ? null : t.values.map((v) => logRisingFactorial(theta, v) - logFactorial(v));
      let ll = 0;
      for (let i = 0; i < y.length; i++) {
        const yi = y[i];
        const countTerms = t === null || perValue === null ? logRisingFactorial(theta, yi) - logFactorial(yi) : perValue[t.valueIndex[i]];
        ll += countTerms - theta * Math.log1p(mu[i] / theta);
        if (yi > 0) ll += yi * (Math.log(mu[i]) - Math.log(theta + mu[i]));
      }
      return ll;
    },
  };
}

/**
 * ψ(x) for x > 0: ψ(x) = ψ(x + 1) - 1/x up to x >= 16, then the asymptotic series
 * ψ(x) = ln x - 1/(2x) - 1/(12x²) + 1/(120x⁴) - 1/(252x⁶) + 1/(240x⁸) - 1/(132x¹⁰)
 * (Abramowitz & Stegun 1964, 6.3.5 and 6.3.18); its next term, 691/(32760 x¹²), is below 1e-16 there.
 */
export function digamma(x: number): number {
  let shift = 0;
  for (; x < 16; x++) shift -= 1 / x;
  const f = 1 / (x * x);
  return shift + Math.log(x) - 0.5 / x - f * (1 / 12 - f * (1 / 120 - f * (1 / 252 - f * (1 / 240 - f / 132))));
}

/** ψ(θ + v) - ψ(θ) for whole v >= 0: the sum of 1/(θ + k), k < v, for small v, else by `digamma`. */
function digammaRise(theta: number, v: number): number {
  if (v > 64) return digamma(theta + v) - digamma(theta);
  let sum = 0;
  for (let k = v - 1; k >= 0; k--) sum += 1 / (theta + k);
  return sum;
}

/**
 * d ln L / d ln α of NB2 at fixed means, by differentiating ln L above in θ = 1/α (the dispersion
 * score as in Lawless 1987, Can J Stat 15:209; the form here derived, not copied):
 *
 *   d ln L / d ln α = -θ sum_i [ ψ(y_i + θ) - ψ(θ) - ln(1 + mu_i/θ) + (mu_i - y_i) / (θ + mu_i) ].
 *
 * Its root is the α that maximises ln L at these means. Unlike ln L near its maximum, which is
 * flat to within rounding over a range of α, the score crosses zero steeply, so the root is fixed
 * to near double precision whatever the rounding of the terms.
 */
export function alphaScore(alpha: number, table: CountTable, mu: readonly number[]): number {
  evaluations++;
  const theta = 1 / alpha;
  const rise = table.values.map((v) => digammaRise(theta, v));
  let sum = 0;
  for (let i = 0; i < mu.length; i++) sum += rise[table.valueIndex[i]] - Math.log1p(mu[i] / theta) + (mu[i] - table.y[i]) / (theta + mu[i]);
  return -theta * sum;
}
