/** Whole-option runs: conservation, deaths, determinism, measures, and no impossible values. */
import { describe, expect, it } from 'vitest';
import { IntegratorWorkspace, integrate } from '../../src/engine/integrator.ts';
import { prepareScenario } from '../../src/engine/prepare.ts';
import { runScenario } from '../../src/engine/run.ts';
import { seirRightHandSide } from '../../src/engine/seir.ts';
import { transmissionMatrixInto } from '../../src/engine/transmission.ts';
import { demoScenario } from '../helpers/demo.ts';
import { valid } from '../helpers/scenarios.ts';
import type { ScenarioInput } from '../../src/engine/scenario.ts';

describe('population conservation', () => {
  it('S + E + I + R stays the 16-band population to 1e-9 relative at every day', () => {
    const s = demoScenario();
    const base = { ...s, disease: { ...s.disease, latentStages: 2, infectiousStages: 3 } };
    const p = prepareScenario(valid(base));
    const L = p.layout;
    const n = L.bands;
    const total = s.populationPersons.reduce((a, b) => a + b, 0);
    const m = transmissionMatrixInto(new Float64Array(n * n), p.scenario, p.bands, p.beta, null);
    const rhs = seirRightHandSide(L, s.disease.latentPeriodDays, s.disease.infectiousPeriodDays, m);
    const y = p.initialState.slice();
    let worst = 0;
    integrate(rhs, y, 0, 365, Array.from({ length: 365 }, (_, d) => d + 1), (_t, state) => {
      let sum = 0;
      for (let k = 0; k < L.cumulative; k++) sum += state[k];
      worst = Math.max(worst, Math.abs(sum - total) / total);
    }, new IntegratorWorkspace(L.size));
    expect(worst).toBeLessThan(1e-9);
  });
});

describe('deaths', () => {
  it('equal the sum of IFR x infections by band (less with a vaccine that protects against death), and the daily series adds up to them', () => {
    const s = demoScenario();
    const r = runScenario(s);
    for (const o of r.options) {
      o.deathsByBand.forEach((d, i) => {
        const unprotected = s.severity.infectionFatalityRatio[i] * o.infectionsByBand[i];
        if (o.vaccination === null) expect(d).toBeCloseTo(unprotected, 9);
        else expect(d).toBeLessThanOrEqual(unprotected + 1e-9);
      });
      expect(o.deaths).toBeCloseTo(o.deathsByBand.reduce((a, b) => a + b, 0), 9);
      const daily = o.series.deaths.reduce((a, b) => a + b, 0);
      // Deaths of late infections fall beyond the horizon, so the series is a little short.
      expect(daily).toBeLessThanOrEqual(o.deaths * (1 + 1e-9));
      expect(daily).toBeGreaterThan(0.99 * o.deaths);
    }
  });
});

describe('determinism and sanity', () => {
  it('the same scenario gives the same numbers bit for bit', () => {
    const a = runScenario(demoScenario());
    const b = runScenario(demoScenario());
    expect(a.options.map((o) => [o.attackRate, o.deaths, o.peakDay, o.rStart])).toEqual(b.options.map((o) => [o.attackRate, o.deaths, o.peakDay, o.rStart]));
    expect(Array.from(a.options[1].series.rt)).toEqual(Array.from(b.options[1].series.rt));
  });

  it('never returns NaN or negative numbers', () => {
    const r = runScenario(demoScenario());
    for (const o of r.options) {
      for (const arr of [o.series.susceptible, o.series.prevalence, o.series.incidence, o.series.deaths, o.series.rt]) {
        expect(Array.from(arr).filter((v) => !(Number.isFinite(v) && v >= 0))).toEqual([]);
      }
      expect(o.attackRate).toBeGreaterThanOrEqual(0);
      expect(o.attackRate).toBeLessThanOrEqual(1);
    }
  });

  it('incidence adds up to infections by band', () => {
    const o = runScenario(demoScenario()).options[0];
    const n = o.series.bands;
    for (let i = 0; i < n; i++) {
      let sum = 0;
      for (let d = 0; d < o.series.days; d++) sum += o.series.incidence[d * n + i];
      expect(Math.abs(sum - o.infectionsByBand[i]) / o.infectionsByBand[i]).toBeLessThan(1e-9);
    }
  });
});

describe('measures', () => {
  const s = demoScenario();
  const base = s.options[0];
  const withPhase = (phase: ScenarioInput['options'][number]['phases'] extends (infer P)[] | undefined ? P : never) => valid({ ...s, options: [base, { name: 'measure', phases: [phase] }] });

  it('closing every setting from day 0 gives R at start 0 and stops spread', () => {
    const all = Object.fromEntries(s.settings.map((st) => [st.name, 0]));
    const r = runScenario(withPhase({ fromDay: 0, toDay: s.horizonDays, settingMultipliers: all }));
    expect(r.options[1].rStart).toBe(0);
    expect(r.options[1].growthRatePerDay).toBeLessThan(0);
    expect(r.options[1].doublingTimeDays).toBeNull();
    expect(r.options[1].halvingTimeDays).toBeGreaterThan(0);
    expect(r.options[1].infections).toBeLessThan(2 * s.initialState.infectedPersons.reduce((a, b) => a + b, 0));
  });

  it('case isolation c scales R at start by (1 - c)', () => {
    const r = runScenario(withPhase({ fromDay: 0, toDay: 30, caseIsolation: 0.3 }));
    expect(r.options[1].rStart).toBeCloseTo(0.7 * r.options[0].rStart, 10);
  });

  it('R(t) shows the phase: lower inside it, back up after (for the same susceptibles)', () => {
    const r = runScenario(withPhase({ fromDay: 10, toDay: 40, settingMultipliers: { work: 0.2, other: 0.5 } }));
    const rt = r.options[1].series.rt;
    expect(rt[9]).toBeGreaterThan(rt[10] * 1.1);
    expect(rt[40]).toBeGreaterThan(rt[39] * 1.1);
    expect(r.options[1].peakDay).toBeGreaterThan(r.options[0].peakDay);
    expect(r.options[1].finalSize).toBeNull();
    expect(r.options[0].finalSize).not.toBeNull();
  });

  it('the final-size cross-check agrees with a constant-measures run that has finished', () => {
    const long = valid({ ...s, referenceOption: undefined, horizonDays: 1500, options: [{ name: 'work halved', phases: [{ fromDay: 0, toDay: 1500, settingMultipliers: { work: 0.5 } }] }] });
    const o = runScenario(long).options[0];
    expect(o.finalSize).not.toBeNull();
    o.attackRateByBand.forEach((z, i) => expect(z).toBeCloseTo(o.finalSize!.attackRateByBand[i], 4));
  });
});
