/**
 * R0 of the scenario's age-structured model from a fitted growth rate.
 *
 * Every age band shares the latent and infectious periods, so the growth rate of the linearised
 * infected subsystem and the dominant eigenvalue R of the next-generation matrix obey the
 * one-group Euler-Lotka relation R = 1 / M(r) (Wallinga & Lipsitch 2007, Proc R Soc B 274:599;
 * `reproductionNumberFromGrowthRate`), whatever the contact matrix. R(r) is increasing in r, so the
 * interval for r maps to an interval for R end to end. A lower r end at or below the slowest
 * possible decay rate (`lowestGrowthRate`) maps to R = 0.
 *
 * Measures in force during the window: the fit then measures R under measures. With
 * measuresRatio = ρ(K with measures) / ρ(K without measures) (dominant NGM eigenvalues, supplied
 * by the caller), R0 = R_measures / measuresRatio. The same division applies to both ends.
 */
import { lowestGrowthRate, reproductionNumberFromGrowthRate, type Periods } from '../growth.ts';
import type { GrowthFit } from './fitGrowth.ts';

export interface R0FromFit {
  /** Basic reproduction number without measures (dimensionless). */
  r0: number;
  r0Interval: [number, number];
  /** R implied by r for the window itself (under the measures then in force). */
  reproductionNumberInWindow: number;
  reproductionNumberInWindowInterval: [number, number];
  /** The ratio divided out (1 when no measures were in force). */
  measuresRatio: number;
  notes: string[];
}

export type R0FromFitResult = { ok: true; value: R0FromFit } | { ok: false; problems: { field: string; rule: string; value?: string }[] };

/** R = 1 / M(r), or 0 at or below the slowest possible decay rate, +Infinity for r = +Infinity. */
function reproductionNumberAt(r: number, periods: Periods): number {
  if (r === Infinity) return Infinity;
  if (r <= lowestGrowthRate(periods)) return 0;
  return reproductionNumberFromGrowthRate(r, periods);
}

export function r0FromFit(fit: GrowthFit, periods: Periods, measuresRatio?: number): R0FromFitResult {
  const ratio = measuresRatio ?? 1;
  if (!(Number.isFinite(ratio) && ratio > 0)) {
    return { ok: false, problems: [{ field: 'measuresRatio', rule: 'must be a finite number > 0 (dominant NGM eigenvalue with measures / without)', value: String(measuresRatio) }] };
  }
  const rWindow = reproductionNumberAt(fit.growthRatePerDay, periods);
  const [lo, hi] = fit.growthRateInterval;
  const windowInterval: [number, number] = [reproductionNumberAt(lo, periods), reproductionNumberAt(hi, periods)];
  const notes = [
    `R from r by the Euler-Lotka relation for latent ${periods.latentPeriodDays} d (${periods.latentStages} stage(s)) and infectious ${periods.infectiousPeriodDays} d (${periods.infectiousStages} stage(s)) periods, shared by all age bands (Wallinga & Lipsitch 2007).`,
  ];
  if (measuresRatio !== undefined) {
    notes.push(
      `Measures were in force during the window: the fit gives R under measures = ${rWindow.toFixed(3)}; R0 = that / ${ratio.toPrecision(4)} (dominant next-generation-matrix eigenvalue with measures / without).`,
    );
  }
  return {
    ok: true,
    value: {
      r0: rWindow / ratio,
      r0Interval: [windowInterval[0] / ratio, windowInterval[1] / ratio],
      reproductionNumberInWindow: rWindow,
      reproductionNumberInWindowInterval: windowInterval,
      measuresRatio: ratio,
      notes,
    },
  };
}
