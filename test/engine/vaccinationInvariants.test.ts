/**
 * With a campaign the engine integrates S, E, I, W, P and the quadratures Xp, Q (V for
 * all-or-nothing) only: R and X follow from invariants of the model and U is known in closed form
 * (seir.ts, vaccination/unvaccinated.ts). These tests check the shortcuts against the model with
 * every compartment and counter integrated (test/helpers/vaccinationByHand.ts):
 * - the identities hold for the equations themselves, at any state (to rounding);
 * - the engine's right-hand side equals the full model's on every component it keeps;
 * - integrated through the demo's campaign, the full model keeps R = N - (S + E + I + W + P + V),
 *   X = (S + W + P + V)(0) - (S + W + P + V) and U = N - doses given to rounding (a Runge-Kutta
 *   method keeps linear invariants exactly), and the engine's infections, protected infections
 *   and doses to non-susceptibles match its counters.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { integrate, IntegratorWorkspace } from '../../src/engine/integrator.ts';
import { integrateOption } from '../../src/engine/integrateOption.ts';
import { prepareScenario } from '../../src/engine/prepare.ts';
import { quadratureUnits, seirRightHandSide, stateLayout } from '../../src/engine/seir.ts';
import { segmentsOf } from '../../src/engine/segments.ts';
import { dosesByBandUntil } from '../../src/engine/vaccination/dosePlan.ts';
import { Unvaccinated } from '../../src/engine/vaccination/unvaccinated.ts';
import type { Scenario } from '../../src/engine/scenario.ts';
import { demoScenario } from '../helpers/demo.ts';
import { valid } from '../helpers/scenarios.ts';
import { vaccinationByHand } from '../helpers/vaccinationByHand.ts';

const protections = ['leaky', 'allOrNothing'] as const;

/** A random model: bands, stages, periods, vaccine, transmission matrix, dose rates and a state (some compartments dipped below 0). */
const randomCase = fc
  .record({
    n: fc.integer({ min: 1, max: 4 }),
    kE: fc.integer({ min: 1, max: 3 }),
    kI: fc.integer({ min: 1, max: 3 }),
    latent: fc.double({ min: 0.5, max: 10, noNaN: true }),
    infectious: fc.double({ min: 0.5, max: 10, noNaN: true }),
    efficacy: fc.double({ min: 0, max: 1, noNaN: true }),
    protection: fc.constantFrom(...protections),
    delay: fc.double({ min: 1, max: 30, noNaN: true }),
  })
  .chain((c) => {
    const blocks = 1 + c.kE + c.kI + 8;
    const person = fc.oneof(fc.double({ min: 0, max: 1e6, noNaN: true }), fc.double({ min: -1e-6, max: 0, noNaN: true }));
    return fc.record({
      c: fc.constant(c),
      M: fc.array(fc.double({ min: 0, max: 1e-5, noNaN: true }), { minLength: c.n * c.n, maxLength: c.n * c.n }),
      v: fc.array(fc.oneof(fc.constant(0), fc.double({ min: 1, max: 5000, noNaN: true })), { minLength: c.n, maxLength: c.n }),
      y: fc.array(person, { minLength: blocks * c.n, maxLength: blocks * c.n }),
      population: fc.array(fc.oneof(fc.constant(0), fc.double({ min: 1, max: 1e7, noNaN: true })), { minLength: c.n, maxLength: c.n }),
    });
  });

describe('the identities behind the derived R and X hold for the model equations', () => {
  it('sum of d(people)/dt = 0 and dX/dt = -d(S + W + P + V)/dt in every band, at any state (fast-check)', () => {
    fc.assert(
      fc.property(randomCase, ({ c, M, v, y }) => {
        const model = vaccinationByHand(c.n, c.kE, c.kI, c.latent, c.infectious, { efficacy: c.efficacy, protection: c.protection, delayDays: c.delay });
        const dy = new Float64Array(model.size);
        model.derivative(M, v, y, dy);
        const largest = dy.reduce((m, x) => Math.max(m, Math.abs(x)), 1);
        for (let i = 0; i < c.n; i++) {
          expect(Math.abs(model.people(dy, i))).toBeLessThan(1e-12 * largest);
          expect(Math.abs(dy[model.at.X + i] + model.neverInfected(dy, i))).toBeLessThan(1e-12 * largest);
        }
      }),
      { numRuns: 300, seed: 20261203 },
    );
  });
});

describe("the engine's right-hand side with vaccination", () => {
  it('equals the full model on S, E, I, W, P, V, Xp and Q (in units of 1% of the band), with U(t) = U(t0) - v (t - t0) (fast-check)', () => {
    fc.assert(
      fc.property(randomCase, fc.double({ min: 0, max: 50, noNaN: true }), fc.double({ min: 0, max: 20, noNaN: true }), ({ c, M, v, y, population }, t0, dt) => {
        const model = vaccinationByHand(c.n, c.kE, c.kI, c.latent, c.infectious, { efficacy: c.efficacy, protection: c.protection, delayDays: c.delay });
        const L = stateLayout(c.n, c.kE, c.kI, c.protection);
        const doses = new Unvaccinated(population);
        doses.atStart.set(y.slice(model.at.U, model.at.U + c.n));
        doses.enter(t0, Float64Array.from(v));
        // The full model's U at t0 + dt: the closed form, evaluated as the engine rounds it.
        const since = t0 + dt - t0;
        const full = Float64Array.from(y);
        for (let i = 0; i < c.n; i++) full[model.at.U + i] = doses.atStart[i] - v[i] * since;
        const rhs = seirRightHandSide(L, c.latent, c.infectious, Float64Array.from(M), { efficacyAgainstInfection: c.efficacy, protection: c.protection, delayToProtectionDays: c.delay }, doses, false);
        const pairs: [number, number][] = [
          [L.susceptible, 0],
          ...Array.from({ length: c.kE + c.kI }, (_, k): [number, number] => [L.latent + k * c.n, model.at.E + k * c.n]),
          [L.waiting, model.at.W],
          [L.protectedSusceptible, model.at.P],
          [L.protectedInfections, model.at.Xp],
          [L.dosesToNonSusceptible, model.at.Q],
        ];
        if (c.protection === 'allOrNothing') pairs.push([L.vaccineImmune, model.at.V]);
        const units = quadratureUnits(doses.population);
        const inUnits = (engine: number, i: number) => (engine === L.protectedInfections || engine === L.dosesToNonSusceptible ? units[i] : 1);
        const state = new Float64Array(L.size);
        for (const [engine, at] of pairs) for (let i = 0; i < c.n; i++) state[engine + i] = y[at + i] / inUnits(engine, i);
        const expected = new Float64Array(model.size);
        model.derivative(M, v, full, expected);
        const got = new Float64Array(L.size);
        rhs(t0 + dt, state, got);
        const largest = expected.reduce((m, x) => Math.max(m, Math.abs(x)), 1);
        expect(pairs.length * c.n).toBe(L.size);
        for (const [engine, at] of pairs) for (let i = 0; i < c.n; i++) expect(Math.abs(got[engine + i] * inUnits(engine, i) - expected[at + i])).toBeLessThanOrEqual(1e-9 * largest);
      }),
      { numRuns: 300, seed: 20261204 },
    );
  });
});

/** The demo with its campaign's protection set to `protection`. */
function demoWith(protection: (typeof protections)[number]): Scenario {
  const s = demoScenario();
  return valid({ ...s, vaccinationCampaigns: s.vaccinationCampaigns.map((c) => ({ ...c, protection })) });
}

describe('through the demo campaign (tight tolerances)', () => {
  const TIGHT = { relative: 1e-10, absolute: 1e-10 };
  it.each(protections)('%s: the full model keeps the invariants to rounding, and the engine matches its counters', { timeout: 60_000 }, (protection) => {
    const s = demoWith(protection);
    const p = prepareScenario(s);
    const option = s.options.find((o) => o.vaccinationCampaign !== undefined)!;
    const campaign = p.campaigns.get(option.vaccinationCampaign!)!;
    const segments = segmentsOf(p, option, campaign.plan);
    const n = p.bands.bands;
    const H = s.horizonDays;
    const N = s.populationPersons;
    const vaccine = campaign.vaccine;
    const model = vaccinationByHand(n, p.periods.latentStages, p.periods.infectiousStages, p.periods.latentPeriodDays, p.periods.infectiousPeriodDays, {
      efficacy: vaccine.efficacyAgainstInfection,
      protection: vaccine.protection,
      delayDays: vaccine.delayToProtectionDays,
    });
    // Day 0 as the engine has it (initialState.ts), with R, U and X.
    const engineLayout = stateLayout(n, p.periods.latentStages, p.periods.infectiousStages, protection);
    const y = new Float64Array(model.size);
    for (let i = 0; i < n; i++) {
      y[i] = p.initialSusceptible[i];
      y[model.at.E + i] = p.initialState[p.layout.latent + i];
      y[model.at.I + i] = p.initialState[p.layout.infectious + i];
      y[model.at.R + i] = p.initialState[p.layout.recovered + i];
      y[model.at.U + i] = N[i];
    }
    const before = Array.from({ length: n }, (_, i) => model.neverInfected(y, i));
    const days = Array.from({ length: H }, (_, d) => d + 1);
    const X = new Float64Array((H + 1) * n);
    const Xp = new Float64Array((H + 1) * n);
    let worstR = 0;
    let worstX = 0;
    let worstU = 0;
    const check = (t: number, state: Float64Array): void => {
      const d = Math.round(t);
      const given = dosesByBandUntil(campaign.plan, n, t);
      for (let i = 0; i < n; i++) {
        worstR = Math.max(worstR, Math.abs(model.people(state, i) - N[i]) / N[i]);
        worstX = Math.max(worstX, Math.abs(state[model.at.X + i] - (before[i] - model.neverInfected(state, i))) / N[i]);
        worstU = Math.max(worstU, Math.abs(state[model.at.U + i] - (N[i] - given[i])) / N[i]);
        X[d * n + i] = state[model.at.X + i];
        Xp[d * n + i] = state[model.at.Xp + i];
      }
    };
    const ws = new IntegratorWorkspace(model.size);
    const unvaccinated = new Unvaccinated(N);
    let worstClosedForm = 0;
    for (const seg of segments) {
      const f = (_t: number, state: Float64Array, out: Float64Array) => model.derivative(seg.transmission, seg.doseRates, state, out);
      integrate(f, y, seg.fromDay, seg.toDay, days, check, ws, { relative: 1e-10, absolute: 1e-10, maxStep: 7 });
      unvaccinated.enter(seg.fromDay, seg.doseRates);
      const given = dosesByBandUntil(campaign.plan, n, seg.fromDay);
      for (let i = 0; i < n; i++) worstClosedForm = Math.max(worstClosedForm, Math.abs(unvaccinated.atStart[i] - (N[i] - given[i])) / N[i]);
    }
    expect(worstR).toBeLessThan(1e-12);
    expect(worstX).toBeLessThan(1e-12);
    expect(worstU).toBeLessThan(1e-12);
    expect(worstClosedForm).toBeLessThan(1e-12);

    const daily = integrateOption(p, segments, campaign, null, TIGHT);
    expect(engineLayout.size).toBe(protection === 'leaky' ? 7 * n : 8 * n);
    let worstCumulative = 0;
    let worstProtected = 0;
    for (let k = 0; k < (H + 1) * n; k++) {
      const i = k % n;
      worstCumulative = Math.max(worstCumulative, Math.abs(daily.cumulative[k] - Math.max(0, X[k])) / N[i]);
      worstProtected = Math.max(worstProtected, Math.abs(daily.protectedCumulative[k] - Math.max(0, Xp[k])) / N[i]);
    }
    expect(worstCumulative).toBeLessThan(1e-9);
    expect(worstProtected).toBeLessThan(1e-9);
    for (let i = 0; i < n; i++) expect(Math.abs(daily.dosesToNonSusceptible[i] - y[model.at.Q + i]) / N[i]).toBeLessThan(1e-9);
    // The campaign really moved people: the comparison is not between zeros.
    expect(Math.max(...Xp)).toBeGreaterThan(100);
    expect(Math.max(...daily.dosesToNonSusceptible)).toBeGreaterThan(100);
  });
});
