/**
 * The engine's main results against published formulas with worked numbers
 * (see shared/CHECKS.md; every number is recomputed here, not trusted).
 */
import { describe, expect, it } from 'vitest';
import { runScenario } from '../../src/engine/run.ts';
import { correctReciprocity } from '../../src/engine/contacts.ts';
import { doublingTimeDays, generationIntervalTransform, growthRateFromR, halvingTimeDays, reproductionNumberFromGrowthRate } from '../../src/engine/growth.ts';
import { finalSizeByBand } from '../../src/engine/finalSize.ts';
import { oneGroupFinalSize } from '../helpers/byHand.ts';
import { seededRandom } from '../helpers/random.ts';
import { oneBand, twoBand, valid } from '../helpers/scenarios.ts';

describe('final size, one group', () => {
  // Kermack & McKendrick 1927, Proc R Soc Lond A 115:700: z = 1 - exp(-R0 z); valid for SEIR too.
  // Worked values from shared/CHECKS.md item 1 [derived]: 0.582812, 0.796812, 0.892645, 0.940480.
  const table: [number, number][] = [
    [1.5, 0.582812],
    [2, 0.796812],
    [2.5, 0.892645],
    [3, 0.94048],
  ];
  it.each(table)('R0 = %s gives attack rate %s from a one-band SEIR run', (r0, z) => {
    expect(oneGroupFinalSize(r0)).toBeCloseTo(z, 6);
    const o = runScenario(oneBand({ r0, seed: 1e-4, horizon: 1500 })).options[0];
    expect(o.attackRate).toBeCloseTo(z, 5);
    expect(o.finalSize?.attackRate).toBeCloseTo(z, 6);
  });

  // Near R0 = 1 the root is nearly double: a plain fixed-point iteration crawls there (and stops
  // far from the root), which uncertainty draws reach often.
  it.each([1.0001, 1.001, 1.01, 1.2])('R0 = %s, near the threshold: the solver reaches the one-group root', (r0) => {
    const D = 5;
    const N = 1000;
    const z = finalSizeByBand(Float64Array.of(r0 / (D * N)), [N], [1], D)[0];
    expect(Math.abs(z - oneGroupFinalSize(r0)) / oneGroupFinalSize(r0)).toBeLessThan(1e-8);
  });

  it.each([0.5, 0.999, 1])('R0 = %s, at or below the threshold: no epidemic (z = 0 to 1e-12)', (r0) => {
    expect(finalSizeByBand(Float64Array.of(r0 / 5000), [1000], [1], 5)[0]).toBeLessThan(1e-12);
  });

  it('sixteen bands near the threshold: z solves z_i = s0_i (1 - exp(-sum_j A_ij z_j)) to 1e-14', () => {
    const random = seededRandom(7);
    const n = 16;
    const D = 5;
    const population = Array.from({ length: n }, () => 1e4 + 1e5 * random());
    const s0 = Array.from({ length: n }, () => 0.6 + 0.4 * random());
    const m = Float64Array.from({ length: n * n }, () => random() * 5.5e-7);
    const z = finalSizeByBand(m, population, s0, D);
    expect(Math.max(...z)).toBeGreaterThan(1e-3);
    expect(Math.max(...z)).toBeLessThan(0.5);
    for (let i = 0; i < n; i++) {
      let pressure = 0;
      for (let j = 0; j < n; j++) pressure += D * m[i * n + j] * population[j] * z[j];
      expect(Math.abs(z[i] - s0[i] * (1 - Math.exp(-pressure)))).toBeLessThan(1e-14);
    }
  });

  it('with prior immunity p: z = (1 - p)(1 - exp(-R0 z)), R0 = 2.5, p = 0.3 -> z = 0.498889', () => {
    // The same relation with the initial susceptible fraction s0 = 1 - p (Ma & Earn 2006, Bull
    // Math Biol 68:679, one group); z counts infections over the whole population.
    let lo = 1e-9;
    let hi = 0.7;
    for (let k = 0; k < 200; k++) {
      const mid = (lo + hi) / 2;
      if (mid - 0.7 * (1 - Math.exp(-2.5 * mid)) < 0) lo = mid;
      else hi = mid;
    }
    const z = (lo + hi) / 2;
    expect(z).toBeCloseTo(0.498889, 6); // [derived]
    const base = oneBand({ r0: 2.5, seed: 1e-4, horizon: 1500 });
    const o = runScenario(valid({ ...base, initialState: { ...base.initialState, priorImmunityFraction: [0.3] } })).options[0];
    expect(o.attackRate).toBeCloseTo(z, 5);
    expect(o.finalSize?.attackRate).toBeCloseTo(z, 9);
  });

  it('holds with Erlang stages, which change timing but not the final size', () => {
    const o = runScenario(oneBand({ r0: 2, seed: 1e-4, latentStages: 3, infectiousStages: 4, horizon: 1500 })).options[0];
    expect(o.attackRate).toBeCloseTo(oneGroupFinalSize(2), 5);
  });
});

describe('peak prevalence', () => {
  // Hethcote 2000, SIAM Review 42:599; Keeling & Rohani 2008, Modeling Infectious Diseases, ch. 2:
  // SIR peak i_max = 1 - (1 + ln R0) / R0 for S0 -> 1. For SEIR (one latent and one infectious
  // stage) d(E+I)/dt = I (beta S - gamma), so E+I peaks exactly when S = 1/R0 and the same
  // formula gives the peak of E+I (not of I). R0 = 2, 2.5 -> 0.153426, 0.233484 [derived].
  it.each([
    [2, 0.153426],
    [2.5, 0.233484],
  ])('R0 = %s: peak of E+I is %s of the population', (r0, expected) => {
    expect(1 - (1 + Math.log(r0)) / r0).toBeCloseTo(expected, 6);
    const o = runScenario(oneBand({ r0, seed: 1e-3, horizon: 600 })).options[0];
    // Daily sampling of a smooth peak: error is second order in the sampling offset (< 1e-4 here).
    expect(Math.abs(o.peakPrevalence - expected)).toBeLessThan(1e-4);
  });
});

describe('herd-immunity threshold', () => {
  // Anderson & May 1991, Infectious Diseases of Humans: immunity in a fraction 1 - 1/R0, spread
  // uniformly, gives R = 1 in the next-generation matrix.
  it('prior immunity 1 - 1/R0 in every band gives R at start = 1 in a two-band model', () => {
    const base = twoBand();
    const r0 = runScenario(base).r0;
    const h = 1 - 1 / r0;
    const s = valid({ ...base, initialState: { infectedPersons: [0, 1e-9], priorImmunityFraction: [h, h] } });
    expect(runScenario(s).options[0].rStart).toBeCloseTo(1, 9);
  });
});

describe('growth rate and R (Wallinga & Lipsitch 2007, Proc R Soc B 274:599)', () => {
  it("reproduces the paper's example: r = 0.2/day, generation interval 2.85 d, sigma = gamma = 2/2.85 -> R = 1.65", () => {
    const periods = { latentPeriodDays: 1.425, infectiousPeriodDays: 1.425, latentStages: 1, infectiousStages: 1 };
    const r = reproductionNumberFromGrowthRate(0.2, periods);
    expect(r).toBeCloseTo(1.651225, 6); // [derived] (1 + 0.2 * 1.425)^2
    expect(r.toFixed(2)).toBe('1.65'); // [paper]
  });

  it('latent 3 d, infectious 5 d, R0 = 2.5 -> r = 0.146989/day, doubling time 4.7156 d', () => {
    const periods = { latentPeriodDays: 3, infectiousPeriodDays: 5, latentStages: 1, infectiousStages: 1 };
    const r = growthRateFromR(2.5, periods);
    expect(r).toBeCloseTo(0.146989, 6); // [derived] root of (1 + 3r)(1 + 5r) = 2.5
    expect((1 + 3 * r) * (1 + 5 * r)).toBeCloseTo(2.5, 12);
    expect(Math.LN2 / r).toBeCloseTo(4.7156, 4);
    const o = runScenario(oneBand({ r0: 2.5 })).options[0];
    expect(o.growthRatePerDay).toBeCloseTo(0.146989, 5);
    expect(o.doublingTimeDays).toBeCloseTo(4.7156, 3);
  });

  it('M(r) near r = 0 has slope minus the mean generation interval, T_E + T_I (k_I + 1) / (2 k_I)', () => {
    // M is the Laplace transform of the generation-interval density, so M(0) = 1 and M'(0) = -T_G.
    // For SEIR with Erlang(k_I) infectious periods T_G = T_E + T_I (k_I + 1) / (2 k_I)
    // (Svensson 2007, Math Biosci 208:300; from memory): 3 + 5 x 4/6 = 6.333 d for k_I = 3.
    // Central difference at |r T_I| = 5e-7, where the engine uses its series near 0.
    const periods = { latentPeriodDays: 3, infectiousPeriodDays: 5, latentStages: 2, infectiousStages: 3 };
    const h = 1e-7;
    expect(generationIntervalTransform(0, periods)).toBe(1);
    const slope = (generationIntervalTransform(h, periods) - generationIntervalTransform(-h, periods)) / (2 * h);
    expect(slope).toBeCloseTo(-(3 + (5 * 4) / 6), 6);
  });

  it('neither doubling nor halving time without growth or decline', () => {
    expect(doublingTimeDays(0)).toBeNull();
    expect(halvingTimeDays(0)).toBeNull();
    expect(doublingTimeDays(-0.1)).toBeNull();
    expect(halvingTimeDays(0.1)).toBeNull();
  });

  it('the simulated epidemic grows at that rate in its early phase', () => {
    const o = runScenario(oneBand({ r0: 2.5, seed: 1e-3, horizon: 120, population: 1e9 })).options[0];
    const n = o.series.bands;
    const prevalence = (d: number) => o.series.prevalence[d * n];
    // After the initial transient dies out, log prevalence rises with slope r.
    const slope = (Math.log(prevalence(60)) - Math.log(prevalence(40))) / 20;
    expect(slope).toBeCloseTo(0.146989, 4);
  });
});

describe('two-band worked example (shared/CHECKS.md items 5 and 6)', () => {
  // Next-generation matrix: Diekmann, Heesterbeek & Roberts 2010, J R Soc Interface 7:873.
  // 2x2 closed form R0 = (K11 + K22)/2 + sqrt(((K11 - K22)/2)^2 + K12 K21) with
  // K = [[1.8, 0.3], [0.9, 1.2]] -> 2.1.
  it('R0 = 2.1 with beta = 0.02 per contact', () => {
    const r = runScenario(twoBand());
    expect((1.8 + 1.2) / 2 + Math.sqrt(((1.8 - 1.2) / 2) ** 2 + 0.3 * 0.9)).toBeCloseTo(2.1, 12);
    expect(r.r0).toBeCloseTo(2.1, 12);
    expect(r.beta).toBeCloseTo(0.02, 12);
  });

  // Multi-group final size: Ma & Earn 2006, Bull Math Biol 68:679; Andreasen 2011, Bull Math Biol
  // 73:2305. z_i = s0_i (1 - exp(-sum_j A_ij z_j)), A_ij = beta D u_i C_ij h_j.
  // Worked values [derived, checked with two ODE solvers]: z = (0.886884, 0.647720), overall 0.707511;
  // with child susceptibility 0.5: R0 = 1.446863, z = (0.509332, 0.563530).
  it('simulated attack rates match the multi-group final-size relation', () => {
    const o = runScenario(twoBand()).options[0];
    expect(o.attackRateByBand[0]).toBeCloseTo(0.886884, 5);
    expect(o.attackRateByBand[1]).toBeCloseTo(0.64772, 5);
    expect(o.attackRate).toBeCloseTo(0.707511, 5);
    const A = [[1.8, 0.9], [0.3, 1.2]];
    const z = o.attackRateByBand;
    for (let i = 0; i < 2; i++) expect(z[i]).toBeCloseTo(1 - Math.exp(-(A[i][0] * z[0] + A[i][1] * z[1])), 5);
  });

  it('with child susceptibility 0.5', () => {
    const r = runScenario(twoBand({ childSusceptibility: 0.5 }));
    expect(r.r0).toBeCloseTo(1.446863, 6);
    expect(r.options[0].attackRateByBand[0]).toBeCloseTo(0.509332, 5);
    expect(r.options[0].attackRateByBand[1]).toBeCloseTo(0.56353, 5);
    expect(r.options[0].finalSize?.attackRateByBand[0]).toBeCloseTo(0.509332, 6);
  });
});

describe('reciprocity correction (Wallinga, Teunis & Kretzschmar 2006, Am J Epidemiol 164:936; from memory)', () => {
  it('C = [[18, 10], [3, 12]], N = (250, 750) -> [[18, 9.5], [3.166667, 12]]', () => {
    const c = correctReciprocity([[18, 10], [3, 12]], [250, 750]);
    expect(c[0][0]).toBeCloseTo(18, 12);
    expect(c[0][1]).toBeCloseTo(9.5, 12);
    expect(c[1][0]).toBeCloseTo(3.166667, 6);
    expect(c[1][1]).toBeCloseTo(12, 12);
    expect(250 * c[0][1]).toBeCloseTo(750 * c[1][0], 9);
  });
});
