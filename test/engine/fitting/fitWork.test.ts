/**
 * The growth fit with warm-started profile refits (growthProfile.ts, Brent's root search in
 * profileInterval.ts, the counts' table in countLikelihoods.ts) gives the results of the slow path
 * it replaced, with bounded work counted in likelihood evaluations and refits (never timings).
 *
 * SLOW_PATH values: fitGrowth of commit e08b3f9 (every profile point refitted from scratch, α
 * searched over its whole grid in every round, bisection of each interval end to 1e-10), run with
 * `node --import tsx` on `referenceSeries()` (the same seeded series) and printed with
 * JSON.stringify, so at full double precision. The 10,000-day series took 20.5 s there.
 */
import { describe, expect, it } from 'vitest';
import { countTable, likelihoodEvaluationsSoFar } from '../../../src/engine/fitting/countLikelihoods.ts';
import { fitGrowth, type GrowthFit } from '../../../src/engine/fitting/fitGrowth.ts';
import { growthDesign } from '../../../src/engine/fitting/growthDesign.ts';
import { growthRateProfileInterval } from '../../../src/engine/fitting/growthProfile.ts';
import { fitNegativeBinomial } from '../../../src/engine/fitting/negativeBinomialFit.ts';
import { longOverdispersedSeries, referenceSeries } from './referenceSeries.ts';

interface SlowPathValues {
  r: number;
  se: number;
  interval: [number, number];
  alpha: number | null;
  logLikelihood: number;
}

const SLOW_PATH: Record<string, SlowPathValues> = {
  '28 days, alpha 0.1, negative binomial': { r: 0.061350717433514244, se: 0.007077127596737848, interval: [0.047206397884415496, 0.07554115799392944], alpha: 0.07692155110561359, logLikelihood: -128.99040922467407 },
  '28 days, alpha 0.1, Poisson': { r: 0.0635206914607489, se: 0.002617755930895203, interval: [0.058409567784844074, 0.06867180456111599], alpha: null, logLikelihood: -192.2028006861418 },
  '120 days, weekday pattern, alpha 0.5': { r: 0.016389301213986834, se: 0.0018188617369189132, interval: [0.012845365676813623, 0.01995573247567551], alpha: 0.45871462939053187, logLikelihood: -631.5793437850454 },
  '45 days falling, alpha 0.8': { r: -0.03693722642348344, se: 0.009355261941310993, interval: [-0.057203882595076624, -0.016696132533374472], alpha: 0.6469757636984486, logLikelihood: -234.34686795880347 },
  '2,000 days, alpha 1.5': { r: 0.0010072324097523196, se: 0.00004748422459756082, interval: [0.0009124720427677634, 0.001102076643603898], alpha: 1.479473929204756, logLikelihood: -9960.46091141746 },
  '6 days of few cases, alpha 2': { r: -1.1265272074995067, se: 0.6374611438450685, interval: [-7.285024976106239, 1.2628925389611947], alpha: 3.1519702379796053, logLikelihood: -8.902635157053888 },
  '500 days near a million cases a day, alpha 0.01': { r: 0.0009909747097064524, se: 0.000031851026916375653, interval: [0.0009285935347660833, 0.0010533569174140363], alpha: 0.010566745901261682, logLikelihood: -6602.278092769534 },
  '10,000 days, weekday pattern, alpha 2': { r: 0.0001976942842051019, se: 0.000004938436097056203, interval: [0.00018792445315594605, 0.00020746562234535184], alpha: 2.0024462253201225, logLikelihood: -46692.21683934664 },
};

/**
 * How far the fast path may differ, set by the fits' own tolerances: r and the ends of its
 * interval to a millionth of a standard error (the ends also to 1e-10/day, the root search's
 * tolerance as it was the bisection's); ln L to 1e-10 of itself plus its rounding, 1e-15 of the
 * day terms y ln y that cancel in it (near 10⁷ a day for a million cases a day). α and the
 * standard error to 1e-5 relative: ln L is flat in α, so that rounding moves its maximum by that
 * much; for the million-a-day series 1e-4.
 */
function expectSlowPathResult(fit: GrowthFit, name: string, count: readonly number[]): void {
  const want = SLOW_PATH[name];
  const alphaTolerance = name.includes('million') ? 1e-4 : 1e-5;
  const rounding = 1e-15 * count.reduce((s, y) => s + y * Math.log1p(y), 0);
  expect(Math.abs(fit.growthRatePerDay - want.r)).toBeLessThanOrEqual(1e-6 * want.se);
  for (const k of [0, 1]) expect(Math.abs(fit.growthRateInterval[k] - want.interval[k])).toBeLessThanOrEqual(1e-10 + 1e-6 * want.se);
  expect(fit.growthRateIntervalNotDetermined).toEqual([null, null]);
  expect(Math.abs(fit.growthRateStandardError - want.se)).toBeLessThanOrEqual(alphaTolerance * want.se);
  expect(Math.abs(fit.logLikelihood - want.logLikelihood)).toBeLessThanOrEqual(1e-10 * Math.abs(want.logLikelihood) + rounding);
  const alpha = fit.dispersion.negativeBinomialAlpha;
  if (want.alpha === null) expect(alpha).toBeNull();
  else expect(Math.abs((alpha as number) - want.alpha)).toBeLessThanOrEqual(alphaTolerance * want.alpha);
}

describe('growth fit with warm-started profile refits', () => {
  // The 10,000-day series is compared in the work test below (one fit of it is enough).
  const shorter = referenceSeries().filter((s) => s.day.length < 10000);
  it.each(shorter.map((s) => [s.name, s] as const))('gives the slow path’s estimates and interval: %s', (name, series) => {
    const result = fitGrowth({ day: series.day, count: series.count }, series.options);
    if (!result.ok) throw new Error(JSON.stringify(result.problems));
    expectSlowPathResult(result.fit, name, series.count);
  });

  it('fits 10,000 overdispersed days as the slow path did, within 800 likelihood evaluations and 16 profile refits', () => {
    const series = longOverdispersedSeries(10000);
    const before = likelihoodEvaluationsSoFar();
    const result = fitGrowth({ day: series.day, count: series.count }, series.options);
    const evaluations = likelihoodEvaluationsSoFar() - before;
    if (!result.ok) throw new Error(JSON.stringify(result.problems));
    // The slow path took 11,597 evaluations here (about 90 for α alone in each round of each refit),
    // each one twice as costly per day (two ln Γ per day); this one about 500.
    expect(evaluations).toBeLessThanOrEqual(800);
    expectSlowPathResult(result.fit, series.name, series.count);

    // The profile alone, from the same maximum-likelihood fit: 2 refits to bracket each end, a few to find it.
    const design = growthDesign(series.day, 0, true);
    const table = countTable(series.count);
    const main = fitNegativeBinomial({ x: design.x, y: series.count, offset: series.day.map(() => 0) }, { table });
    if (!main.ok) throw new Error(main.reason);
    const fromRefits = likelihoodEvaluationsSoFar();
    const profile = growthRateProfileInterval({
      design,
      y: series.count,
      table,
      negativeBinomial: true,
      coefficients: main.fit.coefficients,
      alpha: main.alpha,
      logLikelihood: main.fit.logLikelihood,
      standardError: Math.sqrt(main.fit.covariance[1][1]),
    });
    expect(profile.interval).toEqual(result.fit.growthRateInterval);
    expect(profile.refits).toBeLessThanOrEqual(16);
    expect((likelihoodEvaluationsSoFar() - fromRefits) / profile.refits).toBeLessThanOrEqual(50);
  });
});
