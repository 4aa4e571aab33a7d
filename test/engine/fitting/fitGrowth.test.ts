import { lusolve, multiply, transpose } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { CHI_SQUARE_1_DF_95, fitGrowth, type GrowthFit } from '../../../src/engine/fitting/index.ts';
import { expectedCounts, SeededRandom } from './seededRandom.ts';

function fitted(result: ReturnType<typeof fitGrowth>): GrowthFit {
  if (!result.ok) throw new Error(result.problems.map((p) => `${p.field} ${p.rule}`).join('; '));
  return result.fit;
}

const days = (n: number): number[] => Array.from({ length: n }, (_, t) => t);

/**
 * Independent Poisson profile log-likelihood of r for ln mu_t = a + r t (no weekday effect):
 * for fixed r the intercept has the closed form e^a = sum y / sum e^{r t}, so
 * ln L_p(r) = sum y_t (a + r t) - sum y - sum ln y_t! ; the ln y! terms cancel in differences and are dropped.
 */
function closedFormProfile(t: number[], y: number[], r: number): number {
  const total = y.reduce((s, v) => s + v, 0);
  const a = Math.log(total / t.reduce((s, ti) => s + Math.exp(r * ti), 0));
  return y.reduce((s, yi, i) => s + yi * (a + r * t[i]), 0) - total;
}

/** Golden-section maximum of a unimodal function on [lo, hi] (Kiefer 1953) — a different route from IRLS. */
function goldenMax(f: (x: number) => number, lo: number, hi: number): number {
  const g = (Math.sqrt(5) - 1) / 2;
  while (hi - lo > 1e-12) {
    const c = hi - g * (hi - lo);
    const d = lo + g * (hi - lo);
    if (f(c) >= f(d)) hi = d;
    else lo = c;
  }
  return 0.5 * (lo + hi);
}

describe('fitGrowth: Poisson regression on day', () => {
  it('equals the closed-form MLE r = ln(y1 / y0) for a two-day window', () => {
    // Two points, two parameters: the fit is saturated, mu_t = y_t, so r = ln(y1/y0) exactly (derived).
    const fit = fitted(fitGrowth({ day: [3, 4, 5], count: [12, 30, 90] }, { fromDay: 3, toDay: 4 }));
    expect(fit.daysUsed).toBe(2);
    expect(fit.growthRatePerDay).toBeCloseTo(Math.log(30 / 12), 12);
    // Interval ends: profile deviance 2 (ln L(r̂) - ln L_p(r)) = χ²₁(0.95), with ln L_p in closed form.
    const best = closedFormProfile([0, 1], [12, 30], Math.log(30 / 12));
    for (const end of fit.growthRateInterval) expect(2 * (best - closedFormProfile([0, 1], [12, 30], end))).toBeCloseTo(CHI_SQUARE_1_DF_95, 6);
    expect(fit.dispersion.pearsonRatio).toBe(null);
  });

  it('agrees with a direct maximisation of the closed-form profile likelihood', () => {
    const rng = new SeededRandom(42);
    const t = days(21);
    const y = expectedCounts(21, 15, 0.1).map((m) => rng.poisson(m));
    const fit = fitted(fitGrowth({ day: t, count: y }));
    const rDirect = goldenMax((r) => closedFormProfile(t, y, r), -1, 1);
    expect(fit.growthRatePerDay).toBeCloseTo(rDirect, 7);
    const best = closedFormProfile(t, y, rDirect);
    const [lo, hi] = fit.growthRateInterval;
    expect(lo).toBeLessThan(fit.growthRatePerDay);
    expect(hi).toBeGreaterThan(fit.growthRatePerDay);
    for (const end of [lo, hi]) expect(2 * (best - closedFormProfile(t, y, end))).toBeCloseTo(CHI_SQUARE_1_DF_95, 6);
  });

  it('with a day-of-week effect agrees with Newton-Raphson written with mathjs', () => {
    const weekday = [1, 1.1, 1.2, 1.1, 1, 0.6, 0.5];
    const rng = new SeededRandom(9);
    const t = days(42);
    const y = expectedCounts(42, 30, 0.05, weekday).map((m) => rng.poisson(m));
    const fit = fitted(fitGrowth({ day: t, count: y }, { dayOfWeek: true }));

    // Newton on ln L = sum y η - e^η with η = X b (uncentred day column): b += (Xᵀ M X)^{-1} Xᵀ (y - mu).
    const x = t.map((ti) => [1, ti, ...[1, 2, 3, 4, 5, 6].map((k) => (ti % 7 === k ? 1 : 0))]);
    let b: number[] = [Math.log(y.reduce((s, v) => s + v, 0) / y.length), 0, 0, 0, 0, 0, 0, 0];
    for (let i = 0; i < 50; i++) {
      const mu = x.map((row) => Math.exp(row.reduce((s, v, j) => s + v * b[j], 0)));
      const grad = multiply(transpose(x), y.map((yi, k) => yi - mu[k])) as number[];
      const hess = multiply(transpose(x), x.map((row, k) => row.map((v) => v * mu[k]))) as number[][];
      const step = (lusolve(hess, grad) as number[][]).map((r) => r[0]);
      b = b.map((v, j) => v + step[j]);
    }
    expect(fit.growthRatePerDay).toBeCloseTo(b[1], 9);
    fit.dayOfWeekFactors?.slice(1).forEach((f, k) => expect(f).toBeCloseTo(Math.exp(b[k + 2]), 7));
    // and the weekday pattern is recovered roughly (0.5 on the seventh class)
    expect(fit.dayOfWeekFactors?.[6]).toBeGreaterThan(0.4);
    expect(fit.dayOfWeekFactors?.[6]).toBeLessThan(0.6);
  });

  it('covers the true r in at least 90 of 100 seeded repetitions, without bias', () => {
    const trueR = 0.08;
    const estimates: number[] = [];
    let covered = 0;
    for (let seed = 1; seed <= 100; seed++) {
      const rng = new SeededRandom(1000 + seed);
      const y = expectedCounts(21, 20, trueR).map((m) => rng.poisson(m));
      const fit = fitted(fitGrowth({ day: days(21), count: y }));
      estimates.push(fit.growthRatePerDay);
      if (fit.growthRateInterval[0] <= trueR && trueR <= fit.growthRateInterval[1]) covered++;
    }
    expect(covered).toBeGreaterThanOrEqual(90);
    const mean = estimates.reduce((s, v) => s + v, 0) / estimates.length;
    const sd = Math.sqrt(estimates.reduce((s, v) => s + (v - mean) ** 2, 0) / (estimates.length - 1));
    // unbiased to within 2 standard errors of the mean estimate (SE = sd / sqrt(100))
    expect(Math.abs(mean - trueR)).toBeLessThan((2 * sd) / Math.sqrt(estimates.length));
  });

  it('reports a constant series as not growing, r = 0', () => {
    const fit = fitted(fitGrowth({ day: days(10), count: new Array(10).fill(40) }));
    expect(Math.abs(fit.growthRatePerDay)).toBeLessThan(1e-9);
    expect(fit.status).toBe('not growing');
    expect(fit.doublingTimeDays).toBe(null);
    expect(fit.doublingTimeInterval).toBe(null);
    expect(fit.halvingTimeDays).toBe(null);
    expect(fit.growthRateInterval[0]).toBeLessThan(0);
    expect(fit.growthRateInterval[1]).toBeGreaterThan(0);
  });

  it('gives doubling time ln2/r with its interval when growing, halving time when shrinking', () => {
    const rng = new SeededRandom(3);
    const up = fitted(fitGrowth({ day: days(14), count: expectedCounts(14, 20, 0.15).map((m) => rng.poisson(m)) }));
    expect(up.status).toBe('growing');
    expect(up.doublingTimeDays).toBeCloseTo(Math.LN2 / up.growthRatePerDay, 12);
    expect(up.doublingTimeInterval).toEqual([Math.LN2 / up.growthRateInterval[1], Math.LN2 / up.growthRateInterval[0]]);
    const down = fitted(fitGrowth({ day: days(14), count: expectedCounts(14, 300, -0.1).map((m) => rng.poisson(m)) }));
    expect(down.status).toBe('shrinking');
    expect(down.doublingTimeDays).toBe(null);
    expect(down.halvingTimeDays).toBeCloseTo(Math.LN2 / -down.growthRatePerDay, 12);
    expect(down.halvingTimeInterval).toEqual([Math.LN2 / -down.growthRateInterval[0], Math.LN2 / -down.growthRateInterval[1]]);
  });

  it('leaves the far end of the doubling time open when the r interval reaches 0', () => {
    const fit = fitted(fitGrowth({ day: [0, 1, 2, 3], count: [5, 4, 6, 7] }));
    expect(fit.status).toBe('growing');
    expect(fit.growthRateInterval[0]).toBeLessThan(0);
    expect(fit.doublingTimeInterval?.[1]).toBe(null);
  });

  it('uses only the window and draws the fitted curve with its band over every window day', () => {
    const fit = fitted(fitGrowth({ day: [0, 1, 2, 4, 5, 9], count: [1, 2, 4, 16, 32, 1] }, { fromDay: 0, toDay: 5 }));
    expect(fit.growthRatePerDay).toBeCloseTo(Math.LN2, 9);
    expect(fit.fitted.map((p) => p.day)).toEqual([0, 1, 2, 3, 4, 5]);
    expect(fit.fitted[3].observed).toBe(null);
    for (const p of fit.fitted) {
      expect(p.lower).toBeLessThan(p.expected);
      expect(p.upper).toBeGreaterThan(p.expected);
    }
  });

  it('names the field and rule for windows it cannot fit', () => {
    const problems = (r: ReturnType<typeof fitGrowth>): string[] => (r.ok ? [] : r.problems.map((p) => `${p.field} ${p.rule}`));
    expect(problems(fitGrowth({ day: [0, 1, 2], count: [0, 0, 9] }))[0]).toMatch(/^window must have cases on at least 2 different days/);
    expect(problems(fitGrowth({ day: [0, 1, 2], count: [3, 4, 5] }, { fromDay: 2, toDay: 1 }))[0]).toBe('toDay must be after fromDay (2)');
    expect(problems(fitGrowth({ day: [0, 1], count: [3, -1] }))[0]).toBe('counts.count[1] must be a whole number >= 0');
    expect(problems(fitGrowth({ day: days(10), count: new Array(10).fill(5) }, { dayOfWeek: true, fromDay: 0, toDay: 5 }))[0]).toBe(
      'dayOfWeek needs counts on at least 8 days of the window (has 6)',
    );
  });
});

describe('fitGrowth: negative binomial for overdispersed counts', () => {
  const rng = new SeededRandom(77);
  const t = days(28);
  const y = expectedCounts(28, 40, 0.06).map((m) => rng.negativeBinomial(m, 0.1));

  it('reports dispersion > 0, a Pearson ratio flagging overdispersion, and a wider interval than Poisson', () => {
    const poisson = fitted(fitGrowth({ day: t, count: y }));
    const nb = fitted(fitGrowth({ day: t, count: y }, { family: 'negativeBinomial' }));
    expect(poisson.dispersion.pearsonRatio).toBeGreaterThan(1.5);
    expect(poisson.notes.some((n) => n.includes('prefer the negative-binomial fit'))).toBe(true);
    const alpha = nb.dispersion.negativeBinomialAlpha as number;
    expect(alpha).toBeGreaterThan(0.03);
    expect(alpha).toBeLessThan(0.3);
    const width = (f: GrowthFit): number => f.growthRateInterval[1] - f.growthRateInterval[0];
    expect(width(nb)).toBeGreaterThan(1.5 * width(poisson));
    expect(nb.growthRateInterval[0]).toBeLessThan(0.06);
    expect(nb.growthRateInterval[1]).toBeGreaterThan(0.06);
  });

  it('is a maximum of the NB2 likelihood: nudging r, the intercept or alpha lowers it', () => {
    const nb = fitted(fitGrowth({ day: t, count: y }, { family: 'negativeBinomial' }));
    const alpha = nb.dispersion.negativeBinomialAlpha as number;
    const tc = (t.length - 1) / 2;
    const a = Math.log(nb.fitted[Math.round(tc)].expected) - nb.growthRatePerDay * (Math.round(tc) - tc);
    // NB2 log-likelihood written out with sums of logs for ln Γ(y+θ) - ln Γ(θ) (exact for whole y).
    const ll = (aa: number, r: number, al: number): number => {
      const th = 1 / al;
      return y.reduce((s, yi, i) => {
        const mu = Math.exp(aa + r * (t[i] - tc));
        let g = 0;
        for (let k = 0; k < yi; k++) g += Math.log(th + k) - Math.log(k + 1);
        return s + g + th * Math.log(th / (th + mu)) + yi * Math.log(mu / (th + mu));
      }, 0);
    };
    const best = ll(a, nb.growthRatePerDay, alpha);
    expect(best).toBeCloseTo(nb.logLikelihood, 6);
    for (const [da, dr, dal] of [[1e-3, 0, 0], [-1e-3, 0, 0], [0, 1e-4, 0], [0, -1e-4, 0], [0, 0, 1e-3 * alpha], [0, 0, -1e-3 * alpha]]) {
      expect(ll(a + da, nb.growthRatePerDay + dr, alpha + dal)).toBeLessThan(best);
    }
  });

  it('finds no overdispersion in Poisson counts (alpha near 0, Pearson ratio near 1)', () => {
    const r2 = new SeededRandom(8);
    const yp = expectedCounts(28, 40, 0.06).map((m) => r2.poisson(m));
    const nb = fitted(fitGrowth({ day: t, count: yp }, { family: 'negativeBinomial' }));
    expect(nb.dispersion.negativeBinomialAlpha).toBeLessThan(0.01);
    expect(nb.dispersion.pearsonRatio).toBeGreaterThan(0.4);
    expect(nb.dispersion.pearsonRatio).toBeLessThan(1.6);
  });
});
