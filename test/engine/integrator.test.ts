/**
 * The Dormand-Prince integrator: accuracy of steps and dense output on problems with known
 * solutions, and the whole demo against odex (an independent extrapolation solver).
 */
import { Solver } from 'odex';
import { describe, expect, it } from 'vitest';
import { Dopri5Workspace, integrate } from '../../src/engine/dopri5.ts';
import { prepareScenario } from '../../src/engine/prepare.ts';
import { runScenario } from '../../src/engine/run.ts';
import { seirRightHandSide } from '../../src/engine/seir.ts';
import { transmissionMatrixInto } from '../../src/engine/transmission.ts';
import { demoScenario } from '../helpers/demo.ts';

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

describe('the demo scenario against odex', () => {
  it('gives the same daily susceptibles and infected for the no-measures option', () => {
    const s = demoScenario();
    const p = prepareScenario(s);
    const L = p.layout;
    const n = L.bands;
    const m = transmissionMatrixInto(new Float64Array(n * n), s, p.bands, p.beta, null);
    const rhs = seirRightHandSide(L, s.disease.latentPeriodDays, s.disease.infectiousPeriodDays, m);
    const dydt = new Float64Array(L.size);
    const f = (t: number, y: number[]) => {
      rhs(t, Float64Array.from(y), dydt);
      return Array.from(dydt);
    };
    const solver = new Solver(L.size);
    solver.absoluteTolerance = 1e-8;
    solver.relativeTolerance = 1e-10;
    solver.denseOutput = true;
    const reference = new Map<number, number[]>();
    solver.solve(f, 0, Array.from(p.initialState), 200, solver.grid(1, (t, y) => { reference.set(Math.round(t), y); }));
    const option = runScenario({ ...s, horizonDays: 200, options: [s.options[0]] }).options[0];
    for (const day of [10, 50, 80, 120, 200]) {
      const y = reference.get(day)!;
      for (let i = 0; i < n; i++) {
        const sRef = y[L.susceptible + i];
        const infectedRef = y[L.latent + i] + y[L.infectious + i];
        expect(Math.abs(option.series.susceptible[day * n + i] - sRef)).toBeLessThan(1e-5 * s.populationPersons[i]);
        expect(Math.abs(option.series.prevalence[day * n + i] - infectedRef)).toBeLessThan(1e-5 * s.populationPersons[i]);
      }
    }
  });
});
