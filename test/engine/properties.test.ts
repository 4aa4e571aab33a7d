/**
 * Property tests (fast-check): any valid scenario runs without throwing, within an integrator
 * step budget, and gives finite, non-negative, bounded outcomes. Small random scenarios: 1-4
 * bands, random reciprocal contacts in two settings, random phases, optional hospital section
 * and vaccination campaign.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { MIN_PERIOD_DAYS } from '../../src/engine/limits.ts';
import { integratorStepsSoFar } from '../../src/engine/integrator.ts';
import { runScenario } from '../../src/engine/run.ts';
import type { Scenario, ScenarioInput } from '../../src/engine/scenario.ts';
import { validateScenario } from '../../src/engine/validation.ts';

const positive = (max: number) => fc.double({ min: MIN_PERIOD_DAYS, max, noNaN: true });
const unit = fc.double({ min: 0, max: 1, noNaN: true });

const scenarioArbitrary = fc.integer({ min: 1, max: 4 }).chain((n) =>
  fc.record({
    n: fc.constant(n),
    population: fc.array(fc.oneof(fc.constant(0), fc.double({ min: 1, max: 1e6, noNaN: true })), { minLength: n, maxLength: n }),
    totals: fc.array(fc.array(fc.array(fc.double({ min: 0, max: 5000, noNaN: true }), { minLength: n, maxLength: n }), { minLength: n, maxLength: n }), { minLength: 2, maxLength: 2 }),
    r0: fc.double({ min: 0.1, max: 6, noNaN: true }),
    latent: positive(8),
    infectious: positive(10),
    stages: fc.tuple(fc.integer({ min: 1, max: 3 }), fc.integer({ min: 1, max: 3 })),
    susceptibility: fc.array(fc.double({ min: 0, max: 2, noNaN: true }), { minLength: n, maxLength: n }),
    immunity: fc.array(fc.double({ min: 0, max: 0.9, noNaN: true }), { minLength: n, maxLength: n }),
    ifr: fc.array(fc.double({ min: 0, max: 0.2, noNaN: true }), { minLength: n, maxLength: n }),
    horizon: fc.integer({ min: 1, max: 200 }),
    phase: fc.option(fc.record({ from: fc.integer({ min: 0, max: 50 }), length: fc.integer({ min: 1, max: 100 }), home: fc.double({ min: 0, max: 1.5, noNaN: true }), away: unit, isolation: unit, shield: unit })),
    hospital: fc.boolean(),
    vaccine: fc.option(fc.record({ day: fc.integer({ min: 0, max: 60 }), doses: fc.double({ min: 0, max: 5e4, noNaN: true }), efficacy: unit, extra: unit, leaky: fc.boolean(), ceiling: unit })),
  }),
);

type Generated = typeof scenarioArbitrary extends fc.Arbitrary<infer T> ? T : never;

function scenarioFrom(g: Generated): ScenarioInput {
  const n: number = g.n;
  const N: number[] = g.population.map((x: number, i: number) => (i === 0 ? Math.max(x, 100) : x));
  // Reciprocal by construction: C_ij = W_ij / N_i with W symmetric (zero rows where N_i = 0).
  const setting = (name: string, t: number[][]) => ({
    name,
    contactsPerDay: N.map((Ni, i) => N.map((_, j) => (Ni > 0 ? (t[Math.min(i, j)][Math.max(i, j)] * 0.001 * Math.min(Ni, N[j])) / Ni : 0))),
  });
  const seeds = N.map((x, i) => (i === 0 ? Math.min(1, x * (1 - g.immunity[0])) : 0));
  const phases = g.phase === null ? [] : [{
    fromDay: g.phase.from, toDay: g.phase.from + g.phase.length,
    settingMultipliers: { home: g.phase.home, away: g.phase.away }, caseIsolation: g.phase.isolation,
    ageFactors: [{ setting: 'away', bands: [n - 1], factor: g.phase.shield }],
  }];
  const e = g.vaccine;
  return {
    format: 'mixwise-scenario', version: 1, title: 'random',
    ageBands: N.map((_, i) => ({ label: `b${i}`, lowerAgeYears: 20 * i })),
    populationPersons: N,
    settings: [setting('home', g.totals[0]), setting('away', g.totals[1])],
    disease: {
      transmission: { kind: 'r0', r0: g.r0 }, latentPeriodDays: g.latent, infectiousPeriodDays: g.infectious,
      latentStages: g.stages[0], infectiousStages: g.stages[1], relativeSusceptibility: g.susceptibility,
    },
    severity: { infectionFatalityRatio: g.ifr, source: 'test' },
    initialState: { infectedPersons: seeds, priorImmunityFraction: g.immunity },
    horizonDays: g.horizon,
    options: [
      { name: 'none' },
      { name: 'measures', phases, vaccinationCampaign: e === null ? undefined : 'c' },
    ],
    ...(g.hospital ? { healthcare: { capacity: { wardBeds: 10, icuBeds: 1 } } } : {}),
    ...(e === null ? {} : {
      vaccinationCampaigns: [{
        name: 'c', schedule: [{ fromDay: e.day, dosesPerDay: e.doses }], uptakeCeiling: N.map(() => e.ceiling),
        efficacyAgainstInfection: e.efficacy, efficacyAgainstDeath: e.efficacy + (1 - e.efficacy) * e.extra,
        protection: e.leaky ? 'leaky' : 'allOrNothing', priority: [N.map((_, i) => n - 1 - i)],
      }],
    }),
  } as ScenarioInput;
}

/**
 * Integrator step budget of a whole run (a work measure, not a clock): per option the integrator
 * steps at most about 2.5 / (fastest stage or protection rate) days for stability (Hairer & Wanner
 * 1996, Solving ODEs II, section IV.2) and at most 10 days, so it needs at least H / that step;
 * the budget allows STEP_MARGIN times that (the random scenarios use up to about a quarter of it),
 * plus STEPS_PER_RESTART for each restart (start-up steps and rejections after the right-hand
 * side jumps). A run beyond it is a hang in the making, however fast the machine.
 */
const STEP_MARGIN = 4;
const STEPS_PER_RESTART = 60;
function stepBudget(s: Scenario): number {
  const d = s.disease;
  const rates = [d.latentStages / d.latentPeriodDays, d.infectiousStages / d.infectiousPeriodDays, ...s.vaccinationCampaigns.map((c) => 1 / c.delayToProtectionDays)];
  const stableStep = Math.min(10, 2.5 / Math.max(...rates));
  const restarts = s.options.reduce((acc, o) => acc + 1 + 2 * o.phases.length, 0) + s.vaccinationCampaigns.reduce((acc, c) => acc + 2 * (c.schedule.length + s.ageBands.length), 0);
  return s.options.length * STEP_MARGIN * Math.ceil(s.horizonDays / stableStep) + STEPS_PER_RESTART * restarts;
}

const finiteNonNegative = (xs: ArrayLike<number>) => Array.from(xs).every((v) => Number.isFinite(v) && v >= 0);

describe('any valid scenario', () => {
  it('runs, and every outcome is finite, non-negative and within its bounds', () => {
    fc.assert(
      fc.property(scenarioArbitrary, (g) => {
        const checked = validateScenario(scenarioFrom(g));
        // Random contacts can be too thin to carry any transmission: then the file is refused (and
        // said why), which is the right outcome; anything else refused is a generator mistake.
        if (!checked.ok) {
          expect(checked.problems.map((p) => p.path)).toEqual(['disease.transmission.r0']);
          return;
        }
        const before = integratorStepsSoFar();
        const r = runScenario(checked.scenario);
        const steps = integratorStepsSoFar() - before;
        expect(steps).toBeLessThanOrEqual(stepBudget(checked.scenario));
        expect(Number.isFinite(r.r0) && r.r0 >= 0).toBe(true);
        for (const o of r.options) {
          expect(Number.isFinite(o.rStart) && o.rStart >= 0).toBe(true);
          expect(Number.isFinite(o.growthRatePerDay)).toBe(true);
          expect(o.attackRate).toBeGreaterThanOrEqual(0);
          expect(o.attackRate).toBeLessThanOrEqual(1 + 1e-9);
          o.attackRateByBand.forEach((a) => expect(a).toBeLessThanOrEqual(1 + 1e-9));
          expect(o.deaths).toBeLessThanOrEqual(o.infections * 0.2 + 1e-9);
          expect(o.peakDay).toBeGreaterThanOrEqual(0);
          expect(o.peakDay).toBeLessThanOrEqual(checked.scenario.horizonDays);
          const s = o.series;
          for (const xs of [s.susceptible, s.prevalence, s.incidence, s.deaths, s.rt, s.doses]) expect(finiteNonNegative(xs)).toBe(true);
          expect(finiteNonNegative([o.infections, o.deaths, o.peakInfectedPersons, ...o.infectionsByBand, ...o.deathsByBand])).toBe(true);
          if (o.healthcare !== null) {
            const h = o.healthcare.series;
            for (const xs of [h.admissions, h.icuAdmissions, h.wardOccupancy, h.icuOccupancy]) expect(finiteNonNegative(xs)).toBe(true);
          }
          if (o.vaccination !== null) {
            expect(o.vaccination.dosesToNonSusceptibleShare).toBeGreaterThanOrEqual(0);
            expect(o.vaccination.dosesToNonSusceptibleShare).toBeLessThanOrEqual(1 + 1e-9);
          }
        }
      }),
      { numRuns: 80, seed: 4242 },
    );
  });
});
