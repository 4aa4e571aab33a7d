/**
 * Numeric limits of the engine, one check per defect found by feeding it extreme input:
 * no hang, no NaN, fractions in [0, 1], no subnormal slow-down, no built-in names read as values.
 */
import { describe, expect, it } from 'vitest';
import { settingMultipliers } from '../../src/engine/contacts.ts';
import { dailyDelayWeights, regularizedLowerGamma } from '../../src/engine/distributions.ts';
import { DEFAULT_TOLERANCES, IntegratorWorkspace, integrate } from '../../src/engine/integrator.ts';
import { growthRateFromR } from '../../src/engine/growth.ts';
import { profileLikelihoodInterval } from '../../src/engine/fitting/profileInterval.ts';
import { runScenario } from '../../src/engine/index.ts';
import { nextGenerationMatrixInto } from '../../src/engine/ngm.ts';
import { perronRoot } from '../../src/engine/perronRoot.ts';
import { bandParameters, transmissionMatrixInto } from '../../src/engine/transmission.ts';
import { demoScenario } from '../helpers/demo.ts';
import type { Phase, ScenarioInput, Setting } from '../../src/engine/scenario.ts';
import { oneBand, valid } from '../helpers/scenarios.ts';
import { dosePlan, dosesByBandUntil } from '../../src/engine/vaccination/dosePlan.ts';

const SMALLEST_NORMAL = 2.2250738585072014e-308;
const isSubnormal = (x: number): boolean => x !== 0 && Math.abs(x) < SMALLEST_NORMAL;

describe('engine numeric limits', () => {
  it('finds the dominant eigenvalue of a matrix whose entries span 200 orders of magnitude (it used to hang)', () => {
    // K = [[1e200, 1], [1, 2]]: rho = 1e200 to double precision (the off-diagonal coupling adds 1e-200 of it).
    const k = Float64Array.from([1e200, 1, 1, 2]);
    expect(perronRoot(k, 2) / 1e200).toBeCloseTo(1, 12);
    // The demo's K at beta = 1 with one contact of 1e200: the case that hung R0 calibration.
    const s = demoScenario();
    s.settings[0].contactsPerDay[0][0] = 1e200;
    const bp = bandParameters(s);
    const n = bp.bands;
    const kDemo = nextGenerationMatrixInto(new Float64Array(n * n), transmissionMatrixInto(new Float64Array(n * n), s, bp, 1, null), bp.population, s.disease.infectiousPeriodDays);
    expect(perronRoot(kDemo, n) / kDemo[0]).toBeCloseTo(1, 12);
    // A triangular matrix: rho is the largest diagonal entry.
    const t = Float64Array.from([3, 1e-250, 0, 0, 1e-180, 7, 0, 0, 5]);
    expect(perronRoot(t, 3)).toBeCloseTo(5, 12);
  });

  it('ends a profile-likelihood interval around an estimate of 1e7 (bisection to 1e-10 never ended where doubles are 2e-9 apart)', () => {
    let evaluations = 0;
    const profile = (v: number): number => {
      evaluations++;
      return -0.5 * ((v - 1e7) / 1e-3) ** 2;
    };
    const { interval, notDetermined } = profileLikelihoodInterval(1e7, 0, 1e-3, profile);
    const [lower, upper] = interval;
    expect(lower).toBeCloseTo(1e7 - 1.96e-3, 5);
    expect(upper).toBeCloseTo(1e7 + 1.96e-3, 5);
    expect(notDetermined).toEqual([null, null]);
    expect(evaluations).toBeLessThanOrEqual(2 * 60);
  });

  it('gives finite delay weights for a shape near the top of double precision (they used to be NaN)', () => {
    const w = dailyDelayWeights(21, 1e306, 60);
    expect(w.every(Number.isFinite)).toBe(true);
    // A point mass at 21 days: the event at mid-day 21 - 0.5 .. 21 + 0.5 holds all of it.
    expect(w[21]).toBe(1);
    expect(w.reduce((a, b) => a + b, 0)).toBe(1);
    expect(regularizedLowerGamma(1e306, 1e300)).toBe(0);
    expect(regularizedLowerGamma(1e306, 1e307)).toBe(1);
  });

  it('reads a multiplier only for settings the phase names, even a setting called constructor', () => {
    const settings = ['constructor', 'toString', 'school'].map((name): Setting => ({ name, contactsPerDay: [[1]] }));
    const phase: Phase = { fromDay: 0, toDay: 10, settingMultipliers: { school: 0 }, ageFactors: [], caseIsolation: 0 };
    expect(Array.from(settingMultipliers(settings, phase))).toEqual([1, 1, 0]);
  });

  it('keeps attack rates and prevalence in [0, 1] under very fast growth (rounding gave 1 + 6e-13)', () => {
    const o = runScenario(oneBand({ r0: 100, latent: 3, infectious: 0.5, seed: 1, population: 1e6, horizon: 200 })).options[0];
    expect(o.infections / 1e6).toBeGreaterThan(0.999999);
    for (const x of [o.attackRate, ...o.attackRateByBand, o.peakPrevalence, o.finalSize?.attackRate ?? 0]) {
      expect(x).toBeGreaterThanOrEqual(0);
      expect(x).toBeLessThanOrEqual(1);
    }
  });

  it('flushes compartments that decay into subnormal floats (they made long runs ten times slower)', () => {
    // y' = -y from 1 for 1000 days reaches e^-1000, far below the smallest normal double (tolerances
    // tight enough to follow it all the way down).
    const y = Float64Array.from([1, 2]);
    const seen: number[] = [];
    const ws = new IntegratorWorkspace(2);
    const days = Array.from({ length: 1000 }, (_, d) => d + 1);
    integrate((_t, state, out) => {
      out[0] = -state[0];
      out[1] = -state[1];
      seen.push(state[0], state[1]);
    }, y, 0, 1000, days, () => undefined, ws, { ...DEFAULT_TOLERANCES, absolute: 1e-300, relative: 1e-6 });
    expect(seen.some(isSubnormal)).toBe(false);
    expect(Array.from(y)).toEqual([0, 0]);
    const run = runScenario(oneBand({ r0: 30, latentStages: 20, infectiousStages: 20, horizon: 3650 })).options[0];
    expect(run.series.prevalence.some(isSubnormal)).toBe(false);
    expect(run.series.incidence.some(isSubnormal)).toBe(false);
  });

  it('finds a growth rate for any finite R (the search for an upper end is bounded)', () => {
    const periods = { latentPeriodDays: 3, infectiousPeriodDays: 5, latentStages: 20, infectiousStages: 20 };
    for (const r of [1e-300, 0.5, 2, 1e10, 1e300]) expect(Number.isFinite(growthRateFromR(r, periods))).toBe(true);
  });

  it('gives every dose of a huge daily supply (1e20 a day made the campaign vanish)', () => {
    // Validation now stops such a supply; the plan must still not lose doses to rounding.
    const campaign = { ...valid(withCampaign(1e4)).vaccinationCampaigns[0], schedule: [{ fromDay: 30, dosesPerDay: 1e20 }] };
    const plan = dosePlan(campaign, [1000, 2000], 100);
    const doses = dosesByBandUntil(plan, 2, 100);
    // Within rounding of t + 1e-6 days - t (a relative 1e-9).
    expect(doses[0]).toBeCloseTo(500, 5);
    expect(doses[1]).toBeCloseTo(1600, 5);
    expect(plan.every((piece) => piece.toDay > piece.fromDay)).toBe(true);
  });
});

function withCampaign(dosesPerDay: number): ScenarioInput {
  return {
    format: 'mixwise-scenario',
    version: 1,
    title: 'two bands, one campaign',
    ageBands: [{ label: 'young', lowerAgeYears: 0 }, { label: 'old', lowerAgeYears: 60 }],
    populationPersons: [1000, 2000],
    settings: [{ name: 'all', contactsPerDay: [[5, 2], [1, 4]] }],
    disease: { transmission: { kind: 'r0', r0: 2 }, latentPeriodDays: 3, infectiousPeriodDays: 5 },
    severity: { infectionFatalityRatio: [0.001, 0.01], source: 'test value' },
    initialState: { infectedPersons: [1, 1] },
    horizonDays: 100,
    options: [{ name: 'vaccinate', vaccinationCampaign: 'c' }],
    vaccinationCampaigns: [
      { name: 'c', schedule: [{ fromDay: 30, dosesPerDay }], uptakeCeiling: [0.5, 0.8], efficacyAgainstInfection: 0.5, efficacyAgainstDeath: 0.8, priority: [[1], [0]] },
    ],
  };
}
