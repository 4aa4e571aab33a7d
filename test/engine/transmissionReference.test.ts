/**
 * Relative susceptibility u, relative infectiousness h and case isolation c against values
 * computed here by hand from the published formulas, not from the engine's transmission matrix:
 *
 * - next-generation matrix K_ij = beta D u_i C_ij h_j (1 - c) S_i / N_j, R = its spectral radius,
 *   2x2 closed form R = (K11 + K22)/2 + sqrt(((K11 - K22)/2)^2 + K12 K21)
 *   (Diekmann, Heesterbeek & Roberts 2010, J R Soc Interface 7:873; van den Driessche &
 *   Watmough 2002, Math Biosci 180:29);
 * - multi-group final size z_i = 1 - exp(-sum_j A_ij z_j), A_ij = beta D u_i C_ij h_j (1 - c)
 *   (Ma & Earn 2006, Bull Math Biol 68:679; Andreasen 2011, Bull Math Biol 73:2305).
 *
 * The two-band example of shared/CHECKS.md items 5-6 (N = (250, 750), C = [[18, 9], [3, 12]],
 * beta = 0.02 per contact, D = 5 d, latent 3 d), with u and h that differ between the bands so that
 * leaving either out, or taking it from the wrong band, changes every number below.
 */
import { describe, expect, it } from 'vitest';
import { runScenario } from '../../src/engine/run.ts';
import type { Phase, Scenario } from '../../src/engine/scenario.ts';
import { valid } from '../helpers/scenarios.ts';

const N = [250, 750];
const C = [[18, 9], [3, 12]];
const BETA = 0.02;
const D = 5;

interface Inputs {
  u: [number, number];
  h: [number, number];
  /** Case isolation c and age factor f_i of the phase in force (f = 1: none). */
  c?: number;
  f?: [number, number];
}

const SEEDS = [1e-3, 3e-3];
/** Susceptibles on day 0: everyone but the seeds. */
const S0 = N.map((n, i) => n - SEEDS[i]);

/** K with beta = BETA at susceptibles S (default: the disease-free state S = N), written from the formula. */
function nextGenerationMatrix({ u, h, c = 0, f = [1, 1] }: Inputs, S = N): number[][] {
  return [0, 1].map((i) => [0, 1].map((j) => (BETA * D * u[i] * C[i][j] * Math.min(f[i], f[j]) * h[j] * (1 - c) * S[i]) / N[j]));
}

/** Spectral radius of a non-negative 2x2 matrix, closed form. */
function spectralRadius2([[a, b], [c, d]]: number[][]): number {
  return (a + d) / 2 + Math.sqrt(((a - d) / 2) ** 2 + b * c);
}

/** z solving z_i = 1 - exp(-sum_j A_ij z_j), by Newton's method from z = (1, 1). */
function finalSize({ u, h, c = 0, f = [1, 1] }: Inputs): number[] {
  const A = [0, 1].map((i) => [0, 1].map((j) => BETA * D * u[i] * C[i][j] * Math.min(f[i], f[j]) * h[j] * (1 - c)));
  let z = [1, 1];
  for (let k = 0; k < 100; k++) {
    const e = [0, 1].map((i) => Math.exp(-(A[i][0] * z[0] + A[i][1] * z[1])));
    const g = [0, 1].map((i) => z[i] - 1 + e[i]);
    // Jacobian of g: I - diag(e) A.
    const J = [0, 1].map((i) => [0, 1].map((j) => (i === j ? 1 : 0) - e[i] * A[i][j]));
    const det = J[0][0] * J[1][1] - J[0][1] * J[1][0];
    z = [z[0] - (J[1][1] * g[0] - J[0][1] * g[1]) / det, z[1] - (J[0][0] * g[1] - J[1][0] * g[0]) / det];
  }
  return z;
}

/** The example with R0 set so that beta calibrates to BETA, and one phase over the whole horizon. */
function scenario(inputs: Inputs, horizon = 3000): Scenario {
  const r0 = spectralRadius2(nextGenerationMatrix({ u: inputs.u, h: inputs.h }));
  const phase: Partial<Phase> = {
    fromDay: 0,
    toDay: horizon,
    caseIsolation: inputs.c ?? 0,
    ageFactors: inputs.f === undefined ? [] : [{ setting: 'all', bands: [0], factor: inputs.f[0] }],
  };
  return valid({
    format: 'mixwise-scenario',
    version: 1,
    title: 'two bands, u and h',
    ageBands: [{ label: 'child', lowerAgeYears: 0 }, { label: 'adult', lowerAgeYears: 18 }],
    populationPersons: N,
    settings: [{ name: 'all', contactsPerDay: C }],
    disease: { transmission: { kind: 'r0', r0 }, latentPeriodDays: 3, infectiousPeriodDays: D, relativeSusceptibility: inputs.u, relativeInfectiousness: inputs.h },
    severity: { infectionFatalityRatio: [0.001, 0.01], source: 'test value' },
    initialState: { infectedPersons: SEEDS },
    horizonDays: horizon,
    options: [{ name: 'none' }, { name: 'measures', phases: [phase as Phase] }],
  });
}

describe('relative susceptibility and infectiousness in the next-generation matrix', () => {
  const inputs: Inputs = { u: [0.5, 1], h: [0.6, 1] };

  it('K = [[0.54, 0.15], [0.54, 1.2]] and R0 = 1.305775 at beta = 0.02: the engine calibrates beta to 0.02', () => {
    const K = nextGenerationMatrix(inputs);
    // [derived] K11 = 0.1 x 0.5 x 18 x 0.6, K12 = 0.1 x 0.5 x 9 x 250/750, K21 = 0.1 x 3 x 0.6 x 750/250, K22 = 0.1 x 12.
    [[0.54, 0.15], [0.54, 1.2]].forEach((row, i) => row.forEach((k, j) => expect(K[i][j]).toBeCloseTo(k, 12)));
    expect(spectralRadius2(K)).toBeCloseTo(1.305775, 6);
    const r = runScenario(scenario(inputs));
    // R0 is the input; beta = R0 / rho(K at beta = 1) is where u and h must enter, with the right band.
    expect(r.beta).toBeCloseTo(BETA, 12);
    expect(r.r0).toBeCloseTo(1.305775, 6);
    // R at start counts the day-0 susceptibles (the seeds are not susceptible).
    expect(r.options[0].rStart).toBeCloseTo(spectralRadius2(nextGenerationMatrix(inputs, S0)), 12);
  });

  it('h alone (u = 1): R0 = 1.546940 at beta = 0.02', () => {
    const only: Inputs = { u: [1, 1], h: [0.6, 1] };
    expect(spectralRadius2(nextGenerationMatrix(only))).toBeCloseTo(1.54694, 5); // [derived]
    expect(runScenario(scenario(only)).beta).toBeCloseTo(BETA, 12);
  });

  it('the simulated epidemic ends at the multi-group final size with u and h: z = (0.306554, 0.445651)', () => {
    const z = finalSize(inputs);
    expect(z[0]).toBeCloseTo(0.306554, 6); // [derived]
    expect(z[1]).toBeCloseTo(0.445651, 6);
    const o = runScenario(scenario(inputs)).options[0];
    // The seeds (4e-6 of each band) are neglected by the relation: agreement to about 1e-5.
    o.attackRateByBand.forEach((a, i) => expect(Math.abs(a - z[i])).toBeLessThan(2e-5));
    o.finalSize!.attackRateByBand.forEach((a, i) => expect(a).toBeCloseTo(z[i], 9));
  });
});

describe('case isolation and an age factor, with u and h', () => {
  // Case isolation c = 0.1 and the child band's contacts at half (the smaller factor of the pair,
  // DESIGN.md section 2), u = 1, h = (0.6, 1): K = [[0.486, 0.135], [0.243, 1.08]].
  const inputs: Inputs = { u: [1, 1], h: [0.6, 1], c: 0.1, f: [0.5, 1] };

  it('R at start = 1.130871', () => {
    const K = nextGenerationMatrix(inputs);
    [[0.486, 0.135], [0.243, 1.08]].forEach((row, i) => row.forEach((k, j) => expect(K[i][j]).toBeCloseTo(k, 12))); // [derived]
    expect(spectralRadius2(K)).toBeCloseTo(1.130871, 6);
    const r = runScenario(scenario(inputs));
    expect(r.beta).toBeCloseTo(BETA, 12);
    expect(r.options[1].rStart).toBeCloseTo(spectralRadius2(nextGenerationMatrix(inputs, S0)), 12);
  });

  it('the simulated epidemic under the measures ends at z = (0.153708, 0.227626)', () => {
    const z = finalSize(inputs);
    expect(z[0]).toBeCloseTo(0.153708, 6); // [derived]
    expect(z[1]).toBeCloseTo(0.227626, 6);
    const o = runScenario(scenario(inputs)).options[1];
    // Closer to R = 1 the seeds weigh more (by about 1 / (1 - R_eff) at the end): 5e-5.
    o.attackRateByBand.forEach((a, i) => expect(Math.abs(a - z[i])).toBeLessThan(5e-5));
    o.finalSize!.attackRateByBand.forEach((a, i) => expect(a).toBeCloseTo(z[i], 9));
  });
});
