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
 * Log-likelihood evaluations (one per call of a family's `logLikelihood`, whatever the number of
 * counts) by every fit so far in this realm: a deterministic measure of the fit's work, for work
 * budgets in tests (never timings).
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
