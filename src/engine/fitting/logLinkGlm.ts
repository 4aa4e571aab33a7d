/**
 * Maximum-likelihood fit of a count regression with log link, ln mu_i = offset_i + x_i·b,
 * by iteratively reweighted least squares (Fisher scoring; McCullagh & Nelder 1989, Generalized
 * Linear Models, 2nd ed., sec. 2.5):
 *
 *   working response  z_i = x_i·b + (y_i - mu_i) / mu_i,
 *   working weight    w_i = mu_i² / Var(mu_i)   (= mu_i for Poisson, mu_i / (1 + α mu_i) for NB2),
 *   next b solves     (Xᵀ W X) b = Xᵀ W z,
 *
 * started from mu_i = y_i + 0.1, or from given coefficients (a warm start: a refit near a known
 * solution), and repeated until no coefficient changes by more than 1e-10 (1 + |b_j|). A step
 * that lowers the log-likelihood (beyond rounding) is halved (up to 30 times). The covariance of b
 * is the inverse expected information (Xᵀ W X)^{-1} at the optimum.
 * Units: b per unit of the design columns (slope on day: per day).
 */
import { choleskyFactor, choleskyInverse, choleskySolve } from './cholesky.ts';
import type { CountFamily } from './countLikelihoods.ts';
import type { EvaluationBudget } from './fitBudget.ts';

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

/** `budget`: true when the fit stopped because its work budget ran out (not a property of the data). */
export type GlmResult = { ok: true; fit: GlmFit } | { ok: false; reason: string; budget?: true };

/** Where to start and how much work to allow; both optional. */
export interface GlmStart {
  coefficients?: readonly number[];
  budget?: EvaluationBudget;
}

const MAX_ITERATIONS = 100;

function meansOf(data: GlmData, b: readonly number[]): number[] {
  const mu = new Array<number>(data.y.length);
  for (let i = 0; i < mu.length; i++) {
    const row = data.x[i];
    let eta = data.offset[i];
    for (let j = 0; j < b.length; j++) eta += row[j] * b[j];
    mu[i] = Math.exp(eta);
  }
  return mu;
}

/** Xᵀ W X and Xᵀ W z for the current means. */
function normalEquations(data: GlmData, mu: number[], family: CountFamily): { a: number[][]; rhs: number[] } {
  const p = data.x[0]?.length ?? 0;
  const a = Array.from({ length: p }, () => new Array<number>(p).fill(0));
  const rhs = new Array<number>(p).fill(0);
  for (let i = 0; i < data.y.length; i++) {
    // mu / (Var / mu) rather than mu² / Var: mu² overflows for means past 1e154 (NB2 with α near
    // its upper limit can send the intercept there), and Var / mu = 1 + α mu stays finite longer.
    const w = mu[i] / (family.variance(mu[i]) / mu[i]);
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

/** Fits the log-link count regression; fails (with a reason) when the information matrix is singular, the fit diverges or the budget runs out. */
export function fitLogLinkGlm(data: GlmData, family: CountFamily, start: GlmStart = {}): GlmResult {
  const p = data.x[0]?.length ?? 0;
  const { budget } = start;
  const warm = start.coefficients !== undefined && start.coefficients.length === p ? [...start.coefficients] : null;
  let b: number[] | null = warm;
  let mu = warm === null ? data.y.map((y) => y + 0.1) : meansOf(data, warm);
  let ll = warm === null ? -Infinity : family.logLikelihood(data.y, mu);
  if (!Number.isFinite(ll)) [b, mu, ll] = [null, data.y.map((y) => y + 0.1), -Infinity];
  for (let iter = 1; iter <= MAX_ITERATIONS; iter++) {
    if (budget?.exhausted) return { ok: false, reason: budget.reason, budget: true };
    const { a, rhs } = normalEquations(data, mu, family);
    if (!rhs.every(Number.isFinite) || !a.every((row) => row.every(Number.isFinite))) return { ok: false, reason: 'the fit diverged' };
    const l = choleskyFactor(a);
    if (l === null) return { ok: false, reason: 'the design is singular for these counts (too few days or no cases in a group of days)' };
    let next = choleskySolve(l, rhs);
    let nextMu = meansOf(data, next);
    let nextLl = family.logLikelihood(data.y, nextMu);
    // Halve only a real loss (beyond rounding), so steps near the optimum are never shrunk.
    for (let halving = 0; b !== null && !(nextLl >= ll - 1e-9 * (Math.abs(ll) + 1)) && halving < 30; halving++) {
      if (budget?.exhausted) return { ok: false, reason: budget.reason, budget: true };
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
