/**
 * The Dormand-Prince integrator: accuracy of steps and dense output on problems with known
 * solutions, and whole runs against the model written out again in this file and solved by odex
 * (an independent extrapolation solver).
 */
import { Solver } from 'odex';
import { describe, expect, it } from 'vitest';
import { Dopri5Workspace, integrate } from '../../src/engine/dopri5.ts';
import { runScenario } from '../../src/engine/run.ts';
import type { Scenario } from '../../src/engine/scenario.ts';
import { demoScenario } from '../helpers/demo.ts';
import { dominantByMathjs, nextGenerationMatrixByHand } from '../helpers/byHand.ts';
import { seirByHand } from '../helpers/seirByHand.ts';
import { valid } from '../helpers/scenarios.ts';

describe('dopri5', () => {
  it('solves y\' = -y and its dense output between steps matches exp(-t)', () => {
    const y = Float64Array.of(1);
    const times = [0.3, 1, 2.5, 4, 7.25, 10];
    const seen: number[] = [];
    const ws = new Dopri5Workspace(1);
    integrate((_t, x, d) => { d[0] = -x[0]; }, y, 0, 10, times, (_t, x) => seen.push(x[0]), ws, { relative: 1e-10, absolute: 1e-12, maxStep: 5 });
    times.forEach((t, k) => expect(Math.abs(seen[k] - Math.exp(-t))).toBeLessThan(1e-10));
    expect(Math.abs(y[0] - Math.exp(-10))).toBeLessThan(1e-12);
    expect(ws.steps).toBeGreaterThan(3);
  });

  it('keeps the harmonic oscillator on its circle (y = (cos t, -sin t))', () => {
    const y = Float64Array.of(1, 0);
    const ws = new Dopri5Workspace(2);
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
