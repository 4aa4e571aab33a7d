/**
 * Negative-binomial (NB2, Var = mu + α mu²) regression with log link, α estimated by maximum
 * likelihood jointly with the coefficients. Alternates (Cameron & Trivedi 2013, Regression
 * Analysis of Count Data, 2nd ed., sec. 3.3; the same scheme as Venables & Ripley 2002, Modern
 * Applied Statistics with S, 4th ed., sec. 7.4):
 *   1. b given α: IRLS with weights mu / (1 + α mu) (`fitLogLinkGlm`), started from the previous b;
 *   2. α given the means: the maximum of the NB2 log-likelihood over ln α, bracketed either by a
 *      grid over α in [1e-8, 1e3] or, given a previous α, by stepping out from it; inside the
 *      bracket the root of the score d ln L / d ln α (countLikelihoods.ts) by Brent's method
 *      (brentRoot.ts), or Brent's maximum search (brentMaximum.ts) when the maximum is at an end
 *      of the range; α = 0 when the Poisson limit is at least as likely;
 * until the log-likelihood changes by less than 1e-10 (relative). b and α are orthogonal in the
 * expected information (Lawless 1987, Can J Stat 15:209), so (Xᵀ W X)^{-1} remains the covariance
 * of b, and a refit near a known solution (a profile point next to the last) settles in two or
 * three rounds when started from that solution's b and α.
 * Why ML rather than the moment estimate: the profile-likelihood interval for r needs the full
 * likelihood maximised at every r, and ML makes the interval and the point estimate consistent.
 */
import { brentMaximum } from './brentMaximum.ts';
import { brentRoot } from './brentRoot.ts';
import { alphaScore, countFamily, countTable, type CountTable } from './countLikelihoods.ts';
import type { EvaluationBudget } from './fitBudget.ts';
import { fitLogLinkGlm, type GlmData, type GlmFit } from './logLinkGlm.ts';

/** `budget`: true when the fit stopped because its work budget ran out (not a property of the data). */
export type NegativeBinomialResult = { ok: true; fit: GlmFit; alpha: number } | { ok: false; reason: string; budget?: true };

/** A warm start (coefficients and α of a nearby solution), the counts' table and a work budget; all optional. */
export interface NegativeBinomialStart {
  coefficients?: readonly number[];
  alpha?: number;
  table?: CountTable;
  budget?: EvaluationBudget;
}

const LN_ALPHA_MIN = Math.log(1e-8);
const LN_ALPHA_MAX = Math.log(1e3);
const GRID_STEPS = 44;
/** First half-width of the bracket around a previous ln α (ln α moves little between profile points). */
const WARM_STEP = 0.1;
const MAX_ROUNDS = 200;

/** Bracket [lo, hi] of ln α holding a maximum of `ll`, from a grid over the whole range. */
function gridBracket(ll: (lnAlpha: number) => number): [number, number] {
  const h = (LN_ALPHA_MAX - LN_ALPHA_MIN) / GRID_STEPS;
  let best = 0;
  let bestLl = -Infinity;
  for (let k = 0; k <= GRID_STEPS; k++) {
    const v = ll(LN_ALPHA_MIN + k * h);
    if (v > bestLl) [best, bestLl] = [k, v];
  }
  return [LN_ALPHA_MIN + Math.max(0, best - 1) * h, LN_ALPHA_MIN + Math.min(GRID_STEPS, best + 1) * h];
}

/** Bracket [lo, hi] of ln α holding a maximum of `ll`, stepping out (doubling) uphill from `start`. */
function warmBracket(ll: (lnAlpha: number) => number, start: number): [number, number] {
  let step = WARM_STEP;
  let lo = Math.max(LN_ALPHA_MIN, start - step);
  let hi = Math.min(LN_ALPHA_MAX, start + step);
  let mid = start;
  let [fLo, fMid, fHi] = [ll(lo), ll(start), ll(hi)];
  // Each pass doubles the step: the range of ln α (27.6 wide) is crossed within 9 passes.
  while (!(fMid >= fLo && fMid >= fHi)) {
    step *= 2;
    if (fHi > fMid) {
      if (hi >= LN_ALPHA_MAX) return [mid, hi];
      [lo, fLo, mid, fMid] = [mid, fMid, hi, fHi];
      hi = Math.min(LN_ALPHA_MAX, mid + step);
      fHi = ll(hi);
    } else {
      if (lo <= LN_ALPHA_MIN) return [lo, mid];
      [hi, fHi, mid, fMid] = [mid, fMid, lo, fLo];
      lo = Math.max(LN_ALPHA_MIN, mid - step);
      fLo = ll(lo);
    }
  }
  return [lo, hi];
}

/** Thrown inside the α search when the budget runs out; caught by `maximumLikelihoodAlpha`. */
class BudgetSpent extends Error {}

/**
 * The α >= 0 maximising the NB2 log-likelihood of y at fixed means mu, with that log-likelihood;
 * `start` (α > 0 of a nearby fit) skips the grid. Null when the budget runs out.
 */
export function maximumLikelihoodAlpha(
  y: readonly number[],
  mu: readonly number[],
  options: { start?: number; table?: CountTable; budget?: EvaluationBudget } = {},
): { alpha: number; logLikelihood: number } | null {
  const { budget } = options;
  const table = options.table !== undefined && options.table.y === y ? options.table : countTable(y);
  const ll = (lnAlpha: number): number => {
    if (budget?.exhausted) throw new BudgetSpent();
    return countFamily(Math.exp(lnAlpha), table).logLikelihood(y, mu);
  };
  const score = (lnAlpha: number): number => {
    if (budget?.exhausted) throw new BudgetSpent();
    return alphaScore(Math.exp(lnAlpha), table, mu);
  };
  try {
    const start = options.start !== undefined && options.start > 0 ? Math.log(options.start) : null;
    const [lo, hi] = start !== null && start > LN_ALPHA_MIN && start < LN_ALPHA_MAX ? warmBracket(ll, start) : gridBracket(ll);
    const [sLo, sHi] = [score(lo), score(hi)];
    // A maximum inside the bracket: the score falls through zero there. Else (the maximum at an
    // end of the range, or a score that is not a number) search ln L itself.
    const root = sLo > 0 && sHi < 0 ? brentRoot(score, lo, sLo, hi, sHi, 1e-12, 100) : null;
    const lnAlpha = root !== null ? root.x : brentMaximum(ll, lo, hi, 1e-9, 100).x;
    const value = ll(lnAlpha);
    const poissonLl = countFamily(0, table).logLikelihood(y, mu);
    return poissonLl >= value ? { alpha: 0, logLikelihood: poissonLl } : { alpha: Math.exp(lnAlpha), logLikelihood: value };
  } catch (error) {
    if (error instanceof BudgetSpent) return null;
    throw error;
  }
}

/** Joint ML fit of b and α, from `start` when given. */
export function fitNegativeBinomial(data: GlmData, start: NegativeBinomialStart = {}): NegativeBinomialResult {
  const table = start.table ?? countTable(data.y);
  const { budget } = start;
  let alpha = start.alpha ?? 0;
  let coefficients = start.coefficients;
  let previous = -Infinity;
  for (let round = 0; round < MAX_ROUNDS; round++) {
    const glm = fitLogLinkGlm(data, countFamily(alpha, table), { coefficients, budget });
    if (!glm.ok) return glm;
    coefficients = glm.fit.coefficients;
    const found = maximumLikelihoodAlpha(data.y, glm.fit.mu, { start: alpha, table, budget });
    if (found === null) return { ok: false, reason: (budget as EvaluationBudget).reason, budget: true };
    alpha = found.alpha;
    const ll = found.logLikelihood;
    if (Math.abs(ll - previous) <= 1e-10 * (Math.abs(ll) + 0.1)) {
      const final = fitLogLinkGlm(data, countFamily(alpha, table), { coefficients, budget });
      return final.ok ? { ok: true, fit: final.fit, alpha } : final;
    }
    previous = ll;
  }
  return { ok: false, reason: `the negative-binomial fit did not converge in ${MAX_ROUNDS} rounds` };
}
