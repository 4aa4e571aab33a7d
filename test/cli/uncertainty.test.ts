import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { OUTCOMES } from '../../src/report/outcomes.ts';
import { DEMO, demoJson, runCli, tempDir, writeTemp } from './helpers.ts';

/** The demo with an uncertainty section of `draws` draws. */
function demoWithDraws(draws: number): string {
  return writeTemp('uncertain.json', {
    ...demoJson(),
    uncertainty: {
      draws,
      seed: 4,
      intervalLevel: 0.8,
      parameters: [
        { name: 'r0', distribution: { kind: 'uniform', low: 2, high: 3 }, source: 'test range' },
        { name: 'ifrScale', distribution: { kind: 'lognormal', median: 1, range95: [0.6, 1.6] }, source: 'test range' },
        { name: 'measureAdherence', distribution: { kind: 'triangular', low: 0.5, mode: 0.8, high: 1 }, source: 'test range' },
      ],
    },
  });
}

describe('mixwise run with an uncertainty section', () => {
  const file = demoWithDraws(9);
  const single = runCli('run', file, '--format', 'json');

  it('adds the draws, sensitivity, intervals and chances; the point values stay as they were', () => {
    expect(single.code).toBe(0);
    const out = JSON.parse(single.stdout);
    const plain = JSON.parse(runCli('run', DEMO, '--format', 'json').stdout);
    expect(out.uncertainty).toEqual({ draws: 9, seed: 4, intervalLevel: 0.8, sampling: 'latinHypercube', failedDraws: 0, notes: [] });
    expect(out.options.map((o: { deaths: number }) => o.deaths)).toEqual(plain.options.map((o: { deaths: number }) => o.deaths));
    const option = out.options[1];
    // Every outcome of the catalogue that the demo has gets an interval, keyed by its JSON key.
    for (const key of ['rStart', 'growthRatePerDay', 'peakPrevalence', 'infections', 'attackRate', 'deaths', 'admissions', 'peakWardOccupancy', 'peakIcuOccupancy', 'infectionsAverted', 'deathsAverted']) {
      expect(OUTCOMES.some((o) => o.key === key)).toBe(true);
      const interval = option.intervals[key];
      expect(interval.low).toBeLessThanOrEqual(interval.median);
      expect(interval.median).toBeLessThanOrEqual(interval.high);
    }
    expect(Object.keys(option.probabilityBetterThanReference)).toEqual(['deaths', 'infections', 'admissions', 'peakIcuOccupancy']);
    expect(out.options[0].probabilityBetterThanReference.deaths).toBe(0);
    const bestShares = out.options.reduce((s: number, o: { probabilityBest: { deaths: number } }) => s + o.probabilityBest.deaths, 0);
    expect(bestShares).toBeCloseTo(1, 12);
    expect(out.sensitivity).toHaveLength(out.options.length * 4 * 3);
    expect(out.sensitivity[0]).toEqual({ option: 'No measures', outcome: 'deaths', parameter: 'r0', prcc: expect.any(Number) });
  });

  it('merges slices into exactly the bytes of a single run, in any order of the parts', () => {
    const dir = tempDir();
    const parts = [['0:4', 'part-0.json'], ['4:5', 'part-1.json'], ['5:9', 'part-2.json']].map(([range, name]) => {
      const path = join(dir, name);
      expect(runCli('run', file, '--draw-range', range, '--out', path).code).toBe(0);
      return path;
    });
    const all = join(dir, 'all.json');
    expect(runCli('merge', parts[2], parts[0], parts[1], '--out', all)).toMatchObject({ code: 0, stderr: '' });
    expect(readFileSync(all, 'utf8')).toBe(single.stdout);
  });

  it('refuses parts that miss or repeat draws, or come from another scenario', () => {
    const dir = tempDir();
    const a = join(dir, 'a.json');
    const b = join(dir, 'b.json');
    runCli('run', file, '--draw-range', '0:5', '--out', a);
    runCli('run', file, '--draw-range', '3:9', '--out', b);
    expect(runCli('merge', a)).toMatchObject({ code: 2, stderr: 'mixwise: the parts do not cover every draw: 4 of 9 missing, first 5\n' });
    expect(runCli('merge', a, b)).toMatchObject({ code: 2, stderr: `mixwise: ${b}: repeats draw 3, already in another part\n` });
    const other = join(dir, 'other.json');
    runCli('run', file, '--seed', '5', '--draw-range', '5:9', '--out', other);
    expect(runCli('merge', a, other).stderr).toBe(`mixwise: ${other}: belongs to another scenario, or to other draws or seed, than ${a}\n`);
    expect(runCli('merge', DEMO).stderr).toMatch(/is not a part file written by 'mixwise run --draw-range'/);
  });

  it('lets --draws and --seed override the file, and refuses them without a section', () => {
    const out = JSON.parse(runCli('run', file, '--format', 'json', '--draws', '6', '--seed', '10').stdout);
    expect(out.uncertainty).toMatchObject({ draws: 6, seed: 10 });
    expect(out.options[1].intervals.deaths).not.toEqual(JSON.parse(single.stdout).options[1].intervals.deaths);
    expect(runCli('run', DEMO, '--draws', '10')).toMatchObject({ code: 1, stderr: expect.stringMatching(/^mixwise: --draws, --seed and --draw-range need an "uncertainty" section/) });
    expect(runCli('run', file, '--draw-range', '5:10')).toMatchObject({ code: 1, stderr: expect.stringMatching(/goes beyond the 9 draws/) });
    expect(runCli('run', file, '--draw-range', '5-10').code).toBe(1);
  });

  it('leaves the output of a scenario without the section unchanged', () => {
    const out = JSON.parse(runCli('run', DEMO, '--format', 'json').stdout);
    expect(out.uncertainty).toBeUndefined();
    expect(out.sensitivity).toBeUndefined();
    expect(out.options[0].intervals).toBeUndefined();
  });
});
