/** Small hand-made scenarios for engine tests (not demo data). */
import type { ScenarioInput } from '../../src/engine/scenario.ts';
import { validateScenario } from '../../src/engine/validation.ts';
import type { Scenario } from '../../src/engine/scenario.ts';

/** Validates or throws with the problems listed (tests only). */
export function valid(input: ScenarioInput): Scenario {
  const r = validateScenario(input);
  if (!r.ok) throw new Error(r.problems.map((p) => `${p.path} ${p.rule} ${p.value ?? ''}`).join('\n'));
  return r.scenario;
}

/** One band, one setting with `contacts` per day: the classic well-mixed SEIR. */
export function oneBand(opts: { r0: number; latent?: number; infectious?: number; population?: number; seed?: number; horizon?: number; latentStages?: number; infectiousStages?: number; seedIn?: 'latent' | 'infectious' }): Scenario {
  const population = opts.population ?? 1e6;
  return valid({
    format: 'mixwise-scenario',
    version: 1,
    title: 'one band',
    ageBands: [{ label: 'all', lowerAgeYears: 0 }],
    populationPersons: [population],
    settings: [{ name: 'all', contactsPerDay: [[10]] }],
    disease: {
      transmission: { kind: 'r0', r0: opts.r0 },
      latentPeriodDays: opts.latent ?? 3,
      infectiousPeriodDays: opts.infectious ?? 5,
      latentStages: opts.latentStages ?? 1,
      infectiousStages: opts.infectiousStages ?? 1,
    },
    severity: { infectionFatalityRatio: [0.01], source: 'test value' },
    initialState: { infectedPersons: [opts.seed ?? 1e-3], infectedCompartment: opts.seedIn ?? 'latent' },
    horizonDays: opts.horizon ?? 1500,
    options: [{ name: 'none', phases: [] }],
  });
}

/**
 * The two-band worked example of shared/CHECKS.md item 5 (Ma & Earn 2006; Andreasen 2011):
 * N = (250, 750), C = [[18, 9], [3, 12]], beta = 0.02 per contact, D = 5 d, latent 3 d -> R0 = 2.1.
 * R0 is given so that beta calibrates to 0.02.
 */
export function twoBand(opts: { childSusceptibility?: number; horizon?: number; seed?: number } = {}): Scenario {
  const u = opts.childSusceptibility ?? 1;
  // R0 for beta = 0.02: closed form for 2x2 (Diekmann et al. 2010): K = 0.1 * [[18u*1, 9u*1/3],[3*3, 12]]
  const k11 = 1.8 * u, k12 = 0.3 * u, k21 = 0.9, k22 = 1.2;
  const r0 = (k11 + k22) / 2 + Math.sqrt(((k11 - k22) / 2) ** 2 + k12 * k21);
  const seed = opts.seed ?? 1e-6;
  return valid({
    format: 'mixwise-scenario',
    version: 1,
    title: 'two bands',
    ageBands: [{ label: 'child', lowerAgeYears: 0 }, { label: 'adult', lowerAgeYears: 18 }],
    populationPersons: [250, 750],
    settings: [{ name: 'all', contactsPerDay: [[18, 9], [3, 12]] }],
    disease: {
      transmission: { kind: 'r0', r0 },
      latentPeriodDays: 3,
      infectiousPeriodDays: 5,
      relativeSusceptibility: [u, 1],
    },
    severity: { infectionFatalityRatio: [0.001, 0.01], source: 'test value' },
    initialState: { infectedPersons: [seed, seed * 3] },
    horizonDays: opts.horizon ?? 2000,
    options: [{ name: 'none', phases: [] }],
  });
}
