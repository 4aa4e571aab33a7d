/**
 * The WebAssembly kernel (src/engine/optionKernel.ts) against the TypeScript integrator it
 * replaces: the same steps in the same arithmetic, so every daily value, the step count, the
 * switch days of triggered measures and the failure are the same bit for bit. Padding (odd band
 * counts), Erlang stages, several segments, tolerance overrides, triggered stops and vaccination
 * (leaky and all-or-nothing, with triggers too) are covered.
 */
import { describe, expect, it } from 'vitest';
import { type Accuracy, type DailyState, type Integration, integrateOption } from '../../src/engine/integrateOption.ts';
import { integratorStepsSoFar } from '../../src/engine/integrator.ts';
import { kernelAvailable } from '../../src/engine/optionKernel.ts';
import { hasTriggers, phaseAt } from '../../src/engine/phases.ts';
import { prepareScenario } from '../../src/engine/prepare.ts';
import type { PolicyOption, Scenario, ScenarioInput } from '../../src/engine/scenario.ts';
import { type Segment, segmentsOf } from '../../src/engine/segments.ts';
import { TriggeredMeasures } from '../../src/engine/triggeredMeasures.ts';
import { decodeBase64 } from '../../src/engine/wasm/base64.ts';
import { demoScenario } from '../helpers/demo.ts';
import { valid } from '../helpers/scenarios.ts';

interface Run {
  daily: DailyState;
  steps: number;
  realized: Segment[];
  switches: unknown;
}

/** integrateOption as simulate.ts calls it, on the given path. */
function run(s: Scenario, option: PolicyOption, integration: Integration, accuracy: Accuracy = {}): Run {
  const p = prepareScenario(s);
  const campaign = option.vaccinationCampaign === undefined ? null : (p.campaigns.get(option.vaccinationCampaign) ?? null);
  const triggered = hasTriggers(option)
    ? { measures: new TriggeredMeasures(p, option, campaign?.admissionRiskFactor ?? 1), fixedPhaseAt: (t: number) => phaseAt(option, t), realized: [] as Segment[] }
    : null;
  const before = integratorStepsSoFar();
  const daily = integrateOption(p, segmentsOf(p, option, campaign?.plan ?? []), campaign, triggered, accuracy, integration);
  return {
    daily,
    steps: integratorStepsSoFar() - before,
    realized: triggered?.realized ?? [],
    switches: triggered?.measures.controller.outcomes(s.horizonDays) ?? [],
  };
}

/** Entries of the daily arrays that differ between the two paths (0 expected). */
function differences(a: DailyState, b: DailyState): number {
  let count = 0;
  for (const key of ['susceptible', 'effectiveSusceptible', 'prevalence', 'cumulative', 'protectedCumulative', 'dosesToNonSusceptible'] as const) {
    expect(b[key].length).toBe(a[key].length);
    for (let i = 0; i < a[key].length; i++) if (!Object.is(a[key][i], b[key][i])) count++;
  }
  return count;
}

function expectSameRuns(s: Scenario, option: PolicyOption, accuracy: Accuracy = {}): Run {
  const typescript = run(s, option, 'typescript', accuracy);
  const kernel = run(s, option, 'kernel', accuracy);
  expect(differences(typescript.daily, kernel.daily)).toBe(0);
  expect(kernel.steps).toBe(typescript.steps);
  expect(kernel.realized).toEqual(typescript.realized);
  expect(kernel.switches).toEqual(typescript.switches);
  return kernel;
}

/** Three bands (odd: the kernel pads to four), 2 latent and 3 infectious stages, phases on fixed days and a triggered one. */
function threeBands(): Scenario {
  return valid(threeBandsInput());
}

/** The same with a campaign for the two older bands (all-or-nothing), on an option of its own. */
function threeBandsVaccinated(): Scenario {
  const input = threeBandsInput();
  return valid({
    ...input,
    vaccinationCampaigns: [{
      name: 'campaign',
      schedule: [{ fromDay: 20, dosesPerDay: 3000 }, { fromDay: 60, dosesPerDay: 6000 }],
      uptakeCeiling: [0, 0.7, 0.9],
      delayToProtectionDays: 10,
      efficacyAgainstInfection: 0.6,
      efficacyAgainstDeath: 0.9,
      efficacyAgainstAdmission: 0.85,
      protection: 'allOrNothing',
      priority: [[2], [1]],
      source: 'test value',
    }],
    options: [...input.options, { name: 'vaccinated', phases: [], vaccinationCampaign: 'campaign' }],
  });
}

function threeBandsInput(): ScenarioInput {
  return {
    format: 'mixwise-scenario',
    version: 1,
    title: 'three bands',
    ageBands: [{ label: 'young', lowerAgeYears: 0 }, { label: 'middle', lowerAgeYears: 20 }, { label: 'old', lowerAgeYears: 60 }],
    populationPersons: [3e5, 5e5, 2e5],
    settings: [
      { name: 'home', contactsPerDay: [[4, 3, 1], [1.8, 3, 0.8], [1, 2, 2]] },
      { name: 'work', contactsPerDay: [[6, 2, 0.2], [1.2, 7, 0.4], [0.3, 1, 1]] },
    ],
    disease: { transmission: { kind: 'r0', r0: 2.2 }, latentPeriodDays: 3, infectiousPeriodDays: 6, latentStages: 2, infectiousStages: 3 },
    severity: { infectionFatalityRatio: [0.0001, 0.002, 0.03], source: 'test value' },
    initialState: { infectedPersons: [5, 10, 1] },
    horizonDays: 400,
    options: [
      { name: 'none', phases: [] },
      { name: 'work halved twice', phases: [{ fromDay: 30, toDay: 90, settingMultipliers: { work: 0.5 } }, { fromDay: 150, toDay: 200, settingMultipliers: { work: 0.5 } }] },
      {
        name: 'work closed when infectious',
        phases: [{ fromDay: 0, toDay: 400, settingMultipliers: { work: 0.1 }, trigger: { quantity: 'infectiousPer100k', onAbove: 500, offBelow: 100, minimumDaysOn: 10, lagDays: 2 } }],
      },
    ],
  };
}

describe('the WebAssembly kernel', () => {
  it('runs on this platform', () => {
    expect(kernelAvailable()).toBe(true);
  });

  it('gives the TypeScript path\'s daily record bit for bit: every demo option', () => {
    const demo = demoScenario();
    expect(demo.options.filter((o) => o.vaccinationCampaign !== undefined).length).toBeGreaterThan(0);
    for (const option of demo.options) expectSameRuns(demo, option);
  });

  it('the same with all-or-nothing protection (a V block), another efficacy, and a triggered phase over the campaign', () => {
    const demo = demoScenario();
    const allOrNothing = { ...demo, vaccinationCampaigns: demo.vaccinationCampaigns.map((c) => ({ ...c, protection: 'allOrNothing' as const })) };
    const option = demo.options.find((o) => o.vaccinationCampaign !== undefined)!;
    expectSameRuns(allOrNothing, option);
    // Efficacy 0.7: a relative risk in P that is not a power of 2 (0.5 would make some orders of the products equal).
    const leaky = { ...demo, vaccinationCampaigns: demo.vaccinationCampaigns.map((c) => ({ ...c, protection: 'leaky' as const, efficacyAgainstInfection: 0.7 })) };
    expectSameRuns(leaky, option);
    const trigger = { quantity: 'infectiousPer100k' as const, onAbove: 300, offBelow: 50, minimumDaysOn: 14, lagDays: 3 };
    const phase = { ...demo.options[1].phases[0], fromDay: 0, toDay: demo.horizonDays, trigger };
    const triggered = expectSameRuns(demo, { ...option, name: 'vaccinated, triggered', phases: [...option.phases, phase] });
    expect(triggered.realized.length).toBeGreaterThan(2);
  });

  it('the same with a tolerance override (rtol 1e-9, as the accuracy checks run)', () => {
    const demo = demoScenario();
    const r = expectSameRuns(demo, demo.options[1], { relative: 1e-9 });
    expect(r.steps).toBeGreaterThan(250);
  });

  it('the same on an odd band count with Erlang stages, over several segments, with and without vaccination', () => {
    const s = threeBands();
    expectSameRuns(s, s.options[0]);
    expectSameRuns(s, s.options[1]);
    const vaccinated = threeBandsVaccinated();
    const campaign = expectSameRuns(vaccinated, vaccinated.options[3]);
    // The campaign reached people: infections among the protected, and doses to non-susceptibles.
    expect(campaign.daily.protectedCumulative.reduce((a, b) => Math.max(a, b), 0)).toBeGreaterThan(1);
    expect(campaign.daily.dosesToNonSusceptible.reduce((a, b) => a + b, 0)).toBeGreaterThan(1);
  });

  it('the same for triggered measures: the same switch days and realized segments', () => {
    const s = threeBands();
    const r = expectSameRuns(s, s.options[2]);
    expect(r.realized.length).toBeGreaterThan(2);
    const demo = demoScenario();
    const phase = { ...demo.options[1].phases[0], fromDay: 0, toDay: demo.horizonDays, trigger: { quantity: 'infectiousPer100k' as const, onAbove: 300, offBelow: 50, minimumDaysOn: 14, lagDays: 3 } };
    const triggered = expectSameRuns(demo, { ...demo.options[1], name: 'triggered', phases: [phase] });
    expect(triggered.realized.length).toBeGreaterThan(2);
  });

  it('fails where the TypeScript path fails, with the same message', () => {
    const s = threeBands();
    // A step-size floor the error control cannot meet: every step is rejected until h < 1e-12.
    const accuracy = { relative: 0, absolute: 1e-300 };
    expect(() => run(s, s.options[0], 'typescript', accuracy)).toThrow(/could not be solved near day 0\.00/);
    expect(() => run(s, s.options[0], 'kernel', accuracy)).toThrow(/could not be solved near day 0\.00/);
  });
});

describe('decodeBase64', () => {
  it('gives the bytes Node encodes, for every length and every byte value', () => {
    for (let length = 0; length < 70; length++) {
      const bytes = Uint8Array.from({ length }, (_, i) => (i * 97 + length * 31) % 256);
      expect(decodeBase64(Buffer.from(bytes).toString('base64'))).toEqual(bytes);
    }
    const all = Uint8Array.from({ length: 256 }, (_, i) => i);
    expect(decodeBase64(Buffer.from(all).toString('base64'))).toEqual(all);
  });

  it('refuses a character outside the alphabet', () => {
    expect(() => decodeBase64('AAA*')).toThrow('not base64: character "*" at 3');
  });
});
