/**
 * A sweep of extreme but valid scenarios: R0 from 0.01 to the largest allowed, populations from 1
 * to 1e9 persons a band, 1 to 21 bands, horizons of 1 to 3650 days, the most Erlang stages and
 * the shortest periods. Every result must be finite and non-negative, and conserve people:
 * susceptible at the end + infections = population, band by band. Work is bounded by integrator
 * steps, not time.
 */
import { describe, expect, it } from 'vitest';
import { integratorStepsSoFar } from '../../src/engine/integrator.ts';
import { runScenario, type ScenarioInput } from '../../src/engine/index.ts';
import { MAX_CONTACTS_PER_DAY, MAX_R0, MIN_PERIOD_DAYS } from '../../src/engine/limits.ts';
import { valid } from '../helpers/scenarios.ts';
import { demoScenario } from '../helpers/demo.ts';

interface Extreme {
  label: string;
  bands: number;
  /** Persons in band i. */
  population: (i: number) => number;
  r0: number;
  horizon: number;
  stages: [number, number];
  periods?: [number, number];
  contacts?: number;
  /** Proportionate mixing, C_ij = 10 N_j / sum N (reciprocal: N_i C_ij = N_j C_ji), for bands of very different sizes. */
  proportionate?: boolean;
}

function contact(e: Extreme, population: number[], i: number, j: number): number {
  if (e.proportionate === true) return (10 * population[j]) / population.reduce((a, b) => a + b, 0);
  return e.contacts ?? (i === j ? 6 : 1 + ((i + 2 * j) % 3));
}

function scenarioOf(e: Extreme): ScenarioInput {
  const n = e.bands;
  const population = Array.from({ length: n }, (_, i) => e.population(i));
  return {
    format: 'mixwise-scenario',
    version: 1,
    title: e.label,
    ageBands: Array.from({ length: n }, (_, i) => ({ label: `band ${i}`, lowerAgeYears: i * 5 })),
    populationPersons: population,
    settings: [{ name: 'all', contactsPerDay: Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => contact(e, population, i, j))) }],
    disease: {
      transmission: { kind: 'r0', r0: e.r0 },
      latentPeriodDays: e.periods?.[0] ?? 3,
      infectiousPeriodDays: e.periods?.[1] ?? 5,
      latentStages: e.stages[0],
      infectiousStages: e.stages[1],
    },
    severity: { infectionFatalityRatio: Array.from({ length: n }, (_, i) => Math.min(1, 1e-4 * (i + 1))), source: 'test values' },
    initialState: { infectedPersons: population.map((p, i) => (i === 0 ? Math.min(1, p / 2) : 0)) },
    horizonDays: e.horizon,
    options: [
      { name: 'none' },
      { name: 'halved', phases: [{ fromDay: 0, toDay: Math.max(1, Math.floor(e.horizon / 2)), settingMultipliers: { all: 0.5 } }] },
    ],
  };
}

const SWEEP: Extreme[] = [
  { label: 'one person, R0 0.01, one day', bands: 1, population: () => 1, r0: 0.01, horizon: 1, stages: [1, 1] },
  { label: 'one band of 1e9, R0 30, ten years, 20/20 stages', bands: 1, population: () => 1e9, r0: 30, horizon: 3650, stages: [20, 20] },
  { label: '21 bands of one person, R0 30, 20/20 stages', bands: 21, population: () => 1, r0: 30, horizon: 365, stages: [20, 20] },
  { label: '21 bands of 1e9, R0 0.01, ten years', bands: 21, population: () => 1e9, r0: 0.01, horizon: 3650, stages: [1, 1] },
  { label: '21 bands of 1e9, R0 30, ten years, 20/20 stages', bands: 21, population: () => 1e9, r0: 30, horizon: 3650, stages: [20, 20] },
  { label: 'bands from 1 to 1e9 persons, R0 1', bands: 10, population: (i) => 10 ** i, r0: 1, horizon: 1000, stages: [20, 1], proportionate: true },
  { label: `R0 ${MAX_R0} with the shortest periods and most stages`, bands: 5, population: () => 1e6, r0: MAX_R0, horizon: 365, stages: [20, 20], periods: [MIN_PERIOD_DAYS, MIN_PERIOD_DAYS] },
  { label: `every contact at ${MAX_CONTACTS_PER_DAY} a day`, bands: 21, population: (i) => 1e3 * (i + 1), r0: 30, horizon: 200, stages: [1, 20], contacts: MAX_CONTACTS_PER_DAY },
];

/** Integrator steps one scenario may take (two options): a generous bound, far above what they need. */
const STEP_BUDGET = 400_000;

describe('extreme valid scenarios', () => {
  it.each(SWEEP.map((e) => [e.label, e] as const))('%s: finite, non-negative, conserved', (_label, e) => {
    const scenario = valid(scenarioOf(e));
    const before = integratorStepsSoFar();
    const results = runScenario(scenario);
    expect(integratorStepsSoFar() - before).toBeLessThanOrEqual(STEP_BUDGET);
    expect(Number.isFinite(results.r0) && results.r0 > 0).toBe(true);
    const n = e.bands;
    const H = e.horizon;
    for (const o of results.options) {
      for (const series of [o.series.susceptible, o.series.prevalence, o.series.incidence, o.series.deaths, o.series.rt]) {
        expect(series.every((x) => Number.isFinite(x) && x >= 0)).toBe(true);
      }
      for (const x of [o.attackRate, o.peakPrevalence, ...o.attackRateByBand]) expect(x >= 0 && x <= 1).toBe(true);
      for (const x of [o.infections, o.deaths, o.rStart, ...o.infectionsByBand, ...o.deathsByBand]) expect(Number.isFinite(x) && x >= 0).toBe(true);
      for (let i = 0; i < n; i++) {
        const people = scenario.populationPersons[i];
        const accounted = o.series.susceptible[H * n + i] + o.infectionsByBand[i];
        // Conservation to 1e-9 of the band (the integrator conserves to rounding; flushed tails are below 1e-100 persons).
        expect(Math.abs(accounted - people)).toBeLessThanOrEqual(1e-9 * people);
      }
    }
  }, 600_000);
});

describe('an epidemic suppressed for a year, then released', () => {
  // Below the absolute tolerance (1e-6 persons) the integrator may leave infectious stages a
  // little negative while the measures hold prevalence down. When they lift, such a dip must
  // not seed a growing "negative epidemic" in the force of infection: the run ends, finite,
  // non-negative and conserved.
  it('runs to its horizon, finite, non-negative and conserved', () => {
    const demo = demoScenario();
    const tenth = Object.fromEntries(demo.settings.map((setting) => [setting.name, 0.1]));
    const scenario = valid({
      ...structuredClone(demo),
      horizonDays: 900,
      referenceOption: undefined,
      options: [{ name: 'suppress, then release', phases: [{ fromDay: 20, toDay: 400, settingMultipliers: tenth, caseIsolation: 0.5 }] }],
    } as ScenarioInput);
    const results = runScenario(scenario);
    const o = results.options[0];
    const n = scenario.ageBands.length;
    for (const series of [o.series.susceptible, o.series.prevalence, o.series.incidence]) expect(series.every((x) => Number.isFinite(x) && x >= 0)).toBe(true);
    expect(o.attackRate > 0 && o.attackRate <= 1).toBe(true);
    for (let i = 0; i < n; i++) {
      // Those not immune at the start are still susceptible or were infected (seeds included).
      const people = scenario.populationPersons[i] * (1 - (scenario.initialState.priorImmunityFraction?.[i] ?? 0));
      expect(Math.abs(o.series.susceptible[900 * n + i] + o.infectionsByBand[i] - people)).toBeLessThanOrEqual(1e-9 * people);
    }
  }, 120_000);
});
