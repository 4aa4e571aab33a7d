import { describe, expect, it } from 'vitest';
import { growthRateFromR, type Periods } from '../../../src/engine/growth.ts';
import { fitGrowth, r0FromFit, type GrowthFit } from '../../../src/engine/fitting/index.ts';
import { SeededRandom, expectedCounts } from './seededRandom.ts';

const days = (n: number): number[] => Array.from({ length: n }, (_, t) => t);

function fitted(result: ReturnType<typeof fitGrowth>): GrowthFit {
  if (!result.ok) throw new Error(result.problems.map((p) => `${p.field} ${p.rule}`).join('; '));
  return result.fit;
}

/** SEIR with exponential periods of mean 1/sigma and 1/gamma days. */
const exponential = (latentDays: number, infectiousDays: number): Periods => ({
  latentPeriodDays: latentDays,
  infectiousPeriodDays: infectiousDays,
  latentStages: 1,
  infectiousStages: 1,
});

describe('r0FromFit', () => {
  it('reproduces the Wallinga-Lipsitch example: r = 0.2/day, sigma = gamma = 2/2.85 -> R = 1.65', () => {
    // Wallinga & Lipsitch 2007, Proc R Soc B 274:599: R = (1 + r/sigma)(1 + r/gamma); their example
    // r = 0.2 per day, mean generation interval 2.85 d split equally, R = 1.65 (1.651225 derived).
    // Noise-free counts with r = 0.2: rounding to whole cases at this size moves r by < 1e-7.
    const fit = fitted(fitGrowth({ day: days(15), count: expectedCounts(15, 1e6, 0.2).map(Math.round) }));
    expect(fit.growthRatePerDay).toBeCloseTo(0.2, 6);
    const periods = exponential(2.85 / 2, 2.85 / 2);
    const result = r0FromFit(fit, periods);
    if (!result.ok) throw new Error('unexpected');
    expect(result.value.r0).toBeCloseTo(1.65, 2);
    expect(result.value.r0).toBeCloseTo(1.651225, 5);
    const r = fit.growthRatePerDay;
    const sigma = 2 / 2.85;
    expect(result.value.r0).toBeCloseTo((1 + r / sigma) * (1 + r / sigma), 10);
  });

  it('maps the r interval end to end and round-trips with growthRateFromR (CHECKS item 4)', () => {
    // Wallinga & Lipsitch 2007 formula, derived example: latent 3 d, infectious 5 d, R0 = 2.5 -> r = 0.146989/day.
    const periods = exponential(3, 5);
    const rng = new SeededRandom(21);
    const fit = fitted(fitGrowth({ day: days(20), count: expectedCounts(20, 10, 0.146989).map((m) => rng.poisson(m)) }));
    const result = r0FromFit(fit, periods);
    if (!result.ok) throw new Error('unexpected');
    const { r0, r0Interval } = result.value;
    const [rLo, rHi] = fit.growthRateInterval;
    expect(r0Interval[0]).toBeCloseTo((1 + rLo * 3) * (1 + rLo * 5), 10);
    expect(r0Interval[1]).toBeCloseTo((1 + rHi * 3) * (1 + rHi * 5), 10);
    expect(r0Interval[0]).toBeLessThan(r0);
    expect(r0Interval[1]).toBeGreaterThan(r0);
    expect(growthRateFromR(r0, periods)).toBeCloseTo(fit.growthRatePerDay, 10);
    expect(r0Interval[0]).toBeLessThan(2.5);
    expect(r0Interval[1]).toBeGreaterThan(2.5);
  });

  it('divides out the effect of measures in force during the window, and says so', () => {
    const periods = { latentPeriodDays: 3, infectiousPeriodDays: 5, latentStages: 2, infectiousStages: 2 };
    const fit = fitted(fitGrowth({ day: days(10), count: expectedCounts(10, 50, 0.05).map(Math.round) }));
    const plain = r0FromFit(fit, periods);
    const measured = r0FromFit(fit, periods, 0.6);
    if (!plain.ok || !measured.ok) throw new Error('unexpected');
    expect(measured.value.reproductionNumberInWindow).toBeCloseTo(plain.value.r0, 12);
    expect(measured.value.r0).toBeCloseTo(plain.value.r0 / 0.6, 12);
    expect(measured.value.r0Interval[1]).toBeCloseTo(plain.value.r0Interval[1] / 0.6, 12);
    expect(measured.value.notes.some((n) => n.startsWith('Measures were in force during the window'))).toBe(true);
  });

  it('gives R0 = 0 at a lower r end below the fastest possible decay, and rejects a bad ratio', () => {
    const fit = fitted(fitGrowth({ day: [0, 1], count: [40, 1] }));
    const result = r0FromFit(fit, exponential(3, 5));
    if (!result.ok) throw new Error('unexpected');
    // fastest decay for these periods is -min(1/3, 1/5) = -0.2/day; the two-day fit gives r = ln(1/40)
    expect(fit.growthRateInterval[0]).toBeLessThan(-0.2);
    expect(result.value.r0Interval[0]).toBe(0);
    const bad = r0FromFit(fit, exponential(3, 5), 0);
    expect(bad.ok ? '' : `${bad.problems[0].field} ${bad.problems[0].rule}`).toMatch(/^measuresRatio must be a finite number > 0/);
  });
});
