/** `mixwise fit --measures-option NAME`: the ratio comes from the scenario's own option. */
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { measuresRatioForOption } from '../../../src/engine/fitting/index.ts';
import { demoScenario } from '../../helpers/demo.ts';
import { DEMO, ROOT, runCli } from '../../cli/helpers.ts';

const CASES = join(ROOT, 'resources/example-cases.csv');
const json = (...extra: string[]) => {
  const { code, stdout, stderr } = runCli('fit', CASES, '--scenario', DEMO, '--format', 'json', ...extra);
  expect(stderr).toBe('');
  expect(code).toBe(0);
  return JSON.parse(stdout);
};

describe('mixwise fit --measures-option', () => {
  const demo = demoScenario();
  const dayZero = demo.options.find((o) => o.phases[0]?.fromDay === 0);
  const later = demo.options.find((o) => o.phases.length > 0 && o.phases[0].fromDay > 5);

  it('divides R in the window by the NGM ratio of the phase in force on the window start', () => {
    if (dayZero === undefined) throw new Error('demo has no day-0 measures');
    const plain = json('--from', '2', '--to', '25');
    const measured = json('--from', '2', '--to', '25', '--measures-option', dayZero.name);
    const expected = measuresRatioForOption(demo, dayZero.name, 2);
    if (!expected.ok) throw new Error('unexpected');
    expect(expected.value.ratio).toBeLessThan(1);
    expect(measured.measuresRatio).toBeCloseTo(expected.value.ratio, 12);
    expect(measured.r0).toBeCloseTo(plain.r0 / expected.value.ratio, 10);
    expect(measured.r0Interval[0]).toBeCloseTo(plain.r0Interval[0] / expected.value.ratio, 10);
    expect(measured.measures).toMatchObject({ option: dayZero.name, day: 2, phase: { fromDay: 0 } });
    expect(measured.measures.reproductionNumberInWindow).toBeCloseTo(plain.r0, 10);
    expect(measured.notes.join(' ')).toContain(`"${dayZero.name}"`);
    // Same answer as giving the ratio by hand.
    expect(json('--from', '2', '--to', '25', '--measures-ratio', String(expected.value.ratio)).r0).toBeCloseTo(measured.r0, 9);
  });

  it('divides nothing when the option has no measures on the window start, and says so', () => {
    if (later === undefined) throw new Error('demo has no later phase');
    const plain = json('--to', '20');
    const measured = json('--to', '20', '--measures-option', later.name);
    expect(measured.measuresRatio).toBe(1);
    expect(measured.r0).toBe(plain.r0);
    expect(measured.notes.join(' ')).toContain('no measures in force on day 0');
    expect(measured.notes.join(' ')).not.toContain('Measures were in force');
  });

  it('prints the measures note in the table output', () => {
    if (dayZero === undefined) throw new Error('demo has no day-0 measures');
    const { code, stdout } = runCli('fit', CASES, '--scenario', DEMO, '--measures-option', dayZero.name);
    expect(code).toBe(0);
    expect(stdout).toMatch(new RegExp(`^note: Measures of option "${dayZero.name}" \\(days 0 to \\d+\\) were in force on day 0`, 'm'));
  });

  it('rejects an unknown option (listing the options) and giving both measures flags, exit code 1', () => {
    const unknown = runCli('fit', CASES, '--scenario', DEMO, '--measures-option', 'Nope');
    expect(unknown.code).toBe(1);
    expect(unknown.stderr).toContain('--measures-option must name a policy option of the scenario ("No measures"');
    const both = runCli('fit', CASES, '--scenario', DEMO, '--measures-option', 'x', '--measures-ratio', '0.5');
    expect(both.code).toBe(1);
    expect(both.stderr).toContain('not both');
  });
});
