import { inv } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { choleskyFactor, choleskyInverse } from '../../../src/engine/fitting/cholesky.ts';
import { logFactorial, logRisingFactorial } from '../../../src/engine/fitting/countLikelihoods.ts';
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
