/**
 * A drawn scenario is checked again only in the sections its parameters change
 * (revalidateSections): for every parameter, values that keep the scenario valid and values that
 * break a rule give exactly what a full validation gives: the same scenario and calibration, or
 * the same problems with the same messages. A draw that breaks a rule is still counted as failed.
 */
import { describe, expect, it } from 'vitest';
import { applyParameter, evaluateDraw, formatProblem, prepareDraws, validateScenario, type Scenario } from '../../../src/engine/index.ts';
import { sectionOfParameter } from '../../../src/engine/uncertainty/applyDraw.ts';
import { revalidateSections } from '../../../src/engine/validation.ts';
import { catalogueReader } from '../../../src/report/drawOutcomes.ts';
import { demoScenario } from '../../helpers/demo.ts';

const demo = demoScenario();

/** Each parameter with a value the format accepts and one it refuses (or, for r0, a value far out). */
const CASES: [name: string, fine: number, broken: number][] = [
  ['r0', 2.7, -1],
  ['latentPeriodDays', 2.5, 0.01],
  ['infectiousPeriodDays', 4, -3],
  ['ifrScale', 1.3, 1e6],
  ['hospitalisationScale', 0.8, 1e6],
  ['icuShareScale', 1.2, 1e6],
  ['wardStayScale', 1.5, -1],
  ['icuStayScale', 0.7, -1],
  ['measureAdherence', 0.8, 5],
  ['vaccineEfficacyScale', 0.9, 3],
  ['initialInfectedScale', 2, -1],
  ['contactScale.school', 0.5, -2],
];

function outcomeOf(r: ReturnType<typeof validateScenario>): unknown {
  return r.ok ? { scenario: r.scenario, calibration: r.calibration } : r.problems.map(formatProblem);
}

describe('revalidating only the drawn sections', () => {
  it('agrees with a full validation for every parameter, valid or broken', () => {
    let refused = 0;
    for (const [name, fine, broken] of CASES) {
      for (const value of [fine, broken]) {
        const drawn = applyParameter(demo, name, value);
        const full = validateScenario(drawn);
        expect(outcomeOf(revalidateSections(drawn, [sectionOfParameter(name)])), `${name} = ${value}`).toEqual(outcomeOf(full));
        if (!full.ok) refused++;
      }
    }
    // Every broken value is refused, so the comparison covered the failure path of each section.
    expect(refused).toBe(CASES.length);
  });

  it('misses a broken section it is not told about: the sections asked for are what it checks', () => {
    const drawn = applyParameter(demo, 'ifrScale', 1e6);
    expect(validateScenario(drawn).ok).toBe(false);
    expect(revalidateSections(drawn, ['disease']).ok).toBe(true);
  });

  it('still fails, counts and names a draw that breaks a rule', () => {
    const s: Scenario = {
      ...demo,
      uncertainty: { draws: 4, seed: 2, intervalLevel: 0.9, parameters: [{ name: 'vaccineEfficacyScale', distribution: { kind: 'uniform', low: 1.5, high: 3 }, source: 'test range' }] },
    };
    const r = evaluateDraw(prepareDraws(s), 0, catalogueReader);
    expect(r).toEqual({ draw: 0, ok: false, reason: expect.stringMatching(/^vaccinationCampaigns\[0\]\.efficacyAgainstInfection must be a fraction between 0 and 1, got 1\.\d+$/) });
  });
});
