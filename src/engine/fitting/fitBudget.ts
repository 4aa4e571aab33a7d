/**
 * How much work a count fit may do before it stops and says so, counted in log-likelihood
 * evaluations (`likelihoodEvaluationsSoFar`, each one pass over the counts) and profile refits, so
 * that the bound is the same on every machine. Measured on seeded series of 2 to 10,000 days
 * (test/engine/fitting/fitWork.test.ts, and 400 random series of 2 to 400 days): the
 * negative-binomial fit itself takes 90 to 250 evaluations; a warm-started profile refit 30 to
 * 50, up to a few hundred far out in the tail of a short series, where b and α are far from
 * orthogonal and the alternation creeps; each end of the interval 6 refits; the worst whole fit
 * 3,400. The caps are well above that (common practice: far above what a fit that settles needs,
 * far below a run that looks hung; no source). Together they bound a fit at 4,000 + 2 × 5,000
 * evaluations; at 10,000 days, where the usual 500 took 0.35 s (0.7 ms each, with the IRLS
 * steps between them, on a shared 2-core machine), that is about 10 s at most.
 */
import { likelihoodEvaluationsSoFar } from './countLikelihoods.ts';

/** Evaluations allowed to the maximum-likelihood fit itself (all rounds of b and α). */
export const FIT_EVALUATIONS = 4000;
/** Evaluations allowed to all refits for one end of the profile interval, the growth rate held at each point in turn. */
export const PROFILE_EVALUATIONS_PER_SIDE = 5000;
/** Refits allowed to find one end of the profile interval (bracket and root search together; 6 is usual). */
export const PROFILE_REFITS_PER_SIDE = 60;

/** A limit on log-likelihood evaluations from the moment it is made. */
export class EvaluationBudget {
  private readonly until: number;

  /** `reason`: the sentence a fit that stops here reports ("the fit did not settle within 4000 likelihood evaluations"). */
  constructor(
    readonly limit: number,
    readonly reason = `the fit did not settle within ${limit} likelihood evaluations`,
  ) {
    this.until = likelihoodEvaluationsSoFar() + limit;
  }

  get exhausted(): boolean {
    return likelihoodEvaluationsSoFar() >= this.until;
  }
}
