/**
 * The Tsitouras 5(4) integrator: its coefficients against the Runge-Kutta order conditions,
 * convergence orders and the stability boundary measured, accuracy of steps and dense output on
 * problems with known solutions, and whole runs against the model written out again in this file
 * and solved by odex (an independent extrapolation solver).
 */
import { Solver } from 'odex';
import { describe, expect, it } from 'vitest';
import { denseWeights, IntegratorWorkspace, integrate, REAL_STABILITY_BOUNDARY, type RightHandSide, TABLEAU } from '../../src/engine/integrator.ts';
import { runScenario } from '../../src/engine/run.ts';
import type { Scenario } from '../../src/engine/scenario.ts';
import { demoScenario } from '../helpers/demo.ts';
import { dominantByMathjs, nextGenerationMatrixByHand } from '../helpers/byHand.ts';
import { seirByHand } from '../helpers/seirByHand.ts';
import { valid } from '../helpers/scenarios.ts';

/**
 * sum_i w_i Phi_i(tree) for the rooted trees up to order 5 (Butcher's order conditions; Hairer,
 * Norsett & Wanner 1993, Solving ODEs I, section II.2, Table 2.2), each against 1 / gamma(tree).
 * A method of order p satisfies every condition of order <= p.
 */
function orderConditions(w: readonly number[]): { order: number; value: number; target: number }[] {
  const { a, c } = TABLEAU;
  const s = c.length;
  const A = (v: number[]) => Array.from({ length: s }, (_, i) => a[i].reduce((x: number, aij: number, j: number) => x + aij * v[j], 0));
  const mul = (...vs: number[][]) => Array.from({ length: s }, (_, i) => vs.reduce((x, v) => x * v[i], 1));
  const one = Array.from({ length: s }, () => 1);
  const cc = [...c];
  const Ac = A(cc);
  const sum = (v: number[]) => v.reduce((x, vi, i) => x + w[i] * vi, 0);
  const rows: [number, number[], number][] = [
    [1, one, 1],
    [2, cc, 1 / 2],
    [3, mul(cc, cc), 1 / 3], [3, Ac, 1 / 6],
    [4, mul(cc, cc, cc), 1 / 4], [4, mul(cc, Ac), 1 / 8], [4, A(mul(cc, cc)), 1 / 12], [4, A(Ac), 1 / 24],
    [5, mul(cc, cc, cc, cc), 1 / 5], [5, mul(cc, cc, Ac), 1 / 10], [5, mul(cc, A(mul(cc, cc))), 1 / 15], [5, mul(cc, A(Ac)), 1 / 30],
    [5, mul(Ac, Ac), 1 / 20], [5, A(mul(cc, cc, cc)), 1 / 20], [5, A(mul(cc, Ac)), 1 / 40], [5, A(A(mul(cc, cc))), 1 / 60], [5, A(A(Ac)), 1 / 120],
  ];
  return rows.map(([order, phi, target]) => ({ order, value: sum(phi), target }));
}

/** Integrates with the fixed step h (tolerances that accept every step) and returns y(t1) and the dense outputs. */
function fixedStep(rhs: RightHandSide, y0: number[], t1: number, h: number, times: number[]): { end: Float64Array; dense: Float64Array[] } {
  const y = Float64Array.from(y0);
  const dense: Float64Array[] = [];
  integrate(rhs, y, 0, t1, times, (_t, x) => dense.push(x.slice()), new IntegratorWorkspace(y.length), { relative: 1e30, absolute: 1e30, maxStep: h }, h);
  return { end: y, dense };
}

/** log2 of the error ratio between steps h and h / 2: the observed order of the error. */
const observedOrder = (coarse: number, fine: number): number => Math.log2(coarse / fine);

describe('Tsitouras 5(4): coefficients and orders', () => {
  it('the rows sum to the nodes (c_i = sum_j a_ij), the last row is the 5th-order weights', () => {
    TABLEAU.a.forEach((row, i) => expect(Math.abs(row.reduce((x: number, y: number) => x + y, 0) - TABLEAU.c[i])).toBeLessThan(1e-14));
    TABLEAU.a[6].forEach((x, j) => expect(x).toBe(TABLEAU.b[j]));
  });

  it('the 5th-order weights satisfy every order condition up to order 5', () => {
    for (const { value, target } of orderConditions(TABLEAU.b)) expect(Math.abs(value - target)).toBeLessThan(1e-13);
  });

  it('the embedded weights (b - e) have order 4 exactly: every condition to order 4 holds, some of order 5 fail', () => {
    const embedded = TABLEAU.b.map((b, i) => b - TABLEAU.e[i]);
    const conditions = orderConditions(embedded);
    for (const { order, value, target } of conditions) if (order <= 4) expect(Math.abs(value - target)).toBeLessThan(1e-13);
    expect(Math.max(...conditions.filter((x) => x.order === 5).map((x) => Math.abs(x.value - x.target)))).toBeGreaterThan(1e-4);
  });

  it.each([0.2, 0.5, 0.77, 1])('the continuous extension at theta = %s has order 4: sum b_i(theta) Phi_i = theta^q / gamma', (theta) => {
    const w = new Float64Array(7);
    denseWeights(theta, w);
    for (const { order, value, target } of orderConditions(Array.from(w))) {
      if (order <= 4) expect(Math.abs(value - theta ** order * target)).toBeLessThan(1e-13);
    }
    if (theta === 1) w.forEach((x, i) => expect(Math.abs(x - TABLEAU.b[i])).toBeLessThan(1e-14));
  });

  it('converges with order 5 on a linear system (y = exp(At) y0) and on the logistic equation, dense output with order >= 4', () => {
    // y' = A y, A = [[-0.5, 2], [-2, -0.5]]: y(t) = exp(-t/2) (cos 2t, -sin 2t) for y0 = (1, 0).
    const linear: RightHandSide = (_t, x, d) => { d[0] = -0.5 * x[0] + 2 * x[1]; d[1] = -2 * x[0] - 0.5 * x[1]; };
    const linearExact = (t: number) => [Math.exp(-t / 2) * Math.cos(2 * t), -Math.exp(-t / 2) * Math.sin(2 * t)];
    const logistic: RightHandSide = (_t, x, d) => { d[0] = x[0] * (1 - x[0]); };
    const logisticExact = (t: number) => [1 / (1 + 9 * Math.exp(-t))];
    const times = [0.37, 1.91, 3.33, 4.58];
    for (const [rhs, exact, y0] of [[linear, linearExact, [1, 0]], [logistic, logisticExact, [0.1]]] as const) {
      const errors = [0.2, 0.1].map((h) => {
        const run = fixedStep(rhs, [...y0], 5, h, times);
        const endError = Math.max(...Array.from(run.end, (x, i) => Math.abs(x - exact(5)[i])));
        const denseError = Math.max(...run.dense.flatMap((x, k) => Array.from(x, (xi, i) => Math.abs(xi - exact(times[k])[i]))));
        return { endError, denseError };
      });
      const order = observedOrder(errors[0].endError, errors[1].endError);
      expect(order).toBeGreaterThan(4.6);
      expect(order).toBeLessThan(5.6);
      expect(observedOrder(errors[0].denseError, errors[1].denseError)).toBeGreaterThan(4.5);
    }
  });

  it('is stable on the negative real axis up to REAL_STABILITY_BOUNDARY, and not much further', () => {
    // R(z) = y1 for y' = lambda y, y0 = 1, z = h lambda: stage values Y_i = 1 + z sum_j a_ij Y_j.
    const R = (z: number): number => {
      const Y: number[] = [];
      TABLEAU.c.forEach((_, i) => Y.push(1 + z * TABLEAU.a[i].reduce((x: number, aij: number, j: number) => x + aij * Y[j], 0)));
      return 1 + z * TABLEAU.b.reduce((x, b, i) => x + b * Y[i], 0);
    };
    let boundary = 0;
    while (Math.abs(R(-(boundary + 1e-3))) <= 1) boundary += 1e-3;
    expect(boundary).toBeGreaterThanOrEqual(REAL_STABILITY_BOUNDARY);
    expect(boundary).toBeLessThan(REAL_STABILITY_BOUNDARY + 0.05);
  });
});

describe('Tsitouras 5(4): adaptive runs', () => {
  it('rejects a first step that is far too large and redoes it smaller', () => {
    // y' = -y over one day in one step of 1 day: an estimated error about 100 times rtol 1e-5.
    const y = Float64Array.of(1);
    const ws = new IntegratorWorkspace(1);
    integrate((_t, x, d) => { d[0] = -x[0]; }, y, 0, 1, [], () => undefined, ws, { relative: 1e-5, absolute: 1e-12, maxStep: 1 }, 1);
    expect(ws.rejected).toBeGreaterThanOrEqual(1);
    expect(Math.abs(y[0] - Math.exp(-1))).toBeLessThan(1e-5 * Math.exp(-1));
  });

  it('solves y\' = -y and its dense output between steps matches exp(-t)', () => {
    const y = Float64Array.of(1);
    const times = [0.3, 1, 2.5, 4, 7.25, 10];
    const seen: number[] = [];
    const ws = new IntegratorWorkspace(1);
    integrate((_t, x, d) => { d[0] = -x[0]; }, y, 0, 10, times, (_t, x) => seen.push(x[0]), ws, { relative: 1e-10, absolute: 1e-12, maxStep: 5 });
    times.forEach((t, k) => expect(Math.abs(seen[k] - Math.exp(-t))).toBeLessThan(1e-10));
    expect(Math.abs(y[0] - Math.exp(-10))).toBeLessThan(1e-12);
    expect(ws.steps).toBeGreaterThan(3);
  });

  it('keeps the harmonic oscillator on its circle (y = (cos t, -sin t))', () => {
    const y = Float64Array.of(1, 0);
    const ws = new IntegratorWorkspace(2);
    const times = Array.from({ length: 20 }, (_, k) => k + 0.5);
    const out: [number, number, number][] = [];
    integrate((_t, x, d) => { d[0] = x[1]; d[1] = -x[0]; }, y, 0, 20, times, (t, x) => out.push([t, x[0], x[1]]), ws, { relative: 1e-9, absolute: 1e-12, maxStep: 1 });
    for (const [t, a, b] of out) {
      expect(Math.abs(a - Math.cos(t))).toBeLessThan(1e-7);
      expect(Math.abs(b + Math.sin(t))).toBeLessThan(1e-7);
    }
  });
});

/**
 * The engine against the SEIR model written out again (test/helpers/seirByHand.ts), with
 * beta = R0 / rho(K at beta = 1), K_ij = D u_i C_ij h_j N_i / N_j (test/helpers/byHand.ts) from
 * mathjs's eigenvalues, solved with odex and restarted where the option's measures change.
 */
function referenceModel(s: Scenario) {
  const seir = seirByHand(s);
  const N = s.populationPersons;
  const r0 = (s.disease.transmission as { r0: number }).r0;
  const beta = r0 / dominantByMathjs(nextGenerationMatrixByHand(s, 1, N, null));
  /** Daily states of `option`, restarting the solver where its measures change. */
  const solve = (option: Scenario['options'][number], horizon: number): Map<number, number[]> => {
    const days = new Map<number, number[]>();
    const cuts = [...new Set([0, horizon, ...option.phases.flatMap((p) => [p.fromDay, p.toDay]).filter((d) => d > 0 && d < horizon)])].sort((a, b) => a - b);
    let y = seir.initialState();
    for (let k = 0; k + 1 < cuts.length; k++) {
      const phase = option.phases.find((p) => cuts[k] >= p.fromDay && cuts[k] < p.toDay) ?? null;
      const solver = new Solver(y.length);
      solver.absoluteTolerance = 1e-8;
      solver.relativeTolerance = 1e-10;
      solver.denseOutput = true;
      y = solver.solve(seir.rhs(seir.forceOfInfection(beta, phase)), cuts[k], y, cuts[k + 1], solver.grid(1, (t, state) => { days.set(Math.round(t), state.slice()); })).y;
      days.set(cuts[k + 1], y.slice());
    }
    return days;
  };
  return { beta, solve, at: seir.band };
}

describe('the engine against the model written out independently, solved by odex', () => {
  // The demo (16 bands) with Erlang stages, relative susceptibility and infectiousness by band, and
  // an option whose measures close schools, cut work, shield the two oldest bands in "other"
  // contacts and isolate cases, between days 20 and 60.
  const demo = demoScenario();
  const u = demo.ageBands.map((_, i) => (i < 4 ? 0.5 : i < 12 ? 1 : 1.3));
  const h = demo.ageBands.map((_, i) => (i < 4 ? 0.7 : i < 14 ? 1 : 0.8));
  const s = valid({
    ...demo,
    vaccinationCampaigns: [],
    referenceOption: undefined,
    horizonDays: 150,
    disease: { ...demo.disease, latentStages: 2, infectiousStages: 3, relativeSusceptibility: u, relativeInfectiousness: h },
    options: [
      { name: 'none' },
      { name: 'measures', phases: [{ fromDay: 20, toDay: 60, settingMultipliers: { school: 0, work: 0.6 }, ageFactors: [{ setting: 'other', bands: [14, 15], factor: 0.3 }], caseIsolation: 0.25 }] },
    ],
  });
  const model = referenceModel(s);
  const results = runScenario(s);

  it('calibrates the same transmission rate', () => {
    expect(results.beta).toBeCloseTo(model.beta, 12);
  });

  it.each([0, 1])('gives the same daily susceptibles, infected and infections by band (option %s)', (k) => {
    const reference = model.solve(s.options[k], s.horizonDays);
    const o = results.options[k];
    const n = o.series.bands;
    for (const day of [5, 20, 30, 45, 60, 61, 90, 150]) {
      const y = reference.get(day)!;
      for (let i = 0; i < n; i++) {
        const ref = model.at(y, i);
        // Both solvers keep a relative error near 1e-5 of the band's size (the engine's tolerance).
        const tolerance = 1e-5 * s.populationPersons[i];
        expect(Math.abs(o.series.susceptible[day * n + i] - ref.susceptible)).toBeLessThan(tolerance);
        expect(Math.abs(o.series.prevalence[day * n + i] - ref.infected)).toBeLessThan(tolerance);
      }
    }
    const last = reference.get(s.horizonDays)!;
    o.infectionsByBand.forEach((x, i) => expect(Math.abs(x - s.initialState.infectedPersons[i] - model.at(last, i).cumulative)).toBeLessThan(1e-5 * s.populationPersons[i]));
  });

  it('agrees when the seeds start infectious rather than latent', () => {
    const seededInfectious = valid({ ...s, horizonDays: 60, options: [s.options[0]], initialState: { ...s.initialState, infectedCompartment: 'infectious' } });
    const reference = referenceModel(seededInfectious).solve(seededInfectious.options[0], 60);
    const o = runScenario(seededInfectious).options[0];
    const n = o.series.bands;
    for (const day of [2, 10, 30, 60]) {
      for (let i = 0; i < n; i++) {
        const ref = model.at(reference.get(day)!, i);
        expect(Math.abs(o.series.susceptible[day * n + i] - ref.susceptible)).toBeLessThan(1e-5 * s.populationPersons[i]);
        expect(Math.abs(o.series.prevalence[day * n + i] - ref.infected)).toBeLessThan(1e-5 * s.populationPersons[i]);
      }
    }
  });
});
