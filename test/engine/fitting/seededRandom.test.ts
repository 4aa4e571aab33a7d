import { describe, expect, it } from 'vitest';
import { SeededRandom } from './seededRandom.ts';

/** The test generator itself must have the moments it claims, or the fitting tests prove nothing. */
describe('seeded generator (test helper)', () => {
  it('is deterministic for a seed', () => {
    const a = new SeededRandom(7);
    const b = new SeededRandom(7);
    expect(Array.from({ length: 5 }, () => a.poisson(12))).toEqual(Array.from({ length: 5 }, () => b.poisson(12)));
  });

  it('Poisson draws have mean and variance close to lambda', () => {
    const rng = new SeededRandom(11);
    for (const lambda of [3, 47.5, 400]) {
      const n = 20000;
      const xs = Array.from({ length: n }, () => rng.poisson(lambda));
      const mean = xs.reduce((s, x) => s + x, 0) / n;
      const variance = xs.reduce((s, x) => s + (x - mean) ** 2, 0) / (n - 1);
      // standard error of the mean is sqrt(lambda / n); allow 4 of them
      expect(Math.abs(mean - lambda)).toBeLessThan(4 * Math.sqrt(lambda / n));
      expect(variance / lambda).toBeGreaterThan(0.95);
      expect(variance / lambda).toBeLessThan(1.05);
    }
  });

  it('negative-binomial draws have variance mu + alpha mu^2', () => {
    const rng = new SeededRandom(5);
    const mu = 50;
    const alpha = 0.2;
    const n = 40000;
    const xs = Array.from({ length: n }, () => rng.negativeBinomial(mu, alpha));
    const mean = xs.reduce((s, x) => s + x, 0) / n;
    const variance = xs.reduce((s, x) => s + (x - mean) ** 2, 0) / (n - 1);
    expect(mean).toBeGreaterThan(mu * 0.98);
    expect(mean).toBeLessThan(mu * 1.02);
    expect(variance / (mu + alpha * mu * mu)).toBeGreaterThan(0.92);
    expect(variance / (mu + alpha * mu * mu)).toBeLessThan(1.08);
  });
});
