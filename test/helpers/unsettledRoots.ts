/**
 * Scenarios whose next-generation matrix has a dominant eigenvalue the bounded Perron root
 * (src/engine/perronRoot.ts) cannot pin down somewhere during a run, though R0 calibrates:
 * contacts only between two halves of the bands (a periodic matrix, so power iteration never
 * settles) spread over 300 orders of magnitude, beside an ordinary setting that dominates until a
 * phase or the initial state takes it away. Both were found by a seeded search (mulberry32,
 * test/helpers/random.ts): among random matrices of that shape, these end in PerronRootNotSettled.
 */
import type { ScenarioInput } from '../../src/engine/index.ts';

/** Bands 0..m-1 with the periodic "odd" contacts, band m (when present) the hub of an ordinary setting. */
function scenarioOf(odd: number[][], population: number[], ordinary: number[][], rest: Partial<ScenarioInput>): ScenarioInput {
  const n = population.length;
  const m = odd.length;
  return {
    format: 'mixwise-scenario',
    version: 1,
    title: 'contacts over 300 orders of magnitude',
    ageBands: population.map((_, i) => ({ label: `band ${i}`, lowerAgeYears: 10 * i })),
    populationPersons: population,
    settings: [
      { name: 'ordinary', contactsPerDay: ordinary },
      { name: 'odd', contactsPerDay: Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => (i < m && j < m ? odd[i][j] : 0))) },
    ],
    disease: { transmission: { kind: 'r0', r0: 2 }, latentPeriodDays: 3, infectiousPeriodDays: 5, latentStages: 1, infectiousStages: 1 },
    severity: { infectionFatalityRatio: population.map(() => 0.01), source: 'test value' },
    initialState: { infectedPersons: population.map(() => 1), infectedCompartment: 'latent' },
    horizonDays: 30,
    options: [{ name: 'as usual', phases: [] }],
    ...rest,
  } as ScenarioInput;
}

/**
 * Contacts only between two halves of six bands (a periodic matrix) spread over 300 orders of
 * magnitude, with their populations: alone, their R0 cannot be pinned down.
 */
export const PERIODIC_ODD_CONTACTS: readonly number[][] = [
  [0, 0, 0, 0, 5.200153618278532e-110, 0],
  [0, 0, 0, 0, 6.914290743330413e-307, 2.7935444930385406e-102],
  [0, 0, 0, 5.556834333647057e-53, 0, 1.9075001887270956e-142],
  [7.707005304652407e-138, 1.9123612842943637e-68, 1.273995898004837e-25, 0, 0, 0],
  [4.249506383436402e-225, 1.8317924817336967e-229, 0, 0, 0, 0],
  [1.130141368518444e-47, 9.908536844769235e-194, 4.365502222546034e-248, 0, 0, 0],
];
export const PERIODIC_ODD_POPULATION: readonly number[] = [1660068115, 351365797, 35, 56556, 73684134, 61759];

/**
 * R0 calibrates (the ordinary setting, proportionate mixing, dominates), but option 1's phase
 * shuts the ordinary setting and leaves the odd contacts alone: R under that phase cannot be
 * pinned down, for every susceptible count. `validateScenario` refuses it at options[1].phases[0].
 */
export function phaseLeavingOddContacts(): ScenarioInput {
  const odd = PERIODIC_ODD_CONTACTS.map((row) => [...row]);
  const population = [...PERIODIC_ODD_POPULATION];
  const total = population.reduce((a, b) => a + b, 0);
  const ordinary = population.map(() => population.map((Nj) => (10 * Nj) / total));
  return scenarioOf(odd, population, ordinary, {
    options: [
      { name: 'as usual', phases: [] },
      { name: 'ordinary contacts shut', phases: [{ fromDay: 10, toDay: 20, settingMultipliers: { ordinary: 0 }, ageFactors: [] }] },
    ],
  });
}

/**
 * Valid, with every phase's R computable: the ordinary setting is a hub (band 6 meets everyone),
 * but band 6 starts fully immune, so on day 0 only the odd contacts carry transmission and R on
 * day 0 cannot be pinned down: the run, not the check, refuses it (options[0], day 0).
 */
export function immuneHubLeavingOddContacts(): ScenarioInput {
  const odd = [
    [0, 0, 0, 0, 6.849610335433852e-134, 0],
    [0, 0, 0, 1.6628147787915136e-294, 2.542511879969837e-127, 2.7040507939976067e-192],
    [0, 0, 0, 0, 0, 2.139250151081747e-263],
    [0, 0, 3.2002128523373226e-299, 0, 0, 0],
    [0, 2.3746401304148163e-105, 0, 0, 0, 0],
    [1.2713724815081603e-151, 0, 0, 0, 0, 0],
  ];
  const population = [37713056, 35222, 38565, 69, 238, 35441414, 1000000];
  const hub = 6;
  const ordinary = population.map((Ni, i) => population.map((_, j) => (i === hub && j === hub ? 5 : i === hub ? 1e-3 : j === hub ? (1e-3 * Ni) / population[hub] : 0)));
  return scenarioOf(odd, population, ordinary, {
    initialState: {
      infectedPersons: population.map((_, i) => (i === hub ? 0 : 1)),
      infectedCompartment: 'latent',
      priorImmunityFraction: population.map((_, i) => (i === hub ? 1 : 0)),
    },
  });
}
