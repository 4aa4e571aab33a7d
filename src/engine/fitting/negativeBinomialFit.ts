/**
 * Negative-binomial (NB2, Var = mu + α mu²) regression with log link, α estimated by maximum
 * likelihood jointly with the coefficients. Alternates (Cameron & Trivedi 2013, Regression
 * Analysis of Count Data, 2nd ed., sec. 3.3; the same scheme as Venables & Ripley 2002, Modern
 * Applied Statistics with S, 4th ed., sec. 7.4):
 *   1. b given α: IRLS with weights mu / (1 + α mu) (`fitLogLinkGlm`);
 *   2. α given the means: one-dimensional maximisation of the NB2 log-likelihood over ln α
 *      (grid bracket then golden section), or α = 0 when the Poisson limit is at least as likely;
 * until the log-likelihood changes by less than 1e-10. b and α are orthogonal in the expected
 * information (Lawless 1987, Can J Stat 15:209), so (Xᵀ W X)^{-1} remains the covariance of b.
 * Why ML rather than the moment estimate: the profile-likelihood interval for r needs the full
 * likelihood maximised at every r, and ML makes the interval and the point estimate consistent.
 */
import { countFamily } from './countLikelihoods.ts';
import { fitLogLinkGlm, type GlmData, type GlmFit } from './logLinkGlm.ts';

export type NegativeBinomialResult = { ok: true; fit: GlmFit; alpha: number } | { ok: false; reason: string };

const LN_ALPHA_MIN = Math.log(1e-8);
const LN_ALPHA_MAX = Math.log(1e3);
const GOLDEN = (Math.sqrt(5) - 1) / 2;

/** The α >= 0 maximising the NB2 log-likelihood of y at fixed means mu. */
export function maximumLikelihoodAlpha(y: readonly number[], mu: readonly number[]): number {
  const ll = (lnAlpha: number): number => countFamily(Math.exp(lnAlpha)).logLikelihood(y, mu);
  const steps = 44;
  const h = (LN_ALPHA_MAX - LN_ALPHA_MIN) / steps;
  let best = 0;
  let bestLl = -Infinity;
  for (let k = 0; k <= steps; k++) {
    const v = ll(LN_ALPHA_MIN + k * h);
    if (v > bestLl) [best, bestLl] = [k, v];
  }
  let lo = LN_ALPHA_MIN + Math.max(0, best - 1) * h;
  let hi = LN_ALPHA_MIN + Math.min(steps, best + 1) * h;
  let c = hi - GOLDEN * (hi - lo);
  let d = lo + GOLDEN * (hi - lo);
  let fc = ll(c);
  let fd = ll(d);
  // Each step keeps 0.618 of the bracket: 100 steps narrow it by 1e-21, far below 1e-9 of its width.
  for (let step = 0; step < 100 && hi - lo > 1e-9; step++) {
    if (fc >= fd) {
      [hi, d, fd] = [d, c, fc];
      c = hi - GOLDEN * (hi - lo);
      fc = ll(c);
    } else {
      [lo, c, fc] = [c, d, fd];
      d = lo + GOLDEN * (hi - lo);
      fd = ll(d);
    }
  }
  const lnAlpha = 0.5 * (lo + hi);
  const poissonLl = countFamily(0).logLikelihood(y, mu);
  return poissonLl >= ll(lnAlpha) ? 0 : Math.exp(lnAlpha);
}

/** Joint ML fit of b and α. */
export function fitNegativeBinomial(data: GlmData): NegativeBinomialResult {
  let alpha = 0;
  let previous = -Infinity;
  for (let round = 0; round < 200; round++) {
    const glm = fitLogLinkGlm(data, countFamily(alpha));
    if (!glm.ok) return glm;
    alpha = maximumLikelihoodAlpha(data.y, glm.fit.mu);
    const ll = countFamily(alpha).logLikelihood(data.y, glm.fit.mu);
    if (Math.abs(ll - previous) <= 1e-10 * (Math.abs(ll) + 0.1)) {
      const final = fitLogLinkGlm(data, countFamily(alpha));
      return final.ok ? { ok: true, fit: final.fit, alpha } : final;
    }
    previous = ll;
  }
  return { ok: false, reason: 'the negative-binomial fit did not converge in 200 rounds' };
}
