/**
 * Bed-day and admission kernels (src/engine/healthcare/kernels.ts): Little's law in steady state,
 * the decay of a single pulse of admissions, and the closed form of the expected time in bed
 * against an independent quadrature.
 */
import { describe, expect, it } from 'vitest';
import { convolve, dailyDelayWeights } from '../../src/engine/distributions.ts';
import { delayKernel, bedDayKernel, expectedTimeInBedBy } from '../../src/engine/healthcare/kernels.ts';

const DAYS = 2000;

/** Survival of an Erlang stay (integer shape k, mean L): e^{-lu} sum_{j<k} (lu)^j / j!, l = k / L. */
function erlangSurvival(u: number, mean: number, shape: number): number {
  const rate = shape / mean;
  let term = 1;
  let sum = 1;
  for (let j = 1; j < shape; j++) {
    term *= (rate * u) / j;
    sum += term;
  }
  return Math.exp(-rate * u) * sum;
}

/** Composite Simpson rule on [a, b] with `m` (even) intervals. */
function simpson(f: (x: number) => number, a: number, b: number): number {
  const m = 2 * Math.ceil(500 * (b - a));
  const h = (b - a) / m;
  let s = f(a) + f(b);
  for (let j = 1; j < m; j++) s += (j % 2 === 1 ? 4 : 2) * f(a + j * h);
  return (s * h) / 3;
}

describe('bed-day kernel', () => {
  it.each([
    [8, 2],
    [10, 1],
    [6.5, 3.7],
    [0.4, 1],
    [21, 0.6],
  ])('obeys Little\'s law in steady state: constant admissions x mean stay %s d (shape %s) = occupancy', (mean, shape) => {
    // Little 1961, A proof for the queuing formula L = lambda W, Operations Research 9:383:
    // in steady state, mean number in the system = arrival rate x mean time in the system.
    const admissionsPerDay = 37;
    const admissions = new Float64Array(DAYS).fill(admissionsPerDay);
    const occupancy = convolve(admissions, bedDayKernel({ meanDays: mean, shape }, DAYS));
    expect(occupancy[DAYS - 1]).toBeCloseTo(admissionsPerDay * mean, 6);
    expect(Math.abs(occupancy[DAYS - 1] / (admissionsPerDay * mean) - 1)).toBeLessThan(1e-8);
  });

  it('lets a single pulse of admissions decay as the exponential stay says, e^(-t/L)', () => {
    // Exponential length of stay with mean L: P(stay > t) = e^{-t/L}. Patients admitted at mid-day 0,
    // occupancy on day d >= 1 is the mean over [d, d+1]: P L e^{-d/L} (e^{1/(2L)} - e^{-1/(2L)}),
    // so day-to-day ratio e^{-1/L} and value P e^{-d/L} to within a factor 2L sinh(1/(2L)) ~ 1 + 1/(24 L^2).
    const L = 7;
    const pulse = 1000;
    const admissions = new Float64Array(120);
    admissions[0] = pulse;
    const occupancy = convolve(admissions, bedDayKernel({ meanDays: L, shape: 1 }, 120));
    for (let d = 1; d < 80; d++) {
      expect(Math.abs(occupancy[d + 1] / occupancy[d] / Math.exp(-1 / L) - 1)).toBeLessThan(1e-8);
      const exact = pulse * L * Math.exp(-d / L) * 2 * Math.sinh(1 / (2 * L));
      expect(occupancy[d]).toBeCloseTo(exact, 9);
      expect(Math.abs(occupancy[d] / (pulse * Math.exp(-d / L)) - 1)).toBeLessThan(1 / (20 * L * L));
    }
    // Day 0: admitted at mid-day, so half a day on average, minus those already gone.
    expect(occupancy[0]).toBeCloseTo(pulse * L * (1 - Math.exp(-0.5 / L)), 8);
  });

  it.each([
    [8, 2],
    [10, 3],
    [3, 1],
  ])('matches a quadrature of the Erlang survival (mean %s, shape %s)', (mean, shape) => {
    // Independent check of Lambda(x) = x G(x) + L F_{k+1}(x): Simpson's rule on the closed-form
    // Erlang survival function (no incomplete gamma function involved).
    for (const x of [0.5, 1.5, 4.5, 12.5, 30.5]) {
      expect(expectedTimeInBedBy(x, { meanDays: mean, shape })).toBeCloseTo(simpson((u) => erlangSurvival(u, mean, shape), 0, x), 10);
    }
    const b = bedDayKernel({ meanDays: mean, shape }, 50);
    expect(b[0]).toBeCloseTo(simpson((u) => erlangSurvival(u, mean, shape), 0, 0.5), 10);
    for (const k of [1, 3, 9]) expect(b[k]).toBeCloseTo(simpson((u) => erlangSurvival(u, mean, shape), k - 0.5, k + 0.5), 10);
  });

  it('is zero for a zero stay and never negative', () => {
    expect(bedDayKernel({ meanDays: 0, shape: 1 }, 30).every((x) => x === 0)).toBe(true);
    for (const [mean, shape] of [[0.1, 0.2], [40, 0.5], [5, 20]]) {
      expect(bedDayKernel({ meanDays: mean, shape }, 365).every((x) => x >= 0)).toBe(true);
    }
  });
});

describe('admission kernel', () => {
  it('holds all but a negligible tail of the delay and is trimmed to a short support', () => {
    const w = delayKernel({ meanDays: 10, shape: 4 }, 365);
    const total = w.reduce((a, b) => a + b, 0);
    expect(Math.abs(total - 1)).toBeLessThan(1e-9);
    expect(w.length).toBeLessThan(120);
    // Mean of the discretised delay equals the gamma mean (mid-day rounding is symmetric on average).
    const mean = w.reduce((acc, x, k) => acc + k * x, 0);
    expect(mean).toBeCloseTo(10, 1);
  });

  it('is a unit mass on day 0 for a zero delay', () => {
    const w = delayKernel({ meanDays: 0, shape: 1 }, 30);
    expect(w[0]).toBe(1);
    expect(w.slice(1).every((x) => x === 0)).toBe(true);
  });
});

describe('kept kernels', () => {
  it('are computed once per delay and length, and equal a fresh computation', () => {
    const delay = { meanDays: 9.25, shape: 3.5 };
    const w = delayKernel(delay, 300);
    expect(delayKernel({ ...delay }, 300)).toBe(w);
    const fresh = dailyDelayWeights(delay.meanDays, delay.shape, 300);
    expect(Array.from(w)).toStrictEqual(Array.from(fresh.subarray(0, w.length)));
    expect(delayKernel(delay, 299)).not.toBe(w);
    expect(delayKernel({ ...delay, shape: 3.5000001 }, 300)).not.toBe(w);
    // A stay of the same mean and shape is another kernel.
    const b = bedDayKernel(delay, 300);
    expect(b).not.toBe(w);
    expect(bedDayKernel(delay, 300)).toBe(b);
    expect(b[0]).toBeCloseTo(expectedTimeInBedBy(0.5, delay), 15);
  });
});
