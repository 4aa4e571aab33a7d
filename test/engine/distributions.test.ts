/** Delay distributions: ln Gamma, the gamma CDF and the daily discretisation. */
import { describe, expect, it } from 'vitest';
import { convolve, dailyDelayWeights, gammaCdf, logGamma, regularizedLowerGamma } from '../../src/engine/distributions.ts';

describe('logGamma', () => {
  it('gives ln((n-1)!) at integers and ln(sqrt(pi)) at 1/2', () => {
    let factorial = 1;
    for (let n = 1; n <= 20; n++) {
      expect(logGamma(n)).toBeCloseTo(Math.log(factorial), 10);
      factorial *= n;
    }
    expect(logGamma(0.5)).toBeCloseTo(0.5 * Math.log(Math.PI), 12);
  });
});

describe('gamma CDF', () => {
  it('with integer shape equals the Erlang CDF 1 - sum_{k<s} e^{-x}(x)^k/k!', () => {
    // Erlang distribution closed form (a standard result; e.g. Ross 2014, Introduction to
    // Probability Models, 11th ed., section 5.2.3).
    for (const shape of [1, 2, 4, 7]) {
      for (const x of [0.1, 1, 3, 8, 20]) {
        let tail = 0;
        let term = 1;
        for (let k = 0; k < shape; k++) {
          tail += term;
          term *= x / (k + 1);
        }
        expect(regularizedLowerGamma(shape, x)).toBeCloseTo(1 - Math.exp(-x) * tail, 12);
      }
    }
  });

  it('has the stated mean: sum of daily weights x day is close to the mean', () => {
    const w = dailyDelayWeights(21, 4, 400);
    const total = w.reduce((a, b) => a + b, 0);
    const mean = w.reduce((acc, x, k) => acc + x * k, 0);
    expect(total).toBeCloseTo(1, 10);
    expect(mean).toBeCloseTo(21, 1);
  });

  it('a zero-mean delay puts everything on day 0', () => {
    expect(gammaCdf(0, 0, 1)).toBe(1);
    expect(Array.from(dailyDelayWeights(0, 1, 3))).toEqual([1, 0, 0]);
  });
});

describe('convolve', () => {
  it('spreads a single pulse by the weights and keeps its total', () => {
    const out = convolve(Float64Array.of(0, 10, 0, 0, 0), Float64Array.of(0.5, 0.3, 0.2));
    expect(Array.from(out)).toEqual([0, 5, 3, 2, 0]);
  });
});
