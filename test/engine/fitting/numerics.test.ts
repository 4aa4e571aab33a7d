import { inv } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { choleskyFactor, choleskyInverse } from '../../../src/engine/fitting/cholesky.ts';
import { alphaScore, countFamily, countTable, digamma, logFactorial, logRisingFactorial } from '../../../src/engine/fitting/countLikelihoods.ts';
import { maximumLikelihoodAlpha } from '../../../src/engine/fitting/negativeBinomialFit.ts';
import { logGamma } from '../../../src/engine/distributions.ts';

describe('fitting numerics', () => {
  it('logGamma matches ln n!, Γ(1/2) = √π and the reflection region', () => {
    let lnFact = 0;
    for (let n = 1; n <= 170; n++) {
      lnFact += Math.log(n);
      expect(logGamma(n + 1)).toBeCloseTo(lnFact, Math.max(8, 12 - Math.ceil(Math.log10(lnFact + 1))));
    }
    expect(logGamma(0.5)).toBeCloseTo(0.5 * Math.log(Math.PI), 13); // Γ(1/2) = √π (standard result)
    expect(logGamma(0.25)).toBeCloseTo(Math.log(3.625609908221908), 12); // Γ(1/4), Abramowitz & Stegun 1964 table 6.1 [memory]
  });

  it('ln Γ(θ + y) - ln Γ(θ) stays accurate for huge θ (the Poisson limit of NB2)', () => {
    for (const theta of [0.3, 9.9, 10, 250, 1e6, 1e10]) {
      for (const y of [1, 7, 60]) {
        let direct = 0;
        for (let k = 0; k < y; k++) direct += Math.log(theta + k);
        expect(logRisingFactorial(theta, y)).toBeCloseTo(direct, 8);
      }
    }
    expect(logFactorial(0)).toBe(0);
  });

  it('digamma matches ψ(1) = -γ, ψ(1/2) = -γ - 2 ln 2 and ψ(x + 1) = ψ(x) + 1/x', () => {
    const eulerGamma = 0.5772156649015329; // Abramowitz & Stegun 1964, 6.1.3
    expect(digamma(1)).toBeCloseTo(-eulerGamma, 14);
    expect(digamma(0.5)).toBeCloseTo(-eulerGamma - 2 * Math.LN2, 14); // A&S 6.3.3
    for (const x of [0.01, 0.7, 3, 9.5, 12, 1e3, 1e8]) expect(digamma(x + 1) - digamma(x)).toBeCloseTo(1 / x, 12);
  });

  it('the NB2 score in ln α is the derivative of ln L, and vanishes at the α the fit picks', () => {
    const y = [0, 3, 7, 2, 0, 15, 4, 90, 1, 33, 5, 0, 120, 8];
    const mu = [2, 4, 5, 3, 2, 9, 6, 40, 3, 20, 6, 2, 60, 9];
    const table = countTable(y);
    const ll = (lnAlpha: number) => countFamily(Math.exp(lnAlpha), table).logLikelihood(y, mu);
    for (const lnAlpha of [-6, -1, 0.3, 2]) {
      const h = 1e-5;
      const numeric = (ll(lnAlpha + h) - ll(lnAlpha - h)) / (2 * h);
      expect(alphaScore(Math.exp(lnAlpha), table, mu)).toBeCloseTo(numeric, 6);
    }
    const found = maximumLikelihoodAlpha(y, mu, { table });
    expect(found?.alpha).toBeGreaterThan(0);
    expect(Math.abs(alphaScore(found?.alpha as number, table, mu))).toBeLessThan(1e-10);
  });

  it('Cholesky inverse agrees with mathjs inv', () => {
    const a = [
      [4, 1, 0.5],
      [1, 3, 0.2],
      [0.5, 0.2, 2],
    ];
    const l = choleskyFactor(a);
    expect(l).not.toBe(null);
    const ours = choleskyInverse(l as number[][]);
    const theirs = inv(a) as number[][];
    ours.forEach((row, i) => row.forEach((v, j) => expect(v).toBeCloseTo(theirs[i][j], 13)));
    expect(choleskyFactor([[1, 2], [2, 1]])).toBe(null);
  });
});
