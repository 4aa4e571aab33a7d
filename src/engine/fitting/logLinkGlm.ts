/**
 * Maximum-likelihood fit of a count regression with log link, ln mu_i = offset_i + x_i·b,
 * by iteratively reweighted least squares (Fisher scoring; McCullagh & Nelder 1989, Generalized
 * Linear Models, 2nd ed., sec. 2.5):
 *
 *   working response  z_i = x_i·b + (y_i - mu_i) / mu_i,
 *   working weight    w_i = mu_i² / Var(mu_i)   (= mu_i for Poisson, mu_i / (1 + α mu_i) for NB2),
 *   next b solves     (Xᵀ W X) b = Xᵀ W z,
 *
 * started from mu_i = y_i + 0.1 and repeated until no coefficient changes by more than
 * 1e-10 (1 + |b_j|). A step that lowers the log-likelihood (beyond rounding) is halved (up to 30 times). The covariance of b
 * is the inverse expected information (Xᵀ W X)^{-1} at the optimum.
 * Units: b per unit of the design columns (slope on day: per day).
 */
import { choleskyFactor, choleskyInverse, choleskySolve } from './cholesky.ts';
import type { CountFamily } from './countLikelihoods.ts';

export interface GlmData {
  /** Design matrix, one row per observation. May have zero columns (offset only). */
  x: number[][];
  y: number[];
  offset: number[];
}

export interface GlmFit {
  coefficients: number[];
  /** (Xᵀ W X)^{-1}: Wald covariance of the coefficients. */
  covariance: number[][];
  mu: number[];
  logLikelihood: number;
  iterations: number;
}

export type GlmResult = { ok: true; fit: GlmFit } | { ok: false; reason: string };

const MAX_ITERATIONS = 100;

function meansOf(data: GlmData, b: number[]): number[] {
  return data.x.map((row, i) => Math.exp(data.offset[i] + row.reduce((s, v, j) => s + v * b[j], 0)));
}

/** Xᵀ W X and Xᵀ W z for the current means. */
function normalEquations(data: GlmData, mu: number[], family: CountFamily): { a: number[][]; rhs: number[] } {
  const p = data.x[0]?.length ?? 0;
  const a = Array.from({ length: p }, () => new Array<number>(p).fill(0));
  const rhs = new Array<number>(p).fill(0);
  for (let i = 0; i < data.y.length; i++) {
    const w = (mu[i] * mu[i]) / family.variance(mu[i]);
    const z = Math.log(mu[i]) - data.offset[i] + (data.y[i] - mu[i]) / mu[i];
    const row = data.x[i];
    for (let j = 0; j < p; j++) {
      rhs[j] += w * row[j] * z;
      for (let k = 0; k <= j; k++) a[j][k] += w * row[j] * row[k];
    }
  }
  for (let j = 0; j < p; j++) for (let k = j + 1; k < p; k++) a[j][k] = a[k][j];
  return { a, rhs };
}

/** Fits the log-link count regression; fails (with a reason) when the information matrix is singular or the fit diverges. */
export function fitLogLinkGlm(data: GlmData, family: CountFamily): GlmResult {
  const p = data.x[0]?.length ?? 0;
  let mu = data.y.map((y) => y + 0.1);
  let b: number[] | null = null;
  let ll = -Infinity;
  for (let iter = 1; iter <= MAX_ITERATIONS; iter++) {
    const { a, rhs } = normalEquations(data, mu, family);
    const l = choleskyFactor(a);
    if (l === null) return { ok: false, reason: 'the design is singular for these counts (too few days or no cases in a group of days)' };
    let next = choleskySolve(l, rhs);
    let nextMu = meansOf(data, next);
    let nextLl = family.logLikelihood(data.y, nextMu);
    // Halve only a real loss (beyond rounding), so steps near the optimum are never shrunk.
    for (let halving = 0; b !== null && !(nextLl >= ll - 1e-9 * (Math.abs(ll) + 1)) && halving < 30; halving++) {
      const prev: number[] = b;
      next = next.map((v, j) => 0.5 * (v + prev[j]));
      nextMu = meansOf(data, next);
      nextLl = family.logLikelihood(data.y, nextMu);
    }
    if (!Number.isFinite(nextLl) || next.some((v) => !Number.isFinite(v))) return { ok: false, reason: 'the fit diverged' };
    const prev = b;
    const done = prev !== null && next.every((v, j) => Math.abs(v - prev[j]) <= 1e-10 * (1 + Math.abs(v)));
    b = next;
    mu = nextMu;
    ll = nextLl;
    if (done || p === 0) {
      const info = normalEquations(data, mu, family).a;
      const lInfo = choleskyFactor(info);
      if (p > 0 && lInfo === null) return { ok: false, reason: 'the information matrix is singular at the fit' };
      return { ok: true, fit: { coefficients: b, covariance: p > 0 ? choleskyInverse(lInfo as number[][]) : [], mu, logLikelihood: ll, iterations: iter } };
    }
  }
  return { ok: false, reason: `the fit did not converge in ${MAX_ITERATIONS} iterations (counts may be all zero at one end of the window)` };
}
