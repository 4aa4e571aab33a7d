/**
 * The 95% profile-likelihood interval for the growth rate r of a fitted growth regression
 * (profileInterval.ts): ln L_p(r) is the count model refitted with r held fixed, r (t - t̄) moved
 * into the offset. What does not change between profile points is made once: the design without
 * the r column and the counts' table (countLikelihoods.ts). Each refit starts from the solution
 * (other coefficients and NB2 α) at the nearest r already fitted, the estimate itself at first,
 * and the refits for each end share PROFILE_EVALUATIONS_PER_SIDE likelihood evaluations
 * (fitBudget.ts); when they run out, that end is not determined, with the reason.
 */
import { countFamily, type CountTable } from './countLikelihoods.ts';
import { EvaluationBudget, PROFILE_EVALUATIONS_PER_SIDE } from './fitBudget.ts';
import { growthRateFixedDesign, type GrowthDesign } from './growthDesign.ts';
import { fitLogLinkGlm } from './logLinkGlm.ts';
import { fitNegativeBinomial, type NegativeBinomialResult } from './negativeBinomialFit.ts';
import { profileLikelihoodInterval, type ProfileInterval, type ProfileValue } from './profileInterval.ts';

interface Solution {
  r: number;
  /** Coefficients other than r. */
  coefficients: number[];
  alpha: number;
}

export interface GrowthProfileInput {
  design: GrowthDesign;
  y: number[];
  table: CountTable;
  negativeBinomial: boolean;
  /** The maximum-likelihood fit: all coefficients (r second), its α (0 for Poisson), ln L and the Wald SE of r. */
  coefficients: readonly number[];
  alpha: number;
  logLikelihood: number;
  standardError: number;
}

/** The interval for r with the refits it took; see the module comment. */
export function growthRateProfileInterval(input: GrowthProfileInput): ProfileInterval {
  const { y, table, negativeBinomial } = input;
  const fixed = growthRateFixedDesign(input.design);
  const r = input.coefficients[1];
  const solved: Solution[] = [{ r, coefficients: input.coefficients.filter((_, j) => j !== 1), alpha: input.alpha }];
  const nearest = (value: number): Solution => solved.reduce((best, s) => (Math.abs(s.r - value) < Math.abs(best.r - value) ? s : best));

  const budgets = new Map<number, EvaluationBudget>();
  const profile = (value: number, side: -1 | 1): ProfileValue => {
    const start = nearest(value);
    const budget = budgets.get(side) ?? new EvaluationBudget(PROFILE_EVALUATIONS_PER_SIDE, `the refits for this end used up their ${PROFILE_EVALUATIONS_PER_SIDE} likelihood evaluations`);
    budgets.set(side, budget);
    const data = { x: fixed.x, y, offset: fixed.offsetAt(value) };
    let res: NegativeBinomialResult;
    if (negativeBinomial) res = fitNegativeBinomial(data, { coefficients: start.coefficients, alpha: start.alpha, table, budget });
    else {
      const glm = fitLogLinkGlm(data, countFamily(0, table), { coefficients: start.coefficients, budget });
      res = glm.ok ? { ok: true, fit: glm.fit, alpha: 0 } : glm;
    }
    if (!res.ok) return res.budget ? { notSettled: res.reason } : -Infinity;
    solved.push({ r: value, coefficients: res.fit.coefficients, alpha: res.alpha });
    return res.fit.logLikelihood;
  };
  return profileLikelihoodInterval(r, input.logLikelihood, input.standardError, profile, { name: 'r', describe: (v) => `r = ${v.toPrecision(4)} per day` });
}
