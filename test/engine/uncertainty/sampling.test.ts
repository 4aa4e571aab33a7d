import { erf } from 'mathjs';
import { describe, expect, it } from 'vitest';
import {
  distributionQuantile,
  hypercubePoint,
  latinHypercube,
  normalCdf,
  normalQuantile,
  seededPermutation,
  splitMix64At,
  type Distribution,
} from '../../../src/engine/index.ts';

describe('SplitMix64', () => {
  it('gives the reference outputs for seed 1234567', () => {
    // Test vector of the reference splitmix64.c (Vigna), from memory: the first five outputs for
    // seed 1234567. Independently, a BigInt-free recomputation would give the same.
    const expected = ['6457827717110365317', '3203168211198807973', '9817491932198370423', '4593380528125082431', '16408922859458223821'];
    expect([0, 1, 2, 3, 4].map((n) => splitMix64At(1234567n, n).toString())).toEqual(expected);
  });
});

describe('normal quantile (Wichura 1988, AS 241)', () => {
  // Upper percentage points of the standard normal: Abramowitz & Stegun 1964, Table 26.5 (10 digits).
  const table: [number, number][] = [
    [0.975, 1.959963985],
    [0.95, 1.644853627],
    [0.99, 2.326347874],
    [0.999, 3.090232306],
    [0.9999, 3.719016485],
  ];
  it.each(table)('Phi^-1(%s) = %s', (p, z) => {
    expect(normalQuantile(p)).toBeCloseTo(z, 9);
    expect(normalQuantile(1 - p)).toBeCloseTo(-z, 9);
  });

  it('inverts the CDF computed independently by mathjs (erf), in all three regions', () => {
    for (const p of [1e-300, 1e-20, 1e-9, 0.001, 0.02, 0.1, 0.3, 0.5, 0.7, 0.925, 0.999999]) {
      const z = normalQuantile(p);
      const phi = 0.5 * (1 + (erf(z / Math.SQRT2) as number));
      if (p > 1e-6) expect(Math.abs(phi - p) / p).toBeLessThan(1e-12);
      expect(Math.abs(normalCdf(z) - p)).toBeLessThan(1e-15 + 1e-12 * p);
    }
  });

  it('has the normal CDF agree with mathjs', () => {
    for (const x of [-6, -2.5, -1, -0.1, 0, 0.3, 1.7, 4]) {
      expect(normalCdf(x)).toBeCloseTo(0.5 * (1 + (erf(x / Math.SQRT2) as number)), 14);
    }
  });
});

describe('distribution quantiles', () => {
  const us = [0.001, 0.1, 0.25, 0.5, 0.8, 0.999];
  it('uniform and triangular invert their CDFs', () => {
    const tri: Distribution = { kind: 'triangular', low: 1, mode: 2, high: 5 };
    // Triangular CDF: (x-a)^2/((b-a)(c-a)) below the mode, 1 - (b-x)^2/((b-a)(b-c)) above.
    const cdf = (x: number) => (x <= 2 ? (x - 1) ** 2 / (4 * 1) : 1 - (5 - x) ** 2 / (4 * 3));
    for (const u of us) {
      expect(distributionQuantile({ kind: 'uniform', low: 2, high: 3 }, u)).toBeCloseTo(2 + u, 14);
      expect(cdf(distributionQuantile(tri, u))).toBeCloseTo(u, 12);
    }
  });

  it('truncated normal stays in its bounds and inverts the truncated CDF', () => {
    const d: Distribution = { kind: 'normal', mean: 1, sd: 0.5, low: 0.5, high: 3 };
    const a = normalCdf(-1);
    const b = normalCdf(4);
    for (const u of us) {
      const x = distributionQuantile(d, u);
      expect(x).toBeGreaterThanOrEqual(0.5);
      expect(x).toBeLessThanOrEqual(3);
      expect((normalCdf((x - 1) / 0.5) - a) / (b - a)).toBeCloseTo(u, 10);
    }
  });

  it('lognormal by 95% range puts 2.5% and 97.5% at the range ends; by geometric sd, one sd at median x gsd', () => {
    const byRange: Distribution = { kind: 'lognormal', median: 2, range95: [1, 4] };
    expect(distributionQuantile(byRange, 0.5)).toBeCloseTo(2, 12);
    expect(distributionQuantile(byRange, 0.025)).toBeCloseTo(1, 10);
    expect(distributionQuantile(byRange, 0.975)).toBeCloseTo(4, 10);
    const byGsd: Distribution = { kind: 'lognormal', median: 3, geometricSd: 1.5 };
    expect(distributionQuantile(byGsd, normalCdf(1))).toBeCloseTo(4.5, 10);
  });
});

describe('Latin hypercube', () => {
  it('samples every stratum of every parameter exactly once', () => {
    const n = 500;
    const h = latinHypercube(42, 3, n);
    for (let k = 0; k < 3; k++) {
      const hits = new Uint32Array(n);
      for (let i = 0; i < n; i++) hits[Math.floor(hypercubePoint(h, i)[k] * n)]++;
      expect(hits.every((c) => c === 1)).toBe(true);
    }
  });

  it('gives draw i the same point whoever computes it, and different points for another seed', () => {
    const a = latinHypercube(7, 2, 1000);
    const b = latinHypercube(7, 2, 1000); // as another process rebuilding it for a slice
    for (const i of [0, 1, 499, 999]) expect(hypercubePoint(b, i)).toEqual(hypercubePoint(a, i));
    const c = latinHypercube(8, 2, 1000);
    expect(hypercubePoint(c, 5)).not.toEqual(hypercubePoint(a, 5));
  });

  it('draws permutations whose every position is equally likely (chi-square over many seeds)', () => {
    // Where index 0 lands over 2,000 seeds of a permutation of 10: uniform over 10 places.
    const counts = new Array<number>(10).fill(0);
    for (let seed = 0; seed < 2000; seed++) counts[seededPermutation(seed, 0, 10).indexOf(0)]++;
    const chi2 = counts.reduce((s, c) => s + (c - 200) ** 2 / 200, 0);
    expect(chi2).toBeLessThan(27.88); // chi-square, 9 degrees of freedom, 0.1% point (Abramowitz & Stegun 1964, Table 26.8)
  });
});
