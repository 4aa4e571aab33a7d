/**
 * Growth rate r and reproduction number R, linked through the generation interval.
 *
 * Euler-Lotka: 1 = R * M(r), where M(r) = ∫ e^{-r t} w(t) dt is the Laplace transform of the
 * generation-interval density w (Wallinga & Lipsitch 2007, Proc R Soc B 274:599).
 * For SEIR with Erlang latent (k_E stages, mean T_E) and infectious (k_I stages, mean T_I)
 * periods, infectiousness is constant while infectious, so w(t) = P(infectious at t) / T_I and
 *
 *   M(r) = (1 + r T_E / k_E)^{-k_E} * (1 - (1 + r T_I / k_I)^{-k_I}) / (r T_I).
 *
 * With one stage each this is R = (1 + r T_E)(1 + r T_I) = (1 + r/sigma)(1 + r/gamma),
 * Wallinga & Lipsitch's eq. for SEIR. Because every age band shares the same periods, the leading
 * eigenvalue of the linearised age-structured infected subsystem equals the r solving
 * rho(K) M(r) = 1 (tested against a direct eigen computation in test/engine/ngm.test.ts).
 */
import type { Scenario } from './scenario.ts';

/** The periods that shape the generation interval (days, stage counts). */
export interface Periods {
  latentPeriodDays: number;
  infectiousPeriodDays: number;
  latentStages: number;
  infectiousStages: number;
}

/** The periods of a scenario's disease. */
export function periodsOf(s: Scenario): Periods {
  const d = s.disease;
  return {
    latentPeriodDays: d.latentPeriodDays,
    infectiousPeriodDays: d.infectiousPeriodDays,
    latentStages: d.latentStages,
    infectiousStages: d.infectiousStages,
  };
}

/** Slowest possible decay: growth rates must exceed -min(k_E/T_E, k_I/T_I), per day. */
export function lowestGrowthRate(p: Periods): number {
  return -Math.min(p.latentStages / p.latentPeriodDays, p.infectiousStages / p.infectiousPeriodDays);
}

/** M(r): Laplace transform of the generation-interval density at r (per day); dimensionless. */
export function generationIntervalTransform(r: number, p: Periods): number {
  const { latentPeriodDays: te, infectiousPeriodDays: ti, latentStages: ke, infectiousStages: ki } = p;
  const latent = Math.pow(1 + (r * te) / ke, -ke);
  const x = r * ti;
  // (1 - (1 + x/k)^-k) / x, with its series 1 - x (k+1)/(2k) near x = 0 to avoid cancellation.
  const infectious = Math.abs(x) < 1e-6 ? 1 - (x * (ki + 1)) / (2 * ki) : (1 - Math.pow(1 + x / ki, -ki)) / x;
  return latent * infectious;
}

/** R = 1 / M(r): the reproduction number that gives growth rate r (per day). */
export function reproductionNumberFromGrowthRate(r: number, p: Periods): number {
  return 1 / generationIntervalTransform(r, p);
}

/**
 * The growth rate r (per day) at which R M(r) = 1, by bisection (M is strictly decreasing).
 * R = 0 gives the slowest decay rate, the limit of r as R -> 0.
 */
export function growthRateFromR(reproductionNumber: number, p: Periods): number {
  const floor = lowestGrowthRate(p);
  if (!(reproductionNumber > 0)) return floor;
  const target = 1 / reproductionNumber;
  let lo = floor;
  let hi = 1;
  // M(r) falls to 0 as r grows; 2^1100 overflows double precision, so the loop always ends.
  for (let k = 0; k < 1100 && generationIntervalTransform(hi, p) > target; k++) hi *= 2;
  for (let k = 0; k < 200 && hi - lo > 1e-14 * Math.max(1, Math.abs(hi)); k++) {
    const mid = 0.5 * (lo + hi);
    if (mid === lo || mid === hi) break;
    if (generationIntervalTransform(mid, p) > target) lo = mid;
    else hi = mid;
  }
  return 0.5 * (lo + hi);
}

/** Doubling time ln 2 / r in days when growing (r > 0), else null. */
export function doublingTimeDays(r: number): number | null {
  return r > 0 ? Math.LN2 / r : null;
}

/** Halving time ln 2 / -r in days when shrinking (r < 0), else null. */
export function halvingTimeDays(r: number): number | null {
  return r < 0 ? Math.LN2 / -r : null;
}
