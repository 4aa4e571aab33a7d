/**
 * Doubling and halving times from a growth rate and its interval.
 * Doubling time T_d = ln 2 / r for r > 0 (days); halving time ln 2 / (-r) for r < 0.
 * Because ln 2 / r is decreasing in r, the interval [r_lo, r_hi] with r_lo > 0 maps to
 * [ln 2 / r_hi, ln 2 / r_lo]; when the growth interval reaches 0 the far end is unbounded (null).
 */
import { doublingTimeDays, halvingTimeDays } from '../growth.ts';

/** Whether the epidemic grows, shrinks, or neither (r = 0 within the solver tolerance). */
export type GrowthStatus = 'growing' | 'shrinking' | 'not growing';

/** |r| below this (per day; doubling time > 1900 years) is treated as 0: the IRLS tolerance, not a signal. */
export const GROWTH_RATE_TOLERANCE = 1e-9;

export function growthStatus(r: number): GrowthStatus {
  if (r > GROWTH_RATE_TOLERANCE) return 'growing';
  if (r < -GROWTH_RATE_TOLERANCE) return 'shrinking';
  return 'not growing';
}

export interface TimeScales {
  status: GrowthStatus;
  /** ln 2 / r (days) when growing, else null. */
  doublingTimeDays: number | null;
  /** Interval of the doubling time (days); the upper end is null (unbounded) when the r interval reaches 0. */
  doublingTimeInterval: [number, number | null] | null;
  /** ln 2 / (-r) (days) when shrinking, else null. */
  halvingTimeDays: number | null;
  halvingTimeInterval: [number, number | null] | null;
}

/** ln 2 / x over an interval of positive rates [lo, hi] (lo may be <= 0: unbounded end). */
function invertRates(lo: number, hi: number): [number, number | null] {
  return [Math.LN2 / hi, lo > 0 ? Math.LN2 / lo : null];
}

export function timeScales(r: number, interval: readonly [number, number]): TimeScales {
  const status = growthStatus(r);
  const [lo, hi] = interval;
  return {
    status,
    doublingTimeDays: status === 'growing' ? doublingTimeDays(r) : null,
    doublingTimeInterval: status === 'growing' ? invertRates(lo, hi) : null,
    halvingTimeDays: status === 'shrinking' ? halvingTimeDays(r) : null,
    halvingTimeInterval: status === 'shrinking' ? invertRates(-hi, -lo) : null,
  };
}
