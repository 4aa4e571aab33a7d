/**
 * What a run with a vaccination campaign costs the integrator, counted in steps (never timed):
 * the demo's campaign option against the budget its state layout allows (seir.ts). With the
 * quadratures Xp and Q counted in persons instead of 1% of the band (`quadratureUnits`), their
 * error estimate rejected the first step of most dose-plan segments: 140 steps instead of 118.
 */
import { describe, expect, it } from 'vitest';
import { integratorStepsSoFar } from '../../src/engine/integrator.ts';
import { prepareScenario } from '../../src/engine/prepare.ts';
import { simulateOption } from '../../src/engine/simulate.ts';
import { demoScenario } from '../helpers/demo.ts';

describe('integration cost with a vaccination campaign', () => {
  it.each(['leaky', 'allOrNothing'] as const)("the demo's campaign option, %s: at most 125 steps", (protection) => {
    const demo = demoScenario();
    const s = { ...demo, vaccinationCampaigns: demo.vaccinationCampaigns.map((c) => ({ ...c, protection })) };
    const p = prepareScenario(s);
    const option = s.options.find((o) => o.vaccinationCampaign !== undefined)!;
    const before = integratorStepsSoFar();
    simulateOption(p, option, { series: 'summary' });
    expect(integratorStepsSoFar() - before).toBeLessThanOrEqual(125);
  });
});
