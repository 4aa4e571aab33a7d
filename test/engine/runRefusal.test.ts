/**
 * A Perron root that cannot be pinned down after R0 calibrated ends in a clear refusal, never a
 * crash: `validateScenario` refuses a phase whose R under its measures alone cannot be computed
 * (options[k].phases[j]); what only the run reveals (R at a phase's start, R on day 0, R(t))
 * ends in a RunRefused naming the option, the phase or day and the cause, on one thread or a pool.
 */
import { afterAll, describe, expect, it } from 'vitest';
import { nodeWorkerPool } from '../../src/cli/workerThreads.ts';
import { formatProblem, prepareScenario, runScenario, runScenarioOnPool, RunRefused, scenarioSchema, simulateOption, validateScenario, type Scenario } from '../../src/engine/index.ts';
import { measuresRatioForOption } from '../../src/engine/fitting/measuresRatio.ts';
import { reproductionByDay } from '../../src/engine/reproduction.ts';
import { reproductionByPhase } from '../../src/engine/rByPhase.ts';
import { segmentsOf } from '../../src/engine/segments.ts';
import { immuneHubLeavingOddContacts, phaseLeavingOddContacts } from '../helpers/unsettledRoots.ts';

const CAUSE = String.raw`the largest eigenvalue of the next-generation matrix could not be pinned down \(it lies between [^)]+\); look for contacts, setting multipliers or age factors many orders of magnitude from the rest \(such as 1e-300\)`;

/** The RunRefused `run` throws, or a failure when it returns or throws anything else. */
function refusalOf(run: () => unknown): RunRefused {
  try {
    run();
  } catch (err) {
    if (err instanceof RunRefused) return err;
    throw err;
  }
  throw new Error('expected a refusal');
}

/** A scenario read by the schema alone, without the rules after it (to reach the run's own refusals). */
function unchecked(input: object): Scenario {
  return scenarioSchema.parse(input);
}

const pool = nodeWorkerPool(2);
afterAll(() => pool.close());

describe('a Perron root that cannot be pinned down after calibration', () => {
  it('is refused by the check at the phase whose measures leave it, naming the option', () => {
    const check = validateScenario(phaseLeavingOddContacts());
    if (check.ok) throw new Error('expected a refusal');
    expect(check.problems.map(formatProblem)).toEqual([
      expect.stringMatching(new RegExp(`^options\\[1\\]\\.phases\\[0\\] \\(option "ordinary contacts shut"\\) must give measures R can be computed under: with everyone susceptible ${CAUSE}$`)),
    ]);
  });

  it('is refused by the run at the phase when the check is bypassed', () => {
    const s = unchecked(phaseLeavingOddContacts());
    const p = prepareScenario(s);
    // Option 0 has no phase: it runs. Option 1 is refused at its phase, at its start or with everyone
    // susceptible (which comes first depends on the susceptibles of day 10, i.e. on the integrator).
    expect(simulateOption(p, s.options[0]).rStart).toBeCloseTo(2, 6);
    const refused = refusalOf(() => simulateOption(p, s.options[1], { series: 'summary' }));
    expect(refused.problem.path).toBe('options[1].phases[0]');
    expect(refused.message).toMatch(new RegExp(`^options\\[1\\]\\.phases\\[0\\] \\(option "ordinary contacts shut"\\) must give measures R can be computed under: (on day 10, when the phase starts,|with everyone susceptible) ${CAUSE}$`));
    expect(refused.message).not.toContain('\n');
    // R at the phase start, at the susceptibles of its first day (here everyone still).
    const n = p.bands.bands;
    const everyone = new Float64Array((s.horizonDays + 1) * n);
    for (let d = 0; d <= s.horizonDays; d++) everyone.set(p.bands.population, d * n);
    expect(refusalOf(() => reproductionByPhase(p, s.options[1], everyone, [])).message).toMatch(new RegExp(`^options\\[1\\]\\.phases\\[0\\] \\(option "ordinary contacts shut"\\) must give measures R can be computed under: on day 10, when the phase starts, ${CAUSE}$`));
  });

  it('passes the check but is refused by the run on day 0 when the initial state leaves it (R at the start)', () => {
    const check = validateScenario(immuneHubLeavingOddContacts());
    if (!check.ok) throw new Error(check.problems.map(formatProblem).join('\n'));
    const refused = refusalOf(() => runScenario(check.scenario, check.calibration));
    expect(refused.problem.path).toBe('options[0]');
    expect(refused.message).toMatch(new RegExp(`^options\\[0\\] \\(option "as usual"\\) must give measures R can be computed under: on day 0 ${CAUSE}$`));
  });

  it('refuses R(t) on the day it cannot be computed', () => {
    const check = validateScenario(immuneHubLeavingOddContacts());
    if (!check.ok) throw new Error('expected a valid scenario');
    const p = prepareScenario(check.scenario, check.calibration);
    const H = check.scenario.horizonDays;
    const n = p.bands.bands;
    const susceptible = new Float64Array((H + 1) * n);
    for (let d = 0; d <= H; d++) susceptible.set(p.initialSusceptible, d * n);
    const option = check.scenario.options[0];
    expect(refusalOf(() => reproductionByDay(p, option, segmentsOf(p, option, []), susceptible)).message).toMatch(/^options\[0\] \(option "as usual"\) must give measures R can be computed under: on day 0 the largest eigenvalue/);
  });

  it('arrives from a worker pool as the same refusal', { timeout: 60_000 }, async () => {
    const check = validateScenario(immuneHubLeavingOddContacts());
    if (!check.ok) throw new Error('expected a valid scenario');
    const inline = refusalOf(() => runScenario(check.scenario, check.calibration));
    const pooled = await runScenarioOnPool(pool, check.scenario, check.calibration).then(
      () => null,
      (err: unknown) => err,
    );
    expect(pooled).toBeInstanceOf(RunRefused);
    expect((pooled as RunRefused).problem).toEqual(inline.problem);
  });

  it('is a problem of the fit request, not a crash, when the measures ratio cannot be computed', () => {
    const result = measuresRatioForOption(unchecked(phaseLeavingOddContacts()), 'ordinary contacts shut', 12);
    if (result.ok) throw new Error('expected a refusal');
    expect(result.problems).toEqual([{ field: 'measuresOption', rule: expect.stringMatching(new RegExp(`^its measures on day 12 leave R uncomputable at the initial susceptibles: ${CAUSE}$`)), value: 'ordinary contacts shut' }]);
  });
});
