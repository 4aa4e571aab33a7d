import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { parseScenarioText, validateScenario } from '../../src/engine/validation.ts';
import { distributionQuantile } from '../../src/engine/uncertainty/quantiles.ts';
import type { Scenario } from '../../src/engine/scenario.ts';
import type { Distribution } from '../../src/engine/uncertainty/schema.ts';
import { problemInWords } from '../../src/renderer/lib/problemWords.ts';
import { addableParameters, allowedParameters, convertDistribution, newUncertainty, parameterLabel, switchLognormalSpread, withR0FromFit } from '../../src/renderer/lib/uncertaintyEdits.ts';

function demo(): Scenario {
  const parsed = parseScenarioText(readFileSync('resources/demo-scenario.json', 'utf8'));
  if (!parsed.ok) throw new Error('demo invalid');
  return parsed.scenario;
}

const valid = (s: Scenario) => {
  const check = validateScenario(s);
  return check.ok ? [] : check.problems.map((p) => problemInWords(p, s));
};

describe('uncertain inputs editor helpers', () => {
  it('offers only inputs the scenario allows, each starting valid', () => {
    const s = demo();
    const names = allowedParameters(s);
    expect(names).toContain('r0');
    expect(names).not.toContain('doublingTimeDays');
    expect(names).toContain('contactScale.work');
    for (const name of names) expect(valid({ ...s, uncertainty: newUncertainty(s, name) }), name).toEqual([]);
    const noHospital = { ...s, healthcare: undefined, vaccinationCampaigns: [], options: s.options.map((o) => ({ ...o, vaccinationCampaign: undefined })) };
    expect(allowedParameters(noHospital)).not.toContain('wardStayScale');
    expect(allowedParameters(noHospital)).not.toContain('vaccineEfficacyScale');
    expect(addableParameters({ ...s, uncertainty: newUncertainty(s, 'r0') })).not.toContain('r0');
  });

  it('starts R0 at 80 % to 120 % of the scenario value', () => {
    const s = demo();
    expect(newUncertainty(s, 'r0').parameters[0].distribution).toEqual({ kind: 'uniform', low: 2, high: 3 });
  });

  it('keeps centre and range when the kind changes', () => {
    const uniform: Distribution = { kind: 'uniform', low: 2, high: 3 };
    const lognormal = convertDistribution(uniform, 'lognormal');
    expect(lognormal).toEqual({ kind: 'lognormal', median: 2.5, range95: [2, 3] });
    const normal = convertDistribution(uniform, 'normal') as Extract<Distribution, { kind: 'normal' }>;
    expect(normal.mean).toBe(2.5);
    expect(normal.sd).toBeCloseTo(0.5 / 1.959964, 3);
    expect(convertDistribution(lognormal, 'triangular')).toEqual({ kind: 'triangular', low: 2, mode: 2.5, high: 3 });
    const bySd = switchLognormalSpread(lognormal as Extract<Distribution, { kind: 'lognormal' }>, 'geometricSd');
    // The same sigma: ln(gsd) = ln(3/2) / (2 z).
    expect(bySd.kind === 'lognormal' && bySd.geometricSd).toBeCloseTo(Math.exp(Math.log(1.5) / (2 * 1.959964)), 3);
    expect(distributionQuantile(bySd, 0.975) / distributionQuantile(bySd, 0.025)).toBeCloseTo(1.5, 2);
  });

  it('writes the fit interval as R0 lognormal, replacing an R0 entry', () => {
    const s = demo();
    const withFit = withR0FromFit({ ...s, uncertainty: newUncertainty(s, 'ifrScale') }, 2.31, [2.1, 2.55], 'fit of cases.csv');
    expect(withFit?.uncertainty?.parameters.map((p) => p.name)).toEqual(['r0', 'ifrScale']);
    expect(withFit?.uncertainty?.parameters[0].distribution).toEqual({ kind: 'lognormal', median: 2.31, range95: [2.1, 2.55] });
    const again = withR0FromFit(withFit!, 2.4, [2.2, 2.6], 'second fit');
    expect(again?.uncertainty?.parameters.filter((p) => p.name === 'r0')).toHaveLength(1);
    expect(again?.uncertainty?.parameters[0].source).toBe('second fit');
    expect(withR0FromFit(s, 2.31, [null, 2.55], 'x')).toBeNull();
    expect(valid(withFit!)).toEqual([]);
  });

  it('names refusals by the labels the editor shows', () => {
    const s = demo();
    const u = newUncertainty(s, 'contactScale.work');
    u.parameters[0].distribution = { kind: 'uniform', low: 1.2, high: 0.8 };
    expect(valid({ ...s, uncertainty: u })).toEqual(['Uncertain Work contacts factor: high must be above low (1.2), got 0.8']);
    expect(parameterLabel('r0')).toBe('R0');
  });
});
