import { describe, expect, it } from 'vitest';
import { partialRankCorrelations, ranks } from '../../../src/engine/index.ts';
import { inv, matrix } from 'mathjs';

/** A small fixed-seed generator for test data (not the engine's). */
function lcg(seed: number): () => number {
  let x = seed >>> 0;
  return () => ((x = (Math.imul(x, 1664525) + 1013904223) >>> 0) + 0.5) / 2 ** 32;
}

describe('ranks', () => {
  it('gives ties their mean rank', () => {
    expect(Array.from(ranks([10, 30, 20, 30]))).toEqual([1, 3.5, 2, 3.5]);
  });
});

describe('PRCC (Blower & Dowlatabadi 1994)', () => {
  const n = 400;
  const rand = lcg(3);
  const a = Float64Array.from({ length: n }, rand);
  const b = Float64Array.from({ length: n }, rand);
  const c = Float64Array.from({ length: n }, rand);

  it('is near 1 for a monotone driver, near 0 for a parameter the output ignores', () => {
    // y rises with a (nonlinearly), falls with b, ignores c.
    const y = a.map((x, i) => Math.exp(3 * x) - 2 * b[i]);
    const [pa, pb, pc] = partialRankCorrelations([a, b, c], y);
    expect(pa).toBeGreaterThan(0.9);
    expect(pb).toBeLessThan(-0.7);
    expect(Math.abs(pc ?? 1)).toBeLessThan(0.15); // about 3 standard errors (1/sqrt(n - 3)) at n = 400
  });

  it('is exactly 1 when the output is a monotone function of one parameter alone', () => {
    const y = a.map((x) => x ** 3);
    expect(partialRankCorrelations([a, b], y)[0]).toBeCloseTo(1, 12);
  });

  it('equals the partial correlation from the inverse correlation matrix of the ranks', () => {
    // Independent route: r_jy.rest = -P_jy / sqrt(P_jj P_yy), P = inverse of the rank correlation matrix.
    const y = a.map((x, i) => x + b[i] * b[i] + 0.3 * c[i] + 0.2 * rand());
    const cols = [a, b, c, y].map((v) => {
      const r = ranks(v);
      const mean = r.reduce((s, x) => s + x, 0) / n;
      const centred = r.map((x) => x - mean);
      const sd = Math.sqrt(centred.reduce((s, x) => s + x * x, 0));
      return centred.map((x) => x / sd);
    });
    const corr = cols.map((u) => cols.map((v) => u.reduce((s, x, i) => s + x * v[i], 0)));
    const p = (inv(matrix(corr)).toArray() as number[][]);
    const expected = [0, 1, 2].map((j) => -p[j][3] / Math.sqrt(p[j][j] * p[3][3]));
    const got = partialRankCorrelations([a, b, c], y);
    got.forEach((x, j) => expect(x).toBeCloseTo(expected[j], 10));
  });

  it('is 0 for a parameter when the others explain the output entirely', () => {
    const y = a.map((x) => 2 * x);
    expect(partialRankCorrelations([a, b], y)[1]).toBe(0);
  });

  it('is null for an output that does not vary', () => {
    expect(partialRankCorrelations([a, b], new Float64Array(n).fill(2))).toEqual([null, null]);
  });
});
