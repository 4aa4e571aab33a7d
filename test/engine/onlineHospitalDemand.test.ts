/**
 * The hospital demand a trigger reads (healthcare/online.ts, formed only for the quantities and
 * days read) equals the demand the finished run reports (healthcare/demand.ts), whichever days are
 * read: bit for bit with one delay group, within 1e-12 relative with three (the groups' sums are
 * added in another grouping there). And the one-pass pair of sums equals two `convolvedAt` calls
 * bit for bit, for every pair of kernel lengths, empty kernels included.
 */
import { describe, expect, it } from 'vitest';
import { healthcareDemand } from '../../src/engine/healthcare/demand.ts';
import { convolvedAt, convolvedTwiceAt, type HospitalQuantity, OnlineHospitalDemand } from '../../src/engine/healthcare/online.ts';
import { prepareScenario } from '../../src/engine/prepare.ts';
import { demoScenario } from '../helpers/demo.ts';
import { syntheticInfections, withDelaysByBand } from './fixtures/postprocessingCases.ts';

const SERIES = { dailyAdmissions: 'admissions', wardOccupancy: 'wardOccupancy', icuOccupancy: 'icuOccupancy' } as const;

/** Days read: every day, every third day, and long gaps (as while a lag or minimumDaysOn holds the measures). */
const READ_PATTERNS: [string, (d: number) => boolean][] = [
  ['every day', () => true],
  ['every third day', (d) => d % 3 === 0],
  ['with gaps', (d) => d % 40 < 5 || d === 200],
];

describe('hospital demand read by triggers', () => {
  const demo = demoScenario();
  const x = syntheticInfections(demo.populationPersons, demo.horizonDays);
  const n = demo.ageBands.length;
  for (const [groups, scenario] of [
    ['one delay group', demo],
    ['three delay groups', withDelaysByBand(demo)],
  ] as const) {
    const h = prepareScenario(scenario).healthcare!;
    const reported = healthcareDemand(h, x).series;
    it(`equals the reported series on the days read (${groups})`, () => {
      expect(h.groups).toHaveLength(groups === 'one delay group' ? 1 : 3);
      for (const quantity of Object.keys(SERIES) as HospitalQuantity[]) {
        for (const [pattern, reads] of READ_PATTERNS) {
          const online = new OnlineHospitalDemand(h, [quantity]);
          let read = 0;
          for (let d = 0; d < demo.horizonDays; d++) {
            online.addDay(x.subarray(d * n, (d + 1) * n));
            if (!reads(d)) continue;
            const value = online.valueOn(quantity, d);
            const wanted = reported[SERIES[quantity]][d];
            const at = `${quantity}, ${pattern}, day ${d}`;
            if (groups === 'one delay group') expect(value, at).toBe(wanted);
            else expect(Math.abs(value - wanted), at).toBeLessThanOrEqual(1e-12 * Math.abs(wanted));
            read++;
          }
          expect(read).toBeGreaterThan(20);
        }
      }
    });
  }

  it('refuses a day whose infections are not in yet', () => {
    const online = new OnlineHospitalDemand(prepareScenario(demo).healthcare!, ['icuOccupancy']);
    online.addDay(x.subarray(0, n));
    expect(() => online.valueOn('icuOccupancy', 1)).toThrow('hospital demand of day 1 asked before its infections were added');
  });
});

describe('admissions and occupancy of a day in one pass', () => {
  it('equal the two sums taken one after the other, bit for bit', () => {
    const days = 30;
    const x = Float64Array.from({ length: days }, (_, d) => Math.exp(Math.sin(d * 1.7)) * 10 ** ((d % 5) - 2));
    const kernel = (length: number, scale: number) => Float64Array.from({ length }, (_, k) => Math.exp(-k / scale) / 3 + 1e-9 * k);
    for (const lengthW of [0, 1, 2, 3, 7, 12, 40]) {
      for (const lengthV of [0, 1, 2, 5, 12, 13, 40]) {
        const w = kernel(lengthW, 4);
        const v = kernel(lengthV, 6);
        const apart = new Float64Array(days);
        const together = new Float64Array(days);
        for (let e = 0; e < days; e++) {
          apart[e] = convolvedAt(x, w, e);
          const occupancy = convolvedTwiceAt(x, w, together, v, e);
          expect(together[e], `lengths ${lengthW}, ${lengthV}, day ${e}`).toBe(apart[e]);
          expect(occupancy, `lengths ${lengthW}, ${lengthV}, day ${e}`).toBe(convolvedAt(apart, v, e));
        }
      }
    }
  });
});
