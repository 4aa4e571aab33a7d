/**
 * Log-likelihoods and variance functions of the two count models, with mean mu > 0:
 *
 *  Poisson:  ln L = sum_i [ y_i ln mu_i - mu_i - ln y_i! ],                    Var(y) = mu.
 *  NB2:      ln L = sum_i [ ln Γ(y_i + θ) - ln Γ(θ) - ln y_i! - θ ln(1 + mu_i/θ)
 *                         + y_i ln(mu_i / (θ + mu_i)) ],  θ = 1/α,               Var(y) = mu + α mu².
 * (Cameron & Trivedi 2013, Regression Analysis of Count Data, 2nd ed., sec. 3.3; "NB2" is their
 * name for the quadratic-variance form.) α = 0 is the Poisson limit.
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
  const series = (z: number): number => {
    const z2 = z * z;
    return 1 / (12 * z) - 1 / (360 * z * z2) + 1 / (1260 * z * z2 * z2);
  };
  return (theta - 0.5) * Math.log1p(y / theta) + y * Math.log(x) - y + series(x) - series(theta);
}

/** ln y! for whole y >= 0. */
export function logFactorial(y: number): number {
  return y < 2 ? 0 : logGamma(y + 1);
}

/** A count model's variance function and log-likelihood (α = 0: Poisson). */
export interface CountFamily {
  /** NB2 dispersion α >= 0 (per case); 0 means Poisson. */
  alpha: number;
  variance(mu: number): number;
  logLikelihood(y: readonly number[], mu: readonly number[]): number;
}

/** Poisson (α = 0) or NB2 with dispersion α > 0. */
export function countFamily(alpha: number): CountFamily {
  if (alpha === 0) {
    return {
      alpha,
      variance: (mu) => mu,
      logLikelihood(y, mu) {
        let ll = 0;
        for (let i = 0; i < y.length; i++) ll += (y[i] === 0 ? 0 : y[i] * Math.log(mu[i])) - mu[i] - logFactorial(y[i]);
        return ll;
      },
    };
  }
  const theta = 1 / alpha;
  return {
    alpha,
    variance: (mu) => mu + alpha * mu * mu,
    logLikelihood(y, mu) {
      let ll = 0;
      for (let i = 0; i < y.length; i++) {
        const yi = y[i];
        ll += logRisingFactorial(theta, yi) - logFactorial(yi) - theta * Math.log1p(mu[i] / theta);
        if (yi > 0) ll += yi * (Math.log(mu[i]) - Math.log(theta + mu[i]));
      }
      return ll;
    },
  };
}
