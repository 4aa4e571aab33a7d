import { describe, expect, it } from 'vitest';
import { applyParameter, formatProblem, validateScenario, type ScenarioInput } from '../../../src/engine/index.ts';
import { demoScenario } from '../../helpers/demo.ts';

const demo = demoScenario();

function problemsWith(uncertainty: unknown, change: (s: ScenarioInput) => ScenarioInput = (s) => s): string[] {
  const r = validateScenario(change({ ...(demo as ScenarioInput), uncertainty } as ScenarioInput));
  return r.ok ? [] : r.problems.map(formatProblem);
}

const param = (name: string, distribution: object = { kind: 'uniform', low: 0.8, high: 1.2 }) => ({ name, distribution, source: 'test range' });

describe('uncertainty section: validation', () => {
  it('accepts every parameter name the scenario supports, with defaults for draws, seed and level', () => {
    const names = ['r0', 'latentPeriodDays', 'infectiousPeriodDays', 'ifrScale', 'hospitalisationScale', 'icuShareScale', 'wardStayScale', 'icuStayScale', 'measureAdherence', 'vaccineEfficacyScale', 'initialInfectedScale', 'contactScale.school'];
    const r = validateScenario({ ...demo, uncertainty: { parameters: names.map((n) => param(n)) } });
    if (!r.ok) throw new Error(r.problems.map(formatProblem).join('\n'));
    expect(r.scenario.uncertainty).toMatchObject({ draws: 1000, seed: 1, intervalLevel: 0.9 });
  });

  it('names the JSON path and the rule of each mistake', () => {
    expect(problemsWith({ parameters: [param('r00')] })).toEqual([expect.stringMatching(/^uncertainty\.parameters\[0\]\.name must be one of r0, doublingTimeDays, .* or contactScale\.<setting>, got "r00"$/)]);
    expect(problemsWith({ parameters: [param('contactScale.church')] })).toEqual([expect.stringMatching(/^uncertainty\.parameters\[0\]\.name must name a setting of the scenario \(contactScale\.home, .*\), got "contactScale\.church"$/)]);
    expect(problemsWith({ parameters: [param('doublingTimeDays')] })).toEqual(['uncertainty.parameters[0].name must be r0: disease.transmission is given as R0, got "doublingTimeDays"']);
    expect(problemsWith({ parameters: [param('ifrScale'), param('ifrScale')] })).toEqual(['uncertainty.parameters[1].name must be unique (each parameter at most once), got "ifrScale"']);
    expect(problemsWith({ parameters: [param('ifrScale', { kind: 'uniform', low: 2, high: 1 })] })).toEqual(['uncertainty.parameters[0].distribution.high must be above low (2), got 1']);
    expect(problemsWith({ parameters: [param('ifrScale', { kind: 'triangular', low: 1, mode: 3, high: 2 })] })).toEqual(['uncertainty.parameters[0].distribution.mode must lie between low and high (1 to 2), got 3']);
    expect(problemsWith({ parameters: [param('ifrScale', { kind: 'lognormal', median: 1 })] })).toEqual(['uncertainty.parameters[0].distribution must give exactly one of range95 [low, high] or geometricSd']);
    expect(problemsWith({ parameters: [param('ifrScale', { kind: 'lognormal', median: 1, range95: [1.2, 2] })] })).toEqual(['uncertainty.parameters[0].distribution.range95 must have low < median (1) < high, got [1.2,2]']);
    expect(problemsWith({ parameters: [param('ifrScale', { kind: 'normal', mean: 1, sd: 0.1, low: 5 })] })).toEqual([expect.stringMatching(/^uncertainty\.parameters\[0\]\.distribution must keep some probability between low and high/)]);
    expect(problemsWith({ parameters: [param('ifrScale', { kind: 'beta', a: 1 })] })).toEqual([expect.stringMatching(/^uncertainty\.parameters\[0\]\.distribution\.kind must be/)]);
    expect(problemsWith({ draws: 1.5, parameters: [param('ifrScale')] })).toEqual(['uncertainty.draws must be a whole number, got 1.5']);
    expect(problemsWith({ intervalLevel: 1, parameters: [param('ifrScale')] })).toEqual(['uncertainty.intervalLevel must be between 0 and 1 (exclusive), got 1']);
    expect(problemsWith({ parameters: [] })).toEqual(['uncertainty.parameters must list at least one uncertain parameter, got []']);
    expect(problemsWith({ parameters: [{ ...param('ifrScale'), spread: 2 }] })).toEqual([expect.stringMatching(/^uncertainty\.parameters\[0\]\.spread is not a known field/)]);
  });

  it('refuses hospital and vaccine scales when the scenario has no such section', () => {
    const bare = (s: ScenarioInput): ScenarioInput => ({ ...s, healthcare: undefined, vaccinationCampaigns: [], options: s.options.map((o) => ({ ...o, vaccinationCampaign: undefined })) });
    expect(problemsWith({ parameters: [param('wardStayScale'), param('vaccineEfficacyScale')] }, bare)).toEqual([
      'uncertainty.parameters[0].name needs a healthcare section in the scenario, got "wardStayScale"',
      'uncertainty.parameters[1].name needs at least one vaccination campaign in the scenario, got "vaccineEfficacyScale"',
    ]);
  });
});

describe('applying a draw', () => {
  it('scales what each parameter names and leaves the scenario given untouched', () => {
    const before = JSON.stringify(demo);
    const s = applyParameter(applyParameter(demo, 'ifrScale', 2), 'contactScale.work', 0.5);
    expect(s.severity.infectionFatalityRatio[3]).toBeCloseTo(2 * demo.severity.infectionFatalityRatio[3], 15);
    const work = demo.settings.findIndex((x) => x.name === 'work');
    expect(s.settings[work].contactsPerDay[5][6]).toBeCloseTo(0.5 * demo.settings[work].contactsPerDay[5][6], 15);
    expect(s.settings[0]).toBe(demo.settings[0]);
    expect(JSON.stringify(demo)).toBe(before);
  });

  it('measureAdherence a turns a multiplier m into 1 - a(1 - m) and case isolation c into a c', () => {
    const phase = demo.options.flatMap((o) => o.phases).find((p) => Object.keys(p.settingMultipliers).length > 0);
    if (phase === undefined) throw new Error('demo has no measures');
    const s = applyParameter(demo, 'measureAdherence', 0.6);
    const after = s.options.flatMap((o) => o.phases).find((p) => p.fromDay === phase.fromDay && Object.keys(p.settingMultipliers).join() === Object.keys(phase.settingMultipliers).join());
    for (const [k, m] of Object.entries(phase.settingMultipliers)) expect(after?.settingMultipliers[k]).toBeCloseTo(1 - 0.6 * (1 - m), 15);
    expect(applyParameter(demo, 'measureAdherence', 1).options).toEqual(demo.options);
  });
});
