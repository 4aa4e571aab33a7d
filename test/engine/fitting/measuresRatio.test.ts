/**
 * The measures ratio rho = lambda(K with a phase's measures) / lambda(K without), at the initial
 * susceptibles: closed forms for measures that scale K uniformly, and the board's own "R at
 * start" (power iteration in simulate.ts, a different eigen-route) for the demo's options.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { runScenario } from '../../../src/engine/run.ts';
import { dailyTotals, fitGrowth, measuresRatioForOption, measuresRatioOfPhase, parseCaseCountsCsv, r0FromFit } from '../../../src/engine/fitting/index.ts';
import { periodsOf } from '../../../src/engine/growth.ts';
import type { Phase } from '../../../src/engine/scenario.ts';
import { demoScenario } from '../../helpers/demo.ts';
import { twoBand } from '../../helpers/scenarios.ts';

const phase = (p: Partial<Phase>): Phase => ({ fromDay: 0, toDay: 10, settingMultipliers: {}, ageFactors: [], caseIsolation: 0, ...p });

describe('measuresRatioOfPhase', () => {
  it('is the multiplier itself when one setting holds every contact (K scales linearly)', () => {
    const s = twoBand();
    expect(measuresRatioOfPhase(s, phase({ settingMultipliers: { all: 0.37 } }))).toBeCloseTo(0.37, 12);
  });

  it('is 1 - c for case isolation c (infectiousness cut by c in every band)', () => {
    expect(measuresRatioOfPhase(twoBand(), phase({ caseIsolation: 0.3 }))).toBeCloseTo(0.7, 12);
  });

  it('is 1 without a phase', () => {
    expect(measuresRatioOfPhase(twoBand(), null)).toBe(1);
  });

  it('follows the 2x2 closed form when one band is shielded', () => {
    // K = 0.1 [[18 u, 3 u], [9, 12]] for the two-band example (u = 1). An age factor f on band 0
    // scales C_ij by min(f_i, f_j) (contacts.ts), so K = [[1.8 f, 0.3 f], [0.9 f, 1.2]]; dominant
    // eigenvalue of [[a, b], [c, d]] = (a + d)/2 + sqrt(((a - d)/2)^2 + b c) (closed form for 2x2).
    const f = 0.5;
    const dominant = (a: number, b: number, c: number, d: number) => (a + d) / 2 + Math.sqrt(((a - d) / 2) ** 2 + b * c);
    const expected = dominant(1.8 * f, 0.3 * f, 0.9 * f, 1.2) / dominant(1.8, 0.3, 0.9, 1.2);
    const got = measuresRatioOfPhase(twoBand(), phase({ ageFactors: [{ setting: 'all', bands: [0], factor: f }] }));
    expect(got).toBeCloseTo(expected, 12);
  });
});

describe('measuresRatioForOption', () => {
  const demo = demoScenario();
  const results = runScenario(demo);
  const plain = results.options.find((o) => o.name === 'No measures');

  it('equals the ratio of the board\'s R at start (option / no measures) for every demo option on day 0', () => {
    expect(plain).toBeDefined();
    for (const option of demo.options) {
      const r = measuresRatioForOption(demo, option.name, 0);
      if (!r.ok) throw new Error(JSON.stringify(r.problems));
      const shown = results.options.find((o) => o.name === option.name);
      expect(r.value.ratio).toBeCloseTo((shown?.rStart ?? NaN) / (plain?.rStart ?? NaN), 7);
    }
  });

  it('uses the phase in force on the given day, and 1 with a note when none is', () => {
    const schools = demo.options.find((o) => o.phases.length > 0 && o.phases[0].fromDay > 0);
    expect(schools).toBeDefined();
    if (schools === undefined) return;
    const before = measuresRatioForOption(demo, schools.name, schools.phases[0].fromDay - 1);
    const during = measuresRatioForOption(demo, schools.name, schools.phases[0].fromDay);
    if (!before.ok || !during.ok) throw new Error('unexpected');
    expect(before.value).toMatchObject({ ratio: 1, phase: null });
    expect(before.value.note).toContain('no measures in force');
    expect(during.value.phase).toEqual({ fromDay: schools.phases[0].fromDay, toDay: schools.phases[0].toDay });
    expect(during.value.ratio).toBeCloseTo(measuresRatioOfPhase(demo, schools.phases[0]), 14);
    expect(during.value.ratio).not.toBeCloseTo(1, 3);
  });

  it('names the field and the options when the option does not exist', () => {
    const r = measuresRatioForOption(demo, 'Nope', 0);
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.problems[0].field).toBe('measuresOption');
      expect(r.problems[0].rule).toContain('"No measures"');
    }
  });

  it('rejects measures that stop all transmission', () => {
    const s = twoBand();
    const closed = { ...s, options: [{ name: 'closed', description: '', phases: [phase({ settingMultipliers: { all: 0 } })] }] };
    expect(measuresRatioForOption(closed, 'closed', 0).ok).toBe(false);
  });

  it('back-calculated R0 puts R at start under the measures back at the fitted R (day-0 window)', () => {
    const csv = parseCaseCountsCsv(readFileSync('resources/example-cases.csv', 'utf8'));
    if (!csv.ok) throw new Error('example file invalid');
    const fit = fitGrowth(dailyTotals(csv.series), { fromDay: 0, toDay: 20 });
    if (!fit.ok) throw new Error('fit failed');
    const option = demo.options.find((o) => o.phases[0]?.fromDay === 0);
    if (option === undefined) throw new Error('demo has no day-0 measures');
    const ratio = measuresRatioForOption(demo, option.name, 0);
    if (!ratio.ok) throw new Error('unexpected');
    const r0 = r0FromFit(fit.fit, periodsOf(demo), ratio.value.ratio);
    if (!r0.ok) throw new Error('unexpected');
    const refitted = runScenario({ ...demo, disease: { ...demo.disease, transmission: { kind: 'r0', r0: r0.value.r0 } } });
    const rStart = refitted.options.find((o) => o.name === option.name)?.rStart ?? NaN;
    // R0 is defined at full susceptibility, R at start at the day-0 susceptibles (a handful of seeds
    // fewer in 1.5 M persons): they agree to about seeds / population.
    expect(rStart / r0.value.reproductionNumberInWindow).toBeCloseTo(1, 4);
  });
});
