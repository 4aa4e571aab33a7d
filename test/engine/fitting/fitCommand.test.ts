/** `mixwise fit` (src/cli/fit.ts), run in-process with the command-line test helpers. */
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { DEMO, ROOT, demoJson, runCli, writeTemp } from '../../cli/helpers.ts';

const CASES = join(ROOT, 'resources/example-cases.csv');

describe('mixwise fit', () => {
  it('prints r, doubling time and R0 with intervals, and the caution', () => {
    const { code, stdout, stderr } = runCli('fit', CASES, '--scenario', DEMO);
    expect(stderr).toBe('');
    expect(code).toBe(0);
    expect(stdout).toMatch(/^Growth rate r: +0\.\d{4} per day \(95% interval 0\.\d{4} to 0\.\d{4}, profile likelihood\)$/m);
    expect(stdout).toMatch(/^Doubling time: +\d+\.\d days \(\d+\.\d to \d+\.\d\)$/m);
    expect(stdout).toMatch(/^R0 for ".*": \d\.\d\d \(95% interval \d\.\d\d to \d\.\d\d\)$/m);
    expect(stdout).toContain('not forecasts');
  });

  it('writes the JSON fields of issue 7, and R0 follows Wallinga & Lipsitch for one-stage periods', () => {
    const { code, stdout } = runCli('fit', CASES, '--scenario', DEMO, '--from', '2031-03-10', '--to=20', '--format', 'json');
    expect(code).toBe(0);
    const json = JSON.parse(stdout);
    for (const key of ['growthRatePerDay', 'growthRateInterval', 'doublingTimeDays', 'r0', 'r0Interval']) expect(json).toHaveProperty(key);
    expect(json.window).toMatchObject({ fromDay: 7, toDay: 20, startDate: '2031-03-03' });
    const d = demoJson().disease;
    if ((d.latentStages ?? 1) === 1 && (d.infectiousStages ?? 1) === 1) {
      // Wallinga & Lipsitch 2007, Proc R Soc B 274:599: R = (1 + r T_E)(1 + r T_I) for exponential periods.
      const r = json.growthRatePerDay;
      expect(json.r0).toBeCloseTo((1 + r * d.latentPeriodDays) * (1 + r * d.infectiousPeriodDays), 10);
    }
    expect(json.doublingTimeDays).toBeCloseTo(Math.LN2 / json.growthRatePerDay, 12);
  });

  it('divides R by --measures-ratio', () => {
    const plain = JSON.parse(runCli('fit', CASES, '--scenario', DEMO, '--format', 'json').stdout);
    const measured = JSON.parse(runCli('fit', CASES, '--scenario', DEMO, '--format', 'json', '--measures-ratio', '0.5').stdout);
    expect(measured.r0).toBeCloseTo(plain.r0 / 0.5, 12);
    expect(measured.notes.some((n: string) => n.startsWith('Measures were in force'))).toBe(true);
  });

  it('names the line of a bad cases file and exits 2', () => {
    const bad = writeTemp('cases.csv', 'date;count\n2031-03-01;4\n2031-03-02;-1\n');
    const { code, stderr } = runCli('fit', bad, '--scenario', DEMO);
    expect(code).toBe(2);
    expect(stderr).toBe(`mixwise: ${bad}: line 3, column "count": must be >= 0, got "-1"\n`);
  });

  it('rejects a wrong command line with exit code 1', () => {
    expect(runCli('fit', CASES).stderr).toContain("'fit' needs --scenario FILE");
    expect(runCli('fit', CASES, '--scenario', DEMO, '--family', 'gamma').code).toBe(1);
    expect(runCli('fit', CASES, '--scenario', DEMO, '--from', 'March').stderr).toContain('--from must be a day number or a date YYYY-MM-DD');
    expect(runCli('fit', CASES, '--scenario', DEMO, '--measures-ratio', '-2').code).toBe(1);
  });
});
