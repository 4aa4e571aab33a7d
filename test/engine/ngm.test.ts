/**
 * Next-generation matrix and growth rate against independent routines: mathjs `eigs` (a
 * general-purpose eigenvalue solver from the npm registry) and an explicit Jacobian of the
 * linearised infected subsystem.
 */
import { Solver } from 'odex';
import { describe, expect, it } from 'vitest';
import { spectralRadius } from '../../src/engine/ngm.ts';
import { perronRoot } from '../../src/engine/perronRoot.ts';
import { growthRateFromR } from '../../src/engine/growth.ts';
import { runScenario } from '../../src/engine/run.ts';
import { demoScenario } from '../helpers/demo.ts';
import { dominantByMathjs, nextGenerationMatrixByHand } from '../helpers/byHand.ts';
import { oneBand, valid } from '../helpers/scenarios.ts';
import { seededRandom } from '../helpers/random.ts';

/** A random reciprocal contact matrix: C_ij = W_ij / N_i with W symmetric. */
function randomReciprocal(n: number, rand: () => number): { C: number[][]; N: number[] } {
  const N = Array.from({ length: n }, () => 1000 + 9000 * rand());
  const W = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  for (let i = 0; i < n; i++) for (let j = i; j < n; j++) W[i][j] = W[j][i] = 3000 * rand() * rand();
  return { C: W.map((row, i) => row.map((w) => w / N[i])), N };
}

describe('dominant eigenvalue of the next-generation matrix', () => {
  it('agrees with mathjs eigs on random reciprocal matrices with random u and h', () => {
    const rand = seededRandom(42);
    for (let trial = 0; trial < 20; trial++) {
      const n = 2 + Math.floor(rand() * 15);
      const { C, N } = randomReciprocal(n, rand);
      const u = N.map(() => 0.3 + rand());
      const h = N.map(() => 0.3 + rand());
      const D = 5;
      const beta = 0.03;
      const K = C.map((row, i) => row.map((c, j) => (beta * D * u[i] * c * h[j] * N[i]) / N[j]));
      const flat = Float64Array.from(K.flat());
      const expected = dominantByMathjs(K);
      expect(perronRoot(flat, n)).toBeCloseTo(expected, 9);
      const v = new Float64Array(n).fill(1 / n);
      expect(Math.abs(spectralRadius(flat, n, v, new Float64Array(n)) - expected) / expected).toBeLessThan(1e-7);
    }
  });

  it('power iteration never certifies a start vector with a zero entry the matrix fills', () => {
    // [[1, 2], [3, 4]]: rho = (5 + sqrt 33) / 2 [derived]. From e_1 the one positive entry's ratio
    // is 1 = M_11, a bracket of width zero over the positive entries only; the second row's
    // (Kx)_2 = 3 > 0 against x_2 = 0 makes the upper bound infinite, so iteration goes on.
    const flat = new Float64Array([1, 2, 3, 4]);
    const rho = (5 + Math.sqrt(33)) / 2;
    expect(Math.abs(spectralRadius(flat, 2, new Float64Array([1, 0]), new Float64Array(2), 1e-12) - rho) / rho).toBeLessThan(1e-11);
    // A band with no susceptibles (row scale 0) keeps its zero entry and still has no say.
    const scaled = spectralRadius(flat, 2, new Float64Array([1, 0]), new Float64Array(2), 1e-12, new Float64Array([1, 0]));
    expect(scaled).toBeCloseTo(1, 12);
  });

  // Demo contacts with relative susceptibility and infectiousness that differ by band, so that K
  // written out from the formula (test/helpers/byHand.ts), not the engine's transmission matrix,
  // is what mathjs checks.
  const demo = demoScenario();
  const withUH = valid({
    ...demo,
    disease: {
      ...demo.disease,
      relativeSusceptibility: demo.ageBands.map((_, i) => (i < 4 ? 0.5 : 1)),
      relativeInfectiousness: demo.ageBands.map((_, i) => (i < 4 ? 0.7 : i > 13 ? 0.8 : 1)),
    },
  });

  it('R0 of the demo equals its target: mathjs on K written out from the formula with the calibrated beta', () => {
    const r = runScenario(withUH);
    expect(r.r0).toBeCloseTo(2.5, 12);
    expect(dominantByMathjs(nextGenerationMatrixByHand(withUH, r.beta, withUH.populationPersons, null))).toBeCloseTo(2.5, 9);
  });

  it('R(t) from warm-started power iteration matches mathjs on K written out from the formula, day by day for a demo option', () => {
    const r = runScenario(withUH);
    const n = withUH.ageBands.length;
    const option = withUH.options[1];
    const o = r.options[1];
    for (const d of [0, 20, 21, 30, 60, 76, 77, 100, 200, 364]) {
      const phase = option.phases.find((ph) => d >= ph.fromDay && d < ph.toDay) ?? null;
      const S = Array.from(o.series.susceptible.subarray(d * n, (d + 1) * n));
      const expected = dominantByMathjs(nextGenerationMatrixByHand(withUH, r.beta, S, phase));
      expect(Math.abs(o.series.rt[d] - expected) / expected).toBeLessThan(1e-6);
    }
  });
});

describe('Erlang stage counts', () => {
  it('leave R0 unchanged but change the growth rate', () => {
    const a = runScenario(oneBand({ r0: 2.5 }));
    const b = runScenario(oneBand({ r0: 2.5, latentStages: 4, infectiousStages: 3 }));
    expect(b.r0).toBe(a.r0);
    expect(b.options[0].rStart).toBeCloseTo(a.options[0].rStart, 12);
    expect(b.options[0].growthRatePerDay).toBeGreaterThan(a.options[0].growthRatePerDay);
  });
});

/**
 * Jacobian of the infected subsystem (E stages, I stages per band) linearised at the initial
 * susceptibles, written out independently of the engine's right-hand side.
 */
function infectedJacobian(s: ReturnType<typeof valid>, beta: number): number[][] {
  const n = s.ageBands.length;
  const kE = s.disease.latentStages;
  const kI = s.disease.infectiousStages;
  const aE = kE / s.disease.latentPeriodDays;
  const aI = kI / s.disease.infectiousPeriodDays;
  const size = n * (kE + kI);
  const J = Array.from({ length: size }, () => new Array<number>(size).fill(0));
  const e = (k: number, i: number) => i * (kE + kI) + k;
  const inf = (k: number, i: number) => i * (kE + kI) + kE + k;
  const C = s.settings.reduce((acc, st) => acc.map((row, i) => row.map((x, j) => x + st.contactsPerDay[i][j])), s.settings[0].contactsPerDay.map((r) => r.map(() => 0)));
  for (let i = 0; i < n; i++) {
    const Si = s.populationPersons[i] - s.initialState.infectedPersons[i];
    for (let j = 0; j < n; j++) {
      const rate = (beta * (s.disease.relativeSusceptibility?.[i] ?? 1) * C[i][j] * (s.disease.relativeInfectiousness?.[j] ?? 1) * Si) / s.populationPersons[j];
      for (let k = 0; k < kI; k++) J[e(0, i)][inf(k, j)] += rate;
    }
    for (let k = 0; k < kE; k++) {
      J[e(k, i)][e(k, i)] -= aE;
      if (k + 1 < kE) J[e(k + 1, i)][e(k, i)] += aE;
      else J[inf(0, i)][e(k, i)] += aE;
    }
    for (let k = 0; k < kI; k++) {
      J[inf(k, i)][inf(k, i)] -= aI;
      if (k + 1 < kI) J[inf(k + 1, i)][inf(k, i)] += aI;
    }
  }
  return J;
}

describe('growth rate = leading eigenvalue of the linearised infected subsystem', () => {
  // Wallinga & Lipsitch 2007, Proc R Soc B 274:599: with common periods for all bands, the
  // Euler-Lotka relation rho(K) M(r) = 1 gives the same r as the Jacobian's leading eigenvalue.
  function randomFourBand(kE: number, kI: number) {
    const rand = seededRandom(7 + kE);
    const { C, N } = randomReciprocal(4, rand);
    return valid({
      format: 'mixwise-scenario', version: 1, title: 'random', ageBands: N.map((_, i) => ({ label: `b${i}`, lowerAgeYears: 10 * i })),
      populationPersons: N, settings: [{ name: 'all', contactsPerDay: C }],
      disease: { transmission: { kind: 'r0', r0: 1.8 }, latentPeriodDays: 2.5, infectiousPeriodDays: 4, latentStages: kE, infectiousStages: kI, relativeSusceptibility: [0.5, 1, 1.2, 0.9] },
      severity: { infectionFatalityRatio: [0, 0, 0, 0], source: 'test' }, initialState: { infectedPersons: [0, 1, 0, 0] }, horizonDays: 10,
      options: [{ name: 'none' }],
    });
  }

  it('with one latent and one infectious stage: mathjs eigs on the Jacobian', () => {
    const s = randomFourBand(1, 1);
    const r = runScenario(s);
    expect(r.options[0].growthRatePerDay).toBeCloseTo(dominantByMathjs(infectedJacobian(s, r.beta)), 8);
  });

  it('with 2 latent and 3 infectious stages: asymptotic growth of dx/dt = J x solved by odex', () => {
    // Erlang chains make J nearly defective and mathjs's QR does not converge on it, so the
    // leading eigenvalue is measured as the long-run growth rate of the linear system, integrated
    // by odex (Gragg-Bulirsch-Stoer extrapolation; Hairer & Wanner's ODEX, an independent solver).
    const s = randomFourBand(2, 3);
    const r = runScenario(s);
    const J = infectedJacobian(s, r.beta);
    const solver = new Solver(J.length);
    solver.absoluteTolerance = solver.relativeTolerance = 1e-12;
    const f = (_t: number, x: number[]) => J.map((row) => row.reduce((acc, a, j) => acc + a * x[j], 0));
    const norm = (x: number[]) => Math.hypot(...x);
    const x80 = solver.solve(f, 0, J.map(() => 1), 80).y;
    const x100 = solver.solve(f, 0, x80.map((v) => v / norm(x80)), 20).y;
    const measured = Math.log(norm(x100)) / 20;
    expect(r.options[0].growthRatePerDay).toBeCloseTo(measured, 7);
    expect(growthRateFromR(r.options[0].rStart, { latentPeriodDays: 2.5, infectiousPeriodDays: 4, latentStages: 2, infectiousStages: 3 })).toBeCloseTo(measured, 7);
  });

  it('calibrating beta from a doubling time reproduces that doubling time', () => {
    const base = oneBand({ r0: 2 });
    const s = valid({ ...base, disease: { ...base.disease, transmission: { kind: 'doublingTime', doublingTimeDays: 4 } } });
    const o = runScenario(s).options[0];
    expect(o.doublingTimeDays).toBeCloseTo(4, 9);
  });
});
